/**
 * The fused and short-stencil kernels of the V-cycle and of its conjugate gradients against the plain loops
 * they stand for, on an operator that has both uniform stretches (four equal faces, diagonal 4g) and general
 * volumes (cut faces, Dirichlet boundaries, holes, the box edge).
 */
import { directionAndProduct, stepAndFirstSweep, stepAndNorm } from './cg-kernels';
import { coarsen, prolongAdd, prolongCorrection, restrict, restrictResidual } from './coarsen';
import { buildHierarchy, cycleFromZero } from './cycle';
import { multigridCg } from './multigrid-cg';
import { activeRuns, createOperator, finishOperator, findRuns, residual, type Operator5 } from './operator';
import { pcg } from './pcg';
import { prolongAndSmooth, smoothAndRestrict, smoothRedBlack, smoothRedBlackFromZero } from './smooth';

function lcg(seed: number) {
  let s = seed >>> 0;
  return () => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 4294967296);
}

/** Two channels of unit faces with a few holes and cut faces, each with a port (Dirichlet volumes), on a 47 × 31 box. */
function channels(seed: number): Operator5 {
  const n1 = 47, n2 = 31;
  const rnd = lcg(seed);
  const op = createOperator(n1, n2, { reaction: false });
  for (let j = 0; j < n2; j++) {
    for (let i = 0; i < n1; i++) {
      const inChannel = j < 13 || (j > 16 && i > 3);
      op.active[i + j * n1] = inChannel && rnd() > 0.02 ? 1 : 0;
    }
  }
  op.gx.fill(1);
  op.gy.fill(1);
  for (let f = 0; f < op.gx.length; f++) if (rnd() < 0.05) op.gx[f] = rnd();
  for (let f = 0; f < op.gy.length; f++) if (rnd() < 0.05) op.gy[f] = rnd();
  for (let j = 0; j < n2; j++) op.boundary[j < 13 ? j * n1 : (j + 1) * n1 - 1] = 2; // a port at one end of each channel
  return finishOperator(op);
}

/** One colour of Gauss–Seidel by the definition, over the whole box. */
function plainRelax(op: Operator5, x: Float64Array, b: Float64Array, colour: number): void {
  const { n1, n2, gx, gy, diag, active } = op;
  for (let j = 0; j < n2; j++) {
    for (let i = 0; i < n1; i++) {
      const c = i + j * n1;
      if (!active[c] || (i + j) % 2 !== colour) continue;
      let s = b[c];
      if (i > 0) s += gx[i + j * (n1 + 1)] * x[c - 1];
      if (i < n1 - 1) s += gx[i + 1 + j * (n1 + 1)] * x[c + 1];
      if (j > 0) s += gy[c] * x[c - n1];
      if (j < n2 - 1) s += gy[c + n1] * x[c + n1];
      x[c] = s / diag[c];
    }
  }
}

function plainApply(op: Operator5, x: Float64Array): Float64Array {
  const r = new Float64Array(x.length);
  residual(op, x, new Float64Array(x.length), r);
  return r.map((v) => -v);
}

const maxDiff = (a: Float64Array, b: Float64Array) => a.reduce((m, v, k) => Math.max(m, Math.abs(v - b[k])), 0);
const dotAll = (a: Float64Array, b: Float64Array) => a.reduce((s, v, k) => s + v * b[k], 0);

