/**
 * What a solve returns (the result of design-format.md, plus per-cell fields for the UI). Shared: the solver
 * produces it (solver/result/types.ts re-exports this file), the app and the server read it.
 * SI units; signs as in physics.md: currents and flow rates are positive INTO the fluid.
 */
import type { Point } from './design';

export interface GridSummary {
  nx: number;
  ny: number;
  /** Cell edge (m). */
  spacing: number;
  /** Cells holding any fluid. */
  fluidCells: number;
}

export interface PortResult {
  id: string;
  /** V: the electrode's potential, the solved potential of a floating port, or null where no electrode fixes it. */
  potential: number | null;
  /** A, positive when current enters the fluid through the port. */
  current: number;
  /** m³/s, positive when liquid enters the fluid through the port. */
  flowRate: number;
  /**
   * m/s: mean speed in the channel leg the port feeds, |flowRate| / (port width × depth); never negative.
   * Added field: absent from results written before it (stored runs), and from superposed sweep points.
   */
  meanSpeed?: number;
}

/** A probe outside the fluid has inside: false and no values; a value that was not computed is null. */
export interface ProbeResult {
  at: Point;
  inside: boolean;
  potential?: number | null;
  /** E (V/m). */
  field?: [number, number];
  /** Depth-averaged velocity (m/s). */
  velocity?: [number, number];
  /** 1/s. */
  vorticity?: number | null;
  /** Pa (gauge). */
  pressure?: number | null;
}

export interface SolveMetrics {
  /** W: Σ_k V_k I_k. */
  joulePower: number;
  /** V/m: largest |E| over the fluid cells. */
  maxField: number;
  /** m/s: largest |u| over the fluid cells. */
  maxSpeed: number;
  /** m. */
  debyeLength: number;
  /** ρ U_max D_h / μ with D_h of the narrowest channel. */
  reynolds: number;
  /**
   * 1/s: largest in-plane shear rate at the side walls, |(u_cell − u_wall)·t| / δ with δ the distance from the
   * wall cell's fluid centroid to the wall (solver/flow/flow-metrics.ts). Added field: absent from results
   * written before it (stored runs).
   */
  maxWallShearRate?: number;
}

export interface SolveWarning {
  code: string;
  message: string;
  /** Where to point on the drawing (m), when the warning has a place (not in the command line's JSON). */
  at?: Point;
}

export interface SolverStats {
  /** Conjugate-gradient iterations of the potential, summed over its linear solves (1, or 2 + floating ports). */
  potentialIterations: number;
  potentialSeconds: number;
  flowIterations: number;
  flowSeconds: number;
  /** Largest final relative residual of the linear solves. */
  residual: number;
  /** Whole solve, geometry included. */
  seconds: number;
}

/**
 * Per-cell fields for drawing: cell (i, j) is index i + j·nx and covers
 * [x0 + i·spacing, x0 + (i+1)·spacing] × [y0 + j·spacing, y0 + (j+1)·spacing].
 * NaN outside the fluid (fraction 0), and where a value is undefined (the potential of a piece of
 * fluid without an electrode; the pressure while no flow solver computes it).
 * Values are those at the cell's fluid centroid.
 */
export interface SolveFields {
  nx: number;
  ny: number;
  spacing: number;
  x0: number;
  y0: number;
  /** Fluid area of each cell / spacing², in [0, 1]. */
  fraction: Float32Array;
  potential: Float32Array;
  fieldX: Float32Array;
  fieldY: Float32Array;
  velocityX: Float32Array;
  velocityY: Float32Array;
  pressure: Float32Array;
  vorticity: Float32Array;
  streamfunction: Float32Array;
}

export interface SolveResult {
  grid: GridSummary;
  ports: PortResult[];
  probes: ProbeResult[];
  metrics: SolveMetrics;
  warnings: SolveWarning[];
  solver: SolverStats;
  fields: SolveFields;
}

/** The command line's JSON: the result without the fields, warnings as { code, message }. */
export type SolveResultJson = Omit<SolveResult, 'fields' | 'warnings'> & { warnings: Array<{ code: string; message: string }> };

export function resultJson(result: SolveResult): SolveResultJson {
  const { fields: _fields, warnings, ...rest } = result;
  return { ...rest, warnings: warnings.map((w) => ({ code: w.code, message: w.message })) };
}
