#!/usr/bin/env node
// The project's own PostgreSQL: install, create, start, stop. Plain Node with no npm packages,
// because `npm start` and `npm test` call it before anything is installed.
//
//   node scripts/db.mjs ensure   # install if missing, init, start, create app + test databases
//   node scripts/db.mjs stop     # stop the cluster
//   node scripts/db.mjs status   # say where it lives and whether it runs
//
// DATABASE_URL, when set, skips all of this: a real deployment brings its own server.
import { execFileSync, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const projectDir = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
export const DB_USER = 'sixfold';
export const APP_DB = 'sixfold';
export const TEST_DB = 'sixfold_test';

export function dbPort() {
  const port = Number(process.env.DB_PORT ?? 54329);
  if (!Number.isInteger(port) || port < 1024 || port > 65535) {
    throw new Error(`DB_PORT must be a port number from 1024 to 65535, got "${process.env.DB_PORT}"`);
  }
  return port;
}

/** The URLs of the app and test databases on the project's own cluster. */
export function localUrls() {
  const base = `postgres://${DB_USER}@127.0.0.1:${dbPort()}`;
  return { app: `${base}/${APP_DB}`, test: `${base}/${TEST_DB}` };
}

const log = (msg) => process.stderr.write(`[db] ${msg}\n`);

function run(cmd, args, opts = {}) {
  const res = spawnSync(cmd, args, { encoding: 'utf8', ...opts });
  return { ok: res.status === 0, out: `${res.stdout ?? ''}${res.stderr ?? ''}`.trim(), status: res.status };
}

/** Runs a command as the postgres user when we are root (postgres refuses to run as root). */
function runPg(cmd, args, opts = {}) {
  if (isRoot) return run('runuser', ['-u', 'postgres', '--', cmd, ...args], { cwd: '/', ...opts });
  return run(cmd, args, opts);
}

function findBinDir() {
  const base = '/usr/lib/postgresql';
  if (!existsSync(base)) return null;
  const versions = readdirSync(base)
    .filter((v) => existsSync(join(base, v, 'bin', 'pg_ctl')))
    .sort((a, b) => Number(b) - Number(a));
  return versions.length > 0 ? join(base, versions[0], 'bin') : null;
}

function installPostgres() {
  if (!isRoot) {
    throw new Error(
      "PostgreSQL's server is not installed. Install Debian's package (sudo apt-get install -y postgresql) or set DATABASE_URL.",
    );
  }
  log("installing Debian's postgresql package (once)");
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
  execFileSync('apt-get', ['install', '-y', '-qq', 'postgresql'], { stdio: 'inherit', env });
}

function pathHash() {
  return createHash('sha256').update(projectDir).digest('hex').slice(0, 12);
}

/** Can the postgres user create files in dir? (A clone in a root-only temp folder cannot.) */
function postgresCanWrite(dir) {
  if (!isRoot) return true;
  return run('runuser', ['-u', 'postgres', '--', 'test', '-w', dir], { cwd: '/' }).ok;
}

/** Where the cluster lives: .data/pg in the project, or a postgres-owned folder outside it. */
export function clusterDir() {
  const inside = join(projectDir, '.data');
  mkdirSync(inside, { recursive: true });
  if (isRoot) run('chown', ['postgres:postgres', inside]);
  if (postgresCanWrite(inside)) return join(inside, 'pg');
  const home = existsSync('/var/lib/postgresql') ? '/var/lib/postgresql' : '/tmp';
  const outside = join(home, `sixfold-${pathHash()}`);
  mkdirSync(outside, { recursive: true, mode: 0o700 });
  run('chown', ['postgres:postgres', outside]);
  writeFileSync(join(inside, 'CLUSTER_LOCATION'), `${outside}\n`);
  return join(outside, 'pg');
}

/** A short socket directory: a Unix socket path is limited to about 107 bytes. */
function socketDir(dataDir) {
  if (dataDir.length <= 70) return dataDir;
  const dir = `/tmp/sixfold-${pathHash()}`;
  mkdirSync(dir, { recursive: true, mode: 0o700 });
  if (isRoot) run('chown', ['postgres:postgres', dir]);
  return dir;
}

/**
 * Server settings passed at every start (they win over postgresql.conf). Saving takes writes
 * about 130 kB of WAL each, so at 100 a second the defaults checkpoint every half minute, and
 * each checkpoint is followed by a burst of full-page images that stalls commits. Never
 * anything that can lose an acknowledged write: fsync, synchronous_commit and full_page_writes
 * stay on.
 */
export const SERVER_SETTINGS = {
  // Checkpoints by time (15 min), not by WAL volume; spread over 90% of the interval.
  max_wal_size: '4GB',
  min_wal_size: '256MB',
  checkpoint_timeout: '15min',
  checkpoint_completion_target: '0.9',
  // Full-page images compressed (lz4 is cheap), so the burst after a checkpoint is smaller.
  wal_compression: 'lz4',
  // Room for a few hundred takes' WAL before a backend has to write it out itself.
  wal_buffers: '16MB',
  shared_buffers: '256MB',
  // The background writer cleans pages ahead, so a backend seldom writes one out to get a buffer.
  bgwriter_delay: '50ms',
  bgwriter_lru_maxpages: '400',
  // A take's played notes and score (tens of kB of JSON) are compressed with lz4, not pglz.
  default_toast_compression: 'lz4',
  // Compiling a query plan can take longer than the query itself; short statements never gain.
  jit: 'off',
  // What stalls look like afterwards: checkpoints and autovacuum runs over a second in server.log.
  log_checkpoints: 'on',
  log_autovacuum_min_duration: '1s',
};

/** SERVER_SETTINGS as postgres command-line options, for the server's major version. */
export function serverOptions(major = 15) {
  const settings = { ...SERVER_SETTINGS };
  // lz4 for WAL came in PostgreSQL 15 and for TOAST in 14; older servers compress WAL with pglz.
  if (major < 15) settings.wal_compression = 'on';
  if (major < 14) delete settings.default_toast_compression;
  return Object.entries(settings)
    .map(([name, value]) => `-c ${name}=${value}`)
    .join(' ');
}

function isRunning(bin, dataDir) {
  return runPg(join(bin, 'pg_ctl'), ['status', '-D', dataDir]).status === 0;
}

/** A postmaster.pid left by a crash blocks a start when its pid now belongs to something else. */
function clearStalePid(dataDir) {
  const pidFile = join(dataDir, 'postmaster.pid');
  if (!existsSync(pidFile)) return;
  const pid = Number(readFileSync(pidFile, 'utf8').split('\n')[0]);
  let alive = false;
  try {
    process.kill(pid, 0);
    const cmdline = readFileSync(`/proc/${pid}/cmdline`, 'utf8');
    alive = cmdline.includes('postgres');
  } catch {
    alive = false;
  }
  if (!alive) {
    log(`removing a stale postmaster.pid (pid ${pid} is gone)`);
    rmSync(pidFile, { force: true });
  }
}

function psql(bin, db, sql) {
  return run(join(bin, 'psql'), ['-h', '127.0.0.1', '-p', String(dbPort()), '-U', DB_USER, '-d', db, '-tAc', sql]);
}

function ensureDatabase(bin, name) {
  const found = psql(bin, 'postgres', `SELECT 1 FROM pg_database WHERE datname = '${name}'`);
  if (!found.ok) throw new Error(`cannot reach the database server: ${found.out}`);
  if (found.out === '1') return;
  const made = psql(bin, 'postgres', `CREATE DATABASE "${name}"`);
  if (!made.ok && !/already exists/.test(made.out)) throw new Error(`cannot create database ${name}: ${made.out}`);
  log(`created database ${name}`);
}

/** Brings the project's cluster up (idempotent) and returns the database URLs. */
export function ensure() {
  if (process.env.DATABASE_URL) {
    log('DATABASE_URL is set: using that server');
    return { app: process.env.DATABASE_URL, test: process.env.TEST_DATABASE_URL ?? process.env.DATABASE_URL };
  }
  let bin = findBinDir();
  if (!bin) {
    installPostgres();
    bin = findBinDir();
    if (!bin) throw new Error('PostgreSQL was installed but its server binaries were not found');
  }
  const dataDir = clusterDir();
  if (!existsSync(join(dataDir, 'PG_VERSION'))) {
    log(`creating a cluster in ${dataDir}`);
    rmSync(dataDir, { recursive: true, force: true });
    mkdirSync(dataDir, { recursive: true, mode: 0o700 });
    if (isRoot) run('chown', ['-R', 'postgres:postgres', dirname(dataDir)]);
    const init = runPg(join(bin, 'initdb'), ['-D', dataDir, '-A', 'trust', '-U', DB_USER, '-E', 'UTF8', '--locale=C']);
    if (!init.ok) throw new Error(`initdb failed: ${init.out}`);
  }
  if (!isRunning(bin, dataDir)) {
    clearStalePid(dataDir);
    const sock = socketDir(dataDir);
    const major = Number(bin.split('/').at(-2)) || 15;
    const opts = `-p ${dbPort()} -k ${sock} -c listen_addresses=127.0.0.1 ${serverOptions(major)}`;
    log(`starting PostgreSQL on 127.0.0.1:${dbPort()}`);
    const started = runPg(join(bin, 'pg_ctl'), [
      '-D',
      dataDir,
      '-o',
      opts,
      '-l',
      join(dataDir, 'server.log'),
      '-w',
      '-t',
      '60',
      'start',
    ]);
    if (!started.ok && !isRunning(bin, dataDir)) {
      let tail = '';
      try {
        tail = readFileSync(join(dataDir, 'server.log'), 'utf8').split('\n').slice(-15).join('\n');
      } catch {}
      throw new Error(`PostgreSQL did not start: ${started.out}\n${tail}`);
    }
  }
  ensureDatabase(bin, APP_DB);
  ensureDatabase(bin, TEST_DB);
  return localUrls();
}

export function stop() {
  if (process.env.DATABASE_URL) {
    log('DATABASE_URL is set: nothing of ours to stop');
    return;
  }
  const bin = findBinDir();
  if (!bin) return;
  const dataDir = clusterDir();
  if (!existsSync(join(dataDir, 'PG_VERSION')) || !isRunning(bin, dataDir)) {
    log('not running');
    return;
  }
  const res = runPg(join(bin, 'pg_ctl'), ['-D', dataDir, '-m', 'fast', '-w', 'stop']);
  log(res.ok ? 'stopped' : `stop failed: ${res.out}`);
}

function status() {
  const bin = findBinDir();
  const dataDir = clusterDir();
  const running = bin ? isRunning(bin, dataDir) : false;
  console.log(JSON.stringify({ binDir: bin, dataDir, port: dbPort(), running, urls: localUrls() }, null, 2));
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const cmd = process.argv[2] ?? 'ensure';
  try {
    if (cmd === 'ensure') console.log(JSON.stringify(ensure()));
    else if (cmd === 'stop') stop();
    else if (cmd === 'status') status();
    else throw new Error(`unknown command "${cmd}" (ensure, stop, status)`);
  } catch (err) {
    process.stderr.write(`[db] ${err.message}\n`);
    process.exit(1);
  }
}
