/**
 * The finite-volume Laplace operator on the cut cells (physics.md §2, §7), σ d factored out:
 *
 *   Σ_faces a_f (φ_nb − φ_c) + Σ_{port pieces s in c} g_s (V_k(s) − φ_c) = 0   for every fluid cell c,
 *
 * a_f the face aperture (the open length over h, divided by the centre distance h), g_s the port
 * conductance of port-conductance.ts. Walls contribute nothing: zero flux through insulating walls
 * is exact by construction. As an Operator5: gx/gy = apertures, boundary_c = Σ g_s, and the
 * right-hand side b_c = Σ g_s V_k(s). Every port (floating ones at 0 V) is a Dirichlet boundary of
 * the operator; floating ports get their potential by superposition (potential-solve.ts).
 */
import type { CutCellGrid } from '../grid/cut-cell-grid';
import { finishOperator, type Operator5 } from '../multigrid/operator';

/**
 * The operator over the `active` cells. When every fluid cell is active its face arrays ARE the grid's
 * aperture arrays (finishOperator then writes nothing into them: apertures next to solid cells and on the
 * border are 0 already), which saves 16 bytes a cell; otherwise they are copies, as finishOperator closes the
 * faces next to the excluded cells. Nothing writes to an operator's faces after that. What the caller knows of
 * `active` (ElectrodePieces: whether it is every fluid cell, its runs) spares the passes that find out.
 * No reaction term.
 */
export function laplaceOperator(
  grid: CutCellGrid,
  active: Uint8Array,
  conductance: Float64Array,
  known: { everyFluidCell?: boolean; runs?: Int32Array; rowRuns?: Int32Array } = {},
): Operator5 {
  const n = grid.nx * grid.ny;
  const boundary = new Float64Array(n);
  const seg = grid.segments;
  for (let s = 0; s < seg.count; s++) if (seg.port[s] >= 0) boundary[seg.cell[s]] += conductance[s];
  const shared = known.everyFluidCell ?? everyFluidCellActive(grid, active);
  const op: Operator5 = {
    n1: grid.nx,
    n2: grid.ny,
    gx: shared ? grid.apertureX : grid.apertureX.slice(),
    gy: shared ? grid.apertureY : grid.apertureY.slice(),
    reaction: new Float64Array(0),
    boundary,
    active: active.slice(),
    diag: new Float64Array(n),
  };
  return finishOperator(op, known.runs && known.rowRuns ? { runs: known.runs, rowRuns: known.rowRuns } : undefined);
}

function everyFluidCellActive(grid: CutCellGrid, active: Uint8Array): boolean {
  const { fraction } = grid;
  for (let c = 0; c < active.length; c++) if (active[c] === 0 && fraction[c] > 0) return false;
  return true;
}

/** b_c = Σ_{port pieces s in active cell c} g_s · value(port(s)); ports whose value is 0 add nothing. */
export function portRightHandSide(
  grid: CutCellGrid,
  active: Uint8Array,
  conductance: Float64Array,
  portValue: ArrayLike<number>,
  b: Float64Array,
): Float64Array {
  b.fill(0);
  const seg = grid.segments;
  for (let s = 0; s < seg.count; s++) {
    const k = seg.port[s];
    if (k < 0 || !active[seg.cell[s]]) continue;
    const v = portValue[k];
    if (v !== 0) b[seg.cell[s]] += conductance[s] * v;
  }
  return b;
}

/**
 * Port currents with σ d factored out: J_k = Σ_{pieces s of port k} g_s (V_k − φ_c), positive when
 * current enters the fluid (physics.md §2: I_k = σ d ∫ ∂φ/∂n_out ds). Multiply by σ d for amperes.
 */
export function portFluxes(
  grid: CutCellGrid,
  active: Uint8Array,
  conductance: Float64Array,
  portValue: ArrayLike<number>,
  potential: Float64Array,
  out: Float64Array,
): Float64Array {
  out.fill(0);
  const seg = grid.segments;
  for (let s = 0; s < seg.count; s++) {
    const k = seg.port[s];
    const c = seg.cell[s];
    if (k < 0 || !active[c]) continue;
    out[k] += conductance[s] * (portValue[k] - potential[c]);
  }
  return out;
}
