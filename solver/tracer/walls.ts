import type { CutCellGrid } from '../grid/cut-cell-grid';

// Math's functions as module locals: hot loops then avoid a global lookup per call (slow in some hosts).
const { floor, abs, max } = Math;

/**
 * Moves a particle along a straight step, reflecting it specularly at walls and absorbing it at ports, using the
 * grid's boundary segments (the same outline the solvers use). Steps are shorter than half a cell, so only the
 * segments of the cells around the start can be crossed.
 */
export interface WallStepper {
  /** Moves p = [x, y] by (dx, dy) in place; returns −1 when the particle stays in the fluid, else the port index it left by. */
  step(p: Float64Array, dx: number, dy: number): number;
}

export function createWallStepper(grid: CutCellGrid): WallStepper {
  const { nx, ny, spacing: h, x0, y0, segments: seg, fraction } = grid;
  // Compressed row offsets: the segments of cell c are start[c] .. start[c+1) (segments are sorted by cell).
  const start = new Int32Array(nx * ny + 1);
  for (let s = 0; s < seg.count; s++) start[seg.cell[s] + 1]++;
  for (let c = 0; c < nx * ny; c++) start[c + 1] += start[c];
  const hasSegments = (i: number, j: number) => i >= 0 && j >= 0 && i < nx && j < ny && start[i + j * nx + 1] > start[i + j * nx];

  const cross = (ax: number, ay: number, bx: number, by: number) => {
    // First segment crossed from inside to outside on the path a → b: returns [s, t] or null.
    const i0 = floor((ax - x0) / h);
    const j0 = floor((ay - y0) / h);
    let best = -1;
    let bestT = 2; // beyond the step (t ≤ 1)
    const dx = bx - ax;
    const dy = by - ay;
    for (let j = j0 - 1; j <= j0 + 1; j++) {
      if (j < 0 || j >= ny) continue;
      for (let i = i0 - 1; i <= i0 + 1; i++) {
        if (i < 0 || i >= nx) continue;
        const c = i + j * nx;
        for (let s = start[c]; s < start[c + 1]; s++) {
          const nxs = seg.normalX[s];
          const nys = seg.normalY[s];
          const along = dx * nxs + dy * nys;
          if (along <= 0) continue; // moving inwards or parallel
          const half = seg.length[s] / 2;
          const px = seg.midX[s];
          const py = seg.midY[s];
          // Distance of a from the segment's line, measured outwards (negative inside).
          const da = (ax - px) * nxs + (ay - py) * nys;
          const t = -da / along;
          if (t < -1e-12 || t > 1 || t >= bestT) continue;
          const cx = ax + t * dx - px;
          const cy = ay + t * dy - py;
          const u = -cx * nys + cy * nxs; // coordinate along the segment
          if (abs(u) > half * (1 + 1e-9) + 1e-12 * h) continue;
          best = s;
          bestT = max(t, 0);
        }
      }
    }
    return best < 0 ? null : ([best, bestT] as const);
  };

  return {
    step(p, dx, dy) {
      let ax = p[0];
      let ay = p[1];
      let bx = ax + dx;
      let by = ay + dy;
      const ia = floor((ax - x0) / h);
      const ja = floor((ay - y0) / h);
      const ib = floor((bx - x0) / h);
      const jb = floor((by - y0) / h);
      const nearWall = hasSegments(ia, ja) || hasSegments(ib, jb) || hasSegments(ia, jb) || hasSegments(ib, ja);
      if (nearWall) {
        for (let bounce = 0; bounce < 4; bounce++) {
          const hit = cross(ax, ay, bx, by);
          if (!hit) break;
          const [s, t] = hit;
          if (seg.port[s] >= 0) {
            p[0] = ax + t * (bx - ax);
            p[1] = ay + t * (by - ay);
            return seg.port[s];
          }
          // Specular reflection of the rest of the step about the wall's line.
          const nxs = seg.normalX[s];
          const nys = seg.normalY[s];
          const out = (bx - seg.midX[s]) * nxs + (by - seg.midY[s]) * nys;
          const cx = ax + t * (bx - ax);
          const cy = ay + t * (by - ay);
          bx -= 2 * out * nxs;
          by -= 2 * out * nys;
          // Continue from just inside the crossing point.
          ax = cx - 1e-9 * h * nxs;
          ay = cy - 1e-9 * h * nys;
        }
      }
      const ie = floor((bx - x0) / h);
      const je = floor((by - y0) / h);
      if (ie < 0 || je < 0 || ie >= nx || je >= ny || fraction[ie + je * nx] <= 0) return -1; // step rejected: stay put
      p[0] = bx;
      p[1] = by;
      return -1;
    },
  };
}
