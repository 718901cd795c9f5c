/**
 * The Sweeps tab's form as plain values, and the request it makes: quantities are typed with units ("50 um",
 * "1.2 kV") and read by the app's one unit parser.
 */
import type { SweepOutput, SweepRange, SweepRequest } from '../../../../shared/api';
import { isLinearPointer, MAX_SWEEP_POINTS, type NumericField } from '../../../../shared/sweep';
import { formatQuantity, parseQuantity, type Dimension } from '../../ui/units';

export type RangeKind = SweepRange['kind'];

export interface ParameterForm {
  pointer: string;
  kind: RangeKind;
  from: string;
  to: string;
  steps: number | null;
  /** Values separated by commas or semicolons (list ranges). */
  list: string;
}

/** Unit assumed for a bare number, per dimension. */
const DEFAULT_UNITS: Partial<Record<Dimension, string>> = {
  length: 'um', potential: 'V', pressure: 'Pa', angle: 'deg', viscosity: 'mPa*s', density: 'kg/m^3', conductivity: 'S/m',
  concentration: 'mM', temperature: 'K',
};

export function dimensionOf(field: NumericField | undefined): Dimension {
  return (field?.dimension ?? 'dimensionless') as Dimension;
}

function read(text: string, dimension: Dimension, what: string): number {
  const r = parseQuantity(text, dimension, { defaultUnit: DEFAULT_UNITS[dimension] });
  if (!r.ok) throw new Error(`${what}: ${r.message}`);
  return r.value;
}

/** A sensible first range around a field's present value: zero to twice it, or half to one and a half times. */
export function defaultParameter(field: NumericField): ParameterForm {
  const dimension = dimensionOf(field);
  const v = field.value;
  const potentialLike = isLinearPointer(field.pointer);
  const [from, to] = v === 0 ? [0, potentialLike ? 100 : 1] : potentialLike ? [0, v * 2] : [v * 0.5, v * 1.5];
  const text = (x: number) => formatQuantity(x, dimension, { digits: 4 });
  return { pointer: field.pointer, kind: 'linear', from: text(from), to: text(to), steps: 11, list: '' };
}

export function rangeOf(form: ParameterForm, field: NumericField | undefined, name: string): SweepRange {
  const dimension = dimensionOf(field);
  if (form.kind === 'list') {
    const parts = form.list.split(/[;,]/).map((t) => t.trim()).filter((t) => t !== '');
    if (parts.length === 0) throw new Error(`${name}: list at least one value`);
    return { kind: 'list', values: parts.map((t, k) => read(t, dimension, `${name}, value ${k + 1}`)) };
  }
  const steps = form.steps ?? NaN;
  if (!(Number.isInteger(steps) && steps >= 2 && steps <= MAX_SWEEP_POINTS)) throw new Error(`${name}: steps must be a whole number from 2 to ${MAX_SWEEP_POINTS}`);
  const from = read(form.from, dimension, `${name}, from`);
  const to = read(form.to, dimension, `${name}, to`);
  if (form.kind === 'log' && !(from !== 0 && to !== 0 && Math.sign(from) === Math.sign(to))) {
    throw new Error(`${name}: logarithmic steps need from and to of one sign, neither zero`);
  }
  return { kind: form.kind, from, to, steps };
}

export function countOf(form: ParameterForm): number {
  return form.kind === 'list' ? form.list.split(/[;,]/).filter((t) => t.trim() !== '').length : (form.steps ?? 0);
}

export type Built = { ok: true; request: SweepRequest; points: number; superposed: boolean } | { ok: false; message: string; points: number };

/** The request, or the first thing wrong with the form in words. */
export function buildRequest(
  revisionId: number,
  parameters: ParameterForm[],
  outputs: SweepOutput[],
  cells: number | null,
  fields: NumericField[],
): Built {
  const points = parameters.reduce((n, p) => n * countOf(p), 1);
  try {
    if (parameters.length === 2 && parameters[0].pointer === parameters[1].pointer) throw new Error('Choose two different parameters');
    const ranges = parameters.map((p, k) => {
      const field = fields.find((f) => f.pointer === p.pointer);
      if (!field) throw new Error(`Parameter ${k + 1}: choose a field`);
      return { pointer: p.pointer, range: rangeOf(p, field, `Parameter ${k + 1}`) };
    });
    if (outputs.length === 0) throw new Error('Choose at least one output');
    if (points > MAX_SWEEP_POINTS) throw new Error(`${points} points; a sweep may have at most ${MAX_SWEEP_POINTS}`);
    if (!(cells !== null && Number.isInteger(cells) && cells >= 16 && cells <= 600)) throw new Error('Cells must be a whole number from 16 to 600');
    return { ok: true, request: { revisionId, parameters: ranges, outputs, cells }, points, superposed: ranges.every((r) => isLinearPointer(r.pointer)) };
  } catch (err) {
    return { ok: false, message: err instanceof Error ? err.message : String(err), points };
  }
}
