import type { Knex } from 'knex';
import { migrationSource } from './migrations';

export async function migrateLatest(db: Knex): Promise<string[]> {
  const [, applied] = await db.migrate.latest({ migrationSource });
  return applied as string[];
}
