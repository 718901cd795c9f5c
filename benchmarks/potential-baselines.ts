/**
 * Baselines for the potential benchmark, on the same operator and right-hand side as the solver:
 *   - one streaming pass over the operator's arrays (the "work unit");
 *   - SOR with the optimal relaxation factor.
 */
import { apply, multigridPcg, type Operator5 } from '../solver/multigrid';

/**
 * CPU seconds of this process (user + system). The benchmark machine is shared, so wall time would
 * mostly measure the neighbours; CPU time of a single-threaded solve is what it costs.
 */
export function cpuSeconds(): number {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1e6;
}

/**
 * One streaming pass: read every array a relaxation sweep reads (gx, gy, diag, active, x, b) once
 * and write one vector, with no neighbour reuse and no dependencies: the memory traffic of a
 * sweep at its cheapest.
 */
export function streamingPass(op: Operator5, x: Float64Array, b: Float64Array, out: Float64Array): void {
  const { n1, n2, gx, gy, diag, active } = op;
  const sx = n1 + 1;
  for (let j = 0; j < n2; j++) {
    const row = j * n1, rowx = j * sx;
    for (let i = 0; i < n1; i++) {
      const c = row + i;
      out[c] = active[c] ? diag[c] * x[c] + gx[rowx + i] + gy[c] + b[c] : 0;
    }
  }
}

/** Seconds of one streaming pass, averaged over enough passes to span at least a second of CPU time. */
export function timeStreamingPass(op: Operator5, x: Float64Array, b: Float64Array): number {
  const out = new Float64Array(x.length);
  for (let k = 0; k < 10; k++) streamingPass(op, x, b, out);
  let passes = 0;
  const start = cpuSeconds();
  while (cpuSeconds() - start < 1) {
    for (let k = 0; k < 10; k++) streamingPass(op, x, b, out);
    passes += 10;
  }
  return (cpuSeconds() - start) / passes;
}

/** One pass reading the grid's own arrays (fraction and both apertures): the lighter reading of "work unit". */
export function gridPass(fraction: Float64Array, apertureX: Float64Array, apertureY: Float64Array): number {
  let s = 0;
  for (let c = 0; c < fraction.length; c++) s += fraction[c] + apertureX[c] + apertureY[c];
  return s;
}

export function timeGridPass(fraction: Float64Array, apertureX: Float64Array, apertureY: Float64Array): number {
  let sink = 0, passes = 0;
  for (let k = 0; k < 10; k++) sink += gridPass(fraction, apertureX, apertureY);
  const start = cpuSeconds();
  while (cpuSeconds() - start < 1) {
    for (let k = 0; k < 10; k++) sink += gridPass(fraction, apertureX, apertureY);
    passes += 10;
  }
  if (sink === -1) console.log(sink);
  return (cpuSeconds() - start) / passes;
}

/**
 * The Jacobi spectral radius ρ_J = 1 − λ_min(D⁻¹A) (the spectrum of D⁻¹A is symmetric about 1 for a
 * five-point operator, whose graph is bipartite), with λ_min from inverse iteration x ← A⁻¹ D x
 * (solved by the multigrid solver) and the Rayleigh quotient xᵀAx / xᵀDx.
 */
export function jacobiSpectralRadius(op: Operator5, steps = 6): number {
  const n = op.n1 * op.n2;
  const mg = multigridPcg(op);
  let x = new Float64Array(n);
  for (let c = 0; c < n; c++) x[c] = op.active[c] ? 1 + 0.01 * Math.sin(c) : 0;
  const rhs = new Float64Array(n), ax = new Float64Array(n);
  let lambda = 1;
  for (let s = 0; s < steps; s++) {
    for (let c = 0; c < n; c++) rhs[c] = op.diag[c] * x[c];
    const y = new Float64Array(n);
    mg.solve(rhs, y, { tolerance: 1e-10 });
    let norm = 0;
    for (let c = 0; c < n; c++) norm = Math.max(norm, Math.abs(y[c]));
    for (let c = 0; c < n; c++) y[c] /= norm;
    x = y;
    apply(op, x, ax);
    let num = 0, den = 0;
    for (let c = 0; c < n; c++) if (op.active[c]) { num += x[c] * ax[c]; den += op.diag[c] * x[c] * x[c]; }
    lambda = num / den;
  }
  return 1 - lambda;
}

