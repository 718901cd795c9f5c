import type { MikroORM } from '@mikro-orm/postgresql';
import type { SweepParameterInfo, SweepPointResult } from '../../shared/api';
import { parseDesign } from '../../shared/design';
import { queryRow, run } from '../db/sql';

/** What a worker needs to solve the points of one sweep (the same for all of them, so it is kept per sweep). */
export interface SweepInputs {
  document: unknown;
  pointers: string[];
  cells: number;
}

export type PointOutcome = { status: 'solved'; result: SweepPointResult; seconds: number } | { status: 'failed'; error: string; seconds?: number };

const OPEN = `('queued', 'solving')`;

/**
 * The database side of a worker: claim a point, store what came of it, and close the sweep after its last point.
 * Every write is guarded by the point's status, so a job that runs twice (its first worker died, or was merely
 * slow past the expiry) writes nothing the second time, and a cancelled point takes nothing at all.
 */
export class PointStore {
  constructor(private readonly orm: MikroORM) {}

  async inputs(sweepId: number): Promise<SweepInputs | null> {
    const row = await queryRow<{ document: unknown; parameters: SweepParameterInfo[]; cells: number }>(
      this.orm.em.fork(),
      'select r.document, s.parameters, s.cells from sweeps s join revisions r on r.id = s.revision_id where s.id = ?',
      [sweepId],
    );
    if (!row) return null;
    // Pointers were checked against the document with its defaults filled in, so points start from that too.
    const parsed = parseDesign(row.document);
    return { document: parsed.ok ? parsed.design : row.document, pointers: row.parameters.map((p) => p.pointer), cells: row.cells };
  }

  /** Marks the point as being solved by `worker`; answers its values, or null when it is no longer open. */
  async claim(sweepId: number, index: number, worker: string): Promise<number[] | null> {
    return this.orm.em.fork().transactional(async (em) => {
      const point = await queryRow<{ values: number[] }>(
        em,
        `update sweep_points set status = 'solving', attempts = attempts + 1, worker = ?, started_at = now()
         where sweep_id = ? and "index" = ? and status in ${OPEN} returning "values"`,
        [worker, sweepId, index],
      );
      if (point) await run(em, `update sweeps set status = 'solving' where id = ? and status = 'queued'`, [sweepId]);
      return point?.values ?? null;
    });
  }

  /** True when the point was cancelled (or otherwise closed) since it was claimed. */
  async closed(sweepId: number, index: number): Promise<boolean> {
    const row = await queryRow<{ status: string }>(this.orm.em.fork(), 'select status from sweep_points where sweep_id = ? and "index" = ?', [sweepId, index]);
    return !row || (row.status !== 'queued' && row.status !== 'solving');
  }

  /**
   * Stores a point's outcome unless it was already stored or cancelled, then closes the sweep when no point is
   * open any more: solved, or failed when every point failed. The sweep row is locked first, so two workers
   * finishing the last two points cannot both miss the end.
   */
  async finish(sweepId: number, index: number, outcome: PointOutcome): Promise<boolean> {
    return this.orm.em.fork().transactional(async (em) => {
      await queryRow(em, 'select id from sweeps where id = ? for update', [sweepId]);
      const stored = await run(
        em,
        `update sweep_points set status = ?, result = ?::jsonb, error = ?, seconds = ?, finished_at = now()
         where sweep_id = ? and "index" = ? and status in ${OPEN}`,
        [
          outcome.status,
          outcome.status === 'solved' ? JSON.stringify(outcome.result) : null,
          outcome.status === 'failed' ? outcome.error : null,
          outcome.seconds ?? null,
          sweepId,
          index,
        ],
      );
      const counts = await queryRow<{ open: string; failed: string; total: string }>(
        em,
        `select count(*) filter (where status in ${OPEN}) as open, count(*) filter (where status = 'failed') as failed,
           count(*) as total from sweep_points where sweep_id = ?`,
        [sweepId],
      );
      if (counts && Number(counts.open) === 0) {
        const failedAll = Number(counts.failed) === Number(counts.total);
        await run(
          em,
          `update sweeps set status = ?, finished_at = now(), message = ? where id = ? and status in ${OPEN}`,
          [failedAll ? 'failed' : 'solved', failedAll ? 'Every point failed; see the points for the reasons.' : null, sweepId],
        );
      }
      return stored > 0;
    });
  }
}
