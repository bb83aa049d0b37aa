// npm run bench:feed (issue 7): a feed of 5,000 stored events (plus recurring markets and holidays)
// through GET /feeds/<token>.ics on the real app: built cold (every VEVENT written by ical-generator,
// as after a restart) and after one step changed (the usual refetch: one VEVENT rewritten, the rest
// from the cache), and a 304 revalidation with If-None-Match. Targets: generation ≤ 150 ms, 304 ≤ 5 ms.
// Sequential requests over one keep-alive connection; prints median and p95, a bare SELECT 1 round
// trip and the load average, so the figures can be read against how busy the machine is.
// Uses its own scratch database, kerfcast_bench_feed.
import { execFileSync } from 'node:child_process';
import http from 'node:http';
import os from 'node:os';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import knex from 'knex';
import { migrateLatest } from '../../db/migrate';
import { addDays } from '@shared/calendar/dates';
import { hashToken, newToken } from '../../server/account/tokens';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { connectionSettings, createDb } from '../../server/db';
import { clearFeedCache } from '../../server/feeds/feed-builder';
import { FeedService } from '../../server/feeds/feed-service';
import { createLogger } from '../../server/logger';
import { todayInZone } from '../../server/occasions/studio-today';
import { lcg } from '../../shared/seeded-random';

const DATABASE = 'kerfcast_bench_feed';
const EVENT_COUNT = 5_000;
const MARKET_COUNT = 12;
const GENERATION_RUNS = 40;
const REVALIDATION_RUNS = 1_000;
const root = path.resolve(__dirname, '../..');

const random = lcg(11);

