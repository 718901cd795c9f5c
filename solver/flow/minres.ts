/**
 * Preconditioned MINRES for a symmetric (indefinite) system K x = b with a symmetric positive definite
 * preconditioner M (C. C. Paige & M. A. Saunders, SIAM J. Numer. Anal. 12, 617 (1975); the preconditioned
 * form of H. C. Elman, D. J. Silvester & A. J. Wathen, Finite Elements and Fast Iterative Solvers, 2nd ed.,
 * OUP 2014, ch. 4): Lanczos in the M⁻¹ inner product, Givens rotations for the least-squares problem, short
 * recurrences. The iterate minimises ‖b − K x‖ in the M⁻¹ norm over the Krylov space; |η| tracks that norm.
 *
 * Storage: x, b (overwritten, used as a work vector) and four work vectors: the next search direction is
 * accumulated before the preconditioner overwrites the current z, and scaled once the rotation is known.
 */

export interface MinresOptions {
  /** Stop when ‖r‖_{M⁻¹} / ‖b‖_{M⁻¹} ≤ tolerance (default 1e-8). */
  tolerance?: number;
  maxIterations?: number;
  /** Called after each iteration with the relative residual; return false to stop. */
  onIteration?: (iteration: number, relativeResidual: number) => boolean | void;
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
  x.fill(0);
  let v: Float64Array = b;
  let vPrev: Float64Array = new Float64Array(n);
  const z: Float64Array = new Float64Array(n);
  let w: Float64Array = new Float64Array(n);
  let wPrev: Float64Array = new Float64Array(n);
  const history: number[] = [];

  precondition(v, z);
  let gamma = Math.sqrt(Math.max(dot(z, v), 0));
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
    scale(z, 1 / gamma);
    // v_{j+1} = K z_j − (γ_j/γ_{j−1}) v_{j−1} − (δ_j/γ_j) v_j, δ_j after the first subtraction (modified Gram–Schmidt).
    applyK(z, vPrev, it === 1 ? 0 : gamma / gammaPrev);
    const delta = dot(vPrev, z);
    axpy(vPrev, -delta / gamma, v);
    [v, vPrev] = [vPrev, v];
    // Apply the previous two rotations to the new column of the tridiagonal matrix; the new direction
    // w_{j+1} = (z_j − a3 w_{j−1} − a2 w_j)/a1 is accumulated now, while z_j is still there.
    const a0 = c * delta - cPrev * s * gamma;
    const a2 = s * delta + cPrev * c * gamma;
    const a3 = sPrev * gamma;
    for (let i = 0; i < n; i++) wPrev[i] = z[i] - a3 * wPrev[i] - a2 * w[i];
    precondition(v, z);
    const gammaNext = Math.sqrt(Math.max(dot(z, v), 0));
    const a1 = Math.hypot(a0, gammaNext);
    if (!(a1 > 0)) break; // singular: no progress possible
    const cNext = a0 / a1, sNext = gammaNext / a1;
    const inv = 1 / a1, step = cNext * eta;
    for (let i = 0; i < n; i++) {
      const wi = wPrev[i] * inv;
      wPrev[i] = wi;
      x[i] += step * wi;
    }
    [w, wPrev] = [wPrev, w];
    eta = -sNext * eta;
    rel = Math.abs(eta) / eta0;
    history.push(rel);
    cPrev = c; c = cNext; sPrev = s; s = sNext;
    gammaPrev = gamma; gamma = gammaNext;
    if (rel <= tol || !(gamma > 0)) break;
    if (options.onIteration?.(it, rel) === false) break;
  }
  return { iterations: it, relativeResidual: rel, converged: rel <= tol, history };
}

function dot(a: Float64Array, b: Float64Array): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}

function scale(a: Float64Array, f: number): void {
  for (let i = 0; i < a.length; i++) a[i] *= f;
}

/** y += f x. */
function axpy(y: Float64Array, f: number, x: Float64Array): void {
  for (let i = 0; i < y.length; i++) y[i] += f * x[i];
}
