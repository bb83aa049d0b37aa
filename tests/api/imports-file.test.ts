import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import fc from 'fast-check';
import Papa from 'papaparse';
import { lastRecordBreak, streamRowPieces } from '../../server/imports/import-file';

/**
 * The plain definition (RFC 4180 §2): look at every character, flip on each quote, and take the last
 * LF or lone CR outside quotes; a CR at the very end may be half of a CR LF and is not a break.
 */
function lastRecordBreakByEveryCharacter(text: string): { end: number; next: number } | null {
  let isQuoted = false;
  let cut = -1;
  for (let i = 0; i < text.length; i++) {
    const code = text.charCodeAt(i);
    if (code === 34) isQuoted = !isQuoted;
    else if (!isQuoted && (code === 10 || (code === 13 && i + 1 < text.length && text.charCodeAt(i + 1) !== 10))) cut = i;
  }
  if (cut < 0) return null;
  const end = text.charCodeAt(cut) === 10 && text.charCodeAt(cut - 1) === 13 ? cut - 1 : cut;
  return { end, next: cut + 1 };
}

const csvText = fc.stringMatching(/^[a,"\r\n]*$/, { maxLength: 60 });

describe('cutting the upload at record ends', () => {
  it('when any text of cells, quotes, CR and LF is cut, then the break found is the one every character shows', () => {
    fc.assert(fc.property(csvText, (text) => expect(lastRecordBreak(text)).toEqual(lastRecordBreakByEveryCharacter(text))), { numRuns: 5000 });
  });

  it('when quotes hide breaks or a CR LF is split at the end, then those are not cuts', () => {
    expect(lastRecordBreak('a,"b\nc"')).toBeNull();
    expect(lastRecordBreak('a\r')).toBeNull();
    expect(lastRecordBreak('a\r\nb\r')).toEqual({ end: 1, next: 3 });
    expect(lastRecordBreak('a\rb')).toEqual({ end: 1, next: 2 });
    expect(lastRecordBreak('"x""\n"\ny')).toEqual({ end: 6, next: 7 });
  });
});

describe('streaming a file in pieces', () => {
  it('when a CRLF file of quoted breaks spans many 64 KB pieces, then the rows and their lines are those of one whole parse', async () => {
    const lines = ['date,item,quantity'];
    for (let i = 0; i < 30_000; i++) lines.push(i % 7 === 0 ? `2024-01-0${1 + (i % 9)},"Shelf, ""oak""\r\nlong",${i}` : `2024-02-01,Star garland,${i}`);
    const text = lines.join('\r\n') + '\r\n';
    const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'kerfcast-pieces-')), 'pieces.csv');
    fs.writeFileSync(file, text);
    try {
      const streamed: string[][] = [];
      const starts: number[] = [];
      let pieces = 0;
      for await (const rows of streamRowPieces(file, ',')) {
        pieces++;
        for (const row of rows) {
          streamed.push(row.cells);
          starts.push(row.line);
        }
      }
      const whole = Papa.parse<string[]>(text.slice(0, -2), { delimiter: ',' }).data;
      expect(pieces).toBeGreaterThan(2);
      expect(streamed).toEqual(whole);
      // Every seventh data row holds one break inside its quotes, so it takes two lines of the file.
      let line = 1;
      const expected = whole.map((cells) => {
        const start = line;
        line += 1 + cells.filter((cell) => cell.includes('\r\n')).length;
        return start;
      });
      expect(starts).toEqual(expected);
    } finally {
      fs.rmSync(path.dirname(file), { recursive: true, force: true });
    }
  });
});
