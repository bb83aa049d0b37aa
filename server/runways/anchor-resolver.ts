import { addDays, isIsoDate, type IsoDate } from '@shared/calendar/dates';
import type { AnchorKind } from '@shared/contracts/runways';
import { AppError } from '../http/app-error';
import { marketDates } from '../markets/market-service';
import { holidaysOf, occasionsOf, type StudioCalendar } from '../occasions/studio-calendar';
import type { RunwayRepository } from './runway-repository';

export interface ResolvedAnchor {
  date: IsoDate;
  /** A theme's own offset, used when the request gives none. */
  offsetDays?: number;
  themeId?: number;
}

// How far ahead a bare key ("mothers-day") looks for its next date.
const LOOKAHEAD_DAYS = 2 * 366;

function badAnchor(message: string): AppError {
  return new AppError('invalid_input', 400, `anchor.value: ${message}`, [{ path: ['anchor', 'value'], message }]);
}

/** "key" or "key:YYYY-MM-DD" → the key and the date asked for (if any). */
function splitValue(value: string): { key: string; date?: IsoDate } {
  const match = /^(.+):(\d{4}-\d{2}-\d{2})$/.exec(value);
  if (!match) return { key: value };
  if (!isIsoDate(match[2])) throw badAnchor(`${match[2]} is not a real date`);
  return { key: match[1], date: match[2] };
}

/** Finds the date of an anchor: a date, a holiday, an occasion, a market day or a theme's target. */
export async function resolveAnchor(
  calendar: StudioCalendar,
  runways: RunwayRepository,
  kind: AnchorKind,
  value: string,
  depth = 0,
): Promise<ResolvedAnchor> {
  const { key, date } = splitValue(value);
  const from = date ?? calendar.today;
  const to = date ?? addDays(calendar.today, LOOKAHEAD_DAYS);
  switch (kind) {
    case 'date':
      if (!isIsoDate(value)) throw badAnchor(`"${value}" is not a date as YYYY-MM-DD`);
      return { date: value };
    case 'holiday': {
      const found = holidaysOf(calendar, from, to).find((holiday) => holiday.key === key);
      if (!found) throw badAnchor(`no public holiday "${key}" ${date ? `on ${date}` : 'in the next two years'} for this studio's country`);
      return { date: found.date };
    }
    case 'occasion': {
      const found = occasionsOf(calendar, from, to).find((occasion) => occasion.key === key);
      if (!found) throw badAnchor(`no occasion "${key}" ${date ? `on ${date}` : 'in the next two years'}`);
      return { date: found.date };
    }
    case 'market': {
      const market = calendar.markets.find((row) => String(row.id) === key);
      if (!market) throw badAnchor(`no market with id ${key} in this studio`);
      const next = marketDates(market, from, to)[0];
      if (!next) throw badAnchor(`${market.name} has no day ${date ? `on ${date}` : 'in the next two years'}`);
      return { date: next };
    }
    case 'theme': {
      const id = Number(key);
      const theme = Number.isInteger(id) && id > 0 ? await runways.theme(calendar.studioId, id) : undefined;
      if (!theme) throw badAnchor(`no theme with id ${key} in this studio`);
      const base = { offsetDays: theme.offset_days, themeId: theme.id };
      if (theme.target_date) return { ...base, date: theme.target_date };
      const { target_kind: targetKind, target_value: targetValue } = theme;
      if (targetKind === 'month' && targetValue && isIsoDate(`${targetValue}-01`)) return { ...base, date: `${targetValue}-01` };
      if (targetValue && depth === 0 && (targetKind === 'holiday' || targetKind === 'occasion' || targetKind === 'market' || targetKind === 'date')) {
        return { ...base, date: (await resolveAnchor(calendar, runways, targetKind, targetValue, depth + 1)).date };
      }
      throw badAnchor(`theme ${theme.name} has no target date yet`);
    }
  }
}
