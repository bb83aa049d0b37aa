import { addYears, format } from 'date-fns';
import fc from 'fast-check';
import { analyseCsv } from './analyse-csv';
import { characterCount, fitsLength, importLimits, quoteCell, salesDateWindow } from './csv-limits';
import { CsvError } from './csv-problem';
import { readCsvText } from './read-csv-text';
import type { CsvProblem, InterestPoint, SaleRecord } from './csv-types';

const salesHeader = 'date,item,sku,quantity,revenue';
const sales = (...rows: string[]) => {
  const result = readCsvText([salesHeader, ...rows].join('\n'), { today: '2026-03-15' });
  return { summary: result.summary, records: result.records as SaleRecord[] };
};
const errors = (problems: CsvProblem[]) => problems.filter((problem) => problem.severity === 'error');

describe('characterCount', () => {
  it('when any string is counted, then it matches the code points of the ECMAScript string iterator', () => {
    // Outside source: ECMAScript String.prototype[Symbol.iterator] yields code points (a lone surrogate alone).
    fc.assert(fc.property(fc.string({ unit: 'binary', maxLength: 60 }), (text) => expect(characterCount(text)).toBe(Array.from(text).length)), {
      numRuns: 2000,
    });
  });

  it('when a text holds emoji, then each counts once, as utf8mb4 VARCHAR counts it', () => {
    expect('🪵'.length).toBe(2);
    expect(characterCount('🪵'.repeat(200))).toBe(200);
    expect(fitsLength('🪵'.repeat(200), 200)).toBe(true);
    expect(fitsLength('🪵'.repeat(201), 200)).toBe(false);
    expect(fitsLength('x'.repeat(200), 200)).toBe(true);
  });
});

describe('salesDateWindow', () => {
  it.each(['2026-03-15', '2028-02-29', '2027-12-31', '2024-01-01'])('when today is %s, then the window ends on the day date-fns puts a year later', (today) => {
    // Outside source: date-fns 4 addYears, which takes 29 February to 28 February.
    const [year, month, day] = today.split('-').map(Number);
    expect(salesDateWindow(today)).toEqual({ first: '1990-01-01', last: format(addYears(new Date(year, month - 1, day), 1), 'yyyy-MM-dd') });
  });

  it('when today is not known, then only the start applies', () => {
    expect(salesDateWindow(undefined)).toEqual({ first: '1990-01-01', last: null });
  });
});

describe('quoteCell', () => {
  it('when a cell is long, then messages show its start and its length only', () => {
    expect(quoteCell('walnut')).toBe('"walnut"');
    expect(quoteCell('x'.repeat(10_001))).toBe(`"${'x'.repeat(40)}…" (10,001 characters)`);
  });
});

