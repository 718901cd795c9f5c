import { join } from 'node:path';
import { Worker } from 'node:worker_threads';
import type { SweepPointResult } from '../../shared/api';
import type { DesignDocument } from '../../shared/design';

export type SolverTask =
  | { kind: 'point'; document: unknown; pointers: string[]; values: number[]; cells: number }
  | { kind: 'superposed'; document: DesignDocument; pointers: string[]; points: number[][]; cells: number }
  /** A full solve kept as a run: the summary (the command line's JSON) and the compressed field blob. */
  | { kind: 'run'; document: unknown; cells: number };

export interface RunSolve {
  summary: Record<string, unknown>;
  blob: Uint8Array;
}

type Value<T extends SolverTask> = T extends { kind: 'point' } ? SweepPointResult : T extends { kind: 'run' } ? RunSolve : SweepPointResult[];

export interface SolverRequest {
  id: number;
  task: SolverTask;
  /** One Int32: set to 1 to stop the solve (read by the solver's shouldStop). */
  stop: SharedArrayBuffer;
}

export type SolverReply =
  | { id: number; ok: true; value: unknown }
  | { id: number; ok: false; error: { code: string; kind: 'refused' | 'cancelled' | 'internal'; message: string } };

/** A solve the solver refused (invalid point document, geometry problem), was stopped, or failed inside. */
export class SolverFailure extends Error {
  constructor(
    readonly code: string,
    readonly kind: 'refused' | 'cancelled' | 'internal',
    message: string,
  ) {
    super(message);
    this.name = 'SolverFailure';
  }
}

/** A way to stop a task already handed to a thread. */
export class StopSignal {
  readonly buffer = new SharedArrayBuffer(4);
  stop(): void {
    Atomics.store(new Int32Array(this.buffer), 0, 1);
  }
}

interface Slot {
  worker: Worker;
  busy: { id: number; resolve: (v: unknown) => void; reject: (e: Error) => void } | null;
}

const root = join(__dirname, '..', '..');

/** Starts the thread; under TypeScript (tsx, ts-jest) the thread registers tsx itself before loading its file. */
function startThread(): Worker {
  const file = join(__dirname, `solver-thread${__filename.endsWith('.ts') ? '.ts' : '.js'}`);
  if (!file.endsWith('.ts')) return new Worker(file);
  const boot = `require(${JSON.stringify(require.resolve('tsx/cjs'))}); require(${JSON.stringify(file)});`;
  return new Worker(boot, { eval: true, env: { ...process.env, TSX_TSCONFIG_PATH: join(root, 'tsconfig.server.json') } });
}

/**
 * Solver threads (worker_threads) so that solves never block a process's event loop: the API server answers
 * requests while it superposes a sweep, and a worker process keeps its job queue and cancellation checks alive
 * while a point is solved. Threads start on first use; a thread that dies fails its task and is replaced.
 */
export class SolverPool {
  private readonly slots: Slot[] = [];
  private readonly waiting: Array<{ request: SolverRequest; resolve: (v: unknown) => void; reject: (e: Error) => void }> = [];
  private nextId = 1;
  private closed = false;

  constructor(readonly size = 1) {}

  run<T extends SolverTask>(task: T, signal: StopSignal = new StopSignal()): Promise<Value<T>> {
    if (this.closed) return Promise.reject(new SolverFailure('internal', 'internal', 'the solver pool is closed'));
    return new Promise((resolve, reject) => {
      this.waiting.push({ request: { id: this.nextId++, task, stop: signal.buffer }, resolve: resolve as (v: unknown) => void, reject });
      this.dispatch();
    });
  }

  private dispatch(): void {
    while (this.waiting.length > 0) {
      let slot = this.slots.find((s) => !s.busy);
      if (!slot && this.slots.length < this.size) slot = this.spawn();
      if (!slot) return;
      const next = this.waiting.shift()!;
      slot.busy = { id: next.request.id, resolve: next.resolve, reject: next.reject };
      slot.worker.postMessage(next.request);
    }
  }

  private spawn(): Slot {
    const slot: Slot = { worker: startThread(), busy: null };
    slot.worker.on('message', (reply: SolverReply) => {
      const busy = slot.busy;
      slot.busy = null;
      if (busy && busy.id === reply.id) {
        if (reply.ok) busy.resolve(reply.value);
        else busy.reject(new SolverFailure(reply.error.code, reply.error.kind, reply.error.message));
      }
      this.dispatch();
    });
    const lost = (why: string) => {
      const index = this.slots.indexOf(slot);
      if (index < 0) return;
      this.slots.splice(index, 1);
      slot.busy?.reject(new SolverFailure('internal', 'internal', `the solver thread stopped: ${why}`));
      slot.busy = null;
      if (!this.closed) this.dispatch();
    };
    slot.worker.on('error', (err) => lost(err.message));
    slot.worker.on('exit', (code) => lost(`exit code ${code}`));
    this.slots.push(slot);
    return slot;
  }

  async close(): Promise<void> {
    this.closed = true;
    const closed = () => new SolverFailure('internal', 'internal', 'the solver pool is closed');
    for (const w of this.waiting.splice(0)) w.reject(closed());
    await Promise.all(
      this.slots.splice(0).map((s) => {
        s.busy?.reject(closed());
        s.busy = null;
        return s.worker.terminate();
      }),
    );
  }
}
