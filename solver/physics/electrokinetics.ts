import { AVOGADRO, BOLTZMANN, ELEMENTARY_CHARGE, VACUUM_PERMITTIVITY } from './constants';

/** Helmholtz–Smoluchowski (μ_eo = −ε ζ / μ and its inverse) lives in shared/ so the app can use it. */
export { electroosmoticMobility, zetaFromMobility } from '../../shared/physics';

/**
 * Debye length of a symmetric z:z electrolyte (physics.md §4):
 *   λ_D = sqrt(ε_r ε₀ k_B T / (2 N_A e² z² I)),  I in mol/m³.
 */
export function debyeLength(relativePermittivity: number, temperature: number, ionicStrength: number, valence = 1): number {
  const eps = relativePermittivity * VACUUM_PERMITTIVITY;
  return Math.sqrt((eps * BOLTZMANN * temperature) / (2 * AVOGADRO * ELEMENTARY_CHARGE ** 2 * valence ** 2 * ionicStrength));
}

/** Thermal voltage k_B T / e. */
export function thermalVoltage(temperature: number): number {
  return (BOLTZMANN * temperature) / ELEMENTARY_CHARGE;
}

/** Reynolds number ρ U D_h / μ with the hydraulic diameter of a w × d rectangle, D_h = 2 w d / (w + d). */
export function reynolds(density: number, speed: number, width: number, depth: number, viscosity: number): number {
  const dh = (2 * width * depth) / (width + depth);
  return (density * speed * dh) / viscosity;
}
