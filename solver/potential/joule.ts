/**
 * Joule heating (physics.md §2, reference-values.md §7: q = σ|E|²).
 *
 *   P = Σ_k V_k I_k                     the electrical power the electrodes deliver;
 *   P = ∫ σ |E|² dV ≈ σ d h² Σ_c fraction_c |E_c|²   the heat released in the fluid.
 * For the discrete solution the first equals σ d [Σ_faces a_f (Δφ)² + Σ_port pieces g_s (V − φ_c)²]
 * exactly (discrete Green identity), so it is the one reported; the second agrees to the
 * discretisation error of the cell-centred field.
 */
import type { CutCellGrid } from '../grid/cut-cell-grid';
import type { CellField } from './gradient';

export function electrodePower(portPotential: ReadonlyArray<number | null>, portCurrent: ArrayLike<number>): number {
  let p = 0;
  portPotential.forEach((v, k) => { if (v !== null) p += v * portCurrent[k]; });
  return p;
}

export function fieldPower(grid: CutCellGrid, active: Uint8Array, field: CellField, sigma: number, depth: number): number {
  let sum = 0;
  for (let c = 0; c < active.length; c++) {
    if (active[c]) sum += grid.fraction[c] * (field.x[c] ** 2 + field.y[c] ** 2);
  }
  return sigma * depth * grid.spacing * grid.spacing * sum;
}

/**
 * The largest Joule power per unit channel length (W/m) for the validity check of physics.md §6,
 * estimated on grid lines: along each vertical grid line, a run of consecutive open faces is one
 * cut across a channel; the current through it is I = σ d Σ a_f (φ_left − φ_right) (exact for the
 * discrete solution) and the power per length there is |I| times the mean |E| of the cells beside
 * the run (exact for a straight channel at any angle: P' = σ w d E²). Horizontal lines likewise.
 */
export function maxPowerPerLength(
  grid: CutCellGrid,
  active: Uint8Array,
  potential: Float64Array,
  field: CellField,
  sigma: number,
  depth: number,
): number {
  const { nx, ny, apertureX, apertureY } = grid;
  const magnitude = (c: number) => Math.hypot(field.x[c], field.y[c]);
  let best = 0;
  let current = 0, weighted = 0, weight = 0;
  const close = () => {
    if (weight > 0) best = Math.max(best, Math.abs(current) * (weighted / weight));
    current = 0; weighted = 0; weight = 0;
  };
  const face = (a: number, lo: number, hi: number) => {
    if (!(a > 0) || !active[lo] || !active[hi]) {
      close();
      return;
    }
    current += a * (potential[lo] - potential[hi]);
    weighted += a * 0.5 * (magnitude(lo) + magnitude(hi));
    weight += a;
  };
  for (let i = 1; i < nx; i++) {
    for (let j = 0; j < ny; j++) face(apertureX[i + j * (nx + 1)], i - 1 + j * nx, i + j * nx);
    close();
  }
  for (let j = 1; j < ny; j++) {
    for (let i = 0; i < nx; i++) face(apertureY[i + j * nx], i + (j - 1) * nx, i + j * nx);
    close();
  }
  return sigma * depth * best;
}
