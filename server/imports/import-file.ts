import { createHash } from 'node:crypto';
import fs from 'node:fs';
import Papa from 'papaparse';
import { createLineCounter, type CsvDelimiter } from '@shared/csv';
import { AppError } from '../http/app-error';

/** How much of the file the preview's detection reads (the rest is streamed). */
export const headBytes = 64 * 1024;

export async function sha256OfFile(filePath: string): Promise<string> {
  const hash = createHash('sha256');
  for await (const chunk of fs.createReadStream(filePath)) hash.update(chunk as Buffer);
  return hash.digest('hex');
}

/**
 * The first 64 KB as text, and whether that is only the start of the file. A partial head is cut
 * after its last complete record, so a quoted cell cut in two is not taken for an unclosed quote.
 */
export async function readHead(filePath: string): Promise<{ text: string; isPartial: boolean }> {
  const handle = await fs.promises.open(filePath, 'r');
  try {
    const buffer = Buffer.alloc(headBytes + 1);
    const { bytesRead } = await handle.read(buffer, 0, headBytes + 1, 0);
    const isPartial = bytesRead > headBytes;
    const text = buffer.subarray(0, Math.min(bytesRead, headBytes)).toString('utf8');
    const cut = isPartial ? lastRecordBreak(text) : null;
    return { text: cut ? text.slice(0, cut.end) : text, isPartial };
  } finally {
    await handle.close();
  }
}

export interface FileRow {
  cells: string[];
  /** 1-based file line where the row starts. */
  line: number;
}

/**
 * Where the last complete record of `text` ends: the last line break outside quotes (RFC 4180 §2:
 * a break inside a quoted field has an odd number of quotes before it). Returns the end of that
 * record (before CR LF) and where the next one starts, or null when no record is complete yet.
 * A CR at the very end is not taken for a break: it may be the first half of a CR LF cut in two.
 */
export function lastRecordBreak(text: string): { end: number; next: number } | null {
  // Quotes are few beside the other characters, so count them with indexOf (native) rather than
  // look at every character: their parity at the end says whether the tail is inside a quote.
  let quotes = 0;
  for (let at = text.indexOf('"'); at !== -1; at = text.indexOf('"', at + 1)) quotes++;
  // Walk back over the stretches between quotes, outside quotes only, until one holds a break.
  let segmentEnd = text.length;
  let isQuoted = quotes % 2 === 1;
  while (segmentEnd > 0) {
    const quote = text.lastIndexOf('"', segmentEnd - 1);
    const segmentStart = quote + 1;
    if (!isQuoted) {
      const cut = lastBreakIn(text, segmentStart, segmentEnd);
      if (cut >= 0) {
        const end = text.charCodeAt(cut) === 10 && cut > 0 && text.charCodeAt(cut - 1) === 13 ? cut - 1 : cut;
        return { end, next: cut + 1 };
      }
    }
    if (quote === -1) break;
    isQuoted = !isQuoted;
    segmentEnd = quote;
  }
  return null;
}

/** The last LF, or lone CR (one with a character after it that is not LF), in text[start, end). */
function lastBreakIn(text: string, start: number, end: number): number {
  if (end <= start) return -1;
  const lf = text.lastIndexOf('\n', end - 1);
  let cr = text.lastIndexOf('\r', end - 1);
  while (cr >= start && cr > lf && (cr + 1 >= text.length || text.charCodeAt(cr + 1) === 10)) cr = cr === 0 ? -1 : text.lastIndexOf('\r', cr - 1);
  const cut = Math.max(lf, cr);
  return cut >= start ? cut : -1;
}

type LineBreak = '\n' | '\r' | '\r\n';

/**
 * Streams the parsed rows of a file with their line numbers, a piece at a time. The file is read
 * in 64 KB pieces cut at record boundaries, and each piece goes through papaparse whole, so memory
 * stays at one piece and the for-await consumer sets the pace. (Papaparse's own stream modes pause
 * and re-slice their input every few rows, which made a million rows take minutes.) Rows come in
 * arrays, one per piece, so a million rows cost a few thousand awaits rather than a million; the
 * pieces are small so that fewer parsed rows are alive at each young-generation collection (256 KB
 * pieces measured about a fifth slower on the commit).
 */
export async function* streamRowPieces(filePath: string, delimiter: CsvDelimiter): AsyncGenerator<FileRow[]> {
  const source = fs.createReadStream(filePath, { encoding: 'utf8', highWaterMark: 64 * 1024 });
  const lines = createLineCounter();
  let carry = '';
  let isFirst = true;
  let nextLine = 1;
  // Papaparse guesses the line break of every input it is given, by splitting the whole piece on
  // CR and on LF; the first piece's guess is kept for the rest (as one parse of the whole file
  // would, from its first megabyte).
  let newline: LineBreak | undefined;
  const unclosed = (line: number) => {
    const message = `A quoted cell starting on line ${line} is never closed`;
    return new AppError('csv_unclosed_quote', 400, message, [{ row: line, message, path: [] }]);
  };
  const parse = (piece: string): FileRow[] => {
    if (isFirst) {
      isFirst = false;
      if (piece.charCodeAt(0) === 0xfeff) piece = piece.slice(1);
    }
    // An empty piece is one blank line; papaparse would return no row and the line count would slip.
    if (piece === '') {
      const line = lines.next(['']);
      nextLine = line + 1;
      return [{ cells: [''], line }];
    }
    const result = Papa.parse<string[]>(piece, { delimiter, newline, skipEmptyLines: false });
    newline ??= result.meta.linebreak as LineBreak;
    const missing = result.errors.find((error) => error.code === 'MissingQuotes');
    const rows: FileRow[] = new Array(result.data.length);
    for (let index = 0; index < result.data.length; index++) {
      const cells = result.data[index];
      const line = lines.next(cells);
      if (missing && index === missing.row) throw unclosed(line);
      nextLine = line + 1;
      rows[index] = { cells, line };
    }
    if (missing) throw unclosed(nextLine);
    return rows;
  };
  try {
    for await (const chunk of source as AsyncIterable<string>) {
      const text = carry + chunk;
      const cut = lastRecordBreak(text);
      if (cut === null) {
        // No record ends within 8 MB: an unclosed quote has swallowed the rest of the file.
        if (text.length > 8 * 1024 * 1024) throw unclosed(nextLine);
        carry = text;
        continue;
      }
      carry = text.slice(cut.next);
      yield parse(text.slice(0, cut.end));
    }
    if (carry !== '') yield parse(carry);
  } finally {
    source.destroy();
  }
}
