// Series and sales written straight into the database, so the Trends and themes tests have data
// without going through an import (the imports feature has its own tests).
import type { Knex } from 'knex';
import type { Point } from '@shared/scoring/types';
import { fixedClock, useClock } from '../../server/clock/clock';
import { makeTestApp, type TestApp } from '../helpers/test-app';
import { lcg } from '../../shared/seeded-random';

export interface SeriesShape {
  term: string;
  region?: string;
  kind?: 'interest' | 'sales';
  period?: 'weekly' | 'monthly';
  /** First period's date (a Monday for weekly series). */
  start?: string;
  periods?: number;
  level?: number;
  /** Growth per period as a fraction. */
  growth?: number;
  /** Yearly wave amplitude as a fraction of the level. */
  amplitude?: number;
  /** Week or month of the wave's crest, counted from the start. */
  crest?: number;
  seed?: number;
}

const DAY_MS = 86_400_000;

function dateOf(start: string, period: 'weekly' | 'monthly', t: number): string {
  const base = new Date(`${start}T00:00:00Z`);
  if (period === 'weekly') return new Date(base.getTime() + 7 * t * DAY_MS).toISOString().slice(0, 10);
  return new Date(Date.UTC(base.getUTCFullYear(), base.getUTCMonth() + t, 1)).toISOString().slice(0, 10);
}

/** Trend × yearly wave × seeded noise (a linear congruential generator, Numerical Recipes constants). */
export function makePoints(shape: SeriesShape): Point[] {
  const period = shape.period ?? 'weekly';
  const m = period === 'weekly' ? 52 : 12;
  const random = lcg(shape.seed ?? 7);
  const level = shape.level ?? 40;
  return Array.from({ length: shape.periods ?? 156 }, (_, t) => ({
    date: dateOf(shape.start ?? '2023-01-02', period, t),
    value:
      Math.round(
        Math.max(
          1,
          level * (1 + (shape.growth ?? 0)) ** t * (1 + (shape.amplitude ?? 0.4) * Math.cos((2 * Math.PI * (t - (shape.crest ?? 45))) / m)) +
            (random() - 0.5) * level * 0.1,
        ) * 10,
      ) / 10,
  }));
}

export async function insertSeries(db: Knex, studioId: number, shape: SeriesShape, points = makePoints(shape)): Promise<{ id: number; points: Point[] }> {
  const [id] = await db('series').insert({
    studio_id: studioId,
    kind: shape.kind ?? 'interest',
    term: shape.term,
    region: shape.region ?? '',
    period: shape.period ?? 'weekly',
    start_date: points[0]?.date ?? null,
    end_date: points.at(-1)?.date ?? null,
    points: points.length,
  });
  for (let index = 0; index < points.length; index += 500) {
    await db('series_points').insert(points.slice(index, index + 500).map((point) => ({ series_id: id, studio_id: studioId, date: point.date, value: point.value })));
  }
  return { id, points };
}

/** Sales rows need an import to belong to; one committed sales import per call. */
export async function insertSales(db: Knex, studioId: number, sales: { date: string; item: string; quantity: number }[]): Promise<void> {
  const [importId] = await db('imports').insert({
    studio_id: studioId,
    file_name: 'sales-test.csv',
    kind: 'sales',
    layout: 'sales',
    status: 'committed',
    sha256: 'a'.repeat(64),
  });
  await db('sales').insert(
    sales.map((sale) => ({ studio_id: studioId, import_id: importId, date: sale.date, item: sale.item, quantity: sale.quantity, revenue_cents: sale.quantity * 1500, channel: 'market' })),
  );
}

// 15:00 UTC is 10:00 in New York (the test studios' zone), so the studio's today is 2026-03-10.
export const fixedNow = new Date('2026-03-10T15:00:00Z');
export const fixedToday = '2026-03-10';

/** A score as it comes back through JSON (undefined fields dropped). */
export const viaJson = <T>(value: T): T => JSON.parse(JSON.stringify(value));

/** One test app per file with the clock held at fixedNow; returns a getter for it. */
export function useTrendsTestApp(): () => TestApp {
  let app: TestApp;
  beforeAll(() => {
    // Many sign-ins from one address in one file; the limiter has its own tests.
    app = makeTestApp({ signInLimits: { perAccount: 10, perAddress: 100_000, windowMs: 60_000 } });
  });
  let restoreClock = () => {};
  beforeEach(() => {
    restoreClock = useClock(fixedClock(fixedNow));
  });
  afterEach(() => {
    restoreClock();
    jest.restoreAllMocks();
  });
  afterAll(() => app.close());
  return () => app;
}
