/**
 * solveDesign: the one entry point the command line, the Web Worker and the server call.
 *
 *   design JSON → validated design (shared/design.ts) → cut-cell grid and geometry checks
 *   → electric potential, port currents (solver/potential) → flow (Stokes–Brinkman, solver/flow)
 *   → metrics, validity warnings, probes and per-cell fields.
 *
 * Pure TypeScript: no Node built-ins, so it runs in the browser's worker too. Every refusal is a
 * SolveError with { code, message, field? }; nothing else is thrown on purpose.
 */
import { parseDesign, type DesignDocument, type Point } from '../shared/design';
import { discretiseDesign } from './grid/discretise';
import { fluidRuns } from './grid/fluid-runs';
import { debyeLength, reynolds } from './physics/electrokinetics';
import { electricField } from './potential/gradient';
import { electrodePower, maxPowerPerLength } from './potential/joule';
import { PotentialCancelled, solvePotential } from './potential/potential-solve';
import { asSolveError, geometryRefusal, invalidDesign, SolveError } from './result/errors';
import { rangeErrors } from './result/limits';
import type { FlowInput, FlowOutput } from './result/interim-flow';
import { stokesBrinkmanFlow } from './flow/flow-stage';
import { sampleProbes } from './result/probes';
import type { SolveFields, SolveResult } from './result/types';
import { convergenceWarning, electrodeWarnings, geometryWarnings, physicsWarnings } from './result/warnings';

const { hypot, max } = Math;

export { SolveError } from './result/errors';
export type * from './result/types';
export { resultJson } from './result/types';

export type SolveStage = 'geometry' | 'potential' | 'flow' | 'fields';

export interface SolveProgress {
  stage: SolveStage;
  /** Fraction of the stage done, in [0, 1]. */
  fraction: number;
}

export interface SolveOptions {
  /** Grid cells along the longer side of the layout (--cells N); default: about 10 across the narrowest channel. */
  cells?: number;
  /** Points (m) at which to sample the fields (--probe X,Y). */
  probes?: ReadonlyArray<Point>;
  onProgress?: (progress: SolveProgress) => void;
  /** Polled often; returning true abandons the solve with SolveError code 'cancelled'. */
  shouldStop?: () => boolean;
  /** Relative residual of the linear solves (default 1e-8). */
  tolerance?: number;
}

/** The flow stage: depth-averaged Stokes–Brinkman with Smoluchowski slip (solver/flow). */
const solveFlow: (input: FlowInput) => FlowOutput = stokesBrinkmanFlow;

const DEFAULT_TOLERANCE = 1e-8;

/** Solves a design (any JSON value; it is validated first). Throws SolveError only. */
export function solveDesign(design: unknown, options: SolveOptions = {}): SolveResult {
  try {
    return solveValidated(validated(design), options);
  } catch (error) {
    if (error instanceof PotentialCancelled) throw new SolveError('cancelled', 'The solve was stopped.');
    throw asSolveError(error);
  }
}

function validated(design: unknown): DesignDocument {
  const parsed = parseDesign(design);
  if (!parsed.ok) throw invalidDesign(parsed.errors);
  const outOfRange = rangeErrors(parsed.design);
  if (outOfRange.length > 0) throw invalidDesign(outOfRange);
  return parsed.design;
}

function checkOptions(options: SolveOptions): void {
  const { cells, probes, tolerance } = options;
  if (cells !== undefined && !(Number.isInteger(cells) && cells >= 1)) {
    throw new SolveError('invalid-option', `cells must be a positive whole number, not ${String(cells)}`, { field: 'cells' });
  }
  probes?.forEach((p, k) => {
    if (!(Array.isArray(p) && p.length === 2 && Number.isFinite(p[0]) && Number.isFinite(p[1]))) {
      throw new SolveError('invalid-option', `probe ${k + 1} must be two finite numbers (x, y in metres)`, { field: 'probes' });
    }
  });
  if (tolerance !== undefined && !(tolerance > 0 && tolerance < 1)) {
    throw new SolveError('invalid-option', 'tolerance must be between 0 and 1', { field: 'tolerance' });
  }
}

