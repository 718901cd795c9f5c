/**
 * The Planner tab's pure pieces: targets as the engineer states them (flow or speed through a port and its
 * direction, zero flow in a leg, a pinch ratio, a current), ports planned, held or floating, bounds, the plan
 * request for solver/planner (run in the solver worker).
 */
import type { DesignDocument } from '../../../../shared/design';
import type { Drive, PlanRequest, Target } from '../../core/solver-client';
import type { Dimension } from '../../ui/units';

export type TargetKind = 'flow' | 'speed' | 'zero' | 'ratio' | 'current';

export interface TargetRow {
  kind: TargetKind;
  port: string;
  /** Size of the flow rate, speed or current (SI, ≥ 0), or the ratio; unused for zero flow. */
  value: number | null;
  /** For flow, speed and current: into the chip through the port, or out of it. */
  direction: 'in' | 'out';
  /** For a ratio: Q_port = value × Q_of. */
  of: string | null;
}

export const TARGET_KINDS: ReadonlyArray<{ kind: TargetKind; label: string; dimension: Dimension | null }> = [
  { kind: 'speed', label: 'Mean speed', dimension: 'velocity' },
  { kind: 'flow', label: 'Flow rate', dimension: 'flowRate' },
  { kind: 'zero', label: 'No flow', dimension: null },
  { kind: 'ratio', label: 'Pinch ratio', dimension: 'dimensionless' },
  { kind: 'current', label: 'Current', dimension: 'current' },
];

export type PortMode = 'plan' | 'hold' | 'float';

export interface PortPlan {
  id: string;
  mode: PortMode;
  /** Held potential (V); 0 is ground. */
  hold: number;
  /** Bounds on a planned potential (V); null for none. */
  min: number | null;
  max: number | null;
}

/** Ports as the design has them: at 0 V held at ground, without an electrode floating, the others planned. */
export function defaultPortPlans(doc: DesignDocument): PortPlan[] {
  return doc.ports.map((p) => ({ id: p.id, mode: p.potential === null ? 'float' : p.potential === 0 ? 'hold' : 'plan', hold: 0, min: null, max: null }));
}

/** A first target: 1 mm/s out through the grounded port farthest along the layout, else the last port. */
export function defaultTargets(doc: DesignDocument): TargetRow[] {
  const grounded = doc.ports.filter((p) => p.potential === 0);
  const port = (grounded.length ? grounded[grounded.length - 1] : doc.ports[doc.ports.length - 1])?.id;
  return port ? [{ kind: 'speed', port, value: 1e-3, direction: 'out', of: null }] : [];
}

/** The design the unit responses are computed for: floating ports without an electrode, every other port with one. */
export function plannedDesign(doc: DesignDocument, ports: ReadonlyArray<PortPlan>): DesignDocument {
  const mode = new Map(ports.map((p) => [p.id, p.mode]));
  return {
    ...doc,
    ports: doc.ports.map((p) => {
      const m = mode.get(p.id) ?? 'plan';
      if (m === 'float') return { ...p, potential: null };
      return { ...p, potential: p.potential ?? 0 };
    }),
  };
}

/**
 * What the unit responses depend on: everything but the potentials' values and the heads (unit responses set
 * both), so editing a voltage or a head keeps them, while the layout, the buffer or a floating port does not.
 */
export function responsesKey(design: DesignDocument): string {
  const { name: _name, ...rest } = design;
  return JSON.stringify({ ...rest, ports: design.ports.map((p) => ({ ...p, name: undefined, potential: p.potential === null ? null : 0, pressure: (p.pressure ?? 0) !== 0 })) });
}

export function toTargets(rows: ReadonlyArray<TargetRow>): Target[] {
  return rows.map((r): Target => {
    const sign = r.direction === 'in' ? 1 : -1;
    switch (r.kind) {
      case 'zero':
        return { kind: 'flow', port: r.port, value: 0 };
      case 'ratio':
        return { kind: 'ratio', port: r.port, of: r.of ?? r.port, value: r.value ?? 0 };
      default:
        return { kind: r.kind, port: r.port, value: sign * (r.value ?? 0) };
    }
  });
}

/** Why a row cannot be planned yet, or null. */
export function rowProblem(row: TargetRow): string | null {
  if (row.kind === 'zero') return null;
  if (row.value === null || !Number.isFinite(row.value)) return 'enter a value';
  if (row.kind === 'ratio' && (!row.of || row.of === row.port)) return 'pick the other port of the ratio';
  return null;
}

export function planRequest(rows: ReadonlyArray<TargetRow>, ports: ReadonlyArray<PortPlan>, design: DesignDocument, drives: ReadonlyArray<Drive>): PlanRequest {
  const hold: PlanRequest['hold'] = [];
  for (const p of ports) if (p.mode === 'hold') hold.push({ port: p.id, kind: 'potential', value: p.hold });
  // Heads stay as the design has them.
  for (const d of drives) {
    if (d.kind !== 'pressure') continue;
    hold.push({ port: d.port, kind: 'pressure', value: design.ports.find((p) => p.id === d.port)?.pressure ?? 0 });
  }
  const bounds = ports
    .filter((p) => p.mode === 'plan' && (p.min !== null || p.max !== null))
    .map((p) => ({ port: p.id, kind: 'potential' as const, min: p.min ?? undefined, max: p.max ?? undefined }));
  return { targets: toTargets(rows), hold, bounds };
}

/** Slider range for a planned potential: its bounds when set, else symmetric and wide enough for the setting. */
export function sliderRange(setting: number, plan: PortPlan): { min: number; max: number; step: number } {
  // The smallest round span (1, 2 or 5 × 10^k, at least 100 V) that holds 1.5 times the setting.
  const need = Math.max(100, 1.5 * Math.abs(setting));
  const decade = 10 ** Math.floor(Math.log10(need));
  const span = [1, 2, 5, 10].map((m) => m * decade).find((v) => v >= need) ?? 10 * decade;
  const min = plan.min ?? -span, max = plan.max ?? span;
  return { min, max, step: Math.max((max - min) / 1000, 1e-3) };
}
