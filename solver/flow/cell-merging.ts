/**
 * Small-cell merging for the continuity equation. A cut cell holding a sliver of fluid has faces with tiny
 * apertures; its own mass balance Σ a h u = 0 then constrains almost nothing and its pressure, the Lagrange
 * multiplier of that constraint, can take any large value (the "small cell problem" of Cartesian cut-cell
 * methods). As is usual for cut cells (e.g. H. S. Udaykumar, R. Mittal & W. Shyy, J. Comput. Phys. 153, 535
 * (1999); M. J. Berger & M. J. Aftosmis, AIAA J. 36, 2085 (1998)) such a cell is merged with a neighbour:
 * the pair shares one pressure and one mass balance (their fluxes add, so the face between them drops out).
 *
 * A cell with fraction below MERGE_FRACTION joins the neighbour across its most open face; chains of small
 * cells are followed to their largest member (union–find). Cells reached through no open face (only through
 * a port) stay on their own.
 */
import type { CutCellGrid } from '../grid/cut-cell-grid';

/** Cells with less fluid than this (fraction of a cell) share the pressure of a neighbour. */
export const MERGE_FRACTION = 0.25;

export interface CellMerging {
  /** Merged cells and the cell whose pressure they take (never itself merged). */
  cell: Int32Array;
  into: Int32Array;
}

export function mergeSmallCells(grid: CutCellGrid): CellMerging {
  const { nx, fraction, apertureX: ax, apertureY: ay } = grid;
  const parent = new Map<number, number>();
  const find = (c: number): number => {
    let r = c;
    while (parent.has(r) && parent.get(r) !== r) r = parent.get(r)!;
    let k = c;
    while (k !== r) {
      const next = parent.get(k)!;
      parent.set(k, r);
      k = next;
    }
    return r;
  };
  // Larger fraction wins, then lower index, so a set's root is its largest cell.
  const better = (a: number, b: number) => fraction[a] > fraction[b] || (fraction[a] === fraction[b] && a < b);
  const union = (a: number, b: number) => {
    const ra = find(a), rb = find(b);
    if (ra === rb) return;
    if (better(ra, rb)) parent.set(rb, ra);
    else parent.set(ra, rb);
  };
  const small: number[] = [];
  for (const c of grid.cutCells) {
    if (!(fraction[c] < MERGE_FRACTION) || !(fraction[c] > 0)) continue;
    const i = c % nx, j = (c - i) / nx;
    const faces: Array<[number, number]> = [
      [ax[i + j * (nx + 1)], c - 1],
      [ax[i + 1 + j * (nx + 1)], c + 1],
      [ay[c], c - nx],
      [ay[c + nx], c + nx],
    ];
    let best = -1, open = 0;
    for (const [a, nb] of faces) {
      if (a > open) {
        open = a;
        best = nb;
      }
    }
    if (best < 0) continue;
    small.push(c);
    union(c, best);
  }
  // Each small cell adds one link, so a set holds at most one cell that is not small: its root.
  const pairs: Array<[number, number]> = [];
  for (const c of small) {
    const r = find(c);
    if (r !== c) pairs.push([c, r]);
  }
  pairs.sort((p, q) => p[0] - q[0]);
  return { cell: Int32Array.from(pairs, (p) => p[0]), into: Int32Array.from(pairs, (p) => p[1]) };
}

/**
 * The divergence entries of the merged cells, so that B and Bᵀ can move them onto the cell they joined:
 * for merged cell t, every open face f (and port face) with B_tf ≠ 0, as (component, node, B_tf).
 */
export interface MergedCouplings {
  merging: CellMerging;
  /** Position in merging.cell of each entry's merged cell. */
  owner: Int32Array;
  axis: Uint8Array;
  node: Int32Array;
  coefficient: Float64Array;
}

export function mergedCouplings(
  grid: CutCellGrid,
  merging: CellMerging,
  portFaces: { count: number; axis: Uint8Array; node: Int32Array; cell: Int32Array; sign: Float64Array; length: Float64Array },
): MergedCouplings {
  const { nx, spacing: h, apertureX: ax, apertureY: ay } = grid;
  const owner: number[] = [], axis: number[] = [], node: number[] = [], coefficient: number[] = [];
  const add = (k: number, a: number, n: number, b: number) => {
    if (b === 0) return;
    owner.push(k);
    axis.push(a);
    node.push(n);
    coefficient.push(b);
  };
  const position = new Map<number, number>();
  merging.cell.forEach((t, k) => {
    position.set(t, k);
    const i = t % nx, j = (t - i) / nx;
    // Outward fluxes: −a h u on the low faces, +a h u on the high faces.
    add(k, 0, i + j * (nx + 1), -ax[i + j * (nx + 1)] * h);
    add(k, 0, i + 1 + j * (nx + 1), ax[i + 1 + j * (nx + 1)] * h);
    add(k, 1, t, -ay[t] * h);
    add(k, 1, t + nx, ay[t + nx] * h);
  });
  for (let f = 0; f < portFaces.count; f++) {
    const k = position.get(portFaces.cell[f]);
    if (k !== undefined) add(k, portFaces.axis[f], portFaces.node[f], portFaces.sign[f] * portFaces.length[f]);
  }
  return {
    merging,
    owner: Int32Array.from(owner),
    axis: Uint8Array.from(axis),
    node: Int32Array.from(node),
    coefficient: Float64Array.from(coefficient),
  };
}
