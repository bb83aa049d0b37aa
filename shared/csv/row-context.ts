import type { CsvPreview, DateFormat, DateOrder } from './csv-types';
import { ProblemList, createProblem } from './csv-problem';
import { parseDateCell } from './csv-dates';
import { isBlankRow, isFormulaLike } from './csv-text';
import { parseNumberCell, type NumberCell } from './csv-numbers';
import { fitsLength, quoteCell } from './csv-limits';

export interface ReaderOptions {
  /** Resolves an ambiguous slash date: month first or day first. */
  dateOrder?: DateOrder;
  /** The studio's channels, in its own spelling; defaults to market, booth, online, wholesale, consignment. */
  channels?: readonly string[];
  /** ISO 4217 code for sales whose file names no currency. */
  defaultCurrency?: string;
  /** How many problems to keep in full (all are counted). */
  maxProblems?: number;
  /** The studio's today (YYYY-MM-DD), which ends the window of sales dates; without it only the start applies. */
  today?: string;
}

/** What the interest and sales readers share: header lookup, row checks, cell reading, problems. */
export class RowContext {
  readonly problems: ProblemList;
  readonly dateFormat: DateFormat;
  private readonly indexes = new Map<string, number>();
  rows = 0;
  private lastDateText = '';
  private lastDateIso: string | null = null;

  constructor(
    readonly preview: Pick<CsvPreview, 'headerRow' | 'columns' | 'dateFormat' | 'decimalSeparator'>,
    options: ReaderOptions,
  ) {
    this.problems = new ProblemList(options.maxProblems);
    for (const column of preview.columns) {
      if (!this.indexes.has(column.name)) this.indexes.set(column.name, column.index);
    }
    const isSlash = preview.dateFormat === 'M/D/YYYY' || preview.dateFormat === 'D/M/YYYY';
    this.dateFormat =
      isSlash && options.dateOrder ? (options.dateOrder === 'DMY' ? 'D/M/YYYY' : 'M/D/YYYY') : preview.dateFormat;
  }

  /** Whether the row holds data to read: after the header, not blank, not longer than the header. */
  accepts(cells: readonly string[], rowNumber: number): boolean {
    if (rowNumber <= this.preview.headerRow || isBlankRow(cells)) return false;
    this.rows++;
    const width = this.preview.columns.length;
    if (cells.length > width && !isBlankRow(cells.slice(width))) {
      const message = `Row ${rowNumber} has ${cells.length} cells but the header has ${width}; the row was not read`;
      this.problems.add(createProblem('row-too-long', rowNumber, null, message));
      return false;
    }
    return true;
  }

  cell(cells: readonly string[], column: string | undefined): string {
    if (column === undefined) return '';
    const index = this.indexes.get(column);
    return index === undefined ? '' : (cells[index] ?? '').trim();
  }

  readDate(cells: readonly string[], column: string, rowNumber: number): string | null {
    const text = this.cell(cells, column);
    // Rows of one day come together, so the last date read is usually the next one too.
    const date = text === this.lastDateText ? this.lastDateIso : parseDateCell(text, this.dateFormat);
    this.lastDateText = text;
    this.lastDateIso = date;
    if (date === null) {
      const message =
        text === ''
          ? `Row ${rowNumber} has no date in column "${column}"`
          : `${quoteCell(text)} in column "${column}" is not a date in the file's format ${this.dateFormat}`;
      this.problems.add(createProblem('unparseable-date', rowNumber, column, message));
    }
    return date;
  }

  /** A text cell, stored as written; formula-like text is flagged but never evaluated. */
  readText(cells: readonly string[], column: string | undefined, rowNumber: number): string {
    const text = this.cell(cells, column);
    if (column !== undefined && isFormulaLike(text)) {
      const message = `${quoteCell(text)} in column "${column}" starts like a spreadsheet formula; it is kept as plain text and escaped on export`;
      this.problems.add(createProblem('formula-like', rowNumber, column, message, 'warning'));
    }
    return text;
  }

  /** A number cell; an unreadable one, or one too large for a double, is reported and comes back as invalid. */
  readNumber(cells: readonly string[], column: string, rowNumber: number): NumberCell {
    const text = this.cell(cells, column);
    const parsed = parseNumberCell(text, this.preview.decimalSeparator);
    if (parsed.kind === 'number' && !Number.isFinite(parsed.value)) {
      this.reportRange(text, column, rowNumber, 'it is too large to be stored');
      return { kind: 'invalid' };
    }
    if (parsed.kind === 'invalid') {
      const formula = isFormulaLike(text) ? ' (it looks like a formula, which is never evaluated)' : '';
      const message = `${quoteCell(text)} in column "${column}" is not a number${formula}`;
      this.problems.add(createProblem('not-a-number', rowNumber, column, message));
    }
    return parsed;
  }

  /** Whether a text fits its database column; a longer one is an error naming row and column. */
  fits(text: string, column: string, rowNumber: number, limit: number): boolean {
    if (fitsLength(text, limit)) return true;
    const message = `${quoteCell(text)} in column "${column}" is longer than the ${limit} characters that can be stored`;
    this.problems.add(createProblem('too-long', rowNumber, column, message));
    return false;
  }

  /** Reports a value the database cannot hold, quoting the cell as written. */
  reportRange(text: string, column: string, rowNumber: number, why: string): void {
    this.problems.add(createProblem('out-of-range', rowNumber, column, `${quoteCell(text)} in column "${column}" cannot be imported: ${why}`));
  }

  requireText(cells: readonly string[], column: string, rowNumber: number, what: string): string | null {
    const text = this.readText(cells, column, rowNumber);
    if (text !== '') return text;
    this.problems.add(createProblem('missing-value', rowNumber, column, `Row ${rowNumber} has no ${what} in column "${column}"`));
    return null;
  }
}
