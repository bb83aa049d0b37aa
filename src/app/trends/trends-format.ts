// Number formats and the one-sentence explanations of every score figure, in a maker's words.
// Plain words first; the test statistics behind them come apart, for those who want them.
import { MONTH_NAMES } from '@shared/scoring/calendar-days';
import type { Score } from '@shared/scoring/types';
import { verdictFigures } from '@shared/scoring/verdict-figures';

export const percent = (fraction: number | null | undefined, digits = 0): string =>
  fraction === null || fraction === undefined || !Number.isFinite(fraction) ? '–' : `${fraction >= 0 ? '+' : ''}${(fraction * 100).toFixed(digits)} %`;

export const fixed = (value: number | null | undefined, digits = 0): string =>
  value === null || value === undefined || !Number.isFinite(value) ? '–' : value.toFixed(digits);

export function monthName(date: string | null | undefined): string {
  return date ? MONTH_NAMES[Number(date.slice(5, 7)) - 1] : '–';
}

/** "8 Dec 2026", or "8 Dec" without the year. */
export function dayMonth(date: string, withYear = true): string {
  const day = `${Number(date.slice(8, 10))} ${MONTH_NAMES[Number(date.slice(5, 7)) - 1].slice(0, 3)}`;
  return withYear ? `${day} ${date.slice(0, 4)}` : day;
}

type Period = 'daily' | 'weekly' | 'monthly';
const unitOf = (period: Period) => (period === 'monthly' ? 'month' : 'week');

export const verdictLabels: Record<Score['verdict'], string> = {
  rising: 'Rising',
  steady: 'Steady',
  fading: 'Fading',
  seasonal: 'Seasonal',
  spike: 'Spike',
  'not-enough-history': 'Not enough history',
};

export const partLabels = { rise: 'Rise', seasonLift: 'Season lift', leadRoom: 'Lead room', salesPull: 'Sales pull' } as const;
export type PartName = keyof typeof partLabels;
export const partNames = Object.keys(partLabels) as PartName[];

/** The board's rise: the very figure the verdict was decided on (verdictFigures), never another. */
export function riseText(score: Score | null): string {
  if (!score) return '–';
  const shown = verdictFigures(score);
  if (shown.risePerYear !== null) return `${percent(shown.risePerYear)} a year`;
  return shown.isRiseUnclear ? 'no clear trend' : '–';
}

/** What is still needed before a series has a heat, e.g. "5 more weeks". */
export function neededText(score: Score, period: Period): string {
  const needed = verdictFigures(score).periodsNeeded;
  return `${needed} more ${unitOf(period)}${needed === 1 ? '' : 's'}`;
}

/** The peak by its calendar name: "peaks in December", or for weeks "peaks in the week of 8 Dec". */
export function peakText(score: Score | null, period: Period): string {
  const seasonal = score?.seasonal;
  if (!seasonal) return '–';
  return period === 'monthly' ? `peaks in ${monthName(seasonal.nextPeak)}` : `peaks in the week of ${dayMonth(seasonal.nextPeak, false)}`;
}

export interface ExplainedFigure {
  label: string;
  value: string;
  sentence: string;
}

export interface ExplainedScore {
  /** What a maker needs, in plain words. */
  plain: ExplainedFigure[];
  /** The test statistics behind the verdict. */
  statistics: ExplainedFigure[];
}

