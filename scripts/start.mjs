#!/usr/bin/env node
// `npm start`: private database up, client built, then the server (which migrates and seeds the demo studio).
import { spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { buildClient } from './build-client.mjs';
import { ensureDependencies } from './ensure-deps.mjs';
import { startDb } from './db.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

function localSecret() {
  const file = path.join(root, '.runtime', 'session-secret');
  if (!fs.existsSync(file)) {
    fs.mkdirSync(path.dirname(file), { recursive: true });
    fs.writeFileSync(file, randomBytes(32).toString('hex'), { mode: 0o600 });
  }
  return fs.readFileSync(file, 'utf8').trim();
}

async function main() {
  ensureDependencies();
  await startDb();
  buildClient();
  // A local run is a development run (the captured-mail page is on); the secret is made once and kept.
  const env = { NODE_ENV: 'development', SESSION_SECRET: localSecret(), ...process.env, SEED_DEMO: '1' };
  const server = spawn(process.execPath, [path.join(root, 'node_modules/tsx/dist/cli.mjs'), path.join(root, 'server/main.ts')], {
    cwd: root,
    stdio: 'inherit',
    env,
  });
  const forward = (signal) => server.kill(signal);
  process.on('SIGINT', forward);
  process.on('SIGTERM', forward);
  server.on('exit', (code) => process.exit(code ?? 0));
}

main().catch((error) => {
  console.error(`[start] ${error.message}`);
  process.exit(1);
});
