/**
 * Flow benchmark (issue 4): the serpentine fixture (five legs, four bends, a pillar row; d = 20 µm, w = 100 µm)
 * at 256, 512 and 1024 cells along its long side. For each grid, after the potential is solved as solveDesign
 * does it:
 *   - the Stokes–Brinkman solve of solver/flow (assembly, multigrid hierarchies, MINRES to 1e-8 in the
 *     preconditioner's norm, as solveDesign runs it): iterations, CPU seconds (set-up and iterations), peak memory;
 *   - the same work units as the potential benchmark: one streaming pass over a five-point operator's arrays
 *     (the potential's Laplace operator on this grid) and one pass over the grid's fraction and apertures.
 * Times are CPU seconds of this single-threaded process (process.cpuUsage): the machine is shared.
 * Memory: bytes of the typed arrays the flow solve holds while iterating (counted), plus the grid's own arrays
 * and the flow's inputs (φ and E per cell); and the growth of process.memoryUsage().arrayBuffers while solving,
 * sampled every iteration after a forced garbage collection (measured); both per grid cell (nx·ny).
 *
 *   npm run bench:flow [-- --sizes 256,512]
 */
import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';
import { flowProblemFromDesign, solveFlow, type FlowProblem } from '../solver/flow';
import type { CutCellGrid } from '../solver/grid/cut-cell-grid';
import { discretiseDesign } from '../solver/grid/discretise';
import { electricField, electrodePieces, laplaceOperator, portConductances, solvePotential } from '../solver/potential';
import { loadFixture } from '../tests/fixtures/designs';
import { cpuSeconds, timeGridPass, timeStreamingPass } from './potential-baselines';

setFlagsFromString('--expose-gc');
const gc = runInNewContext('gc') as () => void;

const args = process.argv.slice(2);
const option = (name: string, fallback: string) => {
  const k = args.indexOf(name);
  return k >= 0 && k + 1 < args.length ? args[k + 1] : fallback;
};
const SIZES = option('--sizes', '256,512,1024').split(',').map(Number);
const TOLERANCE = 1e-8;

const design = loadFixture('serpentine');

function gridBytes(grid: CutCellGrid): number {
  const s = grid.segments;
  return grid.fraction.byteLength + grid.apertureX.byteLength + grid.apertureY.byteLength + grid.cutCells.byteLength +
    grid.cutCentroidX.byteLength + grid.cutCentroidY.byteLength +
    s.cell.byteLength + s.length.byteLength + s.normalX.byteLength + s.normalY.byteLength + s.midX.byteLength +
    s.midY.byteLength + s.port.byteLength + s.zeta.byteLength;
}

interface Row {
  cells: number; nx: number; ny: number; fluid: number;
  iterations: number; seconds: number; setupSeconds: number; runs: number;
  wuSeconds: number; gridPassSeconds: number;
  countedBytes: number; inputBytes: number; gridBytes: number; measuredBytes: number;
  imbalance: number;
}

/** One flow solve, with the CPU time at which the first iteration ended (set-up plus one iteration). */
function timedSolve(problem: FlowProblem, sample?: () => void) {
  const start = cpuSeconds();
  let first = 0;
  const solution = solveFlow(problem, {
    tolerance: TOLERANCE,
    onIteration: (it) => {
      if (it === 1) first = cpuSeconds();
      sample?.();
    },
  });
  const seconds = cpuSeconds() - start;
  const perIteration = solution.iterations > 1 ? (seconds - (first - start)) / (solution.iterations - 1) : 0;
  return { solution, seconds, setupSeconds: first - start - perIteration };
}

