// Knex settings for the CLI-free scripts in scripts/; the app builds its own from server/config.ts.
import { loadConfig } from '../server/config';
import { connectionSettings } from '../server/db';
import { migrationSource } from './migrations';

const config = loadConfig();

export default {
  client: 'mysql2',
  connection: connectionSettings(config),
  migrations: { migrationSource },
};
