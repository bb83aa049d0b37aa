// Scores 5,000 synthetic weekly series of 260 points (five years) in process and prints the rate
// (issue 4). Series mix a trend, a yearly wave and seeded noise so every code path does real work.
import { scoreSeries } from '@shared/scoring/score-series';
import type { Point } from '@shared/scoring/types';
import { lcg } from '../../shared/seeded-random';

const SERIES_COUNT = 5_000;
const POINTS_PER_SERIES = 260;
const FIRST_MONDAY = Date.UTC(2020, 0, 6);

// Seeded linear congruential generator (Numerical Recipes constants): the same run every time.
const nextRandom = lcg(42);

const dates = Array.from({ length: POINTS_PER_SERIES }, (_, week) =>
  new Date(FIRST_MONDAY + week * 7 * 86_400_000).toISOString().slice(0, 10),
);

function syntheticSeries(): Point[] {
  const level = 20 + 80 * nextRandom();
  const growth = (nextRandom() - 0.5) * 0.01;
  const amplitude = nextRandom() * 0.6;
  const phase = nextRandom() * 2 * Math.PI;
  return dates.map((date, week) => ({
    date,
    value: Math.max(
      0,
      level * (1 + growth) ** week * (1 + amplitude * Math.sin((2 * Math.PI * week) / 52 + phase)) +
        (nextRandom() - 0.5) * level * 0.2,
    ),
  }));
}

const allSeries = Array.from({ length: SERIES_COUNT }, syntheticSeries);
const options = { period: 'weekly' as const, today: '2025-01-06' };

// A short warm-up so the timing measures compiled code, not the first interpreted calls.
for (let index = 0; index < 200; index++) scoreSeries(allSeries[index], options);

const verdictCounts: Record<string, number> = {};
const started = performance.now();
for (const series of allSeries) {
  const score = scoreSeries(series, options);
  verdictCounts[score.verdict] = (verdictCounts[score.verdict] ?? 0) + 1;
}
const elapsedMs = performance.now() - started;

console.log(
  `scored ${SERIES_COUNT} weekly series of ${POINTS_PER_SERIES} points in ${elapsedMs.toFixed(0)} ms`,
);
console.log(
  `${((SERIES_COUNT * 1000) / elapsedMs).toFixed(0)} series per second, ${(elapsedMs / SERIES_COUNT).toFixed(3)} ms per series`,
);
console.log('verdicts:', verdictCounts);