function measure(cells: number): Row {
  const disc = discretiseDesign(design, { cells });
  if (!disc.ok) throw new Error(disc.problems.map((p) => p.message).join('; '));
  const grid = disc.grid!, components = disc.components!;
  const n = grid.nx * grid.ny;
  const pot = solvePotential(grid, components, design.ports, design.buffer.conductivity * design.depth, { tolerance: TOLERANCE });
  const field = electricField(grid, pot.active, pot.potential, pot.portPotential);
  const problem = flowProblemFromDesign(design, grid, pot.potential, pot.portPotential, field);

  // Warm the JIT on this grid, then average over solves spanning at least two seconds of CPU time.
  timedSolve(problem);
  let runs = 0, seconds = 0, setupSeconds = 0, iterations = 0, imbalance = 0;
  const t = cpuSeconds();
  while (runs < 2 || (cpuSeconds() - t < 2 && runs < 20)) {
    const r = timedSolve(problem);
    seconds += r.seconds;
    setupSeconds += r.setupSeconds;
    iterations = r.solution.iterations;
    imbalance = r.solution.massImbalance;
    runs++;
  }
  // Memory: ArrayBuffer growth while solving, sampled every iteration. Backing stores of collected buffers are
  // released lazily, so collect until the count settles.
  let base = Infinity;
  for (let k = 0; k < 10; k++) {
    gc();
    const now = process.memoryUsage().arrayBuffers;
    if (now >= base) break;
    base = now;
  }
  let peak = base;
  const sample = () => { peak = Math.max(peak, process.memoryUsage().arrayBuffers); };
  const { solution } = timedSolve(problem, sample);
  sample();

  const pieces = electrodePieces(grid, components, design.ports);
  const op = laplaceOperator(grid, pieces.active, portConductances(grid));
  return {
    cells, nx: grid.nx, ny: grid.ny, fluid: grid.fluidCells,
    iterations, seconds: seconds / runs, setupSeconds: setupSeconds / runs, runs,
    wuSeconds: timeStreamingPass(op, new Float64Array(n).fill(1), new Float64Array(n)),
    gridPassSeconds: timeGridPass(grid.fraction, grid.apertureX, grid.apertureY),
    countedBytes: solution.bytes,
    inputBytes: pot.potential.byteLength + field.x.byteLength + field.y.byteLength,
    gridBytes: gridBytes(grid),
    measuredBytes: peak - base,
    imbalance,
  };
}

function pad(s: string | number, w: number): string {
  return String(s).padStart(w);
}

console.log(`Serpentine flow benchmark (MINRES to ${TOLERANCE} in the preconditioner's norm, CPU seconds of one core).\n`);
const rows: Row[] = [];
for (const cells of SIZES) {
  const r = measure(cells);
  rows.push(r);
  console.log(
    `${cells}: ${r.nx}×${r.ny} grid, ${r.fluid} fluid cells; ${r.iterations} MINRES iterations in ${r.seconds.toFixed(3)} s ` +
      `(set-up ${r.setupSeconds.toFixed(3)} s, ${((r.seconds - r.setupSeconds) / r.iterations * 1e3).toFixed(1)} ms per iteration; mean of ${r.runs}) = ` +
      `${(r.seconds / r.wuSeconds).toFixed(0)} WU (1 WU = ${(r.wuSeconds * 1e3).toFixed(2)} ms), ` +
      `${(r.seconds / r.gridPassSeconds).toFixed(0)} grid passes (${(r.gridPassSeconds * 1e3).toFixed(2)} ms); |ΣQ|/Σ|Q| = ${r.imbalance.toExponential(1)}`,
  );
}
console.log('\n cells |      grid | fluid cells | its | CPU s   | set-up s | WU    | grid passes | B/cell flow | + grid + φ, E | measured | B/fluid cell');
for (const r of rows) {
  const cellsN = r.nx * r.ny;
  const total = r.countedBytes + r.gridBytes + r.inputBytes;
  console.log(
    `${pad(r.cells, 6)} | ${pad(`${r.nx}×${r.ny}`, 9)} | ${pad(r.fluid, 11)} | ${pad(r.iterations, 3)} | ${pad(r.seconds.toFixed(3), 7)} | ` +
      `${pad(r.setupSeconds.toFixed(3), 8)} | ${pad((r.seconds / r.wuSeconds).toFixed(0), 5)} | ${pad((r.seconds / r.gridPassSeconds).toFixed(0), 11)} | ` +
      `${pad((r.countedBytes / cellsN).toFixed(0), 11)} | ${pad((total / cellsN).toFixed(0), 13)} | ${pad(((r.measuredBytes + r.gridBytes + r.inputBytes) / cellsN).toFixed(0), 8)} | ` +
      `${pad((total / r.fluid).toFixed(0), 12)}`,
  );
}
console.log(
  '\nWU: CPU seconds of the flow solve over one streaming pass over the arrays a relaxation sweep of the potential\'s operator\n' +
    'reads (gx, gy, diag, active, x, b; one write), as in the potential benchmark; "grid passes": over one pass reading\n' +
    'fraction, apertureX and apertureY. B/cell: bytes per grid cell (nx·ny); "flow" counts the typed arrays the solve holds\n' +
    'while iterating (operators, hierarchies, the saddle-point vectors), then the grid\'s own arrays and the inputs φ and E are\n' +
    'added; "measured" is the growth of process.memoryUsage().arrayBuffers during the solve (uncollected garbage included) plus\n' +
    'the grid and inputs. Goals (issue 4): iterations flat; 512 cells in < 5 s and 1024 in < 20 s on one core; ≤ 400 bytes per cell.',
);
