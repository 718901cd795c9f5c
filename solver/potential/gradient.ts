/**
 * Cell-centred electric field E = −grad φ (physics.md §2) by weighted least squares about each
 * cell's fluid centroid x_c: fit φ ≈ φ_c + a + g·(x − x_c) to
 *
 *   the cell's own value                  weight f_c                 (f: fluid fraction)
 *   neighbours through open faces         weight a_f · f_nb²         (a: aperture)
 *   the foot of x_c on each port piece    weight L/h, value V_k
 *   each wall piece, as g·n = 0           weight L/h                 (insulating wall, ∂φ/∂n = 0)
 *
 * with offsets in cells, so all terms weigh alike. A cell less than half full also takes the
 * neighbours of its neighbours (weight a_f a_f' f²): a small cut cell's own potential is the
 * least accurate value around (its few faces barely constrain it), so the fit leans on the
 * larger cells nearby and stays bounded however small the cell. On a full cell with four full
 * neighbours this is the central difference (φ_E − φ_W)/2h; wherever the data are those of a
 * linear potential (a rectangle with ports on its ends) it reproduces it exactly.
 * Measured on the annular sector (tests/verification/potential.test.ts): first order in the
 * area-weighted mean, the largest error about 2 % of the largest field at curved walls.
 */
import { cutIndex, type CutCellGrid } from '../grid/cut-cell-grid';
import { fluidRuns } from '../grid/fluid-runs';

export interface CellField {
  /** E = −grad φ per cell (V/m); 0 outside `active`. */
  x: Float64Array;
  y: Float64Array;
}

/** Cells less than this full also use their second ring of neighbours. */
export const SMALL_CELL = 0.5;
const REGULARISE = 1e-12;

/** Normal equations of the fit for the unknowns (a, g_x h, g_y h). */
class Fit {
  s00 = 0; s01 = 0; s02 = 0; s11 = 0; s12 = 0; s22 = 0; r0 = 0; r1 = 0; r2 = 0;
  reset(): void {
    this.s00 = this.s01 = this.s02 = this.s11 = this.s12 = this.s22 = this.r0 = this.r1 = this.r2 = 0;
  }
  /** w (a + dx g_x + dy g_y − value)², or w (g·n)² when `constant` is 0. */
  add(w: number, constant: 0 | 1, dx: number, dy: number, value: number): void {
    this.s00 += w * constant; this.s01 += w * constant * dx; this.s02 += w * constant * dy;
    this.s11 += w * dx * dx; this.s12 += w * dx * dy; this.s22 += w * dy * dy;
    this.r0 += w * constant * value; this.r1 += w * dx * value; this.r2 += w * dy * value;
  }
  /** [g_x h, g_y h] by Cramer's rule on the regularised 3 × 3 system. */
  gradient(): [number, number] {
    const eps = REGULARISE * (this.s00 + this.s11 + this.s22) + 1e-300;
    const a = this.s00 + eps, b = this.s01, c = this.s02, d = this.s11 + eps, e = this.s12, f = this.s22 + eps;
    const det = a * (d * f - e * e) - b * (b * f - c * e) + c * (b * e - c * d);
    const { r0, r1, r2 } = this;
    const gx = (a * (r1 * f - e * r2) - r0 * (b * f - c * e) + c * (b * r2 - r1 * c)) / det;
    const gy = (a * (d * r2 - r1 * e) - b * (b * r2 - r1 * c) + r0 * (b * e - c * d)) / det;
    return [gx, gy];
  }
}

export function electricField(
  grid: CutCellGrid,
  active: Uint8Array,
  potential: Float64Array,
  portPotential: ReadonlyArray<number | null>,
): CellField {
  const { nx, ny, spacing: h, x0, y0, apertureX, apertureY, fraction, segments: seg } = grid;
  const ex = new Float64Array(nx * ny);
  const ey = new Float64Array(nx * ny);
  // Centroid of a cell in cell units from the grid origin.
  const centroid = (c: number, axis: 0 | 1): number => {
    const i = c % nx, j = (c - i) / nx;
    const k = fraction[c] < 1 ? cutIndex(grid, c) : -1;
    if (axis === 0) return k >= 0 ? (grid.cutCentroidX[k] - x0) / h : i + 0.5;
    return k >= 0 ? (grid.cutCentroidY[k] - y0) / h : j + 0.5;
  };
  // Calls f(neighbour, aperture) for each active neighbour through an open face.
  const eachNeighbour = (c: number, f: (nb: number, a: number) => void) => {
    const i = c % nx, j = (c - i) / nx;
    let a: number;
    if (i > 0 && (a = apertureX[i + j * (nx + 1)]) > 0 && active[c - 1]) f(c - 1, a);
    if (i < nx - 1 && (a = apertureX[i + 1 + j * (nx + 1)]) > 0 && active[c + 1]) f(c + 1, a);
    if (j > 0 && (a = apertureY[c]) > 0 && active[c - nx]) f(c - nx, a);
    if (j < ny - 1 && (a = apertureY[c + nx]) > 0 && active[c + nx]) f(c + nx, a);
  };
  const fit = new Fit();
  let s = 0; // segments are sorted by cell
  // Active cells are fluid cells: visit the runs of fluid cells, not the box.
  const { runs } = fluidRuns(grid);
  for (let k = 0; k < runs.length; k += 2) for (let c = runs[k]; c < runs[k + 1]; c++) {
    while (s < seg.count && seg.cell[s] < c) s++;
    if (!active[c]) continue;
    const cx = centroid(c, 0), cy = centroid(c, 1);
    const phi = potential[c];
    fit.reset();
    fit.add(Math.min(1, fraction[c]), 1, 0, 0, 0);
    const data = (nb: number, w: number) => {
      const f = Math.min(1, fraction[nb]);
      fit.add(w * f * f, 1, centroid(nb, 0) - cx, centroid(nb, 1) - cy, potential[nb] - phi);
    };
    eachNeighbour(c, (nb, a) => data(nb, a));
    if (fraction[c] < SMALL_CELL) {
      eachNeighbour(c, (nb, a) => eachNeighbour(nb, (nb2, a2) => {
        if (nb2 === c || areNeighbours(nb2, c, nx)) return;
        data(nb2, 0.5 * a * a2); // reached from up to two ring-1 cells: half each
      }));
    }
    for (let t = s; t < seg.count && seg.cell[t] === c; t++) {
      const w = seg.length[t] / h, nX = seg.normalX[t], nY = seg.normalY[t];
      const port = seg.port[t];
      const v = port >= 0 ? portPotential[port] : null;
      if (v === null || v === undefined) {
        fit.add(w, 0, nX, nY, 0);
      } else {
        const dist = ((seg.midX[t] - x0) / h - cx) * nX + ((seg.midY[t] - y0) / h - cy) * nY;
        fit.add(w, 1, dist * nX, dist * nY, v - phi);
      }
    }
    const [gx, gy] = fit.gradient();
    ex[c] = -gx / h;
    ey[c] = -gy / h;
  }
  return { x: ex, y: ey };
}

/** Whether two cells share a face (the second ring skips the first). */
function areNeighbours(a: number, b: number, nx: number): boolean {
  const d = Math.abs(a - b);
  return d === nx || (d === 1 && Math.floor(a / nx) === Math.floor(b / nx));
}
