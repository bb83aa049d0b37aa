import type { Knex } from 'knex';
import type { CustomOccasion } from '@shared/calendar/occasions';
import type { BlackoutsRequest, OccasionSettingsRequest } from '@shared/contracts/markets';
import type { MarketRow } from '../markets/market-repository';

export interface StudioCalendarRow {
  timezone: string;
  country: string;
  region: string | null;
  work_days: string;
  daily_capacity_hours: number;
  holidays_off: boolean;
  back_to_school: string | null;
}

export interface BlackoutRow {
  start: string;
  end: string;
  note: string | null;
}

export interface CalendarSnapshot {
  /**
   * Changes whenever anything the month view shows changes: the rules above, the stored events
   * (write counter and latest change), and the theme and member names the events carry.
   */
  fingerprint: string;
  settings: StudioCalendarRow;
  custom: CustomOccasion[];
  sellWindows: Record<string, number>;
  blackouts: BlackoutRow[];
  markets: MarketRow[];
}

type SnapshotRow = StudioCalendarRow & {
  fingerprint: string;
  events_stamp: number;
  events_touched: string | null;
  names_stamp: string | null;
  custom_json: unknown;
  windows_json: unknown;
  blackouts_json: unknown;
  markets_json: unknown;
};

// Everything rule-based about a studio, and the stamps of what the month view shows besides.
const SNAPSHOT_COLUMNS = `SELECT s.timezone, s.country, s.region, s.work_days, s.daily_capacity_hours, s.holidays_off, s.back_to_school,
  s.events_stamp,
  (SELECT DATE_FORMAT(MAX(e.updated_at), '%Y%m%d%H%i%s%f') FROM events e WHERE e.studio_id = s.id) AS events_touched,
  CONCAT_WS('|',
    (SELECT MD5(GROUP_CONCAT(t.id, ':', t.name ORDER BY t.id SEPARATOR '\n')) FROM themes t WHERE t.studio_id = s.id),
    (SELECT MD5(GROUP_CONCAT(r.id, ':', r.name ORDER BY r.id SEPARATOR '\n')) FROM runways r WHERE r.studio_id = s.id),
    (SELECT MD5(GROUP_CONCAT(u.id, ':', u.name ORDER BY u.id SEPARATOR '\n')) FROM memberships ms JOIN users u ON u.id = ms.user_id
       WHERE ms.studio_id = s.id)) AS names_stamp,
  (SELECT JSON_ARRAYAGG(JSON_OBJECT('occasion_key', o.occasion_key, 'name', o.name, 'rrule', o.rrule, 'start', o.start,
     'dates', o.dates, 'sell_window_days', o.sell_window_days) ORDER BY o.id) FROM studio_occasions o WHERE o.studio_id = s.id) AS custom_json,
  (SELECT JSON_ARRAYAGG(JSON_OBJECT('key', w.occasion_key, 'days', w.days)) FROM studio_sell_windows w WHERE w.studio_id = s.id) AS windows_json,
  (SELECT JSON_ARRAYAGG(JSON_OBJECT('start', b.start, 'end', b.end, 'note', b.note) ORDER BY b.start, b.id)
     FROM studio_blackouts b WHERE b.studio_id = s.id) AS blackouts_json,
  (SELECT JSON_ARRAYAGG(JSON_OBJECT('id', m.id, 'studio_id', m.studio_id, 'name', m.name, 'place', m.place, 'start', m.start,
     'rrule', m.rrule, 'exdates', m.exdates, 'rdates', m.rdates, 'hours', m.hours, 'booth_fee_cents', m.booth_fee_cents,
     'application_deadline', m.application_deadline, 'decision_date', m.decision_date, 'kits_allowed', m.kits_allowed,
     'notes', m.notes, 'version', m.version) ORDER BY m.start, m.id) FROM markets m WHERE m.studio_id = s.id) AS markets_json
FROM studios s WHERE s.id = ?`;

// The fingerprint, worked out by the database over the same columns, so a check that nothing
// changed brings back one short string instead of the whole snapshot.
const FINGERPRINT = `MD5(JSON_ARRAY(c.timezone, c.country, c.region, c.work_days, c.daily_capacity_hours, c.holidays_off,
  c.back_to_school, c.events_stamp, c.events_touched, c.names_stamp, c.custom_json, c.windows_json, c.blackouts_json, c.markets_json))`;

// JSON_ARRAYAGG is built on GROUP_CONCAT, so its length limit is lifted for these statements.
const SNAPSHOT_SQL = `SET STATEMENT group_concat_max_len = 67108864 FOR
SELECT c.*, ${FINGERPRINT} AS fingerprint FROM (${SNAPSHOT_COLUMNS}) c`;
const FINGERPRINT_SQL = `SET STATEMENT group_concat_max_len = 67108864 FOR
SELECT ${FINGERPRINT} AS fingerprint FROM (${SNAPSHOT_COLUMNS}) c`;

