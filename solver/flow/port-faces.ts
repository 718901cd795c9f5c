/**
 * Ports on the staggered grid. A port is a run of boundary segments (cut-cell-grid.ts), and the faces at a
 * port's end are closed, so the flow through a port needs velocity nodes of its own. Each port segment s in
 * cell c, outward normal n, is split into its projections on the two axes: the part along a (length
 * ℓ = L_s |n_a|) is carried by the node on the face of c on the side n points to (σ = sign n_a). For a port
 * on a grid line that is exactly the MAC boundary node of the closed face; an oblique port becomes a
 * staircase of x- and y-port faces (the projected lengths add up exactly, so the discrete divergence theorem
 * still holds). A face that is also open (an oblique port cutting a cell's corner) carries both parts.
 *
 * Per port face: the flux into c is ℓ u (flowing in when σ u < 0); the pressure p_k pushes on ℓ; the
 * control volume between the cell's fluid centroid and the port is ℓ δ, δ the centroid-to-port distance
 * (floored at MIN_PORT_DISTANCE h, as for the potential's port conductance); the field along a at the port
 * is E·n_out = −(V_k − φ_c)/δ times n_a, so the port part of B applied to μ E reproduces the potential
 * solver's port current.
 */
import { cutIndex, type CutCellGrid } from '../grid/cut-cell-grid';
import type { FlowProblem } from './flow-problem';
import type { Component } from './staggered';

/** Least centroid-to-port distance, in cells (as MIN_PORT_DISTANCE in solver/potential). */
export const MIN_PORT_DISTANCE = 0.1;
/** Projections shorter than this fraction of a segment are dropped (round-off of axis-aligned normals). */
const MIN_PROJECTION = 1e-9;

export interface PortFaces {
  count: number;
  /** Component (0: u, 1: v) and node index in its box. */
  axis: Uint8Array;
  node: Int32Array;
  /** The fluid cell the port part opens into. */
  cell: Int32Array;
  /** +1 when the port lies on the cell's high-a side (outflow for u > 0), −1 on its low side. */
  sign: Float64Array;
  /** ℓ: projected port length (m). */
  length: Float64Array;
  /** Σ ℓ_s δ_s: control volume of the port part (m²). */
  volume: Float64Array;
  /** Σ ℓ_s / δ_s: its Dirichlet conductance for a pressure Poisson operator (dimensionless). */
  conductance: Float64Array;
  /** Σ ℓ_s p_k(s): the port pressure's push (Pa·m), acting along −σ. */
  push: Float64Array;
  /** E along the axis at the port part, ℓ-weighted (V/m). */
  field: Float64Array;
  /** Attribution to ports: part p of face partFace[p] belongs to port partPort[p] with length partLength[p]. */
  partFace: Int32Array;
  partPort: Int32Array;
  partLength: Float64Array;
  /** Per component: node → port face. */
  byNode: [Map<number, number>, Map<number, number>];
}

export function portFaces(problem: FlowProblem, comps: [Component, Component]): PortFaces {
  const { grid, potential, portPotential, portPressure } = problem;
  const seg = grid.segments;
  const byNode: [Map<number, number>, Map<number, number>] = [new Map(), new Map()];
  const faces: Array<{ axis: 0 | 1; node: number; cell: number; sign: number; length: number; volume: number; conductance: number; push: number; field: number }> = [];
  const parts = new Map<string, { face: number; port: number; length: number }>();
  for (let s = 0; s < seg.count; s++) {
    const k = seg.port[s];
    if (k < 0) continue;
    const c = seg.cell[s];
    const delta = portDistance(grid, s);
    const v = portPotential[k];
    const phi = potential[c];
    const en = v !== null && v !== undefined && Number.isFinite(phi) ? -(v - phi) / delta : 0;
    for (const comp of comps) {
      const na = comp.segmentNormalA(s);
      if (!(Math.abs(na) > MIN_PROJECTION)) continue;
      const [a, b] = comp.cellAB(c);
      const node = comp.node(na > 0 ? a + 1 : a, b);
      const ell = seg.length[s] * Math.abs(na);
      let f = byNode[comp.axis].get(node);
      if (f === undefined) {
        f = faces.length;
        byNode[comp.axis].set(node, f);
        faces.push({ axis: comp.axis, node, cell: c, sign: na > 0 ? 1 : -1, length: 0, volume: 0, conductance: 0, push: 0, field: 0 });
      }
      const face = faces[f];
      face.length += ell;
      face.volume += ell * delta;
      face.conductance += ell / delta;
      face.push += ell * portPressure[k];
      face.field += ell * en * na;
      const key = `${f}:${k}`;
      const part = parts.get(key);
      if (part) part.length += ell;
      else parts.set(key, { face: f, port: k, length: ell });
    }
  }
  const n = faces.length;
  const out: PortFaces = {
    count: n,
    axis: new Uint8Array(n),
    node: new Int32Array(n),
    cell: new Int32Array(n),
    sign: new Float64Array(n),
    length: new Float64Array(n),
    volume: new Float64Array(n),
    conductance: new Float64Array(n),
    push: new Float64Array(n),
    field: new Float64Array(n),
    partFace: Int32Array.from([...parts.values()].map((p) => p.face)),
    partPort: Int32Array.from([...parts.values()].map((p) => p.port)),
    partLength: Float64Array.from([...parts.values()].map((p) => p.length)),
    byNode,
  };
  faces.forEach((f, i) => {
    out.axis[i] = f.axis;
    out.node[i] = f.node;
    out.cell[i] = f.cell;
    out.sign[i] = f.sign;
    out.length[i] = f.length;
    out.volume[i] = f.volume;
    out.conductance[i] = f.conductance;
    out.push[i] = f.push;
    out.field[i] = f.length > 0 ? f.field / f.length : 0;
  });
  return out;
}

/** Distance (m) from the fluid centroid of a port segment's cell to the segment's line, floored. */
export function portDistance(grid: CutCellGrid, s: number): number {
  const seg = grid.segments;
  const k = cutIndex(grid, seg.cell[s]);
  const cx = grid.cutCentroidX[k], cy = grid.cutCentroidY[k];
  const d = Math.abs((cx - seg.midX[s]) * seg.normalX[s] + (cy - seg.midY[s]) * seg.normalY[s]);
  return Math.max(d, MIN_PORT_DISTANCE * grid.spacing);
}
