import type { CsvPreview, InterestPoint, SaleRecord } from './csv-types';
import type { InterestSummary } from './interest-reader';
import type { SalesSummary } from './sales-reader';
import type { ReaderOptions } from './row-context';
import { analyseCsv, type AnalyseOptions } from './analyse-csv';
import { createRowReader } from './row-reader';
import { parseRows, stripBom } from './csv-text';

export type CsvTextResult =
  | { preview: CsvPreview; kind: 'interest'; records: InterestPoint[]; summary: InterestSummary }
  | { preview: CsvPreview; kind: 'sales'; records: SaleRecord[]; summary: SalesSummary };

/**
 * Analyses and reads a whole CSV text held in memory: for small files, tests and the demo data.
 * Large uploads should stream rows into `createRowReader` instead.
 */
export function readCsvText(text: string, options: AnalyseOptions & ReaderOptions = {}): CsvTextResult {
  const preview = analyseCsv(text, options);
  const { rows } = parseRows(stripBom(text), preview.delimiter);
  const reader = createRowReader(preview, options);
  if (reader.kind === 'interest') {
    const records = rows.flatMap((row) => reader.push(row.cells, row.line));
    return { preview, kind: 'interest', records, summary: reader.finish() };
  }
  const records = rows.flatMap((row) => reader.push(row.cells, row.line));
  return { preview, kind: 'sales', records, summary: reader.finish() };
}
