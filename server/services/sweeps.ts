import { randomUUID } from 'node:crypto';
import type { MikroORM } from '@mikro-orm/postgresql';
import type { RunCreated, SweepDetail, SweepParameterInfo, SweepPointResult, SweepSummary } from '../../shared/api';
import { parseDesign, type DesignDocument } from '../../shared/design';
import { describePointer, MAX_SWEEP_POINTS, rangeValues, sweepPoints, valueAt, type ParsedSweepRequest } from '../../shared/sweep';
import { pointDocument } from '../../solver/sweep/point';
import { superposable } from '../../solver/sweep/superposed';
import { queryRow, run } from '../db/sql';
import { ApiError } from '../errors';
import type { SweepQueue } from '../jobs/queue';
import { SolverFailure, type SolverPool } from '../jobs/solver-pool';
import type { Access } from './access';
import type { ActivityService } from './activity';
import type { RunService } from './runs';
import { designSweeps, sweepPointRows, sweepSummary } from './sweep-rows';

interface RevisionRow {
  design_id: number;
  number: number;
  name: string;
  document: unknown;
}

/**
 * Sweeps of a revision. Over port potentials and pressures only, a sweep is answered when it is made, by
 * superposing unit responses (a solver thread does the unit solves); otherwise every point becomes a job on
 * the queue for the worker processes. Reading, cancelling and opening a point as a run are here too.
 */
export class SweepService {
  constructor(
    private readonly orm: MikroORM,
    private readonly queue: SweepQueue,
    private readonly pool: SolverPool,
    private readonly runs: RunService,
    private readonly activity: ActivityService,
  ) {}

  async create(access: Access, request: ParsedSweepRequest): Promise<SweepDetail> {
    const em = this.orm.em.fork();
    const rev = await queryRow<RevisionRow>(
      em,
      'select r.design_id, r.number, d.name, r.document from revisions r join designs d on d.id = r.design_id where r.id = ?',
      [request.revisionId],
    );
    if (!rev) throw new ApiError('not-found', 'No such revision');
    const parsed = parseDesign(rev.document);
    if (!parsed.ok) throw new ApiError('invalid', `Revision ${rev.number} is not a valid design: ${parsed.errors[0]?.message}`, 'revisionId');
    const design = parsed.design;
    const parameters = this.parameters(design, rev.number, request);
    const points = sweepPoints(parameters.map((p) => p.values));
    const pointers = parameters.map((p) => p.pointer);
    const method = superposable(pointers) ? 'superposed' : 'jobs';
    const results = method === 'superposed' ? await this.superpose(design, pointers, points, request.cells) : null;

    const jobs: Array<{ id: string; index: number }> = [];
    const id = await em.transactional(async (tx) => {
      const sweep = await queryRow<{ id: number }>(
        tx,
        `insert into sweeps (revision_id, method, status, parameters, outputs, cells, total, created_at, finished_at, author_id)
         values (?, ?, ?, ?::jsonb, ?::jsonb, ?, ?, now(), ${results ? 'now()' : 'null'}, ?) returning id`,
        [request.revisionId, method, results ? 'solved' : 'queued', JSON.stringify(parameters), JSON.stringify(request.outputs), request.cells, points.length, access.userId],
      );
      const sweepId = sweep!.id;
      const rows = points.map((values, index) => {
        const jobId = results ? null : randomUUID();
        if (jobId) jobs.push({ id: jobId, index });
        return [sweepId, index, JSON.stringify(values), results ? 'solved' : 'queued', results ? JSON.stringify(results[index]) : null, jobId];
      });
      for (let k = 0; k < rows.length; k += 100) {
        const chunk = rows.slice(k, k + 100);
        await run(
          tx,
          `insert into sweep_points (sweep_id, "index", "values", status, result, job_id, attempts) values ${chunk.map(() => '(?, ?, ?::jsonb, ?, ?::jsonb, ?, 0)').join(', ')}`,
          chunk.flat(),
        );
      }
      const what = parameters.map((p) => p.label).join(' and ');
      const how = results ? 'answered at once by superposition' : 'queued for the workers';
      await this.activity.record(tx, { workspaceId: access.workspaceId, actorId: access.userId, designId: rev.design_id, kind: 'sweep.started', message: `swept ${what} over ${points.length} points on revision ${rev.number} of "${rev.name}" (${how})` });
      return sweepId;
    });

    if (jobs.length > 0) {
      try {
        await this.queue.enqueue(jobs.map((j) => ({ id: j.id, sweepId: id, index: j.index })));
      } catch (err) {
        const why = err instanceof Error ? err.message : String(err);
        await run(em, `update sweeps set status = 'failed', finished_at = now(), message = ? where id = ?`, [`The job queue could not take the points: ${why}`, id]);
        await run(em, `update sweep_points set status = 'failed', error = 'not queued' where sweep_id = ? and status = 'queued'`, [id]);
        throw new ApiError('unavailable', 'The job queue did not answer; the sweep was not started. Try again shortly.');
      }
    }
    return this.get(id);
  }

