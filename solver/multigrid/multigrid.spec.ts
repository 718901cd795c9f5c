import { apply, createOperator, finishOperator, solveMultigridPcg, type Operator5 } from './index';

/**
 * −Δu = f on the unit square minus a disc (inactive volumes), u = 0 on the square's edges through Dirichlet
 * conductances 2 (half-cell distance), natural no-flux at the disc: the shape of the potential problems.
 */
function poissonWithHole(n: number, reactionPerArea = 0): Operator5 {
  const op = createOperator(n, n);
  const h = 1 / n;
  for (let j = 0; j < n; j++) {
    for (let i = 0; i < n; i++) {
      const c = i + j * n;
      const x = (i + 0.5) * h;
      const y = (j + 0.5) * h;
      op.active[c] = (x - 0.6) ** 2 + (y - 0.4) ** 2 > 0.04 ? 1 : 0;
      op.reaction[c] = reactionPerArea * h * h;
      if (i === 0 || i === n - 1) op.boundary[c] += 2;
      if (j === 0 || j === n - 1) op.boundary[c] += 2;
    }
  }
  op.gx.fill(1);
  op.gy.fill(1);
  return finishOperator(op);
}

describe('multigrid-preconditioned conjugate gradients', () => {
  it('needs a number of iterations that does not grow with the resolution', () => {
    const its: number[] = [];
    for (const n of [32, 64, 128, 256, 512]) {
      const op = poissonWithHole(n);
      const b = new Float64Array(n * n).fill(1 / (n * n));
      const x = new Float64Array(n * n);
      const res = solveMultigridPcg(op, b, x, { tolerance: 1e-8 });
      expect(res.converged).toBe(true);
      its.push(res.iterations);
    }
    // Mesh independence: the finest grid needs at most two more iterations than the coarsest.
    expect(Math.max(...its)).toBeLessThanOrEqual(15);
    expect(its[its.length - 1] - its[0]).toBeLessThanOrEqual(3);
  });

  it('solves to the requested residual (checked independently of the solver)', () => {
    const n = 96;
    const op = poissonWithHole(n, 50);
    const b = new Float64Array(n * n);
    for (let c = 0; c < b.length; c++) b[c] = op.active[c] ? Math.sin(c) : 0;
    const x = new Float64Array(n * n);
    solveMultigridPcg(op, b, x, { tolerance: 1e-10 });
    const ax = new Float64Array(n * n);
    apply(op, x, ax);
    let num = 0;
    let den = 0;
    for (let c = 0; c < b.length; c++) {
      num += (ax[c] - b[c]) ** 2;
      den += b[c] ** 2;
    }
    expect(Math.sqrt(num / den)).toBeLessThan(1e-10);
  });

  it('reproduces the exact discrete solution of a 1D problem embedded in 2D', () => {
    // A channel of one row: −u'' = 0 with u = 0 at the left face and u = 1 at the right face gives u linear.
    const n = 200;
    const op = createOperator(n, 3);
    for (let i = 0; i < n; i++) op.active[i + n] = 1;
    op.gx.fill(1);
    op.gy.fill(1);
    op.boundary[n] = 2;
    op.boundary[2 * n - 1] = 2;
    finishOperator(op);
    const b = new Float64Array(3 * n);
    b[2 * n - 1] = 2; // Dirichlet value 1 times its conductance
    const x = new Float64Array(3 * n);
    solveMultigridPcg(op, b, x, { tolerance: 1e-12 });
    for (let i = 0; i < n; i++) expect(x[i + n]).toBeCloseTo((i + 0.5) / n, 10);
  });
});
