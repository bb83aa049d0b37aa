import { appClock, type Clock } from '../clock/clock';
import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import type { FeedRequest, FeedView, NewFeed } from '@shared/contracts/feeds';
import { hashToken, newToken } from '../account/tokens';
import { EventRepository } from '../events/event-repository';
import { ruleEvents } from '../events/event-service';
import { toCalendarEvent } from '../events/event-views';
import { forbidden, notFound } from '../http/app-error';
import type { SessionUser, StudioContext } from '../http/auth-middleware';
import { OccasionRepository } from '../occasions/occasion-repository';
import { loadStudioCalendar } from '../occasions/studio-calendar';
import { buildFeed, type FeedItem } from './feed-builder';
import { extraMarketDays, marketItem, ruleItem, stepItem, windowOf, type ItemContext } from './feed-items';
import { FeedRepository, toFeedView, type ResolvedFeed } from './feed-repository';

/** Calendar apps are asked to refetch hourly. */
export const REFRESH_SECONDS = 3600;

export interface FeedValidators {
  feed: ResolvedFeed;
  etag: string;
  lastModified: Date;
  today: string;
}

const studioOfToken = new Map<string, number>();

const scopeNames = { all: 'all work', mine: 'my steps', markets: 'markets and deadlines' } as const;

export class FeedService {
  private readonly feeds: FeedRepository;
  private readonly events: EventRepository;
  private readonly rules: OccasionRepository;
  private readonly uidHost: string;

  constructor(
    private readonly db: Knex,
    private readonly publicUrl: string,
    private readonly clock: Clock = appClock,
  ) {
    this.feeds = new FeedRepository(db);
    this.events = new EventRepository(db);
    this.rules = new OccasionRepository(db);
    this.uidHost = new URL(publicUrl).hostname;
  }

  async list(studio: StudioContext, user: SessionUser): Promise<FeedView[]> {
    return (await this.feeds.list(studio.id, user.id)).map(toFeedView);
  }

  async create(studio: StudioContext, user: SessionUser, request: FeedRequest): Promise<NewFeed> {
    const token = newToken();
    const id = await this.feeds.create(studio.id, user.id, request.scope, request.includeHolidays, hashToken(token));
    return this.withUrl(studio.id, id, token);
  }

  /** A new URL for one of the member's own feeds; the old one stops at once. */
  async rotate(studio: StudioContext, user: SessionUser, feedId: number): Promise<NewFeed> {
    const feed = await this.feeds.find(studio.id, feedId);
    if (!feed) throw notFound(`Feed ${feedId}`);
    if (feed.user_id !== user.id) throw forbidden("Only the member whose feed it is may get a new link for it");
    const token = newToken();
    await this.feeds.rotate(studio.id, feedId, hashToken(token));
    return this.withUrl(studio.id, feedId, token);
  }

  /** Members revoke their own feeds; the owner may revoke anyone's. */
  async remove(studio: StudioContext, user: SessionUser, feedId: number): Promise<void> {
    const feed = await this.feeds.find(studio.id, feedId);
    if (!feed) throw notFound(`Feed ${feedId}`);
    if (feed.user_id !== user.id && studio.role !== 'owner') throw forbidden("Only the owner may revoke another member's feed");
    await this.feeds.delete(studio.id, feedId);
  }

  private async withUrl(studioId: number, feedId: number, token: string): Promise<NewFeed> {
    const row = await this.feeds.find(studioId, feedId);
    if (!row) throw notFound(`Feed ${feedId}`);
    const { id, scope, includeHolidays, createdAt } = toFeedView(row);
    return { id, url: `${this.publicUrl}/feeds/${token}.ics`, scope, includeHolidays, createdAt };
  }

  /**
   * What a conditional GET needs, from a handful of cheap queries: the ETag fingerprints every input
   * of the feed (stored events, markets, studio settings, the feed's own settings and today's date,
   * which moves the window); Last-Modified is the latest of those changes. Null: no such feed.
   */
  async validators(token: string): Promise<FeedValidators | null> {
    const tokenHash = hashToken(token);
    // A token's studio never changes, so a repeat fetch asks for the feed (revoked ones still stop at
    // once) and for the calendar's fingerprint (stored events, rules, markets, theme and member
    // names) at the same time.
    const knownStudio = studioOfToken.get(tokenHash);
    const [feed, knownStamp] = await Promise.all([
      this.feeds.byTokenHash(tokenHash),
      knownStudio === undefined ? Promise.resolve(null) : this.fingerprint(knownStudio),
    ]);
    if (!feed) {
      studioOfToken.delete(tokenHash);
      return null;
    }
    if (studioOfToken.size >= 10_000) studioOfToken.clear();
    studioOfToken.set(tokenHash, feed.studio_id);
    const now = this.clock.now();
    void this.feeds.touch(feed.id, now).catch(() => undefined);
    const today = this.clock.today(feed.timezone);
    const calendarStamp = knownStudio === feed.studio_id && knownStamp !== null ? knownStamp : await this.fingerprint(feed.studio_id);
    const parts = [feed.id, feed.scope, feed.include_holidays, feed.user_name, feed.studio_name, feed.studio_version, calendarStamp, today];
    const etag = `"${createHash('sha256').update(JSON.stringify(parts)).digest('base64url').slice(0, 27)}"`;
    const times = [feed.created_at, `${today}T00:00:00Z`, feed.events_touched, feed.markets_touched]
      .filter((time) => time !== null)
      .map((time) => new Date(time).getTime());
    const lastModified = new Date(Math.ceil(Math.max(...times) / 1000) * 1000);
    return { feed, etag, lastModified, today };
  }

  private async fingerprint(studioId: number): Promise<string> {
    return (await this.rules.fingerprint(studioId)) ?? '';
  }

  /** The feed's iCalendar text. */
  async render({ feed, lastModified, today }: FeedValidators): Promise<Buffer> {
    const { from, to } = windowOf(today);
    const context: ItemContext = { studioId: feed.studio_id, publicUrl: this.publicUrl, uidHost: this.uidHost };
    const [calendar, rows] = await Promise.all([
      loadStudioCalendar(this.db, feed.studio_id),
      feed.scope === 'markets' ? Promise.resolve([]) : this.events.inRange(feed.studio_id, from, to),
    ]);
    const items: FeedItem[] = [];
    if (feed.scope !== 'markets') {
      for (const row of rows) {
        if (feed.scope === 'mine' && row.assignee_user_id !== feed.user_id) continue;
        items.push(stepItem(toCalendarEvent(row, 'crew'), context));
      }
    }
    if (feed.scope !== 'mine') {
      for (const market of calendar.markets) items.push(marketItem(market, context), ...extraMarketDays(market, context));
    }
    const kinds = new Set<string>(feed.scope === 'mine' ? [] : ['deadline']);
    if (feed.include_holidays) {
      kinds.add('holiday');
      kinds.add('occasion');
    }
    if (kinds.size) {
      for (const event of ruleEvents(calendar, from, to)) if (kinds.has(event.kind)) items.push(ruleItem(event, context));
    }
    const who = feed.scope === 'mine' ? ` (${feed.user_name})` : '';
    return buildFeed({ name: `${feed.studio_name} · ${scopeNames[feed.scope]}${who}`, timezone: feed.timezone, refreshSeconds: REFRESH_SECONDS, items }, lastModified);
  }
}
