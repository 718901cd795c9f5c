/**
 * Preconditioner for the pressure Schur complement S = B A⁻¹ Bᵀ of the Stokes–Brinkman system, after
 * J. Cahouet & J.-P. Chabard, Int. J. Numer. Meth. Fluids 8, 869 (1988) (see also Elman, Silvester &
 * Wathen, Finite Elements and Fast Iterative Solvers, 2nd ed. 2014, ch. 4 and 9). With A = μ L + α M:
 *
 *   S⁻¹ ≈ D_S⁻¹ + P⁻¹,
 *
 * - Stokes part (short waves, S ≈ pressure mass / μ): D_S = diag(B D_L⁻¹ Bᵀ), D_L the viscous part of A's
 *   diagonal (on a full cell this is h²/μ, the pressure mass over μ; on cut cells it follows the actual
 *   coupling instead of dividing by a tiny area);
 * - Darcy part (long waves, S ≈ B (α M)⁻¹ Bᵀ): P = B (α_eff M)⁻¹ Bᵀ with M the velocity control volumes,
 *   the pressure Laplacian with face conductance a h · a h / (α_eff a h²) = a / α_eff and Dirichlet
 *   conductance ℓ/(δ α_eff) at the ports (their pressure is fixed); one multigrid V-cycle stands in for P⁻¹.
 *   Cahouet & Chabard take α_eff = α = 12 μ/d², right for a wide, shallow channel. In a channel narrower
 *   than deep the long pressure waves are resisted by the side walls instead, so here
 *   α_eff = 12 μ/d² + 12 μ/w², with w the open width across the face's line (the run of open faces through
 *   it): the lubrication resistance of both gaps. Without the second term the iteration count grows like
 *   the channel's length over its width once d > w (measured: 170 iterations instead of 40 on a 30:1 channel).
 *
 * Both parts are symmetric positive definite, as MINRES needs.
 */
import type { CutCellGrid } from '../grid/cut-cell-grid';
import { runsOf } from '../grid/fluid-runs';
import { buildHierarchy, cycleFromZero, type Hierarchy } from '../multigrid/cycle';
import { finishOperator, type Operator5 } from '../multigrid/operator';
import type { CellMerging } from './cell-merging';
import type { PortFaces } from './port-faces';
import { openNodes, type Component } from './staggered';

const { min } = Math;

export interface SchurPreconditioner {
  /** z = S̃⁻¹ r on the pressure cells; z must hold finite values (0 in MINRES) off the fluid cells, left as they are. */
  apply(r: Float64Array, z: Float64Array): void;
  poisson: Operator5;
  hierarchy: Hierarchy;
  /** 1 / diag(B D_L⁻¹ Bᵀ) per cell (0 outside). */
  stokesInverse: Float64Array;
}

export interface SchurInput {
  grid: CutCellGrid;
  ports: PortFaces;
  comps: [Component, Component];
  ops: [Operator5, Operator5];
  /** Cells reached by an open face or a port face. */
  fluid: Uint8Array;
  merging: CellMerging;
  /** Cells with a pressure unknown. */
  active: Uint8Array;
  /** 12 μ / d² and μ. */
  alpha: number;
  viscosity: number;
  sweeps: number;
}

