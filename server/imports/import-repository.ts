import type { Knex } from 'knex';
import type { CsvKind, CsvPeriod } from '@shared/csv';
import type { ImportStatus } from '@shared/contracts/imports';

export interface ImportRow {
  id: number;
  studio_id: number;
  file_name: string;
  kind: CsvKind;
  layout: string;
  status: ImportStatus;
  sha256: string;
  byte_size: number;
  delimiter: string | null;
  period: string | null;
  row_count: number;
  series_count: number;
  sales_rows: number;
  progress_rows: number;
  period_start: string | null;
  period_end: string | null;
  preview_json: string | null;
  mapping_json: string | null;
  stored_path: string | null;
  failure: string | null;
  created_by: number | null;
  created_by_name?: string | null;
  created_at: Date;
  committed_at: Date | null;
}

export interface SeriesRef {
  id: number;
  kind: CsvKind;
  term: string;
  region: string;
  period: CsvPeriod;
}

export interface ImportSeriesRow extends SeriesRef {
  points_written: number;
  points_replaced: number;
  points: number;
  start_date: string | null;
  end_date: string | null;
}

/**
 * The imports table for an update of one row by id. Left to itself MariaDB reaches the row through
 * the (studio_id, created_at) index and locks that entry before the row: a claim waiting for a
 * committing row would then hold what the commit's own last update needs, a deadlock. Through the
 * primary key both lock the row alone.
 */
function byPrimaryKey(db: Knex): Knex.QueryBuilder {
  return db(db.raw('?? FORCE INDEX (PRIMARY)', ['imports']));
}

/** The imports table and the rows an import owns. Every call takes the studio id. */
export class ImportRepository {
  constructor(private readonly db: Knex) {}

  async insert(studioId: number, row: Partial<ImportRow>): Promise<number> {
    const [id] = await this.db('imports').insert({ ...row, studio_id: studioId });
    return id;
  }

  find(studioId: number, importId: number): Promise<ImportRow | undefined> {
    return this.db<ImportRow>('imports as i')
      .leftJoin('users as u', 'u.id', 'i.created_by')
      .where({ 'i.studio_id': studioId, 'i.id': importId })
      .first('i.*', 'u.name as created_by_name');
  }

  list(studioId: number): Promise<ImportRow[]> {
    return this.db<ImportRow>('imports as i')
      .leftJoin('users as u', 'u.id', 'i.created_by')
      .where({ 'i.studio_id': studioId })
      .orderBy('i.created_at', 'desc')
      .orderBy('i.id', 'desc')
      .select(
        'i.id', 'i.studio_id', 'i.file_name', 'i.kind', 'i.layout', 'i.status', 'i.row_count', 'i.series_count', 'i.sales_rows',
        'i.period_start', 'i.period_end', 'i.created_by', 'i.created_at', 'i.committed_at', 'u.name as created_by_name',
      );
  }

  /** The latest committed import of the same file in this studio, if any. */
  findCommittedBySha(studioId: number, sha256: string, exceptId: number): Promise<ImportRow | undefined> {
    return this.db<ImportRow>('imports')
      .where({ studio_id: studioId, sha256, status: 'committed' })
      .whereNot({ id: exceptId })
      .orderBy('committed_at', 'desc')
      .first();
  }

  /** Previews nobody committed, uploaded before the given time. */
  stalePreviews(studioId: number, before: Date): Promise<ImportRow[]> {
    return this.db<ImportRow>('imports').where({ studio_id: studioId, status: 'preview' }).andWhere('created_at', '<', before).select('id', 'stored_path');
  }

  async update(studioId: number, importId: number, changes: Partial<ImportRow>, db: Knex = this.db): Promise<void> {
    await byPrimaryKey(db).where({ studio_id: studioId, id: importId }).update(changes);
  }

  /**
   * Marks a preview (or failed) import as committing and stamps its progress in one transaction, so
   * every claim has a progress time by which a stale one is told; false when another request got there first.
   */
  async claimForCommit(studioId: number, importId: number): Promise<boolean> {
    return this.db.transaction(async (trx) => {
      const changed = await byPrimaryKey(trx)
        .where({ studio_id: studioId, id: importId })
        .whereIn('status', ['preview', 'failed'])
        .update({ status: 'committing', failure: null, progress_rows: 0 });
      if (changed !== 1) return false;
      await this.writeProgress(studioId, importId, 0, trx);
      return true;
    });
  }

