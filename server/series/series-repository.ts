import type { Knex } from 'knex';
import type { SeriesListQuery, SeriesSort } from '@shared/contracts/series';
import type { Point } from '@shared/scoring/types';
import { OccasionRepository } from '../occasions/occasion-repository';
import type { StudioPlace } from './targets';

export interface SeriesRow {
  id: number;
  studio_id: number;
  kind: 'interest' | 'sales';
  term: string;
  region: string;
  period: 'daily' | 'weekly' | 'monthly';
  start_date: string | null;
  end_date: string | null;
  points: number;
}

export interface ScoreRow {
  series_id: number;
  target: string;
  studio_id: number;
  scored_for: string;
  score_version: number;
  /** null when the series has not enough history for a heat. */
  heat: number | null;
  verdict: string;
  recent_change: number | null;
  slope_pct: number | null;
  /** The rise the board shows: growth a year when the trend is clear (shared/scoring verdictFigures). */
  rise_per_year: number | null;
  yoy: number | null;
  strength: number | null;
  next_peak: string | null;
  target_from: string | null;
  target_to: string | null;
  score_json: string;
  spark_json: string;
  computed_at?: Date;
}

export type ListedRow = SeriesRow & Partial<Pick<ScoreRow, 'score_json' | 'spark_json' | 'scored_for'>>;

const sortColumns: Record<SeriesSort, string> = {
  heat: 'sc.heat',
  term: 's.term',
  rise: 'sc.rise_per_year',
  yoy: 'sc.yoy',
  strength: 'sc.strength',
  nextPeak: 'sc.next_peak',
};

const seriesColumns = ['s.id', 's.studio_id', 's.kind', 's.term', 's.region', 's.period', 's.start_date', 's.end_date', 's.points'];

function escapeLike(text: string): string {
  return text.replace(/[\\%_]/g, (character) => `\\${character}`);
}

export class SeriesRepository {
  constructor(private readonly db: Knex) {}

  /** Where and when the studio is, with its own occasions and markets (the calendar engine's snapshot). */
  async place(studioId: number): Promise<StudioPlace> {
    const snapshot = await new OccasionRepository(this.db).snapshot(studioId);
    if (!snapshot) throw new Error(`studio ${studioId} vanished while scoring`);
    const { settings } = snapshot;
    return {
      timezone: settings.timezone,
      country: settings.country,
      region: settings.region,
      occasions: { custom: snapshot.custom, sellWindows: snapshot.sellWindows, ...(settings.back_to_school ? { backToSchool: settings.back_to_school } : {}) },
      markets: snapshot.markets,
    };
  }

  async seriesIds(studioId: number): Promise<number[]> {
    return (await this.db('series').where({ studio_id: studioId }).pluck('id')) as number[];
  }

  /** Series of the studio whose score for this target is missing, from another day or way of scoring, or older than the series. */
  async staleIds(studioId: number, target: string, today: string, version: number, onlyIds?: number[]): Promise<number[]> {
    const query = this.db('series as s')
      .leftJoin('series_scores as sc', function join() {
        this.on('sc.series_id', 's.id').andOnVal('sc.target', target);
      })
      .where('s.studio_id', studioId)
      .andWhere((where) => {
        where.whereNull('sc.series_id').orWhereNot('sc.scored_for', today).orWhereNot('sc.score_version', version).orWhereRaw('sc.computed_at < s.updated_at');
      });
    if (onlyIds) query.whereIn('s.id', onlyIds);
    return (await query.pluck('s.id')) as number[];
  }

  async rows(studioId: number, ids: number[]): Promise<SeriesRow[]> {
    if (ids.length === 0) return [];
    return this.db('series as s').where('s.studio_id', studioId).whereIn('s.id', ids).select(seriesColumns);
  }

  /** The sales series of these items (the column's collation matches names without regard to case). */
  async salesSeriesOfItems(studioId: number, items: string[]): Promise<SeriesRow[]> {
    if (items.length === 0) return [];
    return this.db('series as s').where({ 's.studio_id': studioId, 's.kind': 'sales' }).whereIn('s.term', items).orderBy('s.id').select(seriesColumns);
  }

  async pointsOf(studioId: number, ids: number[]): Promise<Map<number, Point[]>> {
    const byId = new Map<number, Point[]>(ids.map((id) => [id, []]));
    if (ids.length === 0) return byId;
    const rows: { series_id: number; date: string; value: number | null }[] = await this.db('series_points')
      .where({ studio_id: studioId })
      .whereIn('series_id', ids)
      .orderBy(['series_id', 'date'])
      .select('series_id', 'date', 'value');
    for (const row of rows) byId.get(row.series_id)?.push({ date: row.date, value: row.value });
    return byId;
  }

  /** Items linked to each series through the themes it belongs to. */
  async linkedItems(studioId: number, ids: number[]): Promise<Map<number, string[]>> {
    const byId = new Map<number, string[]>();
    if (ids.length === 0) return byId;
    const rows: { series_id: number; item: string }[] = await this.db('theme_series as ts')
      .join('theme_items as ti', 'ti.theme_id', 'ts.theme_id')
      .where('ts.studio_id', studioId)
      .whereIn('ts.series_id', ids)
      .distinct('ts.series_id', 'ti.item');
    for (const row of rows) byId.set(row.series_id, [...(byId.get(row.series_id) ?? []), row.item]);
    return byId;
  }

