/**
 * Finite-double-layer corrections of the mean electroosmotic velocity (Debye–Hückel, |ζ| ≲ 25 mV), relative to
 * the Helmholtz–Smoluchowski velocity; κ = 1/λ_D (physics.md §4, reference-values.md §4).
 */

/** Slit of half-gap h: ū/u_HS = 1 − tanh(κh)/(κh) (Burgreen & Nakache 1964, Debye–Hückel form). */
export function slitMeanRatio(kappaH: number): number {
  if (kappaH < 1e-4) return (kappaH * kappaH) / 3; // series: tanh x / x ≈ 1 − x²/3
  return 1 - Math.tanh(kappaH) / kappaH;
}

/** Circular capillary of radius a: ū/u_HS = 1 − 2 I₁(κa)/(κa I₀(κa)) (Rice & Whitehead, J. Phys. Chem. 69, 4017 (1965)). */
export function capillaryMeanRatio(kappaA: number): number {
  if (kappaA < 1e-4) return (kappaA * kappaA) / 8;
  return 1 - (2 * besselRatioI1I0(kappaA)) / kappaA;
}

/**
 * I₁(x)/I₀(x) for x > 0: power series of both below x = 20 (terms (x²/4)^k / (k!)² and (x/2)(x²/4)^k/(k!(k+1)!)),
 * and the large-argument expansion I_ν(x) ~ eˣ/√(2πx) Σ (−1)^k a_k(ν)/x^k above
 * (Abramowitz & Stegun, Handbook of Mathematical Functions, 9.6.10 and 9.7.1).
 */
export function besselRatioI1I0(x: number): number {
  if (x < 20) {
    const q = (x * x) / 4;
    let t0 = 1;
    let t1 = x / 2;
    let s0 = t0;
    let s1 = t1;
    for (let k = 1; k < 200; k++) {
      t0 *= q / (k * k);
      t1 *= q / (k * (k + 1));
      s0 += t0;
      s1 += t1;
      if (t0 < 1e-17 * s0 && t1 < 1e-17 * s1) break;
    }
    return s1 / s0;
  }
  return asymptoticSum(1, x) / asymptoticSum(0, x);
}

function asymptoticSum(nu: number, x: number): number {
  const m = 4 * nu * nu;
  let term = 1;
  let sum = 1;
  for (let k = 1; k < 30; k++) {
    term *= -(m - (2 * k - 1) ** 2) / (k * 8 * x);
    sum += term;
    if (Math.abs(term) < 1e-17) break;
  }
  return sum;
}
