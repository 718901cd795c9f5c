import type { DesignDocument } from '../../shared/design';
import { boundedLeastSquares } from './least-squares';
import { superposePorts } from './superpose';
import { withSettings, type Drive } from '../../shared/drives';
import type { UnitResponses } from './unit-responses';

/**
 * What the engineer asks for. Flow rates and currents are positive INTO the fluid through the port
 * (physics.md §3); a speed is the mean speed through the port, positive inwards.
 */
export type Target =
  | { kind: 'flow'; port: string; value: number; weight?: number }
  | { kind: 'speed'; port: string; value: number; weight?: number }
  | { kind: 'current'; port: string; value: number; weight?: number }
  | { kind: 'ratio'; port: string; of: string; value: number; weight?: number };

export interface PlanRequest {
  targets: Target[];
  /** Drives held at a value and not planned, e.g. a port held at ground: { port, kind: 'potential', value: 0 }. */
  hold?: Array<Drive & { value: number }>;
  /** Bounds per drive (default ±Infinity); volts or pascals. */
  bounds?: Array<Drive & { min?: number; max?: number }>;
}

export interface PlanResult {
  /** Strength of every drive, in the order of responses.drives. */
  settings: number[];
  /** For each target: what it asked, what the plan gives, and the difference, in the target's units. */
  targets: Array<{ target: Target; wanted: number; achieved: number; residual: number }>;
  ports: ReturnType<typeof superposePorts>;
  /** The design with the planned potentials and pressures written in. */
  design: DesignDocument;
}

/**
 * Reservoir settings that meet the targets best in the least-squares sense (each target row scaled to unit size,
 * then by its weight), within the bounds, with held drives fixed. Linear because the fields are linear in the drives.
 */
export function planSettings(responses: UnitResponses, request: PlanRequest): PlanResult {
  const { design, drives, results } = responses;
  const portIndex = (id: string) => {
    const j = design.ports.findIndex((p) => p.id === id);
    if (j < 0) throw new PlanError(`no port "${id}" in the design`);
    return j;
  };
  const driveIndex = (d: Drive) => drives.findIndex((e) => e.port === d.port && e.kind === d.kind);
  const depth = design.depth;
  const portWidth = (j: number) => {
    const p = design.ports[j];
    return Math.hypot(p.to[0] - p.from[0], p.to[1] - p.from[1]);
  };
  // Row of unit responses for each target: value = Σ_k row_k s_k.
  const rowOf = (t: Target): number[] => {
    const j = portIndex(t.port);
    switch (t.kind) {
      case 'flow':
        return results.map((r) => r.ports[j].flowRate);
      case 'current':
        return results.map((r) => r.ports[j].current);
      case 'speed':
        return results.map((r) => r.ports[j].flowRate / (portWidth(j) * depth));
      case 'ratio': {
        const m = portIndex(t.of);
        return results.map((r) => r.ports[j].flowRate - t.value * r.ports[m].flowRate);
      }
    }
  };
  const wantedOf = (t: Target) => (t.kind === 'ratio' ? 0 : t.value);
  if (!request.targets.length) throw new PlanError('give at least one target');
  for (const t of request.targets) if (!Number.isFinite(t.value)) throw new PlanError(`target for port "${t.port}" needs a finite value`);

  const held = new Map<number, number>();
  for (const h of request.hold ?? []) {
    const k = driveIndex(h);
    if (k < 0) throw new PlanError(`port "${h.port}" has no ${h.kind} drive to hold`);
    held.set(k, h.value);
  }
  const free = drives.map((_, k) => k).filter((k) => !held.has(k));
  if (!free.length) throw new PlanError('every drive is held; leave at least one port free to plan');
  const lo = free.map(() => -Infinity);
  const hi = free.map(() => Infinity);
  for (const b of request.bounds ?? []) {
    const k = free.indexOf(driveIndex(b));
    if (k < 0) continue;
    if (b.min !== undefined) lo[k] = b.min;
    if (b.max !== undefined) hi[k] = b.max;
    if (lo[k] > hi[k]) throw new PlanError(`bounds of port "${b.port}" are empty (min above max)`);
  }

  const A: number[][] = [];
  const rhs: number[] = [];
  for (const t of request.targets) {
    const row = rowOf(t);
    let wanted = wantedOf(t);
    for (const [k, v] of held) wanted -= row[k] * v;
    const freeRow = free.map((k) => row[k]);
    const scale = Math.hypot(...freeRow) || 1;
    const w = (t.weight ?? 1) / scale;
    A.push(freeRow.map((a) => a * w));
    rhs.push(wanted * w);
  }
  const x = boundedLeastSquares(A, rhs, lo, hi);
  const settings = drives.map((_, k) => held.get(k) ?? 0);
  free.forEach((k, m) => (settings[k] = x[m]));

  const targets = request.targets.map((t) => {
    const row = rowOf(t);
    const achieved = row.reduce((s, a, k) => s + a * settings[k], 0);
    const wanted = wantedOf(t);
    return { target: t, wanted, achieved, residual: achieved - wanted };
  });
  return { settings, targets, ports: superposePorts(responses, settings), design: withSettings(design, drives, settings) };
}

export class PlanError extends Error {
  readonly code = 'invalid-plan';
}
