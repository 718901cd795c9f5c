import type { DesignDocument } from '../../shared/design';
import { drivesOf, type Drive } from '../../shared/drives';
import { solveDesign, type SolveOptions, type SolveResult } from '../solve';

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
