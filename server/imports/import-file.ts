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
 */
export function lastRecordBreak(text: string): { end: number; next: number } | null {
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

/**
 * Streams the parsed rows of a file with their line numbers. The file is read in 256 KB pieces cut
 * at record boundaries, and each piece goes through papaparse whole, so memory stays at one piece
 * and the for-await consumer sets the pace. (Papaparse's own stream modes pause and re-slice their
 * input every few rows, which made a million rows take minutes.)
 */
export async function* streamRows(filePath: string, delimiter: CsvDelimiter): AsyncGenerator<FileRow> {
  const source = fs.createReadStream(filePath, { encoding: 'utf8', highWaterMark: 256 * 1024 });
  const lines = createLineCounter();
  let carry = '';
  let isFirst = true;
  let nextLine = 1;
  const unclosed = (line: number) => {
    const message = `A quoted cell starting on line ${line} is never closed`;
    return new AppError('csv_unclosed_quote', 400, message, [{ row: line, message, path: [] }]);
  };
  const parse = function* (piece: string): Generator<FileRow> {
    if (isFirst) {
      isFirst = false;
      if (piece.charCodeAt(0) === 0xfeff) piece = piece.slice(1);
    }
    // An empty piece is one blank line; papaparse would return no row and the line count would slip.
    const result = piece === '' ? { data: [['']], errors: [] } : Papa.parse<string[]>(piece, { delimiter, skipEmptyLines: false });
    const missing = result.errors.find((error) => error.code === 'MissingQuotes');
    for (const [index, cells] of result.data.entries()) {
      const line = lines.next(cells);
      if (missing && index === missing.row) throw unclosed(line);
      nextLine = line + 1;
      yield { cells, line };
    }
    if (missing) throw unclosed(nextLine);
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
      yield* parse(text.slice(0, cut.end));
    }
    if (carry !== '') yield* parse(carry);
  } finally {
    source.destroy();
  }
}