describe('sales rows the database could not hold are problems by row and column', () => {
  it.each([
    ['a quantity past INT', '2025-01-05,Oak tray,,99999999999999999999,1.00', 'out-of-range', 'quantity'],
    ['a quantity one past INT', '2025-01-05,Oak tray,,2147483648,1.00', 'out-of-range', 'quantity'],
    ['revenue past exact cents', '2025-01-05,Oak tray,,1,99999999999999999999', 'out-of-range', 'revenue'],
    ['a number too large for a double', `2025-01-05,Oak tray,,1,${'9'.repeat(400)}`, 'out-of-range', 'revenue'],
    ['an item of 10,001 characters', `2025-01-05,${'y'.repeat(10_001)},,1,1.00`, 'too-long', 'item'],
    ['an item of 201 characters', `2025-01-05,${'y'.repeat(201)},,1,1.00`, 'too-long', 'item'],
    ['a SKU of 65 characters', `2025-01-05,Oak tray,${'K'.repeat(65)},1,1.00`, 'too-long', 'sku'],
    ['a date before 1990', '1989-12-31,Oak tray,,1,1.00', 'out-of-range', 'date'],
    ['a date more than a year ahead', '2027-03-16,Oak tray,,1,1.00', 'out-of-range', 'date'],
  ])('when a row has %s, then it is an error on its row and column and no record is made', (_, row, code, column) => {
    const result = sales('2025-01-04,Oak tray,,1,1.00', row);
    expect(errors(result.summary.problems)).toEqual([expect.objectContaining({ code, row: 3, column, severity: 'error' })]);
    expect(result.records).toHaveLength(1);
    expect(result.summary.problems[0].message.length).toBeLessThan(200);
  });

  it('when values sit exactly at the limits, then they are read', () => {
    const result = sales(`1990-01-01,${'🪵'.repeat(200)},${'K'.repeat(64)},2147483647,1000000000.00`, '2027-03-15,Oak tray,,-2147483647,-5.00');
    expect(errors(result.summary.problems)).toEqual([]);
    expect(result.records.map((sale) => [sale.date, sale.quantity, sale.revenueCents])).toEqual([
      ['1990-01-01', importLimits.quantity, 100_000_000_000],
      ['2027-03-15', -importLimits.quantity, -500],
    ]);
  });

  it('when rows have negative quantities, then they are read as returns and the preview counts them', () => {
    const text = [salesHeader, '2025-01-05,Oak tray,,3,30.00', '2025-01-06,Oak tray,,-1,-10.00', '2025-01-07,Oak tray,,-2,-20.00'].join('\n');
    expect(analyseCsv(text, { today: '2026-03-15' })).toMatchObject({ returnRows: 2, problems: [] });
    expect((readCsvText(text).records as SaleRecord[]).map((sale) => sale.quantity)).toEqual([3, -1, -2]);
  });
});

describe('search interest the database could not hold', () => {
  it('when a long file has a term of 5,000 characters or a region of 65, then both are errors naming row and column', () => {
    const text = `month,term,region,value\n2025-01,oak tray,US,3\n2025-02,${'t'.repeat(5000)},US,4\n2025-03,oak tray,${'R'.repeat(65)},5`;
    const preview = analyseCsv(text);
    expect(errors(preview.problems)).toEqual([
      expect.objectContaining({ code: 'too-long', row: 3, column: 'term' }),
      expect.objectContaining({ code: 'too-long', row: 4, column: 'region' }),
    ]);
  });

  it('when a wide header names a region of 65 characters, then that column is an error on the header row and is not read', () => {
    const column = `oak tray: (${'R'.repeat(65)})`;
    const result = readCsvText(`Week,${column},birch tray\n2025-01-05,4,5\n2025-01-12,6,7`);
    expect(errors(result.summary.problems)).toEqual([expect.objectContaining({ code: 'too-long', row: 1, column })]);
    expect(new Set((result.records as InterestPoint[]).map((point) => point.term))).toEqual(new Set(['birch tray']));
  });

  it.each([
    ['400 digits', '9'.repeat(400)],
    ['300 digits', '9'.repeat(300)],
    ['one past a billion', '1000000001'],
  ])('when a value has %s, then it is an error naming row and column', (_, value) => {
    const preview = analyseCsv(`Week,oak tray\n2025-01-05,4\n2025-01-12,${value}\n2025-01-19,5`);
    expect(errors(preview.problems)).toEqual([expect.objectContaining({ code: 'out-of-range', row: 3, column: 'oak tray' })]);
  });

  it('when a value is a billion, then it is kept with the warning of any value past 100', () => {
    const preview = analyseCsv('Week,oak tray\n2025-01-05,4\n2025-01-12,1000000000\n2025-01-19,5');
    expect(preview.problems).toEqual([expect.objectContaining({ code: 'out-of-range', row: 3, severity: 'warning' })]);
  });

  it('when a header cell is longer than a column name may be, then no preview is made and the error names it', () => {
    const long = 'h'.repeat(importLimits.columnNameLength + 1);
    let error: unknown;
    try {
      analyseCsv(`Week,${long}\n2025-01-05,4`);
    } catch (caught) {
      error = caught;
    }
    expect(error).toBeInstanceOf(CsvError);
    expect((error as CsvError).problems).toEqual([expect.objectContaining({ code: 'too-long', row: 1, column: long })]);
  });
});
