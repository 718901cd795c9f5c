/**
 * Vorticity ω = ∂v/∂x − ∂u/∂y of the depth-averaged flow (physics.md §3), per cell, from the circulation
 * around the fluid part of the cell (Stokes' theorem, the discrete form of ∮ u·t ds = ∫ ω dA):
 *
 *   ω_c A_c = Σ_open face parts  ±(a h) · (tangential velocity at the face centre)
 *           + Σ_wall segments  L · (u_wall · t),       t = (−n_y, n_x)  (fluid on the left),
 *
 * counter-clockwise; the tangential velocity at a face centre is the mean of the four nearest nodes of that
 * component that exist: nodes of the flow, and closed faces lying on a wall across the component (their
 * velocity is the wall's normal one, 0); a closed face out in the solid beyond a curved wall has no velocity
 * and is left out. Ports have no tangential velocity. On a wall cell this is the one-sided difference between
 * the wall's slip and the flow a cell inside, so the wall's shear vorticity is resolved.
 * A_c = max(fraction, 1/4) h², so slivers do not divide by a tiny area.
 */
import type { CutCellGrid } from '../grid/cut-cell-grid';
import { fluidRuns } from '../grid/fluid-runs';
import type { PortFaces } from './port-faces';

const { abs, max, round } = Math;

/** Least area (fraction of a cell) the circulation is divided by. */
export const MIN_VORTICITY_AREA = 0.25;

export function vorticity(
  grid: CutCellGrid,
  ports: PortFaces,
  u: Float64Array,
  v: Float64Array,
  slip: { x: Float64Array; y: Float64Array },
): Float64Array {
  const { nx, ny, spacing: h, apertureX: ax, apertureY: ay, segments: seg } = grid;
  const sx = nx + 1;
  const omega = new Float64Array(nx * ny);
  const [wu, wv] = nodeWeights(grid, ports);
  const mean = (vel: Float64Array, w: Uint8Array, a: number, b: number, c: number, d: number) => {
    const n = w[a] + w[b] + w[c] + w[d];
    return n > 0 ? (w[a] * vel[a] + w[b] * vel[b] + w[c] * vel[c] + w[d] * vel[d]) / n : 0;
  };
  // Mean u at the centre of horizontal face (i, j); mean v at the centre of vertical face (i, j).
  const uAt = (i: number, j: number) => mean(u, wu, i + (j - 1) * sx, i + 1 + (j - 1) * sx, i + j * sx, i + 1 + j * sx);
  const vAt = (i: number, j: number) => mean(v, wv, i - 1 + j * nx, i + j * nx, i - 1 + (j + 1) * nx, i + (j + 1) * nx);
  // Fluid cells never lie on the grid's border (cut-cell-grid.ts), so all four faces exist.
  const { runs, rowRuns } = fluidRuns(grid);
  for (let j = 1; j < ny - 1; j++) {
    for (let k = rowRuns[j], last = rowRuns[j + 1]; k < last; k += 2) {
      for (let c = runs[k], end = runs[k + 1]; c < end; c++) {
        const i = c - j * nx;
        let circulation = 0;
        if (ay[c] > 0) circulation += ay[c] * h * uAt(i, j);
        if (ay[c + nx] > 0) circulation -= ay[c + nx] * h * uAt(i, j + 1);
        if (ax[i + j * sx] > 0) circulation -= ax[i + j * sx] * h * vAt(i, j);
        if (ax[i + 1 + j * sx] > 0) circulation += ax[i + 1 + j * sx] * h * vAt(i + 1, j);
        omega[c] = circulation;
      }
    }
  }
  for (let s = 0; s < seg.count; s++) {
    if (seg.port[s] >= 0) continue;
    omega[seg.cell[s]] += seg.length[s] * (-seg.normalY[s] * slip.x[s] + seg.normalX[s] * slip.y[s]);
  }
  for (let k = 0; k < runs.length; k += 2) {
    for (let c = runs[k], end = runs[k + 1]; c < end; c++) omega[c] /= max(grid.fraction[c], MIN_VORTICITY_AREA) * h * h;
  }
  return omega;
}

/** 1 for velocity nodes that exist (open faces, port faces) and for closed faces lying on a wall; else 0. */
function nodeWeights(grid: CutCellGrid, ports: PortFaces): [Uint8Array, Uint8Array] {
  const { nx, spacing: h, x0, y0, apertureX: ax, apertureY: ay, segments: seg } = grid;
  const wu = new Uint8Array(ax.length), wv = new Uint8Array(ay.length);
  // Open faces join fluid cells: visit the runs of fluid cells (fluid-runs.ts).
  const { runs, rowRuns } = fluidRuns(grid);
  for (let j = 0; j < grid.ny; j++) {
    for (let k = rowRuns[j], last = rowRuns[j + 1]; k < last; k += 2) {
      for (let c = runs[k], end = runs[k + 1]; c < end; c++) {
        if (ax[c + j] > 0) wu[c + j] = 1;
        if (ay[c] > 0) wv[c] = 1;
      }
    }
  }
  for (let f = 0; f < ports.count; f++) (ports.axis[f] === 0 ? wu : wv)[ports.node[f]] = 1;
  for (let s = 0; s < seg.count; s++) {
    const c = seg.cell[s], i = c % nx, j = (c - i) / nx;
    if (abs(seg.normalX[s]) > 0.99) {
      const k = round((seg.midX[s] - x0) / h);
      if (abs(seg.midX[s] - (x0 + k * h)) < 1e-6 * h && (k === i || k === i + 1)) wu[k + j * (nx + 1)] = 1;
    }
    if (abs(seg.normalY[s]) > 0.99) {
      const k = round((seg.midY[s] - y0) / h);
      if (abs(seg.midY[s] - (y0 + k * h)) < 1e-6 * h && (k === j || k === j + 1)) wv[i + k * nx] = 1;
    }
  }
  return [wu, wv];
}
