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
 */
import type { CutCellGrid } from '../grid/cut-cell-grid';
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
  const sx = nx + 1;
  for (let j = 0; j < ny; j++) {
    const row = j * nx;
    for (let i = 1; i < nx; i++) {
      const a = ax[i + j * sx];
      if (a === 0) continue;
      const flux = a * h * u[i + j * sx];
      out[row + i - 1] += flux;
      out[row + i] -= flux;
    }
  }
  for (let j = 1; j < ny; j++) {
    const row = j * nx;
    for (let i = 0; i < nx; i++) {
      const c = row + i;
      const a = ay[c];
      if (a === 0) continue;
      const flux = a * h * v[c];
      out[c - nx] += flux;
      out[c] -= flux;
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
  const sx = nx + 1;
  for (let j = 0; j < ny; j++) {
    const row = j * nx;
    for (let i = 1; i < nx; i++) {
      const f = i + j * sx;
      const a = ax[f];
      if (a === 0) continue;
      outU[f] += a * h * (p[row + i - 1] - p[row + i]);
    }
  }
  for (let j = 1; j < ny; j++) {
    const row = j * nx;
    for (let i = 0; i < nx; i++) {
      const c = row + i;
      const a = ay[c];
      if (a === 0) continue;
      outV[c] += a * h * (p[c - nx] - p[c]);
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
