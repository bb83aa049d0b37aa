import { appClock } from '../clock/clock';
import fs from 'node:fs';
import type { Knex } from 'knex';
import type {
  CommitRequest,
  CommitResult,
  ImportDetail,
  ImportListItem,
  ImportPreview,
  PreviewChange,
  UploadFields,
} from '@shared/contracts/imports';
import type { SessionUser, StudioContext } from '../http/auth-middleware';
import { AppError, notFound } from '../http/app-error';
import { StudioRepository } from '../studios/studio-repository';
import { analyseFile, assertCommittable, errorsOf, type AnalysisOptions, type StoredAnalysis } from './import-analysis';
import { runCommitPass } from './import-commit';
import { sha256OfFile } from './import-file';
import { ImportRepository, type ImportRow } from './import-repository';

export interface ImportServiceOptions {
  /** Rows per multi-row insert. */
  batchSize?: number;
  /** Test hook: the commit throws after this many records, to prove that nothing partial stays. */
  failAfterRows?: number;
  /** Called after a commit or a deletion changed series (the scoring hooks in here). */
  afterSeriesChanged?(studioId: number, seriesIds: number[]): Promise<void>;
}

export interface UploadedFile {
  path: string;
  originalName: string;
  size: number;
}

const progressEveryMs = 250;
/** How long an uncommitted preview (and its uploaded file) is kept. */
const previewLifetimeMs = 24 * 3600 * 1000;

function iso(value: Date | string | null): string | null {
  if (value === null) return null;
  return value instanceof Date ? value.toISOString() : new Date(value).toISOString();
}

/** Imports: upload and preview, corrected mappings, all-or-nothing commits, history and deletion. */
export class ImportService {
  private readonly imports: ImportRepository;
  private readonly studios: StudioRepository;

  constructor(
    private readonly db: Knex,
    private readonly options: ImportServiceOptions = {},
  ) {
    this.imports = new ImportRepository(db);
    this.studios = new StudioRepository(db);
  }

  async upload(studio: StudioContext, user: SessionUser, file: UploadedFile, fields: UploadFields): Promise<ImportPreview> {
    let analysis: StoredAnalysis;
    let sha256: string;
    try {
      sha256 = await sha256OfFile(file.path);
      analysis = await analyseFile(file.path, { ...fields, channels: await this.studios.channels(studio.id) });
    } catch (error) {
      await fs.promises.rm(file.path, { force: true });
      throw error;
    }
    await this.pruneStalePreviews(studio.id);
    const id = await this.imports.insert(studio.id, {
      file_name: file.originalName.slice(0, 255),
      sha256,
      byte_size: file.size,
      stored_path: file.path,
      created_by: user.id,
      ...this.previewColumns(analysis),
    });
    return this.previewOf((await this.imports.find(studio.id, id))!);
  }

  async changePreview(studio: StudioContext, importId: number, change: PreviewChange): Promise<ImportPreview> {
    const row = await this.pending(studio.id, importId);
    const analysis = await this.reanalyse(studio.id, row, change);
    await this.imports.update(studio.id, importId, this.previewColumns(analysis));
    return this.previewOf((await this.imports.find(studio.id, importId))!);
  }

