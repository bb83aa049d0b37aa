import type { Knex } from 'knex';
import {
  themeTransitions,
  type ThemeCreate,
  type ThemeDetail,
  type ThemePatch,
  type ThemePick,
  type ThemeStatus,
  type ThemeStatusChange,
  type ThemeTarget,
  type ThemeView,
} from '@shared/contracts/themes';
import type { TargetWindow } from '@shared/contracts/series';
import { scoreTheme } from '@shared/scoring/score-theme';
import type { Score } from '@shared/scoring/types';
import { AppError, forbidden, notFound } from '../http/app-error';
import type { StudioContext } from '../http/auth-middleware';
import type { ScoringService } from '../series/scoring-service';
import { SeriesRepository } from '../series/series-repository';
import { resolveTarget, targetKeyOf } from '../series/targets';
import { ThemesRepository, type ThemeChanges, type ThemeRow } from './themes-repository';

interface Actor extends StudioContext {
  userId: number;
}

const iso = (date: Date | null) => (date ? new Date(date).toISOString() : null);

/** Items are matched without regard to case (the column's collation), so "Sign" and "sign" are one. */
function uniqueItems(items: string[]): string[] {
  const seen = new Map<string, string>();
  for (const item of items) if (!seen.has(item.toLowerCase())) seen.set(item.toLowerCase(), item);
  return [...seen.values()];
}

export class ThemesService {
  private readonly themes: ThemesRepository;
  private readonly series: SeriesRepository;

  constructor(
    db: Knex,
    private readonly scoring: ScoringService,
  ) {
    this.themes = new ThemesRepository(db);
    this.series = new SeriesRepository(db);
  }

  async list(studio: StudioContext): Promise<ThemeView[]> {
    const rows = await this.themes.list(studio.id);
    const ids = rows.map((row) => row.id);
    const [members, items] = await Promise.all([this.themes.members(studio.id, ids), this.themes.items(studio.id, ids)]);
    const context = await this.scoring.context(studio.id);
    const views: ThemeView[] = [];
    for (const row of rows) {
      const seriesIds = members.get(row.id) ?? [];
      const { score, target } = await this.scoreOf(studio.id, row, seriesIds, context);
      views.push(this.toView(row, seriesIds, items.get(row.id) ?? [], target, score));
    }
    return views;
  }

  async detail(studio: StudioContext, themeId: number): Promise<ThemeDetail> {
    const row = await this.themes.find(studio.id, themeId);
    if (!row) throw notFound('Theme');
    const seriesIds = (await this.themes.members(studio.id, [themeId])).get(themeId) ?? [];
    const items = (await this.themes.items(studio.id, [themeId])).get(themeId) ?? [];
    const context = await this.scoring.context(studio.id);
    const { score, target, window, memberScores } = await this.scoreOf(studio.id, row, seriesIds, context);
    const memberRows = await this.series.rows(studio.id, seriesIds);
    const history = await this.themes.history(studio.id, themeId);
    return {
      ...this.toView(row, seriesIds, items, target, score),
      members: memberRows.map((member) => ({
        id: member.id,
        term: member.term,
        region: member.region,
        kind: member.kind,
        period: member.period,
        heat: memberScores.get(member.id)?.heat ?? null,
        verdict: memberScores.get(member.id)?.verdict ?? null,
      })),
      history: history.map((entry) => ({
        from: entry.from_status,
        to: entry.to_status,
        target: entry.target_kind && entry.target_value ? targetKeyOf(entry.target_kind as ThemeTarget['kind'], entry.target_value) : null,
        by: entry.changed_by ? { id: entry.changed_by, name: entry.changed_by_name ?? '' } : null,
        at: iso(entry.changed_at) ?? '',
      })),
      window,
      itemSales: await this.series.unitsByMonth(studio.id, items),
    };
  }

