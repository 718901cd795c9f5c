import { hostname } from 'node:os';
import type { SweepDetail, SweepEvent, SweepPointResult } from '../../shared/api';
import { parseDesign, type DesignDocument } from '../../shared/design';
import { rangeValues } from '../../shared/sweep';
import { loadConfig } from '../../server/config';
import { queryRow, queryRows } from '../../server/db/sql';
import { solveDesign } from '../../solver/solve';
import { pointDocument, pointResult } from '../../solver/sweep';
import { call, makeTeam, startTestServer, validDocument, type Team, type TestServer } from './harness';
import { startWorker, type WorkerProcess } from './workers';

/**
 * Sweeps against the real database with two real worker processes (server/jobs/worker-main.ts). The job expiry
 * is lowered to a few seconds so a killed worker's point comes back quickly; each point is held 250 ms after it
 * is claimed, so a test can catch one in flight.
 */

jest.setTimeout(60_000);

const CELLS = 80;
const WIDTH = '/shapes/1/width';
let t: TestServer;
let team: Team;
let revisionId: number;
let design: DesignDocument;
let workers: WorkerProcess[] = [];

const workerName = (w: WorkerProcess) => `${hostname()}:${w.pid}`;

function direct(pointers: string[], values: number[]): SweepPointResult {
  return JSON.parse(JSON.stringify(pointResult(solveDesign(pointDocument(design, pointers, values), { cells: CELLS })))) as SweepPointResult;
}

async function startSweep(token: string, body: Record<string, unknown>) {
  return call<SweepDetail & { error?: { field?: string } }>(t.base, 'POST', '/api/sweeps', { token, body: { revisionId, cells: CELLS, outputs: ['portCurrents', 'maxField', 'maxVorticity'], ...body } });
}

async function waitFor<T>(what: string, probe: () => Promise<T | null | undefined | false>, timeoutMs = 60_000): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const v = await probe();
    if (v) return v;
    if (Date.now() > until) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 25));
  }
}

/** Reads the event stream to its end (the sweep finishing), as the app does with fetch. */
async function readEvents(id: number, token: string): Promise<SweepEvent[]> {
  const r = await fetch(`${t.base}/api/sweeps/${id}/events`, { headers: { authorization: `Bearer ${token}` } });
  expect(r.status).toBe(200);
  expect(r.headers.get('content-type')).toContain('text/event-stream');
  const text = await r.text();
  return text
    .split('\n\n')
    .map((frame) => frame.split('\n').find((line) => line.startsWith('data: ')))
    .filter((line): line is string => !!line)
    .map((line) => JSON.parse(line.slice(6)) as SweepEvent);
}

/** Jobs of the sweep still waiting, retrying or running on the queue. */
async function pendingJobs(sweepId: number): Promise<number> {
  const row = await queryRow<{ n: string }>(t.orm.em.fork(), `select count(*) as n from pgboss.job where name = 'sweep-point' and (data->>'sweepId')::int = ?
     and state in ('created', 'retry', 'active')`, [sweepId]);
  return Number(row?.n);
}

beforeAll(async () => {
  t = await startTestServer({
    sweeps: { ...loadConfig().sweeps, jobExpirySeconds: 4, retryDelaySeconds: 1, maintenanceSeconds: 1, pollingSeconds: 0.5 },
  });
  team = await makeTeam(t.base, 'Sweep lab');
  const document = validDocument();
  const made = await call(t.base, 'POST', `/api/workspaces/${team.wid}/designs`, { token: team.editor.token, body: { name: 'Cross to sweep', document } });
  revisionId = (await call(t.base, 'POST', `/api/designs/${made.body.id}/revisions`, { token: team.editor.token, body: { note: 'to sweep' } })).body.id;
  const parsed = parseDesign(document);
  if (!parsed.ok) throw new Error('the demo cross does not parse');
  design = parsed.design;
  const env = { SWEEP_MAINTENANCE_SECONDS: '1', SWEEP_POLLING_SECONDS: '0.5', SWEEP_POINT_HOLD_MS: '250' };
  workers = await Promise.all([startWorker(env), startWorker(env)]);
}, 90_000);

afterAll(async () => {
  await Promise.all(workers.map((w) => w.stop()));
  await t.close();
});

