// Keeps series_scores current: after an import (afterSeriesChanged), when a day has passed, and on
// demand for a new target. Scoring itself is shared/scoring's scoreSeries; this only feeds it.
import type { Knex } from 'knex';
import type { Sparkline, TargetWindow } from '@shared/contracts/series';
import { regularise } from '@shared/scoring/regularise';
import { scoreSeries } from '@shared/scoring/score-series';
import type { Point, Score, ScoreOptions } from '@shared/scoring/types';
import { verdictFigures } from '@shared/scoring/verdict-figures';
import { appClock, type Clock } from '../clock/clock';
import { SeriesRepository, type ScoreRow, type SeriesRow } from './series-repository';
import { resolveTarget, type StudioPlace } from './targets';

// A value near Number.MAX_VALUE overflows to Infinity once scaled, which the DOUBLE column refuses.
const roundTo = (value: number | null, places = 3): number | null => {
  if (value === null || !Number.isFinite(value)) return null;
  const rounded = Math.round(value * 10 ** places) / 10 ** places;
  return Number.isFinite(rounded) ? rounded : null;
};

/**
 * How stored scores were computed. Raise it whenever scoring changes (shared/scoring or what this
 * service feeds it), so every studio's stored scores go stale and are scored afresh on next read.
 * 2: sales without a sale count as 0 sold, no heat without a verdict, the board's rise column.
 */
export const SCORE_VERSION = 2;

/** How a series' points read: a sales week without a figure sold nothing; interest stays missing. */
export interface SeriesReading {
  kind: SeriesRow['kind'];
  /** Sales only: the last day its sales files cover. */
  coveredUntil?: string;
}

/** The last two years on the regular grid, and the same periods one year earlier. */
export function sparklineOf(points: Point[], period: SeriesRow['period'], reading?: SeriesReading): Sparkline | null {
  if (points.length === 0) return null;
  const regular = regularise(points, period, { isMissingZero: reading?.kind === 'sales', coveredUntil: reading?.coveredUntil });
  const { m } = regular;
  const length = Math.min(2 * m, regular.values.length);
  const start = regular.values.length - length;
  const recent = regular.values.slice(start).map((value) => roundTo(value, 2));
  const yearBefore = recent.map((_, index) => {
    const earlier = start + index - m;
    return earlier >= 0 ? roundTo(regular.values[earlier], 2) : null;
  });
  return { dates: regular.dates.slice(start), recent, yearBefore };
}

export interface ScoringContext {
  place: StudioPlace;
  today: string;
}

export class ScoringService {
  private readonly series: SeriesRepository;

  constructor(
    db: Knex,
    private readonly clock: Clock = appClock,
  ) {
    this.series = new SeriesRepository(db);
  }

  async context(studioId: number): Promise<ScoringContext> {
    const place = await this.series.place(studioId);
    return { place, today: this.clock.today(place.timezone) };
  }

  /**
   * The hook the imports service calls after a commit or deletion: drops every stored score of
   * those series and scores them afresh, together with the series whose themes list the items of
   * changed sales series (their sales pull moved too).
   */
  readonly afterSeriesChanged = async (studioId: number, seriesIds: number[]): Promise<void> => {
    const pulling = await this.series.seriesPullingFrom(studioId, seriesIds);
    await this.rescoreSeries(studioId, [...new Set([...seriesIds, ...pulling])]);
  };

  async rescoreSeries(studioId: number, seriesIds: number[]): Promise<void> {
    await this.series.dropScores(studioId, seriesIds);
    const context = await this.context(studioId);
    await this.scoreAndStore(studioId, seriesIds, '', null, context);
  }

  async rescoreStudio(studioId: number): Promise<void> {
    await this.rescoreSeries(studioId, await this.series.seriesIds(studioId));
  }

  /** Scores whatever is stale for this target (all the studio's series, or only some) and returns the window. */
  async ensureFresh(studioId: number, targetKey: string, context: ScoringContext, onlyIds?: number[]): Promise<TargetWindow | null> {
    const window = resolveTarget(targetKey, context.place, context.today);
    const stale = await this.series.staleIds(studioId, targetKey, context.today, SCORE_VERSION, onlyIds);
    if (stale.length > 0) await this.scoreAndStore(studioId, stale, targetKey, window, context);
    return window;
  }