/** Every figure of a score with one plain sentence each. */
export function explainScore(score: Score, period: Period): ExplainedScore {
  const unit = unitOf(period);
  const k = period === 'monthly' ? 3 : 4;
  const m = period === 'monthly' ? 12 : 52;
  const { seasonal, explanation } = score;
  const target = explanation.target ? `${dayMonth(explanation.target.from)} to ${dayMonth(explanation.target.to)}` : 'its next peak';
  const plain: ExplainedFigure[] = [
    score.heat === null
      ? { label: 'Heat', value: 'none yet', sentence: `Too few ${unit}s of figures to rank it against the others: ${neededText(score, period)} are needed.` }
      : { label: 'Heat', value: fixed(score.heat), sentence: `Out of 100, how good a bet this is to build for ${target}, made of the four parts below.` },
    ...partNames.map((name) => ({
      label: partLabels[name],
      value: `${fixed(score.parts[name])} → ${fixed(score.contributions[name], 1)}`,
      sentence: partSentence(name, score),
    })),
    { label: 'Verdict', value: verdictLabels[score.verdict], sentence: explanation.reason },
    {
      label: 'Rise a year',
      value: riseText(score),
      sentence: 'How much it grows or shrinks in a year once the usual season is taken out; shown only when the trend is clear rather than chance. The verdict is decided on this figure.',
    },
    {
      label: 'Year over year',
      value: percent(score.yoy, 1),
      sentence: `The last ${k} ${unit}s against the same ${unit}s a year ago: is this season bigger than the last one?`,
    },
  ];
  if (explanation.periodsWithoutSales !== null) {
    plain.push({
      label: `${unit[0].toUpperCase()}${unit.slice(1)}s without a sale`,
      value: `${explanation.periodsWithoutSales} of ${explanation.periodsUsed}`,
      sentence: `Each ${unit} from the first sale on that sold nothing counts as 0 sold, not as a ${unit} without figures.`,
    });
  }
  if (seasonal) {
    plain.push(
      {
        label: 'Seasonal strength',
        value: fixed(seasonal.strength, 2),
        sentence: 'From 0 to 1, how much of the ups and downs follow the same yearly pattern rather than chance; 0.6 or more is a strong season.',
      },
      {
        label: 'Peak',
        value: `${peakText(score, period)}, next ${dayMonth(seasonal.nextPeak)}`,
        sentence: `The ${unit} of the year that is usually busiest, and when it comes round next: plan to be selling before then.`,
      },
    );
  } else {
    plain.push({ label: 'Season', value: 'not enough history', sentence: `A season needs two full years; ${explanation.seasonalPeriodsNeeded} more ${unit}s of figures are needed.` });
  }
  for (const note of explanation.notes) plain.push({ label: 'Note', value: '', sentence: note });
  return { plain, statistics: statisticsOf(score, unit, m, k) };
}

function statisticsOf(score: Score, unit: string, m: number, k: number): ExplainedFigure[] {
  const { rise, seasonal } = score;
  const statistics: ExplainedFigure[] = [
    {
      label: 'Mann–Kendall',
      value: rise.mannKendall ? `S ${rise.mannKendall.S}, z ${fixed(rise.mannKendall.z, 2)}, p ${fixed(rise.mannKendall.p, 3)}, τ ${fixed(rise.mannKendall.tau, 2)}` : '–',
      sentence: 'Counts how often later values beat earlier ones over two years, season taken out; p below 0.05 means the climb or fall is unlikely to be chance.',
    },
    {
      label: "Sen's slope",
      value: rise.senSlope === null ? '–' : `${fixed(rise.senSlope, 3)} per ${unit}`,
      sentence: 'The middle of all the pairwise slopes over the same two years: a rate of change that one odd week cannot tip.',
    },
    {
      label: 'Least-squares slope',
      value: rise.slopePct === null ? '–' : `${fixed(rise.slopePct, 2)} % per ${unit}`,
      sentence: `The straight line through the last ${m} ${unit}s (season taken out), as a share of their average; × ${m} it is the rise a year.`,
    },
    {
      label: 'Recent change',
      value: percent(rise.recentChange, 1),
      sentence: `The last ${k} ${unit}s against the ${k} before, season taken out: a short look that one busy ${unit} can swing, so the verdict does not rest on it.`,
    },
  ];
  if (seasonal) {
    statistics.push({
      label: 'Model',
      value: seasonal.model,
      sentence:
        seasonal.model === 'multiplicative'
          ? 'The season is a percentage on top of the level (every value is above zero), so it grows as the term grows.'
          : 'The season adds or takes a fixed amount from the level, because some values are zero.',
    });
  }
  return statistics;
}

function partSentence(name: PartName, score: Score): string {
  const { explanation } = score;
  switch (name) {
    case 'rise':
      return 'Growth with the season taken out, scaled so +100 % a year is 100 and flat is 50; halved towards 50 when the trend could be chance.';
    case 'seasonLift':
      return explanation.seasonLiftFraction === null
        ? 'No season to judge the target by, so it sits at the neutral 50.'
        : `The target window sits ${percent(explanation.seasonLiftFraction)} against an average ${score.seasonal?.period === 12 ? 'month' : 'week'}; 50 % above scores 100.`;
    case 'leadRoom':
      return `Days until the target against a ${explanation.figures['runwayDays'] ?? 42}-day runway: 100 when there is just enough time to design, cut, finish and list, less when it is too close or far off.`;
    case 'salesPull':
      return explanation.figures['salesRatio'] === null || explanation.figures['salesRatio'] === undefined
        ? 'No sales of linked items yet, so your own sales neither push nor pull (50).'
        : `Your own linked items sell ${fixed(Number(explanation.figures['salesRatio']), 2)} × an average month in the target's months; twice as well scores 100.`;
  }
}
