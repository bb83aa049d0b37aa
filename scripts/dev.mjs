#!/usr/bin/env node
// `npm run dev`: the API (with the demo seed) on PORT and `ng serve` with a proxy to it, for live reloading.
import { spawn } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { startDb } from './db.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

await startDb();
const children = [
  spawn(process.execPath, [path.join(root, 'node_modules/tsx/dist/cli.mjs'), 'watch', path.join(root, 'server/main.ts')], {
    cwd: root,
    stdio: 'inherit',
    env: { ...process.env, NODE_ENV: 'development', SEED_DEMO: '1', CLIENT_DIST: 'no-client-in-dev' },
  }),
  spawn(process.execPath, [path.join(root, 'node_modules/@angular/cli/bin/ng.js'), 'serve'], { cwd: root, stdio: 'inherit' }),
];
const stop = () => children.forEach((child) => child.kill('SIGTERM'));
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
children.forEach((child) => child.on('exit', stop));
