/** Physical constants, SI: they live in shared/physics.ts (the app needs them too). */
export {
  AVOGADRO,
  BOLTZMANN,
  ELEMENTARY_CHARGE,
  FARADAY,
  GAS_CONSTANT,
  STANDARD_GRAVITY,
  VACUUM_PERMITTIVITY,
} from '../../shared/physics';
