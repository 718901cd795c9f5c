import type { PortResult, SolveFields } from '../../shared/result';
import { planSettings, superposeField, superposePorts, type Drive, type PlanRequest, type PlanResult, type UnitResponses } from '../../solver/planner';
import type { SolveFailure } from './solver-api';

const { sqrt } = Math;

export type PlannerMap = 'speed' | 'potential' | 'vorticity';

/**
 * The Planner's basis as the page holds it. The unit responses themselves stay in the solver worker (one
 * response per electrode, every field): the page asks the worker to recombine a map or to plan.
 */
export interface PlannerBasis {
  /** Names this basis in later calls; a worker that has since restarted no longer knows it. */
  id: number;
  drives: Drive[];
  /** One unit response's fields: the grid and the fluid the maps are drawn on. */
  fields: SolveFields;
  grid: { nx: number; ny: number };
}

export type PlannerOutcome<T> = ({ ok: true } & T) | { ok: false; error: SolveFailure };
export type RecombineOutcome = PlannerOutcome<{ values: Float32Array; ports: PortResult[]; workerMs: number }>;
export type PlanOutcome = PlannerOutcome<{ plan: PlanResult }>;

const STALE: SolveFailure = { code: 'stale-basis', message: 'The unit responses are no longer in the worker: they are computed again.' };

/**
 * A map for drive strengths s from the unit responses, written into `out`: the slider's step. Speed is
 * recombined from both velocity components in one pass per drive, then |u| in place.
 */
export function recombine(responses: UnitResponses, map: PlannerMap, s: ArrayLike<number>, out: Float32Array, scratch: Float32Array): Float32Array {
  if (map !== 'speed') return superposeField(responses, map, s, out);
  const results = responses.results;
  const n = out.length;
  out.fill(0);
  scratch.fill(0);
  for (let k = 0; k < results.length; k++) {
    const w = s[k];
    if (w === 0) continue;
    const vx = results[k].fields.velocityX, vy = results[k].fields.velocityY;
    for (let c = 0; c < n; c++) {
      out[c] += w * vx[c];
      scratch[c] += w * vy[c];
    }
  }
  const first = results[0].fields.velocityX;
  for (let c = 0; c < n; c++) out[c] = first[c] !== first[c] ? NaN : sqrt(out[c] * out[c] + scratch[c] * scratch[c]);
  return out;
}

function copyFields(f: SolveFields): SolveFields {
  const copy = { ...f };
  for (const [name, value] of Object.entries(f)) if (value instanceof Float32Array) (copy as unknown as Record<string, Float32Array>)[name] = value.slice();
  return copy;
}

/** The solver worker's one Planner basis: kept when the unit responses are computed, used by sliders and plans. */
export class PlannerStore {
  private kept: { id: number; responses: UnitResponses } | null = null;
  private scratch = new Float32Array(0);
  private nextId = 1;

  /** Keeps the responses (replacing any earlier basis) and returns what the page needs of them. */
  keep(responses: UnitResponses): PlannerBasis {
    const id = this.nextId++;
    this.kept = { id, responses };
    const first = responses.results[0];
    return { id, drives: responses.drives, fields: copyFields(first.fields), grid: { nx: first.grid.nx, ny: first.grid.ny } };
  }

  /** The map and the port table for drive strengths s; a new array each call (it is transferred to the page). */
  recombine(id: number, map: PlannerMap, s: number[]): RecombineOutcome {
    const r = this.basis(id);
    if (!r) return { ok: false, error: { ...STALE } };
    const started = performance.now();
    const n = r.results[0].fields.potential.length;
    if (this.scratch.length !== n) this.scratch = new Float32Array(n);
    const values = recombine(r, map, s, new Float32Array(n), this.scratch);
    return { ok: true, values, ports: superposePorts(r, s), workerMs: performance.now() - started };
  }

  /** Potentials for the targets by bounded least squares (solver/planner). */
  plan(id: number, request: PlanRequest): PlanOutcome {
    const r = this.basis(id);
    if (!r) return { ok: false, error: { ...STALE } };
    try {
      return { ok: true, plan: planSettings(r, request) };
    } catch (error) {
      return { ok: false, error: { code: 'plan-failed', message: error instanceof Error ? error.message : String(error) } };
    }
  }

  /** Drops the basis if it is this one (its fields can be tens of megabytes). */
  release(id: number): void {
    if (this.kept?.id === id) this.kept = null;
  }

  private basis(id: number): UnitResponses | null {
    return this.kept?.id === id ? this.kept.responses : null;
  }
}
