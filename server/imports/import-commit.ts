import type { Knex } from 'knex';
import { createRowReader, type CsvPeriod, type InterestPoint, type SaleRecord } from '@shared/csv';
import { AppError } from '../http/app-error';
import { issuesOf, type StoredAnalysis } from './import-analysis';
import { streamRowPieces } from './import-file';
import { ImportWriter, type PointRow, type WrittenSeries } from './import-writer';

export interface CommitPassOptions {
  batchSize: number;
  /** Test hook: throw after this many records were written, inside the transaction. */
  failAfterRows?: number;
  /** Called now and then with the data rows read so far (outside the transaction). */
  onProgress(rows: number): void;
}

export interface CommitPassResult {
  series: WrittenSeries[];
  replaced: Map<number, number>;
  rows: number;
  salesRows: number;
  start: string | null;
  end: string | null;
}

const salesDepth = 3;

/** Monday of the ISO week of an ISO date (sales series are weekly, as the scoring regularises them). */
function isoWeekStart(date: string): string {
  const time = Date.parse(`${date}T00:00:00Z`);
  const weekday = (new Date(time).getUTCDay() + 6) % 7;
  return new Date(time - weekday * 86_400_000).toISOString().slice(0, 10);
}

/**
 * Streams the stored file through papaparse and the shared row reader into batched multi-row
 * inserts on the transaction. One batch is written while the next is parsed; nothing but the
 * current batches (and, for sales, the weekly totals per item) is held in memory.
 */
export async function runCommitPass(
  trx: Knex.Transaction,
  studioId: number,
  importId: number,
  filePath: string,
  analysis: StoredAnalysis,
  options: CommitPassOptions,
): Promise<CommitPassResult> {
  const writer = new ImportWriter(trx, studioId, importId);
  try {
    return await commitPass(writer, filePath, analysis, options);
  } finally {
    await writer.close();
  }
}

async function commitPass(
  writer: ImportWriter,
  filePath: string,
  analysis: StoredAnalysis,
  options: CommitPassOptions,
): Promise<CommitPassResult> {
  const { preview } = analysis;
  const { dateOrder, channels, today } = analysis.options;
  const reader = createRowReader(preview, { dateOrder, channels, today, maxProblems: 500 });
  const period: CsvPeriod = preview.period ?? (preview.dateFormat === 'YYYY-MM' ? 'monthly' : 'weekly');
  const weekly = new Map<string, Map<string, number>>();
  const weekOf = new Map<string, string>();
  let written = 0;
  let salesRows = 0;
  const inFlight: Promise<void>[] = [];

  const checkInjectedFailure = () => {
    if (options.failAfterRows !== undefined && written >= options.failAfterRows) {
      throw new Error(`Injected failure after ${written} rows`);
    }
  };
  const writeInterest = async (points: InterestPoint[]) => {
    const rows: PointRow[] = [];
    for (const point of points) {
      const seriesId = await writer.seriesId('interest', point.term, point.region, period);
      rows.push({ seriesId, date: point.date, value: point.value, belowOne: point.belowOne });
    }
    await writer.writePoints(rows);
    written += rows.length;
    checkInjectedFailure();
  };
  const writeSales = async (sales: SaleRecord[]) => {
    await writer.writeSales(sales);
    written += sales.length;
    salesRows += sales.length;
    checkInjectedFailure();
  };
  const addToWeeks = (sale: SaleRecord) => {
    let week = weekOf.get(sale.date);
    if (week === undefined) {
      week = isoWeekStart(sale.date);
      weekOf.set(sale.date, week);
    }
    let weeks = weekly.get(sale.item);
    // A parsed cell is a slice of its 64 KB piece and would keep the piece alive as a key for the
    // whole commit (a large catalogue would hold most of the file); the key is a copy of its own.
    if (!weeks) weekly.set(Buffer.from(sale.item, 'utf8').toString('utf8'), (weeks = new Map()));
    weeks.set(week, (weeks.get(week) ?? 0) + sale.quantity);
  };
  // Keeps batches in flight while the next is parsed, so node and MariaDB work at once. Sales
  // batches queue up to three deep on the connection (the server takes them in order), which
  // rides out the moments when either side is slowed by other work on the machine. Interest
  // batches stay one deep: each may first look up or create its series, which must not interleave.
  const flush = async <T>(batch: T[], write: (batch: T[]) => Promise<void>, depth: number) => {
    while (inFlight.length >= depth) await inFlight.shift();
    const pending = write(batch);
    pending.catch(() => undefined);
    inFlight.push(pending);
  };

  let rowsRead = 0;
  let interestBatch: InterestPoint[] = [];
  let salesBatch: SaleRecord[] = [];
  for await (const rows of streamRowPieces(filePath, preview.delimiter)) {
    for (const row of rows) {
      rowsRead++;
      if (reader.kind === 'interest') {
        for (const point of reader.push(row.cells, row.line)) interestBatch.push(point);
        if (interestBatch.length >= options.batchSize) {
          await flush(interestBatch, writeInterest, 1);
          interestBatch = [];
          options.onProgress(rowsRead);
        }
      } else {
        for (const sale of reader.push(row.cells, row.line)) {
          salesBatch.push(sale);
          addToWeeks(sale);
        }
        if (salesBatch.length >= options.batchSize) {
          await flush(salesBatch, writeSales, salesDepth);
          salesBatch = [];
          options.onProgress(rowsRead);
        }
      }
    }
  }
  if (interestBatch.length > 0) await flush(interestBatch, writeInterest, 1);
  if (salesBatch.length > 0) await flush(salesBatch, writeSales, salesDepth);
  while (inFlight.length > 0) await inFlight.shift();

  const summary = reader.finish();
  if (summary.hasErrors) {
    const errors = summary.problems.filter((problem) => problem.severity === 'error');
    throw new AppError('file_has_problems', 400, `${summary.problemCount} problem(s) found while importing; nothing was stored`, issuesOf(errors));
  }
  let start: string | null;
  let end: string | null;
  if (summary.kind === 'sales') {
    // Points of many items share each insert (an item has a few hundred weeks at most).
    let points: PointRow[] = [];
    for (const [item, weeks] of weekly) {
      const seriesId = await writer.seriesId('sales', item, null, 'weekly');
      for (const [date, quantity] of weeks) points.push({ seriesId, date, value: quantity, belowOne: false });
      if (points.length >= options.batchSize) {
        await writer.writePoints(points);
        points = [];
      }
    }
    await writer.writePoints(points);
    ({ start, end } = summary);
  } else {
    const starts = summary.series.map((s) => s.start).filter((d): d is string => d !== null).sort();
    const ends = summary.series.map((s) => s.end).filter((d): d is string => d !== null).sort();
    start = starts[0] ?? null;
    end = ends[ends.length - 1] ?? null;
  }
  const { series, replaced } = await writer.finish();
  return { series, replaced, rows: summary.rows, salesRows, start, end };
}
