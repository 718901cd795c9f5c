/**
 * Preconditioned MINRES for a symmetric (indefinite) system K x = b with a symmetric positive definite
 * preconditioner M (C. C. Paige & M. A. Saunders, SIAM J. Numer. Anal. 12, 617 (1975); the preconditioned
 * form of H. C. Elman, D. J. Silvester & A. J. Wathen, Finite Elements and Fast Iterative Solvers, 2nd ed.,
 * OUP 2014, ch. 4): Lanczos in the M⁻¹ inner product, Givens rotations for the least-squares problem, short
 * recurrences. The iterate minimises ‖b − K x‖ in the M⁻¹ norm over the Krylov space; |η| tracks that norm.
 *
 * Storage: x, b (overwritten, used as a work vector) and four work vectors: the next search direction is
 * accumulated before the preconditioner overwrites the current z, and scaled once the rotation is known.
 *
 * Support: when K and M⁻¹ give 0 outside a set of unknowns S (rows of unknowns that do not exist) and b is 0
 * there, every Krylov vector is 0 outside S, so the vector operations need visit only S, given as runs
 * [first, end) of indices. On a layout whose fluid fills a few per cent of its bounding box this is the
 * difference between visiting the unknowns and visiting the box.
 */
const { sqrt, abs, hypot, max } = Math;

export interface MinresOptions {
  /** Stop when ‖r‖_{M⁻¹} / ‖b‖_{M⁻¹} ≤ tolerance (default 1e-8). */
  tolerance?: number;
  maxIterations?: number;
  /** Called after each iteration with the relative residual; return false to stop. */
  onIteration?: (iteration: number, relativeResidual: number) => boolean | void;
  /**
   * Runs [first, end) of the unknowns outside which K z, M⁻¹ r and b are 0 (default: all). Entries of x and of
   * the work vectors outside them stay 0; applyK and precondition must leave their outputs 0 there.
   */
  support?: Int32Array;
}

export interface MinresResult {
  iterations: number;
  /** Final ‖r‖_{M⁻¹} / ‖b‖_{M⁻¹} as tracked by the recurrence. */
  relativeResidual: number;
  converged: boolean;
  history: number[];
}

/**
 * Solves K x = b from x = 0. `applyK(z, out, beta)` must set out = K z − beta·out (beta = 0: out = K z, whatever
 * out held); `precondition(r, z)` sets z = M⁻¹ r. b is destroyed.
 */
export function minres(
  applyK: (z: Float64Array, out: Float64Array, beta: number) => void,
  precondition: (r: Float64Array, z: Float64Array) => void,
  b: Float64Array,
  x: Float64Array,
  options: MinresOptions = {},
): MinresResult {
  const tol = options.tolerance ?? 1e-8;
  const maxIt = options.maxIterations ?? 1000;
  const n = b.length;
  const runs = options.support ?? Int32Array.of(0, n);
  x.fill(0);
  let v: Float64Array = b;
  let vPrev: Float64Array = new Float64Array(n);
  const z: Float64Array = new Float64Array(n);
  let w: Float64Array = new Float64Array(n);
  let wPrev: Float64Array = new Float64Array(n);
  const history: number[] = [];

  precondition(v, z);
  let gamma = sqrt(max(dot(z, v, runs), 0));
  if (!(gamma > 0)) return { iterations: 0, relativeResidual: 0, converged: true, history: [0] };
  const eta0 = gamma;
  let eta = gamma;
  let gammaPrev = 1;
  let c = 1, cPrev = 1, s = 0, sPrev = 0;
  history.push(1);
  let it = 0;
  let rel = 1;
  while (it < maxIt) {
    it++;
    scale(z, 1 / gamma, runs);
    // v_{j+1} = K z_j − (γ_j/γ_{j−1}) v_{j−1} − (δ_j/γ_j) v_j, δ_j after the first subtraction (modified Gram–Schmidt).
    applyK(z, vPrev, it === 1 ? 0 : gamma / gammaPrev);
    const delta = dot(vPrev, z, runs);
    axpy(vPrev, -delta / gamma, v, runs);
    [v, vPrev] = [vPrev, v];
    // Apply the previous two rotations to the new column of the tridiagonal matrix; the new direction
    // w_{j+1} = (z_j − a3 w_{j−1} − a2 w_j)/a1 is accumulated now, while z_j is still there.
    const a0 = c * delta - cPrev * s * gamma;
    const a2 = s * delta + cPrev * c * gamma;
    const a3 = sPrev * gamma;
    nextDirection(wPrev, z, a3, a2, w, runs);
    precondition(v, z);
    const gammaNext = sqrt(max(dot(z, v, runs), 0));
    const a1 = hypot(a0, gammaNext);
    if (!(a1 > 0)) break; // singular: no progress possible
    const cNext = a0 / a1, sNext = gammaNext / a1;
    scaleAndStep(wPrev, 1 / a1, x, cNext * eta, runs);
    [w, wPrev] = [wPrev, w];
    eta = -sNext * eta;
    rel = abs(eta) / eta0;
    history.push(rel);
    cPrev = c; c = cNext; sPrev = s; s = sNext;
    gammaPrev = gamma; gamma = gammaNext;
    if (rel <= tol || !(gamma > 0)) break;
    if (options.onIteration?.(it, rel) === false) break;
  }
  return { iterations: it, relativeResidual: rel, converged: rel <= tol, history };
}

function dot(a: Float64Array, b: Float64Array, runs: Int32Array): number {
  let s = 0;
  for (let k = 0; k < runs.length; k += 2) for (let i = runs[k], end = runs[k + 1]; i < end; i++) s += a[i] * b[i];
  return s;
}

function scale(a: Float64Array, f: number, runs: Int32Array): void {
  for (let k = 0; k < runs.length; k += 2) for (let i = runs[k], end = runs[k + 1]; i < end; i++) a[i] *= f;
}

/** y += f x. */
function axpy(y: Float64Array, f: number, x: Float64Array, runs: Int32Array): void {
  for (let k = 0; k < runs.length; k += 2) for (let i = runs[k], end = runs[k + 1]; i < end; i++) y[i] += f * x[i];
}

/** wPrev ← z − a3 wPrev − a2 w. */
function nextDirection(wPrev: Float64Array, z: Float64Array, a3: number, a2: number, w: Float64Array, runs: Int32Array): void {
  for (let k = 0; k < runs.length; k += 2) {
    for (let i = runs[k], end = runs[k + 1]; i < end; i++) wPrev[i] = z[i] - a3 * wPrev[i] - a2 * w[i];
  }
}

/** w ← f w, then x += step w. */
function scaleAndStep(w: Float64Array, f: number, x: Float64Array, step: number, runs: Int32Array): void {
  for (let k = 0; k < runs.length; k += 2) {
    for (let i = runs[k], end = runs[k + 1]; i < end; i++) {
      const wi = w[i] * f;
      w[i] = wi;
      x[i] += step * wi;
    }
  }
}
