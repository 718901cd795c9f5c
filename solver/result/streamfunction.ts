/**
 * Streamfunction from face fluxes (physics.md §3: u = ∂ψ/∂y, v = −∂ψ/∂x).
 *
 * ψ lives on the cell corners (nodes). The flux (m²/s, per unit depth) through a vertical face is
 * the rise of ψ along it and the flux through a horizontal face the fall of ψ along it:
 *   ψ(i, j+1) − ψ(i, j) = F_x(face left of cell (i, j)),   ψ(i+1, j) − ψ(i, j) = −F_y(face below (i, j)).
 * Nodes are joined only through open faces (aperture > 0), so the walls of different channels keep
 * their own values; each connected set of nodes starts from 0 at its first node. Around a cell
 * the differences close exactly when the cell's fluxes balance (a divergence-free discrete field);
 * at port cells, which are sources, the first path found wins. Cell values are the mean of the
 * corners reached.
 */
import type { CutCellGrid } from '../grid/cut-cell-grid';

/** fluxX(f) for x-face index f = i + j(nx+1) (positive towards +x), fluxY(f) for f = i + j·nx (towards +y). */
export function streamfunction(
  grid: CutCellGrid,
  fluxX: (face: number) => number,
  fluxY: (face: number) => number,
): Float32Array {
  const { nx, ny, apertureX, apertureY, fraction } = grid;
  const sx = nx + 1;
  const psi = new Float64Array((nx + 1) * (ny + 1));
  const seen = new Uint8Array((nx + 1) * (ny + 1));
  const queue = new Int32Array((nx + 1) * (ny + 1));
  const visit = (node: number, value: number, tail: number) => {
    if (seen[node]) return tail;
    seen[node] = 1;
    psi[node] = value;
    queue[tail] = node;
    return tail + 1;
  };
  for (let start = 0; start < psi.length; start++) {
    if (seen[start]) continue;
    let head = 0, tail = visit(start, 0, 0);
    while (head < tail) {
      const node = queue[head++];
      const i = node % sx, j = (node - i) / sx;
      const p = psi[node];
      // Up along the x-face left of cell (i, j); down along the one left of (i, j−1).
      if (j < ny && apertureX[i + j * sx] > 0) tail = visit(node + sx, p + fluxX(i + j * sx), tail);
      if (j > 0 && apertureX[i + (j - 1) * sx] > 0) tail = visit(node - sx, p - fluxX(i + (j - 1) * sx), tail);
      // Right along the y-face below cell (i, j); left along the one below (i−1, j).
      if (i < nx && apertureY[i + j * nx] > 0) tail = visit(node + 1, p - fluxY(i + j * nx), tail);
      if (i > 0 && apertureY[i - 1 + j * nx] > 0) tail = visit(node - 1, p + fluxY(i - 1 + j * nx), tail);
    }
  }
  const out = new Float32Array(nx * ny);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const c = i + j * nx;
      if (!(fraction[c] > 0)) {
        out[c] = NaN;
        continue;
      }
      // Corners that lie on an open face of this cell were reached through it.
      let sum = 0, count = 0;
      const corner = (node: number, open: boolean) => { if (open) { sum += psi[node]; count++; } };
      const w = apertureX[i + j * sx] > 0, e = apertureX[i + 1 + j * sx] > 0;
      const s = apertureY[c] > 0, n = apertureY[c + nx] > 0;
      corner(i + j * sx, w || s);
      corner(i + 1 + j * sx, e || s);
      corner(i + (j + 1) * sx, w || n);
      corner(i + 1 + (j + 1) * sx, e || n);
      out[c] = count > 0 ? sum / count : NaN;
    }
  }
  return out;
}
