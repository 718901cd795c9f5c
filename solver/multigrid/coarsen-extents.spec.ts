import { buildHierarchy, vcycle, type Coarsening } from './cycle';
import { createOperator, finishOperator, residual, type Operator5 } from './operator';

/**
 * −Δu = f in a 4n × n channel with Dirichlet walls all round, placed `shift` cells into the box; the long walls
 * are `wall` cells from the first and last rows' centres (conductance 1/wall), the ends half a cell.
 */
function channel(n: number, shift: number, wall = 0.5): Operator5 {
  const n1 = 4 * n + 2, n2 = n + 2;
  const op = createOperator(n1, n2);
  for (let j = shift; j < n + shift; j++) {
    for (let i = shift; i < 4 * n + shift; i++) {
      const c = i + j * n1;
      op.active[c] = 1;
      if (j === shift || j === n - 1 + shift) op.boundary[c] += 1 / wall;
      if (i === shift || i === 4 * n - 1 + shift) op.boundary[c] += 2;
    }
  }
  op.gx.fill(1);
  op.gy.fill(1);
  return finishOperator(op);
}

/** Residual reduction of the last of ten V-cycles used as a stationary iteration. */
function cycleFactor(op: Operator5, coarsening: Coarsening, distance?: Float64Array): number {
  const h = buildHierarchy(op, 2, coarsening, distance);
  const n = op.n1 * op.n2;
  const b = new Float64Array(n);
  for (let c = 0; c < n; c++) b[c] = op.active[c] ? Math.sin(0.37 * c) : 0;
  const x = new Float64Array(n), r = new Float64Array(n), e = new Float64Array(n);
  let last = 0, factor = 0;
  for (let k = 0; k < 10; k++) {
    residual(op, x, b, r);
    const norm = Math.hypot(...r);
    if (k > 0) factor = norm / last;
    last = norm;
    vcycle(h, r, e);
    for (let c = 0; c < n; c++) x[c] += e[c];
  }
  return factor;
}

describe('coarsening with active extents', () => {
  it('keeps the V-cycle factor near 0.1 whether the Dirichlet walls fall on even or odd grid lines', () => {
    for (const shift of [0, 1]) expect(cycleFactor(channel(128, shift), 'extents')).toBeLessThan(0.2);
  });

  it('fixes what the half-sum rule gets wrong on odd lines (reference: it stops converging there)', () => {
    expect(cycleFactor(channel(128, 0), 'half')).toBeLessThan(0.2);
    expect(cycleFactor(channel(128, 1), 'half')).toBeGreaterThan(1);
  });

  it('re-discretises walls a whole cell away (a staggered velocity normal to its wall) when told their distance', () => {
    const op = channel(128, 0, 1);
    const distance = new Float64Array(op.n1 * op.n2);
    for (let c = 0; c < distance.length; c++) {
      if (op.boundary[c] > 0) distance[c] = op.boundary[c] === 1 ? 1 : op.boundary[c] === 2 ? 0.5 : 2 / op.boundary[c];
    }
    expect(cycleFactor(op, 'extents', distance)).toBeLessThan(0.2);
    expect(cycleFactor(op, 'extents')).toBeGreaterThan(0.5);
  });

  it('equals the half-sum rule on full aggregates', () => {
    const fine = channel(16, 0);
    const a = buildHierarchy(fine, 2, 'half').levels[1];
    const b = buildHierarchy(fine, 2, 'extents').levels[1];
    for (const key of ['gx', 'gy', 'boundary', 'reaction', 'diag'] as const) {
      a[key].forEach((v, k) => expect(b[key][k]).toBeCloseTo(v, 12));
    }
  });
});
