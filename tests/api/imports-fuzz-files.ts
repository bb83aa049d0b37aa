// Generated CSV files for the import fuzz test (imports-fuzz.test.ts): each file is sound, or
// sound with a tenth of its cells swapped for cells clients send that the database cannot take.
import fc from 'fast-check';
import { writeCsv } from '@shared/csv/csv-text';
import type { CsvDelimiter } from '@shared/csv/csv-types';

export interface FuzzFile {
  kind: 'sales' | 'interest';
  text: string;
  /** The header cells as written. */
  header: string[];
  /** Lines of the file, which every problem's row must fall within. */
  lines: number;
}

const long = (char: string, length: number) => char.repeat(length);

/** A sound cell nine times in ten, a hostile one otherwise; a clean file has sound cells only. */
function cell(isClean: boolean, sound: readonly string[], hostile: readonly string[]): fc.Arbitrary<string> {
  if (isClean) return fc.constantFrom(...sound);
  return fc.oneof({ arbitrary: fc.constantFrom(...sound), weight: 9 }, { arbitrary: fc.constantFrom(...hostile), weight: 1 });
}

const isoDay = (from: string, to: string) =>
  fc.date({ min: new Date(`${from}T00:00:00Z`), max: new Date(`${to}T00:00:00Z`), noInvalidDate: true }).map((date) => date.toISOString().slice(0, 10));

const badDates = ['1989-12-31', '2027-03-16', '9999-12-31', '1000-01-01', 'soon', '2025-13-45', ''];
const badNumbers = ['99999999999999999999', long('9', 400), 'lots', '=1+2', '1e5', ''];

function salesRow(isClean: boolean): fc.Arbitrary<string[]> {
  const date = isClean ? isoDay('2020-01-01', '2026-03-01') : fc.oneof({ arbitrary: isoDay('1990-01-01', '2027-03-15'), weight: 9 }, { arbitrary: fc.constantFrom(...badDates), weight: 1 });
  return fc.tuple(
    date,
    cell(isClean, ['Oak tray', 'Birch tray', 'The "Big" planter', 'Shelf, walnut', 'Line\nbreak sign', '🪵 log stool', '=SUM(A1)', long('w', 200), long('🪵', 200)], ['', long('w', 201), long('w', 10_001), long('🪵', 201)]),
    cell(isClean, ['', 'OAK-1', long('K', 64)], [long('K', 65), long('k', 3000)]),
    cell(isClean, ['1', '2', '-1', '0', '12', '1.5', '2147483647', '-2147483647'], [...badNumbers, '2147483648', '-2147483649']),
    cell(isClean, ['10.00', '24.5', '-24.00', '$1,240.00', '(4.00)', '0', '90071992547409.91'], [...badNumbers, '90071992547409.93']),
    cell(isClean, ['market', 'online', 'Craft fair', 'zeppelin cart', ''], [long('c', 5000)]),
  );
}

const salesFile = (isClean: boolean) =>
  fc.record({
    rows: fc.array(salesRow(isClean), { minLength: 1, maxLength: 12 }),
    // Now and then enough sound rows to pass the 64 KB the preview detects from, so the rest is streamed.
    bulk: fc.constantFrom(0, 0, 0, 0, 0, 0, 0, 0, 0, 1800),
  }).map(({ rows, bulk }) => {
    const filler = Array.from({ length: bulk }, (_, i) => [`2025-0${1 + (i % 9)}-1${i % 10}`, `Oak tray ${i % 40}`, '', '1', '10.00', 'market']);
    return { header: ['date', 'item', 'sku', 'quantity', 'revenue', 'channel'], rows: [...rows, ...filler] };
  });

const terms = ['oak tray', 'birch tray', 'pine stool', 'ash ladder'];
const badTerms = [long('t', 201), long('t', 5000)];
const interestValue = (isClean: boolean) => cell(isClean, ['0', '7', '55', '100', '<1', '', '250', '-5', '0.000001'], [long('9', 300), long('9', 400), 'lots', '1e5', '=A1']);

function weeks(count: number): string[] {
  return Array.from({ length: count }, (_, i) => new Date(Date.UTC(2024, 0, 7 + 7 * i)).toISOString().slice(0, 10));
}

/** Wide: one date column of evenly spaced weeks, one column per term (some with a region). */
const wideFile = (isClean: boolean) =>
  fc.record({
    columns: fc.uniqueArray(fc.constantFrom(...terms, 'oak tray: (north)', 'pine stool: (coast)'), { minLength: 1, maxLength: 4 }),
    badColumn: isClean ? fc.constant(null) : fc.constantFrom(null, null, null, `oak tray: (${long('R', 65)})`, ...badTerms),
    count: fc.integer({ min: 2, max: 10 }),
  }).chain(({ columns, badColumn, count }) => {
    const header = ['Week', ...columns, ...(badColumn ? [badColumn] : [])];
    const dates = weeks(count).map((date) => (isClean ? fc.constant(date) : cell(false, [date], badDates)));
    const rows = fc.tuple(...dates.map((date) => fc.tuple(date, ...header.slice(1).map(() => interestValue(isClean)))));
    return rows.map((cells) => ({ header, rows: cells as string[][] }));
  });

/** Long: a row per month and term, each series on the same months. */
const longFile = (isClean: boolean) =>
  fc.record({
    series: fc.uniqueArray(fc.tuple(cell(isClean, terms, badTerms), cell(isClean, ['', 'north', 'coast'], [long('R', 65)])), {
      minLength: 1,
      maxLength: 3,
      selector: ([term, region]) => `${term}|${region}`,
    }),
    count: fc.integer({ min: 2, max: 8 }),
  }).chain(({ series, count }) => {
    const months = Array.from({ length: count }, (_, i) => `2024-${String(i + 1).padStart(2, '0')}`);
    const rows = series.flatMap(([term, region]) => months.map((month) => fc.tuple(cell(isClean, [month], badDates), fc.constant(term), fc.constant(region), interestValue(isClean))));
    return fc.tuple(...rows).map((cells) => ({ header: ['month', 'term', 'region', 'value'], rows: cells as string[][] }));
  });

/** Whole-row trouble now and then: a row longer than the header, a blank line, a quote never closed. */
const tail = fc.constantFrom<string[][]>([], [], [], [], [], [], [['2025-01-05', 'x', 'x', 'x', 'x', 'x', 'x', 'extra']], [['']], [['"never closed']]);

export const aFile: fc.Arbitrary<FuzzFile> = fc
  .record({
    isClean: fc.boolean(),
    kind: fc.constantFrom('sales', 'sales', 'wide', 'long'),
    delimiter: fc.constantFrom<CsvDelimiter>(',', ',', ';', '\t'),
    lineEnd: fc.constantFrom<'\n' | '\r\n'>('\n', '\r\n'),
    hasBom: fc.boolean(),
  })
  .chain((shape) => {
    const table = shape.kind === 'sales' ? salesFile(shape.isClean) : shape.kind === 'wide' ? wideFile(shape.isClean) : longFile(shape.isClean);
    return fc.tuple(fc.constant(shape), table, shape.isClean ? fc.constant([]) : tail);
  })
  .map(([shape, table, extra]) => {
    const body = writeCsv([table.header, ...table.rows, ...extra], { delimiter: shape.delimiter, lineEnd: shape.lineEnd });
    const text = (shape.hasBom ? '\ufeff' : '') + body.replace('"""never closed"', '"never closed');
    return {
      kind: shape.kind === 'sales' ? 'sales' : 'interest',
      text,
      header: table.header,
      lines: text.split(/\r\n|\r|\n/).length,
    } as FuzzFile;
  });
