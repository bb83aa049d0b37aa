import type { Knex } from 'knex';
import * as users from './20261201000100_users';
import * as studios from './20261201000200_studios';
import * as memberships from './20261201000300_memberships';
import * as sessions from './20261201000400_sessions';
import * as m1000 from './20261201001000_imports';
import * as m1100 from './20261201001100_series';
import * as m1200 from './20261201001200_series_points';
import * as m1300 from './20261201001300_sales';
import * as m2000 from './20261201002000_themes';
import * as m2100 from './20261201002100_theme_members';
import * as m2200 from './20261201002200_theme_items';

interface Migration {
  up(knex: Knex): Promise<void>;
  down(knex: Knex): Promise<void>;
}

// Migrations are listed here, in order, so they load the same way under tsx, Jest and a bundle.
// Add a new file's import and entry; never edit one that has been applied.
const migrations: Record<string, Migration> = {
  '20261201000100_users': users,
  '20261201000200_studios': studios,
  '20261201000300_memberships': memberships,
  '20261201000400_sessions': sessions,
  '20261201001000_imports': m1000,
  '20261201001100_series': m1100,
  '20261201001200_series_points': m1200,
  '20261201001300_sales': m1300,
  '20261201002000_themes': m2000,
  '20261201002100_theme_members': m2100,
  '20261201002200_theme_items': m2200,
};

export const migrationSource: Knex.MigrationSource<string> = {
  // Sorted by timestamp, so the order never depends on where an entry was added.
  getMigrations: async () => Object.keys(migrations).sort(),
  getMigrationName: (name) => name,
  getMigration: async (name) => migrations[name],
};
