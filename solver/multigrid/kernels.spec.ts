/**
 * The run-based kernels (only runs of active volumes are visited) against plain loops over the whole
 * box, on a random operator with holes; and the banded Cholesky of the coarsest level.
 */
import { coarsestSolver } from './banded';
import { prolongAdd, restrict, coarsen } from './coarsen';
import { activeRuns, apply, createOperator, finishOperator, residual, type Operator5 } from './operator';
import { smoothRedBlack } from './smooth';

function lcg(seed: number) {
  let s = seed >>> 0;
  return () => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 4294967296);
}

function randomOperator(n1: number, n2: number, seed: number): Operator5 {
  const rnd = lcg(seed);
  const op = createOperator(n1, n2);
  for (let c = 0; c < n1 * n2; c++) op.active[c] = rnd() < 0.75 ? 1 : 0;
  for (let f = 0; f < op.gx.length; f++) op.gx[f] = rnd() < 0.9 ? rnd() : 0;
  for (let f = 0; f < op.gy.length; f++) op.gy[f] = rnd() < 0.9 ? rnd() : 0;
  for (let c = 0; c < n1 * n2; c++) op.boundary[c] = rnd() < 0.1 ? 2 * rnd() : 0;
  op.reaction.fill(0.01); // every piece of the random mask gets a definite operator
  return finishOperator(op);
}

/** (A x)_c by definition: diagonal minus the open faces, 0 off the active volumes. */
function naiveApply(op: Operator5, x: Float64Array): Float64Array {
  const { n1, n2, gx, gy, diag, active } = op;
  const out = new Float64Array(n1 * n2);
  for (let j = 0; j < n2; j++) for (let i = 0; i < n1; i++) {
    const c = i + j * n1;
    if (!active[c]) continue;
    let s = diag[c] * x[c];
    if (i > 0) s -= gx[i + j * (n1 + 1)] * x[c - 1];
    if (i < n1 - 1) s -= gx[i + 1 + j * (n1 + 1)] * x[c + 1];
    if (j > 0) s -= gy[c] * x[c - n1];
    if (j < n2 - 1) s -= gy[c + n1] * x[c + n1];
    out[c] = s;
  }
  return out;
}

const maxDiff = (a: Float64Array, b: Float64Array) => a.reduce((m, v, k) => Math.max(m, Math.abs(v - b[k])), 0);

describe('multigrid kernels on runs of active volumes', () => {
  const op = randomOperator(37, 23, 7);
  const n = 37 * 23;
  const rnd = lcg(11);
  const x = Float64Array.from({ length: n }, () => rnd() - 0.5);
  const b = Float64Array.from({ length: n }, () => rnd() - 0.5);

  it('finds the runs: every active volume once, in order, nothing else', () => {
    const runs = activeRuns(op);
    const seen = new Uint8Array(n);
    for (let k = 0; k < runs.length; k += 2) {
      expect(Math.floor(runs[k] / 37)).toBe(Math.floor((runs[k + 1] - 1) / 37)); // within one row
      for (let c = runs[k]; c < runs[k + 1]; c++) seen[c] = 1;
    }
    expect(Array.from(seen)).toEqual(Array.from(op.active));
  });

  it('applies A and forms the residual as the plain definition does, 0 off the active volumes', () => {
    const out = new Float64Array(n).fill(9);
    apply(op, x, out);
    expect(maxDiff(out, naiveApply(op, x))).toBeLessThan(1e-14);
    const r = new Float64Array(n).fill(9);
    residual(op, x, b, r);
    const ax = naiveApply(op, x);
    expect(maxDiff(r, Float64Array.from(b, (v, c) => (op.active[c] ? v - ax[c] : 0)))).toBeLessThan(1e-14);
  });

  it('relaxes red then black like Gauss–Seidel in that order', () => {
    const mine = x.slice(), plain = x.slice();
    smoothRedBlack(op, mine, b, 1);
    for (const colour of [1, 0]) {
      for (let j = 0; j < 23; j++) for (let i = 0; i < 37; i++) {
        const c = i + j * 37;
        if (!op.active[c] || (i + j) % 2 !== colour) continue;
        const ax = naiveApply(op, plain)[c] - op.diag[c] * plain[c];
        plain[c] = (b[c] - ax) / op.diag[c];
      }
    }
    expect(maxDiff(mine, plain)).toBeLessThan(1e-13);
  });

  it('restricts by summing children and prolongs by copying the parent', () => {
    const coarse = coarsen(op);
    const r = new Float64Array(n);
    residual(op, x, b, r);
    const rc = new Float64Array(coarse.n1 * coarse.n2);
    restrict(op, r, coarse, rc);
    const expected = new Float64Array(rc.length);
    for (let c = 0; c < n; c++) expected[((c % 37) >> 1) + (Math.floor(c / 37) >> 1) * coarse.n1] += r[c];
    expect(maxDiff(rc, expected)).toBeLessThan(1e-14);
    const xc = Float64Array.from({ length: rc.length }, (_, k) => k);
    const xf = new Float64Array(n);
    prolongAdd(op, xf, coarse, xc);
    for (let c = 0; c < n; c++) expect(xf[c]).toBe(op.active[c] ? xc[((c % 37) >> 1) + (Math.floor(c / 37) >> 1) * coarse.n1] : 0);
  });

  it('solves the coarsest level exactly by banded Cholesky (in either band order)', () => {
    for (const [n1, n2] of [[9, 14], [14, 9]]) {
      const small = randomOperator(n1, n2, 3);
      const rhs = Float64Array.from({ length: n1 * n2 }, (_, c) => (small.active[c] ? Math.cos(c) : 0));
      const sol = new Float64Array(n1 * n2);
      coarsestSolver(small).solve(rhs, sol);
      const check = naiveApply(small, sol);
      expect(maxDiff(check, rhs)).toBeLessThan(1e-10);
    }
  });
});
