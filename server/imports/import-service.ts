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
import { commitRunning, deleteConflict, interruptedFailure, retryOnDeadlock, staleClaimSeconds } from './import-claims';
import { ImportCommitter, isoOf, type CommitterOptions } from './import-committer';
import { sha256OfFile } from './import-file';
import { ImportRepository, type ImportRow } from './import-repository';

export type ImportServiceOptions = CommitterOptions;

export interface UploadedFile {
  path: string;
  originalName: string;
  size: number;
}

/** How long an uncommitted preview (and its uploaded file) is kept. */
const previewLifetimeMs = 24 * 3600 * 1000;
/** mapping_json is TEXT: 65,535 bytes (MariaDB docs, "TEXT"); the preview_json beside it holds the mapping too. */
const mappingJsonBytes = 65_535;

/** Imports: upload and preview, corrected mappings, all-or-nothing commits, history and deletion. */
export class ImportService {
  private readonly imports: ImportRepository;
  private readonly studios: StudioRepository;
  private readonly committer: ImportCommitter;

  constructor(
    private readonly db: Knex,
    private readonly options: ImportServiceOptions = {},
  ) {
    this.imports = new ImportRepository(db);
    this.studios = new StudioRepository(db);
    this.committer = new ImportCommitter(db, this.imports, options);
  }

  async upload(studio: StudioContext, user: SessionUser, file: UploadedFile, fields: UploadFields): Promise<ImportPreview> {
    let analysis: StoredAnalysis;
    let sha256: string;
    try {
      sha256 = await sha256OfFile(file.path);
      analysis = await analyseFile(file.path, { ...fields, ...(await this.studioFacts(studio)) });
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
    const analysis = await this.reanalyse(studio, row, change);
    await this.imports.update(studio.id, importId, this.previewColumns(analysis));
    return this.previewOf((await this.imports.find(studio.id, importId))!);
  }

  async commit(studio: StudioContext, importId: number, request: CommitRequest): Promise<CommitResult> {
    const row = await this.pending(studio.id, importId);
    let analysis = this.analysisOf(row);
    if (request.mapping !== undefined || request.dateOrder !== undefined) {
      analysis = await this.reanalyse(studio, row, request);
      await this.imports.update(studio.id, importId, this.previewColumns(analysis));
    }
    assertCommittable(analysis);
    return this.committer.commit(studio.id, row, analysis, request);
  }

  async list(studio: StudioContext): Promise<ImportListItem[]> {
    return (await this.imports.list(studio.id)).map((row) => this.listItemOf(row));
  }

  async detail(studio: StudioContext, importId: number): Promise<ImportDetail> {
    const row = await this.imports.find(studio.id, importId);
    if (!row) throw notFound('Import');
    const seriesRows = await this.imports.seriesOf(studio.id, importId);
    const values = await this.imports.valuesOf(studio.id, seriesRows.map((series) => series.id));
    const progressRows = row.status === 'committing' ? await this.imports.readProgress(studio.id, importId) : row.progress_rows;
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
    const row = await this.unclaimed(studio.id, importId);
    const remove = () =>
      this.db.transaction(async (trx) => {
        // A commit that claimed the import since it was read holds its row: wait, then refuse.
        if ((await this.imports.lockStatus(studio.id, importId, trx)) === 'committing') throw commitRunning();
        const kept = await this.imports.deleteData(studio.id, importId, trx);
        await this.imports.remove(studio.id, importId, trx);
        return kept;
      });
    const remaining = await retryOnDeadlock(remove, deleteConflict);
    if (row.stored_path) await fs.promises.rm(row.stored_path, { force: true });
    if (remaining.length > 0) await this.options.afterSeriesChanged?.(studio.id, remaining);
  }

  private async pending(studioId: number, importId: number): Promise<ImportRow> {
    const row = await this.unclaimed(studioId, importId);
    if (row.status === 'committed') throw new AppError('already_committed', 409, 'This import is already committed');
    return row;
  }

  /** The import, its claim released first when the commit that holds it died (see import-claims.ts). */
  private async unclaimed(studioId: number, importId: number): Promise<ImportRow> {
    const row = await this.imports.find(studioId, importId);
    if (!row) throw notFound('Import');
    if (row.status !== 'committing') return row;
    const released = await this.imports.releaseStaleClaims(staleClaimSeconds, interruptedFailure, { studioId, importId });
    if (released.length === 0) throw commitRunning();
    return (await this.imports.find(studioId, importId)) ?? row;
  }

  /** What the readers need of the studio: its channels, and its today that bounds sales dates. */
  private async studioFacts(studio: StudioContext): Promise<Pick<AnalysisOptions, 'channels' | 'today'>> {
    const settings = await this.studios.find(studio.id, studio.role);
    if (!settings) throw notFound('Studio');
    return { channels: settings.channels, today: appClock.today(settings.timezone) };
  }

  private analysisOf(row: ImportRow): StoredAnalysis {
    return JSON.parse(row.preview_json ?? 'null') as StoredAnalysis;
  }

  private async reanalyse(studio: StudioContext, row: ImportRow, change: PreviewChange): Promise<StoredAnalysis> {
    if (!row.stored_path || !fs.existsSync(row.stored_path)) {
      throw new AppError('upload_gone', 410, 'The uploaded file is no longer on the server; upload it again');
    }
    const previous = this.analysisOf(row).options;
    const options: AnalysisOptions = {
      kind: change.kind ?? previous.kind,
      mapping: change.mapping ?? previous.mapping,
      dateOrder: change.dateOrder ?? previous.dateOrder,
      // A re-check reads the studio as it is now (a channel may have been added meanwhile).
      ...(await this.studioFacts(studio)),
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
      mapping_json: fitsMappingColumn(JSON.stringify(preview.mapping)),
      status: 'preview',
    };
  }

  private async previewOf(row: ImportRow): Promise<ImportPreview> {
    const { preview, options } = this.analysisOf(row);
    const duplicate = await this.imports.findCommittedBySha(row.studio_id, row.sha256, row.id);
    return {
      ...preview,
      // A stored preview without a count of returns has none.
      returnRows: preview.returnRows ?? 0,
      id: row.id,
      status: row.status,
      fileName: row.file_name,
      dateOrder: options.dateOrder ?? null,
      hasErrors: errorsOf(preview).length > 0,
      byteSize: Number(row.byte_size),
      sha256: row.sha256,
      duplicateOf: duplicate ? { id: duplicate.id, fileName: duplicate.file_name, committedAt: isoOf(duplicate.committed_at) } : null,
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
      createdAt: isoOf(row.created_at)!,
      committedAt: isoOf(row.committed_at),
    };
  }

  private async pruneStalePreviews(studioId: number): Promise<void> {
    for (const row of await this.imports.stalePreviews(studioId, new Date(appClock.now().getTime() - previewLifetimeMs))) await this.committer.discard(studioId, row);
  }
}

/** The mapping as JSON when it fits its TEXT column, else null (nothing reads the column back). */
function fitsMappingColumn(json: string): string | null {
  return Buffer.byteLength(json, 'utf8') <= mappingJsonBytes ? json : null;
}
