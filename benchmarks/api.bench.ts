/**
 * API load benchmark (`npm run bench:api`): the real server in a child process on loopback, on a fresh database
 * seeded with the demo workspace, driven by autocannon. Not a test: it prints a table and says whether the goals
 * of issue 5 were met (reads p95 under 50 ms, no errors, server memory flat).
 *
 *   baseline   GET /api/health                                  100 clients  (same process, for comparison)
 *   reads      GET designs list / GET one design, alternating   100 clients
 *   runs       POST a run with an 8 MB field blob (base64)      10 clients
 *
 * Reads and run uploads go in two rounds, and the server's RSS is read after each (from /proc). Beside the latencies,
 * the CPU time per request of the server process and of its PostgreSQL backends (from /proc): on a machine shared
 * with other work those move much less than the latencies do, so they are the figures to compare between changes.
 * Env: BENCH_SECONDS (each reads phase, default 10), BENCH_RUNS (uploads per round, default 30), BENCH_PORT (default 4390).
 */
import { spawn, execFileSync, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import os from 'node:os';
import { join } from 'node:path';
import type { SignInResponse } from '../shared/api';
import { demoDesigns } from '../server/seed/designs';

interface AutocannonResult {
  requests: { average: number; total: number };
  errors: number;
  timeouts: number;
  non2xx: number;
  duration: number;
}
interface AutocannonTracker {
  on(event: 'response', listener: (client: unknown, status: number, bytes: number, ms: number) => void): void;
}
type Autocannon = (opts: Record<string, unknown>, done: (err: Error | null, result: AutocannonResult) => void) => AutocannonTracker;
// autocannon ships no types; this is the part of its API used here.
// eslint-disable-next-line @typescript-eslint/no-require-imports
const autocannon = require('autocannon') as Autocannon;

const root = join(__dirname, '..');
const port = Number(process.env['BENCH_PORT'] ?? 4390);
const base = `http://127.0.0.1:${port}`;
const seconds = Number(process.env['BENCH_SECONDS'] ?? 10);
const runUploads = Number(process.env['BENCH_RUNS'] ?? 30);
const database = 'osmolane_bench';

function rssMiB(pid: number): number {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  const kb = Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? NaN);
  return kb / 1024;
}

/** CPU time (user + system) of a process so far, in microseconds; 0 once it is gone. */
function cpuMicros(pid: number | string): number {
  try {
    const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1]!.split(' ');
    return ((Number(fields[11]) + Number(fields[12])) * 1e6) / clockTicks;
  } catch {
    return 0;
  }
}
const clockTicks = Number(execFileSync('getconf', ['CLK_TCK'], { encoding: 'utf8' }).trim()) || 100;

/** CPU time of the PostgreSQL backends serving the benchmark's database (their command line names it). */
function postgresMicros(): number {
  const backend = new RegExp(`^postgres: \\S+ ${database} `);
  let total = 0;
  for (const pid of readdirSync('/proc')) {
    if (!/^\d+$/.test(pid)) continue;
    try {
      if (backend.test(readFileSync(`/proc/${pid}/cmdline`, 'utf8'))) total += cpuMicros(pid);
    } catch {
      // ended meanwhile
    }
  }
  return total;
}

function percentile(sorted: number[], p: number): number {
  if (!sorted.length) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]!;
}

