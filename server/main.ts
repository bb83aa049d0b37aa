import { migrateLatest } from '../db/migrate';
import { demoMembers, demoPassword, seedDemoStudio } from '../db/seeds/demo-studio';
import { createApp } from './app';
import { loadConfig } from './config';
import { createDb } from './db';
import { createLogger } from './logger';

async function main(): Promise<void> {
  const config = loadConfig();
  const log = createLogger(config);
  const db = createDb(config, undefined, { warn: (m) => log.warn({ knex: m }, 'database'), error: (m) => log.error({ knex: m }, 'database') });
  const applied = await migrateLatest(db);
  if (applied.length) log.info(`applied migrations: ${applied.join(', ')}`);
  if (process.env['SEED_DEMO'] === '1') {
    const seeded = await seedDemoStudio(db);
    log.info(seeded.isNew ? 'seeded the demo studio' : 'demo studio already present');
    console.log(
      `\nDemo sign-ins (demo data only), password "${demoPassword}":\n` +
        demoMembers.map((member) => `  ${member.role.padEnd(8)} ${member.email}`).join('\n') +
        '\n',
    );
  }
  const app = createApp({ config, db, log });
  const server = app.listen(config.PORT, config.HOST, () => {
    console.log(`Kerfcast is up: http://${config.HOST}:${config.PORT}  (Ctrl-C stops it; npm run db:stop stops the database)`);
  });
  server.on('error', (error: NodeJS.ErrnoException) => {
    const reason = error.code === 'EADDRINUSE' ? `port ${config.PORT} is taken; set PORT to a free one` : error.message;
    log.fatal({ err: error }, `could not listen on ${config.HOST}:${config.PORT}: ${reason}`);
    console.error(`Could not listen on ${config.HOST}:${config.PORT}: ${reason}`);
    process.exit(1);
  });
  const shutdown = (signal: string) => {
    log.info(`${signal}: closing`);
    server.close(() => {
      void db.destroy().finally(() => process.exit(0));
    });
    server.closeAllConnections();
    setTimeout(() => process.exit(0), 5000).unref();
  };
  process.once('SIGTERM', () => shutdown('SIGTERM'));
  process.once('SIGINT', () => shutdown('SIGINT'));
}

main().catch((error: Error) => {
  console.error(error.message);
  process.exit(1);
});