  async commit(studio: StudioContext, importId: number, request: CommitRequest): Promise<CommitResult> {
    const row = await this.pending(studio.id, importId);
    let analysis = this.analysisOf(row);
    if (request.mapping !== undefined || request.dateOrder !== undefined) {
      analysis = await this.reanalyse(studio.id, row, request);
      await this.imports.update(studio.id, importId, this.previewColumns(analysis));
    }
    assertCommittable(analysis);
    const duplicate = await this.imports.findCommittedBySha(studio.id, row.sha256, importId);
    if (duplicate && !request.onDuplicate) {
      throw new AppError(
        'duplicate_file',
        409,
        `This file was already imported on ${iso(duplicate.committed_at)?.slice(0, 10)} as "${duplicate.file_name}"; choose onDuplicate "skip" or "replace"`,
        [{ path: ['onDuplicate'], message: 'Choose "skip" or "replace"' }],
        { duplicateOf: { id: duplicate.id, fileName: duplicate.file_name, committedAt: iso(duplicate.committed_at) } },
      );
    }
    if (duplicate && request.onDuplicate === 'skip') {
      await this.discard(studio.id, row);
      return { ...(await this.resultOf(studio.id, duplicate.id)), skipped: true };
    }
    const storedPath = row.stored_path;
    if (!storedPath || !fs.existsSync(storedPath)) {
      throw new AppError('upload_gone', 410, 'The uploaded file is no longer on the server; upload it again');
    }

    if (!(await this.imports.claimForCommit(studio.id, importId))) {
      throw new AppError('commit_running', 409, 'This import is being committed (or was just committed) by another request');
    }
    const progress = this.progressWriter(studio.id, importId);
    let changedSeries: number[];
    try {
      changedSeries = await this.db.transaction(async (trx) => {
        const replacedSeries = duplicate ? await this.imports.deleteData(studio.id, duplicate.id, trx, true) : [];
        if (duplicate) await this.imports.remove(studio.id, duplicate.id, trx);
        const pass = await runCommitPass(trx, studio.id, importId, storedPath, analysis, {
          batchSize: this.options.batchSize ?? 2000,
          failAfterRows: this.options.failAfterRows,
          onProgress: progress.report,
        });
        const keptSeries = await this.imports.refresh(studio.id, replacedSeries, trx);
        await this.imports.update(
          studio.id,
          importId,
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
        return [...new Set([...keptSeries, ...pass.series.map((series) => series.id)])];
      });
    } catch (error) {
      await progress.stop();
      const message = error instanceof Error ? error.message : String(error);
      await this.imports.update(studio.id, importId, { status: 'failed', failure: message.slice(0, 2000), progress_rows: 0 });
      throw error;
    }
    await progress.stop();
    await fs.promises.rm(storedPath, { force: true });
    if (duplicate?.stored_path) await fs.promises.rm(duplicate.stored_path, { force: true });
    if (changedSeries.length > 0) await this.options.afterSeriesChanged?.(studio.id, changedSeries);
    return this.resultOf(studio.id, importId);
  }

  async list(studio: StudioContext): Promise<ImportListItem[]> {
    return (await this.imports.list(studio.id)).map((row) => this.listItemOf(row));
  }

  async detail(studio: StudioContext, importId: number): Promise<ImportDetail> {
    const row = await this.imports.find(studio.id, importId);
    if (!row) throw notFound('Import');
    const seriesRows = await this.imports.seriesOf(studio.id, importId);
    const values = await this.imports.valuesOf(studio.id, seriesRows.map((series) => series.id));
    const progressRows = row.status === 'committing' ? await this.progressOf(studio.id, importId) : row.progress_rows;
    return {
      ...this.listItemOf(row),
      progressRows,
      failure: row.failure,
      preview: row.status === 'committed' ? null : await this.previewOf(row),
      series: seriesRows.map((series) => ({
        id: series.id,
        term: series.term,
        region: series.region || null,
        kind: series.kind,
        period: series.period,
        points: series.points_written,
        replaced: series.points_replaced,
        total: series.points,
        start: series.start_date,
        end: series.end_date,
        values: values.get(series.id) ?? [],
      })),
    };
  }

  async remove(studio: StudioContext, importId: number): Promise<void> {
    const row = await this.imports.find(studio.id, importId);
    if (!row) throw notFound('Import');
    if (row.status === 'committing') throw new AppError('commit_running', 409, 'This import is being committed; wait until it ends');
    const remaining = await this.db.transaction(async (trx) => {
      const kept = await this.imports.deleteData(studio.id, importId, trx);
      await this.imports.remove(studio.id, importId, trx);
      return kept;
    });
    if (row.stored_path) await fs.promises.rm(row.stored_path, { force: true });
    if (remaining.length > 0) await this.options.afterSeriesChanged?.(studio.id, remaining);
  }

  private async pending(studioId: number, importId: number): Promise<ImportRow> {
    const row = await this.imports.find(studioId, importId);
    if (!row) throw notFound('Import');
    if (row.status === 'committed') throw new AppError('already_committed', 409, 'This import is already committed');
    if (row.status === 'committing') throw new AppError('commit_running', 409, 'This import is being committed right now');
    return row;
  }

  private analysisOf(row: ImportRow): StoredAnalysis {
    return JSON.parse(row.preview_json ?? 'null') as StoredAnalysis;
  }

  private async reanalyse(studioId: number, row: ImportRow, change: PreviewChange): Promise<StoredAnalysis> {
    if (!row.stored_path || !fs.existsSync(row.stored_path)) {
      throw new AppError('upload_gone', 410, 'The uploaded file is no longer on the server; upload it again');
    }
    const previous = this.analysisOf(row).options;
    const options: AnalysisOptions = {
      kind: change.kind ?? previous.kind,
      mapping: change.mapping ?? previous.mapping,
      dateOrder: change.dateOrder ?? previous.dateOrder,
      // A re-check reads the studio's channels as they are now (one may have been added meanwhile).
      channels: await this.studios.channels(studioId),
    };
    // A new kind without a new mapping asks detection again rather than keep the other kind's mapping.
    if (change.kind !== undefined && change.mapping === undefined) options.mapping = undefined;
    return analyseFile(row.stored_path, options);
  }

  private previewColumns(analysis: StoredAnalysis): Partial<ImportRow> {
    const { preview } = analysis;
    return {
      kind: preview.kind,
      layout: preview.layout,
      delimiter: preview.delimiter,
      period: preview.period,
      row_count: preview.rows,
      preview_json: JSON.stringify(analysis),
      mapping_json: JSON.stringify(preview.mapping),
      status: 'preview',
    };
  }

  private async previewOf(row: ImportRow): Promise<ImportPreview> {
    const { preview, options } = this.analysisOf(row);
    const duplicate = await this.imports.findCommittedBySha(row.studio_id, row.sha256, row.id);
    return {
      ...preview,
      id: row.id,
      status: row.status,
      fileName: row.file_name,
      dateOrder: options.dateOrder ?? null,
      hasErrors: errorsOf(preview).length > 0,
      byteSize: Number(row.byte_size),
      sha256: row.sha256,
      duplicateOf: duplicate ? { id: duplicate.id, fileName: duplicate.file_name, committedAt: iso(duplicate.committed_at) } : null,
    };
  }

  private listItemOf(row: ImportRow): ImportListItem {
    return {
      id: row.id,
      fileName: row.file_name,
      kind: row.kind,
      layout: row.layout as ImportListItem['layout'],
      status: row.status,
      rows: row.row_count,
      seriesCount: row.series_count,
      salesRows: row.sales_rows,
      periodStart: row.period_start,
      periodEnd: row.period_end,
      createdBy: row.created_by === null ? null : { id: row.created_by, name: row.created_by_name ?? '' },
      createdAt: iso(row.created_at)!,
      committedAt: iso(row.committed_at),
    };
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

  private async pruneStalePreviews(studioId: number): Promise<void> {
    for (const row of await this.imports.stalePreviews(studioId, new Date(appClock.now().getTime() - previewLifetimeMs))) await this.discard(studioId, row);
  }

  private async discard(studioId: number, row: ImportRow): Promise<void> {
    await this.imports.remove(studioId, row.id);
    if (row.stored_path) await fs.promises.rm(row.stored_path, { force: true });
  }

  private async progressOf(studioId: number, importId: number): Promise<number> {
    return this.imports.readProgress(studioId, importId);
  }

  /** Writes progress on the pool (a second connection), at most every 250 ms, one write at a time. */
  private progressWriter(studioId: number, importId: number) {
    let last = 0;
    const write = (rows: number) => this.imports.writeProgress(studioId, importId, rows).catch(() => undefined);
    let writing: Promise<unknown> = write(0);
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
