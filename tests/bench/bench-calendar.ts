// npm run bench:calendar (issue 5): the month query GET /events?from&to of a studio with 20,000
// stored events and 30 recurring markets, on the real app with signed-in cookies (one member and
// session per connection), beside a bare
// Express + mysql2 endpoint running the one stored-events query, both at 50 connections
// (autocannon) in the same run. Prints requests/s, p50/p99 latency and the ratio, and two readings
// of the machine: the signed-in stack on a small route, and the month's JSON served from memory.
// Targets: p99 ≤ 25 ms, ratio ≥ 0.5. Uses its own scratch database, kerfcast_bench_calendar.
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import express from 'express';
import knex from 'knex';
import mysql from 'mysql2/promise';
import { hashPassword } from '../../server/auth/passwords';
import { loadConfig } from '../../server/config';
import { connectionSettings } from '../../server/db';
import { SHORT_SPAN_DAYS } from '../../server/events/event-repository';
import { prepareDatabase } from '../helpers/global-setup';
import { lcg } from '../../shared/seeded-random';

// autocannon ships no type declarations; this is the part of its API the bench uses.
interface LoadResult {
  requests: { average: number; total: number };
  latency: { p50: number; p99: number };
  non2xx: number;
  errors: number;
  timeouts: number;
}
type Autocannon = (options: {
  url: string;
  connections: number;
  duration: number;
  setupClient?: (client: { setHeaders(headers: Record<string, string>): void }) => void;
}) => Promise<LoadResult>;
// eslint-disable-next-line @typescript-eslint/no-require-imports
const autocannon = require('autocannon') as Autocannon;

const DATABASE = 'kerfcast_bench_calendar';
const EVENT_COUNT = 20_000;
const MARKET_COUNT = 30;
const CONNECTIONS = 50;
const DURATION_SECONDS = Number(process.env['BENCH_SECONDS'] ?? 10);
const FROM = '2026-06-01';
const TO = '2026-06-30';
const emailOf = (index: number) => `bench-member-${index}@example.test`;
const PASSWORD = 'bench-calendar-password';
const root = path.resolve(__dirname, '../..');

// The bare endpoint's one query: the same stored-events read as the app's month query (same
// columns, joins, index and look-back), so the ratio shows what the app adds around it.
const BARE_SQL =
  'SELECT e.id, e.runway_id, e.theme_id, t.name AS theme_name, e.step_index, e.kind, e.title, e.start_date, e.end_date, ' +
  'e.work_days, e.hours_per_day, e.cure_days, e.cautions, e.notes, e.assignee_user_id, u.name AS assignee_name, ' +
  'e.done, e.version, e.sequence FROM events e LEFT JOIN themes t ON t.id = e.theme_id ' +
  'LEFT JOIN users u ON u.id = e.assignee_user_id WHERE e.studio_id = ? AND e.start_date BETWEEN ? AND ? AND e.end_date >= ?';

const random = lcg(7);

function isoDay(offset: number): string {
  return new Date(Date.UTC(2024, 0, 1) + offset * 86_400_000).toISOString().slice(0, 10);
}

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
    server.on('error', reject);
  });
}

async function prepare(): Promise<number> {
  // Starts (or reuses) the private MariaDB and makes a fresh, migrated scratch database.
  await prepareDatabase(DATABASE);
  const db = knex({ client: 'mysql2', connection: connectionSettings(loadConfig({ ...process.env, DB_NAME: DATABASE })) });
  const [studioId] = await db('studios').insert({ name: 'Bench studio', country: 'US', work_days: '1,2,3,4,5' });
  // One member per connection, so each connection has its own session as real users would.
  const passwordHash = await hashPassword(PASSWORD);
  const [userId] = await db('users').insert({ email: emailOf(0), name: 'Bench owner', password_hash: passwordHash });
  await db('memberships').insert({ studio_id: studioId, user_id: userId, role: 'owner' });
  for (let index = 1; index < CONNECTIONS; index++) {
    const [memberId] = await db('users').insert({ email: emailOf(index), name: `Bench partner ${index}`, password_hash: passwordHash });
    await db('memberships').insert({ studio_id: studioId, user_id: memberId, role: 'partner' });
  }
  const themeIds: number[] = [];
  for (let index = 0; index < 40; index++) {
    const [id] = await db('themes').insert({ studio_id: studioId, name: `Theme ${index + 1}`, status: 'building' });
    themeIds.push(id);
  }
  const rules = ['FREQ=WEEKLY;BYDAY=SA', 'FREQ=MONTHLY;BYDAY=2SA', 'FREQ=MONTHLY;BYDAY=1SU', 'FREQ=WEEKLY;INTERVAL=2;BYDAY=SU', 'FREQ=YEARLY;BYMONTH=6;BYDAY=1SA'];
  await db('markets').insert(
    Array.from({ length: MARKET_COUNT }, (_, index) => ({
      studio_id: studioId,
      name: `Market ${index + 1}`,
      place: `Hall ${index + 1}`,
      start: isoDay(index * 3),
      rrule: rules[index % rules.length],
      exdates: JSON.stringify([isoDay(index * 3 + 35)]),
      rdates: '[]',
      hours: '9:00–15:00',
      application_deadline: isoDay(500 + index * 7),
    })),
  );
  // 20,000 steps of one to four days spread over five years (about eleven a day).
  const rows = Array.from({ length: EVENT_COUNT }, (_, index) => {
    const start = Math.floor(random() * 5 * 365);
    const span = Math.floor(random() * 4);
    const kind = (['build', 'content', 'launch'] as const)[index % 3];
    return {
      studio_id: studioId,
      theme_id: themeIds[index % themeIds.length],
      step_index: index % 11,
      kind,
      title: `Step ${index + 1}`,
      start_date: isoDay(start),
      end_date: isoDay(start + (kind === 'launch' ? 0 : span)),
      span_days: kind === 'launch' ? 0 : span,
      days: '[]',
      work_days: kind === 'launch' ? 0 : span + 1,
      hours_per_day: kind === 'launch' ? 0 : 3,
      cautions: '[]',
      assignee_user_id: userId,
    };
  });
  for (let index = 0; index < rows.length; index += 1000) await db('events').insert(rows.slice(index, index + 1000));
  await db.raw('ANALYZE TABLE events');
  await db.destroy();
  return studioId;
}

