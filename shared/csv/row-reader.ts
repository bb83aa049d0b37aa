import type { CsvPreview, InterestPoint, SaleRecord } from './csv-types';
import type { ReaderOptions } from './row-context';
import { createInterestReader, type InterestSummary, type RowReader } from './interest-reader';
import { createSalesReader, type SalesSummary } from './sales-reader';

export type AnyRowReader =
  | ({ kind: 'interest' } & RowReader<InterestPoint, InterestSummary>)
  | ({ kind: 'sales' } & RowReader<SaleRecord, SalesSummary>);

/**
 * Streams the rows of a previewed file into records. Feed it every row the parser gives (preamble
 * and header included: rows up to the preview's header row are skipped), with the file line of
 * each from `createLineCounter`. It keeps only the dates of each interest series, never the rows.
 */
export function createRowReader(preview: CsvPreview, options: ReaderOptions = {}): AnyRowReader {
  return preview.kind === 'sales'
    ? { kind: 'sales', ...createSalesReader(preview, options) }
    : { kind: 'interest', ...createInterestReader(preview, options) };
}
