import type { ColumnRole, CsvColumn, CsvKind, CsvLayout, CsvMapping, CsvPreview, CsvProblem, DateOrder } from './csv-types';
import { createProblem, failWith } from './csv-problem';
import { detectDateFormat } from './csv-dates';
import { findHeaderIndex, guessLayout, parseSeriesHeader } from './csv-headers';
import { validateMapping } from './csv-mapping';
import { fitsLength, importLimits, quoteCell } from './csv-limits';
import { createRowReader } from './row-reader';
import { type CsvRow, detectDelimiter, isBinaryText, isBlankRow, isFormulaLike, maxColumns, parseRows, stripBom } from './csv-text';

export interface AnalyseOptions {
  /** What the user says the file holds; detection decides when absent. */
  kind?: CsvKind;
  /** The user's column mapping, naming header cells; detection guesses one when absent. */
  mapping?: unknown;
  /** Resolves ambiguous slash dates. */
  dateOrder?: DateOrder;
  /** The studio's sales channels (the default list when absent). */
  channels?: readonly string[];
  /** Whether the text is only the start of the file, so its last line may be cut short. */
  isPartial?: boolean;
  /** The studio's today (YYYY-MM-DD), which ends the window of sales dates. */
  today?: string;
}

const sampleSize = 10;

/**
 * Detects the shape of a CSV file from its text (the first ~64 KB or all of it) and reads every
 * row in it, so the preview shows the same problems the import will. Throws `CsvError` only when
 * no preview can be made at all; everything else is in `problems`.
 */
export function analyseCsv(text: string, options: AnalyseOptions = {}): CsvPreview {
  const body = stripBom(String(text));
  if (isBinaryText(body)) {
    failWith('not-csv', 1, null, 'This looks like a binary file, not a CSV text export');
  }
  if (body.trim() === '') failWith('empty', 1, null, 'The file is empty');
  const delimiter = detectDelimiter(body);
  const parsed = parseRows(body, delimiter);
  const rows = options.isPartial && parsed.rows.length > 1 ? parsed.rows.slice(0, -1) : parsed.rows;
  const requested = options.mapping as { date?: unknown } | undefined;
  const headerIndex = findHeaderIndex(rows, typeof requested?.date === 'string' ? requested.date : undefined);
  if (headerIndex === null) failWith('empty', 1, null, 'The file has no rows with values');
  if (headerIndex < 0) {
    failWith('no-header', rows[0].line, null, 'The first row already holds data: add a header row naming the columns');
  }
  const headerRow = rows[headerIndex].line;
  const header = rows[headerIndex].cells.map((cell) => cell.trim());
  if (header.length > maxColumns) {
    failWith('too-many-columns', headerRow, null, `The header has ${header.length} columns; at most ${maxColumns} can be imported`);
  }
  const longName = header.find((name) => !fitsLength(name, importLimits.columnNameLength));
  if (longName !== undefined) {
    const message = `The header cell ${quoteCell(longName)} is longer than the ${importLimits.columnNameLength} characters a column name may have`;
    failWith('too-long', headerRow, longName, message);
  }
  const dataRows = rows.slice(headerIndex + 1).filter((row) => !isBlankRow(row.cells));
  if (dataRows.length === 0) {
    failWith('header-only', headerRow, null, 'The file has a header row but no data rows below it');
  }

  const problems: CsvProblem[] = parsed.unclosedQuoteLines.map((line) =>
    createProblem('unclosed-quote', line, null, `A quoted cell starting on line ${line} is never closed`),
  );
  const { kind, layout, mapping } = chooseMapping(header, headerRow, dataRows, options, problems);
  const dateIndex = header.indexOf(mapping.date);
  const dateGuess = detectDateFormat(dataRows.slice(0, 500).map((row) => row.cells[dateIndex] ?? ''), options.dateOrder);
  const dateFormat = dateGuess?.format ?? 'YYYY-MM-DD';
  const dateAmbiguous = dateGuess?.isAmbiguous ?? false;
  if (dateAmbiguous) {
    const message = `Dates such as "${dataRows[0].cells[dateIndex]}" read as month/day or day/month: choose the date order`;
    problems.push(createProblem('date-ambiguous', headerRow, mapping.date, message, 'warning'));
  }
  problems.push(...headerProblems(header, headerRow));

  const columns = describeColumns(header, mapping, layout);
  const decimalSeparator = delimiter === ';' ? ',' : '.';
  const preview: CsvPreview = {
    kind, layout, delimiter, decimalSeparator, headerRow, period: null, dateFormat, dateAmbiguous,
    columns, mapping, rows: dataRows.length, returnRows: 0, sample: dataRows.slice(0, sampleSize).map((row) => row.cells), problems,
  };
  if (problems.some((problem) => problem.code === 'invalid-mapping' || problem.code === 'unknown-column')) {
    return preview;
  }
  const reader = createRowReader(preview, { dateOrder: options.dateOrder, channels: options.channels, today: options.today });
  for (const row of rows) reader.push(row.cells, row.line);
  const summary = reader.finish();
  problems.push(...summary.problems);
  preview.period = summary.kind === 'interest' ? summary.period : dateFormat === 'YYYY-MM' ? 'monthly' : 'daily';
  preview.returnRows = summary.kind === 'sales' ? summary.returns : 0;
  return preview;
}

