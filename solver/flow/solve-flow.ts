/**
 * The depth-averaged Stokes–Brinkman flow with Smoluchowski slip (physics.md §3) on the cut-cell grid:
 * assemble the staggered momentum operators (momentum.ts), the divergence (divergence.ts) and the port faces
 * (port-faces.ts), then solve the symmetric saddle-point system by preconditioned MINRES (minres.ts) with the
 * block-diagonal preconditioner of saddle-point.ts: one V-cycle per velocity component and the
 * Cahouet–Chabard Schur approximation (schur.ts). Iteration counts do not grow with the resolution and stay
 * bounded from Hele-Shaw (d ≪ w) to Stokes (d ≫ w) (Elman, Silvester & Wathen 2014, ch. 4 and 9).
 */
import { buildHierarchy, type Hierarchy } from '../multigrid/cycle';
import { operatorBytes, type Operator5 } from '../multigrid/operator';
import { mergedCouplings, mergeSmallCells } from './cell-merging';
import { cellFieldFromFaces, faceField, wallSlip } from './face-field';
import { depthFriction, type FlowProblem } from './flow-problem';
import { minres } from './minres';
import { assembleMomentum } from './momentum';
import { portFaces, type PortFaces } from './port-faces';
import { portFlowRates } from './port-flow';
import { applySaddlePoint, blocks, preconditionSaddlePoint, saddlePointSystem } from './saddle-point';
import { cahouetChabard } from './schur';
import { components, openNodes, type Component } from './staggered';

export interface FlowOptions {
  /** MINRES stops at ‖r‖_{M⁻¹} / ‖b‖_{M⁻¹} ≤ tolerance (default 1e-9). */
  tolerance?: number;
  maxIterations?: number;
  /** Red–black sweeps before and after each coarse correction in every V-cycle (default 2). */
  sweeps?: number;
  /** Polled once per iteration; true stops the solve (FlowCancelled is thrown). */
  shouldStop?: () => boolean;
  /** Called after each iteration. */
  onIteration?: (iteration: number, relativeResidual: number) => void;
}

export interface FlowSolution {
  /** x-velocity on the vertical faces, apertureX layout ((nx+1)·ny), m/s; 0 on closed faces. */
  u: Float64Array;
  /** y-velocity on the horizontal faces, apertureY layout (nx·(ny+1)), m/s. */
  v: Float64Array;
  /** Gauge pressure per cell (Pa); NaN outside the fluid. */
  pressure: Float64Array;
  /** Flow rate into the fluid through each port (m³/s), indexed like design.ports. */
  portFlowRate: Float64Array;
  ports: PortFaces;
  /** Velocity of every boundary segment (m/s): HS slip on walls, 0 on ports. */
  slip: { x: Float64Array; y: Float64Array };
  iterations: number;
  /** Final relative residual of MINRES in the preconditioner's norm. */
  residual: number;
  converged: boolean;
  /** |Σ_k Q_k| / Σ_k |Q_k| (0 when nothing flows): the discrete mass balance, at the solver's residual. */
  massImbalance: number;
  /** Bytes of the typed arrays the solve holds while iterating (operators, hierarchies, Krylov vectors). */
  bytes: number;
  seconds: number;
}

export class FlowCancelled extends Error {
  constructor() {
    super('the flow solve was cancelled');
    this.name = 'FlowCancelled';
  }
}