/** Young's optimal factor ω = 2 / (1 + sqrt(1 − ρ_J²)) (D. M. Young, Iterative Solution of Large Linear Systems, 1971). */
export function optimalOmega(rhoJ: number): number {
  return 2 / (1 + Math.sqrt(Math.max(0, 1 - rhoJ * rhoJ)));
}

/** One lexicographic SOR sweep on A x = b. */
export function sorSweep(op: Operator5, x: Float64Array, b: Float64Array, omega: number): void {
  const { n1, n2, gx, gy, diag, active } = op;
  const sx = n1 + 1;
  for (let j = 0; j < n2; j++) {
    const row = j * n1, rowx = j * sx;
    for (let i = 0; i < n1; i++) {
      const c = row + i;
      if (!active[c]) continue;
      let s = b[c];
      const w = gx[rowx + i], e = gx[rowx + i + 1], so = gy[c], no = gy[c + n1];
      if (w !== 0) s += w * x[c - 1];
      if (e !== 0) s += e * x[c + 1];
      if (so !== 0) s += so * x[c - n1];
      if (no !== 0) s += no * x[c + n1];
      x[c] += omega * (s / diag[c] - x[c]);
    }
  }
}

export interface SorRun {
  omega: number;
  /** Sweeps actually run, the relative residual they reached and their time (s). */
  sweeps: number;
  residual: number;
  seconds: number;
  converged: boolean;
  /** Sweeps to 1e-8: measured when converged, else extrapolated from the rate over the last quarter of the run. */
  sweepsNeeded: number;
  secondsNeeded: number;
  /** Rate per sweep observed at the end of the run, and Young's asymptotic rate ω − 1. */
  observedRate: number;
}

export function runSor(op: Operator5, b: Float64Array, omega: number, tolerance: number, maxSeconds: number): SorRun {
  const n = b.length;
  const x = new Float64Array(n), r = new Float64Array(n);
  const norm = (v: Float64Array) => { let s = 0; for (let c = 0; c < n; c++) if (op.active[c]) s += v[c] * v[c]; return Math.sqrt(s); };
  const bnorm = norm(b);
  const rel = () => {
    apply(op, x, r);
    for (let c = 0; c < n; c++) r[c] = op.active[c] ? b[c] - r[c] : 0;
    return norm(r) / bnorm;
  };
  const history: Array<[number, number]> = [[0, 1]];
  const check = 50;
  let sweeps = 0, residual = 1, sweepSeconds = 0;
  while (residual > tolerance && sweepSeconds < maxSeconds) {
    const t = cpuSeconds();
    for (let k = 0; k < check; k++) sorSweep(op, x, b, omega);
    sweepSeconds += cpuSeconds() - t;
    sweeps += check;
    residual = rel();
    history.push([sweeps, residual]);
  }
  const perSweep = sweepSeconds / sweeps;
  const converged = residual <= tolerance;
  const from = history[Math.floor(history.length * 0.75)];
  const observedRate = Math.pow(residual / from[1], 1 / Math.max(1, sweeps - from[0]));
  const sweepsNeeded = converged || !(observedRate < 1) ? sweeps : sweeps + Math.log(tolerance / residual) / Math.log(observedRate);
  return {
    omega, sweeps, residual, seconds: sweepSeconds, converged, observedRate,
    sweepsNeeded: converged ? sweeps : sweepsNeeded,
    secondsNeeded: (converged ? sweeps : sweepsNeeded) * perSweep,
  };
}
