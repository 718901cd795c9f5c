import type { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';
import { PASSWORD_MIN_LENGTH } from '../../../shared/api';

/** Shortest password the server accepts. */
export const MIN_PASSWORD = PASSWORD_MIN_LENGTH;

/** Group validator: `field` must equal `other`. Puts `mismatch` on the group. */
export function sameAs(field: string, other: string): ValidatorFn {
  return (group: AbstractControl): ValidationErrors | null => {
    const a = group.get(field)?.value;
    const b = group.get(other)?.value;
    return a && b && a !== b ? { mismatch: true } : null;
  };
}

/** Rejects text that is only spaces (Validators.required accepts it). */
export const notBlank: ValidatorFn = (control) =>
  typeof control.value === 'string' && control.value.length > 0 && control.value.trim() === '' ? { blank: true } : null;
