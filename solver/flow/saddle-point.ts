/**
 * The Stokes–Brinkman saddle-point system on the staggered grid and its block preconditioner
 * (physics.md §3, §7):
 *
 *   K [u; v; p] = [A_u  0   −B_uᵀ] [u]   [f_u]
 *                 [0    A_v −B_vᵀ] [v] = [f_v]
 *                 [−B_u −B_v  0  ] [p]   [ 0 ]
 *
 * symmetric and indefinite. The unknowns are one vector: u (the apertureX layout), then v (the apertureY
 * layout), then p per cell; unknowns that do not exist (closed faces, solid cells) stay 0. The
 * preconditioner is block diagonal and symmetric positive definite: one multigrid V-cycle for each of A_u,
 * A_v (symmetric red–black sweeps, exact coarsest solve) and the Cahouet–Chabard Schur approximation.
 *
 * Every pass visits only the unknowns that exist: the runs of active velocity nodes (Operator5.runs) and of
 * pressure cells, together `support`, the runs of the whole vector that MINRES works on (minres.ts). Entries
 * outside them stay 0.
 */
import type { CutCellGrid } from '../grid/cut-cell-grid';
import { runsOf } from '../grid/fluid-runs';
import { cycleFromZero, type Hierarchy } from '../multigrid/cycle';
import { activeRuns, type Operator5 } from '../multigrid/operator';
import type { MergedCouplings } from './cell-merging';
import { addDivergence, addDivergenceTranspose } from './divergence';
import type { PortFaces } from './port-faces';
import type { SchurPreconditioner } from './schur';

export interface SaddlePointSystem {
  grid: CutCellGrid;
  ports: PortFaces;
  ops: [Operator5, Operator5];
  /** Small cells merged into a neighbour (they carry no unknown of their own). */
  merged: MergedCouplings;
  /** Cells that carry a pressure unknown. */
  pressureActive: Uint8Array;
  /** Offsets of v and p in the unknown vector, and its length. */
  offsetV: number;
  offsetP: number;
  size: number;
  /** Runs [first, end) of the pressure cells (grid cell indices). */
  pressureRuns: Int32Array;
  /** Runs of the unknowns in the whole vector: u nodes, v nodes, pressure cells. */
  support: Int32Array;
}

export function saddlePointSystem(
  grid: CutCellGrid,
  ports: PortFaces,
  ops: [Operator5, Operator5],
  merged: MergedCouplings,
  pressureActive: Uint8Array,
): SaddlePointSystem {
  const nu = ops[0].n1 * ops[0].n2, nv = ops[1].n1 * ops[1].n2;
  const pressureRuns = runsOf(pressureActive, grid.nx, grid.ny).runs;
  const parts = [activeRuns(ops[0]), activeRuns(ops[1]), pressureRuns];
  const support = new Int32Array(parts[0].length + parts[1].length + parts[2].length);
  let k = 0;
  [0, nu, nu + nv].forEach((offset, p) => { for (const c of parts[p]) support[k++] = c + offset; });
  return {
    grid, ports, ops, merged, pressureActive, offsetV: nu, offsetP: nu + nv, size: nu + nv + grid.nx * grid.ny,
    pressureRuns, support,
  };
}

/** Views of the three blocks of an unknown-sized vector. */
export function blocks(sys: SaddlePointSystem, x: Float64Array): [Float64Array, Float64Array, Float64Array] {
  return [x.subarray(0, sys.offsetV), x.subarray(sys.offsetV, sys.offsetP), x.subarray(sys.offsetP, sys.size)];
}

/** out = K z − beta·out. */
export function applySaddlePoint(sys: SaddlePointSystem, z: Float64Array, out: Float64Array, beta: number): void {
  const [zu, zv, zp] = blocks(sys, z);
  const [ou, ov, op] = blocks(sys, out);
  applyCombined(sys.ops[0], zu, ou, beta);
  applyCombined(sys.ops[1], zv, ov, beta);
  addDivergenceTranspose(sys.grid, sys.ports, sys.merged, zp, ou, ov, -1);
  // Off the pressure cells op is 0 (merged cells are cleared again by addDivergence).
  const runs = sys.pressureRuns;
  for (let k = 0; k < runs.length; k += 2) {
    if (beta === 0) op.fill(0, runs[k], runs[k + 1]);
    else for (let c = runs[k], end = runs[k + 1]; c < end; c++) op[c] = -beta * op[c];
  }
  addDivergence(sys.grid, sys.ports, sys.merged, zu, zv, op, -1);
}

/** z = M⁻¹ r for the block-diagonal preconditioner. */
export function preconditionSaddlePoint(
  sys: SaddlePointSystem,
  velocity: [Hierarchy, Hierarchy],
  schur: SchurPreconditioner,
  r: Float64Array,
  z: Float64Array,
): void {
  const [ru, rv, rp] = blocks(sys, r);
  const [zu, zv, zp] = blocks(sys, z);
  // MINRES keeps z at 0 off the unknowns (its support), so the cycles need not clear it first.
  cycleFromZero(velocity[0], ru, zu);
  cycleFromZero(velocity[1], rv, zv);
  schur.apply(rp, zp);
}

/** out = A x − beta·out on active volumes (the Operator5 product fused with the update); other entries are not written. */
function applyCombined(op: Operator5, x: Float64Array, out: Float64Array, beta: number): void {
  const { n1, gx, gy, diag } = op;
  const runs = activeRuns(op);
  for (let k = 0; k < runs.length; k += 2) {
    const end = runs[k + 1];
    const j = (runs[k] / n1) | 0; // gx index of the face left of volume c is c + j
    for (let c = runs[k]; c < end; c++) {
      const f = c + j;
      let s = diag[c] * x[c];
      const w = gx[f];
      const e = gx[f + 1];
      const so = gy[c];
      const no = gy[c + n1];
      if (w !== 0) s -= w * x[c - 1];
      if (e !== 0) s -= e * x[c + 1];
      if (so !== 0) s -= so * x[c - n1];
      if (no !== 0) s -= no * x[c + n1];
      out[c] = beta === 0 ? s : s - beta * out[c];
    }
  }
}