export function cahouetChabard(input: SchurInput): SchurPreconditioner {
  const { grid, ports, comps, ops, fluid, merging, active, alpha, viscosity, sweeps } = input;
  const n = grid.nx * grid.ny;
  const h = grid.spacing;
  // Merged small cells stay in this operator; their residual is 0 and their output is dropped, which keeps
  // the preconditioner symmetric positive definite on the remaining cells.
  const poisson: Operator5 = {
    n1: grid.nx,
    n2: grid.ny,
    gx: new Float64Array((grid.nx + 1) * grid.ny),
    gy: new Float64Array(grid.nx * (grid.ny + 1)),
    reaction: new Float64Array(n),
    boundary: new Float64Array(n),
    active: fluid,
    diag: new Float64Array(n),
  };
  // The face arrays of the Poisson operator have the layouts of u and v: fill them with α_eff first.
  const friction = [poisson.gx, poisson.gy];
  const nodes = comps.map((comp) => openNodes(grid, comp));
  for (const comp of comps) lubricationFriction(comp, ports, nodes[comp.axis], h, alpha, viscosity, friction[comp.axis]);
  for (let f = 0; f < ports.count; f++) {
    poisson.boundary[ports.cell[f]] += ports.conductance[f] / friction[ports.axis[f]][ports.node[f]];
  }
  for (const comp of comps) {
    const g = friction[comp.axis];
    const ap = comp.normalAperture;
    // Port-only nodes (closed faces) drop out here: their conductance went to `boundary` above.
    for (const [node] of ports.byNode[comp.axis]) if (!(ap[node] > 0)) g[node] = 0;
    for (const node of nodes[comp.axis]) g[node] = ap[node] / g[node];
  }
  finishOperator(poisson);
  const hierarchy = buildHierarchy(poisson, sweeps, 'extents');
  const stokes = new Float64Array(n);
  for (const comp of comps) {
    const op = ops[comp.axis];
    const ap = comp.normalAperture;
    for (const node of nodes[comp.axis]) {
      const viscous = op.diag[node] - op.reaction[node];
      if (!op.active[node] || !(viscous > 0)) continue;
      const [a, b] = comp.nodeAB(node);
      const bb = (ap[node] * h) ** 2 / viscous;
      stokes[comp.cell(a - 1, b)] += bb;
      stokes[comp.cell(a, b)] += bb;
    }
  }
  for (let f = 0; f < ports.count; f++) {
    const op = ops[ports.axis[f]];
    const node = ports.node[f];
    const viscous = op.diag[node] - op.reaction[node];
    if (!(viscous > 0)) continue;
    const open = comps[ports.axis[f]].normalAperture[node] * h;
    stokes[ports.cell[f]] += ((open + ports.length[f]) ** 2 - open * open) / viscous;
  }
  for (let k = 0; k < merging.cell.length; k++) stokes[merging.into[k]] += stokes[merging.cell[k]];
  const runs = runsOf(active, grid.nx, grid.ny).runs;
  for (let k = 0; k < runs.length; k += 2) {
    for (let c = runs[k], end = runs[k + 1]; c < end; c++) stokes[c] = stokes[c] > 0 ? 1 / stokes[c] : 0;
  }
  for (let k = 0; k < merging.cell.length; k++) stokes[merging.cell[k]] = 0;

  const merged = merging.cell;
  return {
    poisson,
    hierarchy,
    stokesInverse: stokes,
    apply(r, z) {
      cycleFromZero(hierarchy, r, z); // z is 0 off the fluid cells (MINRES's support) and stays so
      for (let k = 0; k < runs.length; k += 2) for (let c = runs[k], end = runs[k + 1]; c < end; c++) z[c] += stokes[c] * r[c];
      for (let k = 0; k < merged.length; k++) z[merged[k]] = 0;
    },
  };
}

/**
 * α_eff = α + 12 μ / w² per node of the component, w the open width of the run of nodes along b through it
 * (Σ ã h, ã = aperture + port length / h, each at most 1); 0 where there is no node.
 */
function lubricationFriction(comp: Component, ports: PortFaces, nodes: Int32Array, h: number, alpha: number, mu: number, out: Float64Array): void {
  const ap = comp.normalAperture;
  out.fill(0);
  for (const node of nodes) out[node] = ap[node];
  const all = [...nodes];
  for (const [node, f] of ports.byNode[comp.axis]) {
    if (!(out[node] > 0)) all.push(node);
    out[node] += ports.length[f] / h;
  }
  // Each run along b is measured from its first node (the one whose b − 1 neighbour has no node), once.
  const at = (a: number, b: number) => (b >= 0 && b < comp.nb ? out[comp.node(a, b)] : 0);
  for (const node of all) {
    const [a, b] = comp.nodeAB(node);
    if (!(a >= 1 && a < comp.cellsA) || at(a, b - 1) > 0) continue;
    let end = b, width = 0;
    while (at(a, end) > 0) width += min(out[comp.node(a, end++)], 1) * h;
    const value = alpha + (12 * mu) / (width * width);
    for (let k = b; k < end; k++) out[comp.node(a, k)] = value;
  }
}
