/**
 * Planner benchmark (issue 7): one slider step on a layout of about 250 000 grid cells. The cross-injector
 * fixture is solved once per electrode at 1 V (unit responses, as the Planner tab's worker does and keeps); then
 * a slider step recombines fields with no solve (in the solver worker; the page draws the image):
 *   - one field (superposeField: Σ_k s_k · response_k over every cell, the planner's inner loop);
 *   - the speed map as the Planner tab draws it: both velocity components recombined in one pass per drive and
 *     |u| in place (src/workers/worker-planner.ts `recombine`), then the map's RGBA image (field-image.ts);
 *   - for comparison, the same map from two superposeField calls, field-maps.ts `magnitude` and the image;
 * against one streaming pass over the field (read one array, write one), the cheapest a per-cell step can be.
 * Times are CPU milliseconds of this single-threaded process (the machine is shared), averaged over enough
 * steps to span half a second. Goal: a step under 16 ms (one frame at 60 Hz).
 *
 *   npm run bench:planner [-- --cells 612]
 */
import { colourRange, magnitude, MAPS } from '../src/app/features/fields/field-maps';
import { fieldImage } from '../src/app/features/fields/field-image';
import { recombine } from '../src/workers/worker-planner';
import { settingsOf, superposeField, unitResponses } from '../solver/planner';
import { loadFixture } from '../tests/fixtures/designs';
import { cpuSeconds } from './potential-baselines';

const args = process.argv.slice(2);
const option = (name: string, fallback: string) => {
  const k = args.indexOf(name);
  return k >= 0 && k + 1 < args.length ? args[k + 1] : fallback;
};
const CELLS = Number(option('--cells', '612'));

/** CPU milliseconds per call of `step`, over at least half a second after a warm-up. */
function msPer(step: () => void): number {
  for (let k = 0; k < 5; k++) step();
  let calls = 0;
  const start = cpuSeconds();
  while (cpuSeconds() - start < 0.5) {
    step();
    calls++;
  }
  return ((cpuSeconds() - start) * 1000) / calls;
}

function streamingPass(input: Float32Array, out: Float32Array, w: number): void {
  for (let c = 0; c < input.length; c++) out[c] = w * input[c];
}

const design = loadFixture('cross-injector');
const solveStart = cpuSeconds();
const responses = unitResponses(design, { cells: CELLS });
const solveSeconds = cpuSeconds() - solveStart;
const f0 = responses.results[0].fields;
const n = f0.nx * f0.ny;
const drives = responses.drives.length;
console.log(`layout: ${design.name}, ${f0.nx} × ${f0.ny} = ${n.toLocaleString('en-US')} grid cells (${responses.results[0].grid.fluidCells.toLocaleString('en-US')} fluid), ${drives} drives`);
console.log(`unit responses: ${drives} solves in ${solveSeconds.toFixed(1)} CPU s (once, in the worker)`);

const base = settingsOf(design, responses.drives);
const out = new Float32Array(n);
const outY = new Float32Array(n);
let tick = 0;
/** A new slider value each step, as a drag gives. */
const settings = () => base.map((v, k) => (k === 1 ? v * (1 + 0.001 * (tick++ % 100)) : v));

const oneField = msPer(() => superposeField(responses, 'velocityX', settings(), out));
const pass = msPer(() => streamingPass(f0.velocityX, out, 1.0001));
const speedRange = colourRange(magnitude(superposeField(responses, 'velocityX', base), superposeField(responses, 'velocityY', base)), MAPS.speed);
const plainSpeedMap = msPer(() => {
  const s = settings();
  superposeField(responses, 'velocityX', s, out);
  superposeField(responses, 'velocityY', s, outY);
  fieldImage(magnitude(out, outY), f0.nx, f0.ny, speedRange);
});
const speedOnly = msPer(() => recombine(responses, 'speed', settings(), out, outY));
const speedMap = msPer(() => fieldImage(recombine(responses, 'speed', settings(), out, outY), f0.nx, f0.ny, speedRange));

const rows = [
  ['one streaming pass over the field', pass],
  [`slider step: one field from ${drives} unit responses`, oneField],
  ['slider step: |u| recombined (Planner tab)', speedOnly],
  ['slider step: |u| and its RGBA image (Planner tab)', speedMap],
  ['same map by superposeField ×2, magnitude, image', plainSpeedMap],
] as const;
for (const [what, ms] of rows) console.log(`${what.padEnd(52)} ${ms.toFixed(2).padStart(8)} ms  (${(ms / pass).toFixed(1)} passes)`);
console.log(`goal: a step under 16 ms: ${oneField < 16 ? 'met' : 'NOT met'} for one field, ${speedMap < 16 ? 'met' : 'NOT met'} for the Planner's speed map`);
