/**
 * The staggered (MAC) layout of the velocity on the cut-cell grid (F. H. Harlow & J. E. Welch, Phys. Fluids
 * 8, 2182 (1965)): u, the x-velocity, lives on the vertical faces and v, the y-velocity, on the horizontal
 * ones, with exactly the grid's aperture layouts:
 *
 *   u node (i, j) = vertical face at x = x0 + i h, index i + j (nx + 1), box (nx + 1) × ny;
 *   v node (i, j) = horizontal face at y = y0 + j h, index i + j nx,    box nx × (ny + 1).
 *
 * Code that treats both components alike works in (a, b) coordinates: a along the component's own axis
 * (across its faces: x for u, y for v), b along the other axis. Node (a, b) sits between the cells with
 * normal index a − 1 and a; its normal neighbours are (a ± 1, b), its tangential neighbours (a, b ± 1).
 * Each component is an Operator5 on its own box (solver/multigrid/operator.ts); `normalLinks` and
 * `tangentialLinks` name which of gx / gy hold the links along a and along b.
 */
import type { CutCellGrid } from '../grid/cut-cell-grid';
import { fluidRuns } from '../grid/fluid-runs';
import type { Operator5 } from '../multigrid/operator';

export type Axis = 0 | 1;

export interface Component {
  axis: Axis;
  /** The component's Operator5 box. */
  n1: number;
  n2: number;
  /** Node counts along a and along b. */
  na: number;
  nb: number;
  /** Cell counts along a (nodes along a are cellsA + 1). */
  cellsA: number;
  node(a: number, b: number): number;
  /** The cell with normal index a and tangential index b. */
  cell(a: number, b: number): number;
  /** Aperture of the faces the nodes sit on, indexed by node. */
  normalAperture: Float64Array;
  /** Aperture of the face on the low-b side of cell (a, b) (the face that cell shares with (a, b − 1)). */
  tangentialAperture(a: number, b: number): number;
  /** Index, in normalLinks(op), of the link between nodes (a − 1, b) and (a, b). */
  normalLink(a: number, b: number): number;
  /** Index, in tangentialLinks(op), of the link between nodes (a, b − 1) and (a, b). */
  tangentialLink(a: number, b: number): number;
  normalLinks(op: Operator5): Float64Array;
  tangentialLinks(op: Operator5): Float64Array;
  /** Position (m) of face plane a along the normal axis, and of grid line b along the tangential axis. */
  facePlane(a: number): number;
  tangentialPlane(b: number): number;
  /** (a, b) of a cell index of the grid. */
  cellAB(c: number): [number, number];
  /** (a, b) of a node index. */
  nodeAB(n: number): [number, number];
  /** A segment's normal component along a and along b, and its midpoint along a. */
  segmentNormalA(s: number): number;
  segmentNormalB(s: number): number;
  segmentMidA(s: number): number;
  segmentMidB(s: number): number;
}

export function components(grid: CutCellGrid): [Component, Component] {
  return [xComponent(grid), yComponent(grid)];
}

function xComponent(grid: CutCellGrid): Component {
  const { nx, ny, apertureY, spacing: h, x0, y0, segments: seg } = grid;
  const sx = nx + 1;
  return {
    axis: 0,
    n1: nx + 1,
    n2: ny,
    na: nx + 1,
    nb: ny,
    cellsA: nx,
    node: (a, b) => a + b * sx,
    cell: (a, b) => a + b * nx,
    normalAperture: grid.apertureX,
    tangentialAperture: (a, b) => apertureY[a + b * nx],
    normalLink: (a, b) => a + b * (sx + 1),
    tangentialLink: (a, b) => a + b * sx,
    normalLinks: (op) => op.gx,
    tangentialLinks: (op) => op.gy,
    facePlane: (a) => x0 + a * h,
    tangentialPlane: (b) => y0 + b * h,
    cellAB: (c) => {
      const i = c % nx;
      return [i, (c - i) / nx];
    },
    nodeAB: (n) => {
      const a = n % sx;
      return [a, (n - a) / sx];
    },
    segmentNormalA: (s) => seg.normalX[s],
    segmentNormalB: (s) => seg.normalY[s],
    segmentMidA: (s) => seg.midX[s],
    segmentMidB: (s) => seg.midY[s],
  };
}

function yComponent(grid: CutCellGrid): Component {
  const { nx, ny, apertureX, spacing: h, x0, y0, segments: seg } = grid;
  const sx = nx + 1;
  return {
    axis: 1,
    n1: nx,
    n2: ny + 1,
    na: ny + 1,
    nb: nx,
    cellsA: ny,
    node: (a, b) => b + a * nx,
    cell: (a, b) => b + a * nx,
    normalAperture: grid.apertureY,
    tangentialAperture: (a, b) => apertureX[b + a * sx],
    normalLink: (a, b) => b + a * nx,
    tangentialLink: (a, b) => b + a * sx,
    normalLinks: (op) => op.gy,
    tangentialLinks: (op) => op.gx,
    facePlane: (a) => y0 + a * h,
    tangentialPlane: (b) => x0 + b * h,
    cellAB: (c) => {
      const i = c % nx;
      return [(c - i) / nx, i];
    },
    nodeAB: (n) => {
      const b = n % nx;
      return [(n - b) / nx, b];
    },
    segmentNormalA: (s) => seg.normalY[s],
    segmentNormalB: (s) => seg.normalX[s],
    segmentMidA: (s) => seg.midY[s],
    segmentMidB: (s) => seg.midX[s],
  };
}

/**
 * The nodes of a component whose face is open (aperture > 0), ascending. An open face joins two fluid cells,
 * so they are found from the runs of fluid cells (solver/grid/fluid-runs.ts) without a pass over the box: a
 * vertical face c + j between cells c − 1 and c of one run of row j, a horizontal face c below a cell c of
 * row j ≥ 1. Port nodes whose face is closed are not in the list (port-faces.ts has them). Found once per grid.
 */
export function openNodes(grid: CutCellGrid, comp: Component): Int32Array {
  const known = found.get(comp.normalAperture);
  if (known) return known;
  const { runs, rowRuns } = fluidRuns(grid);
  const ap = comp.normalAperture;
  const out: number[] = [];
  for (let j = 0; j < grid.ny; j++) {
    for (let k = rowRuns[j], last = rowRuns[j + 1]; k < last; k += 2) {
      if (comp.axis === 0) {
        for (let c = runs[k] + 1; c < runs[k + 1]; c++) if (ap[c + j] > 0) out.push(c + j);
      } else if (j > 0) {
        for (let c = runs[k]; c < runs[k + 1]; c++) if (ap[c] > 0) out.push(c);
      }
    }
  }
  const nodes = Int32Array.from(out);
  found.set(comp.normalAperture, nodes);
  return nodes;
}

/** Open nodes, kept with the aperture array they were found from (the grid's arrays never change). */
const found = new WeakMap<Float64Array, Int32Array>();
