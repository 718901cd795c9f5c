/**
 * How far the depth-averaged Brinkman model's pressure-driven flow rate is from the exact rectangular duct,
 * for a channel of depth d and width w (physics.md §3; the report and README must state it).
 *
 * Both relative to the parallel-plate rate Q₀ = w d³ G / (12 μ):
 *   model (Brinkman, k = √12 / d):  Q/Q₀ = 1 − (2 / (k w)) tanh(k w / 2)
 *   exact duct (Fourier series; F. M. White, Viscous Fluid Flow; H. Bruus, Theoretical Microfluidics 2008),
 *   with h = min(d, w), b = max(d, w):  Q/Q₀ = (h/d)² (1 − (192 h / (π⁵ b)) Σ_{n odd} tanh(n π b / (2h)) / n⁵)
 * The second form is symmetric in d and w, as the duct is.
 */

export interface DuctError {
  /** d / w. */
  aspect: number;
  /** Q / Q₀ of the model and of the exact duct. */
  model: number;
  exact: number;
  /** model / exact − 1. */
  error: number;
}

export function brinkmanFactor(depth: number, width: number): number {
  const kw = (Math.sqrt(12) / depth) * width;
  return 1 - (2 / kw) * Math.tanh(kw / 2);
}

export function exactDuctFactor(depth: number, width: number): number {
  const h = Math.min(depth, width), b = Math.max(depth, width);
  let sum = 0;
  for (let n = 1; n < 200; n += 2) sum += Math.tanh((n * Math.PI * b) / (2 * h)) / n ** 5;
  // Q = (h³ b G / 12μ)(1 − ...) for the duct of short side h; Q₀ uses the depth: Q₀ = w d³ G / (12 μ).
  return ((h ** 3 * b) / (width * depth ** 3)) * (1 - ((192 * h) / (Math.PI ** 5 * b)) * sum);
}

export function ductError(depth: number, width: number): DuctError {
  const model = brinkmanFactor(depth, width);
  const exact = exactDuctFactor(depth, width);
  return { aspect: depth / width, model, exact, error: model / exact - 1 };
}
