/**
 * Potential benchmark (issue 3): the serpentine fixture (five legs, four bends, a pillar row) at
 * 256, 512, 1024 and 2048 cells along its long side. For each grid:
 *   - the multigrid-preconditioned CG solve of solvePotential to a relative residual of 1e-8:
 *     iterations, seconds, peak memory;
 *   - a streaming pass over the operator's arrays (the work unit, WU) and the solve in WU, with the share of
 *     its set-up (electrode pieces, operator, multigrid hierarchy) timed on its own;
 *   - SOR with Young's optimal ω (from the Jacobi spectral radius) on the same operator and
 *     right-hand side, capped in time and extrapolated from its observed rate when capped.
 * Times are CPU seconds of this single-threaded process (process.cpuUsage): the machine is shared,
 * and wall time would mostly measure the neighbours. Solve times are means over repeated solves after a warm-up.
 * Memory: the bytes of every typed array the solve allocates (counted), and the growth of V8's
 * ArrayBuffer memory over the grid's own arrays while solving (process.memoryUsage().arrayBuffers,
 * sampled every CG iteration after a forced garbage collection), both per grid cell (nx·ny).
 *
 *   npm run bench:potential [-- --sor-seconds 20] [-- --sizes 256,512]
 */
import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';
import { discretiseDesign } from '../solver/grid/discretise';
import type { CutCellGrid } from '../solver/grid/cut-cell-grid';
import { multigridPcg, operatorBytes } from '../solver/multigrid';
import { electrodePieces, laplaceOperator, portConductances, portRightHandSide, solvePotential } from '../solver/potential';
import { loadFixture } from '../tests/fixtures/designs';
import { cpuSeconds, jacobiSpectralRadius, optimalOmega, runSor, timeGridPass, timeStreamingPass } from './potential-baselines';

setFlagsFromString('--expose-gc');
const gc = runInNewContext('gc') as () => void;

const args = process.argv.slice(2);
const option = (name: string, fallback: string) => {
  const k = args.indexOf(name);
  return k >= 0 && k + 1 < args.length ? args[k + 1] : fallback;
};
const SIZES = option('--sizes', '256,512,1024,2048').split(',').map(Number);
const SOR_SECONDS = Number(option('--sor-seconds', '20'));
const TOLERANCE = 1e-8;

const design = loadFixture('serpentine');

function gridBytes(grid: CutCellGrid): number {
  const s = grid.segments;
  return grid.fraction.byteLength + grid.apertureX.byteLength + grid.apertureY.byteLength + grid.cutCells.byteLength +
    grid.cutCentroidX.byteLength + grid.cutCentroidY.byteLength +
    s.cell.byteLength + s.length.byteLength + s.normalX.byteLength + s.normalY.byteLength + s.midX.byteLength +
    s.midY.byteLength + s.port.byteLength + s.zeta.byteLength;
}

/** Bytes of the typed arrays solvePotential allocates, counted by building the same objects. */
function solverBytes(grid: CutCellGrid, active: Uint8Array): number {
  const conductance = portConductances(grid);
  const op = laplaceOperator(grid, active, conductance);
  const mg = multigridPcg(op);
  const n = grid.nx * grid.ny;
  let bytes = conductance.byteLength + active.byteLength; // pieces.active is kept, the operator holds a copy
  for (const level of mg.hierarchy.levels) {
    // The finest level's faces are the grid's apertures when every fluid cell is active (counted with the grid).
    const shared = level.gx === grid.apertureX;
    bytes += operatorBytes(level) - (shared ? level.gx.byteLength + level.gy.byteLength : 0);
  }
  for (const arrays of [mg.hierarchy.b, mg.hierarchy.x]) for (const a of arrays) bytes += a.byteLength;
  const c = mg.hierarchy.coarsest;
  bytes += c.unknowns * (c.bandwidth + 2) * 8;
  bytes += 4 * n * 8; // b (then the residual), x (the solution) and CG's p and q (q also holds z)
  bytes += n * 4; // the component labels the pieces are read from (kept by the discretisation)
  return bytes;
}

