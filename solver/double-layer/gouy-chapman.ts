import { thermalVoltage } from '../physics/electrokinetics';

/**
 * Gouy–Chapman potential over one flat wall in a symmetric z:z electrolyte (Gouy 1910, Chapman 1913;
 * physics.md §4):  tanh(z e ψ / 4 k_B T) = tanh(z e ζ / 4 k_B T) · exp(−y / λ_D).
 */
export function gouyChapmanPotential(y: number, zeta: number, debyeLength: number, temperature: number, valence = 1): number {
  const vt = thermalVoltage(temperature) / valence;
  return 4 * vt * Math.atanh(Math.tanh(zeta / (4 * vt)) * Math.exp(-y / debyeLength));
}

/** dψ/dy of the Gouy–Chapman profile: −(2 v_T/λ_D) sinh(ψ/2v_T), v_T = k_B T / z e (first integral of Poisson–Boltzmann). */
export function gouyChapmanSlope(psi: number, debyeLength: number, temperature: number, valence = 1): number {
  const vt = thermalVoltage(temperature) / valence;
  return (-2 * vt * Math.sinh(psi / (2 * vt))) / debyeLength;
}

/**
 * Electroosmotic velocity across the double layer over one wall, thin EDL: u(y) = u_HS (1 − ψ(y)/ζ)
 * (follows from μ u'' = −ρ_e E with Poisson's equation; reference-values.md §4).
 */
export function edlVelocityRatio(psi: number, zeta: number): number {
  return zeta === 0 ? 1 : 1 - psi / zeta;
}
