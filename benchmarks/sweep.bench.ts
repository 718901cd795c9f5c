/**
 * npm run bench:sweep — sweep throughput on this machine.
 *
 * A 40-point sweep of the demo serpentine's side-wall zeta (not a drive, so one job per point) solved by 1 and
 * then 2 worker processes (real `worker-main` processes on a fresh database, sweep-bench-env.ts), timed from the
 * request to the last stored point; then a 40-point sweep of its injection-port potential over the same number of
 * points, answered at once by superposition. A direct solve in this process is the baseline for one point. All of
 * it at each grid of CELLS.
 * Each configuration runs ROUNDS times, alternating, and the fastest round is reported (the machine's cores are
 * shared with whatever else runs, so the load average is printed too).
 */
import { BENCH_DATABASE } from './sweep-bench-env';
import { execFileSync } from 'node:child_process';
import { cpus, loadavg } from 'node:os';
import { join } from 'node:path';
import type { SweepRequest } from '../shared/api';
import { loadConfig } from '../server/config';
import { openDatabase } from '../server/db/orm';
import { queryRow } from '../server/db/sql';
import { Mailbox } from '../server/mail/mailbox';
import { Mailer } from '../server/mail/mailer';
import { createServices } from '../server/services';
import { demoEmail, seedDemo } from '../server/seed/demo';
import { demoDesigns } from '../server/seed/designs';
import { solveDesign } from '../solver/solve';
import { startWorker } from '../tests/integration/workers';

const POINTS = 40;
/**
 * Grid cells along the serpentine's longer side: the sweeps' default (120, a point in a few hundredths of a
 * second, where the queue's own cost shows) and about the layout's default solve grid (450, 10 cells across its
 * channel, where the solve dominates and the scaling with processes shows). BENCH_CELLS=N runs one of them.
 */
const CELLS = process.env['BENCH_CELLS'] ? [Number(process.env['BENCH_CELLS'])] : [120, 450];
const ROUNDS = 3;
const root = join(__dirname, '..');

interface Row {
  what: string;
  workers: string;
  seconds: number;
  points: number;
  note: string;
}

