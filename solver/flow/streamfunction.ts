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
 * the flow rate between it and the grid's lower edge. Cells get the mean of their four corners.
 */
import type { CutCellGrid } from '../grid/cut-cell-grid';
import type { PortFaces } from './port-faces';

export function streamfunction(grid: CutCellGrid, ports: PortFaces, u: Float64Array): Float64Array {
  const { nx, ny } = grid;
  const sx = nx + 1;
  const corner = streamfunctionCorners(grid, ports, u);
  const psi = new Float64Array(nx * ny);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const c = i + j * nx;
      if (!(grid.fraction[c] > 0)) continue;
      psi[c] = 0.25 * (corner[i + j * sx] + corner[i + 1 + j * sx] + corner[i + (j + 1) * sx] + corner[i + 1 + (j + 1) * sx]);
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
