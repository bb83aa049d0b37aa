// scoreTheme: a theme's score from its members' scores.
//
// The rule (also in docs/decisions/0002-heat-weights.md):
// 1. Members with the verdict "not-enough-history" do not count: they have no heat, and their
//    mostly neutral parts would only pull the theme towards the middle. When no member counts, the
//    theme has no heat either, and says so.
// 2. Each heat part is the weighted mean of the counted members' parts (weight 1 each unless given,
//    e.g. the studio's sales share of each item); heat is recomputed from those parts with
//    HEAT_WEIGHTS, so the theme's contributions add up the same way a series' do.
// 3. The verdict is the one held by the most member weight; a tie goes to the verdict of the
//    hottest member among the tied, since that member is why the theme is on the board.

import { combineHeat } from './heat';
import type { HeatParts, Score, Verdict } from './types';

export interface ThemeScore {
  /** null when no member has enough history to count. */
  heat: number | null;
  parts: HeatParts | null;
  contributions: HeatParts | null;
  verdict: Verdict;
  /** Plain words: the verdict, and how many of the members the heat is made of. */
  reason: string;
  /** Members whose scores went into the parts and the verdict. */
  membersUsed: number;
  /** Every member scored, counted or not. */
  membersTotal: number;
  /** Total member weight behind each verdict. */
  verdictWeights: Partial<Record<Verdict, number>>;
}

const PART_NAMES: (keyof HeatParts)[] = ['rise', 'seasonLift', 'leadRoom', 'salesPull'];

/** The verdict as words in a sentence (the keys are for code, not for people). */
export const VERDICT_WORDS: Readonly<Record<Verdict, string>> = {
  rising: 'rising',
  steady: 'steady',
  fading: 'fading',
  seasonal: 'seasonal',
  spike: 'a spike',
  'not-enough-history': 'not enough history',
};

const seriesCount = (count: number): string => `${count} series`;

export function scoreTheme(memberScores: Score[], weights?: number[]): ThemeScore | null {
  const members = memberScores
    .map((score, index) => ({ score, weight: weights?.[index] ?? 1 }))
    .filter((member) => member.weight > 0);
  if (members.length === 0) return null;
  const used = members.filter((member) => member.score.verdict !== 'not-enough-history');
  const waiting = members.length - used.length;
  const [has, does] = waiting === 1 ? ['has', 'does'] : ['have', 'do'];
  const waitingNote =
    waiting === 0 ? '' : `; ${waiting} ${has} not enough history yet and ${does} not count`;
  if (used.length === 0) {
    return {
      heat: null,
      parts: null,
      contributions: null,
      verdict: 'not-enough-history',
      reason: `not enough history: none of its ${seriesCount(members.length)} has enough history for a heat yet`,
      membersUsed: 0,
      membersTotal: members.length,
      verdictWeights: {
        'not-enough-history': members.reduce((sum, member) => sum + member.weight, 0),
      },
    };
  }

  const totalWeight = used.reduce((sum, member) => sum + member.weight, 0);
  const parts = {} as HeatParts;
  for (const name of PART_NAMES) {
    parts[name] =
      used.reduce((sum, member) => sum + member.weight * member.score.parts[name], 0) / totalWeight;
  }
  const { heat, contributions } = combineHeat(parts);

  const verdictWeights: Partial<Record<Verdict, number>> = {};
  for (const member of used) {
    verdictWeights[member.score.verdict] =
      (verdictWeights[member.score.verdict] ?? 0) + member.weight;
  }
  const topWeight = Math.max(...Object.values(verdictWeights));
  const tied = new Set(
    (Object.keys(verdictWeights) as Verdict[]).filter(
      (verdict) => verdictWeights[verdict] === topWeight,
    ),
  );
  const heatOf = (member: (typeof used)[number]): number => member.score.heat ?? -Infinity;
  const hottestTied = used
    .filter((member) => tied.has(member.score.verdict))
    .reduce((best, member) => (heatOf(member) > heatOf(best) ? member : best));
  const verdict = hottestTied.score.verdict;
  const share = Math.round((topWeight / totalWeight) * 100);
  return {
    heat,
    parts,
    contributions,
    verdict,
    reason: `${VERDICT_WORDS[verdict]}: the verdict of ${share} % of the ${seriesCount(used.length)} that count; heat from ${used.length} of ${seriesCount(members.length)}${waitingNote}`,
    membersUsed: used.length,
    membersTotal: members.length,
    verdictWeights,
  };
}
