// Builds the Angular client unless dist/ is already newer than every source it is built from.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

function newest(dir) {
  let latest = 0;
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) latest = Math.max(latest, newest(full));
    else if (!entry.name.endsWith('.spec.ts')) latest = Math.max(latest, fs.statSync(full).mtimeMs);
  }
  return latest;
}

export function buildClient({ force = false } = {}) {
  const index = path.join(root, 'dist/kerfcast/browser/index.html');
  const sources = Math.max(newest(path.join(root, 'src')), newest(path.join(root, 'shared')), fs.statSync(path.join(root, 'angular.json')).mtimeMs);
  if (!force && fs.existsSync(index) && fs.statSync(index).mtimeMs > sources) {
    console.log('[build] client is up to date');
    return;
  }
  console.log('[build] building the client (production)…');
  const result = spawnSync(process.execPath, [path.join(root, 'node_modules/@angular/cli/bin/ng.js'), 'build', '--configuration', 'production'], {
    cwd: root,
    stdio: ['ignore', 'inherit', 'inherit'],
    env: { ...process.env, NG_CLI_ANALYTICS: 'false' },
  });
  if (result.status !== 0) throw new Error('the client build failed (see above)');
}

if (process.argv[1] && fileURLToPath(import.meta.url) === path.resolve(process.argv[1])) {
  try {
    buildClient({ force: process.argv.includes('--force') });
  } catch (error) {
    console.error(`[build] ${error.message}`);
    process.exit(1);
  }
}