async function prepare() {
  execFileSync(process.execPath, [path.join(root, 'scripts/db.mjs'), 'start'], { stdio: 'inherit' });
  const config = loadConfig({ ...process.env, NODE_ENV: 'test', DB_NAME: DATABASE, LOG_LEVEL: 'silent', CLIENT_DIST: 'does-not-exist' });
  const admin = knex({ client: 'mysql2', connection: { ...connectionSettings(config), database: undefined } });
  await admin.raw(`DROP DATABASE IF EXISTS \`${DATABASE}\``);
  await admin.raw(`CREATE DATABASE \`${DATABASE}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await admin.destroy();
  const db = createDb(config);
  await migrateLatest(db);
  const [studioId] = await db('studios').insert({ name: 'Bench studio', timezone: 'America/Chicago' });
  const [userId] = await db('users').insert({ email: 'bench@example.test', name: 'Bench owner', password_hash: 'x' });
  await db('memberships').insert({ studio_id: studioId, user_id: userId, role: 'owner' });
  const today = todayInZone('America/Chicago');
  const rows = Array.from({ length: EVENT_COUNT }, (_, index) => {
    const start = addDays(today, Math.floor(random() * 700) - 150);
    const span = Math.floor(random() * 4);
    return {
      studio_id: studioId,
      kind: (['build', 'content', 'launch'] as const)[index % 3],
      title: `Step ${index}, batch; cut`,
      start_date: start,
      end_date: addDays(start, span),
      days: JSON.stringify([start]),
      span_days: span,
      work_days: span + 1,
      hours_per_day: 3,
      cure_days: index % 5 === 0 ? 2 : 0,
      cautions: JSON.stringify(index % 4 === 0 ? ['Never leave the laser cutter running unattended; keep an extinguisher at hand.'] : []),
      notes: index % 2 === 0 ? `Notes for step ${index}\nsecond line with a comma, and more words to fold the line past 75 octets` : null,
      assignee_user_id: userId,
      sequence: index % 7,
    };
  });
  for (let index = 0; index < rows.length; index += 500) await db('events').insert(rows.slice(index, index + 500));
  for (let index = 0; index < MARKET_COUNT; index++) {
    await db('markets').insert({ studio_id: studioId, name: `Market ${index}`, place: 'Hall', start: addDays(today, index * 3), rrule: 'FREQ=WEEKLY;COUNT=20', exdates: JSON.stringify([addDays(today, index * 3 + 14)]), rdates: '[]', application_deadline: addDays(today, index) });
  }
  const token = newToken();
  await db('feeds').insert({ studio_id: studioId, user_id: userId, scope: 'all', include_holidays: true, token_hash: hashToken(token) });
  return { config, db, token };
}

function get(port: number, urlPath: string, agent: http.Agent, headers: Record<string, string> = {}) {
  return new Promise<{ status: number; body: string; etag: string }>((resolve, reject) => {
    const request = http.get({ host: '127.0.0.1', port, path: urlPath, agent, headers }, (response) => {
      let body = '';
      response.setEncoding('utf8');
      response.on('data', (chunk: string) => (body += chunk));
      response.on('end', () => resolve({ status: response.statusCode ?? 0, body, etag: String(response.headers.etag ?? '') }));
    });
    request.on('error', reject);
  });
}

function summary(times: number[]) {
  const sorted = [...times].sort((a, b) => a - b);
  const at = (q: number) => sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))];
  return { median: at(0.5), p95: at(0.95) };
}

async function main() {
  const { config, db, token } = await prepare();
  const app = createApp({ config, db, log: createLogger(config) });
  const server = app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  const port = (server.address() as AddressInfo).port;
  const agent = new http.Agent({ keepAlive: true, maxSockets: 1 });
  const feedPath = `/feeds/${token}.ics`;

  const first = await get(port, feedPath, agent);
  const eventCount = (first.body.match(/BEGIN:VEVENT/g) ?? []).length;
  for (let index = 0; index < 5; index++) await get(port, feedPath, agent);
  // Cold: every VEVENT written by ical-generator from nothing (as after a restart).
  const cold: number[] = [];
  for (let index = 0; index < GENERATION_RUNS; index++) {
    clearFeedCache();
    const started = performance.now();
    const response = await get(port, feedPath, agent);
    cold.push(performance.now() - started);
    if (response.status !== 200) throw new Error(`feed answered ${response.status}: ${response.body.slice(0, 300)}`);
  }
  // After one step changed: the usual case, a subscriber refetching after a move.
  const changed: number[] = [];
  const [{ id: movedId }] = await db('events').orderBy('id').limit(1).select('id');
  for (let index = 0; index < GENERATION_RUNS; index++) {
    await db('events').where({ id: movedId }).update({ title: `Moved step ${index}`, version: db.raw('version + 1'), sequence: db.raw('sequence + 1'), updated_at: db.raw('CURRENT_TIMESTAMP(3)') });
    const started = performance.now();
    const response = await get(port, feedPath, agent);
    changed.push(performance.now() - started);
    if (!response.body.includes(`Moved step ${index}`)) throw new Error('the changed step is missing from the feed');
  }
  // The server's own share of a revalidation, without HTTP: the two queries and the ETag.
  const feeds = new FeedService(db, config.publicUrl);
  const inProcess: number[] = [];
  for (let index = 0; index < 200; index++) {
    const started = performance.now();
    await feeds.validators(token);
    inProcess.push(performance.now() - started);
  }
  // One database round trip, to read the figures against how busy the machine is.
  const roundTrip: number[] = [];
  for (let index = 0; index < 200; index++) {
    const started = performance.now();
    await db.raw('SELECT 1');
    roundTrip.push(performance.now() - started);
  }
  const fresh = await get(port, feedPath, agent);
  for (let index = 0; index < 50; index++) await get(port, feedPath, agent, { 'If-None-Match': fresh.etag });
  const revalidation: number[] = [];
  for (let index = 0; index < REVALIDATION_RUNS; index++) {
    const started = performance.now();
    const response = await get(port, feedPath, agent, { 'If-None-Match': fresh.etag });
    revalidation.push(performance.now() - started);
    if (response.status !== 304) throw new Error(`revalidation answered ${response.status}`);
  }
  const gen = summary(cold);
  const warm = summary(changed);
  const validatorsOnly = summary(inProcess);
  const ping = summary(roundTrip);
  const reval = summary(revalidation);
  console.log(`feed: ${eventCount} VEVENTs (${EVENT_COUNT} stored events, ${MARKET_COUNT} recurring markets, holidays), ${(Buffer.byteLength(first.body) / 1024).toFixed(0)} KiB`);
  console.log(`generation, cold (GET 200, ${GENERATION_RUNS} runs): median ${gen.median.toFixed(1)} ms, p95 ${gen.p95.toFixed(1)} ms  (target ≤ 150 ms)  ${gen.median <= 150 ? 'OK' : 'OVER'}`);
  console.log(`generation after one step changed (GET 200, ${GENERATION_RUNS} runs): median ${warm.median.toFixed(1)} ms, p95 ${warm.p95.toFixed(1)} ms  (target ≤ 150 ms)  ${warm.median <= 150 ? 'OK' : 'OVER'}`);
  console.log(`revalidation (GET 304, ${REVALIDATION_RUNS} runs): median ${reval.median.toFixed(2)} ms, p95 ${reval.p95.toFixed(2)} ms  (target ≤ 5 ms)  ${reval.median <= 5 ? 'OK' : 'OVER'}`);
  console.log(`  of which the validators in process (2 queries): median ${validatorsOnly.median.toFixed(2)} ms; one SELECT 1 round trip: median ${ping.median.toFixed(2)} ms; load average ${os.loadavg()[0].toFixed(1)} on ${os.cpus().length} CPUs`);
  agent.destroy();
  server.close();
  await db.destroy();
}

main().catch((error: Error) => {
  console.error(error);
  process.exit(1);
});
