import { analyseCsv } from './analyse-csv';
import { CsvError } from './csv-problem';
import { readCsvText } from './read-csv-text';
import type { CsvProblem } from './csv-types';

function csvErrorOf(run: () => unknown): CsvError {
  try {
    run();
  } catch (error) {
    if (error instanceof CsvError) return error;
    throw error;
  }
  throw new Error('expected a CsvError');
}

const having = (problems: CsvProblem[], code: string) => problems.filter((problem) => problem.code === code);

describe('files that cannot be previewed throw CsvError with a problem', () => {
  it.each([
    ['binary with NUL bytes', 'PK\u0003\u0004\u0000\u0000\u0014\u0000', 'not-csv'],
    ['mostly control characters', '\u0001\u0002\u0003\u0004\u0005\u0006\u0007,\u0008\u000e\u000f', 'not-csv'],
    ['prose, not a table', 'Dear studio\nthis is a letter\nwith no columns at all\n', 'not-csv'],
    ['empty', '', 'empty'],
    ['only a byte-order mark and blank lines', '\ufeff\r\n\r\n  \n', 'empty'],
    ['header only', 'Week,herb planter box,lantern panel\r\n', 'header-only'],
    ['no date column', 'term,score\nlantern panel,4\nherb planter box,6\n', 'no-date-column'],
    ['data on the first row, no header', '2025-01-05,4,5\n2025-01-12,6,7\n', 'no-header'],
  ])('%s', (_, text, code) => {
    const error = csvErrorOf(() => analyseCsv(text));
    expect(error.code).toBe(code);
    expect(error.problems[0]).toMatchObject({ code, row: 1, severity: 'error' });
    expect(error.message.length).toBeGreaterThan(10);
  });

  it('more than 200 columns', () => {
    const header = ['date', ...Array.from({ length: 200 }, (_, i) => `term ${i}`)];
    const row = ['2025-01-05', ...Array.from({ length: 200 }, () => '1')];
    const error = csvErrorOf(() => analyseCsv(`${header.join(',')}\n${row.join(',')}`));
    expect(error.code).toBe('too-many-columns');
    expect(error.message).toContain('201 columns');
  });

  it('exactly 200 columns are fine', () => {
    const header = ['date', ...Array.from({ length: 199 }, (_, i) => `term ${i}`)];
    const row = ['2025-01-05', ...Array.from({ length: 199 }, () => '1')];
    expect(analyseCsv(`${header.join(',')}\n${row.join(',')}`).columns).toHaveLength(200);
  });
});

