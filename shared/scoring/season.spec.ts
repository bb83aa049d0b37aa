import airPassengersFigures from '../../tests/fixtures/scoring/airpassengers_decompose.json';
import airPassengers from '../../tests/fixtures/scoring/airpassengers-series.json';
import { decompose } from './decompose';
import {
  nextPeakPeriod,
  peakPosition,
  periodEnd,
  periodIndexOf,
  periodStart,
  seasonLift,
} from './season';

const passengers = airPassengers.passengers;

describe('peakPosition and nextPeakPeriod', () => {
  it('when AirPassengers is decomposed, then the peak is July and the next one July 1961', () => {
    // Source: airpassengers_decompose.json peak_month "Jul" and next_peak_after_last_obs "1961-07".
    const indices = decompose(passengers, 12, 'multiplicative').decomposition!.indices;
    const position = peakPosition(indices);
    expect(position).toBe(6);
    const t = nextPeakPeriod('1949-01-01', 'monthly', 12, position, '1960-12-31');
    expect(periodStart('1949-01-01', 'monthly', t)).toBe('1961-07-01');
    // The trough is the smallest index: November.
    expect(indices.indexOf(Math.min(...indices))).toBe(10);
    expect(airPassengersFigures.trough_month).toBe('Nov');
  });

  it.each([
    // Peak position 6 (July) counted from January 1949.
    { today: '1960-06-30', expected: '1960-07-01' },
    { today: '1960-07-01', expected: '1961-07-01' }, // strictly after today
    { today: '1960-07-15', expected: '1961-07-01' },
    { today: '1948-01-01', expected: '1948-07-01' }, // before the series starts
  ])('when today is $today, then the next July peak is $expected', ({ today, expected }) => {
    const t = nextPeakPeriod('1949-01-01', 'monthly', 12, 6, today);
    expect(periodStart('1949-01-01', 'monthly', t)).toBe(expected);
  });

  it('when weekly, then the peak is counted in whole weeks from the first date', () => {
    // First week Monday 2024-01-01, m = 52, peak position 3 → 2024-01-22, then 52 weeks later
    // 2025-01-20 (364 days on).
    expect(
      periodStart(
        '2024-01-01',
        'weekly',
        nextPeakPeriod('2024-01-01', 'weekly', 52, 3, '2024-01-10'),
      ),
    ).toBe('2024-01-22');
    expect(
      periodStart(
        '2024-01-01',
        'weekly',
        nextPeakPeriod('2024-01-01', 'weekly', 52, 3, '2024-01-22'),
      ),
    ).toBe('2025-01-20');
  });

  it('when period edges are asked for, then months and weeks end on their last day', () => {
    expect(periodEnd('2024-01-01', 'monthly', 1)).toBe('2024-02-29'); // leap year
    expect(periodEnd('2024-01-01', 'weekly', 0)).toBe('2024-01-07');
    expect(periodIndexOf('2024-01-01', 'weekly', '2023-12-31')).toBe(-1);
  });
});

describe('seasonLift', () => {
  const multiplicative = decompose(passengers, 12, 'multiplicative').decomposition!;
  const additive = decompose(passengers, 12, 'additive').decomposition!;

  it('when the target is July, then the multiplicative lift is the July index − 1', () => {
    // Source: July figure 1.2265555429312012 (R decompose(), airpassengers_seasonal_indices.json).
    const lift = seasonLift(multiplicative, passengers, '1949-01-01', 'monthly', {
      from: '1961-07-01',
      to: '1961-07-31',
    });
    expect(lift).toBeCloseTo(0.2265555429312012, 10);
  });

  it('when the target spans June to August, then the lift is the mean of the three indices − 1', () => {
    // (1.1127758266792729 + 1.2265555429312012 + 1.2199109694456252)/3 − 1 (same source).
    const lift = seasonLift(multiplicative, passengers, '1949-01-01', 'monthly', {
      from: '1961-06-10',
      to: '1961-08-20',
    });
    expect(lift).toBeCloseTo(
      (1.1127758266792729 + 1.2265555429312012 + 1.2199109694456252) / 3 - 1,
      10,
    );
  });

  it('when the model is additive, then the lift is the index over the mean of the last year', () => {
    // July additive figure 63.83080808080808 (same source); 1960's mean = 5714/12 (yearly_sums).
    const lift = seasonLift(additive, passengers, '1949-01-01', 'monthly', {
      from: '1961-07-01',
      to: '1961-07-31',
    });
    expect(lift).toBeCloseTo(63.83080808080808 / (5714 / 12), 10);
  });

  it('when the additive level is not positive, then there is no lift', () => {
    const values = [-1, -2, -3, -2, -1, -2, -3, -2];
    const decomposition = decompose(values, 4, 'additive').decomposition!;
    expect(
      seasonLift(decomposition, values, '2024-01-01', 'monthly', {
        from: '2024-09-01',
        to: '2024-09-30',
      }),
    ).toBeNull();
  });
});
