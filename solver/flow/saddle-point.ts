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
 */
import type { CutCellGrid } from '../grid/cut-cell-grid';
import { vcycle, type Hierarchy } from '../multigrid/cycle';
import type { Operator5 } from '../multigrid/operator';
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
}

export function saddlePointSystem(
  grid: CutCellGrid,
  ports: PortFaces,
  ops: [Operator5, Operator5],
  merged: MergedCouplings,
  pressureActive: Uint8Array,
): SaddlePointSystem {
  const nu = ops[0].n1 * ops[0].n2, nv = ops[1].n1 * ops[1].n2;
  return { grid, ports, ops, merged, pressureActive, offsetV: nu, offsetP: nu + nv, size: nu + nv + grid.nx * grid.ny };
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
  const active = sys.pressureActive;
  for (let c = 0; c < op.length; c++) op[c] = active[c] && beta !== 0 ? -beta * op[c] : 0;
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
  vcycle(velocity[0], ru, zu);
  vcycle(velocity[1], rv, zv);
  schur.apply(rp, zp);
}

/** out = A x − beta·out on active volumes, 0 elsewhere (the Operator5 product fused with the update). */
function applyCombined(op: Operator5, x: Float64Array, out: Float64Array, beta: number): void {
  const { n1, n2, gx, gy, diag, active } = op;
  const sx = n1 + 1;
  for (let j = 0; j < n2; j++) {
    const row = j * n1;
    const rowx = j * sx;
    for (let i = 0; i < n1; i++) {
      const c = row + i;
      if (!active[c]) {
        out[c] = 0;
        continue;
      }
      let s = diag[c] * x[c];
      const w = gx[rowx + i];
      const e = gx[rowx + i + 1];
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