interface Row {
  cells: number; nx: number; ny: number; fluid: number; discretiseS: number;
  iterations: number; levels: number; seconds: number; setupSeconds: number; wu: number; wuSeconds: number; wuGrid: number; gridPassSeconds: number;
  countedBytes: number; measuredBytes: number; gridBytes: number;
  rhoJ: number; omega: number; sor: ReturnType<typeof runSor>;
}

function measure(cells: number): Row {
  let t = cpuSeconds();
  const disc = discretiseDesign(design, { cells });
  const discretiseS = cpuSeconds() - t;
  if (!disc.ok) throw new Error(disc.problems.map((p) => p.message).join('; '));
  const grid = disc.grid!, components = disc.components!;
  const n = grid.nx * grid.ny;
  const sigmaDepth = design.buffer.conductivity * design.depth;

  // Warm the JIT on this grid, then average over solves spanning at least a second of CPU time.
  solvePotential(grid, components, design.ports, sigmaDepth, { tolerance: TOLERANCE });
  let iterations = 0, levels = 0, runs = 0;
  t = cpuSeconds();
  while (runs < 3 || (cpuSeconds() - t < 1 && runs < 50)) {
    const sol = solvePotential(grid, components, design.ports, sigmaDepth, { tolerance: TOLERANCE });
    iterations = sol.iterations;
    levels = sol.levels;
    runs++;
  }
  const seconds = (cpuSeconds() - t) / runs;
  // The set-up alone, as solvePotential makes it.
  let setups = 0;
  t = cpuSeconds();
  while (setups < 3 || (cpuSeconds() - t < 0.5 && setups < 100)) {
    const pieces = electrodePieces(grid, components, design.ports);
    multigridPcg(laplaceOperator(grid, pieces.active, portConductances(grid), pieces));
    setups++;
  }
  const setupSeconds = (cpuSeconds() - t) / setups;
  // Memory: ArrayBuffer growth while solving, sampled every iteration.
  gc();
  const base = process.memoryUsage().arrayBuffers;
  let peak = base;
  const sample = () => { peak = Math.max(peak, process.memoryUsage().arrayBuffers); return false; };
  const sol = solvePotential(grid, components, design.ports, sigmaDepth, { tolerance: TOLERANCE, shouldStop: sample });
  sample();
  const measuredBytes = peak - base;
  const countedBytes = solverBytes(grid, sol.active);

  // Baselines on the same operator and right-hand side.
  const pieces = electrodePieces(grid, components, design.ports);
  const conductance = portConductances(grid);
  const op = laplaceOperator(grid, pieces.active, conductance);
  const b = portRightHandSide(grid, pieces.active, conductance, design.ports.map((p) => p.potential ?? 0), new Float64Array(n));
  const wuSeconds = timeStreamingPass(op, new Float64Array(n).fill(1), b);
  const gridPassSeconds = timeGridPass(grid.fraction, grid.apertureX, grid.apertureY);
  const rhoJ = jacobiSpectralRadius(op);
  const omega = optimalOmega(rhoJ);
  const sor = runSor(op, b, omega, TOLERANCE, SOR_SECONDS);
  return {
    cells, nx: grid.nx, ny: grid.ny, fluid: grid.fluidCells, discretiseS, iterations, levels, seconds, setupSeconds,
    wu: seconds / wuSeconds, wuSeconds, wuGrid: seconds / gridPassSeconds, gridPassSeconds, countedBytes, measuredBytes, gridBytes: gridBytes(grid), rhoJ, omega, sor,
  };
}

function pad(s: string | number, w: number): string {
  return String(s).padStart(w);
}