async function main(): Promise<void> {
  execFileSync('node', [join(root, 'scripts', 'db.mjs'), 'ensure', BENCH_DATABASE, '--fresh'], { stdio: 'inherit' });

  const config = { ...loadConfig(), logRequests: false, passwordHashCost: 4, sweeps: { ...loadConfig().sweeps, pollingSeconds: 0.5 } };
  const orm = await openDatabase();
  await seedDemo(orm, config);
  const services = createServices({ orm, config, mailer: Mailer.memory(new Mailbox(), config.mailFrom) });
  const em = orm.em.fork();
  const found = await queryRow<{ revision_id: number; workspace_id: number; user_id: number }>(
    em,
    `select r.id as revision_id, d.workspace_id, u.id as user_id from revisions r join designs d on d.id = r.design_id
     join users u on u.email = ? where d.name = 'Serpentine separation channel'`,
    [demoEmail('Jonas Lindqvist')],
  );
  if (!found) throw new Error('the demo serpentine was not seeded');
  const access = { userId: found.user_id, workspaceId: found.workspace_id, role: 'editor' as const };
  const sweep = (pointer: string, from: number, to: number, cells: number): SweepRequest & { cells: number; outputs: SweepRequest['outputs'] } => ({
    revisionId: found.revision_id,
    parameters: [{ pointer, range: { kind: 'linear', from, to, steps: POINTS } }],
    outputs: ['portCurrents', 'portFlowRates', 'maxField', 'maxVorticity', 'joulePower', 'warnings'],
    cells,
  });
  const serpentine = demoDesigns()[1]!.document;
  for (const cells of CELLS) await measure(cells);
  await services.stop();
  await orm.close(true);

  async function measure(cells: number): Promise<void> {
    // Baseline: one direct solve of the serpentine here (after a warm-up).
    solveDesign(serpentine, { cells });
    let direct = Infinity;
    for (let k = 0; k < 5; k++) {
      const t0 = performance.now();
      solveDesign(serpentine, { cells });
      direct = Math.min(direct, (performance.now() - t0) / 1000);
    }

    const rows: Row[] = [{ what: 'direct solve in this process', workers: '–', seconds: direct, points: 1, note: 'one point, no queue (fastest of 5)' }];

    const best = new Map<number, Row>();
    for (let round = 0; round < ROUNDS; round++) for (const n of [1, 2]) {
      const workers = await Promise.all(Array.from({ length: n }, () => startWorker({ SWEEP_POLLING_SECONDS: '0.5' })));
      try {
        const started = performance.now();
        const made = await services.sweeps.create(access, sweep('/zeta/side', -0.08, -0.02, cells));
        for (;;) {
          const s = await queryRow<{ status: string }>(orm.em.fork(), 'select status from sweeps where id = ?', [made.id]);
          if (s && s.status !== 'queued' && s.status !== 'solving') break;
          await new Promise((r) => setTimeout(r, 50));
        }
        const seconds = (performance.now() - started) / 1000;
        const stats = await queryRow<{ solved: string; mean: number; by: string }>(
          orm.em.fork(),
          `select count(*) filter (where status = 'solved') as solved, avg(seconds) as mean, count(distinct worker) as by from sweep_points where sweep_id = ?`,
          [made.id],
        );
        const row = {
          what: `zeta sweep, one job per point`,
          workers: String(n),
          seconds,
          points: Number(stats!.solved),
          note: `fastest of ${ROUNDS}; mean solve ${Number(stats!.mean).toFixed(2)} s a point; points taken by ${stats!.by} process(es)`,
        };
        if (!best.has(n) || seconds < best.get(n)!.seconds) best.set(n, row);
      } finally {
        await Promise.all(workers.map((w) => w.stop()));
      }
    }
    rows.push(best.get(1)!, best.get(2)!);

    let fastest: Row | null = null;
    for (let round = 0; round < ROUNDS; round++) {
      const started = performance.now();
      const superposed = await services.sweeps.create(access, sweep('/ports/0/potential', 0, 1600, cells));
      const seconds = (performance.now() - started) / 1000;
      if (!fastest || seconds < fastest.seconds) {
        fastest = { what: 'port potential sweep, superposed', workers: '0 (API thread)', seconds, points: superposed.done, note: `fastest of ${ROUNDS}; ${superposed.method}: one unit solve per drive (2 ports), then sums` };
      }
    }
    rows.push(fastest!);

    console.log(`\nSweep of the demo serpentine, ${POINTS} points, ${cells} cells (${new Date().toISOString()}; ${cpus().length} cores, load average ${loadavg().map((l) => l.toFixed(1)).join(' / ')})\n`);
    const head = ['sweep', 'workers', 'points', 'seconds', 'points/min', 'notes'];
    const table = rows.map((r) => [r.what, r.workers, String(r.points), r.seconds.toFixed(2), ((60 * r.points) / r.seconds).toFixed(1), r.note]);
    const widths = head.map((h, k) => Math.max(h.length, ...table.map((t) => t[k].length)));
    const line = (cells: string[]) => cells.map((c, k) => (k >= 1 && k <= 4 ? c.padStart(widths[k]) : c.padEnd(widths[k]))).join('  ');
    console.log(line(head));
    console.log(widths.map((w) => '-'.repeat(w)).join('  '));
    for (const t of table) console.log(line(t));
    const [one, two] = [rows[1], rows[2]];
  console.log(`\nspeed-up with 2 worker processes: ${(one.seconds / two.seconds).toFixed(2)}x; ideal points/min for one process from the direct solve: ${(60 / direct).toFixed(1)}`);
  }
}

main().catch((err: unknown) => {
  console.error(err);
  process.exit(1);
});
