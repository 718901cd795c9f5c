import { Router } from 'express';
import type { MikroORM } from '@mikro-orm/postgresql';
import type { HealthResponse } from '../../shared/api';
import { databaseAnswers } from '../db/orm';

/** GET /api/health: liveness plus a real database round trip (api.md). */
export function healthRoutes(orm: MikroORM, version: string): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    const ok = await databaseAnswers(orm);
    const body: HealthResponse = { status: ok ? 'ok' : 'degraded', version, database: ok ? 'ok' : 'unreachable' };
    res.status(ok ? 200 : 503).json(body);
  });
  return router;
}