describe('stretches and the kernels that use them', () => {
  const op = channels(5);
  const n = op.n1 * op.n2;
  const rnd = lcg(17);
  const onActive = () => Float64Array.from({ length: n }, (_, c) => (op.active[c] ? rnd() - 0.5 : 0));
  const b = onActive();

  it('cuts the runs into stretches: every active volume once, uniform ones with four faces g and diagonal 4g', () => {
    const { bounds, rowStart, conductance } = op.stretches!;
    const seen = new Uint8Array(n);
    let uniform = 0;
    for (let j = 0; j < op.n2; j++) {
      for (let s = rowStart[j]; s < rowStart[j + 1]; s++) {
        for (let c = bounds[2 * s]; c < bounds[2 * s + 1]; c++) {
          expect(Math.floor(c / op.n1)).toBe(j);
          seen[c]++;
          const g = conductance[s];
          if (g === 0) continue;
          uniform++;
          const f = c + j;
          expect([op.gx[f], op.gx[f + 1], op.gy[c], op.gy[c + op.n1], op.diag[c] / 4]).toEqual([g, g, g, g, g]);
        }
      }
    }
    expect(Array.from(seen)).toEqual(Array.from(op.active));
    expect(uniform).toBeGreaterThan(n / 3);
  });

  it('finishes the same operator from runs given by the caller', () => {
    const a = channels(5);
    const fresh = channels(5);
    findRuns(fresh);
    const given = finishOperator({ ...fresh, runs: undefined, rowRuns: undefined, stretches: undefined }, { runs: fresh.runs!, rowRuns: fresh.rowRuns! });
    expect(Array.from(given.diag)).toEqual(Array.from(a.diag));
    expect(Array.from(given.stretches!.bounds)).toEqual(Array.from(a.stretches!.bounds));
  });

  it('relaxes like plain red–black Gauss–Seidel, also from zero, and sums bᵀx in the last sweep on request', () => {
    const x0 = onActive();
    const mine = x0.slice(), plain = x0.slice();
    smoothRedBlack(op, mine, b, 0);
    plainRelax(op, plain, b, 0);
    plainRelax(op, plain, b, 1);
    expect(maxDiff(mine, plain)).toBeLessThan(1e-13);
    const bx = smoothRedBlack(op, mine, b, 1, true);
    plainRelax(op, plain, b, 1);
    plainRelax(op, plain, b, 0);
    expect(maxDiff(mine, plain)).toBeLessThan(1e-13);
    expect(bx).toBeCloseTo(dotAll(b, plain), 12);
    const fromZero = x0.slice(), zero = new Float64Array(n);
    smoothRedBlackFromZero(op, fromZero, b);
    smoothRedBlack(op, zero, b, 0);
    expect(maxDiff(fromZero, zero)).toBeLessThan(1e-15);
  });

  it('restricts the residual of red volumes only, after a sweep that ended on black, as residual then restrict', () => {
    const coarse = coarsen(op);
    const x = onActive();
    smoothRedBlack(op, x, b, 0);
    const r = new Float64Array(n);
    residual(op, x, b, r);
    const expected = new Float64Array(coarse.n1 * coarse.n2);
    restrict(op, r, coarse, expected);
    const mine = new Float64Array(expected.length).fill(7);
    restrictResidual(op, x, b, coarse, mine); // writes the active coarse volumes only
    expect(maxDiff(mine.map((v, k) => (coarse.active[k] ? v : 0)), expected)).toBeLessThan(1e-13);
  });

  it('prolongs onto red volumes only, which a sweep starting with black cannot tell from the full prolongation', () => {
    const coarse = coarsen(op);
    const xc = Float64Array.from({ length: coarse.n1 * coarse.n2 }, (_, k) => (coarse.active[k] ? Math.sin(k) : 0));
    const x = onActive(), y = x.slice();
    prolongCorrection(op, x, coarse, xc);
    prolongAdd(op, y, coarse, xc);
    smoothRedBlack(op, x, b, 1);
    smoothRedBlack(op, y, b, 1);
    expect(maxDiff(x, y)).toBeLessThan(1e-14);
  });

  it('fuses the last pre-smoothing sweep with the restriction and the first post-smoothing sweep with the prolongation', () => {
    const coarse = coarsen(op);
    const m = coarse.n1 * coarse.n2;
    const x = onActive(), y = x.slice();
    const rcFused = new Float64Array(m), rc = new Float64Array(m);
    smoothAndRestrict(op, x, b, coarse, rcFused);
    smoothRedBlack(op, y, b, 0);
    restrictResidual(op, y, b, coarse, rc);
    expect(maxDiff(x, y)).toBeLessThan(1e-15);
    expect(maxDiff(rcFused, rc)).toBeLessThan(1e-15);
    const xc = Float64Array.from({ length: m }, (_, k) => (coarse.active[k] ? Math.cos(k) : 0));
    const bxFused = prolongAndSmooth(op, x, b, coarse, xc, true);
    prolongCorrection(op, y, coarse, xc);
    const bx = smoothRedBlack(op, y, b, 1, true);
    expect(maxDiff(x, y)).toBeLessThan(1e-15);
    expect(bxFused).toBeCloseTo(bx, 12);
  });

  it('updates the direction with A p and pᵀAp in one pass, q sharing z’s array', () => {
    const z = onActive(), p = onActive();
    const beta = 0.37;
    const expectedP = p.map((v, c) => z[c] + beta * v);
    const expectedQ = plainApply(op, expectedP);
    const q = z; // the solver keeps z and A p in one vector
    const pq = directionAndProduct(op, z, beta, p, q);
    expect(maxDiff(p, expectedP)).toBeLessThan(1e-15);
    expect(maxDiff(q, expectedQ)).toBeLessThan(1e-13);
    expect(pq).toBeCloseTo(dotAll(expectedP, expectedQ), 10);
  });

  it('fuses the solution and residual update with the first sweep of the cycle', () => {
    const p = onActive(), q = onActive(), x = onActive(), r = onActive();
    const [x1, r1, q1] = [x.slice(), r.slice(), q.slice()];
    const alpha = 0.8;
    const rr = stepAndNorm(op, alpha, p, q1, x1, r1);
    const z = q1;
    smoothRedBlackFromZero(op, z, r1);
    const rrFused = stepAndFirstSweep(op, alpha, p, q, x, r, q);
    expect(rrFused).toBeCloseTo(rr, 12);
    expect(maxDiff(x, x1)).toBeLessThan(1e-15);
    expect(maxDiff(r, r1)).toBeLessThan(1e-15);
    expect(maxDiff(q, z)).toBeLessThan(1e-14);
  });

  it.each([1, 2, 3])('runs conjugate gradients with the fused cycle as pcg does with the plain one (%i sweeps)', (sweeps) => {
    const h = buildHierarchy(op, sweeps);
    const x = new Float64Array(n);
    const reference = pcg(op, b, x, { tolerance: 1e-10, precondition: (r, z) => cycleFromZero(h, r, z) });
    const y = new Float64Array(n).fill(NaN);
    const rhs = b.slice();
    const work = { p: new Float64Array(n), q: new Float64Array(n) };
    const fused = multigridCg(h, rhs, y, work, { tolerance: 1e-10, zeroGuess: true, overwriteRightHandSide: true });
    expect(fused.iterations).toBe(reference.iterations);
    expect(reference.converged).toBe(true);
    fused.history.forEach((v, k) => expect(Math.abs(v - reference.history[k])).toBeLessThan(1e-7 * reference.history[k]));
    const runs = activeRuns(op);
    let inside = 0;
    for (let k = 0; k < runs.length; k += 2) for (let c = runs[k]; c < runs[k + 1]; c++, inside++) expect(y[c]).toBeCloseTo(x[c], 8);
    expect(y.filter((v) => Number.isNaN(v)).length).toBe(n - inside); // zeroGuess leaves the rest alone
  });
});
