import { migrateLatest } from '../db/migrate';
import { demoMembers, demoPassword, seedDemoStudio } from '../db/seeds/demo-studio';
import { createApp } from './app';
import { releaseInterruptedCommits } from './imports/import-claims';
import { clockFromEnv, useClock } from './clock/clock';
import { loadConfig } from './config';
import { createDb } from './db';
import { createLogger } from './logger';
import { startMailFake, type MailFake } from './mail/mail-fake';
import { AgendaScheduler } from './agenda/agenda-scheduler';
import { Mailer } from './mail/mailer';

async function main(): Promise<void> {
  const config = loadConfig();
  const log = createLogger(config);
  // Never silent, never the end of the process: a promise nobody awaited that failed is logged.
  process.on('unhandledRejection', (reason) => log.error({ err: reason }, 'unhandled rejection'));
  useClock(clockFromEnv({ ...process.env, NODE_ENV: config.NODE_ENV }));
  const pin = process.env['KERFCAST_NOW'] || process.env['KERFCAST_TODAY'];
  if (pin) console.log(`The date is pinned (${process.env['KERFCAST_NOW'] ? 'KERFCAST_NOW' : 'KERFCAST_TODAY'}=${pin}); every studio's today follows it`);
  const db = createDb(config, undefined, { warn: (m) => log.warn({ knex: m }, 'database'), error: (m) => log.error({ knex: m }, 'database') });
  const applied = await migrateLatest(db);
  if (applied.length) log.info(`applied migrations: ${applied.join(', ')}`);
  // A commit cut off by a crash or a database restart leaves its claim behind; free it for a retry.
  const released = await releaseInterruptedCommits(db);
  if (released.length) log.warn(`imports whose commit was interrupted, released: ${released.join(', ')}`);
  if (process.env['SEED_DEMO'] === '1') {
    const seeded = await seedDemoStudio(db);
    log.info(seeded.isNew ? 'seeded the demo studio' : 'demo studio already present');
    console.log(
      `\nDemo sign-ins (demo data only), password "${demoPassword}":\n` +
        demoMembers.map((member) => `  ${member.role.padEnd(8)} ${member.email}`).join('\n') +
        '\n',
    );
  }
  // Outside production the local SMTP fake runs in this process and keeps mail for the Mailbox page.
  let mailFake: MailFake | null = null;
  if (config.NODE_ENV !== 'production') {
    mailFake = await startMailFake(db, config.SMTP_PORT, config.SMTP_HOST).catch((error: NodeJS.ErrnoException) => {
      const reason = error.code === 'EADDRINUSE' ? `port ${config.SMTP_PORT} is taken; set SMTP_PORT to a free one` : error.message;
      log.warn(`mail fake not started: ${reason}`);
      return null;
    });
    if (mailFake) console.log(`Local SMTP fake on ${config.SMTP_HOST}:${mailFake.port}; captured mail is in the Mailbox page (owners)`);
  }
  const app = createApp({ config, db, log });
  // The weekly agenda: a tick a minute; agenda_sends keeps restarts and extra processes from resending.
  const agendaMailer = new Mailer(config);
  const agenda = new AgendaScheduler(db, agendaMailer, config.publicUrl, log);
  agenda.start();
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
      void agenda
        .stop()
        .then(() => agendaMailer.close())
        .then(() => mailFake?.close())
        .then(() => db.destroy())
        .finally(() => process.exit(0));
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
