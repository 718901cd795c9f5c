/**
 * Physical ranges the schema leaves open but arithmetic does not: a potential of 1e300 V squares
 * to infinity in the Joule power. Far beyond any chip (kilovolts, a few bar), far within float64.
 */
import type { DesignDocument, DesignFieldError } from '../../shared/design';

/** |V| above this is surely a unit mistake (1 MV). */
export const MAX_POTENTIAL = 1e6;
/** |p| above this is surely a unit mistake (1 GPa). */
export const MAX_PRESSURE = 1e9;

export function rangeErrors(design: DesignDocument): DesignFieldError[] {
  const errors: DesignFieldError[] = [];
  design.ports.forEach((port, k) => {
    if (port.potential !== null && Math.abs(port.potential) > MAX_POTENTIAL) {
      errors.push({ field: `ports[${k}].potential`, message: 'is more than 1 MV in size; potentials are in volts' });
    }
    if (Math.abs(port.pressure) > MAX_PRESSURE) {
      errors.push({ field: `ports[${k}].pressure`, message: 'is more than 1 GPa in size; pressures are in pascals' });
    }
  });
  return errors;
}
