// Issue 23, "verdict and figures contradict each other": a property test over generated series that
// each verdict and the figures shown beside it (verdictFigures, which the board formats) agree.
// The thresholds are docs/decisions/0002 (ours): ±10 % a year for rising and fading, F ≥ 0.6 for
// seasonal unless growth reaches ±25 % a year, p < 0.05 for a clear trend (common practice). The
// shapes are in tests/fixtures/scoring/series-shapes.ts.
import fc from 'fast-check';
import { scoreOfShape, seriesShape } from '../../tests/fixtures/scoring/series-shapes';
import { scoreSeries } from './score-series';
import type { Score } from './types';
import { verdictFigures } from './verdict-figures';

const percent = (fraction: number): string =>
  `${fraction >= 0 ? '+' : ''}${Math.round(fraction * 100)} %`;

/** Every way a verdict and its figures could contradict each other, as a list of complaints. */
function contradictions(score: Score): string[] {
  const shown = verdictFigures(score);
  const rise = shown.risePerYear;
  const strength = shown.seasonalStrength;
  const isStrongSeason = strength !== null && strength >= 0.6;
  const problems: string[] = [];
  const complain = (when: boolean, what: string) => when && problems.push(what);
  switch (score.verdict) {
    case 'not-enough-history':
      complain(score.heat !== null, 'a heat without enough history');
      complain(rise !== null, 'a rise without enough history');
      complain(shown.periodsNeeded <= 0, 'no periods needed');
      break;
    case 'rising':
    case 'fading': {
      const sign = score.verdict === 'rising' ? 1 : -1;
      complain(rise === null || sign * rise < 0.1, `${score.verdict} beside a rise of ${rise}`);
      complain(isStrongSeason && rise !== null && Math.abs(rise) < 0.25, 'growth under the season');
      const isReasonInAnotherMeasure = rise !== null && !score.explanation.reason.includes(percent(rise));
      complain(isReasonInAnotherMeasure, 'reason in another measure');
      break;
    }
    case 'steady':
      complain(rise !== null && Math.abs(rise) >= 0.1, `steady beside a rise of ${rise}`);
      complain(isStrongSeason, 'steady beside a strong season');
      break;
    case 'seasonal':
      complain(!isStrongSeason, `seasonal beside a strength of ${strength}`);
      complain(rise !== null && Math.abs(rise) >= 0.25, `seasonal beside a rise of ${rise}`);
      break;
    case 'spike':
      complain(!(Number(score.explanation.figures['spikeZ']) >= 5), 'a spike without a jump');
      break;
  }
  if (score.verdict !== 'not-enough-history') {
    complain(score.heat === null || score.heat < 0 || score.heat > 100, `heat ${score.heat}`);
  }
  return problems;
}

describe('verdictFigures', () => {
  it('when series of every shape are scored, then no verdict contradicts the figures shown beside it', () => {
    fc.assert(
      fc.property(seriesShape, (shape) => {
        expect(contradictions(scoreOfShape(shape))).toEqual([]);
      }),
      { numRuns: 400, seed: 23 },
    );
  });

  it('when the generated shapes are sampled, then every verdict occurs, so each rule above is exercised', () => {
    const shapes = fc.sample(seriesShape, { numRuns: 400, seed: 23 });
    const seen = new Set(shapes.map((shape) => scoreOfShape(shape).verdict));
    expect([...seen].sort()).toEqual([
      'fading',
      'not-enough-history',
      'rising',
      'seasonal',
      'spike',
      'steady',
    ]);
  });

  it('when the trend test cannot tell a slope from chance, then no rise is shown and that is said', () => {
    const flat = Array.from({ length: 60 }, (_, week) => ({
      date: new Date(Date.UTC(2024, 0, 1 + 7 * week)).toISOString().slice(0, 10),
      value: week % 2 === 0 ? 10 : 12,
    }));
    const shown = verdictFigures(scoreSeries(flat, { period: 'weekly', today: '2025-06-02' }));
    expect(shown.risePerYear).toBeNull();
    expect(shown.isRiseUnclear).toBe(true);
  });
});