async function waitFor(url: string, child: ChildProcess): Promise<void> {
  for (let attempt = 0; attempt < 200; attempt++) {
    if (child.exitCode !== null) throw new Error(`server exited with ${child.exitCode}`);
    try {
      if ((await fetch(url)).status < 500) return;
    } catch {
      // not up yet
    }
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`no answer from ${url}`);
}

function startChild(args: string[], env: Record<string, string>): ChildProcess {
  return spawn(process.execPath, [path.join(root, 'node_modules/tsx/dist/cli.mjs'), ...args], {
    cwd: root,
    env: { ...process.env, ...env },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
}

async function signInCookie(base: string, email: string): Promise<string> {
  const me = await fetch(`${base}/api/auth/me`);
  const xsrf = /XSRF-TOKEN=([^;]+)/.exec(me.headers.get('set-cookie') ?? '')?.[1];
  if (!xsrf) throw new Error('no XSRF-TOKEN cookie');
  const login = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-xsrf-token': decodeURIComponent(xsrf), cookie: `XSRF-TOKEN=${xsrf}` },
    body: JSON.stringify({ email, password: PASSWORD }),
  });
  const session = /kerfcast\.sid=([^;]+)/.exec(login.headers.get('set-cookie') ?? '')?.[1];
  if (login.status !== 200 || !session) throw new Error(`sign-in failed: ${login.status}`);
  return `XSRF-TOKEN=${xsrf}; kerfcast.sid=${session}`;
}

// CPU time (user + system, ms) of a process and its descendants from /proc: unlike latency on a
// shared machine, it says what one request costs the process itself. Linux only; 0 elsewhere.
function cpuMsOfTree(pid: number): number {
  try {
    const fields = fs.readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
    let ticks = Number(fields[11]) + Number(fields[12]);
    for (const task of fs.readdirSync(`/proc/${pid}/task`)) {
      const children = fs.readFileSync(`/proc/${pid}/task/${task}/children`, 'utf8').trim();
      for (const child of children ? children.split(' ') : []) ticks += cpuMsOfTree(Number(child)) / 10;
    }
    return ticks * 10; // USER_HZ is 100 on Linux
  } catch {
    return 0;
  }
}

async function load(url: string, cookies: string[] = [], pid?: number) {
  // Connection n sends cookie n: fifty members with a session each.
  let next = 0;
  const setupClient = (client: { setHeaders(headers: Record<string, string>): void }) => {
    if (cookies.length) client.setHeaders({ cookie: cookies[next++ % cookies.length] });
  };
  // A short warm-up first, so both sides are measured with compiled code and full pools.
  await autocannon({ url, connections: CONNECTIONS, duration: 2, setupClient });
  const cpuBefore = pid ? cpuMsOfTree(pid) : 0;
  const result = await autocannon({ url, connections: CONNECTIONS, duration: DURATION_SECONDS, setupClient });
  const cpuPerRequest = pid && result.requests.total ? (cpuMsOfTree(pid) - cpuBefore) / result.requests.total : 0;
  if (result.non2xx > 0 || result.errors > 0) {
    throw new Error(`${url}: ${result.non2xx} non-2xx answers, ${result.errors} errors (${result.timeouts} timeouts), ${result.requests.total} requests`);
  }
  return { rps: result.requests.average, p50: result.latency.p50, p99: result.latency.p99, total: result.requests.total, cpuPerRequest };
}

