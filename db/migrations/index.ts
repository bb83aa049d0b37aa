import type { Knex } from 'knex';
import * as users from './20261201000100_users';
import * as studios from './20261201000200_studios';
import * as memberships from './20261201000300_memberships';
import * as sessions from './20261201000400_sessions';
import * as m1000 from './20261201001000_imports';
import * as m1100 from './20261201001100_series';
import * as m1200 from './20261201001200_series_points';
import * as m1300 from './20261201001300_sales';
import * as m1400 from './20261201001400_import_series';
import * as m1500 from './20261201001500_import_progress';
import * as m2000 from './20261201002000_themes';
import * as m2100 from './20261201002100_theme_members';
import * as m2200 from './20261201002200_theme_items';
import * as m2300 from './20261201002300_series_scores';
import * as m2400 from './20261201002400_theme_status_history';
import * as m3000 from './20261201003000_markets';
import * as m3100 from './20261201003100_runway_templates';
import * as m3200 from './20261201003200_runways';
import * as m3300 from './20261201003300_events';
import * as m3400 from './20261201003400_studio_occasions';
import * as m3500 from './20261201003500_studio_sell_windows';
import * as m3600 from './20261201003600_studio_blackouts';
import * as m3700 from './20261201003700_studios_back_to_school';
import * as m3800 from './20261201003800_studios_events_stamp';
import * as m4000 from './20261201004000_invitations';
import * as m4100 from './20261201004100_password_resets';
import * as m4200 from './20261201004200_dev_mailbox';
import * as m4300 from './20261201004300_feeds';
import * as m4400 from './20261201004400_agenda_sends';
import * as m20261202110000 from './20261202110000_studios_channels';
import * as m20261205120000 from './20261205120000_dev_mailbox_tags';
import * as m20261205130000 from './20261205130000_series_scores_trust';
import * as m20261205130100 from './20261205130100_theme_sales_series_to_items';

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
  '20261201001400_import_series': m1400,
  '20261201001500_import_progress': m1500,
  '20261201002000_themes': m2000,
  '20261201002100_theme_members': m2100,
  '20261201002200_theme_items': m2200,
  '20261201002300_series_scores': m2300,
  '20261201002400_theme_status_history': m2400,
  '20261201003000_markets': m3000,
  '20261201003100_runway_templates': m3100,
  '20261201003200_runways': m3200,
  '20261201003300_events': m3300,
  '20261201003400_studio_occasions': m3400,
  '20261201003500_studio_sell_windows': m3500,
  '20261201003600_studio_blackouts': m3600,
  '20261201003700_studios_back_to_school': m3700,
  '20261201003800_studios_events_stamp': m3800,
  '20261201004000_invitations': m4000,
  '20261201004100_password_resets': m4100,
  '20261201004200_dev_mailbox': m4200,
  '20261201004300_feeds': m4300,
  '20261201004400_agenda_sends': m4400,
  '20261202110000_studios_channels': m20261202110000,
  '20261205120000_dev_mailbox_tags': m20261205120000,
  '20261205130000_series_scores_trust': m20261205130000,
  '20261205130100_theme_sales_series_to_items': m20261205130100,
};

export const migrationSource: Knex.MigrationSource<string> = {
  // Sorted by timestamp, so the order never depends on where an entry was added.
  getMigrations: async () => Object.keys(migrations).sort(),
  getMigrationName: (name) => name,
  getMigration: async (name) => migrations[name],
};
