import mannKendallExamples from '../../tests/fixtures/scoring/mann_kendall_examples.json';
import airPassengersFigures from '../../tests/fixtures/scoring/airpassengers_decompose.json';
import airPassengers from '../../tests/fixtures/scoring/airpassengers-series.json';
import norrisData from '../../tests/fixtures/scoring/norris-data.json';
import norrisReference from '../../tests/fixtures/scoring/norris_reference.json';
import {
  complementaryErrorFunction,
  leastSquaresLine,
  mannKendall,
  senSlope,
  tieGroupSizes,
  twoSidedNormalP,
} from './trend-statistics';

const relativeError = (actual: number, expected: number): number =>
  Math.abs(actual - expected) / Math.abs(expected);

describe('leastSquaresLine', () => {
  it('when fitted to NIST StRD Norris, then slope and intercept match the certified values', () => {
    // Source: NIST/ITL Statistical Reference Datasets, "Norris" (certified B1 and B0, 15 digits).
    const line = leastSquaresLine(norrisData.y, norrisData.x);
    expect(line).not.toBeNull();
    expect(relativeError(line!.slope, norrisReference.certified.B1)).toBeLessThan(1e-12);
    expect(relativeError(line!.intercept, norrisReference.certified.B0)).toBeLessThan(1e-10);
  });

  it('when fitted to AirPassengers on t = 0…143, then slope and intercept match statsmodels', () => {
    // Source: airpassengers_decompose.json "ols_trend" (statsmodels 0.13.5 / numpy, Series G).
    const line = leastSquaresLine(airPassengers.passengers)!;
    expect(line.slope).toBeCloseTo(airPassengersFigures.ols_trend.slope_per_month, 9);
    expect(line.intercept).toBeCloseTo(airPassengersFigures.ols_trend.intercept_t0_1949_01, 9);
  });

  it.each([
    // Hand-worked: points (0,1), (1,3), (2,5) lie on y = 1 + 2t.
    { name: 'three points on a line', values: [1, 3, 5], slope: 2, intercept: 1 },
    // Hand-worked: y = 1, 2, 2, 5; mean t = 1.5, mean y = 2.5; Σ(t−1.5)(y−2.5)
    // = (−1.5)(−1.5) + (−0.5)(−0.5) + (0.5)(−0.5) + (1.5)(2.5) = 6; Σ(t−1.5)² = 5;
    // slope = 6/5 = 1.2, intercept = 2.5 − 1.2·1.5 = 0.7.
    { name: 'four points', values: [1, 2, 2, 5], slope: 1.2, intercept: 0.7 },
    { name: 'a constant series', values: [4, 4, 4, 4], slope: 0, intercept: 4 },
  ])('when the series is $name, then the line is exact', ({ values, slope, intercept }) => {
    const line = leastSquaresLine(values)!;
    expect(line.slope).toBeCloseTo(slope, 12);
    expect(line.intercept).toBeCloseTo(intercept, 12);
  });

  it('when there is one point, then there is no line', () => {
    expect(leastSquaresLine([3])).toBeNull();
  });
});

describe('mannKendall and senSlope against published examples', () => {
  // Source of each case: mann_kendall_examples.json, "published" figures — US EPA QA/G-9S (2006)
  // p. 109; US EPA Unified Guidance (2009) examples 17-6 and 17-7 as reproduced by the EnvStats R
  // package; a university course's worked example. "computed" holds scipy's figures for the rest.
  const cases = Object.entries(mannKendallExamples).map(([name, example]) => ({
    name,
    ...example,
  }));

  it.each(cases)('when the data are $name, then S, Var(S), z, p and tau match', (example) => {
    const result = mannKendall(example.data)!;
    expect(result.S).toBe(example.computed.S);
    expect(result.varS).toBeCloseTo(example.computed.varS, 9);
    expect(result.z).toBeCloseTo(example.computed.z, 9);
    expect(relativeError(result.p, example.computed.p_two_sided)).toBeLessThan(1e-6);
    expect(result.tau).toBeCloseTo(example.computed.tau_a, 12);
    expect(tieGroupSizes(example.data).sort()).toEqual([...example.computed.tie_groups].sort());
  });

  it.each(cases)('when the data are $name, then the published figures are met', (example) => {
    const result = mannKendall(example.data)!;
    const published = example.published as Record<string, unknown>;
    if (typeof published['S'] === 'number') expect(result.S).toBe(published['S']);
    if (typeof published['varS'] === 'number')
      expect(result.varS).toBeCloseTo(published['varS'], 2);
    if (typeof published['z'] === 'number') {
      const digits = String(published['z']).split('.')[1].length;
      expect(result.z).toBeCloseTo(published['z'], digits - 1);
    }
    if (typeof published['tau'] === 'number') expect(result.tau).toBeCloseTo(published['tau'], 6);
    if (typeof published['p'] === 'number') {
      expect(relativeError(result.p, published['p'])).toBeLessThan(1e-6);
    }
  });

  it('when the course example gives Var(S) as a formula, then ours equals it', () => {
    // Source: the course's worked example, Var(S) = 14·13·33/18 − 2·1·9/18 (one pair of ties).
    const example = mannKendallExamples.HolyCross_MannKendallByHand;
    expect(mannKendall(example.data)!.varS).toBeCloseTo((14 * 13 * 33) / 18 - (2 * 1 * 9) / 18, 10);
  });

  it.each(cases)("when the data are $name, then Sen's slope matches", (example) => {
    // Sen's slope over the sampling times where the source gives them (EnvStats uses years).
    const slope = senSlope(example.data, example.time ?? undefined)!;
    expect(slope).toBeCloseTo(example.computed.sen_slope, 9);
    const published = example.published as Record<string, unknown>;
    if (typeof published['slope'] === 'number') expect(slope).toBeCloseTo(published['slope'], 6);
  });

  it('when run on all 144 AirPassengers months, then the figures match scipy', () => {
    // Source: airpassengers_decompose.json "mann_kendall" and "sen_slope_per_month" (Gilbert 1987).
    const expected = airPassengersFigures.mann_kendall;
    const result = mannKendall(airPassengers.passengers)!;
    expect(result.S).toBe(expected.S);
    expect(result.varS).toBeCloseTo(expected.varS, 8);
    expect(result.z).toBeCloseTo(expected.z, 9);
    expect(relativeError(result.p, expected.p_two_sided)).toBeLessThan(1e-6);
    expect(result.tau).toBeCloseTo(expected.tau_a, 12);
    expect(tieGroupSizes(airPassengers.passengers)).toHaveLength(expected.n_tie_groups);
    expect(senSlope(airPassengers.passengers)).toBeCloseTo(
      airPassengersFigures.sen_slope_per_month,
      9,
    );
  });
});

