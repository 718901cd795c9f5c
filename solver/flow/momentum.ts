/**
 * One velocity component's momentum operator on its staggered box (physics.md §3), integrated over the
 * node's control volume V (finite volumes on the MAC grid, Harlow & Welch 1965):
 *
 *   Σ_links g (u − u_nb) + Σ_walls g_w (u − u_w) + α V u − (Bᵀ p) = α V u_tb + Σ_walls g_w u_w − σ ℓ p_k,
 *
 * α = 12 μ / d², u_tb = μ_eo_tb E on the face, u_w the velocity of the wall (its HS slip; 0 on a port). The
 * left side without Bᵀp is a symmetric positive definite Operator5 (conductances μ between neighbouring
 * nodes, reaction α V, wall conductances as Dirichlet `boundary`), so one multigrid V-cycle preconditions it.
 *
 * Cut cells (first order at curved walls, the usual second-order MAC treatment on grid-aligned walls):
 * - a node exists where its face is open or carries a port (port-faces.ts); ã = aperture + ℓ_port/h;
 * - V = aperture h² + ℓ_port δ_port (the open part of the face times the spacing, so Hele-Shaw flow through
 *   a narrowed face keeps its exact Darcy law);
 * - normal link (a, b)–(a+1, b): g = μ (ã + ã')/2; tangential link (a, b)–(a, b+1): g = μ × (open length of
 *   the control volume's edge) / (distance between the nodes), the edge the mean of the two half-faces it
 *   crosses, each node taken at the middle of its face's open part (next to the open neighbour), so a wall
 *   that cuts a row of cells keeps the scheme consistent (Shortley–Weller-like distances);
 * - a tangential edge that is open but whose neighbour node is missing: if that node's face lies on a wall
 *   (a wall across the component, where its velocity is the wall's), Dirichlet to that value at distance h;
 *   otherwise the node's line enters the solid at the end of its face's open part: Dirichlet to the nearest
 *   wall segment's velocity at distance ã h/2;
 * - every wall segment of the two cells a node's control volume spans pulls towards the wall velocity:
 *   along b with length L|n_b|/2 at distance max(ã h/2, δ_min) (the node taken at the middle of its face's
 *   open part, so a wall on the grid line is at h/2 as in the ghost-cell MAC scheme); along a (a wall across
 *   the component, e.g. a closed channel end) with length L|n_a| at the distance from the face to the
 *   segment's midpoint. A port segment pulls only a component tangential to it (zero tangential velocity
 *   on a port along a grid line); along a a port is a natural (∂u_n/∂n = 0) boundary. An oblique port
 *   (a staircase of port faces, port-faces.ts) pulls neither component: pinning both Cartesian components
 *   on every step would turn the staircase into a no-slip wall as h → 0 (measured: the flow through a port
 *   at 30° fell to 0.34 of its value at 87 cells across), so there the tangential velocity is left free,
 *   the usual pressure (do-nothing) outlet.
 */
import { segmentRange } from '../grid/cut-cell-grid';
import { createOperator, finishOperator, type Operator5 } from '../multigrid/operator';
import { depthFriction, floorLidMobility, type FlowProblem } from './flow-problem';
import type { PortFaces } from './port-faces';
import { openNodes, type Component } from './staggered';

const { abs, max, min, hypot } = Math;

/** Least node-to-wall distance, in cells: keeps wall conductances finite next to slivers. */
export const MIN_WALL_DISTANCE = 0.05;
/** A component counts as tangential to a port segment when |n_a| is below this (about 1°). */
const PORT_TANGENT_SIN = 0.02;
const MIN_PROJECTION = 1e-9;

export interface MomentumOperator {
  op: Operator5;
  /**
   * Per node, the conductance-weighted distance to its Dirichlet walls in cells, Σℓ / Σ(ℓ/δ): what the
   * multigrid coarsening needs to re-discretise the walls on coarse levels (coarsen-extents.ts).
   */
  wallDistance: Float64Array;
}