  /** Ids of the studio's imports of one file (same SHA-256), to lock before a commit's first read. */
  sameFileIds(studioId: number, sha256: string): Promise<number[]> {
    return this.db('imports').where({ studio_id: studioId, sha256 }).pluck('id');
  }

  /**
   * Locks the given imports of one file in id order, as the transaction's first statement, and
   * returns the latest committed one other than `importId`. A commit holds these locks until it
   * ends, so a second commit of the same file waits and then sees the first one committed, and a
   * live commit's row is never taken for a stale claim (see releaseStaleClaims). Locking by primary
   * key takes no gap locks, so uploads of other files are not held up; the read view starts after
   * the wait, so the commit's later reads see what the first commit stored.
   */
  async lockSameFile(studioId: number, ids: number[], importId: number, trx: Knex.Transaction): Promise<ImportRow | undefined> {
    const rows: ImportRow[] = await trx('imports').where({ studio_id: studioId }).whereIn('id', ids).orderBy('id').forUpdate().select();
    const committed = rows.filter((row) => row.status === 'committed' && row.id !== importId);
    return committed.sort((a, b) => Number(b.committed_at) - Number(a.committed_at))[0];
  }

  /**
   * Releases claims that no live commit holds (its transaction locks the import's row from its
   * first statement, so SKIP LOCKED passes it over) and whose progress is older than `seconds`
   * by the database's clock: commits that died with their process or their database, whose
   * writes the database rolled back. They become failed with `failure`; returns their ids.
   */
  async releaseStaleClaims(seconds: number, failure: string, only?: { studioId: number; importId: number }): Promise<number[]> {
    // Candidates first without locks, then each by its primary key, so no other import is locked.
    const claimed = this.db('imports').where({ status: 'committing' });
    if (only) claimed.andWhere({ studio_id: only.studioId, id: only.importId });
    const candidates: number[] = await claimed.pluck('id');
    if (candidates.length === 0) return [];
    return this.db.transaction(async (trx) => {
      const [rows] = (await trx.raw(
        `SELECT i.id FROM imports i FORCE INDEX (PRIMARY)
          WHERE i.id IN (${candidates.map(() => '?').join(',')}) AND i.status = 'committing'
            AND NOT EXISTS (SELECT 1 FROM import_progress p WHERE p.import_id = i.id AND p.updated_at >= NOW() - INTERVAL ? SECOND)
          FOR UPDATE SKIP LOCKED`,
        [...candidates, seconds],
      )) as [{ id: number }[]];
      const ids = rows.map((row) => row.id);
      if (ids.length === 0) return [];
      await trx('imports').whereIn('id', ids).update({ status: 'failed', failure, progress_rows: 0 });
      await trx('import_progress').whereIn('import_id', ids).delete();
      return ids;
    });
  }

  /** The import's status under a row lock held until the transaction ends. */
  async lockStatus(studioId: number, importId: number, trx: Knex.Transaction): Promise<ImportStatus | undefined> {
    const row = await trx('imports').where({ studio_id: studioId, id: importId }).forUpdate().first('status');
    return row?.status;
  }

  async remove(studioId: number, importId: number, db: Knex = this.db): Promise<void> {
    await db('imports').where({ studio_id: studioId, id: importId }).delete();
  }

  seriesOf(studioId: number, importId: number): Promise<ImportSeriesRow[]> {
    return this.db('import_series as x')
      .join('series as s', 's.id', 'x.series_id')
      .where({ 'x.studio_id': studioId, 'x.import_id': importId, 's.studio_id': studioId })
      .orderBy([{ column: 's.kind' }, { column: 's.term' }, { column: 's.region' }])
      .select('s.id', 's.kind', 's.term', 's.region', 's.period', 's.points', 's.start_date', 's.end_date', 'x.points_written', 'x.points_replaced');
  }

