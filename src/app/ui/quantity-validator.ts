/**
 * Reactive-form support for quantities typed with units: a text control whose validator reads the text with
 * the shared parser (units.ts), checks the range, and explains a refusal with the unit and the reason.
 */
import { FormControl, type AbstractControl, type ValidationErrors, type ValidatorFn } from '@angular/forms';
import { formatQuantity, parseQuantity, type Dimension, type QuantityResult } from './units';

export interface QuantityRule {
  dimension: Dimension;
  /** Unit assumed for a bare number ("um", "V", "deg", ...). */
  defaultUnit?: string;
  /** Smallest value allowed (SI); see `minExclusive`. */
  min?: number;
  /** When true, the value must be greater than `min`, not equal to it. */
  minExclusive?: boolean;
  /** Largest value allowed (SI). */
  max?: number;
  /** Parser used instead of parseQuantity (e.g. a pressure that may be typed as a head). */
  parse?: (text: string) => QuantityResult;
}

/** Reads the text under the rule: the SI value, or the message that says what is wrong. */
export function readQuantity(text: string | null | undefined, rule: QuantityRule): QuantityResult {
  const parsed = rule.parse ? rule.parse(text ?? '') : parseQuantity(text ?? '', rule.dimension, { defaultUnit: rule.defaultUnit });
  if (!parsed.ok) return parsed;
  const v = parsed.value;
  const shown = (x: number) => formatQuantity(x, rule.dimension);
  if (rule.min !== undefined) {
    if (rule.minExclusive && !(v > rule.min)) return { ok: false, message: `Must be greater than ${shown(rule.min)}` };
    if (!rule.minExclusive && !(v >= rule.min)) return { ok: false, message: `Must be at least ${shown(rule.min)}` };
  }
  if (rule.max !== undefined && !(v <= rule.max)) return { ok: false, message: `Must be at most ${shown(rule.max)}` };
  return parsed;
}

/** Validator that puts `{ quantity: message }` on the control when its text is not a valid quantity. */
export function quantityValidator(rule: QuantityRule | (() => QuantityRule)): ValidatorFn {
  return (control: AbstractControl): ValidationErrors | null => {
    const r = readQuantity(control.value as string, typeof rule === 'function' ? rule() : rule);
    return r.ok ? null : { quantity: r.message };
  };
}

/** The message of a quantity control's error, for `<mat-error>`. */
export function quantityError(control: AbstractControl): string {
  const e = control.errors?.['quantity'];
  return typeof e === 'string' ? e : '';
}

/**
 * A text control for a quantity, showing `value` formatted with the shared formatter.
 * Updates on blur so that a value is committed once, when the engineer leaves the field (or presses Enter,
 * which the templates turn into a blur).
 */
export function quantityControl(value: number | null, rule: QuantityRule | (() => QuantityRule), digits = 6): FormControl<string> {
  const dim = typeof rule === 'function' ? rule().dimension : rule.dimension;
  return new FormControl(value === null ? '' : formatQuantity(value, dim, { digits }), {
    nonNullable: true,
    validators: quantityValidator(rule),
    updateOn: 'blur',
  });
}