function solveValidated(design: DesignDocument, options: SolveOptions): SolveResult {
  checkOptions(options);
  const started = now();
  const progress = (stage: SolveStage, fraction: number) => options.onProgress?.({ stage, fraction });
  const stopIfAsked = () => {
    if (options.shouldStop?.()) throw new SolveError('cancelled', 'The solve was stopped.');
  };
  const tolerance = options.tolerance ?? DEFAULT_TOLERANCE;

  // Geometry.
  progress('geometry', 0);
  const disc = discretiseDesign(design, { cells: options.cells });
  if (!disc.ok || !disc.grid || !disc.components || !disc.region || !disc.choice) throw geometryRefusal(disc.problems);
  const { grid, components, region, choice } = disc;
  progress('geometry', 1);
  stopIfAsked();

  // Potential.
  const { conductivity: sigma } = design.buffer;
  const potentialStart = now();
  const pot = solvePotential(grid, components, design.ports, sigma * design.depth, {
    tolerance,
    shouldStop: options.shouldStop,
    onProgress: (f) => progress('potential', f),
  });
  const field = electricField(grid, pot.active, pot.potential, pot.portPotential);
  const potentialSeconds = (now() - potentialStart) / 1000;
  stopIfAsked();

  // Flow.
  progress('flow', 0);
  const flowStart = now();
  const [xmin, ymin, xmax, ymax] = region.bounds;
  const narrowest = disc.widths?.narrowest?.width ?? Math.min(xmax - xmin, ymax - ymin);
  const flow = solveFlow({
    design, grid, active: pot.active, potential: pot.potential, field, portCurrent: pot.portCurrent, shouldStop: options.shouldStop,
    portPotential: pot.portPotential, tolerance, onProgress: (f) => progress('flow', f), narrowestWidth: narrowest,
  });
  const flowSeconds = (now() - flowStart) / 1000;
  progress('flow', 1);
  stopIfAsked();

  // Fields, metrics, warnings, probes.
  progress('fields', 0);
  const n = grid.nx * grid.ny;
  const fraction = Float32Array.from(grid.fraction);
  // NaN outside the fluid; the fluid cells visited run by run (a layout may fill a few per cent of its box).
  const potential = new Float32Array(n).fill(NaN);
  const fieldX = new Float32Array(n).fill(NaN), fieldY = new Float32Array(n).fill(NaN);
  let maxField = 0, maxSpeed = 0;
  const { runs } = fluidRuns(grid);
  for (let k = 0; k < runs.length; k += 2) {
    const from = runs[k], to = runs[k + 1];
    potential.set(pot.potential.subarray(from, to), from);
    fieldX.set(field.x.subarray(from, to), from);
    fieldY.set(field.y.subarray(from, to), from);
    for (let c = from; c < to; c++) {
      maxField = max(maxField, hypot(field.x[c], field.y[c]));
      const speed = hypot(flow.velocityX[c], flow.velocityY[c]);
      if (speed > maxSpeed) maxSpeed = speed;
    }
  }
  const fields: SolveFields = {
    nx: grid.nx, ny: grid.ny, spacing: grid.spacing, x0: grid.x0, y0: grid.y0,
    fraction, potential, fieldX, fieldY,
    velocityX: flow.velocityX, velocityY: flow.velocityY, pressure: flow.pressure,
    vorticity: flow.vorticity, streamfunction: flow.streamfunction,
  };

  const { buffer } = design;
  const lambda = debyeLength(buffer.relativePermittivity, buffer.temperature, buffer.ionicStrength);
  const re = reynolds(buffer.density, maxSpeed, narrowest, design.depth, buffer.viscosity);
  const portVoltages = pot.portPotential.filter((v): v is number => v !== null).map(Math.abs);
  const warnings = [
    ...geometryWarnings(disc.problems),
    ...electrodeWarnings(design, grid, pot.pieces),
    ...physicsWarnings({
      debyeLength: lambda,
      narrowestWidth: narrowest,
      depth: design.depth,
      reynolds: re,
      powerPerLength: maxPowerPerLength(grid, pot.active, pot.potential, field, sigma, design.depth),
      maxPortVoltage: portVoltages.length > 0 ? Math.max(...portVoltages) : 0,
      cellsAcrossNarrowest: choice.cellsAcross,
    }, disc.problems),
    ...convergenceWarning('potential', pot.residual, tolerance),
    ...flow.warnings,
  ];

  const probes = sampleProbes(options.probes ?? [], { grid, region, potential: pot.potential, fields });
  progress('fields', 1);
  return {
    grid: { nx: grid.nx, ny: grid.ny, spacing: grid.spacing, fluidCells: grid.fluidCells },
    ports: design.ports.map((p, k) => ({
      id: p.id,
      potential: pot.portPotential[k],
      current: pot.portCurrent[k],
      flowRate: flow.portFlowRate[k],
      ...finite('meanSpeed', flow.portMeanSpeed?.[k]),
    })),
    probes,
    metrics: {
      joulePower: electrodePower(pot.portPotential, pot.portCurrent),
      maxField,
      maxSpeed,
      debyeLength: lambda,
      reynolds: re,
      ...finite('maxWallShearRate', flow.maxWallShearRate),
    },
    warnings,
    solver: {
      potentialIterations: pot.iterations,
      potentialSeconds,
      flowIterations: flow.iterations,
      flowSeconds,
      residual: Math.max(pot.residual, flow.residual),
      seconds: (now() - started) / 1000,
    },
    fields,
  };
}

/** { [key]: value } for a finite value, else nothing: derived figures a flow stage may not give stay absent. */
function finite<K extends string>(key: K, value: number | undefined): { [P in K]?: number } {
  return value !== undefined && Number.isFinite(value) ? ({ [key]: value } as { [P in K]?: number }) : {};
}

function now(): number {
  return typeof performance !== 'undefined' ? performance.now() : Date.now();
}