  async create(actor: Actor, input: ThemeCreate): Promise<ThemeDetail> {
    const seriesIds = input.seriesIds ?? [];
    await this.checkSeries(actor.id, seriesIds);
    const items = uniqueItems(input.items ?? []);
    const themeId = await this.themes.create(actor.id, actor.userId, { name: input.name, status: input.status ?? 'idea', notes: input.notes ?? null }, seriesIds, items);
    await this.rescoreMembers(actor.id, [], seriesIds, items.length > 0);
    return this.detail(actor, themeId);
  }

  async update(actor: Actor, themeId: number, patch: ThemePatch): Promise<ThemeDetail> {
    const row = await this.existing(actor, themeId);
    if (patch.seriesIds) await this.checkSeries(actor.id, patch.seriesIds);
    const before = (await this.themes.members(actor.id, [themeId])).get(themeId) ?? [];
    const changes: ThemeChanges = {};
    if (patch.name !== undefined) changes.name = patch.name;
    if (patch.notes !== undefined) changes.notes = patch.notes;
    if (patch.offsetDays !== undefined) changes.offset_days = patch.offsetDays;
    const items = patch.items ? uniqueItems(patch.items) : undefined;
    await this.save(actor, row, patch.version, changes, { seriesIds: patch.seriesIds, items });
    await this.rescoreMembers(actor.id, before, patch.seriesIds ?? before, items !== undefined);
    return this.detail(actor, themeId);
  }

  async changeStatus(actor: Actor, themeId: number, change: ThemeStatusChange): Promise<ThemeDetail> {
    const row = await this.existing(actor, themeId);
    this.checkTransition(actor, row.status, change.status);
    if (change.status === 'picked' && !row.target_kind) {
      throw new AppError('invalid_input', 400, 'status: pick the theme for a target first (POST .../pick)', [
        { path: ['status'], message: 'A theme is picked for a target; use pick' },
      ]);
    }
    await this.save(actor, row, change.version, { status: change.status, status_changed_by: actor.userId }, {}, change.status);
    return this.detail(actor, themeId);
  }

  async pick(actor: Actor, themeId: number, input: ThemePick): Promise<ThemeDetail> {
    const row = await this.existing(actor, themeId);
    if (row.status !== 'picked') this.checkTransition(actor, row.status, 'picked');
    const context = await this.scoring.context(actor.id);
    const window = resolveTarget(targetKeyOf(input.target.kind, input.target.value), context.place, context.today);
    const changes: ThemeChanges = {
      status: 'picked',
      target_kind: input.target.kind,
      target_value: input.target.value,
      target_date: window ? window.to : null,
      status_changed_by: actor.userId,
    };
    if (input.target.kind === 'month' && window) changes.target_date = window.from;
    if (input.offsetDays !== undefined) changes.offset_days = input.offsetDays;
    await this.save(actor, row, input.version, changes, {}, 'picked', input.target);
    return this.detail(actor, themeId);
  }

  async remove(studio: StudioContext, themeId: number): Promise<void> {
    const before = (await this.themes.members(studio.id, [themeId])).get(themeId) ?? [];
    const items = (await this.themes.items(studio.id, [themeId])).get(themeId) ?? [];
    if ((await this.themes.delete(studio.id, themeId)) === 0) throw notFound('Theme');
    await this.rescoreMembers(studio.id, before, [], items.length > 0);
  }

  private async existing(studio: StudioContext, themeId: number): Promise<ThemeRow> {
    const row = await this.themes.find(studio.id, themeId);
    if (!row) throw notFound('Theme');
    return row;
  }

  private checkTransition(actor: Actor, from: ThemeStatus, to: ThemeStatus): void {
    if (from === to) return;
    if (!themeTransitions[from].includes(to)) {
      throw new AppError('invalid_transition', 409, `A theme cannot go from ${from} to ${to}; from ${from} it may go to ${themeTransitions[from].join(', ')}`);
    }
    // Choosing what the studio builds, or dropping that choice, is the owner's call.
    const isOwnersCall = to === 'picked' || (from === 'picked' && to !== 'building');
    if (isOwnersCall && actor.role !== 'owner') throw forbidden('Only the owner may pick a theme or drop a pick');
  }

