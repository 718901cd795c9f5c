import type { PortResult, SolveFields } from '../result/types';
import type { UnitResponses } from './unit-responses';

export const LINEAR_FIELDS = ['potential', 'fieldX', 'fieldY', 'velocityX', 'velocityY', 'pressure', 'vorticity', 'streamfunction'] as const;
export type LinearField = (typeof LINEAR_FIELDS)[number];

/** Port potentials, currents and flow rates for drive strengths s (Σ s_k · unit response k). */
export function superposePorts(responses: UnitResponses, s: ArrayLike<number>): PortResult[] {
  const ports = responses.results[0]?.ports ?? [];
  return ports.map((p0, j) => {
    let potential = 0;
    let current = 0;
    let flowRate = 0;
    let fixed = true;
    responses.results.forEach((r, k) => {
      const p = r.ports[j];
      if (p.potential === null) fixed = false;
      potential += s[k] * (p.potential ?? 0);
      current += s[k] * p.current;
      flowRate += s[k] * p.flowRate;
    });
    return { id: p0.id, potential: fixed ? potential : null, current, flowRate };
  });
}

/**
 * One field for drive strengths s, written into `out` (allocated when absent). This is the slider's inner loop:
 * one multiply-add per cell and drive, no solve.
 */
export function superposeField(responses: UnitResponses, name: LinearField, s: ArrayLike<number>, out?: Float32Array): Float32Array {
  const first = responses.results[0].fields[name];
  const n = first.length;
  const result = out ?? new Float32Array(n);
  result.fill(0);
  for (let k = 0; k < responses.results.length; k++) {
    const f = responses.results[k].fields[name];
    const w = s[k];
    if (w === 0) continue;
    for (let c = 0; c < n; c++) result[c] += w * f[c];
  }
  // Cells outside the fluid stay NaN, as in a direct solve.
  for (let c = 0; c < n; c++) if (first[c] !== first[c]) result[c] = NaN;
  return result;
}

/** Every linear field at once (the fraction and grid geometry are those of the unit solves). */
export function superposeFields(responses: UnitResponses, s: ArrayLike<number>): SolveFields {
  const f0 = responses.results[0].fields;
  const fields = { ...f0 };
  for (const name of LINEAR_FIELDS) fields[name] = superposeField(responses, name, s);
  return fields;
}
