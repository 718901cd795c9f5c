/**
 * A symmetric five-point operator on an n1 × n2 box of control volumes (index c = i + j·n1),
 * written as face conductances plus a diagonal part:
 *
 *   (A x)_c = (Σ_faces g_f + reaction_c + boundary_c) x_c − Σ_faces g_f x_neighbour
 *
 * - `gx[(i) + j·(n1+1)]` is the conductance of the face between volumes (i−1, j) and (i, j);
 *   faces on the box edge and faces next to an inactive volume are 0.
 * - `gy[i + j·n1]` likewise for the face between (i, j−1) and (i, j), length n1·(n2+1).
 * - `reaction` holds terms that scale with the volume (Brinkman friction α·area); `boundary` holds Dirichlet
 *   conductances (a port face at a known value). Both are ≥ 0.
 * - `active[c]` is 1 for a volume that carries an unknown; inactive volumes are left untouched (x = 0).
 *
 * This is the finite-volume form of −div(k grad u) + α u = f on cut cells: face conductances carry the open
 * aperture, so insulating and no-flux walls are exact. A is symmetric by construction.
 */
export interface Operator5 {
  n1: number;
  n2: number;
  gx: Float64Array;
  gy: Float64Array;
  reaction: Float64Array;
  boundary: Float64Array;
  active: Uint8Array;
  /** Σ g + reaction + boundary per volume; filled by `finishOperator`. */
  diag: Float64Array;
}

export function createOperator(n1: number, n2: number): Operator5 {
  const n = n1 * n2;
  return {
    n1,
    n2,
    gx: new Float64Array((n1 + 1) * n2),
    gy: new Float64Array(n1 * (n2 + 1)),
    reaction: new Float64Array(n),
    boundary: new Float64Array(n),
    active: new Uint8Array(n),
    diag: new Float64Array(n),
  };
}

/**
 * Clears conductances that touch inactive volumes or the box edge, and computes the diagonal.
 * A volume whose diagonal is zero (no face, no reaction, no boundary) is made inactive.
 */
export function finishOperator(op: Operator5): Operator5 {
  const { n1, n2, gx, gy, reaction, boundary, active, diag } = op;
  const sx = n1 + 1;
  for (let j = 0; j < n2; j++) {
    gx[j * sx] = 0;
    gx[n1 + j * sx] = 0;
  }
  for (let i = 0; i < n1; i++) {
    gy[i] = 0;
    gy[i + n2 * n1] = 0;
  }
  for (let j = 0; j < n2; j++) {
    for (let i = 0; i < n1; i++) {
      const c = i + j * n1;
      if (!active[c]) {
        gx[i + j * sx] = 0;
        gx[i + 1 + j * sx] = 0;
        gy[c] = 0;
        gy[c + n1] = 0;
      }
    }
  }
  for (let j = 0; j < n2; j++) {
    for (let i = 0; i < n1; i++) {
      const c = i + j * n1;
      const d = gx[i + j * sx] + gx[i + 1 + j * sx] + gy[c] + gy[c + n1] + reaction[c] + boundary[c];
      diag[c] = active[c] ? d : 0;
      if (active[c] && d <= 0) {
        active[c] = 0;
        diag[c] = 0;
      }
    }
  }
  return op;
}

/** out = A x (inactive volumes give 0). */
export function apply(op: Operator5, x: Float64Array, out: Float64Array): void {
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
      out[c] = s;
    }
  }
}

/** r = b − A x. */
export function residual(op: Operator5, x: Float64Array, b: Float64Array, r: Float64Array): void {
  apply(op, x, r);
  const { active } = op;
  for (let c = 0; c < r.length; c++) r[c] = active[c] ? b[c] - r[c] : 0;
}
