import { createLineCounter, detectDelimiter, escapeCsvCell, isBinaryText, isFormulaLike, parseRows, writeCsv } from './csv-text';
import { readCsvText } from './read-csv-text';

const cellsOf = (text: string) => parseRows(text, ',').rows.map((row) => row.cells);

describe('RFC 4180 §2 cases', () => {
  it('rule 6: a quoted field may hold the delimiter', () => {
    expect(cellsOf('a,"b,c",d')).toEqual([['a', 'b,c', 'd']]);
  });

  it('rule 7: a double quote inside a quoted field is written twice', () => {
    expect(cellsOf('"the ""big"" one",2')).toEqual([['the "big" one', '2']]);
  });

  it('rule 6: a quoted field may hold line breaks, and the next row starts on the right line', () => {
    const { rows } = parseRows('name,qty\r\n"line one\r\nline two",1\r\nnext,2', ',');
    expect(rows.map((row) => [row.line, row.cells])).toEqual([
      [1, ['name', 'qty']],
      [2, ['line one\r\nline two', '1']],
      [4, ['next', '2']],
    ]);
  });

  it('rule 1 and 2: CRLF or LF line ends, with or without a final line break', () => {
    const expected = [['a', 'b'], ['1', '2']];
    for (const text of ['a,b\r\n1,2\r\n', 'a,b\n1,2\n', 'a,b\r\n1,2', 'a,b\n1,2']) {
      expect(cellsOf(text).filter((cells) => cells.join('') !== '')).toEqual(expected);
    }
  });

  it('rule 4: spaces are part of a field', () => {
    expect(cellsOf(' a , b ')).toEqual([[' a ', ' b ']]);
  });

  it('rule 5: fields may or may not be quoted', () => {
    expect(cellsOf('"a",b,"c"')).toEqual([['a', 'b', 'c']]);
  });

  it('a whole sales file with quoted names and a multi-line note reads its rows by file line', () => {
    const text = 'date,item,qty,revenue\n2025-05-01,"Lantern panel, ""tall""",1,10\n2025-05-02,"Herb box\nwith note",1,=2\n';
    const result = readCsvText(text);
    expect(result.records[0]).toMatchObject({ item: 'Lantern panel, "tall"' });
    expect(result.summary.problems).toEqual([expect.objectContaining({ code: 'not-a-number', row: 3, column: 'revenue' })]);
  });
});

describe('createLineCounter', () => {
  it('counts blank rows and breaks inside cells', () => {
    const counter = createLineCounter();
    expect([['a'], [''], ['x\ny', 'z\r\nw'], ['b']].map((cells) => counter.next(cells))).toEqual([1, 2, 3, 6]);
  });
});

describe('detectDelimiter', () => {
  it.each([
    ['comma', 'date,a,b\n2025-01-05,1,2', ','],
    ['semicolon with decimal commas', 'date;a;b\n2025-01-05;1,5;2,5\n2025-01-12;3,5;4', ';'],
    ['tab', 'date\ta\n2025-01-05\t1,5', '\t'],
    ['comma with a preamble line', 'Exported; all regions\n\ndate,a\n2025-01-05,1\n2025-01-12,2', ','],
  ])('%s', (_, text, delimiter) => {
    expect(detectDelimiter(text)).toBe(delimiter);
  });
});

describe('isBinaryText', () => {
  it('spots NUL bytes and control-character noise, not ordinary text', () => {
    expect(isBinaryText('a,b\u0000')).toBe(true);
    expect(isBinaryText('\u0001\u0002\u0003a')).toBe(true);
    expect(isBinaryText('\ufffd\ufffd\ufffdab')).toBe(true);
    expect(isBinaryText('date,préféré\tnaïve\r\n')).toBe(false);
  });
});

describe('escapeCsvCell', () => {
  it.each([
    ['=SUM(A1:A9)', "'=SUM(A1:A9)"],
    ['+plaque', "'+plaque"],
    ['-online', "'-online"],
    ['@SKU', "'@SKU"],
    ['\tindent', "'\tindent"],
    ['-3', '-3'],
    ['+4.50', '+4.50'],
    ['lantern panel, tall', '"lantern panel, tall"'],
    ['=1,2', '"\'=1,2"'],
    ['the "big" one', '"the ""big"" one"'],
  ])('%j → %j', (value, escaped) => {
    expect(escapeCsvCell(value)).toBe(escaped);
  });

  it('writes numbers as they are', () => {
    expect(escapeCsvCell(-12.5)).toBe('-12.5');
  });

  it('isFormulaLike leaves plain signed numbers alone', () => {
    expect(['-3', '+1', '-0,5'].map(isFormulaLike)).toEqual([false, false, false]);
    expect(['=A1', '-A1', '@x', '+x'].map(isFormulaLike)).toEqual([true, true, true, true]);
  });
});

describe('writeCsv', () => {
  it('quotes only what RFC 4180 §2 rule 6 requires and ends lines with CRLF', () => {
    expect(writeCsv([['a', 'b,c'], ['d"e', 'f\ng']])).toBe('a,"b,c"\r\n"d""e","f\ng"');
  });
});
