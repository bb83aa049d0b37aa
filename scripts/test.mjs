#!/usr/bin/env node
// `npm test`: its own MariaDB (port TEST_DB_PORT, default 3317), Chromium when missing, the client
// build the browser tests use, every Jest project, then the closing `N passed, N failed` line.
import { execFileSync, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { buildClient } from './build-client.mjs';
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

async function main() {
  let exitCode = 1;
  let counts = null;
  await startDb(env);
  try {
    ensureChromium();
    buildClient();
    const output = path.join(root, 'test-output', 'jest.json');
    fs.mkdirSync(path.dirname(output), { recursive: true });
    fs.rmSync(output, { force: true });
    const args = [path.join(root, 'node_modules/jest/bin/jest.js'), '--json', `--outputFile=${output}`, ...process.argv.slice(2)];
    if (process.env.CI) args.push('--ci');
    // Two workers even on two cores: a test file that crashes its process then fails alone instead of
    // ending the whole run (one worker would run every file inside Jest's own process).
    if (!process.argv.some((arg) => arg.startsWith('--maxWorkers') || arg === '-i' || arg === '--runInBand')) args.push('--maxWorkers=2');
    const result = spawnSync(process.execPath, args, { cwd: root, stdio: 'inherit', env });
    counts = summarise(output);
    exitCode = result.status ?? 1;
  } finally {
    await stopDb(env);
  }
  if (!counts) counts = { passed: 0, failed: 1, skipped: 0 };
  console.log(`${counts.passed} passed, ${counts.failed} failed${counts.skipped ? `, ${counts.skipped} skipped` : ''}`);
  process.exit(exitCode === 0 && counts.failed === 0 ? 0 : 1);
}

main().catch((error) => {
  console.error(`[test] ${error.message}`);
  console.log('0 passed, 1 failed');
  process.exit(1);
});
