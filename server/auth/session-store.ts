import { ConnectSessionKnexStore } from 'connect-session-knex';
import type { SessionData } from 'express-session';
import type { Knex } from 'knex';

const TOUCH_INTERVAL_MS = 60_000;

/**
 * Sessions in MariaDB through Knex. The package's touch() rejects when the database is away, and
 * express-session never awaits it, so one signed-in request during an outage would end the process
 * with an unhandled rejection; here the failure goes to the callback like every other store call.
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

  override async destroy(sid: string, callback?: (error?: unknown) => void): Promise<number> {
    this.touchedAt.delete(sid);
    return super.destroy(sid, callback);
  }
}
