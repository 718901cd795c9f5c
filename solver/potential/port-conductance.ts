/**
 * Dirichlet conductance of a port segment (physics.md §2, §7: ports are Dirichlet boundaries).
 *
 * The current through a port piece of length L in cell c is, with σ d factored out,
 *   I_s / (σ d) = g_s (V_k − φ_c),   g_s = L / δ,
 * δ the distance from the cell's fluid centroid to the piece's line: the one-sided difference
 * (V_k − φ_c)/δ for the normal derivative, times the length. A full cell with a port on its face
 * has δ = h/2 and g = 2, the usual cell-centred Dirichlet conductance.
 *
 * A cut cell can have its centroid almost on the port (a thin sliver of fluid along the port): δ is
 * floored at MIN_PORT_DISTANCE·h so the conductance stays finite. Such a cell then sits at the port
 * potential to within δ_min/(δ_min + h) anyway, so the floor changes the solution by less than the
 * first-order error that a cut cell next to a Dirichlet boundary already carries.
 */
import { cutIndex, type CutCellGrid } from '../grid/cut-cell-grid';

/** Least centroid-to-port distance, in cells. */
export const MIN_PORT_DISTANCE = 0.1;

/** g_s = L / max(δ, δ_min) for every segment (0 for walls), dimensionless. */
export function portConductances(grid: CutCellGrid): Float64Array {
  const { segments, spacing: h } = grid;
  const g = new Float64Array(segments.count);
  const floor = MIN_PORT_DISTANCE * h;
  for (let s = 0; s < segments.count; s++) {
    if (segments.port[s] < 0) continue;
    const k = cutIndex(grid, segments.cell[s]);
    // Every cell that holds a segment is a cut cell with a stored fluid centroid (cut-cell-grid.ts).
    const cx = grid.cutCentroidX[k], cy = grid.cutCentroidY[k];
    const delta = Math.abs((cx - segments.midX[s]) * segments.normalX[s] + (cy - segments.midY[s]) * segments.normalY[s]);
    g[s] = segments.length[s] / Math.max(delta, floor);
  }
  return g;
}
