import { Pipe, type PipeTransform } from '@angular/core';
import { formatQuantity, type Dimension } from './units';

/** `{{ 5e-5 | quantity: 'length' }}` → "50 µm": the shared unit formatter in templates. */
@Pipe({ name: 'quantity' })
export class QuantityPipe implements PipeTransform {
  transform(value: number | null | undefined, dimension: Dimension, digits?: number): string {
    if (value === null || value === undefined) return '–';
    return formatQuantity(value, dimension, { digits });
  }
}