it('solves a 20-point sweep of a shape width on two worker processes, each point equal to a direct solve', async () => {
  const range = { kind: 'linear', from: 5e-5, to: 8e-5, steps: 20 };
  const r = await startSweep(team.editor.token, { parameters: [{ pointer: WIDTH, range }] });
  expect(r.status).toBe(201);
  expect(r.body).toMatchObject({ method: 'jobs', total: 20, parameters: [{ pointer: WIDTH, label: 'Shape 2 width', dimension: 'length' }] });
  expect(['queued', 'solving']).toContain(r.body.status);

  const events = await readEvents(r.body.id, team.viewer.token);
  expect(events[0].type).toBe('snapshot');
  expect(events.filter((e) => e.type === 'point').length).toBeGreaterThan(0);
  expect(events.at(-1)).toMatchObject({ type: 'status', sweep: { status: 'solved', done: 20, failed: 0 } });

  const sweep = (await call<SweepDetail>(t.base, 'GET', `/api/sweeps/${r.body.id}`, { token: team.viewer.token })).body;
  expect(sweep.status).toBe('solved');
  const values = rangeValues(range as never);
  expect(sweep.points.map((p) => p.values[0])).toEqual(values);
  for (const p of sweep.points) {
    expect(p.status).toBe('solved');
    expect(p.result).toEqual(direct([WIDTH], p.values));
  }
  const names = await queryRows<{ worker: string }>(t.orm.em.fork(), 'select distinct worker from sweep_points where sweep_id = ?', [sweep.id]);
  console.log(`20-point sweep: points solved by ${names.map((n) => n.worker).join(' and ')}`);
  expect(await pendingJobs(sweep.id)).toBe(0);
});

it('answers a sweep of port potentials at once by superposition, equal to direct solves to round-off', async () => {
  const pointers = ['/ports/0/potential', '/ports/3/potential'];
  const r = await startSweep(team.owner.token, {
    parameters: [
      { pointer: pointers[0], range: { kind: 'list', values: [0, 250, 600] } },
      { pointer: pointers[1], range: { kind: 'linear', from: -100, to: 400, steps: 2 } },
    ],
    outputs: ['portCurrents', 'portFlowRates', 'maxField', 'maxVorticity', 'joulePower', 'warnings'],
  });
  expect(r.status).toBe(201);
  expect(r.body).toMatchObject({ method: 'superposed', status: 'solved', total: 6, done: 6 });
  expect(await pendingJobs(r.body.id)).toBe(0);
  const near = (a: number, b: number, scale: number) => expect(Math.abs(a - b)).toBeLessThanOrEqual(1e-6 * scale);
  for (const p of r.body.points) {
    const want = direct(pointers, p.values);
    const got = p.result!;
    const currents = Math.max(...want.ports.map((q) => Math.abs(q.current)));
    const flows = Math.max(...want.ports.map((q) => Math.abs(q.flowRate)));
    want.ports.forEach((q, j) => {
      near(got.ports[j].current, q.current, currents);
      near(got.ports[j].flowRate, q.flowRate, flows);
    });
    near(got.metrics.maxField, want.metrics.maxField, want.metrics.maxField);
    near(got.metrics.maxVorticity, want.metrics.maxVorticity, want.metrics.maxVorticity);
    near(got.metrics.joulePower, want.metrics.joulePower, Math.abs(want.metrics.joulePower));
    expect(got.warnings.map((w) => w.code).sort()).toEqual(want.warnings.map((w) => w.code).sort());
  }
});

it('lets editors and owners start sweeps, not viewers or reviewers; non-members get 404', async () => {
  const body = { parameters: [{ pointer: '/ports/0/potential', range: { kind: 'list', values: [1, 2] } }] };
  expect((await startSweep(team.viewer.token, body)).status).toBe(403);
  expect((await startSweep(team.reviewer.token, body)).status).toBe(403);
  expect((await startSweep(team.outsider.token, body)).status).toBe(404);
  const made = await startSweep(team.editor.token, body);
  expect(made.status).toBe(201);
  expect((await call(t.base, 'GET', `/api/sweeps/${made.body.id}`, { token: team.outsider.token })).status).toBe(404);
  expect((await call(t.base, 'GET', `/api/sweeps/${made.body.id}/events`, { token: team.outsider.token })).status).toBe(404);
  expect((await call(t.base, 'POST', `/api/sweeps/${made.body.id}/cancel`, { token: team.viewer.token })).status).toBe(403);
  const listed = await call(t.base, 'GET', `/api/designs/${made.body.designId}/sweeps`, { token: team.viewer.token });
  expect(listed.body.map((s: { id: number }) => s.id)).toContain(made.body.id);
});

it('refuses pointers that name no number (400) and more than 400 points (413)', async () => {
  const none = await startSweep(team.editor.token, { parameters: [{ pointer: '/shapes/9/width', range: { kind: 'list', values: [1] } }] });
  expect(none.status).toBe(400);
  expect(none.body.error?.field).toBe('parameters[0].pointer');
  const text = await startSweep(team.editor.token, { parameters: [{ pointer: '/name', range: { kind: 'list', values: [1] } }] });
  expect(text.status).toBe(400);
  const big = await startSweep(team.editor.token, {
    parameters: [
      { pointer: WIDTH, range: { kind: 'linear', from: 5e-5, to: 6e-5, steps: 21 } },
      { pointer: '/depth', range: { kind: 'linear', from: 1e-5, to: 2e-5, steps: 20 } },
    ],
  });
  expect(big.status).toBe(413);
});