  async valuesOf(studioId: number, seriesIds: number[]): Promise<Map<number, { date: string; value: number | null }[]>> {
    const values = new Map<number, { date: string; value: number | null }[]>(seriesIds.map((id) => [id, []]));
    if (seriesIds.length === 0) return values;
    const rows: { series_id: number; date: string; value: number | null }[] = await this.db('series_points')
      .where({ studio_id: studioId })
      .whereIn('series_id', seriesIds)
      .orderBy([{ column: 'series_id' }, { column: 'date' }])
      .select('series_id', 'date', 'value');
    for (const row of rows) values.get(row.series_id)?.push({ date: row.date, value: row.value });
    return values;
  }

  /** Series an import wrote to (for deletion, which must tidy them afterwards). */
  async seriesIdsOf(studioId: number, importId: number, db: Knex = this.db): Promise<number[]> {
    const rows: { series_id: number }[] = await db('import_series').where({ studio_id: studioId, import_id: importId }).select('series_id');
    return rows.map((row) => row.series_id);
  }

  /** Commit progress lives in its own table: see migration 20261201001500_import_progress. */
  async writeProgress(studioId: number, importId: number, rows: number, db: Knex = this.db): Promise<void> {
    await db.raw(
      `INSERT INTO import_progress (import_id, studio_id, rows_done) VALUES (?, ?, ?)
       ON DUPLICATE KEY UPDATE rows_done = VALUES(rows_done), updated_at = NOW()`,
      [importId, studioId, rows],
    );
  }

  async readProgress(studioId: number, importId: number): Promise<number> {
    const row = await this.db('import_progress').where({ studio_id: studioId, import_id: importId }).first('rows_done');
    return row?.rows_done ?? 0;
  }

  async clearProgress(studioId: number, importId: number): Promise<void> {
    await this.db('import_progress').where({ studio_id: studioId, import_id: importId }).delete();
  }

  /**
   * Removes an import's sales and the points it wrote; points other imports wrote stay. With
   * `isRefreshDeferred` (a replacing import) the series rows stay for now, so the new import writes
   * into the same series ids (theme members and scores keep pointing at them); call `refresh` after.
   */
  async deleteData(studioId: number, importId: number, db: Knex, isRefreshDeferred = false): Promise<number[]> {
    const seriesIds = await this.seriesIdsOf(studioId, importId, db);
    await db('sales').where({ studio_id: studioId, import_id: importId }).delete();
    await db('series_points').where({ studio_id: studioId, import_id: importId }).delete();
    await db('import_series').where({ studio_id: studioId, import_id: importId }).delete();
    return isRefreshDeferred ? seriesIds : refreshSeries(db, studioId, seriesIds);
  }

  refresh(studioId: number, seriesIds: number[], db: Knex): Promise<number[]> {
    return refreshSeries(db, studioId, seriesIds);
  }
}

/**
 * Recomputes start, end and point count of the given series; series left without points are
 * deleted. Returns the ids that still exist.
 */
export async function refreshSeries(db: Knex, studioId: number, seriesIds: number[]): Promise<number[]> {
  if (seriesIds.length === 0) return [];
  const placeholders = seriesIds.map(() => '?').join(',');
  await db.raw(
    `UPDATE series s
       LEFT JOIN (SELECT series_id, MIN(date) AS first_date, MAX(date) AS last_date, COUNT(*) AS total
                    FROM series_points WHERE studio_id = ? AND series_id IN (${placeholders}) GROUP BY series_id) p
         ON p.series_id = s.id
        SET s.start_date = p.first_date, s.end_date = p.last_date, s.points = COALESCE(p.total, 0),
            s.version = s.version + 1, s.updated_at = NOW()
      WHERE s.studio_id = ? AND s.id IN (${placeholders})`,
    [studioId, ...seriesIds, studioId, ...seriesIds],
  );
  await db('series').where({ studio_id: studioId, points: 0 }).whereIn('id', seriesIds).delete();
  const rows: { id: number }[] = await db('series').where({ studio_id: studioId }).whereIn('id', seriesIds).select('id');
  return rows.map((row) => row.id);
}
