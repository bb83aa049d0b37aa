import type { Knex } from 'knex';
import type { FeedScope, FeedView } from '@shared/contracts/feeds';

export interface FeedRow {
  id: number;
  studio_id: number;
  user_id: number;
  scope: FeedScope;
  include_holidays: boolean;
  created_at: Date;
  rotated_at: Date | null;
  last_fetched_at: Date | null;
}

/** A feed found by its token, with what building it needs; null when revoked, unknown or the member left. */
export interface ResolvedFeed extends FeedRow {
  studio_name: string;
  timezone: string;
  studio_version: number;
  user_name: string;
  /** Count, top id and version sum of the studio's markets: any change to them alters it. */
  markets_touched: Date | null;
  events_touched: Date | null;
}

export function toFeedView(row: FeedRow): FeedView {
  return {
    id: row.id,
    scope: row.scope,
    includeHolidays: Boolean(row.include_holidays),
    createdAt: new Date(row.created_at).toISOString(),
    lastFetchedAt: row.last_fetched_at ? new Date(row.last_fetched_at).toISOString() : null,
  };
}

const FEED_COLUMNS = ['f.id', 'f.studio_id', 'f.user_id', 'f.scope', 'f.include_holidays', 'f.created_at', 'f.rotated_at', 'f.last_fetched_at'];

export class FeedRepository {
  constructor(private readonly db: Knex) {}

  async create(studioId: number, userId: number, scope: FeedScope, includeHolidays: boolean, tokenHash: string): Promise<number> {
    const [id] = await this.db('feeds').insert({ studio_id: studioId, user_id: userId, scope, include_holidays: includeHolidays, token_hash: tokenHash });
    return id;
  }

  list(studioId: number, userId: number): Promise<FeedRow[]> {
    return this.db('feeds as f').where({ 'f.studio_id': studioId, 'f.user_id': userId }).orderBy('f.id').select(FEED_COLUMNS);
  }

  find(studioId: number, feedId: number): Promise<FeedRow | undefined> {
    return this.db('feeds as f').where({ 'f.studio_id': studioId, 'f.id': feedId }).first(FEED_COLUMNS);
  }

  async rotate(studioId: number, feedId: number, tokenHash: string): Promise<void> {
    await this.db('feeds').where({ studio_id: studioId, id: feedId }).update({ token_hash: tokenHash, rotated_at: this.db.fn.now(), last_fetched_at: null });
  }

  delete(studioId: number, feedId: number): Promise<number> {
    return this.db('feeds').where({ studio_id: studioId, id: feedId }).delete();
  }

  /**
   * Joins the membership, so a removed member's feed stops even before its row is gone. One round
   * trip also brings the latest change of markets and events (by the (studio_id, updated_at) index)
   * for Last-Modified; what the ETag needs besides is the calendar's fingerprint.
   */
  byTokenHash(tokenHash: string): Promise<ResolvedFeed | undefined> {
    return this.db('feeds as f')
      .join('memberships as m', (join) => join.on('m.studio_id', 'f.studio_id').andOn('m.user_id', 'f.user_id'))
      .join('studios as s', 's.id', 'f.studio_id')
      .join('users as u', 'u.id', 'f.user_id')
      .where('f.token_hash', tokenHash)
      .first([
        ...FEED_COLUMNS,
        's.name as studio_name',
        's.timezone',
        's.version as studio_version',
        'u.name as user_name',
        this.db.raw('(SELECT MAX(updated_at) FROM markets WHERE studio_id = f.studio_id) as markets_touched'),
        this.db.raw('(SELECT MAX(updated_at) FROM events WHERE studio_id = f.studio_id) as events_touched'),
      ]);
  }

  /** Records a fetch, at most once a minute per feed so revalidations stay cheap. */
  async touch(feedId: number, now: Date): Promise<void> {
    await this.db('feeds')
      .where({ id: feedId })
      .andWhere((where) => where.whereNull('last_fetched_at').orWhere('last_fetched_at', '<', new Date(now.getTime() - 60_000)))
      .update({ last_fetched_at: now });
  }
}
