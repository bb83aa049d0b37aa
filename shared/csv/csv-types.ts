// Shapes shared by the CSV detector, the row readers and their callers (server import, client preview).

export type CsvKind = 'interest' | 'sales';
export type CsvLayout = 'wide' | 'long' | 'sales';
export type CsvDelimiter = ',' | ';' | '\t';
export type CsvPeriod = 'daily' | 'weekly' | 'monthly';
export type DateOrder = 'MDY' | 'DMY';
export type DateFormat = 'YYYY-MM-DD' | 'YYYY-MM' | 'M/D/YYYY' | 'D/M/YYYY' | 'D.M.YYYY';

/** Wide search interest: one date column and one column per term, each naming a header cell. */
export interface WideInterestMapping {
  date: string;
  terms: string[];
}

/** Long search interest: one row per date and term. */
export interface LongInterestMapping {
  date: string;
  term: string;
  value: string;
  region?: string;
}

/** Sales: a row per sale or per item-day. `item` may name the SKU column when there is no name. */
export interface SalesMapping {
  date: string;
  item: string;
  sku?: string;
  quantity: string;
  revenue: string;
  channel?: string;
  currency?: string;
}

export type CsvMapping = WideInterestMapping | LongInterestMapping | SalesMapping;

export type ColumnRole =
  | 'date'
  | 'series'
  | 'term'
  | 'value'
  | 'region'
  | 'item'
  | 'sku'
  | 'quantity'
  | 'revenue'
  | 'channel'
  | 'currency'
  | 'ignored';

export interface CsvColumn {
  /** 0-based position in the header row. */
  index: number;
  /** The header cell as written (BOM and surrounding spaces removed). */
  name: string;
  role: ColumnRole;
  /** For a wide series column: the term part of the header cell. */
  term?: string;
  /** For a wide series column whose header carries "term: (Region)". */
  region?: string;
}

export type ProblemSeverity = 'error' | 'warning';

export type ProblemCode =
  | 'not-csv'
  | 'empty'
  | 'header-only'
  | 'no-header'
  | 'no-date-column'
  | 'too-many-columns'
  | 'unclosed-quote'
  | 'row-too-long'
  | 'unparseable-date'
  | 'date-ambiguous'
  | 'not-a-number'
  | 'out-of-range'
  | 'too-long'
  | 'missing-value'
  | 'duplicate-date'
  | 'mixed-period'
  | 'date-gap'
  | 'formula-like'
  | 'unknown-channel'
  | 'unknown-column'
  | 'invalid-mapping'
  | 'duplicate-column'
  | 'too-many-problems';

export interface CsvProblem {
  /** 1-based line of the file where the offending row starts. */
  row: number;
  /** The header cell of the offending column, or null when the problem concerns the whole row or file. */
  column: string | null;
  code: ProblemCode;
  message: string;
  /** Errors block a commit; warnings are shown but the data can still be stored. */
  severity: ProblemSeverity;
}

export interface CsvPreview {
  kind: CsvKind;
  layout: CsvLayout;
  delimiter: CsvDelimiter;
  /** Decimal separator of numbers: a comma in semicolon files, a dot otherwise. */
  decimalSeparator: '.' | ',';
  /** 1-based line of the header row. */
  headerRow: number;
  /** Interest: the spacing of the dates. Sales: the date granularity (daily, or monthly for YYYY-MM). */
  period: CsvPeriod | null;
  dateFormat: DateFormat;
  /** Whether every slash date fits both M/D and D/M, so the user must pick `dateOrder`. */
  dateAmbiguous: boolean;
  columns: CsvColumn[];
  mapping: CsvMapping;
  /** Number of data rows seen in the analysed text. */
  rows: number;
  /** Sales rows with a negative quantity: returns, stored as negative sales (0 for search interest). */
  returnRows: number;
  /** The first ten data rows as written. */
  sample: string[][];
  problems: CsvProblem[];
}

/** One point of a search-interest series. */
export interface InterestPoint {
  term: string;
  /** Null when the file names no region. */
  region: string | null;
  /** ISO date YYYY-MM-DD (a YYYY-MM month becomes its first day). */
  date: string;
  /** Null when the cell was blank (missing, not zero). */
  value: number | null;
  /** Whether the cell said "<1"; the value is then 0.5. */
  belowOne: boolean;
}

/** One sale (or refund, with negative quantity or revenue). */
export interface SaleRecord {
  date: string;
  item: string;
  sku: string | null;
  quantity: number;
  revenueCents: number;
  /** One of the studio's channels, 'other' when the cell names none of them, null when not given. */
  channel: string | null;
  /** ISO 4217 code from the currency column or the revenue cell's sign, else the reader's default. */
  currency: string | null;
}
