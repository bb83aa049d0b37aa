import fs from 'node:fs';
import type { Knex } from 'knex';
import type { CommitRequest, CommitResult } from '@shared/contracts/imports';
import { appClock } from '../clock/clock';
import { AppError } from '../http/app-error';
import type { StoredAnalysis } from './import-analysis';
import { commitConflict, failureOf, retryOnDeadlock } from './import-claims';
import { runCommitPass } from './import-commit';
import { ImportRepository, type ImportRow } from './import-repository';

export interface CommitterOptions {
  /** Rows per multi-row insert. */
  batchSize?: number;
  /** Test hook: the commit throws after this many records, to prove that nothing partial stays. */
  failAfterRows?: number;
  /** Called after a commit or a deletion changed series (the scoring hooks in here). */
  afterSeriesChanged?(studioId: number, seriesIds: number[]): Promise<void>;
  /** Where a retried deadlock is noted (the error middleware logs every other server error). */
  log?: { warn(details: unknown, message: string): void };
}

const progressEveryMs = 250;

export function isoOf(value: Date | string | null): string | null {
  if (value === null) return null;
  return value instanceof Date ? value.toISOString() : new Date(value).toISOString();
}

function duplicateFile(duplicate: ImportRow): AppError {
  const committedAt = isoOf(duplicate.committed_at);
  return new AppError(
    'duplicate_file',
    409,
    `This file was already imported on ${committedAt?.slice(0, 10)} as "${duplicate.file_name}"; choose onDuplicate "skip" or "replace"`,
    [{ path: ['onDuplicate'], message: 'Choose "skip" or "replace"' }],
    { duplicateOf: { id: duplicate.id, fileName: duplicate.file_name, committedAt } },
  );
}

interface Written {
  changedSeries: number[];
  replaced: ImportRow | undefined;
}

type ProgressWriter = ReturnType<ImportCommitter['progressWriter']>;

/** An analysed import's commit: the same file's earlier import, the claim, one transaction, what failure leaves. */
export class ImportCommitter {
  constructor(
    private readonly db: Knex,
    private readonly imports: ImportRepository,
    private readonly options: CommitterOptions,
  ) {}

  async commit(studioId: number, row: ImportRow, analysis: StoredAnalysis, request: CommitRequest): Promise<CommitResult> {
    const duplicate = await this.imports.findCommittedBySha(studioId, row.sha256, row.id);
    if (duplicate && !request.onDuplicate) throw duplicateFile(duplicate);
    if (duplicate && request.onDuplicate === 'skip') {
      await this.discard(studioId, row);
      return { ...(await this.resultOf(studioId, duplicate.id)), skipped: true };
    }
    const storedPath = row.stored_path;
    if (!storedPath || !fs.existsSync(storedPath)) {
      throw new AppError('upload_gone', 410, 'The uploaded file is no longer on the server; upload it again');
    }
    const sameFile = await this.imports.sameFileIds(studioId, row.sha256);
    if (!(await this.imports.claimForCommit(studioId, row.id))) {
      throw new AppError('commit_running', 409, 'This import is being committed (or was just committed) by another request');
    }
    const progress = this.progressWriter(studioId, row.id);
    let written: Written;
    try {
      const attempt = () => this.attempt(studioId, row, { storedPath, analysis, request, sameFile, progress });
      written = await retryOnDeadlock(attempt, commitConflict, (error) => this.options.log?.warn({ err: error, importId: row.id }, 'import commit deadlocked; retrying once'));
    } catch (error) {
      // A file someone else committed meanwhile leaves this one a preview, to skip or replace it.
      const isDuplicate = error instanceof AppError && error.code === 'duplicate_file';
      await this.imports.update(studioId, row.id, isDuplicate ? { status: 'preview', failure: null, progress_rows: 0 } : { status: 'failed', failure: failureOf(error), progress_rows: 0 });
      await progress.stop();
      throw error;
    }
    await progress.stop();
    await fs.promises.rm(storedPath, { force: true });
    if (written.replaced?.stored_path) await fs.promises.rm(written.replaced.stored_path, { force: true });
    if (written.changedSeries.length > 0) await this.options.afterSeriesChanged?.(studioId, written.changedSeries);
    return this.resultOf(studioId, row.id);
  }

  async discard(studioId: number, row: ImportRow): Promise<void> {
    await this.imports.remove(studioId, row.id);
    if (row.stored_path) await fs.promises.rm(row.stored_path, { force: true });
  }

  private async attempt(
    studioId: number,
    row: ImportRow,
    run: { storedPath: string; analysis: StoredAnalysis; request: CommitRequest; sameFile: number[]; progress: ProgressWriter },
  ): Promise<Written> {
    try {
      return await this.db.transaction((trx) => this.write(trx, studioId, row, run));
    } catch (error) {
      // A deadlock ends the transaction at once, and sales batches already queued on its
      // connection then run on their own and stay: clear whatever is stored under this import.
      await this.imports.deleteData(studioId, row.id, this.db).catch(() => undefined);
      throw error;
    }
  }

  private async write(
    trx: Knex.Transaction,
    studioId: number,
    row: ImportRow,
    run: { storedPath: string; analysis: StoredAnalysis; request: CommitRequest; sameFile: number[]; progress: ProgressWriter },
  ): Promise<Written> {
    // First, so that a commit of the same file that ran meanwhile is seen whole (or waited for).
    const committed = await this.imports.lockSameFile(studioId, run.sameFile, row.id, trx);
    if (committed && run.request.onDuplicate !== 'replace') throw duplicateFile(committed);
    const replacedSeries = committed ? await this.imports.deleteData(studioId, committed.id, trx, true) : [];
    if (committed) await this.imports.remove(studioId, committed.id, trx);
    const pass = await runCommitPass(trx, studioId, row.id, run.storedPath, run.analysis, {
      batchSize: this.options.batchSize ?? 2000,
      failAfterRows: this.options.failAfterRows,
      onProgress: run.progress.report,
    });
    const keptSeries = await this.imports.refresh(studioId, replacedSeries, trx);
    await this.imports.update(
      studioId,
      row.id,
      {
        status: 'committed',
        row_count: pass.rows,
        progress_rows: pass.rows,
        series_count: pass.series.length,
        sales_rows: pass.salesRows,
        period_start: pass.start,
        period_end: pass.end,
        committed_at: appClock.now(),
        stored_path: null,
      },
      trx,
    );
    return { changedSeries: [...new Set([...keptSeries, ...pass.series.map((series) => series.id)])], replaced: committed };
  }

  private async resultOf(studioId: number, importId: number): Promise<CommitResult> {
    const row = await this.imports.find(studioId, importId);
    const series = await this.imports.seriesOf(studioId, importId);
    return {
      id: importId,
      status: 'committed',
      series: series.map((s) => ({ id: s.id, term: s.term, region: s.region || null, kind: s.kind, period: s.period, points: s.points_written })),
      sales: { rows: row?.sales_rows ?? 0 },
    };
  }

  /** Writes progress on the pool (a second connection), at most every 250 ms, one write at a time. */
  private progressWriter(studioId: number, importId: number) {
    let last = 0;
    const write = (rows: number) => this.imports.writeProgress(studioId, importId, rows).catch(() => undefined);
    let writing: Promise<unknown> = Promise.resolve();
    return {
      report: (rows: number) => {
        // Real elapsed time, only to space the progress writes.
        const now = Date.now();
        if (now - last < progressEveryMs) return;
        last = now;
        writing = writing.then(() => write(rows));
      },
      stop: async () => {
        await writing;
        await this.imports.clearProgress(studioId, importId).catch(() => undefined);
      },
    };
  }
}
