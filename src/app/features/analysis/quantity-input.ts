import { signal, type Signal } from '@angular/core';
import type { FormControl } from '@angular/forms';
import { quantityControl, quantityError, readQuantity, type QuantityRule } from '../../ui/quantity-validator';
import { formatQuantity } from '../../ui/units';

/**
 * A text field for a quantity typed with units (the shared parser), with its value as a signal: the SI value
 * when the text reads under the rule, else null. Commits on blur (Enter blurs in the templates).
 */
export class QuantityInput {
  readonly control: FormControl<string>;
  private readonly parsed = signal<number | null>(null);
  readonly value: Signal<number | null> = this.parsed.asReadonly();

  constructor(
    initial: number | null,
    readonly rule: QuantityRule,
    private readonly digits = 4,
  ) {
    this.control = quantityControl(initial, rule, digits);
    this.parsed.set(initial);
    this.control.valueChanges.subscribe((text) => {
      const r = readQuantity(text, rule);
      this.parsed.set(r.ok ? r.value : null);
    });
  }

  /** Shows a value (e.g. taken from the design) as if typed. */
  set(value: number): void {
    this.control.setValue(formatQuantity(value, this.rule.dimension, { digits: this.digits }));
  }

  get error(): string {
    return quantityError(this.control);
  }
}

/** Enter in a quantity field commits it (the controls update on blur). */
export function blurOnEnter(event: Event): void {
  (event.target as HTMLElement | null)?.blur();
}
