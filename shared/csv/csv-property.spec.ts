import fc from 'fast-check';
import { analyseCsv } from './analyse-csv';
import { CsvError } from './csv-problem';
import { parseRows, writeCsv } from './csv-text';
import { readCsvText } from './read-csv-text';
import type { CsvDelimiter, InterestPoint } from './csv-types';

// Property tests (fast-check). Cells may hold the delimiter, quotes and line breaks, which the
// writer quotes as RFC 4180 §2 rules 6 and 7 ask; the parser must give back the same table.
const cellText = fc.string({ unit: fc.constantFrom('a', 'b', ' ', ',', ';', '\t', '"', '\n', '\r\n', 'é', '1', '-', '=') });

describe('round trip through writeCsv and parseRows', () => {
  it('any table of two or more columns comes back cell for cell', () => {
    fc.assert(
      fc.property(
        fc.constantFrom<CsvDelimiter>(',', ';', '\t'),
        fc.constantFrom<'\r\n' | '\n'>('\r\n', '\n'),
        fc.integer({ min: 2, max: 6 }).chain((width) =>
          fc.array(fc.array(cellText, { minLength: width, maxLength: width }), { minLength: 1, maxLength: 8 }),
        ),
        (delimiter, lineEnd, table) => {
          const text = writeCsv(table, { delimiter, lineEnd });
          expect(parseRows(text, delimiter).rows.map((row) => row.cells)).toEqual(table);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('a random weekly interest table is detected and read back as the same points', () => {
    const term = fc.stringMatching(/^[a-z][a-z ]{0,14}[a-z]$/);
    const value = fc.oneof(fc.integer({ min: 0, max: 100 }).map(String), fc.constant('<1'), fc.constant(''));
    fc.assert(
      fc.property(
        fc.uniqueArray(term, { minLength: 1, maxLength: 5, selector: (name) => name.trim() }),
        fc.integer({ min: 3, max: 30 }),
        fc.date({ min: new Date('2000-01-01'), max: new Date('2030-01-01'), noInvalidDate: true }),
        fc.constantFrom<CsvDelimiter>(',', ';', '\t'),
        fc.boolean(),
        (terms, weeks, start, delimiter, hasBom) => {
          const dates = Array.from({ length: weeks }, (_, i) => new Date(start.getTime() + i * 7 * 86_400_000).toISOString().slice(0, 10));
          const values = dates.map(() => terms.map(() => fc.sample(value, 1)[0]));
          // The first row must carry a number so the header can be found before the data.
          values[0][0] = '7';
          const table = [['Week', ...terms], ...dates.map((date, i) => [date, ...values[i]])];
          const text = (hasBom ? '\ufeff' : '') + writeCsv(table, { delimiter });
          const result = readCsvText(text);
          expect(result.preview).toMatchObject({ delimiter, layout: 'wide', period: 'weekly', headerRow: 1 });
          const expected: InterestPoint[] = dates.flatMap((date, i) =>
            terms.map((name, j) => {
              const cell = values[i][j];
              return { term: name, region: null, date, value: cell === '' ? null : cell === '<1' ? 0.5 : Number(cell), belowOne: cell === '<1' };
            }),
          );
          expect(result.records).toEqual(expected);
          expect(result.summary.hasErrors).toBe(false);
        },
      ),
      { numRuns: 150 },
    );
  });
});

describe('hostile input never throws past CsvError', () => {
  const attempt = (text: string) => {
    try {
      const result = readCsvText(text);
      expect(Array.isArray(result.summary.problems)).toBe(true);
    } catch (error) {
      if (!(error instanceof CsvError)) throw error;
      expect(error.problems.length).toBeGreaterThan(0);
    }
  };

  it('random bytes decoded as UTF-8', () => {
    const decoder = new TextDecoder('utf-8');
    fc.assert(fc.property(fc.uint8Array({ maxLength: 400 }), (bytes) => attempt(decoder.decode(bytes))), { numRuns: 500 });
  });

  it('random strings', () => {
    fc.assert(fc.property(fc.string({ maxLength: 300, unit: 'binary' }), attempt), { numRuns: 500 });
  });

  it('random CSV-ish text made of dates, numbers and separators', () => {
    const piece = fc.constantFrom('2025-01-05', '1/5/2025', '5.1.2025', '2025-01', '<1', '12', '-3', '$4.50', '1,5', 'week', 'item', 'qty', 'revenue', 'term', 'value', '=A1', '"', ',', ';', '\t', '\n', '\r\n', ' ');
    fc.assert(fc.property(fc.array(piece, { maxLength: 120 }), (pieces) => attempt(pieces.join(''))), { numRuns: 1000 });
  });

  it('random mappings and options', () => {
    fc.assert(
      fc.property(fc.anything(), fc.constantFrom(undefined, 'interest', 'sales'), (mapping, kind) => {
        try {
          analyseCsv('Week,lantern panel\n2025-01-05,4\n2025-01-12,5', { mapping, kind: kind as 'interest' | undefined });
        } catch (error) {
          if (!(error instanceof CsvError)) throw error;
        }
      }),
      { numRuns: 300 },
    );
  });
});
