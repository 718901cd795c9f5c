/**
 * Streamfunction ψ of the depth-averaged flow, u = ∂ψ/∂y, v = −∂ψ/∂x (physics.md §3), in m²/s (times the
 * depth d it is a volume flow rate). On the grid's corners it is the running sum of the fluxes through the
 * vertical faces, up each column from the solid margin:
 *
 *   ψ(i, j+1) = ψ(i, j) + (a h + ℓ_port) u(i, j),
 *
 * and since every cell's net flux vanishes (divergence.ts), walking along a row instead gives the same values
 * up to the solver's continuity residual: ψ is single-valued, also around pillars (multiply connected
 * fluid), and constant along every wall (a closed face carries no flux); each wall gets its own constant,
 * the flow rate between it and the grid's lower edge. Cells get the mean of their four corners; the cell values
 * are summed over the runs of fluid cells only (a face outside them carries no flux).
 */
import type { CutCellGrid } from '../grid/cut-cell-grid';
import { fluidRuns } from '../grid/fluid-runs';
import type { PortFaces } from './port-faces';

export function streamfunction(grid: CutCellGrid, ports: PortFaces, u: Float64Array): Float64Array {
  const { nx, ny, spacing: h, apertureX: ax } = grid;
  const { runs, rowRuns } = fluidRuns(grid);
  const portOpen = new Map<number, number>();
  for (let f = 0; f < ports.count; f++) if (ports.axis[f] === 0) portOpen.set(ports.node[f], (portOpen.get(ports.node[f]) ?? 0) + ports.length[f]);
  // ψ on the corners of the current row's lower line, per column: the running sum up the column. Only the faces
  // of fluid cells carry flux (open faces and port faces), so only those change it.
  const column = new Float64Array(nx + 1);
  const flux = new Float64Array(nx + 1);
  const psi = new Float64Array(nx * ny);
  for (let j = 0; j < ny; j++) {
    const row = j * nx, faces = j * (nx + 1);
    for (let k = rowRuns[j], last = rowRuns[j + 1]; k < last; k += 2) {
      const i0 = runs[k] - row, i1 = runs[k + 1] - row;
      for (let i = i0; i <= i1; i++) {
        const f = i + faces;
        const open = ax[f] * h + (portOpen.size > 0 ? portOpen.get(f) ?? 0 : 0);
        flux[i] = open * u[f];
      }
      for (let i = i0; i < i1; i++) {
        psi[row + i] = 0.25 * (column[i] + column[i + 1] + (column[i] + flux[i]) + (column[i + 1] + flux[i + 1]));
      }
      for (let i = i0; i <= i1; i++) column[i] += flux[i];
    }
  }
  return psi;
}

/** ψ on the grid's corners, index i + j (nx + 1), (nx + 1)(ny + 1) values. */
export function streamfunctionCorners(grid: CutCellGrid, ports: PortFaces, u: Float64Array): Float64Array {
  const { nx, ny, spacing: h, apertureX: ax } = grid;
  const sx = nx + 1;
  const open = new Float64Array(ax.length);
  for (let f = 0; f < ax.length; f++) open[f] = ax[f] * h;
  for (let f = 0; f < ports.count; f++) if (ports.axis[f] === 0) open[ports.node[f]] += ports.length[f];
  const corner = new Float64Array((nx + 1) * (ny + 1));
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i <= nx; i++) corner[i + (j + 1) * sx] = corner[i + j * sx] + open[i + j * sx] * u[i + j * sx];
  }
  return corner;
}
