import { formatShort } from '../calendar/calendar-dates';

/** "Sat, Dec 12", with the year when it is not the year of `today` (the studio's): "Sat, Oct 2, 2027". */
export function dayText(date: string, today: string): string {
  return date.slice(0, 4) === today.slice(0, 4) ? formatShort(date) : `${formatShort(date)}, ${date.slice(0, 4)}`;
}