  /** Checks each pointer against the revision's document and lists its values; too many points answer 413. */
  private parameters(design: DesignDocument, revisionNumber: number, request: ParsedSweepRequest): SweepParameterInfo[] {
    const parameters = request.parameters.map((p, k) => {
      const current = valueAt(design, p.pointer);
      if (typeof current !== 'number') {
        const found = current === undefined ? 'names nothing' : current === null ? 'names an empty value (a floating port has no potential)' : 'does not name a number';
        throw new ApiError('invalid', `parameters[${k}].pointer: ${p.pointer} ${found} in revision ${revisionNumber}'s document`, `parameters[${k}].pointer`);
      }
      return { ...p, ...describePointer(design, p.pointer), values: rangeValues(p.range) };
    });
    const total = parameters.reduce((n, p) => n * p.values.length, 1);
    if (total > MAX_SWEEP_POINTS) {
      throw new ApiError('too-large', `This sweep has ${total} points; a sweep may have at most ${MAX_SWEEP_POINTS} (for two parameters, the product of their steps)`);
    }
    return parameters;
  }

  private async superpose(design: DesignDocument, pointers: string[], points: number[][], cells: number): Promise<SweepPointResult[]> {
    try {
      return await this.pool.run({ kind: 'superposed', document: design, pointers, points, cells });
    } catch (err) {
      if (err instanceof SolverFailure && err.kind === 'refused') throw new ApiError('invalid', `The revision cannot be solved: ${err.message}`, 'revisionId');
      throw err;
    }
  }

  async get(id: number): Promise<SweepDetail> {
    const em = this.orm.em.fork();
    const summary = await sweepSummary(em, id);
    if (!summary) throw new ApiError('not-found', 'No such sweep');
    return { ...summary, points: await sweepPointRows(em, id) };
  }

  list(designId: number, q: { limit: number; offset: number }): Promise<{ items: SweepSummary[]; total: number }> {
    return designSweeps(this.orm.em.fork(), designId, q.limit, q.offset);
  }

  /**
   * Cancels a sweep that is still queued or solving: its open points become cancelled and their jobs are taken
   * off the queue (a worker in the middle of one stops at its next check and stores nothing). A sweep that has
   * already finished is answered as it is.
   */
  async cancel(access: Access, id: number): Promise<SweepDetail> {
    const jobIds = await this.orm.em.fork().transactional(async (em) => {
      const sweep = await queryRow<{ status: string; design_id: number; number: number; name: string }>(
        em,
        `select s.status, r.design_id, r.number, d.name from sweeps s join revisions r on r.id = s.revision_id
         join designs d on d.id = r.design_id where s.id = ? for update of s`,
        [id],
      );
      if (!sweep) throw new ApiError('not-found', 'No such sweep');
      if (sweep.status !== 'queued' && sweep.status !== 'solving') return [];
      await run(em, `update sweeps set status = 'cancelled', finished_at = now(), message = 'Cancelled before every point was solved.' where id = ?`, [id]);
      const open = await em.execute<{ job_id: string | null }[]>(
        `update sweep_points set status = 'cancelled', finished_at = now() where sweep_id = ? and status in ('queued', 'solving') returning job_id`,
        [id],
        'all',
      );
      await this.activity.record(em, { workspaceId: access.workspaceId, actorId: access.userId, designId: sweep.design_id, kind: 'sweep.cancelled', message: `cancelled a sweep of revision ${sweep.number} of "${sweep.name}"` });
      return open.map((r) => r.job_id).filter((j): j is string => j !== null);
    });
    await this.queue.remove(jobIds);
    return this.get(id);
  }

  /**
   * A solved point as an ordinary run of the revision: the point's document is solved once more in a solver thread
   * and stored like a run saved from the Fields tab (summary and field blob), with settings that name the sweep
   * and carry the point's document. Opening the same point again answers the same run.
   */
  async openPoint(access: Access, id: number, index: number): Promise<RunCreated & { created: boolean }> {
    const em = this.orm.em.fork();
    const row = await queryRow<{ revision_id: number; method: string; cells: number; parameters: SweepParameterInfo[]; document: unknown; values: number[]; status: string; run_id: number | null }>(
      em,
      `select s.revision_id, s.method, s.cells, s.parameters, r.document, p."values", p.status, p.run_id
       from sweep_points p join sweeps s on s.id = p.sweep_id join revisions r on r.id = s.revision_id where p.sweep_id = ? and p."index" = ?`,
      [id, index],
    );
    if (!row) throw new ApiError('not-found', `No point ${index} in this sweep`);
    if (row.run_id !== null) return { id: row.run_id, created: false };
    if (row.status !== 'solved') throw new ApiError('conflict', `Point ${index + 1} is ${row.status}, not solved; only solved points open as runs`);
    const parsed = parseDesign(row.document);
    const document = pointDocument(parsed.ok ? parsed.design : row.document, row.parameters.map((p) => p.pointer), row.values);
    const solved = await this.pool.run({ kind: 'run', document, cells: row.cells });
    const settings = {
      cells: row.cells,
      cellsAcross: null,
      narrowest: null,
      source: 'sweep',
      sweep: { id, point: index, method: row.method, parameters: row.parameters.map((p, k) => ({ pointer: p.pointer, label: p.label, value: row.values[k] })) },
      document,
    };
    const created = await this.runs.create(access, row.revision_id, { settings, summary: solved.summary, fields: Buffer.from(solved.blob).toString('base64'), status: 'solved' });
    const linked = await run(em, 'update sweep_points set run_id = ? where sweep_id = ? and "index" = ? and run_id is null', [created.id, id, index]);
    if (linked === 0) {
      const other = await queryRow<{ run_id: number }>(em, 'select run_id from sweep_points where sweep_id = ? and "index" = ?', [id, index]);
      return { id: other!.run_id, created: false };
    }
    return { id: created.id, created: true };
  }
}
