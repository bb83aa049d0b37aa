#!/usr/bin/env node
// `npm test`: its own MariaDB (port TEST_DB_PORT, default 3317), Chromium when missing, the client
// build the browser tests use, every Jest project, then the closing `N passed, N failed` line.
import { execFileSync, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { buildClient } from './build-client.mjs';
import { ensureDependencies } from './ensure-deps.mjs';
import { startDb, stopDb } from './db.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const dbPort = process.env.TEST_DB_PORT ?? '3317';
const env = { ...process.env, DB_PORT: dbPort, NODE_ENV: 'test' };

function ensureChromium() {
  if (fs.existsSync('/usr/bin/chromium')) return;
  if (process.getuid?.() !== 0) {
    throw new Error("Chromium is missing for the browser tests. Run: sudo sh -c 'apt-get update && apt-get install -y chromium'");
  }
  console.log('[test] installing Chromium from Debian packages…');
  execFileSync('sh', ['-c', 'apt-get update && DEBIAN_FRONTEND=noninteractive apt-get install -y chromium'], { stdio: 'inherit' });
}

function summarise(file) {
  try {
    const report = JSON.parse(fs.readFileSync(file, 'utf8'));
    const failedSuites = report.testResults.filter((suite) => suite.status === 'failed' && suite.assertionResults.length === 0).length;
    return {
      passed: report.numPassedTests,
      failed: report.numFailedTests + failedSuites,
      skipped: report.numPendingTests + report.numTodoTests,
    };
  } catch {
    return null;
  }
}

/** One Jest run; its counts come from the JSON report (null when Jest died before writing it). */
function runJest(name, extraArgs, extraEnv = {}) {
  const output = path.join(root, 'test-output', `jest-${name}.json`);
  fs.mkdirSync(path.dirname(output), { recursive: true });
  fs.rmSync(output, { force: true });
  const args = [path.join(root, 'node_modules/jest/bin/jest.js'), '--json', `--outputFile=${output}`, ...extraArgs];
  if (process.env.CI) args.push('--ci');
  if (Object.keys(extraEnv).length) console.log(`[test] ${name}: ${Object.entries(extraEnv).map(([key, value]) => `${key}=${value}`).join(' ')}`);
  const result = spawnSync(process.execPath, args, { cwd: root, stdio: 'inherit', env: { ...env, ...extraEnv } });
  const counts = summarise(output) ?? { passed: 0, failed: 1, skipped: 0 };
  return { ...counts, isOk: result.status === 0 && counts.failed === 0 };
}

/**
 * A weekend day near the real date, for the browser tests' second pass: the coming Saturday on even
 * days of the month, the coming Sunday on odd ones, so that both come round.
 */
function weekendDay(now = new Date()) {
  const today = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate()));
  const wanted = today.getUTCDate() % 2 === 0 ? 6 : 0;
  const ahead = ((wanted - today.getUTCDay() + 7) % 7) || 7;
  return new Date(today.getTime() + ahead * 86_400_000).toISOString().slice(0, 10);
}

// With no arguments: the fast projects first on two workers (a file that crashes its process then fails
// alone), then the browser tests on their own so Chromium's timing does not compete with them. With
// TEST_WEEKEND_PASS=1 (.ci/run sets it) the browser tests run once more with the date pinned to a
// weekend day, so a test or seed that only holds on weekdays fails every time.
function phases() {
  const userArgs = process.argv.slice(2);
  if (userArgs.length) return [['custom', userArgs]];
  const browser = ['--selectProjects', 'e2e', '--maxWorkers=1'];
  return [
    ['unit-api', ['--selectProjects', 'shared', 'server', 'client', '--maxWorkers=2']],
    ['browser', browser],
    ...(process.env.TEST_WEEKEND_PASS === '1' ? [['browser-weekend', browser, { KERFCAST_TODAY: weekendDay() }]] : []),
  ];
}

async function main() {
  ensureDependencies();
  const total = { passed: 0, failed: 0, skipped: 0, isOk: true };
  await startDb(env);
  try {
    ensureChromium();
    buildClient();
    for (const [name, args, extraEnv] of phases()) {
      const counts = runJest(name, args, extraEnv);
      total.passed += counts.passed;
      total.failed += counts.failed;
      total.skipped += counts.skipped;
      total.isOk &&= counts.isOk;
    }
  } catch (error) {
    console.error(`[test] ${error.message}`);
    total.failed += 1;
    total.isOk = false;
  } finally {
    await stopDb(env);
  }
  console.log(`${total.passed} passed, ${total.failed} failed${total.skipped ? `, ${total.skipped} skipped` : ''}`);
  process.exit(total.isOk ? 0 : 1);
}

main().catch((error) => {
  console.error(`[test] ${error.message}`);
  console.log('0 passed, 1 failed');
  process.exit(1);
});