it('opens a solved point as a run of the revision, the same run the second time', async () => {
  const r = await startSweep(team.editor.token, { parameters: [{ pointer: '/ports/0/potential', range: { kind: 'list', values: [100, 200] } }] });
  const first = await call(t.base, 'POST', `/api/sweeps/${r.body.id}/points/1/run`, { token: team.editor.token });
  expect(first.status).toBe(201);
  const again = await call(t.base, 'POST', `/api/sweeps/${r.body.id}/points/1/run`, { token: team.owner.token });
  expect(again).toMatchObject({ status: 200, body: { id: first.body.id } });
  const runDetail = await call(t.base, 'GET', `/api/runs/${first.body.id}`, { token: team.viewer.token });
  expect(runDetail.body).toMatchObject({ revisionId, status: 'solved', settings: { source: 'sweep', cells: CELLS, sweep: { id: r.body.id, point: 1 } } });
  expect(runDetail.body.settings.document.ports[0].potential).toBe(200);
  // The point solved again as a run, with its field blob: the superposed numbers to round-off.
  expect(runDetail.body.hasFields).toBe(true);
  const stored = r.body.points[1].result!.ports;
  runDetail.body.summary.ports.forEach((q: { id: string; current: number }, j: number) => {
    expect(q.id).toBe(stored[j].id);
    expect(Math.abs(q.current - stored[j].current)).toBeLessThanOrEqual(1e-6 * Math.max(...stored.map((x) => Math.abs(x.current))));
  });
  const blob = await call(t.base, 'GET', `/api/runs/${first.body.id}/fields`, { token: team.viewer.token });
  expect(blob.status).toBe(200);
});

it('cancels a sweep: its open points are cancelled and no job of it is left on the queue', async () => {
  const r = await startSweep(team.editor.token, { parameters: [{ pointer: WIDTH, range: { kind: 'linear', from: 5e-5, to: 7e-5, steps: 40 } }] });
  const id = r.body.id;
  await waitFor('a first solved point', async () => (await call<SweepDetail>(t.base, 'GET', `/api/sweeps/${id}`, { token: team.editor.token })).body.done > 0);
  const cancelled = await call<SweepDetail>(t.base, 'POST', `/api/sweeps/${id}/cancel`, { token: team.editor.token });
  expect(cancelled.status).toBe(200);
  expect(cancelled.body.status).toBe('cancelled');
  expect(cancelled.body.points.filter((p) => p.status === 'queued' || p.status === 'solving')).toEqual([]);
  expect(cancelled.body.points.some((p) => p.status === 'cancelled')).toBe(true);
  expect(await pendingJobs(id)).toBe(0);
  // A worker that was in the middle of a point stores nothing for it.
  await new Promise((r2) => setTimeout(r2, 1500));
  const later = (await call<SweepDetail>(t.base, 'GET', `/api/sweeps/${id}`, { token: team.editor.token })).body;
  expect(later.points.map((p) => p.status)).toEqual(cancelled.body.points.map((p) => p.status));
  expect(later.status).toBe('cancelled');
  expect(await pendingJobs(id)).toBe(0);
});

it('does not lose the point of a worker killed in the middle of it: the job expires and the other worker solves it', async () => {
  const [victim, survivor] = workers;
  const range = { kind: 'linear', from: 5e-5, to: 6e-5, steps: 6 };
  const r = await startSweep(team.editor.token, { parameters: [{ pointer: WIDTH, range }] });
  const id = r.body.id;
  const caught = await waitFor('a point in the hands of the first worker', () =>
    queryRow<{ index: number }>(t.orm.em.fork(), `select "index" from sweep_points where sweep_id = ? and status = 'solving' and worker = ?`, [id, workerName(victim)]),
  );
  await victim.stop('SIGKILL');
  const sweep = await waitFor(
    'the sweep to finish without the killed worker',
    async () => {
      const s = (await call<SweepDetail>(t.base, 'GET', `/api/sweeps/${id}`, { token: team.editor.token })).body;
      return s.status === 'solved' || s.status === 'failed' ? s : null;
    },
    60_000,
  );
  expect(sweep.status).toBe('solved');
  const point = sweep.points[caught.index];
  expect(point.status).toBe('solved');
  expect(point.attempts).toBeGreaterThanOrEqual(2);
  const row = await queryRow<{ worker: string }>(t.orm.em.fork(), 'select worker from sweep_points where sweep_id = ? and "index" = ?', [id, caught.index]);
  expect(row!.worker).toBe(workerName(survivor));
  for (const p of sweep.points) expect(p.result).toEqual(direct([WIDTH], p.values));
  expect(await pendingJobs(id)).toBe(0);
}, 90_000);
