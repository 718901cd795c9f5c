// The project's own PostgreSQL: a cluster in .data/pg, listening on 127.0.0.1 only, on a fixed port.
// Idempotent: start() reuses a running or stopped cluster and clears a stale pid file left by a crash.
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readdirSync, readFileSync, rmSync, chownSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { ensureAptPackages } from './apt.mjs';

export const root = resolve(import.meta.dirname, '..', '..');
export const pgPort = Number(process.env.OSMOLANE_PG_PORT ?? 55432);
export const pgHost = '127.0.0.1';
const dataDir = join(root, '.data', 'pg');
const logDir = join(root, '.data', 'pg-log');
const isRoot = process.getuid?.() === 0;

/** Environment that the server, migrations and tests use to reach the cluster. */
export function pgEnv(database) {
  return { PGHOST: pgHost, PGPORT: String(pgPort), PGUSER: 'postgres', PGPASSWORD: '', PGDATABASE: database };
}

function binDir() {
  const base = '/usr/lib/postgresql';
  if (!existsSync(base)) return null;
  const versions = readdirSync(base).filter((v) => existsSync(join(base, v, 'bin', 'pg_ctl'))).sort((a, b) => Number(b) - Number(a));
  return versions.length ? join(base, versions[0], 'bin') : null;
}

function ensureBinaries() {
  let dir = binDir();
  if (!dir) {
    console.log('[db] PostgreSQL server binaries not found; installing Debian\'s postgresql package');
    ensureAptPackages(['postgresql']);
    dir = binDir();
  }
  if (!dir) throw new Error('PostgreSQL server binaries are still missing after installing the postgresql package');
  return dir;
}

/** Runs a PostgreSQL program as the postgres user when we are root (initdb refuses to run as root). */
function runAsOwner(program, args, options = {}) {
  const cmd = isRoot ? 'runuser' : program;
  const argv = isRoot ? ['-u', 'postgres', '--', program, ...args] : args;
  return spawnSync(cmd, argv, { encoding: 'utf8', ...options });
}

function owned(dir) {
  mkdirSync(dir, { recursive: true });
  if (isRoot) {
    const pw = execFileSync('id', ['-u', 'postgres'], { encoding: 'utf8' }).trim();
    const gr = execFileSync('id', ['-g', 'postgres'], { encoding: 'utf8' }).trim();
    chownSync(dir, Number(pw), Number(gr));
  }
}

function isRunning(bin) {
  const r = runAsOwner(join(bin, 'pg_ctl'), ['-D', dataDir, 'status']);
  return r.status === 0;
}

/** Starts the cluster (creating it on first use); returns true when this call started it. */
export function startPostgres() {
  const bin = ensureBinaries();
  mkdirSync(join(root, '.data'), { recursive: true });
  if (!existsSync(join(dataDir, 'PG_VERSION'))) {
    rmSync(dataDir, { recursive: true, force: true });
    owned(dataDir);
    console.log('[db] creating a new cluster in .data/pg');
    const r = runAsOwner(join(bin, 'initdb'), ['-D', dataDir, '-U', 'postgres', '--auth=trust', '-E', 'UTF8', '--locale=C.UTF-8']);
    if (r.status !== 0) throw new Error(`initdb failed:\n${r.stdout}\n${r.stderr}`);
  }
  owned(logDir);
  if (isRunning(bin)) return false;
  const pidFile = join(dataDir, 'postmaster.pid');
  if (existsSync(pidFile)) {
    // pg_ctl status said no server runs on this cluster: the pid file is left from a crash.
    console.log('[db] removing a stale postmaster.pid');
    rmSync(pidFile, { force: true });
  }
  const opts = `-p ${pgPort} -c listen_addresses=${pgHost} -c unix_socket_directories='' -c fsync=off -c max_connections=200`;
  const r = runAsOwner(join(bin, 'pg_ctl'), ['-D', dataDir, '-l', join(logDir, 'server.log'), '-o', opts, '-w', '-t', '60', 'start']);
  if (r.status !== 0) {
    const log = existsSync(join(logDir, 'server.log')) ? readFileSync(join(logDir, 'server.log'), 'utf8').split('\n').slice(-20).join('\n') : '';
    throw new Error(`PostgreSQL did not start on ${pgHost}:${pgPort}:\n${r.stdout}\n${r.stderr}\n${log}`);
  }
  console.log(`[db] PostgreSQL listening on ${pgHost}:${pgPort}`);
  return true;
}

export function stopPostgres() {
  const bin = binDir();
  if (!bin || !existsSync(join(dataDir, 'PG_VERSION'))) return;
  if (!isRunning(bin)) return;
  runAsOwner(join(bin, 'pg_ctl'), ['-D', dataDir, '-m', 'fast', '-w', 'stop']);
  console.log('[db] PostgreSQL stopped');
}

/** Creates the database when missing; with fresh=true drops it first (tests get a clean one each run). */
export async function ensureDatabase(name, { fresh = false } = {}) {
  const { default: pg } = await import('pg');
  const client = new pg.Client({ host: pgHost, port: pgPort, user: 'postgres', database: 'postgres' });
  await client.connect();
  try {
    if (fresh) await client.query(`drop database if exists "${name}" with (force)`);
    const found = await client.query('select 1 from pg_database where datname = $1', [name]);
    if (found.rowCount === 0) await client.query(`create database "${name}"`);
  } finally {
    await client.end();
  }
}

