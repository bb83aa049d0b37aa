// Number formats and the one-sentence explanations of every score figure, in a maker's words.
import type { Score } from '@shared/scoring/types';

export const percent = (fraction: number | null | undefined, digits = 0): string =>
  fraction === null || fraction === undefined || !Number.isFinite(fraction) ? '–' : `${fraction >= 0 ? '+' : ''}${(fraction * 100).toFixed(digits)} %`;

export const fixed = (value: number | null | undefined, digits = 0): string =>
  value === null || value === undefined || !Number.isFinite(value) ? '–' : value.toFixed(digits);

const MONTHS = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];

export function monthName(date: string | null | undefined): string {
  return date ? MONTHS[Number(date.slice(5, 7)) - 1] : '–';
}

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

export interface ExplainedFigure {
  label: string;
  value: string;
  sentence: string;
}

/** Every figure of a score with one plain sentence each. */
export function explainScore(score: Score, period: 'daily' | 'weekly' | 'monthly'): ExplainedFigure[] {
  const unit = period === 'monthly' ? 'month' : 'week';
  const k = period === 'monthly' ? 3 : 4;
  const m = period === 'monthly' ? 12 : 52;
  const { rise, seasonal, explanation } = score;
  const figures: ExplainedFigure[] = [
    {
      label: 'Heat',
      value: fixed(score.heat),
      sentence: `Out of 100, how good a bet this is to build for ${explanation.target ? `${explanation.target.from} to ${explanation.target.to}` : 'its next peak'}, made of the four parts below.`,
    },
    ...partNames.map((name) => ({
      label: partLabels[name],
      value: `${fixed(score.parts[name])} → ${fixed(score.contributions[name], 1)}`,
      sentence: partSentence(name, score),
    })),
    { label: 'Verdict', value: verdictLabels[score.verdict], sentence: explanation.reason },
    {
      label: 'Recent change',
      value: percent(rise.recentChange, 1),
      sentence: `The last ${k} ${unit}s against the ${k} before, with the usual season taken out: above zero means more people are looking now.`,
    },
    {
      label: 'Slope',
      value: rise.slopePct === null ? '–' : `${fixed(rise.slopePct, 2)} % per ${unit}`,
      sentence: `The straight line through the last ${m} ${unit}s (season taken out), as a share of their average: how fast interest grows each ${unit}.`,
    },
    {
      label: 'Mann–Kendall',
      value: rise.mannKendall ? `S ${rise.mannKendall.S}, z ${fixed(rise.mannKendall.z, 2)}, p ${fixed(rise.mannKendall.p, 3)}, τ ${fixed(rise.mannKendall.tau, 2)}` : '–',
      sentence: 'Counts how often later values beat earlier ones over two years; p below 0.05 means the climb or fall is unlikely to be chance.',
    },
    {
      label: "Sen's slope",
      value: rise.senSlope === null ? '–' : `${fixed(rise.senSlope, 3)} per ${unit}`,
      sentence: 'The middle of all the pairwise slopes: a steady rate of change that one odd week cannot tip.',
    },
    {
      label: 'Year over year',
      value: percent(score.yoy, 1),
      sentence: `The last ${k} ${unit}s against the same ${unit}s a year ago: is this season bigger than the last one?`,
    },
  ];
  if (seasonal) {
    figures.push(
      {
        label: 'Seasonal strength',
        value: fixed(seasonal.strength, 2),
        sentence: 'From 0 to 1, how much of the wiggle is the yearly pattern rather than noise; 0.6 or more is a strong season.',
      },
      {
        label: 'Model',
        value: seasonal.model,
        sentence:
          seasonal.model === 'multiplicative'
            ? 'The season is a percentage on top of the level (every value is above zero), so it grows as the term grows.'
            : 'The season adds or takes a fixed amount from the level, because some values are zero or below.',
      },
      {
        label: 'Peak',
        value: `${unit} ${seasonal.peakPosition + 1} of the cycle, next ${seasonal.nextPeak}`,
        sentence: `The ${unit} of the year that is usually busiest, and when it comes round next: plan to be selling before then.`,
      },
    );
  } else {
    figures.push({
      label: 'Season',
      value: 'not enough history',
      sentence: `A season needs two full years; ${explanation.seasonalPeriodsNeeded} more ${unit}s of figures are needed.`,
    });
  }
  for (const note of explanation.notes) figures.push({ label: 'Note', value: '', sentence: note });
  return figures;
}

function partSentence(name: PartName, score: Score): string {
  const { explanation } = score;
  switch (name) {
    case 'rise':
      return 'Growth with the season taken out, scaled so +100 % a year is 100 and flat is 50; halved towards 50 when the trend test is unsure.';
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