/** The bare endpoint, run as its own process like the app: Express, a mysql2 pool, one query. */
async function runBare(port: number, studioId: number): Promise<void> {
  const config = loadConfig({ ...process.env, DB_NAME: DATABASE });
  const { typeCast: _typeCast, ...settings } = connectionSettings(config);
  const pool = mysql.createPool({ ...settings, connectionLimit: 10 });
  const app = express();
  app.get('/month', async (req, res) => {
    const from = String(req.query['from']);
    const to = String(req.query['to']);
    const [rows] = await pool.query(BARE_SQL, [studioId, addDaysText(from, -SHORT_SPAN_DAYS), to, from]);
    res.json(rows);
  });
  // The same month's JSON served from memory: no database, no session, so its latency is what this
  // machine (autocannon, Node and the loopback sharing its CPUs) allows for an answer of that size.
  let ceiling: Buffer | null = null;
  app.get('/ceiling', async (req, res) => {
    if (!ceiling) {
      const [rows] = await pool.query(BARE_SQL, [studioId, addDaysText(String(req.query['from']), -SHORT_SPAN_DAYS), String(req.query['to']), String(req.query['from'])]);
      ceiling = Buffer.from(JSON.stringify(rows));
    }
    res.type('application/json').send(ceiling);
  });
  app.listen(port, '127.0.0.1');
}

function addDaysText(date: string, days: number): string {
  return new Date(Date.parse(`${date}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
}

async function main(): Promise<void> {
  if (process.argv[2] === '--bare') return runBare(Number(process.argv[3]), Number(process.argv[4]));
  console.log(`bench:calendar — seeding ${EVENT_COUNT} events and ${MARKET_COUNT} recurring markets in ${DATABASE}…`);
  const studioId = await prepare();
  const [appPort, barePort, smtpPort] = [await freePort(), await freePort(), await freePort()];
  const app = startChild(['server/main.ts'], { PORT: String(appPort), DB_NAME: DATABASE, LOG_LEVEL: 'warn', CLIENT_DIST: 'does-not-exist', SEED_DEMO: '0', SMTP_PORT: String(smtpPort) });
  const bare = startChild([path.join('tests/bench/bench-calendar.ts'), '--bare', String(barePort), String(studioId)], { DB_NAME: DATABASE });
  try {
    const base = `http://127.0.0.1:${appPort}`;
    await waitFor(`${base}/api/health`, app);
    await waitFor(`http://127.0.0.1:${barePort}/month?from=${FROM}&to=${TO}`, bare);
    const cookies: string[] = [];
    for (let index = 0; index < CONNECTIONS; index++) cookies.push(await signInCookie(base, emailOf(index)));
    const cookie = cookies[0];
    const monthUrl = `${base}/api/studios/${studioId}/events?from=${FROM}&to=${TO}`;
    const sample = await fetch(monthUrl, { headers: { cookie } });
    const events = (await sample.json()) as { kind: string }[];
    const counts = events.reduce<Record<string, number>>((all, event) => ({ ...all, [event.kind]: (all[event.kind] ?? 0) + 1 }), {});
    console.log(`month ${FROM}..${TO}: ${events.length} events (${Object.entries(counts).map(([kind, n]) => `${kind} ${n}`).join(', ')})`);

    const real = await load(monthUrl, cookies, app.pid);
    const baseline = await load(`http://127.0.0.1:${barePort}/month?from=${FROM}&to=${TO}`, [], bare.pid);
    // What the signed-in stack (session, user, membership, one small query) costs on its own.
    const floor = await load(`${base}/api/studios/${studioId}`, cookies, app.pid);
    const ceiling = await load(`http://127.0.0.1:${barePort}/ceiling?from=${FROM}&to=${TO}`, [], bare.pid);
    const ratio = real.rps / baseline.rps;
    const line = (name: string, figures: typeof real) =>
      `${name.padEnd(34)} ${figures.rps.toFixed(0).padStart(7)} req/s   p50 ${String(figures.p50).padStart(4)} ms   p99 ${String(figures.p99).padStart(4)} ms   (${figures.total} requests, ${figures.cpuPerRequest.toFixed(2)} ms server CPU each)`;
    console.log(`\n${CONNECTIONS} connections, ${DURATION_SECONDS} s each:`);
    console.log(line('GET /events (real app, signed in)', real));
    console.log(line('bare Express + mysql2, one query', baseline));
    console.log(line('GET /api/studios/:id (stack floor)', floor));
    console.log(line('bare: the same JSON from memory', ceiling));
    console.log(`ratio (real / bare requests per second): ${ratio.toFixed(2)}`);
    console.log(`load average now: ${fs.readFileSync('/proc/loadavg', 'utf8').split(' ').slice(0, 3).join(' ')} on ${os.cpus().length} CPUs (figures are only as quiet as the machine)`);
    console.log(`targets: p99 ≤ 25 ms → ${real.p99 <= 25 ? 'met' : 'NOT met'}; ratio ≥ 0.5 → ${ratio >= 0.5 ? 'met' : 'NOT met'}`);
  } finally {
    app.kill('SIGTERM');
    bare.kill('SIGTERM');
  }
}

main().then(
  () => undefined,
  (error: Error) => {
    console.error(error);
    process.exit(1);
  },
);
