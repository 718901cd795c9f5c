/**
 * The warnings that come with a result: geometry warnings from the discretisation, pieces of
 * fluid without an electrode, the validity checks of physics.md §6, and the solvers' own notes.
 */
import type { DesignDocument, DesignProblem } from '../../shared/design';
import { formatPoint } from '../geometry/format';
import { cellCentre, type CutCellGrid } from '../grid/cut-cell-grid';
import type { ElectrodePieces } from '../potential/electrode-pieces';
import { validityWarnings, type ValidityInput } from '../physics/validity';
import type { SolveWarning } from './types';

export function geometryWarnings(problems: ReadonlyArray<DesignProblem>): SolveWarning[] {
  return problems
    .filter((p) => p.severity === 'warning')
    .map((p) => (p.at ? { code: p.code, message: p.message, at: p.at } : { code: p.code, message: p.message }));
}

export function electrodeWarnings(design: DesignDocument, grid: CutCellGrid, pieces: ElectrodePieces): SolveWarning[] {
  if (pieces.floatingPieces === 0) return [];
  if (design.ports.every((p) => p.potential === null)) {
    return [{
      code: 'no-electrode',
      message: 'No port has an electrode (every potential is null): no current flows and there is no electroosmosis; only pressure drives the flow.',
    }];
  }
  return pieces.floatingSeeds.slice(0, 5).map((seed) => {
    const at = cellCentre(grid, seed);
    return {
      code: 'no-electrode',
      message:
        `The piece of fluid near ${formatPoint(at)} has only floating ports: no current flows through it, ` +
        'its potential is undefined and its electric field is zero.',
      at,
    };
  });
}

/** Validity checks; the resolution check is left out when the geometry already warned about it. */
export function physicsWarnings(input: ValidityInput, problems: ReadonlyArray<DesignProblem>): SolveWarning[] {
  const underResolved = problems.some((p) => p.code === 'under-resolved');
  return validityWarnings(input)
    .filter((w) => !(underResolved && w.code === 'resolution'))
    .map((w) => ({ code: w.code, message: w.message }));
}

export function convergenceWarning(what: string, residual: number, tolerance: number): SolveWarning[] {
  if (residual <= tolerance) return [];
  return [{
    code: 'not-converged',
    message: `The ${what} solve stopped at a relative residual of ${residual.toExponential(1)} (asked for ${tolerance.toExponential(0)}); its numbers are less accurate than usual.`,
  }];
}
