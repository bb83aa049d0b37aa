import fc from 'fast-check';
import { parseNumberCell, toCents } from './csv-numbers';

describe('parseNumberCell', () => {
  it.each([
    ['42', '.', 42, null],
    ['  7 ', '.', 7, null],
    ['1,234', '.', 1234, null],
    ['1,234,567.89', '.', 1234567.89, null],
    ['$1,240.00', '.', 1240, 'USD'],
    ['-$24.00', '.', -24, 'USD'],
    ['$-24.00', '.', -24, 'USD'],
    ['(24.00)', '.', -24, null],
    ['€ 12.50', '.', 12.5, 'EUR'],
    ['£3', '.', 3, 'GBP'],
    ['12.50 USD', '.', 12.5, 'USD'],
    ['1.234,50 €', ',', 1234.5, 'EUR'],
    ['12,5', ',', 12.5, null],
    ['-38,50', ',', -38.5, null],
    ['12.5', ',', 12.5, null],
    ['1 234,50', ',', 1234.5, null],
    ['+4', '.', 4, null],
    ['−3', '.', -3, null],
    ['0', '.', 0, null],
    ['-0', '.', 0, null],
  ] as const)('%j with decimal %j', (text, decimal, value, currency) => {
    expect(parseNumberCell(text, decimal)).toEqual({ kind: 'number', value, belowOne: false, currency });
  });

  it('"<1" is 0.5 and flagged', () => {
    expect(parseNumberCell('<1', '.')).toEqual({ kind: 'number', value: 0.5, belowOne: true, currency: null });
    expect(parseNumberCell('< 1', ',')).toMatchObject({ value: 0.5, belowOne: true });
  });

  it('blank is missing, not zero', () => {
    expect(parseNumberCell('', '.')).toEqual({ kind: 'blank' });
    expect(parseNumberCell('   ', ',')).toEqual({ kind: 'blank' });
  });

  it.each(['lots', '1,2,3.4.5', '=1+2', '12abc', '$', '--3', '1e5', 'Infinity', 'NaN', '<2', '1.2.3'])('%j is invalid', (text) => {
    expect(parseNumberCell(text, '.')).toEqual({ kind: 'invalid' });
  });
});

describe('toCents', () => {
  it.each([
    [0.29, 29],
    [1.005, 101],
    [-24, -2400],
    [-0.005, -1],
    [1234.5, 123450],
    [19.99, 1999],
    [0.1 + 0.2, 30],
    [-0, 0],
  ])('%d → %d cents', (value, cents) => {
    expect(toCents(value)).toBe(cents);
  });
});

describe('toCents property', () => {
  it('any whole number of cents written as a decimal comes back exact', () => {
    fc.assert(
      fc.property(fc.integer({ min: -100_000_000_00, max: 100_000_000_00 }), (cents) => {
        const text = `${cents < 0 ? '-' : ''}${Math.floor(Math.abs(cents) / 100)}.${String(Math.abs(cents) % 100).padStart(2, '0')}`;
        const parsed = parseNumberCell(text, '.');
        expect(parsed.kind === 'number' && toCents(parsed.value)).toBe(cents === 0 ? 0 : cents);
      }),
    );
  });
});
