/**
 * Demo-design benchmark (issue 6: each demo design solves in the browser in under 2 s at the default resolution).
 * For the four demo designs of server/seed/designs.ts, solveDesign at its default resolution, timed by stage from
 * its progress events (CPU seconds of this process, process.cpuUsage: the machine is shared):
 *
 *   geometry   shapes → fluid region → channel widths → grid choice → cut cells → components → checks;
 *   potential  the potential solve and the cell field;
 *   flow       the flow stage: set-up (assembly, hierarchies), MINRES iterations, derived fields and metrics;
 *   fields     the per-cell result arrays, warnings, probes.
 *
 * The first solve of each design in this process is "cold" (the JIT still compiling; a fresh Web Worker is in the
 * same state), then the fastest of --runs warm solves is reported. The flow's set-up and derived fields are told
 * apart from its iterations by the first and last iteration events.
 *
 *   npm run bench:demo [-- --runs 3 --cells 800]
 */
import { parseDesign } from '../shared/design';
import { demoDesigns } from '../server/seed/designs';
import { discretiseDesign } from '../solver/grid/discretise';
import { solveDesign, type SolveResult, type SolveStage } from '../solver/solve';
import { cpuSeconds } from './potential-baselines';

const args = process.argv.slice(2);
const option = (name: string, fallback: string) => {
  const k = args.indexOf(name);
  return k >= 0 && k + 1 < args.length ? args[k + 1] : fallback;
};
const RUNS = Number(option('--runs', '3'));
const CELLS = option('--cells', '') === '' ? undefined : Number(option('--cells', ''));

interface Timing {
  geometry: number;
  potential: number;
  flow: number;
  /** Flow before its first iteration ended, less one iteration; and after its last, less one iteration. */
  flowSetup: number;
  flowIterations: number;
  flowDerived: number;
  fields: number;
  total: number;
  result: SolveResult;
}

function timedSolve(document: unknown): Timing {
  const marks = new Map<string, number>();
  const flowEvents: number[] = [];
  let last: SolveStage | null = null;
  const start = cpuSeconds();
  const result = solveDesign(document, {
    cells: CELLS,
    onProgress: ({ stage, fraction }) => {
      const t = cpuSeconds();
      if (stage !== last) marks.set(`${stage}:start`, t);
      if (stage === 'geometry' && fraction === 1) marks.set('geometry:end', t);
      if (stage === 'flow' && fraction > 0 && fraction < 1) flowEvents.push(t);
      if (stage === 'flow' && fraction === 1) marks.set('flow:end', t);
      last = stage;
    },
  });
  const end = cpuSeconds();
  const at = (key: string) => marks.get(key) ?? NaN;
  const flowStart = at('flow:start'), flowEnd = at('flow:end');
  const its = result.solver.flowIterations;
  // Iteration events come after iterations 1 … its − 1 (the converged one reports nothing).
  const perIteration = flowEvents.length > 1 ? (flowEvents[flowEvents.length - 1] - flowEvents[0]) / (flowEvents.length - 1) : 0;
  const flowSetup = flowEvents.length > 0 ? flowEvents[0] - flowStart - perIteration : NaN;
  const flowDerived = flowEvents.length > 0 ? flowEnd - flowEvents[flowEvents.length - 1] - perIteration : NaN;
  return {
    geometry: at('geometry:end') - start,
    potential: flowStart - at('geometry:end'),
    flow: flowEnd - flowStart,
    flowSetup,
    flowIterations: its * perIteration,
    flowDerived,
    fields: end - flowEnd,
    total: end - start,
    result,
  };
}

const pad = (s: string | number, w: number) => String(s).padStart(w);
const f3 = (x: number) => (Number.isFinite(x) ? x.toFixed(3) : '—');

console.log(`Demo designs at ${CELLS ? `--cells ${CELLS}` : 'the default resolution'} (CPU seconds of one core; warm: fastest of ${RUNS}).\n`);
console.log(
  'design                              |      grid | fluid cells | across | pot its | flow its | ' +
    'geometry | potential | flow (set-up, its, derived)   | fields | total warm | total cold',
);
for (const demo of demoDesigns()) {
  const cold = timedSolve(demo.document);
  let best = cold;
  for (let k = 0; k < RUNS; k++) {
    const t = timedSolve(demo.document);
    if (t.total < best.total || best === cold) best = t;
  }
  const r = best.result;
  const across = cellsAcross(demo.document);
  console.log(
    `${demo.name.padEnd(35)} | ${pad(`${r.grid.nx}×${r.grid.ny}`, 9)} | ${pad(r.grid.fluidCells, 11)} | ${pad(across, 6)} | ` +
      `${pad(r.solver.potentialIterations, 7)} | ${pad(r.solver.flowIterations, 8)} | ${pad(f3(best.geometry), 8)} | ${pad(f3(best.potential), 9)} | ` +
      `${pad(f3(best.flow), 5)} (${f3(best.flowSetup)}, ${f3(best.flowIterations)}, ${f3(best.flowDerived)}) | ${pad(f3(best.fields), 6)} | ` +
      `${pad(f3(best.total), 10)} | ${pad(f3(cold.total), 10)}`,
  );
}

/** Cells across the narrowest channel at the grid solveDesign chooses (discretised once more, untimed). */
function cellsAcross(document: unknown): string {
  const parsed = parseDesign(document);
  if (!parsed.ok) return '—';
  const choice = discretiseDesign(parsed.design, { cells: CELLS }).choice;
  return choice && Number.isFinite(choice.cellsAcross) ? choice.cellsAcross.toFixed(1) : '—';
}