describe('row problems name the file line and the header cell', () => {
  it('unparseable dates', () => {
    const preview = analyseCsv('Week,lantern panel\n2025-01-05,4\n2025-13-45,5\nsoon,6\n2025-01-19,7');
    expect(having(preview.problems, 'unparseable-date')).toEqual([
      expect.objectContaining({ row: 3, column: 'Week', severity: 'error', message: expect.stringContaining('2025-13-45') }),
      expect.objectContaining({ row: 4, column: 'Week', message: expect.stringContaining('"soon"') }),
    ]);
  });

  it('a date column named in the header whose values are all unreadable', () => {
    const preview = analyseCsv('date,lantern panel\nmonday,4\ntuesday,5');
    expect(having(preview.problems, 'unparseable-date').map((problem) => problem.row)).toEqual([2, 3]);
  });

  it('non-numeric values', () => {
    const preview = analyseCsv('Week,lantern panel,herb planter box\n2025-01-05,4,lots\n2025-01-12,5,6');
    expect(having(preview.problems, 'not-a-number')).toEqual([
      expect.objectContaining({ row: 2, column: 'herb planter box', message: '"lots" in column "herb planter box" is not a number' }),
    ]);
  });

  it('duplicate dates in one series (wide)', () => {
    const preview = analyseCsv('Week,lantern panel\n2025-01-05,4\n2025-01-12,5\n2025-01-05,6');
    expect(having(preview.problems, 'duplicate-date')).toEqual([
      expect.objectContaining({ row: 4, column: 'Week', message: expect.stringContaining('first on row 2') }),
    ]);
  });

  it('duplicate dates in one series (long), while other series may share the date', () => {
    const text = 'date,term,value\n2025-01,lantern panel,4\n2025-01,herb planter box,5\n2025-01,lantern panel,6\n2025-02,lantern panel,7';
    expect(having(analyseCsv(text).problems, 'duplicate-date')).toEqual([
      expect.objectContaining({ row: 4, column: 'date', message: expect.stringContaining('"lantern panel"') }),
    ]);
  });

  it('mixed periods', () => {
    const text = 'Week,lantern panel\n2025-01-05,1\n2025-01-12,2\n2025-01-19,3\n2025-01-20,4\n2025-01-27,5';
    const preview = analyseCsv(text);
    expect(having(preview.problems, 'mixed-period')).toEqual([
      expect.objectContaining({ row: 5, column: 'Week', severity: 'error' }),
    ]);
  });

  it('series of different periods in one long file', () => {
    const text = 'date,term,value\n2025-01-01,a,1\n2025-02-01,a,2\n2025-03-01,a,3\n2025-01-05,b,1\n2025-01-12,b,2\n2025-01-19,b,3';
    const preview = analyseCsv(text);
    expect(preview.period).toBeNull();
    expect(having(preview.problems, 'mixed-period')[0].message).toContain('a: monthly, b: weekly');
  });

  it('gaps in the spacing are a warning, not an error', () => {
    const preview = analyseCsv('Week,lantern panel\n2025-01-05,1\n2025-01-12,2\n2025-02-02,3\n2025-02-09,3');
    expect(having(preview.problems, 'date-gap')).toEqual([expect.objectContaining({ row: 3, severity: 'warning' })]);
    expect(preview.period).toBe('weekly');
  });

  it('a row longer than the header', () => {
    const preview = analyseCsv('Week,lantern panel\n2025-01-05,4\n2025-01-12,5,99\n2025-01-19,6,\n');
    expect(having(preview.problems, 'row-too-long')).toEqual([
      expect.objectContaining({ row: 3, column: null, message: expect.stringContaining('3 cells but the header has 2') }),
    ]);
  });

  it('formula-like text cells are flagged, kept as text and never evaluated', () => {
    const text = [
      'date,item,sku,quantity,revenue,channel',
      '2025-05-01,=HYPERLINK("x"),@SKU,1,10.00,market',
      '2025-05-02,+plaque,LP-1,-3,-30.00,-online',
      '2025-05-03,lantern panel,LP-1,=1+2,10.00,market',
    ].join('\n');
    const result = readCsvText(text);
    const flagged = having(result.summary.problems, 'formula-like').map((problem) => [problem.row, problem.column]);
    expect(flagged).toEqual([[2, 'item'], [2, 'sku'], [3, 'item'], [3, 'channel']]);
    expect(result.records[0]).toMatchObject({ item: '=HYPERLINK("x")', sku: '@SKU' });
    // -3 and -30.00 are a refund, not formulas; "=1+2" is not a number and is not worked out.
    expect(result.records[1]).toMatchObject({ quantity: -3, revenueCents: -3000 });
    expect(result.records).toHaveLength(2);
    expect(having(result.summary.problems, 'not-a-number')[0]).toMatchObject({
      row: 4, column: 'quantity', message: expect.stringContaining('looks like a formula'),
    });
  });

  it('a mapping naming an unknown header cell', () => {
    const preview = analyseCsv('Week,lantern panel\n2025-01-05,4', { mapping: { date: 'Week', terms: ['lantern panels'] } });
    expect(having(preview.problems, 'unknown-column')).toEqual([
      expect.objectContaining({ row: 1, column: 'lantern panels', message: expect.stringContaining('"lantern panels" is not in the header') }),
    ]);
  });

  it('a mapping of the wrong shape', () => {
    const preview = analyseCsv('Week,lantern panel\n2025-01-05,4', { mapping: { date: 'Week', terms: 'lantern panel' } });
    expect(having(preview.problems, 'invalid-mapping')[0].message).toContain('terms');
  });

  it('a sales file missing its revenue column asks for it', () => {
    const preview = analyseCsv('date,item,qty\n2025-05-01,lantern panel,1', { kind: 'sales' });
    expect(having(preview.problems, 'invalid-mapping')[0].message).toBe('No revenue column was recognised: choose it in the mapping');
  });

  it('missing and unreadable sales figures', () => {
    const result = readCsvText('date,item,qty,revenue\n2025-05-01,,1,10\n2025-05-02,lantern panel,,10\n2025-05-03,lantern panel,1,ten');
    expect(result.summary.problems.map((problem) => [problem.code, problem.row, problem.column])).toEqual([
      ['missing-value', 2, 'item'],
      ['missing-value', 3, 'qty'],
      ['not-a-number', 4, 'revenue'],
    ]);
    expect(result.records).toEqual([]);
  });

  it('an unclosed quote', () => {
    const preview = analyseCsv('Week,lantern panel\n2025-01-05,4\n2025-01-12,"5\n');
    expect(having(preview.problems, 'unclosed-quote')).toEqual([expect.objectContaining({ row: 3 })]);
  });
});
