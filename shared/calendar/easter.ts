import { makeDate, type IsoDate } from './dates';

/**
 * Western (Gregorian) Easter Sunday by the anonymous Gregorian computus (Meeus/Jones/Butcher).
 * rrule has no BYEASTER part in JavaScript, so Easter-based days are computed here.
 */
export function easterSunday(year: number): IsoDate {
  if (!Number.isInteger(year) || year < 1583) {
    throw new RangeError(`Gregorian Easter is defined from 1583 on, got ${year}`);
  }
  const golden = year % 19;
  const century = Math.floor(year / 100);
  const yearOfCentury = year % 100;
  const leapCenturies = Math.floor(century / 4);
  const centuryRemainder = century % 4;
  const lunarCorrection = Math.floor((century + 8) / 25);
  const solarCorrection = Math.floor((century - lunarCorrection + 1) / 3);
  const epact = (19 * golden + century - leapCenturies - solarCorrection + 15) % 30;
  const leapYears = Math.floor(yearOfCentury / 4);
  const yearRemainder = yearOfCentury % 4;
  const weekdayOffset = (32 + 2 * centuryRemainder + 2 * leapYears - epact - yearRemainder) % 7;
  const correction = Math.floor((golden + 11 * epact + 22 * weekdayOffset) / 451);
  const monthDay = epact + weekdayOffset - 7 * correction + 114;
  return makeDate(year, Math.floor(monthDay / 31), (monthDay % 31) + 1);
}
