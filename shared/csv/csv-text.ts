import Papa from 'papaparse';
import type { CsvDelimiter } from './csv-types';
import { looksLikeDate } from './csv-dates';
import { failWith } from './csv-problem';

export interface CsvRow {
  /** 1-based line of the file where the row starts. */
  line: number;
  cells: string[];
}

export const maxColumns = 200;
const delimiters: CsvDelimiter[] = [',', ';', '\t'];

export function stripBom(text: string): string {
  return text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
}

/**
 * Whether the text is really a binary file decoded as UTF-8: a NUL byte never appears in a text
 * export, and a file that is more than a tenth control or replacement characters is not a table.
 */
export function isBinaryText(text: string): boolean {
  if (text.includes('\u0000')) return true;
  const head = text.slice(0, 4096);
  let odd = 0;
  for (const char of head) {
    const code = char.charCodeAt(0);
    if ((code < 32 && char !== '\n' && char !== '\r' && char !== '\t') || code === 0xfffd) odd++;
  }
  return head.length > 0 && odd / head.length > 0.1;
}

/**
 * Counts lines as papaparse hands over rows, from the cells alone: each row takes one line plus
 * the line breaks quoted inside its cells. This works the same on a stream, where the parser's
 * byte offsets are not at hand. Papaparse must run with `skipEmptyLines: false` so that blank lines
 * still arrive as rows.
 */
export function createLineCounter(): { next(cells: readonly string[]): number } {
  let nextLine = 1;
  return {
    next(cells) {
      const line = nextLine;
      let breaks = 0;
      for (const cell of cells) {
        if (cell.includes('\n') || cell.includes('\r')) breaks += cell.match(/\r\n|\r|\n/g)?.length ?? 0;
      }
      nextLine += 1 + breaks;
      return line;
    },
  };
}

export function isBlankRow(cells: readonly string[]): boolean {
  return cells.every((cell) => cell.trim() === '');
}

/** Splits text into rows with their line numbers; `errors` lists rows with an unclosed quote. */
export function parseRows(
  text: string,
  delimiter: CsvDelimiter,
): { rows: CsvRow[]; unclosedQuoteLines: number[] } {
  const result = Papa.parse<string[]>(text, { delimiter, skipEmptyLines: false });
  const counter = createLineCounter();
  const rows = result.data.map((cells) => ({ line: counter.next(cells), cells }));
  const unclosedQuoteLines = result.errors
    .filter((error) => error.code === 'MissingQuotes' && typeof error.row === 'number')
    .map((error) => rows[error.row as number]?.line ?? 1);
  return { rows, unclosedQuoteLines };
}

/**
 * Picks the delimiter that splits the start of the file into the most even columns with a date
 * in them. A decimal-comma file such as "2024-01-07;12,5" also splits evenly on commas, but then
 * no cell is a date, which is what tells the two apart.
 */
export function detectDelimiter(text: string): CsvDelimiter {
  const head = text.slice(0, 16_384);
  let best: { delimiter: CsvDelimiter; score: number } | null = null;
  for (const delimiter of delimiters) {
    const rows = parseRows(head, delimiter).rows.filter((row) => !isBlankRow(row.cells)).slice(0, 60);
    const widths = new Map<number, number>();
    for (const row of rows) widths.set(row.cells.length, (widths.get(row.cells.length) ?? 0) + 1);
    const [width, even] = [...widths].filter(([w]) => w > 1).sort((a, b) => b[1] - a[1])[0] ?? [0, 0];
    if (width < 2) continue;
    const dated = rows.filter((row) => row.cells.some((cell) => looksLikeDate(cell))).length;
    const score = (dated > 0 ? 1_000_000 : 0) + (even / rows.length) * 1000 + Math.min(width, 200);
    if (!best || score > best.score) best = { delimiter, score };
  }
  if (!best) {
    failWith('not-csv', 1, null, 'No comma, semicolon or tab separates the columns: this is not a CSV table');
  }
  return best.delimiter;
}

/** Quotes a cell as RFC 4180 §2 asks when it holds the delimiter, a quote or a line break. */
export function quoteCsvCell(value: string, delimiter: CsvDelimiter = ','): string {
  return value.includes(delimiter) || /["\r\n]/.test(value) || value !== value.trim()
    ? `"${value.replace(/"/g, '""')}"`
    : value;
}

/** Writes rows as CSV text (CRLF line ends by default, as RFC 4180 §2 rule 1 has them). */
export function writeCsv(
  rows: readonly (readonly string[])[],
  options: { delimiter?: CsvDelimiter; lineEnd?: '\r\n' | '\n' } = {},
): string {
  const delimiter = options.delimiter ?? ',';
  const lineEnd = options.lineEnd ?? '\r\n';
  return rows.map((row) => row.map((cell) => quoteCsvCell(cell, delimiter)).join(delimiter)).join(lineEnd);
}

const formulaStart = /^[=+\-@\t\r]/;
const plainNumber = /^[-+]?\d+([.,]\d+)?$/;

/** Whether a text cell would run as a formula when opened in a spreadsheet. */
export function isFormulaLike(value: string): boolean {
  return formulaStart.test(value) && !plainNumber.test(value.trim());
}

/**
 * Makes a cell safe to export: a formula-like text gets a leading apostrophe so a spreadsheet shows
 * it as text instead of running it (plain numbers such as -3 stay as they are), then RFC 4180
 * quoting is applied.
 */
export function escapeCsvCell(value: string | number, delimiter: CsvDelimiter = ','): string {
  const text = String(value);
  return quoteCsvCell(isFormulaLike(text) ? `'${text}` : text, delimiter);
}
