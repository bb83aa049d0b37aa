// The series and Trends board API (issues 3 and 4). Dates are ISO YYYY-MM-DD.
//
// GET /api/studios/:studioId/series answers a PAGED OBJECT, not a bare list:
//   {items: SeriesSummary[], total, page, pageSize, target, today}
// Issue 3 sketches a list; the board pages in SQL, so the rows travel inside `items` together with
// the total. Every row carries {id, term, region, kind, period, start, end, points, score}.
// GET .../series/:seriesId answers one SeriesSummary plus `values` and `analysis`.
import './zod';
import * as z from 'zod/mini';
import type { Score, Verdict } from '../scoring/types';

export const seriesSorts = ['heat', 'term', 'rise', 'yoy', 'strength', 'nextPeak'] as const;
export type SeriesSort = (typeof seriesSorts)[number];

export const verdicts = ['rising', 'steady', 'fading', 'seasonal', 'spike', 'not-enough-history'] as const;

/**
 * A target to score heat against, as it travels in `?target=`:
 * 'YYYY-MM' (a month), 'date:YYYY-MM-DD' (a day), 'occasion:<key>' (the next one, from
 * occasionsBetween for the studio's country and own occasions), 'holiday:<key>' (the next public
 * holiday of that key), 'market:<id>' (the studio market's next day; four weeks before it).
 * Empty means each series' own next peak.
 */
export const targetText = z.string().check(
  z.maxLength(80, 'Target is too long'),
  z.regex(
    /^$|^\d{4}-(0[1-9]|1[0-2])$|^date:\d{4}-\d{2}-\d{2}$|^(occasion|holiday):[a-z0-9-]{1,64}$|^market:\d{1,10}$/,
    'Target must be YYYY-MM, date:YYYY-MM-DD, occasion:<key>, holiday:<key> or market:<id>',
  ),
);

const intText = (name: string, min: number, max: number) =>
  z.pipe(
    z.string().check(z.regex(/^\d{1,6}$/, `${name} must be a whole number`)),
    z.transform(Number),
  ).check(z.refine((n) => n >= min && n <= max, `${name} must be between ${min} and ${max}`));

export const seriesListQuery = z.object({
  sort: z.optional(z.enum(seriesSorts, `sort must be one of ${seriesSorts.join(', ')}`)),
  order: z.optional(z.enum(['asc', 'desc'], 'order must be asc or desc')),
  page: z.optional(intText('page', 1, 100000)),
  pageSize: z.optional(intText('pageSize', 1, 200)),
  q: z.optional(z.string().check(z.maxLength(200, 'q is too long (200 characters at most)'))),
  verdict: z.optional(z.enum(verdicts, `verdict must be one of ${verdicts.join(', ')}`)),
  kind: z.optional(z.enum(['interest', 'sales'], 'kind must be interest or sales')),
  target: z.optional(targetText),
});
export type SeriesListQuery = z.infer<typeof seriesListQuery>;

export const seriesDetailQuery = z.object({ target: z.optional(targetText) });

/** The board's sparkline: the last two years, and the same periods one year earlier. */
export interface Sparkline {
  dates: string[];
  recent: (number | null)[];
  yearBefore: (number | null)[];
}

/** A resolved target window. */
export interface TargetWindow {
  key: string;
  label: string;
  from: string;
  to: string;
}

/** The stored score as the API shows it: the Score of shared/scoring (issue 4's field names). */
export type SeriesScore = Score;

export interface SeriesSummary {
  id: number;
  term: string;
  region: string;
  kind: 'interest' | 'sales';
  period: 'daily' | 'weekly' | 'monthly';
  start: string | null;
  end: string | null;
  points: number;
  score: SeriesScore | null;
  spark: Sparkline | null;
  /** The studio day the score was computed for. */
  scoredFor: string | null;
}

export interface SeriesPage {
  items: SeriesSummary[];
  total: number;
  page: number;
  pageSize: number;
  /** The target the heat was scored against; null for each series' next peak. */
  target: TargetWindow | null;
  today: string;
}

/** The series page's decomposition, on the regular (weekly or monthly) grid. */
export interface SeriesAnalysis {
  period: 'weekly' | 'monthly';
  dates: string[];
  values: (number | null)[];
  trend: (number | null)[];
  seasonal: (number | null)[];
  residual: (number | null)[];
  /** Seasonally adjusted values (the series the rise is measured on). */
  adjusted: (number | null)[];
  model: 'multiplicative' | 'additive' | null;
}

export interface SeriesDetail extends SeriesSummary {
  values: { date: string; value: number | null }[];
  analysis: SeriesAnalysis;
  target: TargetWindow | null;
  today: string;
}

/** Targets the board offers: the next months, occasions and public holidays of the studio's country. */
export interface TargetChoices {
  today: string;
  months: TargetWindow[];
  occasions: TargetWindow[];
  holidays: TargetWindow[];
  markets: TargetWindow[];
}

export type { Verdict };
