import { activeRuns, createOperator, finishOperator, prepared, type Operator5 } from './operator';

/**
 * The operator on the grid of 2×2 aggregates (coarse volume (I, J) covers fine (2I..2I+1, 2J..2J+1)).
 *
 * Coarse face conductance = half the sum of the fine faces it covers, coarse Dirichlet conductance = half the sum,
 * coarse reaction = the sum: this is the finite-volume operator re-discretised on spacing 2h (for k grad u a face
 * of twice the length at twice the distance keeps its conductance; a reaction term grows with the area), which
 * equals half the Galerkin product PᵀAP of the piecewise-constant prolongation for the diffusive part. Cut cells
 * carry over through their apertures, so the coarse operators respect the walls
 * (W. Hackbusch, Multi-Grid Methods and Applications, 1985, ch. 3; cell-centred variant).
 */
export function coarsen(fine: Operator5): Operator5 {
  const n1 = Math.ceil(fine.n1 / 2);
  const n2 = Math.ceil(fine.n2 / 2);
  const withReaction = fine.reaction.length > 0;
  const op = createOperator(n1, n2, { reaction: withReaction });
  const { active, gx, gy, reaction, boundary } = op;
  const fn1 = fine.n1, fsx = fn1 + 1, csx = n1 + 1;
  const fineReaction = fine.reaction, fineBoundary = fine.boundary, fineGx = fine.gx, fineGy = fine.gy;
  // Only faces within the runs of active volumes (and the face just after each run) can be open.
  const runs = activeRuns(fine);
  for (let k = 0; k < runs.length; k += 2) {
    const first = runs[k], end = runs[k + 1];
    const j = (first / fn1) | 0, J = j >> 1;
    const i0 = first - j * fn1, i1 = end - j * fn1;
    const row = j * fn1, coarseRow = J * n1;
    for (let i = i0; i < i1; i++) {
      const c = row + i;
      const C = coarseRow + (i >> 1);
      active[C] = 1;
      if (withReaction) reaction[C] += fineReaction[c];
      const g = fineBoundary[c];
      if (g !== 0) boundary[C] += 0.5 * g;
    }
    // Vertical faces on the coarse lines x = 2I·h (gx index of face i in row j is i + j(n1+1)).
    for (let i = i0 + (i0 & 1); i <= i1; i += 2) gx[(i >> 1) + J * csx] += 0.5 * fineGx[i + j * fsx];
    // Horizontal faces on the coarse lines y = 2J·h: the face below each volume of an even row.
    if ((j & 1) === 0) for (let i = i0; i < i1; i++) gy[coarseRow + (i >> 1)] += 0.5 * fineGy[row + i];
  }
  return finishOperator(op);
}

/** Fine → coarse: each coarse volume receives the sum of its children (the transpose of `prolongAdd`); r is 0 off the active volumes. */
export function restrict(fine: Operator5, r: Float64Array, coarse: Operator5, rc: Float64Array): void {
  rc.fill(0);
  const n1 = fine.n1;
  const cn1 = coarse.n1;
  const runs = activeRuns(fine);
  for (let k = 0; k < runs.length; k += 2) {
    const j = (runs[k] / n1) | 0;
    const shift = (j >> 1) * cn1, row = j * n1;
    for (let c = runs[k]; c < runs[k + 1]; c++) rc[shift + ((c - row) >> 1)] += r[c];
  }
}

/** Coarse → fine: x_fine += x_coarse of the parent (piecewise-constant prolongation), on active volumes. */
export function prolongAdd(fine: Operator5, x: Float64Array, coarse: Operator5, xc: Float64Array): void {
  const n1 = fine.n1;
  const cn1 = coarse.n1;
  const runs = activeRuns(fine);
  for (let k = 0; k < runs.length; k += 2) {
    const j = (runs[k] / n1) | 0;
    const shift = (j >> 1) * cn1, row = j * n1;
    for (let c = runs[k]; c < runs[k + 1]; c++) x[c] += xc[shift + ((c - row) >> 1)];
  }
}

