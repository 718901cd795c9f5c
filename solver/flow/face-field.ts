/**
 * The electric field where the flow needs it (physics.md §2, §3):
 *
 *   on the MAC faces, E_a = −(φ_hi − φ_lo) / h  (the face between the cells of normal index a − 1 and a),
 *   per cell, E_c = aperture-weighted mean of the face fields (a fallback when the potential solver's own
 *   cell gradient is not given),
 *   per side-wall segment, the Helmholtz–Smoluchowski slip u_s = μ_eo(ζ_s) (E_c − (E_c·n) n), tangential
 *   by construction; port segments get 0 (zero tangential velocity on a port).
 *
 * Undefined potentials (NaN: a piece with no electrode) give no field.
 */
import type { CutCellGrid } from '../grid/cut-cell-grid';
import { mobility, type FlowProblem } from './flow-problem';
import { openNodes, type Component } from './staggered';

const { isFinite } = Number;

/** Fills out[node] with E along the component's axis on every open face (0 elsewhere). */
export function faceField(grid: CutCellGrid, comp: Component, potential: Float64Array, out: Float64Array): Float64Array {
  out.fill(0);
  const h = grid.spacing;
  const nodes = openNodes(grid, comp);
  for (let k = 0; k < nodes.length; k++) {
    const n = nodes[k];
    const [a, b] = comp.nodeAB(n);
    const lo = potential[comp.cell(a - 1, b)];
    const hi = potential[comp.cell(a, b)];
    if (isFinite(lo) && isFinite(hi)) out[n] = -(hi - lo) / h;
  }
  return out;
}

/** E per cell (V/m) as the aperture-weighted mean of the fields on its open faces. */
export function cellFieldFromFaces(grid: CutCellGrid, potential: Float64Array): { x: Float64Array; y: Float64Array } {
  const { nx, ny, spacing: h, apertureX: ax, apertureY: ay } = grid;
  const ex = new Float64Array(nx * ny);
  const ey = new Float64Array(nx * ny);
  const field = (c: number, nb: number, a: number, sign: number) => {
    const p = potential[c], q = potential[nb];
    return a > 0 && Number.isFinite(p) && Number.isFinite(q) ? (a * sign * (p - q)) / h : 0;
  };
  for (let j = 1; j < ny - 1; j++) {
    for (let i = 1; i < nx - 1; i++) {
      const c = i + j * nx;
      if (!(grid.fraction[c] > 0)) continue;
      const aw = ax[i + j * (nx + 1)], ae = ax[i + 1 + j * (nx + 1)];
      const as = ay[c], an = ay[c + nx];
      // −∂φ/∂x on the west face is −(φ_c − φ_w)/h; on the east face −(φ_e − φ_c)/h.
      const sx = aw + ae, sy = as + an;
      if (sx > 0) ex[c] = (field(c, c - 1, aw, -1) + field(c, c + 1, ae, 1)) / sx;
      if (sy > 0) ey[c] = (field(c, c - nx, as, -1) + field(c, c + nx, an, 1)) / sy;
    }
  }
  return { x: ex, y: ey };
}

/** Slip velocity (m/s) of every boundary segment: HS slip from its side-wall zeta on walls, 0 on ports. */
export function wallSlip(problem: FlowProblem, cellField: { x: Float64Array; y: Float64Array }): { x: Float64Array; y: Float64Array } {
  const seg = problem.grid.segments;
  const sx = new Float64Array(seg.count);
  const sy = new Float64Array(seg.count);
  for (let s = 0; s < seg.count; s++) {
    if (seg.port[s] >= 0) continue;
    const c = seg.cell[s];
    const nX = seg.normalX[s], nY = seg.normalY[s];
    const ex = cellField.x[c], ey = cellField.y[c];
    if (!(Number.isFinite(ex) && Number.isFinite(ey))) continue;
    const en = ex * nX + ey * nY;
    const m = mobility(problem, seg.zeta[s]);
    sx[s] = m * (ex - en * nX);
    sy[s] = m * (ey - en * nY);
  }
  return { x: sx, y: sy };
}
