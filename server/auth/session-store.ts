import { ConnectSessionKnexStore } from 'connect-session-knex';
import type { SessionData } from 'express-session';
import type { Knex } from 'knex';

/**
 * Sessions in MariaDB through Knex. The package's touch() rejects when the database is away, and
 * express-session never awaits it, so one signed-in request during an outage would end the process
 * with an unhandled rejection; here the failure goes to the callback like every other store call.
 */
export class KnexSessionStore extends ConnectSessionKnexStore {
  constructor(db: Knex) {
    super({ knex: db, tableName: 'sessions', createTable: false, cleanupInterval: 0 });
    // The store checks for its table once at start; migrations own the table, and a database that is
    // down at that moment must not poison every later session read.
    this.ready = this.ready.catch(() => undefined);
  }

  override async touch(sid: string, session: SessionData, callback?: (error?: unknown) => void): Promise<void> {
    try {
      await super.touch(sid, session);
    } catch (error) {
      callback?.(error);
      return;
    }
    callback?.();
  }
}
