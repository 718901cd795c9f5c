import type { CutCellGrid } from '../grid/cut-cell-grid';

// Math's functions as module locals: hot loops then avoid a global lookup per call (slow in some hosts).
const { floor, min } = Math;

/**
 * Bilinear interpolation of cell-centred fields at a point. The four cell centres around the point are weighted
 * by the usual bilinear weights times their fluid fraction (> 0), renormalised, so values from outside the fluid
 * never leak in and a point in a cut cell takes the values of its fluid neighbours.
 */
export interface Sampler {
  /** Writes the interpolated value of each field into `out`; returns false when no fluid cell is near. */
  sample(x: number, y: number, out: Float64Array): boolean;
}

export function createSampler(grid: CutCellGrid, fields: ArrayLike<number>[]): Sampler {
  const { nx, ny, spacing: h, x0, y0, fraction } = grid;
  const m = fields.length;
  return {
    sample(x, y, out) {
      const fx = (x - x0) / h - 0.5;
      const fy = (y - y0) / h - 0.5;
      const i0 = floor(fx);
      const j0 = floor(fy);
      const tx = fx - i0;
      const ty = fy - j0;
      let wsum = 0;
      for (let k = 0; k < m; k++) out[k] = 0;
      for (let dj = 0; dj < 2; dj++) {
        const j = j0 + dj;
        if (j < 0 || j >= ny) continue;
        const wy = dj ? ty : 1 - ty;
        for (let di = 0; di < 2; di++) {
          const i = i0 + di;
          if (i < 0 || i >= nx) continue;
          const c = i + j * nx;
          if (fraction[c] <= 0) continue;
          const w = (di ? tx : 1 - tx) * wy * min(1, fraction[c] * 4) + 1e-12;
          wsum += w;
          for (let k = 0; k < m; k++) out[k] += w * fields[k][c];
        }
      }
      if (wsum === 0) return false;
      for (let k = 0; k < m; k++) out[k] /= wsum;
      return true;
    },
  };
}
