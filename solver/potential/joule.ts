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
import { fluidRuns } from '../grid/fluid-runs';
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
  // Open faces join fluid cells, so the runs of fluid cells hold them all (fluid-runs.ts). Vertical lines are
  // walked row by row with a run in progress per line, closed when a row does not continue it.
  const { runs, rowRuns } = fluidRuns(grid);
  const lineCurrent = new Float64Array(nx + 1), lineWeighted = new Float64Array(nx + 1), lineWeight = new Float64Array(nx + 1);
  const lastRow = new Int32Array(nx + 1).fill(-2);
  const closeLine = (i: number) => {
    if (lineWeight[i] > 0) best = Math.max(best, Math.abs(lineCurrent[i]) * (lineWeighted[i] / lineWeight[i]));
    lineCurrent[i] = 0; lineWeighted[i] = 0; lineWeight[i] = 0;
  };
  let current = 0, weighted = 0, weight = 0;
  const close = () => {
    if (weight > 0) best = Math.max(best, Math.abs(current) * (weighted / weight));
    current = 0; weighted = 0; weight = 0;
  };
  for (let j = 0; j < ny; j++) {
    for (let k = rowRuns[j], last = rowRuns[j + 1]; k < last; k += 2) {
      const row = j * nx;
      // Vertical face i between cells c − 1 and c.
      for (let c = runs[k] + 1; c < runs[k + 1]; c++) {
        const a = apertureX[c + j], lo = c - 1, i = c - row;
        if (!(a > 0) || !active[lo] || !active[c]) continue;
        if (lastRow[i] !== j - 1) closeLine(i);
        lastRow[i] = j;
        lineCurrent[i] += a * (potential[lo] - potential[c]);
        lineWeighted[i] += a * 0.5 * (magnitude(lo) + magnitude(c));
        lineWeight[i] += a;
      }
      // Horizontal faces below the cells of the run, along line j.
      for (let c = runs[k]; c < runs[k + 1]; c++) {
        const a = j > 0 ? apertureY[c] : 0, lo = c - nx;
        if (!(a > 0) || !active[lo] || !active[c]) {
          close();
          continue;
        }
        current += a * (potential[lo] - potential[c]);
        weighted += a * 0.5 * (magnitude(lo) + magnitude(c));
        weight += a;
      }
      close();
    }
  }
  for (let i = 0; i <= nx; i++) closeLine(i);
  return sigma * depth * best;
}
