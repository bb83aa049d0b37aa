import type { Knex } from 'knex';
import type { MarketRequest } from '@shared/contracts/markets';

export interface MarketRow {
  id: number;
  studio_id: number;
  name: string;
  place: string;
  start: string;
  rrule: string | null;
  exdates: string | null;
  rdates: string | null;
  hours: string | null;
  booth_fee_cents: number | null;
  application_deadline: string | null;
  decision_date: string | null;
  kits_allowed: boolean;
  notes: string | null;
  version: number;
}

const COLUMNS = [
  'id',
  'studio_id',
  'name',
  'place',
  'start',
  'rrule',
  'exdates',
  'rdates',
  'hours',
  'booth_fee_cents',
  'application_deadline',
  'decision_date',
  'kits_allowed',
  'notes',
  'version',
];

function toColumns(market: MarketRequest) {
  return {
    name: market.name,
    place: market.place,
    start: market.start,
    rrule: market.rrule ?? null,
    exdates: JSON.stringify(market.exdates ?? []),
    rdates: JSON.stringify(market.rdates ?? []),
    hours: market.hours ?? null,
    booth_fee_cents: market.boothFeeCents ?? null,
    application_deadline: market.applicationDeadline ?? null,
    decision_date: market.decisionDate ?? null,
    kits_allowed: market.kitsAllowed ?? false,
    notes: market.notes ?? null,
  };
}

export class MarketRepository {
  constructor(private readonly db: Knex) {}

  list(studioId: number): Promise<MarketRow[]> {
    return this.db<MarketRow>('markets').where({ studio_id: studioId }).orderBy([{ column: 'start' }, { column: 'id' }]).select(COLUMNS);
  }

  find(studioId: number, id: number): Promise<MarketRow | undefined> {
    return this.db<MarketRow>('markets').where({ studio_id: studioId, id }).first(COLUMNS);
  }

  async insert(studioId: number, market: MarketRequest): Promise<number> {
    const [id] = await this.db('markets').insert({ studio_id: studioId, ...toColumns(market) });
    return id;
  }

  /** Returns how many rows changed: 0 means gone or a stale version. */
  update(studioId: number, id: number, market: MarketRequest, version: number | undefined): Promise<number> {
    const query = this.db('markets').where({ studio_id: studioId, id });
    if (version !== undefined) query.andWhere({ version });
    return query.update({ ...toColumns(market), version: this.db.raw('version + 1'), updated_at: this.db.fn.now() });
  }

  delete(studioId: number, id: number): Promise<number> {
    return this.db('markets').where({ studio_id: studioId, id }).delete();
  }
}
