import type { Knex } from 'knex';
import type { ThemeStatus, ThemeTargetKind } from '@shared/contracts/themes';

export interface ThemeRow {
  id: number;
  studio_id: number;
  name: string;
  status: ThemeStatus;
  target_kind: ThemeTargetKind | null;
  target_value: string | null;
  target_date: string | null;
  offset_days: number;
  notes: string | null;
  version: number;
  created_by: number | null;
  status_changed_by: number | null;
  status_changed_by_name: string | null;
  status_changed_at: Date | null;
  created_at: Date;
  updated_at: Date;
}

export interface HistoryRow {
  from_status: ThemeStatus | null;
  to_status: ThemeStatus;
  target_kind: string | null;
  target_value: string | null;
  changed_by: number | null;
  changed_by_name: string | null;
  changed_at: Date;
}

export type ThemeChanges = Partial<Pick<ThemeRow, 'name' | 'status' | 'target_kind' | 'target_value' | 'target_date' | 'offset_days' | 'notes' | 'status_changed_by'>> & {
  status_changed_at?: Knex.Raw;
};

export class ThemesRepository {
  constructor(private readonly db: Knex) {}

  private themes(studioId: number, trx: Knex = this.db) {
    return trx('themes as t')
      .leftJoin('users as u', 'u.id', 't.status_changed_by')
      .where('t.studio_id', studioId)
      .select('t.*', 'u.name as status_changed_by_name');
  }

  now(): Knex.Raw {
    return this.db.raw('NOW(3)');
  }

  async list(studioId: number): Promise<ThemeRow[]> {
    return this.themes(studioId).orderBy([{ column: 't.updated_at', order: 'desc' }, { column: 't.id', order: 'desc' }]);
  }

  async find(studioId: number, themeId: number): Promise<ThemeRow | undefined> {
    return this.themes(studioId).andWhere('t.id', themeId).first();
  }

  async members(studioId: number, themeIds: number[]): Promise<Map<number, number[]>> {
    const byTheme = new Map<number, number[]>(themeIds.map((id) => [id, []]));
    if (themeIds.length === 0) return byTheme;
    const rows: { theme_id: number; series_id: number }[] = await this.db('theme_series')
      .where({ studio_id: studioId })
      .whereIn('theme_id', themeIds)
      .orderBy(['theme_id', 'series_id']);
    for (const row of rows) byTheme.get(row.theme_id)?.push(row.series_id);
    return byTheme;
  }

  async items(studioId: number, themeIds: number[]): Promise<Map<number, string[]>> {
    const byTheme = new Map<number, string[]>(themeIds.map((id) => [id, []]));
    if (themeIds.length === 0) return byTheme;
    const rows: { theme_id: number; item: string }[] = await this.db('theme_items')
      .where({ studio_id: studioId })
      .whereIn('theme_id', themeIds)
      .orderBy(['theme_id', 'item']);
    for (const row of rows) byTheme.get(row.theme_id)?.push(row.item);
    return byTheme;
  }

  async history(studioId: number, themeId: number): Promise<HistoryRow[]> {
    return this.db('theme_status_history as h')
      .leftJoin('users as u', 'u.id', 'h.changed_by')
      .where({ 'h.studio_id': studioId, 'h.theme_id': themeId })
      .orderBy([{ column: 'h.changed_at', order: 'asc' }, { column: 'h.id', order: 'asc' }])
      .select('h.from_status', 'h.to_status', 'h.target_kind', 'h.target_value', 'h.changed_by', 'u.name as changed_by_name', 'h.changed_at');
  }

  /** The ids among these that are series of the studio. */
  async existingSeries(studioId: number, ids: number[]): Promise<Set<number>> {
    if (ids.length === 0) return new Set();
    return new Set((await this.db('series').where({ studio_id: studioId }).whereIn('id', ids).pluck('id')) as number[]);
  }

