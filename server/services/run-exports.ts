import { deflateSync } from 'node:zlib';
import type { MikroORM } from '@mikro-orm/postgresql';
import type { MapQuantityName } from '../../shared/api';
import { parseDesign, type DesignDocument } from '../../shared/design';
import { resultsCsv } from '../../solver/io/fields-csv';
import { mapFigure } from '../../solver/io/figure';
import { figureSvg } from '../../solver/io/figure-svg';
import { encodePng } from '../../solver/io/png';
import { fieldsToVtk } from '../../solver/result/vtk';
import { SolveError, solveDesign, type SolveResult } from '../../solver/solve';
import type { ServerConfig } from '../config';
import { iso, queryRow } from '../db/sql';
import { ApiError } from '../errors';
import { runReportPdf } from '../reports/run-report';
import { safeFileName } from './design-files';

interface RunRow {
  id: number;
  settings: Record<string, unknown> | null;
  created_at: Date;
  author: string;
  number: number;
  note: string;
  document: unknown;
  revision_at: Date;
  design_id: number;
  name: string;
  review_state: string;
  workspace: string;
}

interface Loaded {
  row: RunRow;
  design: DesignDocument;
  result: SolveResult;
}

const CACHE = 4;

/**
 * Files made from a stored run: CSV, VTK, map figures and the PDF report. The fields are recomputed from the
 * run's revision with its settings (the solver is deterministic; the stored blob's format belongs to the app),
 * and the last few solves are kept in memory.
 */
export class RunExportService {
  private readonly cache = new Map<number, Loaded>();

  constructor(
    private readonly orm: MikroORM,
    private readonly config: ServerConfig,
  ) {}

  private async load(runId: number): Promise<Loaded> {
    const hit = this.cache.get(runId);
    if (hit) {
      this.cache.delete(runId);
      this.cache.set(runId, hit);
      return hit;
    }
    const row = await queryRow<RunRow>(
      this.orm.em.fork(),
      `select x.id, x.settings, x.created_at, u.name as author, r.number, r.note, r.document, r.created_at as revision_at,
         d.id as design_id, d.name, d.review_state, w.name as workspace
       from runs x join revisions r on r.id = x.revision_id join designs d on d.id = r.design_id
       join workspaces w on w.id = d.workspace_id join users u on u.id = x.author_id where x.id = ?`,
      [runId],
    );
    if (!row) throw new ApiError('not-found', 'No such run');
    const parsed = parseDesign(row.document);
    if (!parsed.ok) throw new ApiError('invalid', "The run's revision is not a valid design");
    const cells = typeof row.settings?.['cells'] === 'number' ? (row.settings['cells'] as number) : undefined;
    let result: SolveResult;
    try {
      result = solveDesign(parsed.design, { cells });
    } catch (error) {
      if (error instanceof SolveError) throw new ApiError('invalid', `The run's revision cannot be solved: ${error.message}`);
      throw error;
    }
    const loaded = { row, design: parsed.design, result };
    this.cache.set(runId, loaded);
    while (this.cache.size > CACHE) this.cache.delete(this.cache.keys().next().value!);
    return loaded;
  }

  private baseName(l: Loaded): string {
    return safeFileName(`${l.row.name} r${l.row.number} run ${l.row.id}`);
  }

  async file(runId: number, format: 'csv' | 'vtk' | 'svg' | 'png', quantity: MapQuantityName): Promise<{ body: string | Buffer; type: string; name: string }> {
    const l = await this.load(runId);
    const base = this.baseName(l);
    switch (format) {
      case 'csv':
        return { body: resultsCsv({ name: l.row.name, ports: l.result.ports, probes: l.result.probes }), type: 'text/csv; charset=utf-8', name: `${base}.csv` };
      case 'vtk':
        return { body: fieldsToVtk(l.result.fields, `Osmolane: ${l.row.name}, revision ${l.row.number}, run ${l.row.id}`), type: 'application/octet-stream', name: `${base}.vtk` };
      case 'svg': {
        const fig = mapFigure(l.result.fields, quantity, { title: `${l.row.name}: ${quantity}` });
        return { body: figureSvg(fig, (raw) => deflateSync(raw)), type: 'image/svg+xml', name: `${base} ${quantity}.svg` };
      }
      case 'png': {
        const fig = mapFigure(l.result.fields, quantity);
        return { body: Buffer.from(encodePng(fig.map.rgba, fig.map.width, fig.map.height, (raw) => deflateSync(raw))), type: 'image/png', name: `${base} ${quantity}.png` };
      }
    }
  }

  async report(runId: number): Promise<{ body: Buffer; name: string }> {
    const l = await this.load(runId);
    const approval = l.row.review_state === 'mask-ready'
      ? await queryRow<{ name: string | null; created_at: Date }>(
          this.orm.em.fork(),
          `select u.name, a.created_at from activity_events a left join users u on u.id = a.actor_id
           where a.design_id = ? and a.kind = 'review.changed' and a.message like '%to mask-ready' order by a.created_at desc, a.id desc limit 1`,
          [l.row.design_id],
        )
      : undefined;
    const body = await runReportPdf({
      design: l.design,
      designName: l.row.name,
      workspace: l.row.workspace,
      revision: { number: l.row.number, note: l.row.note, createdAt: iso(l.row.revision_at) },
      run: { id: l.row.id, createdAt: iso(l.row.created_at), author: l.row.author },
      review: { state: l.row.review_state, approvedBy: approval?.name ?? null, approvedAt: approval ? iso(approval.created_at) : null },
      result: l.result,
      version: this.config.version,
    });
    return { body, name: `${this.baseName(l)} report.pdf` };
  }
}
