import './zod';
import * as z from 'zod/mini';

export const feedScopes = ['all', 'mine', 'markets'] as const;
export type FeedScope = (typeof feedScopes)[number];

export const feedRequest = z.object({
  scope: z.enum(feedScopes, 'Scope must be all, mine or markets'),
  /** Whether public holidays and retail occasions go into the feed too. */
  includeHolidays: z._default(z.boolean(), false),
});
export type FeedRequest = z.infer<typeof feedRequest>;

export interface FeedView {
  id: number;
  scope: FeedScope;
  includeHolidays: boolean;
  createdAt: string;
  /** When a calendar app last fetched it (null: never). */
  lastFetchedAt: string | null;
}

/** POST /feeds and POST /feeds/:feedId/rotate: the only answers that carry the full URL. */
export interface NewFeed {
  id: number;
  url: string;
  scope: FeedScope;
  includeHolidays: boolean;
  createdAt: string;
}