function chooseMapping(
  header: string[],
  headerRow: number,
  dataRows: CsvRow[],
  options: AnalyseOptions,
  problems: CsvProblem[],
): { kind: CsvKind; layout: CsvLayout; mapping: CsvMapping } {
  if (options.mapping !== undefined) {
    const checked = validateMapping(options.mapping, header, headerRow);
    problems.push(...checked.problems);
    if (checked.mapping && checked.layout) {
      return { kind: checked.layout === 'sales' ? 'sales' : 'interest', layout: checked.layout, mapping: checked.mapping };
    }
  }
  const guess = guessLayout(header, dataRows.slice(0, 50), options.kind);
  if (!guess?.mapping) {
    failWith('no-date-column', headerRow, null, `No column holds dates (header: ${header.join(', ')}); name the date column in the mapping`);
  }
  if (options.mapping === undefined) {
    const missing = Object.entries(guess.mapping).filter(([, value]) => value === '' || (Array.isArray(value) && value.length === 0));
    for (const [key] of missing) {
      const what = key === 'terms' ? 'term columns besides the date' : `${key} column`;
      problems.push(createProblem('invalid-mapping', headerRow, null, `No ${what} was recognised: choose it in the mapping`));
    }
  }
  return { kind: guess.kind, layout: guess.layout, mapping: guess.mapping };
}

function headerProblems(header: string[], headerRow: number): CsvProblem[] {
  const problems: CsvProblem[] = [];
  header.forEach((name, index) => {
    if (name !== '' && header.indexOf(name) !== index) {
      const message = `Two columns are named "${name}"; only the first one can be mapped`;
      problems.push(createProblem('duplicate-column', headerRow, name, message, 'warning'));
    }
    if (isFormulaLike(name)) {
      const message = `The header "${name}" starts like a spreadsheet formula; it is kept as plain text`;
      problems.push(createProblem('formula-like', headerRow, name, message, 'warning'));
    }
  });
  return problems;
}

function describeColumns(header: string[], mapping: CsvMapping, layout: CsvLayout): CsvColumn[] {
  const roles = new Map<string, ColumnRole>();
  for (const [key, value] of Object.entries(mapping) as [string, string | string[]][]) {
    if (key === 'terms') for (const term of value as string[]) roles.set(term, 'series');
    else if (!roles.has(value as string)) roles.set(value as string, key as ColumnRole);
  }
  return header.map((name, index) => {
    const role = roles.get(name) ?? 'ignored';
    if (role !== 'series' || layout !== 'wide') return { index, name, role };
    const { term, region } = parseSeriesHeader(name);
    return region === undefined ? { index, name, role, term } : { index, name, role, term, region };
  });
}
