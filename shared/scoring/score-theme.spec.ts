import { combineHeat } from './heat';
import { scoreTheme } from './score-theme';
import type { HeatParts, Score, Verdict } from './types';

/** A member score with only the fields scoreTheme reads filled in meaningfully. */
function member(verdict: Verdict, parts: HeatParts): Score {
  const { heat, contributions } = combineHeat(parts);
  return {
    heat: verdict === 'not-enough-history' ? null : heat,
    parts,
    contributions,
    verdict,
    yoy: null,
    rise: { recentChange: null, slopePct: null, growthPerYear: null, mannKendall: null, senSlope: null },
    seasonal: null,
    explanation: {
      reason: verdict,
      figures: {},
      notes: [],
      gaps: [],
      periodsUsed: 0,
      periodsWithoutSales: null,
      seasonalPeriodsNeeded: 0,
      target: null,
      seasonLiftFraction: null,
    },
  };
}

const hot = { rise: 90, seasonLift: 80, leadRoom: 100, salesPull: 50 };
const cool = { rise: 30, seasonLift: 40, leadRoom: 100, salesPull: 50 };
const neutral = { rise: 50, seasonLift: 50, leadRoom: 50, salesPull: 50 };

describe('scoreTheme', () => {
  it('when two members weigh the same, then each part is their mean and heat is recomputed', () => {
    // rise (90 + 30)/2 = 60, lift (80 + 40)/2 = 60, lead room 100, sales 50:
    // heat = 0.35·60 + 0.30·60 + 0.20·100 + 0.15·50 = 21 + 18 + 20 + 7.5 = 66.5.
    const theme = scoreTheme([member('rising', hot), member('steady', cool)])!;
    expect(theme.parts).toEqual({ rise: 60, seasonLift: 60, leadRoom: 100, salesPull: 50 });
    expect(theme.heat).toBeCloseTo(66.5, 12);
    // A tie of one vote each goes to the hotter member's verdict.
    expect(theme.verdict).toBe('rising');
  });

  it('when weights are given, then parts are weighted means', () => {
    // rise (3·90 + 1·30)/4 = 75.
    const theme = scoreTheme([member('rising', hot), member('steady', cool)], [3, 1])!;
    expect(theme.parts!.rise).toBeCloseTo(75, 12);
  });

  it('when most members share a verdict, then the theme takes it', () => {
    const theme = scoreTheme([
      member('seasonal', cool),
      member('seasonal', cool),
      member('rising', hot),
    ])!;
    expect(theme.verdict).toBe('seasonal');
    expect(theme.verdictWeights).toEqual({ seasonal: 2, rising: 1 });
    expect(theme.reason).toBe('seasonal: the verdict of 67 % of the 3 series that count; heat from 3 of 3 series');
  });

  it('when a member has too little history, then it is left out of the parts and the heat says so', () => {
    const theme = scoreTheme([member('rising', hot), member('not-enough-history', neutral)])!;
    expect(theme.parts).toEqual(hot);
    expect(theme.heat).toBeCloseTo(combineHeat(hot).heat, 12);
    expect(theme.membersUsed).toBe(1);
    // Issue 23: the theme's heat says how many of its members count.
    expect(theme.membersTotal).toBe(2);
    expect(theme.reason).toBe(
      'rising: the verdict of 100 % of the 1 series that count; heat from 1 of 2 series; 1 has not enough history yet and does not count',
    );
  });

  it('when every member has too little history, then the theme has no heat and says why', () => {
    const theme = scoreTheme([
      member('not-enough-history', neutral),
      member('not-enough-history', neutral),
    ])!;
    expect(theme.verdict).toBe('not-enough-history');
    // Issue 23: no heat of 50 from neutral parts, which would rank it among scored themes.
    expect(theme.heat).toBeNull();
    expect(theme.parts).toBeNull();
    expect(theme.membersUsed).toBe(0);
    expect(theme.membersTotal).toBe(2);
    expect(theme.reason).toBe('not enough history: none of its 2 series has enough history for a heat yet');
    expect(theme.reason).not.toContain('not-enough-history');
  });

  it('when there are no members, then there is no theme score', () => {
    expect(scoreTheme([])).toBeNull();
  });
});
