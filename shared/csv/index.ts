// The CSV import's public face: detection and preview, streaming row readers, export helpers.
export type * from './csv-types';
export { CsvError } from './csv-problem';
export { analyseCsv, type AnalyseOptions } from './analyse-csv';
export { createRowReader, type AnyRowReader } from './row-reader';
export { createInterestReader, type InterestSummary, type InterestSeriesSummary, type RowReader } from './interest-reader';
export { createSalesReader, type SalesSummary } from './sales-reader';
export type { ReaderOptions } from './row-context';
export { createLineCounter, escapeCsvCell, isFormulaLike, writeCsv, maxColumns, stripBom } from './csv-text';
export { parseDateCell, detectDateFormat } from './csv-dates';
export { parseNumberCell, toCents } from './csv-numbers';
export { detectPeriod } from './csv-period';
export { defaultChannels, matchChannel } from './csv-channels';
export { wideInterestMappingSchema, longInterestMappingSchema, salesMappingSchema, validateMapping } from './csv-mapping';
export { readCsvText, type CsvTextResult } from './read-csv-text';
export { importLimits, salesDateWindow, characterCount } from './csv-limits';
