// The trend building blocks: least-squares line, Mann–Kendall test and Sen's slope, as defined in
// Gilbert (1987), Statistical Methods for Environmental Pollution Monitoring, ch. 16.

import { linearRegression } from 'simple-statistics';

import type { MannKendall } from './types';

export interface Line {
  slope: number;
  intercept: number;
}

/** Ordinary least squares of y on x; x defaults to 0, 1, 2, … (one step per period). */
export function leastSquaresLine(values: number[], times?: number[]): Line | null {
  if (values.length < 2) return null;
  const pairs = values.map((value, index): [number, number] => [
    times ? times[index] : index,
    value,
  ]);
  const { m, b } = linearRegression(pairs);
  return Number.isFinite(m) ? { slope: m, intercept: b } : null;
}

/**
 * Complementary error function for x ≥ 0. This is the Chebyshev-fitted formula behind
 * simple-statistics' errorFunction (fractional error below 1.2e-7 everywhere), taken before its
 * final "1 −" so that far tails such as p = 1e-47 keep their digits instead of rounding to 0.
 */
export function complementaryErrorFunction(x: number): number {
  const t = 1 / (1 + 0.5 * Math.abs(x));
  const polynomial =
    -1.26551223 +
    t *
      (1.00002368 +
        t *
          (0.37409196 +
            t *
              (0.09678418 +
                t *
                  (-0.18628806 +
                    t *
                      (0.27886807 +
                        t *
                          (-1.13520398 +
                            t * (1.48851587 + t * (-0.82215223 + t * 0.17087277))))))));
  const tail = t * Math.exp(-x * x + polynomial);
  return x >= 0 ? tail : 2 - tail;
}

/** Two-sided p of a standard normal z: P(|Z| ≥ |z|) = erfc(|z| / √2). */
export function twoSidedNormalP(z: number): number {
  return Math.min(1, complementaryErrorFunction(Math.abs(z) / Math.SQRT2));
}

/**
 * Mann–Kendall: S = Σ sign(x_j − x_i) over i < j; Var(S) with the tie correction
 * [n(n−1)(2n+5) − Σ t(t−1)(2t+5)] / 18; z with the continuity correction (S ∓ 1) / √Var(S);
 * tau-a = S / (n(n−1)/2). Values are taken in time order, evenly spaced or not.
 */
export function mannKendall(values: number[]): MannKendall | null {
  const n = values.length;
  if (n < 3) return null;
  let S = 0;
  for (let i = 0; i < n - 1; i++) {
    const earlier = values[i];
    for (let j = i + 1; j < n; j++) {
      const difference = values[j] - earlier;
      if (difference > 0) S++;
      else if (difference < 0) S--;
    }
  }
  let tieTerm = 0;
  for (const groupSize of tieGroupSizes(values)) {
    tieTerm += groupSize * (groupSize - 1) * (2 * groupSize + 5);
  }
  const varS = (n * (n - 1) * (2 * n + 5) - tieTerm) / 18;
  const z = varS === 0 || S === 0 ? 0 : (S > 0 ? S - 1 : S + 1) / Math.sqrt(varS);
  return { S, varS, z, p: twoSidedNormalP(z), tau: S / ((n * (n - 1)) / 2) };
}

/** Sizes of the groups of equal values that have two or more members. */
export function tieGroupSizes(values: number[]): number[] {
  const sorted = Float64Array.from(values).sort();
  const sizes: number[] = [];
  let runLength = 1;
  for (let index = 1; index <= sorted.length; index++) {
    if (index < sorted.length && sorted[index] === sorted[index - 1]) {
      runLength++;
      continue;
    }
    if (runLength > 1) sizes.push(runLength);
    runLength = 1;
  }
  return sizes;
}

/**
 * Sen's slope: the median of (x_j − x_i) / (t_j − t_i) over all pairs i < j; t defaults to
 * 0, 1, 2, …, so the slope is per period. Pairs at the same time are skipped.
 */
export function senSlope(values: number[], times?: number[]): number | null {
  const n = values.length;
  if (n < 2) return null;
  const slopes = new Float64Array((n * (n - 1)) / 2);
  let count = 0;
  for (let i = 0; i < n - 1; i++) {
    for (let j = i + 1; j < n; j++) {
      const run = times ? times[j] - times[i] : j - i;
      if (run === 0) continue;
      slopes[count++] = (values[j] - values[i]) / run;
    }
  }
  if (count === 0) return null;
  // A typed array sorts numerically and far faster than an array of boxed numbers.
  const sorted = slopes.subarray(0, count).sort();
  const middle = count >> 1;
  return count % 2 === 1 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}
