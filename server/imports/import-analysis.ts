import { analyseCsv, createRowReader, CsvError, type CsvPreview, type CsvProblem, type DateOrder } from '@shared/csv';
import type { CsvKind } from '@shared/csv';
import { AppError, type ErrorIssue } from '../http/app-error';
import { readHead, streamRowPieces } from './import-file';

export interface AnalysisOptions {
  kind?: CsvKind;
  mapping?: unknown;
  dateOrder?: DateOrder;
  /** The studio's sales channels when the file was checked; the commit maps onto the same list. */
  channels?: string[];
  /** The studio's today when the file was checked; the commit bounds sales dates by the same day. */
  today?: string;
}

export interface StoredAnalysis {
  preview: CsvPreview;
  options: AnalysisOptions;
}

/** Problems that concern the header or the whole file, which only the head analysis finds. */
const fileLevelCodes = new Set(['unclosed-quote', 'date-ambiguous', 'duplicate-column', 'invalid-mapping', 'unknown-column']);

export function issuesOf(problems: readonly CsvProblem[]): ErrorIssue[] {
  return problems.map((problem) => ({ row: problem.row, column: problem.column ?? undefined, message: problem.message, path: [] }));
}

export function errorsOf(preview: CsvPreview): CsvProblem[] {
  return preview.problems.filter((problem) => problem.severity === 'error');
}

/**
 * The preview of a stored upload: detection from the first 64 KB, then (for larger files) one
 * streaming pass through the row reader so the row count, the period and every problem by row and
 * column cover the whole file, as the commit will see it.
 */
export async function analyseFile(filePath: string, options: AnalysisOptions): Promise<StoredAnalysis> {
  const head = await readHead(filePath);
  let preview: CsvPreview;
  try {
    preview = analyseCsv(head.text, { ...options, isPartial: head.isPartial });
  } catch (error) {
    if (error instanceof CsvError) throw new AppError(`csv_${error.code.replace(/-/g, '_')}`, 400, error.message, issuesOf(error.problems));
    throw error;
  }
  const isMappingBroken = preview.problems.some((problem) => problem.code === 'invalid-mapping' || problem.code === 'unknown-column');
  if (head.isPartial && !isMappingBroken) {
    const reader = createRowReader(preview, { dateOrder: options.dateOrder, channels: options.channels, today: options.today });
    for await (const rows of streamRowPieces(filePath, preview.delimiter)) for (const row of rows) reader.push(row.cells, row.line);
    const summary = reader.finish();
    const fileLevel = preview.problems.filter(
      (problem) => fileLevelCodes.has(problem.code) || (problem.code === 'formula-like' && problem.row === preview.headerRow),
    );
    preview.problems = [...fileLevel, ...summary.problems];
    preview.rows = summary.rows;
    if (summary.kind === 'interest') preview.period = summary.period;
    else preview.returnRows = summary.returns;
  }
  return { preview, options };
}

/** Refuses a commit that an error in the preview (or a missing date order) would spoil. */
export function assertCommittable(analysis: StoredAnalysis): void {
  const { preview, options } = analysis;
  if (preview.dateAmbiguous && !options.dateOrder) {
    const message = `Dates such as "${preview.sample[0]?.[preview.columns.findIndex((c) => c.role === 'date')] ?? ''}" read both as month/day and day/month: choose dateOrder "MDY" or "DMY"`;
    throw new AppError('date_order_needed', 400, message, [
      { row: preview.headerRow, column: preview.mapping.date, message, path: ['dateOrder'] },
    ]);
  }
  const errors = errorsOf(preview);
  if (errors.length > 0) {
    const first = errors[0];
    const where = `row ${first.row}${first.column ? `, column "${first.column}"` : ''}`;
    const message = `${errors.length} problem(s) block the import; the first is at ${where}: ${first.message}`;
    throw new AppError('file_has_problems', 400, message, issuesOf(errors));
  }
}
