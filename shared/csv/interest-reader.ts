import type { CsvPeriod, CsvPreview, CsvProblem, InterestPoint, LongInterestMapping, WideInterestMapping } from './csv-types';
import { createProblem } from './csv-problem';
import { detectPeriod } from './csv-period';
import { parseSeriesHeader } from './csv-headers';
import { RowContext, type ReaderOptions } from './row-context';
import { importLimits } from './csv-limits';
import { normaliseRegion } from './region-names';

export interface InterestSeriesSummary {
  term: string;
  region: string | null;
  period: CsvPeriod | null;
  /** Points read, blanks included. */
  points: number;
  /** Points whose cell was blank. */
  missing: number;
  belowOne: number;
  start: string | null;
  end: string | null;
}

export interface InterestSummary {
  kind: 'interest';
  /** Data rows read (blank lines and preamble not counted). */
  rows: number;
  /** The period all series share; null when there are none or they disagree. */
  period: CsvPeriod | null;
  series: InterestSeriesSummary[];
  problems: CsvProblem[];
  problemCount: number;
  hasErrors: boolean;
}

export interface RowReader<R, S> {
  /** Reads one parsed row; returns the records it produced, so the caller can batch and forget them. */
  push(cells: readonly string[], rowNumber: number): R[];
  /** Checks what needs all rows (periods) and returns the summary with every problem. */
  finish(): S;
}

/** The per-series state kept while streaming: only dates, never values. */
interface SeriesState {
  term: string;
  /** How messages name the series. */
  label: string;
  region: string | null;
  /** ISO date → file line, to report duplicates and mixed spacing by row. */
  dates: Map<string, number>;
  points: number;
  missing: number;
  belowOne: number;
}

export type InterestPreview = Pick<CsvPreview, 'headerRow' | 'columns' | 'dateFormat' | 'decimalSeparator' | 'layout' | 'mapping'>;