const rows: Row[] = [];
console.log(
  `Serpentine potential benchmark (relative residual ${TOLERANCE}); SOR capped at ${SOR_SECONDS} s per grid.\n` +
    'Work unit (WU): the CPU time of one streaming pass over the whole nx·ny box reading the six arrays a relaxation\n' +
    'sweep reads (gx, gy, diag, active, x, b) and writing one, measured in this process on each grid.\n',
);
for (const cells of SIZES) {
  const row = measure(cells);
  rows.push(row);
  const s = row.sor;
  console.log(
    `${cells}: ${row.nx}×${row.ny} grid, ${row.fluid} fluid cells, discretised in ${row.discretiseS.toFixed(2)} s; ` +
      `MG-PCG ${row.iterations} iterations (${row.levels} levels) in ${row.seconds.toFixed(3)} s = ${row.wu.toFixed(1)} WU, ` +
      `of which set-up ${(row.setupSeconds / row.wuSeconds).toFixed(1)} WU ` +
      `(1 WU = ${(row.wuSeconds * 1e3).toFixed(2)} ms; ${row.wuGrid.toFixed(1)} passes over the grid's three arrays of ${(row.gridPassSeconds * 1e3).toFixed(2)} ms); ρ_J = 1 − ${(1 - row.rhoJ).toExponential(3)}, ω = ${row.omega.toFixed(5)}; ` +
      `SOR ${s.sweeps} sweeps in ${s.seconds.toFixed(1)} s to ${s.residual.toExponential(1)}` +
      (s.converged ? ' (converged)' : `, rate ${s.observedRate.toFixed(6)}/sweep (ω − 1 = ${(row.omega - 1).toFixed(6)}) → ${Math.round(s.sweepsNeeded)} sweeps, ${s.secondsNeeded.toFixed(0)} s extrapolated`),
  );
}

console.log('\n cells |      grid | fluid cells | MG its | MG s    | MG WU | grid passes | SOR sweeps   | SOR s        | SOR/MG | B/cell counted | B/cell measured | of which grid');
for (const r of rows) {
  const mark = r.sor.converged ? ' ' : '*';
  console.log(
    `${pad(r.cells, 6)} | ${pad(`${r.nx}×${r.ny}`, 9)} | ${pad(r.fluid, 11)} | ${pad(r.iterations, 6)} | ${pad(r.seconds.toFixed(3), 7)} | ` +
      `${pad(r.wu.toFixed(1), 5)} | ${pad(r.wuGrid.toFixed(1), 11)} | ${pad(Math.round(r.sor.sweepsNeeded) + mark, 12)} | ${pad(r.sor.secondsNeeded.toFixed(1) + mark, 12)} | ` +
      `${pad((r.sor.secondsNeeded / r.seconds).toFixed(0) + mark, 6)} | ${pad(((r.countedBytes + r.gridBytes) / (r.nx * r.ny)).toFixed(0), 14)} | ` +
      `${pad(((r.measuredBytes + r.gridBytes) / (r.nx * r.ny)).toFixed(0), 15)} | ${pad((r.gridBytes / (r.nx * r.ny)).toFixed(0), 13)}`,
  );
}
console.log(
  '\n* SOR stopped at the time cap; sweeps and seconds extrapolated to 1e-8 from the residual rate over the last quarter of its run.\n' +
    'WU: CPU seconds of the whole solve (electrode pieces, assembly, hierarchy, CG, port currents) over those of one\n' +
    'streaming pass over the box reading the arrays a sweep reads (gx, gy, diag, active, x, b; one write); "grid passes":\n' +
    'the same over one pass reading fraction, apertureX and apertureY.\n' +
    'B/cell: bytes per grid cell (nx·ny) at peak, the grid\'s own arrays included; "counted" sums the typed arrays the solve\n' +
    'allocates, "measured" is the growth of process.memoryUsage().arrayBuffers during the solve (garbage not yet collected included).\n' +
    'Goals (issue 3): iterations ≤ 15 and flat; 1024 cells in ≤ 60 WU and ≥ 30× faster than SOR; ≤ 200 bytes per cell.',
);
