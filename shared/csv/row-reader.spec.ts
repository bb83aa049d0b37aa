import Papa from 'papaparse';
import { analyseCsv } from './analyse-csv';
import { createRowReader } from './row-reader';
import { createLineCounter } from './csv-text';
import { wideWeekly, salesComma } from '../../tests/fixtures/csv/csv-fixtures';
import type { InterestPoint, SaleRecord } from './csv-types';

/** Feeds text to a reader the way the server does: papaparse one row at a time, inserts in batches. */
function stream(text: string, preview = analyseCsv(text)) {
  const reader = createRowReader(preview, { defaultCurrency: 'USD', maxProblems: 3 });
  const lines = createLineCounter();
  const batches: number[] = [];
  let batch: (InterestPoint | SaleRecord)[] = [];
  const flush = () => {
    if (batch.length > 0) batches.push(batch.length);
    batch = [];
  };
  Papa.parse<string[]>(text, {
    delimiter: preview.delimiter,
    skipEmptyLines: false,
    step: (results: Papa.ParseStepResult<string[]>) => {
      batch.push(...reader.push(results.data, lines.next(results.data)));
      if (batch.length >= 5) flush();
    },
  });
  flush();
  return { reader, batches, summary: reader.finish() };
}

describe('createRowReader fed row by row', () => {
  it('gives the same interest points as reading the whole text, in small batches', () => {
    const { reader, batches, summary } = stream(wideWeekly);
    expect(reader.kind).toBe('interest');
    expect(batches.reduce((sum, size) => sum + size, 0)).toBe(12);
    expect(batches.length).toBeGreaterThan(1);
    expect(summary).toMatchObject({ kind: 'interest', rows: 4, period: 'weekly', hasErrors: false });
    if (summary.kind !== 'interest') throw new Error('expected interest');
    expect(summary.series).toEqual([
      { term: 'herb planter box', region: 'US', period: 'weekly', points: 4, missing: 0, belowOne: 0, start: '2024-09-01', end: '2024-09-22' },
      { term: 'lantern panel', region: 'US', period: 'weekly', points: 4, missing: 0, belowOne: 1, start: '2024-09-01', end: '2024-09-22' },
      { term: 'pumpkin porch sign', region: null, period: 'weekly', points: 4, missing: 1, belowOne: 0, start: '2024-09-01', end: '2024-09-22' },
    ]);
  });

  it('reads sales and fills the default currency', () => {
    const { summary } = stream(salesComma);
    expect(summary).toMatchObject({ kind: 'sales', rows: 5, records: 5, refunds: 1 });
  });

  it('skips preamble, header and blank rows by their line numbers', () => {
    const preview = analyseCsv(wideWeekly);
    const reader = createRowReader(preview);
    expect(reader.push(['Week', 'herb planter box: (US)', 'lantern panel: (US)', 'pumpkin porch sign'], 4)).toEqual([]);
    expect(reader.push(['', '', '', ''], 9)).toEqual([]);
    expect(reader.push(['2024-09-29', '40', '16', '30'], 10)).toHaveLength(3);
  });

  it('keeps a capped list of problems but counts them all', () => {
    const rows = Array.from({ length: 20 }, (_, i) => `2025-01-${String(i + 1).padStart(2, '0')},x`);
    const text = `Day,lantern panel\n2024-12-31,1\n${rows.join('\n')}`;
    const { summary } = stream(text);
    expect(summary.problemCount).toBe(20);
    expect(summary.problems).toHaveLength(4);
    expect(summary.problems[3]).toMatchObject({ code: 'too-many-problems', message: expect.stringContaining('17 more') });
    expect(summary.hasErrors).toBe(true);
  });

  it('uses a later date order choice', () => {
    const text = 'date,lantern panel\n1/5/2025,1\n2/5/2025,2';
    const reader = createRowReader(analyseCsv(text), { dateOrder: 'DMY' });
    expect(reader.push(['2/5/2025', '2'], 3)).toEqual([{ term: 'lantern panel', region: null, date: '2025-05-02', value: 2, belowOne: false }]);
  });

  it('warns when interest leaves the 0–100 range', () => {
    const { summary } = stream('Week,lantern panel\n2025-01-05,140\n2025-01-12,50');
    expect(summary.problems).toEqual([expect.objectContaining({ code: 'out-of-range', row: 2, severity: 'warning' })]);
    expect(summary.hasErrors).toBe(false);
  });
});
