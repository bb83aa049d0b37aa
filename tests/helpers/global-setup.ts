import { execFileSync } from 'node:child_process';
import path from 'node:path';
import knex from 'knex';
import { migrateLatest } from '../../db/migrate';
import { loadConfig } from '../../server/config';
import { connectionSettings } from '../../server/db';

// Starts (or reuses) the private MariaDB and gives a Jest project a fresh, migrated database.
// Jest runs a globalSetup module once however many projects name it, hence one small file per project.
// `env` picks another private MariaDB (DB_PORT), as the stopped-database test does.
export async function prepareDatabase(database: string, env: NodeJS.ProcessEnv = process.env): Promise<void> {
  const root = path.resolve(__dirname, '../..');
  execFileSync(process.execPath, [path.join(root, 'scripts/db.mjs'), 'start'], { stdio: 'inherit', env });
  const config = loadConfig({ ...env, NODE_ENV: 'test', DB_NAME: database });
  const admin = knex({ client: 'mysql2', connection: { ...connectionSettings(config), database: undefined } });
  await admin.raw(`DROP DATABASE IF EXISTS \`${database}\``);
  await admin.raw(`CREATE DATABASE \`${database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await admin.destroy();
  const db = knex({ client: 'mysql2', connection: connectionSettings(config) });
  await migrateLatest(db);
  await db.destroy();
}

/** TEST_DB_NAME lets two people (or agents) run the API tests at once without sharing a database. */
export function testDatabaseName(): string {
  return process.env['TEST_DB_NAME'] ?? 'kerfcast_test';
}

export function e2eDatabaseName(): string {
  return process.env['E2E_DB_NAME'] ?? 'kerfcast_e2e';
}

export default function globalSetup(): Promise<void> {
  return prepareDatabase(testDatabaseName());
}