  private async save(
    actor: Actor,
    row: ThemeRow,
    version: number,
    changes: ThemeChanges,
    members: { seriesIds?: number[]; items?: string[] },
    newStatus?: ThemeStatus,
    target?: { kind: string; value: string },
  ): Promise<void> {
    const isStatusChange = newStatus !== undefined && (newStatus !== row.status || target !== undefined);
    if (isStatusChange) changes.status_changed_at = this.themes.now();
    const statusChange =
      isStatusChange && newStatus !== undefined
        ? { from: row.status, to: newStatus, userId: actor.userId, targetKind: target?.kind ?? row.target_kind, targetValue: target?.value ?? row.target_value }
        : undefined;
    const isSaved = await this.themes.update(actor.id, row.id, version, changes, members, statusChange);
    if (!isSaved) {
      throw new AppError('version_conflict', 409, 'Someone else changed this theme; reload and try again', undefined, {
        current: await this.detail(actor, row.id),
      });
    }
  }

  private async checkSeries(studioId: number, ids: number[]): Promise<void> {
    const found = await this.themes.existingSeries(studioId, ids);
    const issues = ids.flatMap((id, index) => (found.has(id) ? [] : [{ path: ['seriesIds', index], message: `No series with id ${id} in this studio` }]));
    if (issues.length) throw new AppError('invalid_input', 400, issues.map((issue) => `seriesIds.${issue.path[1]}: ${issue.message}`).join('; '), issues);
  }

  /** Linked items feed the members' sales pull, so a change of members or items re-scores them. */
  private async rescoreMembers(studioId: number, before: number[], after: number[], itemsChanged: boolean): Promise<void> {
    const afterSet = new Set(after);
    const changed = itemsChanged ? [...new Set([...before, ...after])] : [...before.filter((id) => !afterSet.has(id)), ...after.filter((id) => !before.includes(id))];
    if (changed.length) await this.scoring.rescoreSeries(studioId, changed);
  }

  private async scoreOf(studioId: number, row: ThemeRow, seriesIds: number[], context: Awaited<ReturnType<ScoringService['context']>>) {
    const targetKey = row.target_kind && row.target_value ? targetKeyOf(row.target_kind, row.target_value) : '';
    let window: TargetWindow | null = null;
    try {
      window = await this.scoring.ensureFresh(studioId, targetKey, context, seriesIds);
    } catch (error) {
      // A stored target can stop resolving (a custom occasion removed); the theme still lists.
      if (!(error instanceof AppError)) throw error;
    }
    const stored = await this.series.scoresFor(studioId, targetKey, seriesIds);
    const memberScores = new Map<number, Score>([...stored].map(([id, scoreRow]) => [id, JSON.parse(scoreRow.score_json) as Score]));
    const target: ThemeTarget | null =
      row.target_kind && row.target_value
        ? { kind: row.target_kind, value: row.target_value, date: row.target_date, label: window?.label ?? row.target_value }
        : null;
    return { score: scoreTheme([...memberScores.values()]), target, window, memberScores };
  }

  private toView(row: ThemeRow, seriesIds: number[], items: string[], target: ThemeTarget | null, score: ThemeView['score']): ThemeView {
    return {
      id: row.id,
      name: row.name,
      status: row.status,
      seriesIds,
      items,
      target,
      offsetDays: row.offset_days,
      notes: row.notes,
      version: row.version,
      statusChangedAt: iso(row.status_changed_at),
      statusChangedBy: row.status_changed_by ? { id: row.status_changed_by, name: row.status_changed_by_name ?? '' } : null,
      createdAt: iso(row.created_at) ?? '',
      updatedAt: iso(row.updated_at) ?? '',
      score,
    };
  }
}
