/**
 * Cell-centred velocity from the staggered one: per component, the mean of the two faces of the cell
 * weighted by their open length (aperture h, plus the port length on a port face), so a closed face, where
 * the normal velocity is 0 by construction, does not pull the mean down.
 */
import type { CutCellGrid } from '../grid/cut-cell-grid';
import { fluidRuns } from '../grid/fluid-runs';
import type { PortFaces } from './port-faces';

export function cellVelocity(
  grid: CutCellGrid,
  ports: PortFaces,
  u: Float64Array,
  v: Float64Array,
): { x: Float64Array; y: Float64Array } {
  const { nx, ny, spacing: h } = grid;
  const openX = grid.apertureX.slice();
  const openY = grid.apertureY.slice();
  for (let f = 0; f < ports.count; f++) (ports.axis[f] === 0 ? openX : openY)[ports.node[f]] += ports.length[f] / h;
  const vx = new Float64Array(nx * ny);
  const vy = new Float64Array(nx * ny);
  const { runs, rowRuns } = fluidRuns(grid);
  for (let j = 0; j < ny; j++) {
    for (let k = rowRuns[j], last = rowRuns[j + 1]; k < last; k += 2) {
      for (let c = runs[k], end = runs[k + 1]; c < end; c++) {
        const w = c + j, e = w + 1;
        const sx = openX[w] + openX[e];
        if (sx > 0) vx[c] = (openX[w] * u[w] + openX[e] * u[e]) / sx;
        const s = c, n = c + nx;
        const sy = openY[s] + openY[n];
        if (sy > 0) vy[c] = (openY[s] * v[s] + openY[n] * v[n]) / sy;
      }
    }
  }
  return { x: vx, y: vy };
}
