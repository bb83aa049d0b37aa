// Shapes shared by the scoring functions and, through the API, by the server and the client.
// The Score fields follow issue 4 exactly, because outside checks read them by name.

export type Period = 'daily' | 'weekly' | 'monthly';

/** One observation; `date` is YYYY-MM-DD, `value` null when the source had no figure. */
export interface Point {
  date: string;
  value: number | null;
}

/** A closed window of calendar days, both ends YYYY-MM-DD. */
export interface DateWindow {
  from: string;
  to: string;
}

/** A run of missing periods too long to interpolate (more than two periods). */
export interface Gap {
  from: string;
  to: string;
  periods: number;
}

export type SeasonalModel = 'multiplicative' | 'additive';

export type Verdict = 'rising' | 'steady' | 'fading' | 'seasonal' | 'spike' | 'not-enough-history';

export interface MannKendall {
  S: number;
  varS: number;
  z: number;
  p: number;
  tau: number;
}

export interface Rise {
  /** mean(last k) / mean(k before) − 1, as a fraction. */
  recentChange: number | null;
  /** OLS slope over the last m periods, in % of their mean per period. */
  slopePct: number | null;
  /** slopePct × m / 100: the growth a year that the verdict and the rise part read. */
  growthPerYear: number | null;
  mannKendall: MannKendall | null;
  /** Median pairwise slope over the Mann–Kendall window, in series units per period. */
  senSlope: number | null;
}

export interface Seasonal {
  model: SeasonalModel;
  period: number;
  /** indices[i] belongs to the periods t with t mod m = i, t = 0 at the first point. */
  indices: number[];
  strength: number;
  peakPosition: number;
  nextPeak: string;
}

export interface HeatParts {
  rise: number;
  seasonLift: number;
  leadRoom: number;
  salesPull: number;
}

export interface Score {
  /** null when the verdict is "not-enough-history": too little to rank it against scored series. */
  heat: number | null;
  parts: HeatParts;
  /** weight × part for each part; they add up to heat. */
  contributions: HeatParts;
  verdict: Verdict;
  yoy: number | null;
  rise: Rise;
  seasonal: Seasonal | null;
  explanation: ScoreExplanation;
}

export interface ScoreExplanation {
  /** One plain sentence, e.g. "seasonal (peaks in November): ...". */
  reason: string;
  /** The figures the verdict rule looked at, by name. */
  figures: Record<string, number | string | null>;
  /** Things the user should know: missing history, gaps, dropped partial weeks. */
  notes: string[];
  gaps: Gap[];
  /** Periods of history used for the score after regularising. */
  periodsUsed: number;
  /** Sales: periods on the grid with nothing sold (stored as 0 or absent); null for interest. */
  periodsWithoutSales: number | null;
  /** Periods still needed before seasonality can be estimated; 0 when it could be. */
  seasonalPeriodsNeeded: number;
  /** The window the season lift and lead room were judged against. */
  target: DateWindow | null;
  /** The season lift as a fraction above an average period, before it became a 0–100 part. */
  seasonLiftFraction: number | null;
}

export type SeriesKind = 'interest' | 'sales';

export interface ScoreOptions {
  period: Period;
  /** Sales count what sold, so a period without a figure is 0 sold; interest leaves it missing. */
  kind?: SeriesKind;
  /** Sales only: the last day the sales files cover; periods after the last sale sold 0. */
  coveredUntil?: string;
  /** Today as YYYY-MM-DD; passed in so that scoring never reads the clock. */
  today: string;
  /** The window to sell into; defaults to the next peak period when the series is seasonal. */
  target?: DateWindow;
  /** Days the runway needs before the target; defaults to DEFAULT_RUNWAY_DAYS. */
  runwayDays?: number;
  /** The studio's own sales of items linked to the series, as units per day, week or month. */
  salesPull?: Point[];
}
