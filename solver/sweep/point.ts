/**
 * One point of a sweep: the revision's document with the parameters set, solved like any other design, and the
 * few numbers a sweep keeps of the result (the port table, metrics, warnings). No Node imports: the server's
 * workers and the browser run the same code.
 */
import type { SweepPointResult } from '../../shared/api';
import type { DesignDocument } from '../../shared/design';
import { withValueAt } from '../../shared/sweep';
import { solveDesign, type SolveOptions, type SolveResult } from '../solve';

/** The design with each pointer's number replaced by the point's value. */
export function pointDocument<T = DesignDocument>(design: T, pointers: ReadonlyArray<string>, values: ReadonlyArray<number>): T {
  return pointers.reduce((doc, pointer, k) => withValueAt(doc, pointer, values[k]), design);
}

/** Largest |v| over the cells holding fluid (NaN and cells outside the fluid skipped). */
export function maxAbs(values: ArrayLike<number>, fraction: ArrayLike<number>): number {
  let best = 0;
  for (let c = 0; c < values.length; c++) {
    const v = Math.abs(values[c]);
    if (fraction[c] > 0 && v > best) best = v;
  }
  return best;
}

/** What a sweep keeps of a solve. Maximum vorticity is the largest |ω| over the fluid cells of the result's field. */
export function pointResult(result: SolveResult): SweepPointResult {
  const { fields, metrics, grid } = result;
  return {
    ports: result.ports.map((p) => ({ id: p.id, potential: p.potential, current: p.current, flowRate: p.flowRate })),
    metrics: {
      joulePower: metrics.joulePower,
      maxField: metrics.maxField,
      maxVorticity: maxAbs(fields.vorticity, fields.fraction),
      maxSpeed: metrics.maxSpeed,
    },
    warnings: result.warnings.map((w) => ({ code: w.code, message: w.message })),
    grid: { nx: grid.nx, ny: grid.ny, spacing: grid.spacing },
  };
}

/** Solves one point; throws SolveError like solveDesign (an invalid point document is refused, not retried). */
export function solvePoint(
  design: unknown,
  pointers: ReadonlyArray<string>,
  values: ReadonlyArray<number>,
  options: Pick<SolveOptions, 'cells' | 'shouldStop' | 'tolerance'> = {},
): SweepPointResult {
  return pointResult(solveDesign(pointDocument(design, pointers, values), options));
}