/**
 * The component's operator; rhs (length n1·n2) receives the right-hand side above. `faceE` is E along the
 * component's axis on the open faces (face-field.ts); `slipA` the walls' velocity along the axis per segment.
 */
export function assembleMomentum(
  problem: FlowProblem,
  comp: Component,
  ports: PortFaces,
  faceE: Float64Array,
  slipA: Float64Array,
  rhs: Float64Array,
): MomentumOperator {
  const { grid, viscosity: mu } = problem;
  const h = grid.spacing;
  const alpha = depthFriction(problem);
  const mobilityTB = floorLidMobility(problem);
  const op = createOperator(comp.n1, comp.n2);
  const portOf = ports.byNode[comp.axis];
  const ap = comp.normalAperture;
  const gN = comp.normalLinks(op);
  const gT = comp.tangentialLinks(op);
  // Σ ℓ/h of each node's wall pulls, turned into their mean distance at the end.
  const wall = new Float64Array(comp.n1 * comp.n2);
  rhs.fill(0);

  // ã per node, kept in op.diag until finishOperator computes the real diagonal. Nodes exist on open faces and
  // on port faces only: the loops visit those (openNodes), not the box.
  const eff = op.diag;
  const open = openNodes(grid, comp);
  for (let k = 0; k < open.length; k++) eff[open[k]] = ap[open[k]];
  const nodes = [...open];
  for (const [node, f] of portOf) {
    if (!(eff[node] > 0)) nodes.push(node);
    eff[node] += ports.length[f] / h;
  }
  const effAt = (a: number, b: number) => (a >= 1 && a < comp.cellsA && b >= 0 && b < comp.nb ? eff[comp.node(a, b)] : 0);

  for (const n of nodes) {
    const [a, b] = comp.nodeAB(n);
    if (!(a >= 1 && a < comp.cellsA)) continue;
    const e = eff[n];
    if (!(e > 0)) continue;
    op.active[n] = 1;
    let volume = ap[n] * h * h;
    let field = faceE[n];
    const f = portOf.get(n);
    if (f !== undefined) {
      volume += ports.volume[f];
      const open = ap[n] * h;
      field = (open * faceE[n] + ports.length[f] * ports.field[f]) / (open + ports.length[f]);
      rhs[n] -= ports.sign[f] * ports.push[f];
    }
    op.reaction[n] = alpha * volume;
    rhs[n] += alpha * volume * mobilityTB * field;

    const eNext = effAt(a + 1, b);
    if (eNext > 0) gN[comp.normalLink(a + 1, b)] = (mu * (e + eNext)) / 2;

    const edgeUp = (comp.tangentialAperture(a - 1, b + 1) + comp.tangentialAperture(a, b + 1)) / 2;
    if (effAt(a, b + 1) > 0) {
      const gap = max(openCentre(a, b + 1) - openCentre(a, b), MIN_WALL_DISTANCE);
      gT[comp.tangentialLink(a, b + 1)] = (mu * edgeUp) / gap;
    }
    else if (edgeUp > 0) closeEdge(n, a, b, 1, edgeUp);
    if (!(effAt(a, b - 1) > 0)) {
      const edgeDown = (comp.tangentialAperture(a - 1, b) + comp.tangentialAperture(a, b)) / 2;
      if (edgeDown > 0) closeEdge(n, a, b, -1, edgeDown);
    }
  }

  const seg = grid.segments;
  const floor = MIN_WALL_DISTANCE * h;
  for (let s = 0; s < seg.count; s++) {
    const [a, b] = comp.cellAB(seg.cell[s]);
    const isPort = seg.port[s] >= 0;
    const value = isPort ? 0 : slipA[s];
    const nA = comp.segmentNormalA(s), nB = comp.segmentNormalB(s);
    if (abs(nB) > MIN_PROJECTION && !(isPort && abs(nA) >= PORT_TANGENT_SIN)) {
      const w = (seg.length[s] * abs(nB)) / 2;
      for (const n of [comp.node(a, b), comp.node(a + 1, b)]) {
        if (eff[n] > 0) pull(n, (mu * w) / max((eff[n] * h) / 2, floor), w / h, value);
      }
    }
    if (!isPort && abs(nA) > MIN_PROJECTION) {
      const n = comp.node(nA > 0 ? a : a + 1, b);
      if (eff[n] > 0) {
        const dist = nA > 0 ? comp.segmentMidA(s) - comp.facePlane(a) : comp.facePlane(a + 1) - comp.segmentMidA(s);
        const w = seg.length[s] * abs(nA);
        pull(n, (mu * w) / min(max(dist, floor), h), w / h, value);
      }
    }
  }
  finishOperator(op);
  for (const n of nodes) wall[n] = op.boundary[n] > 0 ? (mu * wall[n]) / op.boundary[n] : 0;
  return { op, wallDistance: wall };

  /**
   * Position along b, in cells from line b = 0, of the middle of node (a, b)'s open part: against the
   * neighbour that exists when only one does, else centred.
   */
  function openCentre(a: number, b: number): number {
    const e = min(eff[comp.node(a, b)], 1);
    const below = effAt(a, b - 1) > 0, above = effAt(a, b + 1) > 0;
    if (below && !above) return b + e / 2;
    if (above && !below) return b + 1 - e / 2;
    return b + 0.5;
  }

  /** Dirichlet closure of node (a, b)'s open edge towards the missing node (a, b + dir); edge in cells. */
  function closeEdge(n: number, a: number, b: number, dir: 1 | -1, edge: number): void {
    const nb = b + dir;
    const plane = comp.facePlane(a);
    const lo = comp.tangentialPlane(nb), hi = lo + h;
    for (const c of [comp.cell(a - 1, nb), comp.cell(a, nb)]) {
      const [s0, s1] = segmentRange(grid, c);
      for (let s = s0; s < s1; s++) {
        const mid = comp.segmentMidB(s);
        if (abs(comp.segmentNormalA(s)) > 0.99 && abs(comp.segmentMidA(s) - plane) < 1e-6 * h && mid > lo && mid < hi) {
          pull(n, mu * edge, edge, grid.segments.port[s] >= 0 ? 0 : slipA[s]);
          return;
        }
      }
    }
    // The end of the open part of the node's face, then the wall segment nearest to it.
    const e = min(eff[n], 1);
    const base = comp.tangentialPlane(b);
    const anchored = effAt(a, b - dir) > 0;
    const end = anchored ? (dir > 0 ? base + e * h : base + h - e * h) : base + h / 2 + (dir * e * h) / 2;
    let nearest = -1, best = Infinity;
    for (const c of [comp.cell(a - 1, b), comp.cell(a, b), comp.cell(a - 1, nb), comp.cell(a, nb)]) {
      const [s0, s1] = segmentRange(grid, c);
      for (let s = s0; s < s1; s++) {
        const d = hypot(comp.segmentMidA(s) - plane, comp.segmentMidB(s) - end);
        if (d < best) {
          best = d;
          nearest = s;
        }
      }
    }
    const isPort = nearest >= 0 && grid.segments.port[nearest] >= 0;
    if (isPort && abs(comp.segmentNormalA(nearest)) >= PORT_TANGENT_SIN) return; // free at an oblique port
    const value = nearest < 0 || isPort ? 0 : slipA[nearest];
    pull(n, (mu * edge * h) / max((e * h) / 2, MIN_WALL_DISTANCE * h), edge, value);
  }

  /** A Dirichlet pull towards `value` with conductance g over a wall of length `cells` (in cells). */
  function pull(n: number, g: number, cells: number, value: number): void {
    op.boundary[n] += g;
    wall[n] += cells;
    rhs[n] += g * value;
  }
}
