import { decideVerdict, recentSpikeZ } from './verdict';
import type { Rise } from './types';

// The base below is monthly, so growth a year is slopePct × 12 / 100.
const rise = (slopePct: number | null, p: number | null): Rise => ({
  recentChange: null,
  slopePct,
  growthPerYear: slopePct === null ? null : (slopePct * 12) / 100,
  mannKendall: p === null ? null : { S: 1, varS: 1, z: 1, p, tau: 0.5 },
  senSlope: null,
});

const base = {
  period: 'monthly' as const,
  periodsUsed: 48,
  m: 12,
  k: 3,
  adjusted: [1, 1, 1, 1, 1, 1, 1, 1, 1],
};

describe('decideVerdict', () => {
  it.each([
    // slopePct 1 %/month × 12 = +12 % a year, significant, no season → rising.
    {
      name: '+12 %/year, p 0.01, no season',
      slopePct: 1,
      p: 0.01,
      strength: 0.1,
      verdict: 'rising',
    },
    {
      name: '−12 %/year, p 0.01, no season',
      slopePct: -1,
      p: 0.01,
      strength: 0.1,
      verdict: 'fading',
    },
    // +12 % but not significant → steady.
    { name: '+12 %/year, p 0.3', slopePct: 1, p: 0.3, strength: 0.1, verdict: 'steady' },
    // Significant but only +6 % a year: too little to matter.
    { name: '+6 %/year, p 0.01', slopePct: 0.5, p: 0.01, strength: 0.1, verdict: 'steady' },
    // Strong season and +12 % a year: the season is the story.
    { name: '+12 %/year with F 0.8', slopePct: 1, p: 0.01, strength: 0.8, verdict: 'seasonal' },
    // Strong season but +36 % a year: growth outweighs it.
    { name: '+36 %/year with F 0.8', slopePct: 3, p: 0.01, strength: 0.8, verdict: 'rising' },
    { name: 'no slope at all', slopePct: null, p: null, strength: null, verdict: 'steady' },
  ])(
    'when the figures are $name, then the verdict is $verdict',
    ({ slopePct, p, strength, verdict }) => {
      const result = decideVerdict({
        ...base,
        rise: rise(slopePct, p),
        strength,
        peakMonth: 'November',
      });
      expect(result.verdict).toBe(verdict);
      expect(result.reason.startsWith(verdict)).toBe(true);
    },
  );

  it('when seasonal, then the reason names the peak month and the strength', () => {
    const result = decideVerdict({
      ...base,
      rise: rise(0, 0.5),
      strength: 0.8,
      peakMonth: 'November',
    });
    expect(result.reason).toBe(
      'seasonal (peaks in November): a strong yearly pattern, seasonal strength 0.80 of 1',
    );
    expect(result.figures['peakMonth']).toBe('November');
  });

  it('when rising and seasonal, then the reason says both', () => {
    const result = decideVerdict({
      ...base,
      rise: rise(3, 0.001),
      strength: 0.8,
      peakMonth: 'July',
    });
    expect(result.reason).toBe(
      'rising: about +36 % a year after the season is taken out, a clear trend rather than chance, and seasonal (peaks in July)',
    );
  });

  it('when five months are scored, then one more is needed', () => {
    const result = decideVerdict({
      ...base,
      periodsUsed: 5,
      rise: rise(1, 0.01),
      strength: null,
      peakMonth: null,
    });
    expect(result.verdict).toBe('not-enough-history');
    expect(result.reason).toBe('not enough history: 1 more month needed for a verdict');
  });
});

describe('recentSpikeZ', () => {
  it('when one of the last k jumps, then its robust z is returned', () => {
    // Baseline 10, 11, 10, 11, 10, 11, 10, 11: median 10.5, MAD 0.5 → scale max(0.7413, 1.05) =
    // 1.05; last three 10, 11, 30 → z of 30 = 19.5/1.05 = 18.57; only one z ≥ 2.
    const values = [10, 11, 10, 11, 10, 11, 10, 11, 10, 11, 30];
    expect(recentSpikeZ(values, 3, 12)).toBeCloseTo(19.5 / 1.05, 10);
  });

  it('when the last k all stand high, then it is a shift, not a spike', () => {
    expect(recentSpikeZ([10, 11, 10, 11, 10, 11, 10, 11, 30, 31, 30], 3, 12)).toBeNull();
  });

  it('when a flat zero baseline is followed by one sale, then it is a spike', () => {
    expect(recentSpikeZ([0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 5], 3, 12)).toBeGreaterThan(5);
  });

  it('when the baseline is shorter than 2k, then there is no judgement', () => {
    expect(recentSpikeZ([1, 1, 9], 3, 12)).toBeNull();
  });
});