  async create(studioId: number, userId: number, values: { name: string; status: ThemeStatus; notes: string | null }, seriesIds: number[], items: string[]): Promise<number> {
    return this.db.transaction(async (trx) => {
      const [themeId] = await trx('themes').insert({
        studio_id: studioId,
        ...values,
        created_by: userId,
        status_changed_by: userId,
        status_changed_at: trx.raw('NOW(3)'),
      });
      await this.replaceMembers(trx, studioId, themeId, seriesIds, items);
      await this.record(trx, studioId, themeId, null, values.status, null, null, userId);
      return themeId as number;
    });
  }

  /**
   * Applies changes if the version still matches; returns false when someone else saved first.
   * A status change is recorded in the history in the same transaction.
   */
  async update(
    studioId: number,
    themeId: number,
    version: number,
    changes: ThemeChanges,
    members: { seriesIds?: number[]; items?: string[] },
    statusChange?: { from: ThemeStatus; to: ThemeStatus; userId: number; targetKind: string | null; targetValue: string | null },
  ): Promise<boolean> {
    return this.db.transaction(async (trx) => {
      const changed = await trx('themes')
        .where({ studio_id: studioId, id: themeId, version })
        .update({ ...changes, version: trx.raw('version + 1'), updated_at: trx.raw('NOW(3)') });
      if (changed === 0) return false;
      await this.replaceMembers(trx, studioId, themeId, members.seriesIds, members.items);
      if (statusChange) {
        await this.record(trx, studioId, themeId, statusChange.from, statusChange.to, statusChange.targetKind, statusChange.targetValue, statusChange.userId);
      }
      return true;
    });
  }

  /**
   * Moves a theme on with its runway (building once one is planned, launched once its launch is done)
   * when its status is one of `from`, recording the change in its history; true when it moved.
   * Runs in the caller's transaction when given one, so the runway or tick and the status go together.
   */
  async followRunway(studioId: number, themeId: number, to: ThemeStatus, from: readonly ThemeStatus[], userId: number, trx?: Knex.Transaction): Promise<boolean> {
    const run = async (inner: Knex.Transaction) => {
      const row = await inner('themes').where({ studio_id: studioId, id: themeId }).forUpdate().first('status', 'target_kind', 'target_value');
      if (!row || !from.includes(row.status)) return false;
      await inner('themes')
        .where({ studio_id: studioId, id: themeId })
        .update({ status: to, status_changed_by: userId, status_changed_at: inner.raw('NOW(3)'), version: inner.raw('version + 1'), updated_at: inner.raw('NOW(3)') });
      await this.record(inner, studioId, themeId, row.status, to, row.target_kind, row.target_value, userId);
      return true;
    };
    return trx ? run(trx) : this.db.transaction(run);
  }

  async delete(studioId: number, themeId: number): Promise<number> {
    return this.db('themes').where({ studio_id: studioId, id: themeId }).delete();
  }

  private async replaceMembers(trx: Knex.Transaction, studioId: number, themeId: number, seriesIds?: number[], items?: string[]) {
    if (seriesIds) {
      await trx('theme_series').where({ studio_id: studioId, theme_id: themeId }).delete();
      const unique = [...new Set(seriesIds)];
      if (unique.length) await trx('theme_series').insert(unique.map((seriesId) => ({ theme_id: themeId, series_id: seriesId, studio_id: studioId })));
    }
    if (items) {
      await trx('theme_items').where({ studio_id: studioId, theme_id: themeId }).delete();
      const unique = [...new Set(items)];
      if (unique.length) await trx('theme_items').insert(unique.map((item) => ({ theme_id: themeId, item, studio_id: studioId })));
    }
  }

  private async record(trx: Knex.Transaction, studioId: number, themeId: number, from: ThemeStatus | null, to: ThemeStatus, targetKind: string | null, targetValue: string | null, userId: number) {
    await trx('theme_status_history').insert({
      theme_id: themeId,
      studio_id: studioId,
      from_status: from,
      to_status: to,
      target_kind: targetKind,
      target_value: targetValue,
      changed_by: userId,
      changed_at: trx.raw('NOW(3)'),
    });
  }
}
