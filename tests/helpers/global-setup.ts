import { execFileSync } from 'node:child_process';
import path from 'node:path';
import knex from 'knex';
import { migrateLatest } from '../../db/migrate';
import { loadConfig } from '../../server/config';
import { connectionSettings } from '../../server/db';

// Starts (or reuses) the private MariaDB and gives a Jest project a fresh, migrated database.
// Jest runs a globalSetup module once however many projects name it, hence one small file per project.
export async function prepareDatabase(database: string): Promise<void> {
  const root = path.resolve(__dirname, '../..');
  execFileSync(process.execPath, [path.join(root, 'scripts/db.mjs'), 'start'], { stdio: 'inherit' });
  const config = loadConfig({ ...process.env, NODE_ENV: 'test', DB_NAME: database });
  const admin = knex({ client: 'mysql2', connection: { ...connectionSettings(config), database: undefined } });
  await admin.raw(`DROP DATABASE IF EXISTS \`${database}\``);
  await admin.raw(`CREATE DATABASE \`${database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await admin.destroy();
  const db = knex({ client: 'mysql2', connection: connectionSettings(config) });
  await migrateLatest(db);
  await db.destroy();
}

export default function globalSetup(): Promise<void> {
  return prepareDatabase('kerfcast_test');
}
