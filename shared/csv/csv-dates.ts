import type { DateFormat, DateOrder } from './csv-types';

const isoDay = /^(\d{4})-(\d{1,2})-(\d{1,2})$/;
const isoMonth = /^(\d{4})-(\d{1,2})$/;
const slashed = /^(\d{1,2})\/(\d{1,2})\/(\d{4})$/;
const dotted = /^(\d{1,2})\.(\d{1,2})\.(\d{4})$/;

export interface DateFormatGuess {
  format: DateFormat;
  /** Whether the slash dates seen fit both M/D/YYYY and D/M/YYYY. */
  isAmbiguous: boolean;
}

function daysInMonth(year: number, month: number): number {
  // Day 0 of the next month is the last day of this one; UTC keeps time zones out of it.
  return new Date(Date.UTC(year, month, 0)).getUTCDate();
}

function toIso(year: number, month: number, day: number): string | null {
  if (year < 1000 || month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month)) {
    return null;
  }
  return `${year}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
}

/** Reads one date cell in a known format; null when it is not a real calendar date in that format. */
export function parseDateCell(text: string, format: DateFormat): string | null {
  const value = text.trim();
  let match: RegExpExecArray | null;
  switch (format) {
    case 'YYYY-MM-DD':
      match = isoDay.exec(value);
      return match ? toIso(+match[1], +match[2], +match[3]) : null;
    case 'YYYY-MM':
      match = isoMonth.exec(value);
      return match ? toIso(+match[1], +match[2], 1) : null;
    case 'M/D/YYYY':
      match = slashed.exec(value);
      return match ? toIso(+match[3], +match[1], +match[2]) : null;
    case 'D/M/YYYY':
      match = slashed.exec(value);
      return match ? toIso(+match[3], +match[2], +match[1]) : null;
    case 'D.M.YYYY':
      match = dotted.exec(value);
      return match ? toIso(+match[3], +match[2], +match[1]) : null;
  }
}

/** Whether a cell is a date in any accepted format (used to find where the data starts). */
export function looksLikeDate(text: string): boolean {
  const formats: DateFormat[] = ['YYYY-MM-DD', 'YYYY-MM', 'M/D/YYYY', 'D/M/YYYY', 'D.M.YYYY'];
  return formats.some((format) => parseDateCell(text, format) !== null);
}

/**
 * Picks the format that reads the most cells. Slash dates are M/D unless a first part exceeds 12
 * (or `dateOrder` says otherwise); when every part is 12 or less the guess is flagged ambiguous so
 * the preview can ask. Dotted dates are always day first, as in the regions that write them.
 */
export function detectDateFormat(
  cells: readonly string[],
  dateOrder?: DateOrder,
): DateFormatGuess | null {
  const values = cells.map((cell) => cell.trim()).filter((cell) => cell !== '');
  if (values.length === 0) return null;
  const counts = new Map<DateFormat, number>();
  const count = (format: DateFormat) =>
    values.filter((value) => parseDateCell(value, format) !== null).length;
  for (const format of ['YYYY-MM-DD', 'YYYY-MM', 'D.M.YYYY'] as const) {
    counts.set(format, count(format));
  }
  const monthFirst = count('M/D/YYYY');
  const dayFirst = count('D/M/YYYY');
  let slashFormat: DateFormat = 'M/D/YYYY';
  let isAmbiguous = false;
  if (dateOrder) {
    slashFormat = dateOrder === 'DMY' ? 'D/M/YYYY' : 'M/D/YYYY';
  } else if (dayFirst > monthFirst) {
    slashFormat = 'D/M/YYYY';
  } else if (monthFirst === dayFirst && monthFirst > 0) {
    isAmbiguous = true;
  }
  counts.set(slashFormat, slashFormat === 'M/D/YYYY' ? monthFirst : dayFirst);
  let best: DateFormat | null = null;
  let bestCount = 0;
  for (const [format, hits] of counts) {
    if (hits > bestCount) {
      best = format;
      bestCount = hits;
    }
  }
  if (!best) return null;
  return { format: best, isAmbiguous: isAmbiguous && best === slashFormat };
}

/** Whole days from one ISO date to another. */
export function daysBetween(fromIso: string, toIsoDate: string): number {
  return Math.round((Date.parse(toIsoDate) - Date.parse(fromIso)) / 86_400_000);
}
