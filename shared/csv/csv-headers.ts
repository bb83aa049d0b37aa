import type { CsvKind, CsvLayout, CsvMapping } from './csv-types';
import type { CsvRow } from './csv-text';
import { isBlankRow } from './csv-text';
import { looksLikeDate } from './csv-dates';
import { parseNumberCell } from './csv-numbers';
import { normaliseRegion } from './region-names';

type Field = 'date' | 'term' | 'value' | 'region' | 'item' | 'sku' | 'quantity' | 'revenue' | 'channel' | 'currency';

// Header words our users' files carry, in lower case without punctuation. Kept short and generic.
const synonyms: Record<Field, string[]> = {
  date: ['date', 'day', 'week', 'month', 'period', 'time', 'when', 'sale date', 'order date', 'sold on', 'week of', 'month of', 'week starting', 'datum'],
  term: ['term', 'search term', 'keyword', 'query', 'topic', 'phrase', 'theme'],
  value: ['value', 'interest', 'search interest', 'score', 'index', 'popularity'],
  region: ['region', 'geo', 'location', 'country', 'area'],
  item: ['item', 'item name', 'product', 'product name', 'name', 'title', 'piece', 'description'],
  sku: ['sku', 'item code', 'product code', 'code', 'article', 'article number'],
  quantity: ['quantity', 'qty', 'units', 'units sold', 'qty sold', 'count', 'pieces', 'number sold'],
  revenue: ['revenue', 'total', 'amount', 'sales', 'gross', 'net', 'price', 'line total', 'total price', 'takings'],
  channel: ['channel', 'sales channel', 'source', 'venue', 'sold at', 'where', 'outlet', 'place'],
  currency: ['currency', 'ccy', 'cur'],
};

/** Lower case, units in parentheses dropped ("Revenue (USD)" → "revenue"), punctuation as spaces. */
export function normaliseHeader(name: string): string {
  return name
    .toLowerCase()
    .replace(/\(.*?\)/g, ' ')
    .replace(/[^\p{L}\p{N}]+/gu, ' ')
    .trim();
}

export function headerField(name: string, field: Field): boolean {
  return synonyms[field].includes(normaliseHeader(name));
}

/** Splits a wide header cell "herb planter: (US)" into its term and region. */
export function parseSeriesHeader(name: string): { term: string; region?: string } {
  const match = /^(.*?):\s*\(([^()]*)\)\s*$/.exec(name.trim());
  if (!match || match[1].trim() === '') return { term: name.trim() };
  const region = normaliseRegion(match[2]);
  return region ? { term: match[1].trim(), region } : { term: match[1].trim() };
}

function isNumberish(cell: string): boolean {
  const parsed = parseNumberCell(cell, '.');
  return parsed.kind === 'number' || parseNumberCell(cell, ',').kind === 'number';
}

/**
 * Finds the header: the row before the first row that has a date cell next to a number. Export
 * tools put any number of description lines above the table, so those are skipped. With a mapping
 * the header is simply the first row holding the mapped date column's name.
 */
export function findHeaderIndex(rows: readonly CsvRow[], dateColumn?: string): number | null {
  if (dateColumn !== undefined) {
    const index = rows.findIndex((row) => row.cells.some((cell) => cell.trim() === dateColumn.trim()));
    if (index >= 0) return index;
  }
  for (let i = 0; i < rows.length; i++) {
    const cells = rows[i].cells;
    if (cells.length < 2) continue;
    const dateAt = cells.findIndex((cell) => looksLikeDate(cell));
    if (dateAt < 0) continue;
    const hasNumber = cells.some((cell, j) => j !== dateAt && isNumberish(cell));
    if (!hasNumber) continue;
    let header = i - 1;
    while (header >= 0 && isBlankRow(rows[header].cells)) header--;
    return header;
  }
  // No data row found: take a row naming a date column, else the first wide row.
  const named = rows.findIndex((row) => row.cells.length > 1 && row.cells.some((cell) => headerField(cell, 'date')));
  if (named >= 0) return named;
  const wide = rows.findIndex((row) => row.cells.length > 1 && !isBlankRow(row.cells));
  return wide >= 0 ? wide : null;
}

export interface LayoutGuess {
  kind: CsvKind;
  layout: CsvLayout;
  mapping: CsvMapping | null;
}

/**
 * Guesses the layout and mapping from the header names and the first data rows. Sales files are
 * told by their quantity and revenue columns, long files by a term and a value column; anything
 * else with a date column and numeric columns is wide interest.
 */
export function guessLayout(header: readonly string[], dataRows: readonly CsvRow[], kind?: CsvKind): LayoutGuess | null {
  const names = header.map((cell) => cell.trim());
  const find = (field: Field, except: string[] = []) =>
    names.find((name) => name !== '' && headerField(name, field) && !except.includes(name));
  const dateByValues = () =>
    names.find((_, i) => {
      const cells = dataRows.map((row) => row.cells[i] ?? '').filter((cell) => cell.trim() !== '');
      return cells.length > 0 && cells.filter(looksLikeDate).length >= cells.length / 2;
    });
  const date = find('date') ?? dateByValues();
  if (date === undefined) return null;
  const quantity = find('quantity');
  const revenue = find('revenue', [date]);
  const item = find('item');
  const sku = find('sku');
  const isSales = kind === 'sales' || (kind !== 'interest' && (quantity !== undefined || revenue !== undefined) && (item ?? sku) !== undefined);
  if (isSales) {
    const mapping = {
      date,
      item: item ?? sku ?? '',
      quantity: quantity ?? '',
      revenue: revenue ?? '',
      ...(sku !== undefined && item !== undefined ? { sku } : {}),
      ...optional('channel', find('channel')),
      ...optional('currency', find('currency')),
    };
    return { kind: 'sales', layout: 'sales', mapping };
  }
  const term = find('term');
  const value = find('value', [date]);
  if (term !== undefined && value !== undefined) {
    return { kind: 'interest', layout: 'long', mapping: { date, term, value, ...optional('region', find('region')) } };
  }
  const terms = names.filter((name) => name !== '' && name !== date);
  return { kind: 'interest', layout: 'wide', mapping: { date, terms } };
}

function optional<K extends string>(key: K, value: string | undefined): Partial<Record<K, string>> {
  return value === undefined ? {} : ({ [key]: value } as Record<K, string>);
}
