import type { Knex } from 'knex';
import {
  themeTransitions,
  type ThemeCreate,
  type ThemeDetail,
  type ThemePatch,
  type ThemePick,
  type ThemeStatus,
  type ThemeStatusChange,
  type ThemeMember,
  type ThemeTarget,
  type ThemeView,
} from '@shared/contracts/themes';
import type { TargetWindow } from '@shared/contracts/series';
import { scoreTheme } from '@shared/scoring/score-theme';
import type { Score } from '@shared/scoring/types';
import { AppError, forbidden, notFound } from '../http/app-error';
import type { StudioContext } from '../http/auth-middleware';
import type { ScoringService } from '../series/scoring-service';
import { SeriesRepository, type SeriesRow } from '../series/series-repository';
import { resolveTarget, targetKeyOf, targetLabelOf } from '../series/targets';
import { ThemesRepository, type ThemeChanges, type ThemeRow } from './themes-repository';

interface Actor extends StudioContext {
  userId: number;
}

const iso = (date: Date | null) => (date ? new Date(date).toISOString() : null);

type ScoringContext = Awaited<ReturnType<ScoringService['context']>>;

function memberOf(row: SeriesRow, score: Score | undefined): ThemeMember {
  return { id: row.id, term: row.term, region: row.region, kind: row.kind, period: row.period, heat: score?.heat ?? null, verdict: score?.verdict ?? null };
}

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
      const themeItems = items.get(row.id) ?? [];
      const { score, target } = await this.scoreOf(studio.id, row, seriesIds, themeItems, context);
      views.push(this.toView(row, seriesIds, themeItems, target, score));
    }
    return views;
  }

  async detail(studio: StudioContext, themeId: number): Promise<ThemeDetail> {
    const row = await this.themes.find(studio.id, themeId);
    if (!row) throw notFound('Theme');
    const seriesIds = (await this.themes.members(studio.id, [themeId])).get(themeId) ?? [];
    const items = (await this.themes.items(studio.id, [themeId])).get(themeId) ?? [];
    const context = await this.scoring.context(studio.id);
    const { score, target, window, memberScores, itemRows } = await this.scoreOf(studio.id, row, seriesIds, items, context);
    const memberRows = await this.series.rows(studio.id, seriesIds);
    const history = await this.themes.history(studio.id, themeId);
    return {
      ...this.toView(row, seriesIds, items, target, score),
      members: memberRows.map((member) => memberOf(member, memberScores.get(member.id))),
      itemSeries: itemRows.map((member) => memberOf(member, memberScores.get(member.id))),
      history: history.map((entry) => {
        const kind = entry.target_kind as ThemeTarget['kind'] | null;
        return {
          from: entry.from_status,
          to: entry.to_status,
          target: kind && entry.target_value ? targetKeyOf(kind, entry.target_value) : null,
          targetLabel: kind && entry.target_value ? targetLabelOf(kind, entry.target_value, context.place, context.today) : null,
          by: entry.changed_by ? { id: entry.changed_by, name: entry.changed_by_name ?? '' } : null,
          at: iso(entry.changed_at) ?? '',
        };
      }),
      window,
      itemSales: await this.series.unitsByMonth(studio.id, items),
    };
  }

  async create(actor: Actor, input: ThemeCreate): Promise<ThemeDetail> {
    await this.checkSeries(actor.id, input.seriesIds ?? []);
    const { seriesIds, salesItems } = await this.splitSeries(actor.id, input.seriesIds ?? []);
    const items = uniqueItems([...(input.items ?? []), ...salesItems]);
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
    const { seriesIds, salesItems } = patch.seriesIds ? await this.splitSeries(actor.id, patch.seriesIds) : { seriesIds: undefined, salesItems: [] };
    const givenItems = patch.items ?? (salesItems.length > 0 ? (await this.themes.items(actor.id, [themeId])).get(themeId) ?? [] : undefined);
    const items = givenItems ? uniqueItems([...givenItems, ...salesItems]) : undefined;
    await this.save(actor, row, patch.version, changes, { seriesIds, items });
    await this.rescoreMembers(actor.id, before, seriesIds ?? before, items !== undefined);
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

  /**
   * Items are attached one way only: a sales series given as a series joins as its item (by the
   * item's name), so its sales feed the members' sales pull and it shows under the items.
   */
  private async splitSeries(studioId: number, ids: number[]): Promise<{ seriesIds: number[]; salesItems: string[] }> {
    const kinds = new Map((await this.series.rows(studioId, ids)).map((row) => [row.id, row]));
    return {
      seriesIds: ids.filter((id) => kinds.get(id)?.kind !== 'sales'),
      salesItems: ids.flatMap((id) => (kinds.get(id)?.kind === 'sales' ? [kinds.get(id)!.term] : [])),
    };
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

  /** The theme's score from its members and the sales series of its items, for its own target. */
  private async scoreOf(studioId: number, row: ThemeRow, seriesIds: number[], items: string[], context: ScoringContext) {
    const targetKey = row.target_kind && row.target_value ? targetKeyOf(row.target_kind, row.target_value) : '';
    const itemRows = await this.series.salesSeriesOfItems(studioId, items);
    const ids = [...new Set([...seriesIds, ...itemRows.map((item) => item.id)])];
    let window: TargetWindow | null = null;
    try {
      window = await this.scoring.ensureFresh(studioId, targetKey, context, ids);
    } catch (error) {
      // A stored target can stop resolving (a custom occasion removed); the theme still lists.
      if (!(error instanceof AppError)) throw error;
    }
    const stored = await this.series.scoresFor(studioId, targetKey, ids);
    const memberScores = new Map<number, Score>([...stored].map(([id, scoreRow]) => [id, JSON.parse(scoreRow.score_json) as Score]));
    const target: ThemeTarget | null =
      row.target_kind && row.target_value
        ? { kind: row.target_kind, value: row.target_value, date: row.target_date, label: window?.label ?? targetLabelOf(row.target_kind, row.target_value, context.place, context.today) }
        : null;
    const scores = ids.flatMap((id) => (memberScores.has(id) ? [memberScores.get(id)!] : []));
    return { score: scoreTheme(scores), target, window, memberScores, itemRows };
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