  /** The score of one series for a target window, computed the way the stored ones are. */
  async scoreOf(studioId: number, row: SeriesRow, points: Point[], window: TargetWindow | null, today: string): Promise<Score> {
    const sales = await this.salesFor(studioId, [row], new Map([[row.id, points]]));
    const reading = (await this.readings(studioId, [row])).get(row.id);
    return scoreSeries(points, this.options(row, window, today, sales.get(row.id), reading));
  }

  /** How each series' points are read for scoring, the sparkline and the series page. */
  async readings(studioId: number, rows: SeriesRow[]): Promise<Map<number, SeriesReading>> {
    const salesIds = rows.filter((row) => row.kind === 'sales').map((row) => row.id);
    const covered = await this.series.salesCoveredUntil(studioId, salesIds);
    return new Map(rows.map((row) => [row.id, { kind: row.kind, ...(covered.has(row.id) ? { coveredUntil: covered.get(row.id) } : {}) }]));
  }

  private options(row: SeriesRow, window: TargetWindow | null, today: string, salesPull: Point[] | undefined, reading: SeriesReading | undefined): ScoreOptions {
    return {
      period: row.period,
      today,
      kind: row.kind,
      ...(reading?.coveredUntil ? { coveredUntil: reading.coveredUntil } : {}),
      ...(window ? { target: { from: window.from, to: window.to } } : {}),
      ...(salesPull && salesPull.length > 0 ? { salesPull } : {}),
    };
  }

  /**
   * Sales pull evidence per series: for a sales series its own item's sales (or, without sale rows,
   * its own points); for an interest series the sales of the items linked to it through themes.
   */
  private async salesFor(studioId: number, rows: SeriesRow[], points: Map<number, Point[]>): Promise<Map<number, Point[]>> {
    const linked = await this.series.linkedItems(studioId, rows.map((row) => row.id));
    const itemsOf = new Map(
      rows.map((row) => [row.id, [...new Set((row.kind === 'sales' ? [row.term, ...(linked.get(row.id) ?? [])] : (linked.get(row.id) ?? [])).map((item) => item.toLowerCase()))]]),
    );
    const unitsByItem = await this.series.unitsByItemAndDay(studioId, [...new Set([...itemsOf.values()].flat())]);
    const sales = new Map<number, Point[]>();
    for (const row of rows) {
      const items = itemsOf.get(row.id) ?? [];
      if (items.length === 0) continue;
      // Several items sold on one day add up; scoring sums them by month anyway.
      const units = items.flatMap((item) => unitsByItem.get(item) ?? []);
      sales.set(row.id, units.length === 0 && row.kind === 'sales' ? (points.get(row.id) ?? []) : units);
    }
    return sales;
  }

  private async scoreAndStore(studioId: number, ids: number[], targetKey: string, window: TargetWindow | null, context: ScoringContext): Promise<void> {
    // In slices, so a studio with thousands of series never holds all their points at once.
    for (let index = 0; index < ids.length; index += 100) {
      const slice = ids.slice(index, index + 100);
      const rows = await this.series.rows(studioId, slice);
      const points = await this.series.pointsOf(studioId, slice);
      const sales = await this.salesFor(studioId, rows, points);
      const readings = await this.readings(studioId, rows);
      const stored: ScoreRow[] = rows.map((row) => {
        const seriesPoints = points.get(row.id) ?? [];
        const reading = readings.get(row.id);
        const score = scoreSeries(seriesPoints, this.options(row, window, context.today, sales.get(row.id), reading));
        return {
          series_id: row.id,
          target: targetKey,
          studio_id: studioId,
          scored_for: context.today,
          score_version: SCORE_VERSION,
          heat: score.heat,
          verdict: score.verdict,
          recent_change: roundTo(score.rise.recentChange, 12),
          slope_pct: roundTo(score.rise.slopePct, 12),
          rise_per_year: roundTo(verdictFigures(score).risePerYear, 12),
          yoy: roundTo(score.yoy, 12),
          strength: score.seasonal?.strength ?? null,
          next_peak: score.seasonal?.nextPeak ?? null,
          target_from: score.explanation.target?.from ?? null,
          target_to: score.explanation.target?.to ?? null,
          score_json: JSON.stringify(score),
          spark_json: JSON.stringify(sparklineOf(seriesPoints, row.period, reading)),
        };
      });
      await this.series.saveScores(stored);
    }
  }
}
