/**
 * Helpers for the flow verification tests: a design on its grid, a small Laplace solve for the potential
 * (aperture-weighted five-point fluxes, ports as Dirichlet faces at the centroid distance, as physics.md §2
 * and §7 prescribe), and the flow solve on top.
 */
import type { DesignDocument } from '../../shared/design';
import { discretiseDesign } from '../../solver/grid/discretise';
import type { CutCellGrid } from '../../solver/grid/cut-cell-grid';
import { flowProblemFromDesign, type FlowProblem } from '../../solver/flow/flow-problem';
import { portDistance } from '../../solver/flow/port-faces';
import { solveFlow, type FlowOptions, type FlowSolution } from '../../solver/flow/solve-flow';
import { finishOperator, type Operator5 } from '../../solver/multigrid/operator';
import { solveMultigridPcg } from '../../solver/multigrid';

export function gridOf(design: DesignDocument, cells: number): CutCellGrid {
  const d = discretiseDesign(design, { cells });
  if (!d.grid) throw new Error(`no grid: ${d.problems.map((p) => p.message).join('; ')}`);
  const errors = d.problems.filter((p) => p.severity === 'error');
  if (errors.length > 0) throw new Error(`design has errors: ${errors.map((p) => p.message).join('; ')}`);
  return d.grid;
}

/** φ per cell with every port that has a potential held at it (NaN outside the fluid). */
export function laplacePotential(design: DesignDocument, grid: CutCellGrid): Float64Array {
  const n = grid.nx * grid.ny;
  const active = new Uint8Array(n);
  for (let c = 0; c < n; c++) active[c] = grid.fraction[c] > 0 ? 1 : 0;
  const op: Operator5 = {
    n1: grid.nx, n2: grid.ny, gx: grid.apertureX.slice(), gy: grid.apertureY.slice(),
    reaction: new Float64Array(n), boundary: new Float64Array(n), active, diag: new Float64Array(n),
  };
  const b = new Float64Array(n);
  const seg = grid.segments;
  for (let s = 0; s < seg.count; s++) {
    const k = seg.port[s];
    const v = k >= 0 ? design.ports[k].potential : null;
    if (v === null) continue;
    const g = seg.length[s] / portDistance(grid, s);
    op.boundary[seg.cell[s]] += g;
    b[seg.cell[s]] += g * v;
  }
  finishOperator(op);
  const phi = new Float64Array(n);
  const res = solveMultigridPcg(op, b, phi, { tolerance: 1e-12, maxIterations: 500 });
  if (!res.converged) throw new Error('potential did not converge');
  for (let c = 0; c < n; c++) if (!active[c]) phi[c] = Number.NaN;
  return phi;
}

export interface FlowRun {
  design: DesignDocument;
  grid: CutCellGrid;
  problem: FlowProblem;
  solution: FlowSolution;
}

export function runFlow(design: DesignDocument, cells: number, options: FlowOptions = {}): FlowRun {
  const grid = gridOf(design, cells);
  const potential = laplacePotential(design, grid);
  const problem = flowProblemFromDesign(design, grid, potential, design.ports.map((p) => p.potential));
  return { design, grid, problem, solution: solveFlow(problem, options) };
}

/** u at the vertical face nearest (x, y) and its face-centre y, for profiles across a horizontal channel. */
export function uAtFace(run: FlowRun, x: number, y: number): number {
  const { grid } = run;
  const i = Math.round((x - grid.x0) / grid.spacing);
  const j = Math.floor((y - grid.y0) / grid.spacing);
  return run.solution.u[i + j * (grid.nx + 1)];
}

/** Least-squares slope of order p: error ∝ h^p from (h, error) pairs. */
export function convergenceOrder(h: number[], err: number[]): number {
  const n = h.length;
  const lx = h.map(Math.log), ly = err.map(Math.log);
  const mx = lx.reduce((s, v) => s + v, 0) / n, my = ly.reduce((s, v) => s + v, 0) / n;
  let num = 0, den = 0;
  for (let k = 0; k < n; k++) {
    num += (lx[k] - mx) * (ly[k] - my);
    den += (lx[k] - mx) ** 2;
  }
  return num / den;
}