/**
 * The V-cycle's restriction of the residual r = b − A x right after a sweep that relaxed colour 1 last:
 * the residual of a colour-1 volume is then 0 (its equation was just solved with its neighbours, all of
 * colour 0, as they are now), so only colour-0 volumes are evaluated, each added to its parent in rc.
 * Equal to `residual` then `restrict` up to the rounding of the colour-1 zeros (the vanishing half of the
 * residual after red–black relaxation: U. Trottenberg, C. W. Oosterlee & A. Schüller, Multigrid, Academic Press
 * 2001). x must be finite everywhere; only rc's entries on the active coarse volumes are written.
 */
export function restrictResidual(fine: Operator5, x: Float64Array, b: Float64Array, coarse: Operator5, rc: Float64Array): void {
  clearOnRuns(coarse, rc);
  prepared(fine);
  for (let j = 0; j < fine.n2; j++) restrictRow(fine, x, b, coarse.n1, rc, j);
}

/** v = 0 on the runs of op's active volumes (the only entries the V-cycle reads). */
export function clearOnRuns(op: Operator5, v: Float64Array): void {
  const runs = activeRuns(op);
  for (let k = 0; k < runs.length; k += 2) v.fill(0, runs[k], runs[k + 1]);
}

/** restrictResidual for the colour-0 volumes of row j, added to rc (cn1: the coarse row length). */
export function restrictRow(fine: Operator5, x: Float64Array, b: Float64Array, cn1: number, rc: Float64Array, j: number): void {
  const { n1, n2, gx, gy, diag } = fine;
  const { bounds, rowStart, conductance } = fine.stretches!;
  const row = j * n1, parents = (j >> 1) * cn1; // the parent of c is parents + ((c − row) >> 1)
  const shift = row - j; // (c − shift) & 1 is 0 on colour 0
  const inside = j > 0 && j < n2 - 1;
  for (let t = rowStart[j], last = rowStart[j + 1]; t < last; t++) {
    const first = bounds[2 * t], end = bounds[2 * t + 1];
    const start = first + ((first - shift) & 1);
    const g = conductance[t];
    if (g > 0) {
      for (let c = start; c < end; c += 2) rc[parents + ((c - row) >> 1)] += b[c] + g * (x[c - 1] + x[c + 1] + x[c - n1] + x[c + n1] - 4 * x[c]);
    } else if (inside) {
      for (let c = start; c < end; c += 2) {
        const f = c + j;
        rc[parents + ((c - row) >> 1)] += b[c] - diag[c] * x[c] + gx[f] * x[c - 1] + gx[f + 1] * x[c + 1] + gy[c] * x[c - n1] + gy[c + n1] * x[c + n1];
      }
    } else {
      for (let c = start; c < end; c += 2) {
        const f = c + j;
        let s = b[c] - diag[c] * x[c];
        const w = gx[f], e = gx[f + 1], so = gy[c], no = gy[c + n1];
        if (w !== 0) s += w * x[c - 1];
        if (e !== 0) s += e * x[c + 1];
        if (so !== 0) s += so * x[c - n1];
        if (no !== 0) s += no * x[c + n1];
        rc[parents + ((c - row) >> 1)] += s;
      }
    }
  }
}

/**
 * The V-cycle's prolongation before a sweep that relaxes colour 1 first: that sweep overwrites every colour-1
 * value without reading it, so only colour-0 volumes receive x_coarse of their parent (`prolongAdd` otherwise).
 */
export function prolongCorrection(fine: Operator5, x: Float64Array, coarse: Operator5, xc: Float64Array): void {
  prepared(fine);
  for (let j = 0; j < fine.n2; j++) prolongRow(fine, x, coarse.n1, xc, j);
}

/** prolongCorrection for row j (cn1: the coarse row length). */
export function prolongRow(fine: Operator5, x: Float64Array, cn1: number, xc: Float64Array, j: number): void {
  const runs = fine.runs!, rowRuns = fine.rowRuns!;
  const row = j * fine.n1, parents = (j >> 1) * cn1;
  const shift = row - j;
  for (let k = rowRuns[j], last = rowRuns[j + 1]; k < last; k += 2) {
    const end = runs[k + 1];
    for (let c = runs[k] + ((runs[k] - shift) & 1); c < end; c += 2) x[c] += xc[parents + ((c - row) >> 1)];
  }
}