interface OccasionRow {
  occasion_key: string;
  name: string;
  rrule: string | null;
  start: string | null;
  dates: string | null;
  sell_window_days: number | null;
}

function toCustom(row: OccasionRow): CustomOccasion {
  const occasion: CustomOccasion = { key: row.occasion_key, name: row.name };
  if (row.rrule) occasion.rrule = row.rrule;
  if (row.start) occasion.start = row.start;
  const dates = row.dates ? (JSON.parse(row.dates) as string[]) : [];
  if (dates.length) occasion.dates = dates;
  if (row.sell_window_days !== null) occasion.sellWindowDays = row.sell_window_days;
  return occasion;
}

export function customKey(occasion: { key?: string; name: string }): string {
  return occasion.key ?? `custom-${occasion.name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '')}`;
}

export class OccasionRepository {
  constructor(private readonly db: Knex) {}

  studioSettings(studioId: number): Promise<StudioCalendarRow | undefined> {
    return this.db('studios')
      .where({ id: studioId })
      .first('timezone', 'country', 'region', 'work_days', 'daily_capacity_hours', 'holidays_off', 'back_to_school');
  }

  /**
   * The studio's calendar rules in one round trip: settings, own occasions, sell windows, blackouts
   * and markets (the month view reads them on every request). Lists come back as JSON arrays.
   */
  async snapshot(studioId: number): Promise<CalendarSnapshot | undefined> {
    const [rows] = await this.db.raw(SNAPSHOT_SQL, [studioId]);
    const row = (rows as SnapshotRow[])[0];
    if (!row) return undefined;
    // The driver may hand JSON columns over parsed already or as text.
    const list = <T>(value: unknown): T[] => (typeof value === 'string' ? (JSON.parse(value) as T[]) : ((value as T[] | null) ?? []));
    const { fingerprint, custom_json, windows_json, blackouts_json, markets_json } = row;
    const { timezone, country, region, work_days, daily_capacity_hours, holidays_off, back_to_school } = row;
    const settings = { timezone, country, region, work_days, daily_capacity_hours, holidays_off, back_to_school };
    return {
      fingerprint,
      settings: { ...settings, holidays_off: Boolean(settings.holidays_off), daily_capacity_hours: Number(settings.daily_capacity_hours) },
      custom: list<OccasionRow>(custom_json).map(toCustom),
      sellWindows: Object.fromEntries(list<{ key: string; days: number }>(windows_json).map((window) => [window.key, window.days])),
      blackouts: list<BlackoutRow>(blackouts_json),
      markets: list<MarketRow>(markets_json).map((market) => ({ ...market, kits_allowed: Boolean(market.kits_allowed) })),
    };
  }

  /** The snapshot's fingerprint alone: what a cache asks before it answers. Null: no such studio. */
  async fingerprint(studioId: number): Promise<string | null> {
    const [rows] = await this.db.raw(FINGERPRINT_SQL, [studioId]);
    return (rows as { fingerprint: string }[])[0]?.fingerprint ?? null;
  }

  blackouts(studioId: number): Promise<BlackoutRow[]> {
    return this.db('studio_blackouts').where({ studio_id: studioId }).orderBy([{ column: 'start' }, { column: 'id' }]).select('start', 'end', 'note');
  }

  /** Replaces all occasion settings in one transaction: nothing partial is stored. */
  async replaceOccasions(studioId: number, settings: OccasionSettingsRequest): Promise<void> {
    await this.db.transaction(async (trx) => {
      await trx('studio_occasions').where({ studio_id: studioId }).delete();
      await trx('studio_sell_windows').where({ studio_id: studioId }).delete();
      if (settings.custom.length) {
        await trx('studio_occasions').insert(
          settings.custom.map((occasion) => ({
            studio_id: studioId,
            occasion_key: customKey(occasion),
            name: occasion.name,
            rrule: occasion.rrule ?? null,
            start: occasion.start ?? null,
            dates: occasion.dates ? JSON.stringify(occasion.dates) : null,
            sell_window_days: occasion.sellWindowDays ?? null,
          })),
        );
      }
      const windows = Object.entries(settings.sellWindows);
      if (windows.length) {
        await trx('studio_sell_windows').insert(windows.map(([key, days]) => ({ studio_id: studioId, occasion_key: key, days })));
      }
      await trx('studios').where({ id: studioId }).update({ back_to_school: settings.backToSchool });
    });
  }

  async replaceBlackouts(studioId: number, request: BlackoutsRequest): Promise<void> {
    await this.db.transaction(async (trx) => {
      await trx('studio_blackouts').where({ studio_id: studioId }).delete();
      if (request.blackouts.length) {
        await trx('studio_blackouts').insert(
          request.blackouts.map((blackout) => ({
            studio_id: studioId,
            start: blackout.start,
            end: blackout.end ?? blackout.start,
            note: blackout.note ?? null,
          })),
        );
      }
    });
  }
}
