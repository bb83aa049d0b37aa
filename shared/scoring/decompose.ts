// Classical decomposition as in R's decompose() and statsmodels' seasonal_decompose(): a centred
// moving average for the trend, the mean detrended value at each position for the seasonal
// figure, and the rest as residual. Kept textbook so its figures can be checked against theirs.

import { variance } from 'simple-statistics';

import type { SeasonalModel } from './types';

export interface Decomposition {
  model: SeasonalModel;
  period: number;
  /** null for the first and last floor(m/2) points, where the centred average has no window. */
  trend: (number | null)[];
  /** The seasonal figure: index i belongs to the points t with t mod m = i. */
  indices: number[];
  seasonal: number[];
  residual: (number | null)[];
}

export type DecompositionResult =
  | { decomposition: Decomposition; periodsNeeded: 0 }
  | { decomposition: null; periodsNeeded: number };

/**
 * Centred moving average of order m; for even m the 2×m average, whose end points weigh half,
 * so that the window stays centred on a point.
 */
export function centredMovingAverage(values: number[], m: number): (number | null)[] {
  const half = Math.floor(m / 2);
  const trend: (number | null)[] = new Array(values.length).fill(null);
  if (values.length < 2 * half + 1) return trend;
  const isEven = m % 2 === 0;
  // A running sum keeps this linear in the length of the series.
  let windowSum = 0;
  for (let index = 0; index <= 2 * half; index++) windowSum += values[index];
  for (let centre = half; centre < values.length - half; centre++) {
    if (centre > half) windowSum += values[centre + half] - values[centre - half - 1];
    const sum = isEven
      ? windowSum - 0.5 * values[centre - half] - 0.5 * values[centre + half]
      : windowSum;
    trend[centre] = sum / m;
  }
  return trend;
}

/** Multiplicative needs every value positive, or the ratios to the trend mean nothing. */
export function chooseModel(values: number[]): SeasonalModel {
  return values.length > 0 && values.every((value) => value > 0) ? 'multiplicative' : 'additive';
}

export function decompose(values: number[], m: number, model: SeasonalModel): DecompositionResult {
  if (values.length < 2 * m) return { decomposition: null, periodsNeeded: 2 * m - values.length };
  const isMultiplicative = model === 'multiplicative';
  const trend = centredMovingAverage(values, m);
  const sums = new Array<number>(m).fill(0);
  const counts = new Array<number>(m).fill(0);
  for (let index = 0; index < values.length; index++) {
    const level = trend[index];
    if (level === null) continue;
    const position = index % m;
    sums[position] += isMultiplicative ? values[index] / level : values[index] - level;
    counts[position]++;
  }
  const figure = sums.map((sum, position) => sum / counts[position]);
  const figureMean = figure.reduce((total, value) => total + value, 0) / m;
  const indices = figure.map((value) =>
    isMultiplicative ? value / figureMean : value - figureMean,
  );
  const seasonal = values.map((_, index) => indices[index % m]);
  const residual = values.map((value, index) => {
    const level = trend[index];
    if (level === null) return null;
    return isMultiplicative ? value / (level * seasonal[index]) : value - level - seasonal[index];
  });
  return {
    decomposition: { model, period: m, trend, indices, seasonal, residual },
    periodsNeeded: 0,
  };
}

/**
 * F = max(0, 1 − Var(R) / Var(S + R)) from Hyndman & Athanasopoulos, Forecasting: Principles and
 * Practice, §4.2, on an additive decomposition, over the points where the trend exists.
 */
export function seasonalStrength(additive: Decomposition): number {
  const remainders: number[] = [];
  const detrended: number[] = [];
  for (let index = 0; index < additive.residual.length; index++) {
    const remainder = additive.residual[index];
    if (remainder === null) continue;
    remainders.push(remainder);
    detrended.push(remainder + additive.seasonal[index]);
  }
  // Population variances; the ratio is the same with the n − 1 denominator.
  const detrendedVariance = variance(detrended);
  // A flat detrended series has neither season nor noise; call that no seasonality.
  if (detrendedVariance === 0) return 0;
  return Math.max(0, 1 - variance(remainders) / detrendedVariance);
}

/** The series with the season taken out: divided by its index, or less its index. */
export function seasonallyAdjust(values: number[], decomposition: Decomposition): number[] {
  return values.map((value, index) =>
    decomposition.model === 'multiplicative'
      ? value / decomposition.seasonal[index]
      : value - decomposition.seasonal[index],
  );
}
