#!/usr/bin/env node
// The V8 settings the server runs with: `npm start`, `npm run dev`, and the benchmarks that time it.
// A 64 MB young generation instead of the default 16 MB: building a feed or a month view makes
// thousands of short-lived objects, and with the smaller one many are copied into the old
// generation before they die, so collection takes a large share of each build.
import { spawn } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

export const SERVER_NODE_OPTIONS = '--max-semi-space-size=64';

/** The environment with the server's settings added to any NODE_OPTIONS already there. */
export function withServerFlags(env = process.env) {
  return { ...env, NODE_OPTIONS: [env.NODE_OPTIONS, SERVER_NODE_OPTIONS].filter(Boolean).join(' ') };
}

// `node scripts/server-flags.mjs <file.ts> [args…]` runs a TypeScript file with tsx under those settings.
if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
  const child = spawn(process.execPath, [path.join(root, 'node_modules/tsx/dist/cli.mjs'), ...process.argv.slice(2)], {
    cwd: process.cwd(),
    stdio: 'inherit',
    env: withServerFlags(),
  });
  for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => child.kill(signal));
  child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
}
