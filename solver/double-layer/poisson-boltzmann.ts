import { thermalVoltage } from '../physics/electrokinetics';

/**
 * Numerical solution of the one-dimensional Poisson–Boltzmann equation over a flat wall,
 *   d²ψ/dy² = (v_T / λ_D²) sinh(ψ / v_T),  ψ(0) = ζ,  ψ(L) = 0,  v_T = k_B T / z e,
 * by Newton's method on a finite-difference grid that is fine at the wall and coarse far out
 * (y_k = L (e^{s k/n} − 1)/(e^s − 1)). An independent check of the closed-form Gouy–Chapman profile.
 */
export function solvePoissonBoltzmann(
  zeta: number,
  debyeLength: number,
  temperature: number,
  options: { valence?: number; points?: number; extent?: number } = {},
): { y: Float64Array; psi: Float64Array; iterations: number } {
  const vt = thermalVoltage(temperature) / (options.valence ?? 1);
  const n = options.points ?? 2000;
  const L = (options.extent ?? 30) * debyeLength;
  const s = 6;
  const y = new Float64Array(n + 1);
  for (let k = 0; k <= n; k++) y[k] = (L * (Math.exp((s * k) / n) - 1)) / (Math.exp(s) - 1);
  const psi = new Float64Array(n + 1);
  // Start from the Debye–Hückel profile ζ e^{−y/λ}.
  for (let k = 0; k <= n; k++) psi[k] = zeta * Math.exp(-y[k] / debyeLength);
  psi[n] = 0;
  const k2 = 1 / (debyeLength * debyeLength);
  const a = new Float64Array(n + 1);
  const b = new Float64Array(n + 1);
  const c = new Float64Array(n + 1);
  const r = new Float64Array(n + 1);
  let iterations = 0;
  for (; iterations < 50; iterations++) {
    // Residual F_k = (second difference) − k² v_T sinh(ψ/v_T) and its tridiagonal Jacobian.
    for (let k = 1; k < n; k++) {
      const hl = y[k] - y[k - 1];
      const hr = y[k + 1] - y[k];
      const wl = 2 / (hl * (hl + hr));
      const wr = 2 / (hr * (hl + hr));
      a[k] = wl;
      c[k] = wr;
      b[k] = -wl - wr - k2 * Math.cosh(psi[k] / vt);
      r[k] = -(wl * psi[k - 1] + wr * psi[k + 1] - (wl + wr) * psi[k] - k2 * vt * Math.sinh(psi[k] / vt));
    }
    // Thomas algorithm for the Newton step δ (δ_0 = δ_n = 0).
    for (let k = 2; k < n; k++) {
      const m = a[k] / b[k - 1];
      b[k] -= m * c[k - 1];
      r[k] -= m * r[k - 1];
    }
    let next = 0;
    let step = 0;
    for (let k = n - 1; k >= 1; k--) {
      const d = (r[k] - c[k] * next) / b[k];
      psi[k] += d;
      next = d;
      step = Math.max(step, Math.abs(d));
    }
    // Newton converges quadratically; stop once the update is far below the discretisation error.
    if (step <= 1e-10 * Math.abs(zeta)) break;
  }
  return { y, psi, iterations };
}
