import type { Knex } from 'knex';
import type { MarketRequest, MarketView } from '@shared/contracts/markets';
import { addDays, yearOf } from '@shared/calendar/dates';
import { expandRecurrence } from '@shared/calendar/recurrence';
import { AppError, notFound } from '../http/app-error';
import type { StudioContext } from '../http/auth-middleware';
import { todayIn } from '../occasions/studio-today';
import { MarketRepository, type MarketRow } from './market-repository';

export function parseDates(text: string | null): string[] {
  if (!text) return [];
  const parsed: unknown = JSON.parse(text);
  return Array.isArray(parsed) ? parsed.map(String) : [];
}

// A market's dates depend only on its rule text, so they are cached per rule and year: rrule walks
// from the start date on every expansion, and the month view asks for every market each time.
// Keyed by content, never by id, so an edited market can never read stale dates.
const yearCache = new Map<string, string[]>();
const MAX_CACHED_YEARS = 20_000;

/** The dates of a stored market between two dates, both included. */
export function marketDates(row: MarketRow, from: string, to: string): string[] {
  const key = `${row.start}|${row.rrule ?? ''}|${row.exdates ?? ''}|${row.rdates ?? ''}`;
  const dates: string[] = [];
  for (let year = yearOf(from); year <= yearOf(to); year++) {
    const id = `${key}|${year}`;
    let yearDates = yearCache.get(id);
    if (!yearDates) {
      const recurrence = { start: row.start, rrule: row.rrule ?? undefined, exdates: parseDates(row.exdates), rdates: parseDates(row.rdates) };
      yearDates = expandRecurrence(recurrence, `${year}-01-01`, `${year}-12-31`);
      if (yearCache.size >= MAX_CACHED_YEARS) yearCache.clear();
      yearCache.set(id, yearDates);
    }
    for (const date of yearDates) if (date >= from && date <= to) dates.push(date);
  }
  return dates;
}

export function toMarketView(row: MarketRow, today: string): MarketView {
  return {
    id: row.id,
    name: row.name,
    place: row.place,
    start: row.start,
    rrule: row.rrule,
    exdates: parseDates(row.exdates),
    rdates: parseDates(row.rdates),
    hours: row.hours,
    boothFeeCents: row.booth_fee_cents === null ? null : Number(row.booth_fee_cents),
    applicationDeadline: row.application_deadline,
    decisionDate: row.decision_date,
    kitsAllowed: Boolean(row.kits_allowed),
    notes: row.notes,
    version: row.version,
    nextDates: marketDates(row, today, addDays(today, 2 * 366)).slice(0, 5),
  };
}

export class MarketService {
  private readonly markets: MarketRepository;

  constructor(private readonly db: Knex) {
    this.markets = new MarketRepository(db);
  }

  async list(studio: StudioContext): Promise<MarketView[]> {
    const today = await todayIn(this.db, studio.id);
    return (await this.markets.list(studio.id)).map((row) => toMarketView(row, today));
  }

  async get(studio: StudioContext, id: number): Promise<MarketView> {
    const row = await this.markets.find(studio.id, id);
    if (!row) throw notFound(`Market ${id}`);
    return toMarketView(row, await todayIn(this.db, studio.id));
  }

  async create(studio: StudioContext, market: MarketRequest): Promise<MarketView> {
    const id = await this.markets.insert(studio.id, market);
    return this.get(studio, id);
  }

  async update(studio: StudioContext, id: number, market: MarketRequest & { version?: number }): Promise<MarketView> {
    const { version, ...fields } = market;
    const changed = await this.markets.update(studio.id, id, fields, version);
    if (changed === 0) {
      const current = await this.markets.find(studio.id, id);
      if (!current) throw notFound(`Market ${id}`);
      throw new AppError('version_conflict', 409, 'Someone else changed this market; reload and try again', undefined, {
        current: toMarketView(current, await todayIn(this.db, studio.id)),
      });
    }
    return this.get(studio, id);
  }

  async remove(studio: StudioContext, id: number): Promise<void> {
    if ((await this.markets.delete(studio.id, id)) === 0) throw notFound(`Market ${id}`);
  }
}