describe('mannKendall on hand-worked cases', () => {
  it.each([
    // 1,2,3: three rising pairs, S = 3; Var = 3·2·11/18 = 11/3; z = 2/√(11/3); tau = 3/3.
    {
      name: 'rising 1, 2, 3',
      values: [1, 2, 3],
      S: 3,
      varS: 11 / 3,
      z: 2 / Math.sqrt(11 / 3),
      tau: 1,
    },
    // 3,1,2: pairs (3,1) −, (3,2) −, (1,2) + → S = −1; z = (−1 + 1)/√… = 0.
    { name: '3, 1, 2', values: [3, 1, 2], S: -1, varS: 11 / 3, z: 0, tau: -1 / 3 },
    // 5,5,5,5: every pair tied, S = 0; Var = (4·3·13 − 4·3·13)/18 = 0 → z = 0, p = 1.
    { name: 'constant', values: [5, 5, 5, 5], S: 0, varS: 0, z: 0, tau: 0 },
    // 0,0,1: pairs (0,0) 0, (0,1) +, (0,1) + → S = 2; Var = (3·2·11 − 2·1·9)/18 = 48/18.
    {
      name: '0, 0, 1',
      values: [0, 0, 1],
      S: 2,
      varS: 48 / 18,
      z: 1 / Math.sqrt(48 / 18),
      tau: 2 / 3,
    },
  ])('when the series is $name, then S, Var(S), z and tau are as worked', (example) => {
    const result = mannKendall(example.values)!;
    expect(result.S).toBe(example.S);
    expect(result.varS).toBeCloseTo(example.varS, 12);
    expect(result.z).toBeCloseTo(example.z, 12);
    expect(result.tau).toBeCloseTo(example.tau, 12);
  });

  it('when the series is constant, then p is 1', () => {
    expect(mannKendall([2, 2, 2])!.p).toBe(1);
  });

  it('when there are fewer than three points, then there is no test', () => {
    expect(mannKendall([1, 2])).toBeNull();
    expect(mannKendall([])).toBeNull();
  });

  it("when the pairwise slopes are 1, 2 and 1.5, then Sen's slope is their median 1.5", () => {
    // 0, 1, 3: slopes (1−0)/1 = 1, (3−0)/2 = 1.5, (3−1)/1 = 2; median 1.5.
    expect(senSlope([0, 1, 3])).toBe(1.5);
    // 0, 1, 3, 3: slopes 1, 1.5, 1, 2, 1, 0 → sorted 0 1 1 1 1.5 2 → median (1 + 1)/2 = 1.
    expect(senSlope([0, 1, 3, 3])).toBe(1);
  });
});

describe('normal tail', () => {
  it.each([
    // Source: standard normal table (e.g. NIST/SEMATECH e-Handbook 1.3.6.7.1): P(|Z| ≥ 1.96) = 0.0500;
    // erfc(1) = 0.157299207050285 (Abramowitz & Stegun, table 7.1).
    { z: 1.959963984540054, p: 0.05 },
    { z: 0, p: 1 },
    { z: Math.SQRT2, p: 0.157299207050285 },
  ])('when z is $z, then the two-sided p is $p', ({ z, p }) => {
    expect(relativeError(twoSidedNormalP(z), p)).toBeLessThan(2e-7);
  });

  it('when x is negative, then erfc(x) = 2 − erfc(−x)', () => {
    expect(complementaryErrorFunction(-1)).toBeCloseTo(2 - 0.157299207050285, 6);
  });
});