  /**
   * The last day the committed sales files behind each sales series cover: weeks after an item's
   * last sale up to it sold nothing.
   */
  async salesCoveredUntil(studioId: number, ids: number[]): Promise<Map<number, string>> {
    if (ids.length === 0) return new Map();
    const rows: { series_id: number; until: string | null }[] = await this.db('import_series as x')
      .join('imports as i', function join() {
        this.on('i.id', 'x.import_id').andOn('i.studio_id', 'x.studio_id');
      })
      .where({ 'x.studio_id': studioId, 'i.kind': 'sales', 'i.status': 'committed' })
      .whereIn('x.series_id', ids)
      .groupBy('x.series_id')
      .select('x.series_id', this.db.raw('MAX(i.period_end) AS until'));
    return new Map(rows.filter((row) => row.until !== null).map((row) => [row.series_id, String(row.until)]));
  }

  /** Series that draw sales pull from these sales series: members of themes that list their items. */
  async seriesPullingFrom(studioId: number, salesSeriesIds: number[]): Promise<number[]> {
    if (salesSeriesIds.length === 0) return [];
    return (await this.db('series as s')
      .join('theme_items as ti', function join() {
        this.on('ti.studio_id', 's.studio_id').andOn('ti.item', 's.term');
      })
      .join('theme_series as ts', 'ts.theme_id', 'ti.theme_id')
      .where({ 's.studio_id': studioId, 's.kind': 'sales' })
      .whereIn('s.id', salesSeriesIds)
      .distinct()
      .pluck('ts.series_id')) as number[];
  }

  /** Units sold per item (lower-cased, as the column's collation compares) and day, for many items at once. */
  async unitsByItemAndDay(studioId: number, items: string[]): Promise<Map<string, Point[]>> {
    const byItem = new Map<string, Point[]>();
    if (items.length === 0) return byItem;
    const rows: { item: string; date: string; units: number }[] = await this.db('sales')
      .where({ studio_id: studioId })
      .whereIn('item', items)
      .groupBy('item', 'date')
      .orderBy('date')
      .select('item', 'date', this.db.raw('SUM(quantity) AS units'));
    for (const row of rows) {
      const key = row.item.toLowerCase();
      byItem.set(key, [...(byItem.get(key) ?? []), { date: row.date, value: Number(row.units) }]);
    }
    return byItem;
  }

  async unitsByMonth(studioId: number, items: string[]): Promise<{ month: string; units: number }[]> {
    if (items.length === 0) return [];
    const rows: { month: string; units: number }[] = await this.db('sales')
      .where({ studio_id: studioId })
      .whereIn('item', items)
      .groupByRaw("DATE_FORMAT(date, '%Y-%m')")
      .orderBy('month')
      .select(this.db.raw("DATE_FORMAT(date, '%Y-%m') AS month"), this.db.raw('SUM(quantity) AS units'));
    return rows.map((row) => ({ month: row.month, units: Number(row.units) }));
  }

  async saveScores(rows: ScoreRow[]): Promise<void> {
    for (let index = 0; index < rows.length; index += 200) {
      // The database's clock, the same one that stamps series.updated_at, so the staleness test compares like with like.
      const slice = rows.slice(index, index + 200).map((row) => ({ ...row, computed_at: this.db.raw('NOW(3)') }));
      await this.db('series_scores').insert(slice).onConflict(['series_id', 'target']).merge();
    }
  }

  async dropScores(studioId: number, ids: number[]): Promise<void> {
    if (ids.length > 0) await this.db('series_scores').where({ studio_id: studioId }).whereIn('series_id', ids).delete();
  }

  async scoresFor(studioId: number, target: string, ids: number[]): Promise<Map<number, ScoreRow>> {
    if (ids.length === 0) return new Map();
    const rows: ScoreRow[] = await this.db('series_scores').where({ studio_id: studioId, target }).whereIn('series_id', ids);
    return new Map(rows.map((row) => [row.series_id, row]));
  }

  /** One page of the board, filtered, sorted and paged by MariaDB. Nulls sort last either way. */
  async page(studioId: number, target: string, query: Required<Pick<SeriesListQuery, 'sort' | 'order' | 'page' | 'pageSize'>> & SeriesListQuery) {
    const base = this.db('series as s')
      .leftJoin('series_scores as sc', function join() {
        this.on('sc.series_id', 's.id').andOnVal('sc.target', target);
      })
      .where('s.studio_id', studioId);
    if (query.q?.trim()) {
      const like = `%${escapeLike(query.q.trim())}%`;
      base.andWhere((where) => where.whereILike('s.term', like).orWhereILike('s.region', like));
    }
    if (query.verdict) base.andWhere('sc.verdict', query.verdict);
    if (query.kind) base.andWhere('s.kind', query.kind);
    const totalRow = await base.clone().count<{ total: number }[]>({ total: '*' }).first();
    const column = sortColumns[query.sort];
    const direction = query.order === 'asc' ? 'ASC' : 'DESC';
    // Ranked by a figure, series without enough history for one come after every scored series.
    const waitingLast = query.sort === 'term' ? '' : "(sc.verdict <=> 'not-enough-history'), ";
    const rows: ListedRow[] = await base
      .select([...seriesColumns, 'sc.score_json', 'sc.spark_json', 'sc.scored_for'])
      .orderByRaw(`${waitingLast}${column} IS NULL, ${column} ${direction}, s.id ASC`)
      .limit(query.pageSize)
      .offset((query.page - 1) * query.pageSize);
    return { rows, total: Number(totalRow?.total ?? 0) };
  }
}