async function startServer(): Promise<ChildProcess> {
  execFileSync('node', [join(root, 'scripts', 'db.mjs'), 'ensure', database, '--fresh'], { stdio: 'inherit' });
  const child = spawn(process.execPath, ['--import', 'tsx', join(root, 'server', 'main.ts')], {
    cwd: root,
    env: {
      ...process.env,
      TSX_TSCONFIG_PATH: join(root, 'tsconfig.server.json'),
      PGDATABASE: database,
      PORT: String(port),
      SEED_DEMO: '1',
      LOG_REQUESTS: '0',
      JSON_LIMIT: '16mb',
    },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  for (let i = 0; i < 240; i++) {
    if (child.exitCode !== null) throw new Error('the server stopped while starting');
    try {
      if ((await fetch(`${base}/api/health`)).ok) return child;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error('the server did not answer /api/health within a minute');
}

async function api<T>(method: string, path: string, token: string | null, body?: unknown): Promise<T> {
  const r = await fetch(`${base}${path}`, {
    method,
    headers: { 'content-type': 'application/json', ...(token ? { authorization: `Bearer ${token}` } : {}) },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  if (!r.ok) throw new Error(`${method} ${path}: ${r.status} ${await r.text()}`);
  return (await r.json()) as T;
}

interface Row {
  name: string;
  clients: number;
  requests: number;
  perSecond: number;
  p50: number;
  p95: number;
  p99: number;
  errors: number;
  /** CPU time per request (µs) of the server process and of its PostgreSQL backends. */
  serverCpu: number;
  postgresCpu: number;
  /** Answers other than 2xx, by status, and transport errors. */
  problems: string;
}

function load(serverPid: number, name: string, opts: Record<string, unknown>): Promise<Row> {
  const times: number[] = [];
  const cpu0 = [cpuMicros(serverPid), postgresMicros()];
  const statuses = new Map<number, number>();
  return new Promise((resolve, reject) => {
    const tracker = autocannon({ ...opts, url: `${base}${(opts['path'] as string | undefined) ?? ''}` }, (err, result) => {
      if (err) return reject(err);
      times.sort((a, b) => a - b);
      resolve({
        name,
        clients: opts['connections'] as number,
        requests: result.requests.total,
        perSecond: result.requests.total / result.duration,
        p50: percentile(times, 50),
        p95: percentile(times, 95),
        p99: percentile(times, 99),
        errors: result.errors + result.timeouts + result.non2xx,
        serverCpu: (cpuMicros(serverPid) - cpu0[0]!) / result.requests.total,
        postgresCpu: (postgresMicros() - cpu0[1]!) / result.requests.total,
        problems: [
          ...[...statuses].filter(([s]) => s < 200 || s >= 300).map(([s, n]) => `${n} x ${s}`),
          ...(result.errors ? [`${result.errors} errors`] : []),
          ...(result.timeouts ? [`${result.timeouts} timeouts`] : []),
        ].join(', '),
      });
    });
    tracker.on('response', (_client, status, _bytes, ms) => {
      times.push(ms);
      statuses.set(status, (statuses.get(status) ?? 0) + 1);
    });
  });
}

function table(rows: Row[]): void {
  const head = ['benchmark', 'clients', 'requests', 'req/s', 'p50 ms', 'p95 ms', 'p99 ms', 'errors', 'server µs/req', 'pg µs/req'];
  const lines = rows.map((r) =>
    [r.name, r.clients, r.requests, r.perSecond.toFixed(0), r.p50.toFixed(1), r.p95.toFixed(1), r.p99.toFixed(1), r.errors, r.serverCpu.toFixed(0), r.postgresCpu.toFixed(0)].map(String),
  );
  const widths = head.map((h, k) => Math.max(h.length, ...lines.map((l) => l[k]!.length)));
  const fmt = (cells: string[]) => cells.map((c, k) => (k === 0 ? c.padEnd(widths[k]!) : c.padStart(widths[k]!))).join('  ');
  console.log(`\n${fmt(head)}\n${widths.map((w) => '-'.repeat(w)).join('  ')}`);
  for (const l of lines) console.log(fmt(l));
  for (const r of rows) if (r.problems) console.log(`  ${r.name}: ${r.problems}`);
}

async function main(): Promise<void> {
  const server = await startServer();
  try {
    const pid = server.pid!;
    const signIn = await api<SignInResponse>('POST', '/api/auth/sign-in', null, { email: 'jonas.lindqvist@example.test', password: process.env['DEMO_PASSWORD'] || 'osmolane-demo' });
    const auth = { authorization: `Bearer ${signIn.token}`, 'content-type': 'application/json' };
    const [ws] = await api<{ id: number }[]>('GET', '/api/workspaces', signIn.token);
    // A page of 50 designs to list: the four demo designs plus copies.
    const demo = demoDesigns();
    for (let k = 0; k < 46; k++) {
      const d = demo[k % demo.length]!;
      await api('POST', `/api/workspaces/${ws!.id}/designs`, signIn.token, { name: `${d.name} (copy ${k + 1})`, document: d.document });
    }
    const list = await api<{ items: { id: number }[] }>('GET', `/api/workspaces/${ws!.id}/designs?limit=50`, signIn.token);
    const designId = list.items[0]!.id;
    const revision = await api<{ id: number }>('POST', `/api/designs/${designId}/revisions`, signIn.token, { note: 'benchmark' });
    const reads = [
      { method: 'GET', path: `/api/workspaces/${ws!.id}/designs?limit=50`, headers: auth },
      { method: 'GET', path: `/api/designs/${designId}`, headers: auth },
    ];

    const rss: [string, number][] = [['at start', rssMiB(pid)]];
    await load(pid, 'warm-up', { connections: 20, duration: 2, requests: reads });
    const rows: Row[] = [];
    rows.push(await load(pid, 'baseline: health', { connections: 100, duration: Math.max(2, seconds / 3), path: '/api/health' }));
    rss.push(['after warm-up', rssMiB(pid)]);
    const body = JSON.stringify({ settings: { cells: 800 }, summary: { ports: [], metrics: {}, warnings: [] }, fields: randomBytes(8 * 1024 * 1024).toString('base64') });
    // Two rounds of the same work: memory that keeps growing from round to round is a leak; growth in the
    // first round only is the heap and the allocator settling.
    for (const round of [1, 2]) {
      rows.push(await load(pid, `reads: list + design #${round}`, { connections: 100, duration: seconds, requests: reads }));
      rows.push(await load(pid, `runs: 8 MB blob #${round}`, { connections: 10, amount: runUploads, method: 'POST', path: `/api/revisions/${revision.id}/runs`, headers: auth, body, timeout: 120 }));
      rss.push([`after round ${round}`, rssMiB(pid)]);
    }

    table(rows);
    console.log(`\nserver RSS (MiB): ${rss.map(([when, mib]) => `${when} ${mib.toFixed(0)}`).join(', ')}`);
    const readRows = rows.filter((r) => r.name.startsWith('reads'));
    const p95ok = readRows.every((r) => r.p95 < 50);
    const clean = rows.every((r) => r.errors === 0);
    const [first, second] = [rss[rss.length - 2]![1], rss[rss.length - 1]![1]];
    const growth = (second - first) / first;
    console.log(
      `goals: reads p95 < 50 ms ${p95ok ? 'met' : 'NOT met'}; no errors ${clean ? 'met' : 'NOT met'}; ` +
        `memory ${growth < 0.1 ? 'flat' : 'NOT flat'} (${growth >= 0 ? '+' : ''}${(growth * 100).toFixed(0)}% from round 1 to round 2)`,
    );
    console.log(`machine: ${os.cpus().length} cores, load average ${os.loadavg().map((l) => l.toFixed(1)).join(' ')} (other work on the machine skews latency)`);
  } finally {
    server.kill('SIGTERM');
    await new Promise((r) => server.once('exit', r));
    // Leave no gigabytes of benchmark blobs behind.
    execFileSync('node', [join(root, 'scripts', 'db.mjs'), 'ensure', database, '--fresh'], { stdio: 'ignore' });
  }
}

main().catch((err: unknown) => {
  console.error('[bench:api]', err instanceof Error ? err.message : err);
  process.exit(1);
});