export function solveFlow(problem: FlowProblem, options: FlowOptions = {}): FlowSolution {
  const start = globalThis.performance.now();
  const { grid } = problem;
  const sweeps = options.sweeps ?? 2;
  const comps = components(grid);
  const ports = portFaces(problem, comps);
  const slip = wallSlip(problem, problem.cellField ?? cellFieldFromFaces(grid, problem.potential));

  const nu = comps[0].n1 * comps[0].n2, nv = comps[1].n1 * comps[1].n2, np = grid.nx * grid.ny;
  const b = new Float64Array(nu + nv + np);
  const rhs = [b.subarray(0, nu), b.subarray(nu, nu + nv)];
  const momentum = comps.map((comp) => {
    const faceE = faceField(grid, comp, problem.potential, new Float64Array(comp.n1 * comp.n2));
    return assembleMomentum(problem, comp, ports, faceE, comp.axis === 0 ? slip.x : slip.y, rhs[comp.axis]);
  });
  const ops = momentum.map((m) => m.op) as [Operator5, Operator5];

  const fluid = pressureCells(problem, comps, ports);
  const merging = mergeSmallCells(grid);
  const pressureActive = fluid.slice();
  for (const t of merging.cell) pressureActive[t] = 0;
  const sys = saddlePointSystem(grid, ports, ops, mergedCouplings(grid, merging, ports), pressureActive);
  const schur = cahouetChabard({
    grid, ports, comps, ops, fluid, merging, active: pressureActive,
    alpha: depthFriction(problem), viscosity: problem.viscosity, sweeps,
  });
  const velocity = momentum.map((m) => buildHierarchy(m.op, sweeps, 'extents', m.wallDistance)) as [Hierarchy, Hierarchy];
  for (const h of [...velocity, schur.hierarchy]) releaseAssemblyArrays(h);

  const x = new Float64Array(sys.size);
  const bytes = hierarchyBytes(velocity[0]) + hierarchyBytes(velocity[1]) + hierarchyBytes(schur.hierarchy) +
    schur.stokesInverse.byteLength +
    6 * x.byteLength + 2 * pressureActive.byteLength;

  const result = minres(
    (z, out, beta) => applySaddlePoint(sys, z, out, beta),
    (r, z) => preconditionSaddlePoint(sys, velocity, schur, r, z),
    b,
    x,
    {
      tolerance: options.tolerance ?? 1e-9,
      maxIterations: options.maxIterations ?? 500,
      support: sys.support,
      onIteration: (it, rel) => {
        options.onIteration?.(it, rel);
        if (options.shouldStop?.()) throw new FlowCancelled();
      },
    },
  );

  // The solution vector itself holds u, v and p: no copies.
  const [u, v, pressure] = blocks(sys, x);
  merging.cell.forEach((t, k) => { pressure[t] = pressure[merging.into[k]]; });
  for (let c = 0; c < np; c++) if (!pressureActive[c] && !fluid[c]) pressure[c] = Number.NaN;
  const portFlowRate = portFlowRates(ports, u, v, problem.depth, problem.portPressure.length);
  let net = 0, total = 0;
  for (const q of portFlowRate) {
    net += q;
    total += Math.abs(q);
  }
  return {
    u,
    v,
    pressure,
    portFlowRate,
    ports,
    slip,
    iterations: result.iterations,
    residual: result.relativeResidual,
    converged: result.converged,
    massImbalance: total > 0 ? Math.abs(net) / total : 0,
    bytes,
    seconds: (globalThis.performance.now() - start) / 1000,
  };
}

/** Cells with fluid that some open face or port face reaches. */
function pressureCells(problem: FlowProblem, comps: [Component, Component], ports: PortFaces): Uint8Array {
  const { grid } = problem;
  const active = new Uint8Array(grid.nx * grid.ny);
  for (const comp of comps) {
    for (const node of openNodes(grid, comp)) {
      const [a, b] = comp.nodeAB(node);
      active[comp.cell(a - 1, b)] = active[comp.cell(a, b)] = 1;
    }
  }
  for (let f = 0; f < ports.count; f++) active[ports.cell[f]] = 1;
  return active;
}

/**
 * After the hierarchy is built the cycles read only gx, gy, diag and active (and the coarsest factor): the
 * reaction and boundary arrays served the assembly and the coarsening, and go.
 */
function releaseAssemblyArrays(h: Hierarchy): void {
  for (const op of h.levels) {
    op.reaction = new Float64Array(0);
    op.boundary = new Float64Array(0);
  }
}

function hierarchyBytes(h: Hierarchy): number {
  let n = 0;
  for (const op of h.levels) n += operatorBytes(op);
  for (const list of [h.b, h.x]) for (const a of list) n += a.byteLength;
  const coarsest = h.coarsest as { unknowns?: number; bandwidth?: number };
  if (coarsest.unknowns !== undefined && coarsest.bandwidth !== undefined) n += coarsest.unknowns * (coarsest.bandwidth + 2) * 8;
  return n;
}
