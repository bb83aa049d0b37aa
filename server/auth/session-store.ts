import { ConnectSessionKnexStore } from 'connect-session-knex';
import type { SessionData } from 'express-session';
import type { Knex } from 'knex';

const TOUCH_INTERVAL_MS = 60_000;

/**
 * Sessions in MariaDB through Knex. The package's calls hand an error to their callback and then
 * reject as well (touch() only rejects), and express-session never awaits them, so one signed-in
 * request during an outage would end the process with an unhandled rejection. Here every failure
 * goes to the callback only, and express-session passes it on to the error middleware (a 503).
 */
export class KnexSessionStore extends ConnectSessionKnexStore {
  /** When each session's expiry was last written, so a busy session is written once a minute, not per request. */
  private readonly touchedAt = new Map<string, number>();

  constructor(db: Knex) {
    super({ knex: db, tableName: 'sessions', createTable: false, cleanupInterval: 0 });
    // The store checks for its table once at start; migrations own the table, and a database that is
    // down at that moment must not poison every later session read.
    this.ready = this.ready.catch(() => undefined);
  }

  // Sessions roll (each answer moves the cookie's expiry 14 days on); writing the new expiry at most
  // once a minute per session keeps the stored one within a minute of the cookie's.
  override async touch(sid: string, session: SessionData, callback?: (error?: unknown) => void): Promise<void> {
    // Real time: session expiry is security, never moved by a pinned clock (express-session's cookie uses it too).
    const now = Date.now();
    const last = this.touchedAt.get(sid);
    if (last !== undefined && now - last < TOUCH_INTERVAL_MS) {
      callback?.();
      return;
    }
    try {
      await super.touch(sid, session);
    } catch (error) {
      callback?.(error);
      return;
    }
    if (this.touchedAt.size >= 10_000) this.touchedAt.clear();
    this.touchedAt.set(sid, now);
    callback?.();
  }

  override async get(sid: string, callback: (error: unknown, session?: SessionData | null) => void): Promise<SessionData | null> {
    return super.get(sid, callback).catch(() => null);
  }

  override async set(sid: string, session: SessionData, callback?: (error?: unknown) => void): Promise<void> {
    await super.set(sid, session, callback).catch(() => undefined);
  }

  override async destroy(sid: string, callback?: (error?: unknown) => void): Promise<number> {
    this.touchedAt.delete(sid);
    return super.destroy(sid, callback).catch(() => 0);
  }

  override async length(callback: (error: unknown, length?: number) => void): Promise<number | undefined> {
    return super.length(callback).catch(() => undefined);
  }

  override async clear(callback?: (error?: unknown) => void): Promise<number> {
    return super.clear(callback).catch(() => 0);
  }

  override async all(callback: Parameters<ConnectSessionKnexStore['all']>[0]): ReturnType<ConnectSessionKnexStore['all']> {
    return super.all(callback).catch(() => []);
  }
}
