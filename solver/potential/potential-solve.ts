/**
 * The electric potential of a design on its cut-cell grid (physics.md §2):
 *   laplace(φ) = 0 in the fluid, ∂φ/∂n = 0 on walls, φ = V_k on ports with an electrode,
 *   φ = U_f (unknown, uniform) on floating port f with zero net current.
 *
 * Floating ports by superposition (linearity, physics.md §7): with A the operator in which every
 * port is a Dirichlet boundary (assemble.ts),
 *   φ = φ₀ + Σ_f U_f φ_f,   A φ₀ = b(V, floating ports at 0),   A φ_f = b(port f at 1, others at 0),
 * and the currents into the floating ports vanish:
 *   J_g(φ₀) + Σ_f U_f J_g(φ_f) = 0  for every floating g,
 * a small symmetric positive definite system (the ports' conductance matrix) solved densely.
 * The field is then solved once more with the floating ports at U (no n-vectors kept per port).
 * Each solve is conjugate gradients preconditioned by one multigrid V-cycle on the same hierarchy,
 * to a relative residual ‖b − Aφ‖/‖b‖ ≤ tolerance.
 */
import { Matrix, solve as denseSolve } from 'ml-matrix';
import type { Port } from '../../shared/design';
import type { FluidComponents } from '../grid/components';
import type { CutCellGrid } from '../grid/cut-cell-grid';
import { multigridPcg } from '../multigrid';
import { laplaceOperator, portFluxes, portRightHandSide } from './assemble';
import { electrodePieces, type ElectrodePieces } from './electrode-pieces';
import { portConductances } from './port-conductance';

export interface PotentialOptions {
  /** Relative residual of each linear solve (default 1e-8). */
  tolerance?: number;
  /** Red–black sweeps before and after each coarse correction (default 2). */
  sweeps?: number;
  maxIterations?: number;
  /** Polled once per conjugate-gradient iteration; true stops the solve (PotentialCancelled is thrown). */
  shouldStop?: () => boolean;
  /** Fraction of the linear solves done, in [0, 1]. */
  onProgress?: (fraction: number) => void;
}

export interface PotentialSolution {
  /** φ per cell (V); NaN outside the fluid and in pieces without an electrode. */
  potential: Float64Array;
  /** 1 where φ was solved for. */
  active: Uint8Array;
  /** Port conductance g_s per boundary segment (σ d factored out; 0 on walls). */
  conductance: Float64Array;
  /** Potential of each port (V): the electrode's, the solved one of a floating port, null where undefined. */
  portPotential: Array<number | null>;
  /** Current into the fluid through each port (A), physics.md §2 sign. */
  portCurrent: Float64Array;
  pieces: ElectrodePieces;
  /** Conjugate-gradient iterations summed over the linear solves, and the largest single count. */
  iterations: number;
  maxIterations: number;
  solves: number;
  /** Largest final relative residual over the solves. */
  residual: number;
  converged: boolean;
  levels: number;
}

export class PotentialCancelled extends Error {
  constructor() {
    super('the potential solve was stopped');
  }
}

export function solvePotential(
  grid: CutCellGrid,
  components: FluidComponents,
  ports: ReadonlyArray<Pick<Port, 'potential'>>,
  sigmaDepth: number,
  options: PotentialOptions = {},
): PotentialSolution {
  const n = grid.nx * grid.ny;
  const pieces = electrodePieces(grid, components, ports);
  const { active } = pieces;
  const conductance = portConductances(grid);
  const op = laplaceOperator(grid, active, conductance, pieces);
  const mg = multigridPcg(op, { sweeps: options.sweeps });
  const floating = ports.map((p, k) => (p.potential === null && pieces.portReferenced[k] ? k : -1)).filter((k) => k >= 0);
  const totalSolves = floating.length === 0 ? 1 : floating.length + 2;

  const stats = { iterations: 0, maxIterations: 0, solves: 0, residual: 0, converged: true };
  const b = new Float64Array(n);
  // NaN where φ is not solved for: the solves write the active cells only (zeroGuess).
  const x = new Float64Array(n).fill(NaN);
  const run = (values: ArrayLike<number>) => {
    portRightHandSide(grid, active, conductance, values, b);
    let stopped = false;
    // b is filled again for every solve, so the solver may keep its residual there.
    const result = mg.solve(b, x, {
      zeroGuess: true,
      overwriteRightHandSide: true,
      tolerance: options.tolerance ?? 1e-8,
      maxIterations: options.maxIterations,
      onIteration: () => {
        if (options.shouldStop?.()) {
          stopped = true;
          return false;
        }
        return true;
      },
    });
    if (stopped) throw new PotentialCancelled();
    stats.iterations += result.iterations;
    stats.maxIterations = Math.max(stats.maxIterations, result.iterations);
    stats.residual = Math.max(stats.residual, result.relativeResidual);
    stats.converged &&= result.converged;
    stats.solves++;
    options.onProgress?.(stats.solves / totalSolves);
  };

  // Electrode potentials; floating ports grounded for now.
  const values = new Float64Array(ports.length);
  ports.forEach((p, k) => { values[k] = p.potential ?? 0; });
  run(values);

  if (floating.length > 0) {
    const flux = new Float64Array(ports.length);
    const m = floating.length;
    const rhs = new Matrix(m, 1);
    portFluxes(grid, active, conductance, values, x, flux);
    floating.forEach((k, a) => rhs.set(a, 0, -flux[k]));
    const conductanceMatrix = new Matrix(m, m);
    const unit = new Float64Array(ports.length);
    floating.forEach((f, col) => {
      unit.fill(0);
      unit[f] = 1;
      run(unit);
      portFluxes(grid, active, conductance, unit, x, flux);
      floating.forEach((g, row) => conductanceMatrix.set(row, col, flux[g]));
    });
    const u = denseSolve(conductanceMatrix, rhs);
    floating.forEach((k, a) => { values[k] = u.get(a, 0); });
    run(values);
  }

  const potential = x;
  const portCurrent = portFluxes(grid, active, conductance, values, potential, new Float64Array(ports.length));
  for (let k = 0; k < ports.length; k++) portCurrent[k] *= sigmaDepth;
  const portPotential = ports.map((p, k) => (pieces.portReferenced[k] ? values[k] : p.potential));
  return {
    potential,
    active: op.active,
    conductance,
    portPotential,
    portCurrent,
    pieces,
    ...stats,
    levels: mg.hierarchy.levels.length,
  };
}
