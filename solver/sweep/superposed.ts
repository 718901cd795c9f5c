/**
 * A sweep over port potentials and pressures answered from unit responses (physics.md §7: the fields are linear
 * in those drives), so N points cost one solve per drive instead of N solves. Port currents, flow rates and
 * potentials superpose exactly; the maxima and the Joule power are taken from the superposed fields and ports, as
 * a direct solve takes them from its own. Warnings: those that do not depend on the drive strengths come from the
 * unit solves; the high-voltage, Joule-heating and Reynolds checks are evaluated again for every point.
 */
import type { SweepPointResult } from '../../shared/api';
import type { DesignDocument } from '../../shared/design';
import { isLinearPointer } from '../../shared/sweep';
import { discretiseDesign } from '../grid/discretise';
import { validityWarnings } from '../physics/validity';
import { drivesOf, settingsOf, superposeField, superposePorts, unitResponses, type UnitResponses } from '../planner';
import { electrodePower, maxPowerPerLength } from '../potential/joule';
import type { SolveOptions } from '../solve';
import { maxAbs, pointDocument } from './point';

/** Checks whose outcome depends on the drive strengths; every point evaluates them itself. */
const VALUE_CHECKS = new Set(['high-voltage', 'joule-heating', 'creeping-flow']);

export function superposable(pointers: ReadonlyArray<string>): boolean {
  return pointers.length > 0 && pointers.every(isLinearPointer);
}

export interface SuperposedSweep {
  results: SweepPointResult[];
  /** Direct solves it took (one per drive). */
  solves: number;
}

export function superposedSweep(
  design: DesignDocument,
  pointers: ReadonlyArray<string>,
  points: ReadonlyArray<ReadonlyArray<number>>,
  options: Pick<SolveOptions, 'cells' | 'tolerance' | 'shouldStop'> = {},
): SuperposedSweep {
  if (!superposable(pointers)) throw new Error('only port potentials and pressures superpose');
  const withPressures = pointers.some((p) => p.endsWith('/pressure'));
  const responses = unitResponses(design, { ...options, drives: drivesOf(design, withPressures) });
  const evaluate = pointEvaluator(design, responses, options.cells);
  return { results: points.map((values) => evaluate(settingsOf(pointDocument(design, pointers, values), responses.drives))), solves: responses.drives.length };
}

function pointEvaluator(design: DesignDocument, responses: UnitResponses, cells: number | undefined): (s: number[]) => SweepPointResult {
  const first = responses.results[0];
  const { fraction } = first.fields;
  const n = fraction.length;
  const buffers = { potential: new Float32Array(n), fieldX: new Float32Array(n), fieldY: new Float32Array(n), velocityX: new Float32Array(n), velocityY: new Float32Array(n), vorticity: new Float32Array(n) };
  const kept = new Map<string, { code: string; message: string }>();
  for (const r of responses.results) for (const w of r.warnings) if (!VALUE_CHECKS.has(w.code) && !kept.has(w.message)) kept.set(w.message, { code: w.code, message: w.message });
  // Re = ρ U D_h / μ is proportional to the largest speed; the ratio is the same for every unit solve.
  const withSpeed = responses.results.find((r) => r.metrics.maxSpeed > 0);
  const reynoldsPerSpeed = withSpeed ? withSpeed.metrics.reynolds / withSpeed.metrics.maxSpeed : 0;
  const disc = discretiseDesign(design, { cells });
  const grid = disc.grid!;
  const active = new Uint8Array(n);
  const potential = new Float64Array(n);
  const field = { x: new Float64Array(n), y: new Float64Array(n) };
  const { conductivity } = design.buffer;

  return (s) => {
    for (const name of Object.keys(buffers) as (keyof typeof buffers)[]) superposeField(responses, name, s, buffers[name]);
    const ports = superposePorts(responses, s);
    let maxField = 0, maxSpeed = 0;
    for (let c = 0; c < n; c++) {
      const on = fraction[c] > 0 && buffers.potential[c] === buffers.potential[c];
      active[c] = on ? 1 : 0;
      potential[c] = on ? buffers.potential[c] : NaN;
      field.x[c] = on ? buffers.fieldX[c] : 0;
      field.y[c] = on ? buffers.fieldY[c] : 0;
      if (!(fraction[c] > 0)) continue;
      const e = Math.hypot(buffers.fieldX[c], buffers.fieldY[c]);
      if (e > maxField) maxField = e;
      const u = Math.hypot(buffers.velocityX[c], buffers.velocityY[c]);
      if (u > maxSpeed) maxSpeed = u;
    }
    const voltages = ports.filter((p) => p.potential !== null).map((p) => Math.abs(p.potential!));
    const checks = validityWarnings({
      debyeLength: 0,
      narrowestWidth: 1,
      depth: 1,
      reynolds: reynoldsPerSpeed * maxSpeed,
      powerPerLength: maxPowerPerLength(grid, active, potential, field, conductivity, design.depth),
      maxPortVoltage: voltages.length ? Math.max(...voltages) : 0,
      cellsAcrossNarrowest: Infinity,
    }).filter((w) => VALUE_CHECKS.has(w.code));
    return {
      ports,
      metrics: {
        joulePower: electrodePower(ports.map((p) => p.potential), ports.map((p) => p.current)),
        maxField,
        maxVorticity: maxAbs(buffers.vorticity, fraction),
        maxSpeed,
      },
      warnings: [...kept.values(), ...checks.map((w) => ({ code: w.code, message: w.message }))],
      grid: { nx: first.grid.nx, ny: first.grid.ny, spacing: first.grid.spacing },
    };
  };
}
