/**
 * The discrete divergence B of the staggered velocity and its transpose (physics.md §3, §7):
 *
 *   (B u)_c = Σ_faces of c  (outward sign) · a_f h · u_f  +  Σ_port faces of c  σ ℓ u_f      (m²/s)
 *
 * the net volume flux out of cell c per unit depth, aperture-weighted so that closed walls carry nothing:
 * summed over all cells the interior faces cancel and only the ports remain (exact discrete mass balance),
 * and a uniform field has zero divergence in every cut cell (the grid's discrete divergence theorem).
 * The pressure force on a velocity node's control volume is Bᵀp (a h (p_lo − p_hi) on an open face, and
 * σ ℓ p_c on a port face), so the saddle-point system [A −Bᵀ; −B 0] is symmetric.
 * Merged small cells (cell-merging.ts) pass their mass balance on to the cell they joined and take its
 * pressure; their own entries stay 0.
 * Only the faces between fluid cells can be open, so both loops visit the runs of fluid cells (fluid-runs.ts).
 */
import type { CutCellGrid } from '../grid/cut-cell-grid';
import { fluidRuns } from '../grid/fluid-runs';
import type { MergedCouplings } from './cell-merging';
import type { PortFaces } from './port-faces';

/** out_c += factor · (B [u; v])_c. */
export function addDivergence(
  grid: CutCellGrid,
  ports: PortFaces,
  merged: MergedCouplings | null,
  u: Float64Array,
  v: Float64Array,
  out: Float64Array,
  factor: number,
): void {
  const { nx, ny, apertureX: ax, apertureY: ay } = grid;
  const h = grid.spacing * factor;
  const { runs, rowRuns } = fluidRuns(grid);
  for (let j = 0; j < ny; j++) {
    for (let k = rowRuns[j], last = rowRuns[j + 1]; k < last; k += 2) {
      const end = runs[k + 1];
      // Vertical face c + j lies between cells c − 1 and c; horizontal face c between c − nx and c.
      for (let c = runs[k] + 1; c < end; c++) {
        const a = ax[c + j];
        if (a === 0) continue;
        const flux = a * h * u[c + j];
        out[c - 1] += flux;
        out[c] -= flux;
      }
      if (j === 0) continue;
      for (let c = runs[k]; c < end; c++) {
        const a = ay[c];
        if (a === 0) continue;
        const flux = a * h * v[c];
        out[c - nx] += flux;
        out[c] -= flux;
      }
    }
  }
  for (let f = 0; f < ports.count; f++) {
    const vel = ports.axis[f] === 0 ? u : v;
    out[ports.cell[f]] += factor * ports.sign[f] * ports.length[f] * vel[ports.node[f]];
  }
  if (merged) {
    const { cell, into } = merged.merging;
    for (let k = 0; k < cell.length; k++) {
      out[into[k]] += out[cell[k]];
      out[cell[k]] = 0;
    }
  }
}

/** outU += factor · (Bᵀ p)_u and outV += factor · (Bᵀ p)_v; p is 0 on merged cells. */
export function addDivergenceTranspose(
  grid: CutCellGrid,
  ports: PortFaces,
  merged: MergedCouplings | null,
  p: Float64Array,
  outU: Float64Array,
  outV: Float64Array,
  factor: number,
): void {
  const { nx, ny, apertureX: ax, apertureY: ay } = grid;
  const h = grid.spacing * factor;
  const { runs, rowRuns } = fluidRuns(grid);
  for (let j = 0; j < ny; j++) {
    for (let k = rowRuns[j], last = rowRuns[j + 1]; k < last; k += 2) {
      const end = runs[k + 1];
      for (let c = runs[k] + 1; c < end; c++) {
        const a = ax[c + j];
        if (a !== 0) outU[c + j] += a * h * (p[c - 1] - p[c]);
      }
      if (j === 0) continue;
      for (let c = runs[k]; c < end; c++) {
        const a = ay[c];
        if (a !== 0) outV[c] += a * h * (p[c - nx] - p[c]);
      }
    }
  }
  for (let f = 0; f < ports.count; f++) {
    const out = ports.axis[f] === 0 ? outU : outV;
    out[ports.node[f]] += factor * ports.sign[f] * ports.length[f] * p[ports.cell[f]];
  }
  if (merged) {
    const into = merged.merging.into;
    for (let e = 0; e < merged.owner.length; e++) {
      const out = merged.axis[e] === 0 ? outU : outV;
      out[merged.node[e]] += factor * merged.coefficient[e] * p[into[merged.owner[e]]];
    }
  }
}
