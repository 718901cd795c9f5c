/**
 * @jest-environment node
 */
// Node's MessageChannel stands in for the worker's (jsdom has none).
import { expose, releaseProxy, type Remote } from 'comlink';
import type { SolverApi } from '../../workers/solver-api';
import { WorkerSolverClient } from './solver-client';

const started: Array<{ terminate: () => void }> = [];
afterEach(() => started.splice(0).forEach((w) => w.terminate()));

/** A stand-in Worker: one end of a MessageChannel, the solver api exposed on the other. */
function fakeWorker(api: SolverApi) {
  const channel = new MessageChannel();
  expose(api, channel.port2);
  const port = channel.port1 as MessagePort & { terminate: () => void; terminated: boolean };
  port.terminated = false;
  port.terminate = () => {
    port.terminated = true;
    channel.port1.close();
    channel.port2.close();
  };
  port.start();
  started.push(port);
  return port;
}

describe('WorkerSolverClient', () => {
  it('passes progress through a proxied callback and returns the outcome', async () => {
    const api: SolverApi = {
      hello: async () => ({ ready: true, at: 1 }),
      measure: async () => ({ narrowest: 5e-5, bounds: [0, 0, 1e-3, 5e-5] }),
      solve: async (_design, options, onProgress) => {
        await onProgress?.({ stage: 'potential', fraction: 0.5 });
        (onProgress as Remote<(p: unknown) => void> | undefined)?.[releaseProxy]();
        return { ok: false, error: { code: 'test', message: `cells ${options.cells}` } };
      },
    };
    const client = new WorkerSolverClient(() => fakeWorker(api) as unknown as Worker);
    const progress: number[] = [];
    const outcome = await client.solve({}, { cells: 42 }, (p) => progress.push(p.fraction));
    expect(outcome).toEqual({ ok: false, error: { code: 'test', message: 'cells 42' } });
    expect(progress).toEqual([0.5]);
    expect((await client.measure({})).narrowest).toBe(5e-5);
  });

  it('cancels by ending the busy worker, then starts a fresh one', async () => {
    const workers: Array<ReturnType<typeof fakeWorker>> = [];
    let calls = 0;
    const api: SolverApi = {
      hello: async () => ({ ready: true, at: 2 }),
      measure: async () => ({ narrowest: null, bounds: null }),
      // The first solve never finishes (a worker stuck in a long loop); later ones answer.
      solve: () => (calls++ === 0 ? new Promise(() => undefined) : Promise.resolve({ ok: false, error: { code: 'second', message: '' } })),
    };
    const client = new WorkerSolverClient(() => {
      const w = fakeWorker(api);
      workers.push(w);
      return w as unknown as Worker;
    });
    const first = client.solve({}, {});
    await new Promise((r) => setTimeout(r, 10));
    client.cancel();
    expect(await first).toEqual({ ok: false, error: { code: 'cancelled', message: 'The solve was stopped.' } });
    expect(workers[0].terminated).toBe(true);
    const second = await client.solve({}, {});
    expect(second.ok === false && second.error.code).toBe('second');
    expect(workers.length).toBe(2);
    expect((await client.hello()).ready).toBe(true);
    client.cancel(); // nothing in flight: nothing ends
    expect(workers[1].terminated).toBe(false);
  });
});
