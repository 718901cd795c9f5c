import type { MikroORM } from '@mikro-orm/postgresql';
import type { HealthResponse } from '../../shared/api';
import { databaseAnswers } from '../db/orm';
import type { ApiRoutes } from './define';

/** GET /api/health: liveness plus a real database round trip (api.md). */
export function healthRoutes(api: ApiRoutes, orm: MikroORM, version: string): void {
  api.open('get', '/health', async (_req, res) => {
    const ok = await databaseAnswers(orm);
    const body: HealthResponse = { status: ok ? 'ok' : 'degraded', version, database: ok ? 'ok' : 'unreachable' };
    res.status(ok ? 200 : 503).json(body);
  });
}
