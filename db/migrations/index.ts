import type { Knex } from 'knex';
import * as users from './20261201000100_users';
import * as studios from './20261201000200_studios';
import * as memberships from './20261201000300_memberships';
import * as sessions from './20261201000400_sessions';

interface Migration {
  up(knex: Knex): Promise<void>;
  down(knex: Knex): Promise<void>;
}

// Migrations are listed here, in order, so they load the same way under tsx, Jest and a bundle.
// Add a new file's import and entry at the end; never edit one that has been applied.
const migrations: Record<string, Migration> = {
  '20261201000100_users': users,
  '20261201000200_studios': studios,
  '20261201000300_memberships': memberships,
  '20261201000400_sessions': sessions,
};

export const migrationSource: Knex.MigrationSource<string> = {
  getMigrations: async () => Object.keys(migrations),
  getMigrationName: (name) => name,
  getMigration: async (name) => migrations[name],
};
