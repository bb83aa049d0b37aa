// scoreTheme: a theme's score from its members' scores.
//
// The rule (also in docs/decisions/0002-heat-weights.md):
// 1. Members with the verdict "not-enough-history" are left out, unless every member has it; their
//    parts are mostly neutral 50s and would only pull the theme towards the middle.
// 2. Each heat part is the weighted mean of the members' parts (weight 1 each unless given, e.g.
//    the studio's sales share of each item); heat is recomputed from those parts with HEAT_WEIGHTS,
//    so the theme's contributions add up the same way a series' do.
// 3. The verdict is the one held by the most member weight; a tie goes to the verdict of the
//    hottest member among the tied, since that member is why the theme is on the board.

import { combineHeat } from './heat';
import type { HeatParts, Score, Verdict } from './types';

export interface ThemeScore {
  heat: number;
  parts: HeatParts;
  contributions: HeatParts;
  verdict: Verdict;
  reason: string;
  /** Members whose scores went into the parts and the verdict. */
  membersUsed: number;
  /** Total member weight behind each verdict. */
  verdictWeights: Partial<Record<Verdict, number>>;
}

const PART_NAMES: (keyof HeatParts)[] = ['rise', 'seasonLift', 'leadRoom', 'salesPull'];

export function scoreTheme(memberScores: Score[], weights?: number[]): ThemeScore | null {
  const members = memberScores.map((score, index) => ({ score, weight: weights?.[index] ?? 1 }));
  const withHistory = members.filter(
    (member) => member.score.verdict !== 'not-enough-history' && member.weight > 0,
  );
  const used = withHistory.length > 0 ? withHistory : members.filter((member) => member.weight > 0);
  if (used.length === 0) return null;

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
  const hottestTied = used
    .filter((member) => tied.has(member.score.verdict))
    .reduce((best, member) => (member.score.heat > best.score.heat ? member : best));
  const verdict = hottestTied.score.verdict;
  const share = Math.round((topWeight / totalWeight) * 100);
  return {
    heat,
    parts,
    contributions,
    verdict,
    reason: `${verdict}: the verdict of ${share} % of the ${used.length} member series scored`,
    membersUsed: used.length,
    verdictWeights,
  };
}
