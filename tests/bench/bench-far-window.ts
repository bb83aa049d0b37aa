// npm run bench:far-window (issue 22, item 4): GET /events for a whole year centuries after the first
// day of 50 weekly markets, as crew, on the real app and MariaDB, each year asked once (cold: the
// market dates are cached per rule and year), and /api/health asked every 5 ms meanwhile. Prints
// each answer's time and health's slowest answer. Target: each under 100 ms, health unaffected.
// Uses its own scratch database, kerfcast_bench_far.
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { prepareDatabase } from '../helpers/global-setup';
import { makeStudio, makeTestApp, signIn, testConfig } from '../helpers/test-app';
import { addMarket } from '../api/feeds-fixtures';

const DATABASE = 'kerfcast_bench_far';
const MARKETS = 50;
const YEARS = [2190, 2191, 2192, 2193, 2194, 2195, 2196, 2197, 2198, 2199];

async function main(): Promise<void> {
  await prepareDatabase(DATABASE);
  const t = makeTestApp({ config: testConfig({ DB_NAME: DATABASE }), signInLimits: { perAccount: 100, perAddress: 100_000, windowMs: 60_000 } });
  const server = await new Promise<ReturnType<typeof t.app.listen>>((resolve) => {
    const listening = t.app.listen(0, '127.0.0.1', () => resolve(listening));
  });
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  try {
    const { studioId, members } = await makeStudio(t.db);
    for (let index = 0; index < MARKETS; index++) await addMarket(t.db, studioId, { name: `Market ${index}`, start: '2026-01-03', rrule: 'FREQ=WEEKLY;BYDAY=SA' });
    const crew = await signIn(t.app, members.crew.email);
    let slowestHealth = 0;
    let polling = true;
    const poll = (async () => {
      while (polling) {
        const started = performance.now();
        await request(base).get('/api/health');
        slowestHealth = Math.max(slowestHealth, performance.now() - started);
        await new Promise((resolve) => setTimeout(resolve, 5));
      }
    })();
    const times: number[] = [];
    for (const year of YEARS) {
      const started = performance.now();
      const response = await crew.get(`/api/studios/${studioId}/events`).query({ from: `${year}-01-01`, to: `${year}-12-31` });
      times.push(performance.now() - started);
      if (response.status !== 200) throw new Error(`GET /events ${year}: ${response.status}`);
    }
    polling = false;
    await poll;
    const sorted = [...times].sort((a, b) => a - b);
    console.log(`${MARKETS} weekly markets from 2026, one year asked each time (${YEARS[0]}–${YEARS.at(-1)}), ms:`);
    console.log(`  each: ${times.map((time) => time.toFixed(1)).join(', ')}`);
    console.log(`  median ${sorted[Math.floor(sorted.length / 2)].toFixed(1)}, max ${sorted.at(-1)!.toFixed(1)}; /api/health slowest meanwhile ${slowestHealth.toFixed(1)}`);
  } finally {
    server.close();
    await t.close();
  }
}

main().catch((error: Error) => {
  console.error(error);
  process.exit(1);
});
