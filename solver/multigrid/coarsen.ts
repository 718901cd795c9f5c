import { activeRuns, createOperator, finishOperator, type Operator5 } from './operator';

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
  const op = createOperator(n1, n2);
  const fn1 = fine.n1;
  const csx = n1 + 1;
  // Only faces within the runs of active volumes (and the face just after each run) can be open.
  const runs = activeRuns(fine);
  for (let k = 0; k < runs.length; k += 2) {
    const first = runs[k], end = runs[k + 1];
    const j = (first / fn1) | 0, J = j >> 1;
    const i0 = first - j * fn1, i1 = end - j * fn1;
    for (let i = i0; i < i1; i++) {
      const c = i + j * fn1;
      const C = (i >> 1) + J * n1;
      op.active[C] = 1;
      op.reaction[C] += fine.reaction[c];
      op.boundary[C] += 0.5 * fine.boundary[c];
    }
    // Vertical faces on the coarse lines x = 2I·h (gx index of face i in row j is i + j(n1+1)).
    for (let i = i0 + (i0 & 1); i <= i1; i += 2) op.gx[(i >> 1) + J * csx] += 0.5 * fine.gx[i + j * (fn1 + 1)];
    // Horizontal faces on the coarse lines y = 2J·h: the face below each volume of an even row.
    if ((j & 1) === 0) for (let i = i0; i < i1; i++) op.gy[(i >> 1) + J * n1] += 0.5 * fine.gy[i + j * fn1];
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
