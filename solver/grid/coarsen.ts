/**
 * Coarser grids for geometric multigrid.
 *
 * Coarse cell (I, J) covers fine cells (2I..2I+1, 2J..2J+1); spacing 2h, same
 * origin; fine cells beyond the fine grid count as solid.
 *   fraction_2h(I, J)  = ¼ Σ fraction_h(children)                  (area is additive)
 *   apertureX_2h(I, J) = ½ [apertureX_h(2I, 2J) + apertureX_h(2I, 2J+1)]
 *   apertureY_2h(I, J) = ½ [apertureY_h(2I, 2J) + apertureY_h(2I+1, 2J)]
 *     (open length is additive; the coarse face is twice as long)
 * The outline pieces are kept and re-assigned to the parent cells, so the
 * discrete divergence theorem of cut-cell-grid.ts holds on every level and
 * coarse operators built from these apertures see the same walls.
 */
import { allocateSegments, cutIndex, type CutCellGrid } from './cut-cell-grid';

export function coarsen(fine: CutCellGrid): CutCellGrid {
  const fx = fine.nx, fy = fine.ny;
  const nx = Math.ceil(fx / 2), ny = Math.ceil(fy / 2);
  const frac = (i: number, j: number) => (i < fx && j < fy ? fine.fraction[i + j * fx] : 0);
  const apX = (i: number, j: number) => (i <= fx && j < fy ? fine.apertureX[i + j * (fx + 1)] : 0);
  const apY = (i: number, j: number) => (i < fx && j <= fy ? fine.apertureY[i + j * fx] : 0);

  const fraction = new Float64Array(nx * ny);
  const apertureX = new Float64Array((nx + 1) * ny);
  const apertureY = new Float64Array(nx * (ny + 1));
  let fluidCells = 0;
  for (let J = 0; J < ny; J++) {
    for (let I = 0; I < nx; I++) {
      const i = 2 * I, j = 2 * J;
      const f = (frac(i, j) + frac(i + 1, j) + frac(i, j + 1) + frac(i + 1, j + 1)) / 4;
      fraction[I + J * nx] = f;
      if (f > 0) fluidCells++;
    }
    for (let I = 0; I <= nx; I++) apertureX[I + J * (nx + 1)] = (apX(2 * I, 2 * J) + apX(2 * I, 2 * J + 1)) / 2;
  }
  for (let J = 0; J <= ny; J++) {
    for (let I = 0; I < nx; I++) apertureY[I + J * nx] = (apY(2 * I, 2 * J) + apY(2 * I + 1, 2 * J)) / 2;
  }

  // Segments: same pieces, parent cells, re-sorted by cell (counting sort, stable).
  const fs = fine.segments;
  const parent = new Int32Array(fs.count);
  const counts = new Int32Array(nx * ny + 1);
  for (let s = 0; s < fs.count; s++) {
    const c = fs.cell[s], i = c % fx, j = (c - i) / fx;
    parent[s] = (i >> 1) + (j >> 1) * nx;
    counts[parent[s] + 1]++;
  }
  for (let c = 0; c < nx * ny; c++) counts[c + 1] += counts[c];
  const segments = allocateSegments(fs.count);
  const next = counts.slice(0, nx * ny);
  for (let s = 0; s < fs.count; s++) {
    const t = next[parent[s]]++;
    segments.cell[t] = parent[s];
    segments.length[t] = fs.length[s];
    segments.normalX[t] = fs.normalX[s];
    segments.normalY[t] = fs.normalY[s];
    segments.midX[t] = fs.midX[s];
    segments.midY[t] = fs.midY[s];
    segments.port[t] = fs.port[s];
    segments.zeta[t] = fs.zeta[s];
  }

  // Cut cells: parents of fine cut cells; centroid = fraction-weighted mean of the children's.
  const cutList: number[] = [];
  for (let s = 0; s < segments.count; s++) {
    const c = segments.cell[s];
    if (cutList.length === 0 || cutList[cutList.length - 1] !== c) cutList.push(c);
  }
  const h = fine.spacing;
  const cutCentroidX = new Float64Array(cutList.length);
  const cutCentroidY = new Float64Array(cutList.length);
  cutList.forEach((c, k) => {
    const I = c % nx, J = (c - I) / nx;
    let w = 0, sx = 0, sy = 0;
    for (let dj = 0; dj < 2; dj++) {
      for (let di = 0; di < 2; di++) {
        const i = 2 * I + di, j = 2 * J + dj;
        const f = frac(i, j);
        if (!(f > 0)) continue;
        const child = i + j * fx;
        const ck = cutIndex(fine, child);
        const x = ck >= 0 ? fine.cutCentroidX[ck] : fine.x0 + (i + 0.5) * h;
        const y = ck >= 0 ? fine.cutCentroidY[ck] : fine.y0 + (j + 0.5) * h;
        w += f; sx += f * x; sy += f * y;
      }
    }
    cutCentroidX[k] = sx / w;
    cutCentroidY[k] = sy / w;
  });

  return {
    nx, ny, spacing: 2 * h, x0: fine.x0, y0: fine.y0, level: fine.level + 1,
    fraction, apertureX, apertureY, segments,
    cutCells: Int32Array.from(cutList), cutCentroidX, cutCentroidY,
    portLength: fine.portLength.slice(), fluidCells,
  };
}

/**
 * The multigrid hierarchy: [fine, coarsen(fine), ...] until the coarsest grid
 * has at most `coarsestCells` cells or a side of 2 cells or fewer.
 */
export function gridHierarchy(fine: CutCellGrid, coarsestCells = 64): CutCellGrid[] {
  const levels = [fine];
  let g = fine;
  while (g.nx * g.ny > coarsestCells && g.nx > 2 && g.ny > 2) {
    g = coarsen(g);
    levels.push(g);
  }
  return levels;
}
