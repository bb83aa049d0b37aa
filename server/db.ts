import knex, { Knex } from 'knex';
import type { Config } from './config';

type Field = { type: string; string(): string | null };

// DECIMAL and BIGINT come back as numbers, not strings; TINYINT(1) as booleans. Tested in tests/api/db.test.ts.
function typeCast(field: Field, next: () => unknown): unknown {
  if (field.type === 'NEWDECIMAL' || field.type === 'DECIMAL') {
    const text = field.string();
    return text === null ? null : Number(text);
  }
  if (field.type === 'TINY' && (field as unknown as { length: number }).length === 1) {
    const text = field.string();
    return text === null ? null : text === '1';
  }
  return next();
}

export function connectionSettings(config: Pick<Config, 'DB_HOST' | 'DB_PORT' | 'DB_USER' | 'DB_PASSWORD' | 'DB_NAME'>) {
  return {
    host: config.DB_HOST,
    port: config.DB_PORT,
    user: config.DB_USER,
    password: config.DB_PASSWORD,
    database: config.DB_NAME,
    timezone: 'Z',
    dateStrings: ['DATE'] as 'DATE'[],
    supportBigNumbers: true,
    bigNumberStrings: false,
    charset: 'utf8mb4',
    typeCast,
  };
}

interface KnexLog {
  warn(message: unknown): void;
  error(message: unknown): void;
}

export function createDb(config: Config, pool: Knex.PoolConfig = { min: 0, max: 10 }, log?: KnexLog): Knex {
  const quiet = { warn: () => undefined, error: () => undefined, debug: () => undefined, deprecate: () => undefined };
  return knex({
    client: 'mysql2',
    connection: connectionSettings(config),
    pool,
    acquireConnectionTimeout: 5000,
    // Knex prints pool trouble to the console by default; send it to our logger (or nowhere in tests).
    log: log
      ? { ...quiet, warn: (message) => log.warn(message), error: (message) => log.error(message) }
      : config.NODE_ENV === 'test'
        ? quiet
        : undefined,
  });
}
