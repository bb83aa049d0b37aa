import airPassengersFigures from '../../tests/fixtures/scoring/airpassengers_decompose.json';
import airPassengers from '../../tests/fixtures/scoring/airpassengers-series.json';
import publishedIndices from '../../tests/fixtures/scoring/airpassengers_seasonal_indices.json';
import {
  centredMovingAverage,
  chooseModel,
  decompose,
  seasonallyAdjust,
  seasonalStrength,
} from './decompose';
import { leastSquaresLine } from './trend-statistics';

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
const passengers = airPassengers.passengers;

describe('decompose on AirPassengers (Box & Jenkins Series G)', () => {
  it.each([
    { model: 'multiplicative' as const, figures: publishedIndices.multiplicative },
    { model: 'additive' as const, figures: publishedIndices.additive },
  ])('when the model is $model, then the seasonal indices equal the published figures', (row) => {
    // Source: airpassengers_seasonal_indices.json — R 4.2.2 decompose() and statsmodels 0.13.5
    // seasonal_decompose(period = 12), which agree to 1e-14. The series starts in January, so
    // position i = 0 is January.
    const { decomposition } = decompose(passengers, 12, row.model);
    const expected = MONTHS.map((month) => row.figures[month as keyof typeof row.figures]);
    decomposition!.indices.forEach((index, position) => {
      expect(index).toBeCloseTo(expected[position], 6);
      expect(Math.abs(index - expected[position])).toBeLessThan(1e-10);
    });
  });

  it('when the model is multiplicative, then the figures also match the R output printed to 7 dp', () => {
    // Source: airpassengers_decompose.json R_check.R_figure_multiplicative (R 4.2.2 decompose()).
    const { decomposition } = decompose(passengers, 12, 'multiplicative');
    airPassengersFigures.R_check.R_figure_multiplicative.forEach((figure, position) =>
      expect(decomposition!.indices[position]).toBeCloseTo(figure, 7),
    );
  });

  it('when the trend is the 2×12 moving average, then its first and last values match', () => {
    // Source: airpassengers_decompose.json trend_first_valid / trend_last_valid and
    // trend_nan_count_each_end (statsmodels seasonal_decompose).
    const expected = airPassengersFigures.multiplicative;
    const trend = centredMovingAverage(passengers, 12);
    expect(trend.slice(0, 6).every((value) => value === null)).toBe(true);
    expect(trend.slice(-6).every((value) => value === null)).toBe(true);
    const last = Object.values(expected.trend_last_valid);
    [135, 136, 137].forEach((index, offset) => expect(trend[index]).toBeCloseTo(last[offset], 9));
    const first = Object.values(expected.trend_first_valid);
    [6, 7, 8].forEach((index, offset) => expect(trend[index]).toBeCloseTo(first[offset], 9));
  });

  it('when the trend is fitted by least squares on t = 1…144, then it matches R lm()', () => {
    // Source: airpassengers_decompose.json R_check.R_lm_trend_on_t_1_144 (R lm on the trend).
    const trend = centredMovingAverage(passengers, 12);
    const times: number[] = [];
    const values: number[] = [];
    trend.forEach((value, index) => {
      if (value !== null) {
        times.push(index + 1);
        values.push(value);
      }
    });
    const line = leastSquaresLine(values, times)!;
    expect(line.slope).toBeCloseTo(airPassengersFigures.R_check.R_lm_trend_on_t_1_144.slope, 8);
    expect(line.intercept).toBeCloseTo(
      airPassengersFigures.R_check.R_lm_trend_on_t_1_144.intercept,
      7,
    );
  });

  it('when the multiplicative residuals are summarised, then mean and sd match R', () => {
    // Source: airpassengers_decompose.json R_check random_mean_7_138 and random_sd_7_138.
    const { decomposition } = decompose(passengers, 12, 'multiplicative');
    const residuals = decomposition!.residual.filter((value): value is number => value !== null);
    const mean = residuals.reduce((sum, value) => sum + value, 0) / residuals.length;
    const sampleSd = Math.sqrt(
      residuals.reduce((sum, value) => sum + (value - mean) ** 2, 0) / (residuals.length - 1),
    );
    expect(mean).toBeCloseTo(airPassengersFigures.R_check.random_mean_7_138, 7);
    expect(sampleSd).toBeCloseTo(airPassengersFigures.R_check.random_sd_7_138, 7);
  });

  it('when the seasonal strength is taken from the additive decomposition, then it matches FPP', () => {
    // Source: airpassengers_decompose.json additive.seasonal_strength_FPP (Hyndman &
    // Athanasopoulos' F_S on statsmodels' additive decomposition) and, on log values,
    // log_additive_seasonal_strength.
    const { decomposition } = decompose(passengers, 12, 'additive');
    expect(seasonalStrength(decomposition!)).toBeCloseTo(
      airPassengersFigures.additive.seasonal_strength_FPP,
      10,
    );
    const logs = decompose(passengers.map(Math.log), 12, 'additive').decomposition!;
    expect(seasonalStrength(logs)).toBeCloseTo(
      airPassengersFigures.log_additive_seasonal_strength,
      10,
    );
  });

  it('when the indices are normalised, then they average 1 (multiplicative) and 0 (additive)', () => {
    const mean = (values: number[]) =>
      values.reduce((sum, value) => sum + value, 0) / values.length;
    expect(mean(decompose(passengers, 12, 'multiplicative').decomposition!.indices)).toBeCloseTo(
      1,
      14,
    );
    expect(mean(decompose(passengers, 12, 'additive').decomposition!.indices)).toBeCloseTo(0, 12);
  });
});

