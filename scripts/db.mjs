#!/usr/bin/env node
// Private MariaDB instance for Kerfcast: installed from Debian's packages when missing, data directory
// inside the project, its own port, socket, pid file and log. Never touches a system server on 3306.
import { execFileSync, spawn, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

export function dbSettings(env = process.env) {
  const port = Number(env.DB_PORT ?? 3307);
  const dir = path.resolve(env.DB_DIR ?? path.join(root, '.db', String(port)));
  return {
    port,
    dir,
    dataDir: path.join(dir, 'data'),
    socket: path.join(dir, 'mysqld.sock'),
    pidFile: path.join(dir, 'mysqld.pid'),
    logFile: path.join(dir, 'error.log'),
    configFile: path.join(dir, 'my.cnf'),
    user: env.DB_USER ?? 'kerfcast',
    password: env.DB_PASSWORD ?? 'kerfcast-local-only',
    databases: (env.DB_NAMES ?? 'kerfcast,kerfcast_test,kerfcast_e2e').split(','),
  };
}

function which(command) {
  const result = spawnSync('sh', ['-c', `command -v ${command}`], { encoding: 'utf8' });
  return result.status === 0 ? result.stdout.trim() : null;
}

function findBinary(name) {
  return which(name) ?? ['/usr/sbin', '/usr/bin'].map((d) => path.join(d, name)).find(fs.existsSync) ?? null;
}

function ensureInstalled() {
  if (findBinary('mariadbd')) return;
  const isRoot = process.getuid?.() === 0;
  const command = 'apt-get update && DEBIAN_FRONTEND=noninteractive apt-get install -y mariadb-server';
  if (!isRoot) {
    throw new Error(`MariaDB is not installed and we are not root. Run:\n  sudo sh -c '${command}'`);
  }
  console.log('[db] mariadbd not found; installing mariadb-server from Debian packages…');
  execFileSync('sh', ['-c', command], { stdio: 'inherit' });
  if (!findBinary('mariadbd')) throw new Error('mariadb-server installed but mariadbd is still missing');
}

function writeConfig(s) {
  fs.mkdirSync(s.dir, { recursive: true });
  const lines = [
    '[mysqld]',
    `datadir=${s.dataDir}`,
    `socket=${s.socket}`,
    `pid-file=${s.pidFile}`,
    `log-error=${s.logFile}`,
    `port=${s.port}`,
    'bind-address=127.0.0.1',
    'skip-name-resolve',
    'user=root',
    'character-set-server=utf8mb4',
    'collation-server=utf8mb4_unicode_ci',
    'innodb_buffer_pool_size=128M',
    'innodb_log_file_size=64M',
    'innodb_flush_log_at_trx_commit=2',
    'max_connections=300',
    'local_infile=1',
    '[client]',
    `socket=${s.socket}`,
    `port=${s.port}`,
  ];
  fs.writeFileSync(s.configFile, lines.join('\n') + '\n');
}

function isPidAlive(pid) {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

function readPid(s) {
  try {
    const pid = Number(fs.readFileSync(s.pidFile, 'utf8').trim());
    return Number.isFinite(pid) && pid > 0 ? pid : null;
  } catch {
    return null;
  }
}

function portIsFree(port) {
  return new Promise((resolve) => {
    const server = net.createServer();
    server.once('error', () => resolve(false));
    server.once('listening', () => server.close(() => resolve(true)));
    server.listen(port, '127.0.0.1');
  });
}

function client(s, sql) {
  return spawnSync(findBinary('mariadb') ?? 'mysql', [`--defaults-file=${s.configFile}`, '-uroot', '-e', sql], {
    encoding: 'utf8',
  });
}

function answers(s) {
  return client(s, 'SELECT 1').status === 0;
}

const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

function logTail(s) {
  try {
    return fs.readFileSync(s.logFile, 'utf8').split('\n').slice(-15).join('\n');
  } catch {
    return '(no error log)';
  }
}

export async function startDb(env = process.env) {
  const s = dbSettings(env);
  ensureInstalled();
  writeConfig(s);
  const runningPid = readPid(s);
  if (runningPid && isPidAlive(runningPid) && answers(s)) {
    console.log(`[db] reusing MariaDB on 127.0.0.1:${s.port} (pid ${runningPid})`);
    provision(s);
    return s;
  }
  if (!(await portIsFree(s.port))) {
    throw new Error(`port ${s.port} on 127.0.0.1 is taken by another program; set DB_PORT to a free port`);
  }
  if (!fs.existsSync(path.join(s.dataDir, 'mysql'))) {
    fs.mkdirSync(s.dataDir, { recursive: true });
    const init = spawnSync(
      findBinary('mariadb-install-db') ?? 'mysql_install_db',
      [`--defaults-file=${s.configFile}`, '--auth-root-authentication-method=socket', '--skip-test-db'],
      { encoding: 'utf8' },
    );
    if (init.status !== 0) {
      throw new Error(`could not initialise ${s.dataDir} (disk full or not writable?):\n${init.stderr || init.stdout}`);
    }
  }
  const child = spawn(findBinary('mariadbd'), [`--defaults-file=${s.configFile}`], {
    detached: true,
    stdio: 'ignore',
  });
  child.unref();
  let exited = false;
  child.once('exit', () => (exited = true));
  for (let i = 0; i < 200; i += 1) {
    if (answers(s)) {
      provision(s);
      console.log(`[db] MariaDB up on 127.0.0.1:${s.port} (data in ${path.relative(root, s.dataDir)})`);
      return s;
    }
    if (exited) break;
    await sleep(150);
  }
  throw new Error(`MariaDB did not start on port ${s.port}. Last lines of ${s.logFile}:\n${logTail(s)}`);
}

function provision(s) {
  const quoted = s.password.replace(/'/g, "''");
  const statements = [
    `CREATE USER IF NOT EXISTS '${s.user}'@'127.0.0.1' IDENTIFIED BY '${quoted}'`,
    `CREATE USER IF NOT EXISTS '${s.user}'@'localhost' IDENTIFIED BY '${quoted}'`,
    ...s.databases.map((name) => `CREATE DATABASE IF NOT EXISTS \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`),
    // Every kerfcast* database, so test runs can make throw-away ones of their own.
    `GRANT ALL PRIVILEGES ON \`kerfcast%\`.* TO '${s.user}'@'127.0.0.1'`,
    `GRANT ALL PRIVILEGES ON \`kerfcast%\`.* TO '${s.user}'@'localhost'`,
    `GRANT FILE ON *.* TO '${s.user}'@'127.0.0.1'`,
    'FLUSH PRIVILEGES',
  ];
  const result = client(s, statements.join(';\n'));
  if (result.status !== 0) throw new Error(`could not create databases and user: ${result.stderr}`);
}

export async function stopDb(env = process.env) {
  const s = dbSettings(env);
  const pid = readPid(s);
  if (!pid || !isPidAlive(pid)) {
    console.log(`[db] no MariaDB running for port ${s.port}`);
    return;
  }
  spawnSync(findBinary('mariadb-admin') ?? 'mysqladmin', [`--defaults-file=${s.configFile}`, '-uroot', 'shutdown'], {
    encoding: 'utf8',
  });
  for (let i = 0; i < 300 && isPidAlive(pid); i += 1) await sleep(100);
  if (isPidAlive(pid)) process.kill(pid, 'SIGKILL');
  console.log(`[db] MariaDB on port ${s.port} stopped`);
}

if (process.argv[1] && fileURLToPath(import.meta.url) === path.resolve(process.argv[1])) {
  const action = process.argv[2];
  const run = action === 'stop' ? stopDb : action === 'start' ? startDb : null;
  if (!run) {
    console.error('usage: node scripts/db.mjs start|stop');
    process.exit(2);
  }
  run().catch((error) => {
    console.error(`[db] ${error.message}`);
    process.exit(1);
  });
}
