import type { EntityManager } from '@mikro-orm/postgresql';
import type { RunState, SweepMethod, SweepOutput, SweepParameterInfo, SweepPoint, SweepPointResult, SweepSummary } from '../../shared/api';
import { iso, queryRow, queryRows } from '../db/sql';

/** Reading sweeps and their points as the API shows them (shared by the service and the event stream). */

interface SummaryRow {
  id: number;
  design_id: number;
  revision_id: number;
  revision_number: number;
  status: RunState;
  method: SweepMethod;
  parameters: SweepParameterInfo[];
  outputs: SweepOutput[];
  cells: number;
  total: number;
  done: string;
  failed: string;
  message: string | null;
  created_at: Date;
  finished_at: Date | null;
  author_id: number;
  author_name: string;
}

interface PointRow {
  index: number;
  values: number[];
  status: RunState;
  result: SweepPointResult | null;
  error: string | null;
  attempts: number;
  seconds: number | null;
  run_id: number | null;
}

const SUMMARY = `select s.id, r.design_id, s.revision_id, r.number as revision_number, s.status, s.method, s.parameters, s.outputs,
    s.cells, s.total, s.message, s.created_at, s.finished_at, s.author_id, u.name as author_name,
    (select count(*) from sweep_points p where p.sweep_id = s.id and p.status in ('solved', 'failed')) as done,
    (select count(*) from sweep_points p where p.sweep_id = s.id and p.status = 'failed') as failed
  from sweeps s join revisions r on r.id = s.revision_id join users u on u.id = s.author_id`;

const POINT = `select "index", "values", status, result, error, attempts, seconds, run_id from sweep_points`;

function summary(r: SummaryRow): SweepSummary {
  return {
    id: r.id,
    designId: r.design_id,
    revisionId: r.revision_id,
    revisionNumber: r.revision_number,
    status: r.status,
    method: r.method,
    parameters: r.parameters,
    outputs: r.outputs,
    cells: r.cells,
    total: r.total,
    done: Number(r.done),
    failed: Number(r.failed),
    message: r.message,
    createdAt: iso(r.created_at),
    finishedAt: r.finished_at ? iso(r.finished_at) : null,
    author: { id: r.author_id, name: r.author_name },
  };
}

function point(r: PointRow): SweepPoint {
  return {
    index: r.index,
    values: r.values,
    status: r.status,
    result: r.result,
    error: r.error,
    attempts: r.attempts,
    seconds: r.seconds,
    runId: r.run_id,
  };
}

export async function sweepSummary(em: EntityManager, id: number): Promise<SweepSummary | null> {
  const row = await queryRow<SummaryRow>(em, `${SUMMARY} where s.id = ?`, [id]);
  return row ? summary(row) : null;
}

export async function designSweeps(em: EntityManager, designId: number, limit: number, offset: number): Promise<{ items: SweepSummary[]; total: number }> {
  const [rows, count] = await Promise.all([
    queryRows<SummaryRow>(em, `${SUMMARY} where r.design_id = ? order by s.created_at desc, s.id desc limit ? offset ?`, [designId, limit, offset]),
    queryRow<{ n: string }>(em, 'select count(*) as n from sweeps s join revisions r on r.id = s.revision_id where r.design_id = ?', [designId]),
  ]);
  return { items: rows.map(summary), total: Number(count?.n ?? 0) };
}

/** Points of a sweep in index order; only those listed when `indices` is given. */
export async function sweepPointRows(em: EntityManager, id: number, indices?: number[]): Promise<SweepPoint[]> {
  const rows = indices
    ? await queryRows<PointRow>(em, `${POINT} where sweep_id = ? and "index" = any(?::int[]) order by "index"`, [id, `{${indices.join(',')}}`])
    : await queryRows<PointRow>(em, `${POINT} where sweep_id = ? order by "index"`, [id]);
  return rows.map(point);
}

/** A cheap fingerprint of every point (status and attempts), for noticing which changed. */
export async function sweepPointStates(em: EntityManager, id: number): Promise<Map<number, string>> {
  const rows = await queryRows<{ index: number; status: string; attempts: number; run_id: number | null }>(
    em,
    'select "index", status, attempts, run_id from sweep_points where sweep_id = ?',
    [id],
  );
  return new Map(rows.map((r) => [r.index, `${r.status}/${r.attempts}/${r.run_id ?? ''}`]));
}

export function finished(status: RunState): boolean {
  return status === 'solved' || status === 'failed' || status === 'cancelled';
}
