// bench:calendar-ui (issue 6): in headless Chromium, the month view with 300 events must render in
// ≤ 100 ms and drag frames stay ≤ 16 ms. The figures come from the Performance API marks the calendar
// itself sets: "kc-month-render" (month-view.ts: from new day entries to the rendered, laid-out grid)
// and "kc-drag-frame" (render-marks.ts: a drag move's pointer handler plus the next frame's style
// and layout). Prints them; it is a measurement, not a test.
import os from 'node:os';
import { addDays, dateRange } from '@shared/calendar/dates';
import { prepareDatabase } from '../helpers/global-setup';
import { makeStudio, testPassword } from '../helpers/test-app';

const EVENT_COUNT = 300;
const RENDER_RUNS = Number(process.env["RUNS"] ?? 7);
const DATABASE = process.env['BENCH_DB_NAME'] ?? 'kerfcast_bench_calendar_ui';

// Seeded linear congruential generator (Numerical Recipes constants): the same month every run.
let state = 7;
function nextRandom(): number {
  state = (1664525 * state + 1013904223) % 2 ** 32;
  return state / 2 ** 32;
}

function localToday(): string {
  const now = new Date();
  return `${now.getFullYear()}-${String(now.getMonth() + 1).padStart(2, '0')}-${String(now.getDate()).padStart(2, '0')}`;
}

interface TraceEvent {
  name: string;
  cat: string;
  ph: string;
  ts: number;
  dur?: number;
  tdur?: number;
  pid: number;
  tid: number;
  args?: { name?: string };
}

/**
 * Main-thread CPU time (thread time, "tdur") of the renderer's tasks inside [from, to) in trace
 * microseconds. Unlike wall time it leaves out the time the thread waited for a busy CPU.
 */
function cpuBetween(tasks: TraceEvent[], from: number, to: number): number {
  let cpu = 0;
  for (const task of tasks) {
    const end = task.ts + (task.dur ?? 0);
    const overlap = Math.min(end, to) - Math.max(task.ts, from);
    if (overlap > 0 && task.dur) cpu += ((task.tdur ?? 0) * overlap) / task.dur;
  }
  return cpu / 1000;
}

function readTrace(buffer: Buffer) {
  const events: TraceEvent[] = JSON.parse(buffer.toString()).traceEvents;
  const marks = events.filter((event) => event.cat.includes('blink.user_timing'));
  const owner = marks[0];
  const tasks = events.filter((event) => event.ph === 'X' && event.name === 'RunTask' && event.pid === owner?.pid && event.tid === owner?.tid);
  const starts = (name: string) => marks.filter((event) => event.name === name && (event.ph === 'b' || event.ph === 'R' || event.ph === 'I' || event.ph === 'n')).map((event) => event.ts);
  return { tasks, starts };
}

function percentile(values: number[], share: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil(share * sorted.length) - 1)];
}

const ms = (value: number) => `${value.toFixed(1)} ms`;

