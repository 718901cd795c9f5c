import { Validators, type ValidatorFn } from '@angular/forms';
import type { LibraryItem, LibraryKind } from '../../core/api-types';
import { quantityValidator, readQuantity, type QuantityRule } from '../../ui/quantity-validator';
import { formatQuantity, type Dimension } from '../../ui/units';

/**
 * The values a library item carries (shared/api.ts BufferValues and WallValues). People type them as engineers
 * write them ("0.89 mPa s", "-50 mV", "25 °C"); they are stored in SI, as the design document holds them.
 */
export interface LibraryField {
  key: string;
  label: string;
  dimension: Dimension;
  /** Unit a bare number is read in. */
  defaultUnit?: string;
  required: boolean;
  /** A value that must be exceeded (SI). */
  above?: number;
  hint?: string;
}

export const LIBRARY_FIELDS: Record<LibraryKind, LibraryField[]> = {
  buffer: [
    { key: 'relativePermittivity', label: 'Relative permittivity', dimension: 'dimensionless', required: true, above: 1, hint: 'e.g. 78.4 for water at 25 °C' },
    { key: 'viscosity', label: 'Viscosity', dimension: 'viscosity', defaultUnit: 'mPa*s', required: true, above: 0 },
    { key: 'density', label: 'Density', dimension: 'density', defaultUnit: 'kg/m^3', required: true, above: 0 },
    { key: 'conductivity', label: 'Conductivity', dimension: 'conductivity', defaultUnit: 'S/m', required: true, above: 0 },
    { key: 'ionicStrength', label: 'Ionic strength', dimension: 'concentration', defaultUnit: 'mM', required: true, above: 0 },
    { key: 'temperature', label: 'Temperature', dimension: 'temperature', defaultUnit: 'degC', required: true },
  ],
  wall: [
    { key: 'zeta', label: 'Zeta potential', dimension: 'potential', defaultUnit: 'mV', required: false, hint: 'typical' },
    { key: 'zetaMin', label: 'Zeta, lowest', dimension: 'potential', defaultUnit: 'mV', required: false },
    { key: 'zetaMax', label: 'Zeta, highest', dimension: 'potential', defaultUnit: 'mV', required: false },
    { key: 'mobility', label: 'EO mobility', dimension: 'mobility', required: false, hint: 'typical, e.g. 4.5e-8 m2/(V s)' },
    { key: 'mobilityMin', label: 'Mobility, lowest', dimension: 'mobility', required: false },
    { key: 'mobilityMax', label: 'Mobility, highest', dimension: 'mobility', required: false },
  ],
};

export const KIND_LABELS: Record<LibraryKind, string> = { buffer: 'Buffers', wall: 'Wall materials' };

function rule(field: LibraryField): QuantityRule {
  return { dimension: field.dimension, defaultUnit: field.defaultUnit, min: field.above, minExclusive: field.above !== undefined };
}

/** Validators of the field's text: required when the value must be given, then the shared quantity rule. */
export function fieldValidators(field: LibraryField): ValidatorFn[] {
  const quantity = quantityValidator(rule(field));
  const optional: ValidatorFn = (control) => (typeof control.value === 'string' && control.value.trim() === '' ? null : quantity(control));
  return field.required ? [Validators.required, optional] : [optional];
}

/** The SI value of typed text (after validation), or null for empty text. */
export function fieldValue(field: LibraryField, text: string): number | null {
  if (text.trim() === '') return null;
  const parsed = readQuantity(text, rule(field));
  return parsed.ok ? parsed.value : null;
}

export function valueOf(item: Pick<LibraryItem, 'values'>, key: string): unknown {
  return (item.values as Record<string, unknown>)[key];
}

function field(kind: LibraryKind, key: string): LibraryField {
  return LIBRARY_FIELDS[kind].find((f) => f.key === key)!;
}

/** The stored value as text for display and for editing; "" when absent. */
export function shownValue(kind: LibraryKind, item: Pick<LibraryItem, 'values'>, key: string): string {
  const v = valueOf(item, key);
  return typeof v === 'number' ? formatQuantity(v, field(kind, key).dimension) : '';
}

/** "−50 mV (−88 mV to −66 mV)": the typical value and the range, whichever are given. */
export function formatRange(kind: LibraryKind, item: LibraryItem, key: string): string {
  const typical = shownValue(kind, item, key);
  const lo = shownValue(kind, item, `${key}Min`);
  const hi = shownValue(kind, item, `${key}Max`);
  const range = lo && hi ? `${lo} to ${hi}` : lo ? `from ${lo}` : hi ? `up to ${hi}` : '';
  if (!typical && !range) return '—';
  if (!typical) return range;
  return range ? `${typical} (${range})` : typical;
}

/** Columns of the library tables: buffers show each value; walls show each quantity with its range. */
export interface LibraryColumn {
  id: string;
  label: string;
  numeric: boolean;
  format: (item: LibraryItem) => string;
}

export const LIBRARY_COLUMNS: Record<LibraryKind, LibraryColumn[]> = {
  buffer: LIBRARY_FIELDS.buffer.map((f) => ({
    id: f.key,
    label: f.label,
    numeric: true,
    format: (item: LibraryItem) => shownValue('buffer', item, f.key) || '—',
  })),
  wall: [
    { id: 'zeta', label: 'Zeta potential', numeric: true, format: (item) => formatRange('wall', item, 'zeta') },
    { id: 'mobility', label: 'Electroosmotic mobility', numeric: true, format: (item) => formatRange('wall', item, 'mobility') },
    {
      id: 'note',
      label: 'Note',
      numeric: false,
      format: (item) => {
        const note = valueOf(item, 'note');
        return typeof note === 'string' && note ? note : '—';
      },
    },
  ],
};
