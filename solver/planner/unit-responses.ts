import type { DesignDocument } from '../../shared/design';
import { solveDesign, type SolveOptions, type SolveResult } from '../solve';

/** One independent drive of the chip: a port's electrode potential or its pressure. */
export interface Drive {
  port: string;
  kind: 'potential' | 'pressure';
}

/**
 * The chip's response to each drive alone at unit strength (1 V or 1 Pa, every other drive at 0). Because the
 * potential and flow equations are linear in the port potentials and pressures (physics.md §7), any setting is
 * the sum Σ s_k · response_k: the basis of the voltage planner, instant sliders and linear sweeps.
 */
export interface UnitResponses {
  design: DesignDocument;
  drives: Drive[];
  results: SolveResult[];
}

/** Drives of a design: every port with an electrode (potential not null), plus every port's pressure when asked. */
export function drivesOf(design: DesignDocument, withPressures: boolean): Drive[] {
  const drives: Drive[] = design.ports.filter((p) => p.potential !== null).map((p) => ({ port: p.id, kind: 'potential' as const }));
  if (withPressures) for (const p of design.ports) drives.push({ port: p.id, kind: 'pressure' });
  return drives;
}

/** The design with one drive at 1 (V or Pa) and every other at 0; floating ports stay floating. */
export function unitDesign(design: DesignDocument, drive: Drive): DesignDocument {
  return {
    ...design,
    ports: design.ports.map((p) => ({
      ...p,
      potential: p.potential === null ? null : drive.kind === 'potential' && p.id === drive.port ? 1 : 0,
      pressure: drive.kind === 'pressure' && p.id === drive.port ? 1 : 0,
    })),
  };
}

export function unitResponses(
  design: DesignDocument,
  options: SolveOptions & { withPressures?: boolean; drives?: Drive[] } = {},
): UnitResponses {
  const drives = options.drives ?? drivesOf(design, options.withPressures ?? false);
  const results = drives.map((d, k) =>
    solveDesign(unitDesign(design, d), {
      ...options,
      onProgress: options.onProgress && ((p) => options.onProgress!({ ...p, fraction: (k + p.fraction) / drives.length })),
    }),
  );
  return { design, drives, results };
}

/** The strength of each drive in a design as it stands (its port potential or pressure). */
export function settingsOf(design: DesignDocument, drives: Drive[]): number[] {
  return drives.map((d) => {
    const port = design.ports.find((p) => p.id === d.port);
    if (!port) return 0;
    return d.kind === 'potential' ? (port.potential ?? 0) : (port.pressure ?? 0);
  });
}
