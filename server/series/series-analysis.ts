// The series page's picture of a series: the regular grid with its classical decomposition, the
// same steps scoreSeries takes (regularise, sales weeks without a sale as 0, score only the stretch
// after the last long gap).
import type { SeriesAnalysis } from '@shared/contracts/series';
import { chooseModel, decompose, seasonallyAdjust } from '@shared/scoring/decompose';
import { regularise } from '@shared/scoring/regularise';
import type { Period, Point } from '@shared/scoring/types';
import type { SeriesReading } from './scoring-service';

export function analyseSeries(points: Point[], period: Period, reading?: SeriesReading): SeriesAnalysis {
  const regular = regularise(points, period, { isMissingZero: reading?.kind === 'sales', coveredUntil: reading?.coveredUntil });
  const lastGapEnd = regular.values.lastIndexOf(null);
  const values = regular.values.slice(lastGapEnd + 1) as number[];
  const padding: null[] = new Array(lastGapEnd + 1).fill(null);
  const model = chooseModel(values);
  const { decomposition } = decompose(values, regular.m, model);
  const pad = <T>(list: T[]): (T | null)[] => [...padding, ...list];
  return {
    period: regular.period,
    dates: regular.dates,
    values: regular.values,
    trend: decomposition ? pad(decomposition.trend) : regular.values.map(() => null),
    seasonal: decomposition ? pad(decomposition.seasonal) : regular.values.map(() => null),
    residual: decomposition ? pad(decomposition.residual) : regular.values.map(() => null),
    adjusted: decomposition ? pad(seasonallyAdjust(values, decomposition)) : regular.values,
    model: decomposition ? model : null,
  };
}