describe('decompose on hand-worked and edge cases', () => {
  it('when m is odd, then the trend is the plain m-point average', () => {
    // (1 + 2 + 3)/3 = 2, (2 + 3 + 4)/3 = 3.
    expect(centredMovingAverage([1, 2, 3, 4], 3)).toEqual([null, 2, 3, null]);
  });

  it('when m = 4, then the 2×4 average weighs the end points half', () => {
    // Centre t = 2 of 1..6: (0.5·1 + 2 + 3 + 4 + 0.5·5)/4 = 12/4 = 3.
    expect(centredMovingAverage([1, 2, 3, 4, 5, 6], 4)).toEqual([null, null, 3, 4, null, null]);
  });

  it('when exactly two cycles of a repeating pattern are given, then the pattern is recovered', () => {
    // 10, 20, 30, 20 twice (m = 4): the 2×4 average at t = 2 is (5 + 20 + 30 + 20 + 5)/4 = 20,
    // and at t = 3..5 also 20; detrended: t=2 → +10, t=3 → 0, t=4 → −10, t=5 → 0.
    // Position means: 0 → −10, 1 → 0, 2 → +10, 3 → 0; their mean is 0, so they stay.
    const values = [10, 20, 30, 20, 10, 20, 30, 20];
    const { decomposition, periodsNeeded } = decompose(values, 4, 'additive');
    expect(periodsNeeded).toBe(0);
    decomposition!.indices.forEach((index, position) =>
      expect(index).toBeCloseTo([-10, 0, 10, 0][position], 12),
    );
    expect(seasonalStrength(decomposition!)).toBeCloseTo(1, 12);
    // Multiplicative: ratios 1.5, 1, 0.5, 1 → mean 1 → indices 0.5, 1, 1.5, 1.
    const multiplicative = decompose(values, 4, 'multiplicative').decomposition!;
    multiplicative.indices.forEach((index, position) =>
      expect(index).toBeCloseTo([0.5, 1, 1.5, 1][position], 12),
    );
    seasonallyAdjust(values, multiplicative).forEach((value) => expect(value).toBeCloseTo(20, 12));
  });

  it('when there is less than two cycles, then it says how many more periods are needed', () => {
    const result = decompose(passengers.slice(0, 20), 12, 'multiplicative');
    expect(result.decomposition).toBeNull();
    expect(result.periodsNeeded).toBe(4);
    expect(decompose([1], 52, 'additive').periodsNeeded).toBe(103);
  });

  it('when the series is constant, then the indices are neutral and the strength is 0', () => {
    const values = new Array(24).fill(7);
    expect(decompose(values, 12, 'multiplicative').decomposition!.indices).toEqual(
      new Array(12).fill(1),
    );
    const additive = decompose(values, 12, 'additive').decomposition!;
    expect(additive.indices).toEqual(new Array(12).fill(0));
    expect(seasonalStrength(additive)).toBe(0);
  });

  it.each([
    { name: 'all positive', values: [1, 2, 3], model: 'multiplicative' },
    { name: 'one zero', values: [0, 2, 3], model: 'additive' },
    { name: 'all zeros', values: [0, 0, 0], model: 'additive' },
    { name: 'negative values', values: [-1, 2, 3], model: 'additive' },
    { name: 'empty', values: [], model: 'additive' },
  ])('when the values are $name, then the model is $model', ({ values, model }) => {
    expect(chooseModel(values)).toBe(model);
  });
});