async function main(): Promise<void> {
  process.env['E2E_DB_NAME'] = DATABASE;
  // Rebuilt unless up to date (buildClient compares times), so the figures never come from a stale build.
  if (!process.env['E2E_CLIENT_DIST']) {
    const { buildClient } = await import('../../scripts/build-client.mjs' as string);
    buildClient();
  }
  await prepareDatabase(DATABASE);
  const { startBrowserHarness, signInAs } = await import('../helpers/browser');
  const harness = await startBrowserHarness();
  try {
    const { studioId, members } = await makeStudio(harness.app.db, ['owner', 'partner'], 'Bench bench studio');
    const month = localToday().slice(0, 7);
    const days = dateRange(addDays(`${month}-01`, -6), addDays(`${month}-28`, 9));
    const kinds = ['build', 'build', 'content', 'content', 'launch'] as const;
    const rows = Array.from({ length: EVENT_COUNT }, (_, index) => {
      const kind = kinds[index % kinds.length];
      const start = days[Math.floor(nextRandom() * (days.length - 3))];
      const span = kind === 'launch' ? 0 : nextRandom() < 0.8 ? 0 : 1 + Math.floor(nextRandom() * 2);
      const end = addDays(start, span);
      return {
        studio_id: studioId,
        step_index: index % 11,
        kind,
        title: `${kind === 'build' ? 'Cut' : kind === 'content' ? 'Film' : 'Launch'} batch ${index + 1}`,
        start_date: start,
        end_date: end,
        days: JSON.stringify(dateRange(start, end)),
        span_days: span,
        work_days: kind === 'launch' ? 0 : span + 1,
        hours_per_day: kind === 'launch' ? 0 : 1 + Math.floor(nextRandom() * 3),
        cure_days: 0,
        assignee_user_id: index % 3 === 0 ? members.partner.id : null,
      };
    });
    await harness.app.db.batchInsert('events', rows, 100);

    const page = await harness.newPage();
    await signInAs(page, members.partner.email, testPassword);
    const renders: { duration: number; chips: number }[] = [];
    const renderCpu: number[] = [];
    for (let run = 0; run < RENDER_RUNS; run++) {
      await harness.browser.startTracing(page, { categories: ['blink.user_timing', 'toplevel', 'disabled-by-default-devtools.timeline'] });
      await page.goto(`/studios/${studioId}/calendar`);
      await page.waitForFunction(
        (count) => performance.getEntriesByName('kc-month-render').some((entry) => ((entry as PerformanceMeasure).detail?.chips ?? 0) >= count),
        EVENT_COUNT,
      );
      const measures = await page.evaluate(() =>
        performance.getEntriesByName('kc-month-render').map((entry) => ({ duration: entry.duration, chips: (entry as PerformanceMeasure).detail?.chips ?? 0 })),
      );
      // The render that brought the month's events in (the largest number of chips).
      renders.push(measures.reduce((best, entry) => (entry.chips > best.chips ? entry : best)));
      const trace = readTrace(await harness.browser.stopTracing());
      const begin = trace.starts('kc-month-render-start').at(-1)!;
      const end = trace.starts('kc-month-render-end').at(-1)!;
      renderCpu.push(cpuBetween(trace.tasks, begin, end));
    }
    const chipCount = await page.locator('kc-month-view kc-event-chip').count();

    // Drag one step across the grid and back to its own day (a drop there sends nothing).
    const source = page.locator('kc-month-view kc-event-chip:not(.cdk-drag-disabled)').first();
    const from = (await source.boundingBox())!;
    const grid = (await page.locator('kc-month-view .month').boundingBox())!;
    await page.evaluate(() => performance.clearMeasures('kc-drag-frame'));
    await harness.browser.startTracing(page, { categories: ['blink.user_timing', 'toplevel', 'disabled-by-default-devtools.timeline'] });
    await page.mouse.move(from.x + from.width / 2, from.y + from.height / 2);
    await page.mouse.down();
    await page.mouse.move(from.x + from.width / 2 + 10, from.y + from.height / 2 + 10, { steps: 5 });
    for (let lap = 0; lap < 3; lap++) {
      await page.mouse.move(grid.x + grid.width - 40, grid.y + grid.height - 40, { steps: 60 });
      await page.mouse.move(grid.x + 40, grid.y + 60, { steps: 60 });
    }
    await page.mouse.move(from.x + from.width / 2, from.y + from.height / 2, { steps: 30 });
    await page.mouse.up();
    await page.waitForTimeout(300);
    const frames = await page.evaluate(() => performance.getEntriesByName('kc-drag-frame').map((entry) => entry.duration));
    const dragTrace = readTrace(await harness.browser.stopTracing());
    // A frame's CPU: the main thread's work from one pointer move to the next.
    const moves = dragTrace.starts('kc-drag-frame').sort((a, b) => a - b);
    const frameCpu = moves.slice(0, -1).map((start, index) => cpuBetween(dragTrace.tasks, start, moves[index + 1]));

    const renderTimes = renders.map((render) => render.duration);
    console.log(`bench:calendar-ui — headless Chromium (${(await harness.browser.version()) || 'chromium'}), month view, ${EVENT_COUNT} stored events (${renders[0].chips} day entries incl. holidays/occasions, ${chipCount} chips on screen, the rest behind “+N more”)`);
    console.log(`  month render (kc-month-render) over ${RENDER_RUNS} page loads: median ${ms(percentile(renderTimes, 0.5))}, max ${ms(Math.max(...renderTimes))}  (target ≤ 100 ms: ${Math.max(...renderTimes) <= 100 ? 'met' : 'NOT met'})`);
    console.log(`  drag frames (kc-drag-frame), ${frames.length} frames: median ${ms(percentile(frames, 0.5))}, p95 ${ms(percentile(frames, 0.95))}, max ${ms(Math.max(...frames))}  (target ≤ 16 ms: ${percentile(frames, 0.95) <= 16 ? 'met at p95' : 'NOT met at p95'}${Math.max(...frames) <= 16 ? ', and at max' : ''})`);
    console.log(`  the same, as main-thread CPU time from a trace (leaves out waiting for a busy CPU): month render median ${ms(percentile(renderCpu, 0.5))}, max ${ms(Math.max(...renderCpu))}; drag frames median ${ms(percentile(frameCpu, 0.5))}, p95 ${ms(percentile(frameCpu, 0.95))}, max ${ms(Math.max(...frameCpu))}`);
    console.log(`  machine: ${os.cpus().length} CPUs, load average ${os.loadavg().map((load) => load.toFixed(1)).join(' ')} (wall figures grow with the load)`);
    await page.context().close();
  } finally {
    await harness.close();
  }
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