export function createInterestReader(
  preview: InterestPreview,
  options: ReaderOptions = {},
): RowReader<InterestPoint, InterestSummary> {
  const context = new RowContext(preview, options);
  const series = new Map<string, SeriesState>();
  const stateOf = (term: string, region: string | null) => {
    const key = JSON.stringify([term, region]);
    let state = series.get(key);
    if (!state) {
      state = { term, label: `"${region ? `${term} (${region})` : term}"`, region, dates: new Map(), points: 0, missing: 0, belowOne: 0 };
      series.set(key, state);
    }
    return state;
  };
  const readValue = (cells: readonly string[], column: string, rowNumber: number) => {
    const parsed = context.readNumber(cells, column, rowNumber);
    if (parsed.kind === 'invalid') return undefined;
    if (parsed.kind === 'blank') return { value: null, belowOne: false };
    if (Math.abs(parsed.value) > importLimits.interestValue) {
      context.reportRange(context.cell(cells, column), column, rowNumber, 'search interest runs from 0 to 100, and a value beyond a billion cannot be scored');
      return undefined;
    }
    if (parsed.value < 0 || parsed.value > 100) {
      const message = `${parsed.value} in column "${column}" is outside the usual 0–100 range of search interest`;
      context.problems.add(createProblem('out-of-range', rowNumber, column, message, 'warning'));
    }
    return { value: parsed.value, belowOne: parsed.belowOne };
  };
  const record = (state: SeriesState, point: InterestPoint, rowNumber: number) => {
    state.dates.set(point.date, rowNumber);
    state.points++;
    if (point.value === null) state.missing++;
    if (point.belowOne) state.belowOne++;
    return point;
  };
  const duplicate = (state: SeriesState, date: string, rowNumber: number, column: string) => {
    const first = state.dates.get(date);
    if (first === undefined) return false;
    const message = `${date} appears again for ${state.label} (first on row ${first}); the repeat was not read`;
    context.problems.add(createProblem('duplicate-date', rowNumber, column, message));
    return true;
  };

  let shared: SeriesState | null = null;
  let push: (cells: readonly string[], rowNumber: number) => InterestPoint[];
  if (preview.layout === 'wide') {
    const mapping = preview.mapping as WideInterestMapping;
    // A header's term fits (analyseCsv bounds header cells); its region part may not.
    const storable = mapping.terms.filter((column) => context.fits(parseSeriesHeader(column).region ?? '', column, preview.headerRow, importLimits.regionLength));
    const columns = storable.map((column) => {
      const { term, region } = parseSeriesHeader(column);
      return { column, state: stateOf(term, region ?? null) };
    });
    // All series of a wide file share the date column: duplicates and spacing are checked once.
    shared = { term: mapping.date, label: `the dates in column "${mapping.date}"`, region: null, dates: new Map(), points: 0, missing: 0, belowOne: 0 };
    const dates = shared;
    push = (cells, rowNumber) => {
      if (!context.accepts(cells, rowNumber)) return [];
      const date = context.readDate(cells, mapping.date, rowNumber);
      if (date === null || duplicate(dates, date, rowNumber, mapping.date)) return [];
      dates.dates.set(date, rowNumber);
      const points: InterestPoint[] = [];
      for (const { column, state } of columns) {
        const value = readValue(cells, column, rowNumber);
        if (value === undefined) continue;
        points.push(record(state, { term: state.term, region: state.region, date, ...value }, rowNumber));
      }
      return points;
    };
  } else {
    const mapping = preview.mapping as LongInterestMapping;
    push = (cells, rowNumber) => {
      if (!context.accepts(cells, rowNumber)) return [];
      const date = context.readDate(cells, mapping.date, rowNumber);
      const term = context.requireText(cells, mapping.term, rowNumber, 'term');
      const isTermStorable = term !== null && context.fits(term, mapping.term, rowNumber, importLimits.termLength);
      const written = context.readText(cells, mapping.region, rowNumber);
      const region = written ? normaliseRegion(written) : null;
      const isRegionStorable = region === null || context.fits(region, mapping.region!, rowNumber, importLimits.regionLength);
      const value = readValue(cells, mapping.value, rowNumber);
      if (date === null || term === null || !isTermStorable || !isRegionStorable || value === undefined) return [];
      const state = stateOf(term, region);
      if (duplicate(state, date, rowNumber, mapping.date)) return [];
      return [record(state, { term, region, date, ...value }, rowNumber)];
    };
  }

  return {
    push,
    finish() {
      const sharedReport = shared ? checkSpacing(shared, context, preview) : null;
      const summaries = [...series.values()].map((state) =>
        summarise(state, sharedReport ? sharedReport.period : checkSpacing(state, context, preview).period),
      );
      const periods = new Set(summaries.filter((s) => s.points > 1).map((s) => s.period));
      if (periods.size > 1) {
        const list = summaries.map((s) => `${s.term}: ${s.period ?? 'unknown'}`).join(', ');
        const message = `The series do not share one period (${list})`;
        context.problems.add(createProblem('mixed-period', preview.headerRow, null, message));
      }
      return {
        kind: 'interest',
        rows: context.rows,
        period: periods.size === 1 ? [...periods][0] : null,
        series: summaries,
        problems: context.problems.list(),
        problemCount: context.problems.count,
        hasErrors: context.problems.hasErrors,
      };
    },
  };
}

/** Reports duplicate-free dates that do not keep one spacing, by the row where the odd step lands. */
function checkSpacing(state: SeriesState, context: RowContext, preview: InterestPreview) {
  const sorted = [...state.dates.keys()].sort();
  const report = detectPeriod(sorted);
  const column = preview.layout === 'wide' ? (preview.mapping as WideInterestMapping).date : (preview.mapping as LongInterestMapping).date;
  const label = state.label;
  for (const date of report.mixedAt.slice(0, 5)) {
    const next = sorted[sorted.indexOf(date) + 1];
    const message = `${label}: the step from ${date} to ${next} does not fit its ${report.period} spacing (mixed periods)`;
    context.problems.add(createProblem('mixed-period', state.dates.get(next) ?? preview.headerRow, column, message));
  }
  if (report.gapsAfter.length > 0) {
    const first = report.gapsAfter[0];
    const message = `${label} skips ${report.gapsAfter.length} place(s) in its ${report.period} spacing, first after ${first}`;
    context.problems.add(createProblem('date-gap', state.dates.get(first) ?? preview.headerRow, column, message, 'warning'));
  }
  return report;
}

function summarise(state: SeriesState, period: CsvPeriod | null): InterestSeriesSummary {
  const sorted = [...state.dates.keys()].sort();
  return {
    term: state.term,
    region: state.region,
    period,
    points: state.points,
    missing: state.missing,
    belowOne: state.belowOne,
    start: sorted[0] ?? null,
    end: sorted[sorted.length - 1] ?? null,
  };
}
