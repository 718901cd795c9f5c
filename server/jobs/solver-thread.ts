/**
 * A solver thread (worker_threads): takes sweep tasks from the pool (solver-pool.ts) and answers with the
 * result or the solver's refusal. Runs the same solver/ code as the browser's Web Worker and the command line.
 */
import { parentPort } from 'node:worker_threads';
import { writeFieldBlob } from '../../shared/field-blob';
import { resultJson, SolveError, solveDesign } from '../../solver/solve';
import { solvePoint, superposedSweep } from '../../solver/sweep';
import type { SolverReply, SolverRequest, SolverTask } from './solver-pool';

async function perform(task: SolverTask, shouldStop: () => boolean): Promise<unknown> {
  switch (task.kind) {
    case 'run': {
      const result = solveDesign(task.document, { cells: task.cells, shouldStop });
      return { summary: resultJson(result), blob: await writeFieldBlob(result.fields) };
    }
    case 'point':
      return solvePoint(task.document, task.pointers, task.values, { cells: task.cells, shouldStop });
    case 'superposed':
      return superposedSweep(task.document, task.pointers, task.points, { cells: task.cells, shouldStop }).results;
  }
}

parentPort!.on('message', async ({ id, task, stop }: SolverRequest) => {
  const flag = new Int32Array(stop);
  let reply: SolverReply;
  try {
    reply = { id, ok: true, value: await perform(task, () => Atomics.load(flag, 0) === 1) };
  } catch (err) {
    const e = err instanceof SolveError ? err : new SolveError('internal', err instanceof Error ? err.message : String(err));
    reply = { id, ok: false, error: { code: e.code, kind: e.kind, message: e.message } };
  }
  parentPort!.postMessage(reply);
});
