/**
 * Properties of liquid water at atmospheric pressure.
 */

/**
 * Dynamic viscosity from the IAPWS 2008 formulation (IAPWS R12-08; Huber et al., J. Phys. Chem. Ref. Data 38,
 * 101 (2009)), without the critical enhancement (which is 1 away from the critical point):
 *   μ = μ* · μ̄0(T̄) · μ̄1(T̄, ρ̄),  T̄ = T/647.096 K, ρ̄ = ρ/322 kg/m³, μ* = 1 µPa·s,
 *   μ̄0 = 100 √T̄ / Σ H_i T̄^-i,  μ̄1 = exp(ρ̄ Σ_i (1/T̄ − 1)^i Σ_j H_ij (ρ̄ − 1)^j).
 */
export function waterViscosity(temperature: number, density: number): number {
  const t = temperature / 647.096;
  const r = density / 322;
  const mu0 = (100 * Math.sqrt(t)) / (H0[0] + H0[1] / t + H0[2] / (t * t) + H0[3] / (t * t * t));
  const a = 1 / t - 1;
  const b = r - 1;
  let sum = 0;
  let ai = 1;
  for (let i = 0; i < 6; i++) {
    let inner = 0;
    let bj = 1;
    for (let j = 0; j < 7; j++) {
      inner += H1[i][j] * bj;
      bj *= b;
    }
    sum += ai * inner;
    ai *= a;
  }
  return 1e-6 * mu0 * Math.exp(r * sum);
}

const H0 = [1.67752, 2.20462, 0.6366564, -0.241605];
/** H1[i][j], IAPWS R12-08 table 2. */
const H1 = [
  [5.20094e-1, 2.22531e-1, -2.81378e-1, 1.61913e-1, -3.25372e-2, 0, 0],
  [8.50895e-2, 9.99115e-1, -9.06851e-1, 2.57399e-1, 0, 0, 0],
  [-1.08374, 1.88797, -7.72479e-1, 0, 0, 0, 0],
  [-2.89555e-1, 1.26613, -4.89837e-1, 0, 6.98452e-2, 0, -4.35673e-3],
  [0, 0, -2.5704e-1, 0, 0, 8.72102e-3, 0],
  [0, 1.20573e-1, 0, 0, 0, 0, -5.93264e-4],
];

/**
 * Relative permittivity of water, Malmberg & Maryott, J. Res. NBS 56, 1 (1956):
 *   ε_r = 87.740 − 0.40008 t + 9.398e-4 t² − 1.410e-6 t³,  t in °C (0–100 °C).
 */
export function waterPermittivity(temperature: number): number {
  const t = temperature - 273.15;
  return 87.74 - 0.40008 * t + 9.398e-4 * t * t - 1.41e-6 * t * t * t;
}
