import * as z from 'zod/mini';
import type { CsvLayout, CsvMapping, CsvProblem } from './csv-types';
import { createProblem } from './csv-problem';

const headerName = z.string().check(z.trim(), z.minLength(1));

export const wideInterestMappingSchema = z.strictObject({
  date: headerName,
  terms: z.array(headerName).check(z.minLength(1)),
});

export const longInterestMappingSchema = z.strictObject({
  date: headerName,
  term: headerName,
  value: headerName,
  region: z.optional(headerName),
});

export const salesMappingSchema = z.strictObject({
  date: headerName,
  item: headerName,
  sku: z.optional(headerName),
  quantity: headerName,
  revenue: headerName,
  channel: z.optional(headerName),
  currency: z.optional(headerName),
});

/** Which layout a mapping describes, from its keys, before it is validated in full. */
export function layoutOfMapping(mapping: unknown): CsvLayout | null {
  if (typeof mapping !== 'object' || mapping === null) return null;
  if ('terms' in mapping) return 'wide';
  if ('quantity' in mapping || 'revenue' in mapping || 'item' in mapping) return 'sales';
  if ('term' in mapping || 'value' in mapping) return 'long';
  return null;
}

/**
 * Checks a mapping (the user's or our guess) against the header: the right shape for its layout,
 * and every named column present. Problems sit on the header row.
 */
export function validateMapping(
  mapping: unknown,
  header: readonly string[],
  headerRow: number,
): { layout: CsvLayout | null; mapping: CsvMapping | null; problems: CsvProblem[] } {
  const layout = layoutOfMapping(mapping);
  const schema =
    layout === 'wide' ? wideInterestMappingSchema : layout === 'long' ? longInterestMappingSchema : salesMappingSchema;
  const parsed = z.safeParse(schema, mapping);
  if (!layout || !parsed.success) {
    const details = parsed.success
      ? 'it names none of the date/terms, date/term/value or date/item/quantity/revenue columns'
      : parsed.error.issues.map((issue) => `${issue.path.join('.') || 'mapping'}: ${issue.message}`).join('; ');
    const message = `The column mapping is not valid: ${details}`;
    return { layout, mapping: null, problems: [createProblem('invalid-mapping', headerRow, null, message)] };
  }
  const names = new Set(header.map((cell) => cell.trim()));
  const problems: CsvProblem[] = [];
  const named = Object.entries(parsed.data).flatMap(([key, value]) =>
    (Array.isArray(value) ? value : [value]).map((name) => ({ key, name: String(name) })),
  );
  for (const { key, name } of named) {
    if (!names.has(name)) {
      const message = `The mapping's ${key} column "${name}" is not in the header row`;
      problems.push(createProblem('unknown-column', headerRow, name, message));
    }
  }
  return { layout, mapping: parsed.data as CsvMapping, problems };
}
