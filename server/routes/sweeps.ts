import { sweepRequestSchema } from '../../shared/sweep';
import type { SweepEvent } from '../../shared/api';
import { ApiError } from '../errors';
import type { Services } from '../services';
import { idParam, parse, sendList, type ApiRoutes } from './define';
import * as schema from './schemas';

const sweepQuery = schema.listQuery(['createdAt'], { sort: 'createdAt', order: 'desc', limit: 50, maxLimit: 200 });

/** Sweeps: editors and owners start and cancel them; every member reads them and follows their progress. */
export function sweepRoutes(api: ApiRoutes, s: Services): void {
  api.user('post', '/sweeps', async (req, res, user) => {
    const body = parse(sweepRequestSchema, req.body);
    const access = await s.access.revision(user.id, body.revisionId, 'editor');
    res.status(201).json(await s.sweeps.create(access, body));
  });

  api.user('get', '/designs/:id/sweeps', async (req, res, user) => {
    const q = parse(sweepQuery, req.query, 'The query');
    const id = idParam(req, 'id');
    await s.access.design(user.id, id, 'viewer');
    sendList(res, await s.sweeps.list(id, q));
  });

  api.user('get', '/sweeps/:id', async (req, res, user) => {
    const id = idParam(req, 'id');
    await s.access.sweep(user.id, id, 'viewer');
    res.json(await s.sweeps.get(id));
  });

  api.user('post', '/sweeps/:id/cancel', async (req, res, user) => {
    const id = idParam(req, 'id');
    const access = await s.access.sweep(user.id, id, 'editor');
    res.json(await s.sweeps.cancel(access, id));
  });

  api.user('post', '/sweeps/:id/points/:index/run', async (req, res, user) => {
    const id = idParam(req, 'id');
    const index = Number(req.params['index']);
    const access = await s.access.sweep(user.id, id, 'editor');
    if (!Number.isInteger(index) || index < 0) throw new ApiError('not-found', `No point "${String(req.params['index'])}" in this sweep`);
    const opened = await s.sweeps.openPoint(access, id, index);
    res.status(opened.created ? 201 : 200).json({ id: opened.id });
  });

  /**
   * Server-sent events with the bearer token in the Authorization header (the app reads the stream with fetch,
   * since EventSource cannot send headers): a snapshot, then point and status events, ending with the sweep.
   */
  api.user('get', '/sweeps/:id/events', async (req, res, user) => {
    const id = idParam(req, 'id');
    await s.access.sweep(user.id, id, 'viewer');
    res.writeHead(200, {
      'Content-Type': 'text/event-stream; charset=utf-8',
      'Cache-Control': 'no-cache, no-transform',
      Connection: 'keep-alive',
      'X-Accel-Buffering': 'no',
    });
    res.flushHeaders();
    await new Promise<void>((resolve) => {
      let done = false;
      let unsubscribe: (() => void) | null = null;
      const heartbeat = setInterval(() => res.write(': still here\n\n'), 15_000);
      const finish = () => {
        if (done) return;
        done = true;
        clearInterval(heartbeat);
        unsubscribe?.();
        res.end();
        resolve();
      };
      const send = (event: SweepEvent) => {
        if (!done) res.write(`event: ${event.type}\ndata: ${JSON.stringify(event)}\n\n`);
      };
      req.on('close', finish);
      s.sweepEvents.subscribe(id, send, finish).then(
        (u) => (done ? u() : (unsubscribe = u)),
        (err: unknown) => {
          console.error(`[sweeps] event stream of sweep ${id}: ${err instanceof Error ? err.message : String(err)}`);
          finish();
        },
      );
    });
  });
}
