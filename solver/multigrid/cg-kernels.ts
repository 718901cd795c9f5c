import { prepared, type Operator5 } from './operator';
import { relaxRow, relaxRowFromZero } from './smooth';

/**
 * The vector work of preconditioned conjugate gradients (pcg.ts) on an Operator5, fused into few passes over
 * the runs of active volumes: the search direction update with the product A p and pᵀAp, and the solution and
 * residual update with ‖r‖². Entries off the active volumes are never written, so vectors that start at 0
 * there stay 0; the stencils then carry no tests inside rows 1 … n2 − 2 (a closed face is 0 and every entry is
 * finite), while the first and last rows, whose outer neighbours lie outside the arrays, keep them.
 */

/** q = A p on row j; returns Σ p_c q_c over the row. */
function applyRow(op: Operator5, p: Float64Array, q: Float64Array, j: number): number {
  const { n1, n2, gx, gy, diag } = op;
  const { bounds, rowStart, conductance } = op.stretches!;
  const inside = j > 0 && j < n2 - 1;
  let pq = 0;
  for (let t = rowStart[j], last = rowStart[j + 1]; t < last; t++) {
    const first = bounds[2 * t], end = bounds[2 * t + 1];
    const g = conductance[t];
    if (g > 0) {
      for (let c = first; c < end; c++) {
        const s = g * (4 * p[c] - p[c - 1] - p[c + 1] - p[c - n1] - p[c + n1]);
        q[c] = s;
        pq += p[c] * s;
      }
    } else if (inside) {
      for (let c = first; c < end; c++) {
        const f = c + j; // gx index of the face left of c
        const s = diag[c] * p[c] - gx[f] * p[c - 1] - gx[f + 1] * p[c + 1] - gy[c] * p[c - n1] - gy[c + n1] * p[c + n1];
        q[c] = s;
        pq += p[c] * s;
      }
    } else {
      for (let c = first; c < end; c++) {
        const f = c + j;
        let s = diag[c] * p[c];
        const w = gx[f], e = gx[f + 1], so = gy[c], no = gy[c + n1];
        if (w !== 0) s -= w * p[c - 1];
        if (e !== 0) s -= e * p[c + 1];
        if (so !== 0) s -= so * p[c - n1];
        if (no !== 0) s -= no * p[c + n1];
        q[c] = s;
        pq += p[c] * s;
      }
    }
  }
  return pq;
}

/** p = z + β p on row j (p = z when β = 0, whatever p held). */
function directionRow(runs: Int32Array, rowRuns: Int32Array, z: Float64Array, beta: number, p: Float64Array, j: number): void {
  const last = rowRuns[j + 1];
  if (beta === 0) {
    for (let k = rowRuns[j]; k < last; k += 2) for (let c = runs[k], end = runs[k + 1]; c < end; c++) p[c] = z[c];
    return;
  }
  for (let k = rowRuns[j]; k < last; k += 2) for (let c = runs[k], end = runs[k + 1]; c < end; c++) p[c] = z[c] + beta * p[c];
}

/**
 * p ← z + β p, then q ← A p; returns pᵀq. The direction runs one row ahead of the product, which then finds
 * p updated in every row it reads. q may be z's array: row j of z is read before row j of q is written.
 */
export function directionAndProduct(op: Operator5, z: Float64Array, beta: number, p: Float64Array, q: Float64Array): number {
  const { runs, rowRuns } = prepared(op);
  const n2 = op.n2;
  directionRow(runs, rowRuns, z, beta, p, 0);
  let pq = 0;
  for (let j = 0; j < n2; j++) {
    if (j + 1 < n2) directionRow(runs, rowRuns, z, beta, p, j + 1);
    pq += applyRow(op, p, q, j);
  }
  return pq;
}

/** x ← x + α p, r ← r − α q; returns ‖r‖². */
export function stepAndNorm(op: Operator5, alpha: number, p: Float64Array, q: Float64Array, x: Float64Array, r: Float64Array): number {
  const { runs, rowRuns } = prepared(op);
  let rr = 0;
  for (let j = 0; j < op.n2; j++) rr += stepRow(runs, rowRuns, alpha, p, q, x, r, j);
  return rr;
}

/** r = b − A x on the active volumes, with A x formed in `scratch` (so r may be b); returns [‖b‖², ‖r‖²] over them. */
export function residualAndNorms(op: Operator5, x: Float64Array, b: Float64Array, r: Float64Array, scratch: Float64Array): [number, number] {
  const { runs, rowRuns } = prepared(op);
  let bb = 0, rr = 0;
  for (let j = 0; j < op.n2; j++) {
    applyRow(op, x, scratch, j);
    for (let k = rowRuns[j], last = rowRuns[j + 1]; k < last; k += 2) {
      for (let c = runs[k], end = runs[k + 1]; c < end; c++) {
        const bc = b[c];
        const rc = bc - scratch[c];
        r[c] = rc;
        bb += bc * bc;
        rr += rc * rc;
      }
    }
  }
  return [bb, rr];
}

/** x ← x + α p, r ← r − α q on row j; returns Σ r_c² over the row. */
function stepRow(runs: Int32Array, rowRuns: Int32Array, alpha: number, p: Float64Array, q: Float64Array, x: Float64Array, r: Float64Array, j: number): number {
  let rr = 0;
  for (let k = rowRuns[j], last = rowRuns[j + 1]; k < last; k += 2) {
    for (let c = runs[k], end = runs[k + 1]; c < end; c++) {
      x[c] += alpha * p[c];
      const rc = r[c] - alpha * q[c];
      r[c] = rc;
      rr += rc * rc;
    }
  }
  return rr;
}

/**
 * x ← x + α p and r ← r − α q (returns ‖r‖²) fused with the first sweep of the V-cycle on the new r into z
 * (smoothRedBlackFromZero): row j + 1 is updated, then the red volumes of row j become r/d, then the black ones
 * of row j − 1 are relaxed, each finding the rows it reads done. z may be q's array: row j + 1 of q is read
 * before z is written there.
 */
export function stepAndFirstSweep(op: Operator5, alpha: number, p: Float64Array, q: Float64Array, x: Float64Array, r: Float64Array, z: Float64Array): number {
  const { runs, rowRuns } = prepared(op);
  const n2 = op.n2;
  let rr = stepRow(runs, rowRuns, alpha, p, q, x, r, 0);
  for (let j = 0; j <= n2; j++) {
    if (j + 1 < n2) rr += stepRow(runs, rowRuns, alpha, p, q, x, r, j + 1);
    if (j < n2) relaxRowFromZero(op, z, r, j);
    if (j > 0) relaxRow(op, z, r, j - 1, 1);
  }
  return rr;
}

/** r = b and x = 0 on the runs (r may be b); returns ‖b‖². */
export function startFromZero(runs: Int32Array, b: Float64Array, r: Float64Array, x: Float64Array): number {
  let bb = 0;
  for (let k = 0; k < runs.length; k += 2) {
    for (let c = runs[k], end = runs[k + 1]; c < end; c++) {
      const bc = b[c];
      r[c] = bc;
      x[c] = 0;
      bb += bc * bc;
    }
  }
  return bb;
}

/** Σ a_c b_c over the runs. */
export function dotOnRuns(a: Float64Array, b: Float64Array, runs: Int32Array): number {
  let s = 0;
  for (let k = 0; k < runs.length; k += 2) for (let c = runs[k], end = runs[k + 1]; c < end; c++) s += a[c] * b[c];
  return s;
}
