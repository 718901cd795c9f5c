/**
 * Fuzz: random mutations of valid designs never crash or hang the solver. Each one either solves
 * (with finite numbers and Kirchhoff's sum) or is refused with a SolveError that says why.
 * Seeded (mulberry32), so a failure names the case that reproduces it: FUZZ_SEED=<seed> FUZZ_CASES=1.
 */
import { SolveError, solveDesign } from '../../solver/solve';
import { fixtureFiles, type FixtureName } from '../fixtures/designs';

/** mulberry32 (Tommy Ettinger's public-domain 32-bit generator). */
function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

type Json = null | boolean | number | string | Json[] | { [key: string]: Json };

/** Paths to every leaf (and container) of a JSON value. */
function paths(value: Json, prefix: Array<string | number> = [], out: Array<Array<string | number>> = []) {
  out.push(prefix);
  if (Array.isArray(value)) value.forEach((v, k) => paths(v, [...prefix, k], out));
  else if (value && typeof value === 'object') for (const key of Object.keys(value)) paths(value[key], [...prefix, key], out);
  return out;
}

function isObject(v: Json | undefined): v is { [key: string]: Json } {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function get(root: Json, path: Array<string | number>): Json {
  return path.reduce<Json>((v, key) => (v as Record<string | number, Json>)[key], root);
}

function set(root: Json, path: Array<string | number>, value: Json | undefined): void {
  const parent = get(root, path.slice(0, -1)) as Record<string | number, Json>;
  const key = path[path.length - 1];
  if (value === undefined) {
    if (Array.isArray(parent)) parent.splice(key as number, 1);
    else delete parent[key];
  } else parent[key] = value;
}

// Cheap layouts most of the time; the two with many arcs (slow to clip) now and then.
const BASES: FixtureName[] = ['straight-channel', 'cross-injector', 't-junction', 'bend-90'];
const RARE: FixtureName[] = ['serpentine', 'expansion-chamber'];

interface Case {
  design: Json;
  cells: number;
  probes: Array<[number, number]>;
  what: string[];
}

function makeCase(seed: number): Case {
  const rnd = random(seed);
  const pick = <T>(a: ReadonlyArray<T>): T => a[Math.floor(rnd() * a.length)];
  const base: FixtureName = rnd() < 0.005 ? pick(RARE) : pick(BASES);
  const design = JSON.parse(JSON.stringify(fixtureFiles[base])) as Json;
  const d = design as Record<string, Json>;
  const what: string[] = [base];
  const scale = 1e-3;
  const near = () => (rnd() - 0.2) * 3 * scale;
  const mutations: Array<() => void> = [
    () => { // scale a number
      const leaves = paths(design).filter((p) => typeof get(design, p) === 'number');
      const p = pick(leaves);
      const f = pick([0.999, 1.001, 0.5, 2, 10, 0.1, -1, 0, 1e-6, 1e6]);
      set(design, p, (get(design, p) as number) * f);
      what.push(`${p.join('.')} *= ${f}`);
    },
    () => { // replace a value by something odd
      const p = pick(paths(design).filter((q) => q.length > 0));
      const v = pick<Json | undefined>([null, 'x', true, [], {}, -1, 0, 1e300, undefined, NaN as unknown as Json, Infinity as unknown as Json]);
      set(design, p, v);
      what.push(`${p.join('.')} = ${String(v)}`);
    },
    () => { // nudge a port end along or off the outline
      const ports = d.ports as Array<Record<string, Json>>;
      if (!Array.isArray(ports) || ports.length === 0) return;
      const port = pick(ports);
      if (!isObject(port)) return;
      const end = pick(['from', 'to']);
      const xy = port[end] as number[];
      if (!Array.isArray(xy) || typeof xy[0] !== 'number' || typeof xy[1] !== 'number') return;
      const k = pick([0, 1]);
      const delta = pick([1e-7, 1e-6, 5e-6, 2e-5, 1e-4]) * (rnd() < 0.5 ? -1 : 1);
      xy[k] = (xy[k] as number) + delta;
      what.push(`port ${String(port.id)}.${end}[${k}] += ${delta}`);
    },
    () => { // float or fix a port
      const ports = d.ports as Array<Record<string, Json>>;
      if (!Array.isArray(ports) || ports.length === 0) return;
      const port = pick(ports);
      if (!isObject(port)) return;
      port.potential = port.potential === null ? Math.round(rnd() * 200 - 50) : null;
      if (rnd() < 0.3) port.pressure = Math.round(rnd() * 1000);
      what.push(`port ${String(port.id)} potential ${String(port.potential)}`);
    },
    () => { // add or cut a shape somewhere near the layout
      const shapes = d.shapes as Json[];
      if (!Array.isArray(shapes)) return;
      const op = rnd() < 0.5 ? 'add' : 'subtract';
      const size = pick([2e-6, 2e-5, 1e-4, 5e-4]);
      const shape: Json = pick<Json>([
        { op, type: 'circle', center: [near(), near()], radius: size },
        { op, type: 'rect', x: near(), y: near(), width: size * (1 + rnd() * 5), height: size, angle: rnd() * 360 },
        { op, type: 'sector', center: [near(), near()], innerRadius: size, outerRadius: size * 2, startAngle: rnd() * 90, endAngle: 90 + rnd() * 270 },
        { op, type: 'polygon', points: Array.from({ length: 3 + Math.floor(rnd() * 4) }, () => [near(), near()]) },
      ]);
      shapes.splice(Math.floor(rnd() * (shapes.length + 1)), 0, shape);
      what.push(`insert ${op} ${(shape as Record<string, Json>).type}`);
    },
    () => { // drop, duplicate or flip a shape
      const shapes = d.shapes as Array<Record<string, Json>>;
      if (!Array.isArray(shapes) || shapes.length === 0) return;
      const k = Math.floor(rnd() * shapes.length);
      const how = pick(['drop', 'duplicate', 'flip']);
      if (how === 'drop') shapes.splice(k, 1);
      else if (how === 'duplicate') shapes.splice(k, 0, JSON.parse(JSON.stringify(shapes[k])));
      else if (isObject(shapes[k])) shapes[k].op = shapes[k].op === 'add' ? 'subtract' : 'add';
      what.push(`${how} shapes[${k}]`);
    },
    () => { // a wall zone
      if (!isObject(design)) return;
      d.wallZones = [{ region: { type: 'circle', center: [near(), near()], radius: 5e-4 }, zeta: -0.01 }];
      what.push('wall zone');
    },
    () => { // a port across the middle of the layout, or a copy of one
      const ports = d.ports as Json[];
      if (!Array.isArray(ports)) return;
      ports.push({ id: `P${ports.length}`, from: [near(), near()], to: [near(), near()], potential: rnd() < 0.5 ? null : 5, pressure: 0 });
      what.push('extra port');
    },
  ];
  const count = 1 + Math.floor(rnd() * 3);
  for (let k = 0; k < count; k++) pick(mutations)();
  const cells = 40 + Math.floor(rnd() * 33); // 40–72 cells along the long side: small grids, many cases
  const probes = Array.from({ length: Math.floor(rnd() * 3) }, (): [number, number] => [near(), near()]);
  return { design, cells, probes, what };
}

const FIRST_SEED = Number(process.env.FUZZ_SEED ?? 1);
const CASES = Number(process.env.FUZZ_CASES ?? 2000);

describe('fuzz: mutated designs solve or are refused with a message', () => {
  it(`holds for ${CASES} seeded mutations`, () => {
    const tally = { solved: 0, refused: 0 };
    const codes = new Map<string, number>();
    const failures: string[] = [];
    let slowest = { ms: 0, seed: 0 };
    const spent = { solved: 0, refused: 0 };
    for (let seed = FIRST_SEED; seed < FIRST_SEED + CASES && failures.length < 5; seed++) {
      const c = makeCase(seed);
      const started = Date.now();
      let outcome: 'solved' | 'refused' = 'refused';
      try {
        const r = solveDesign(c.design, { cells: c.cells, probes: c.probes });
        const currents = r.ports.map((p) => p.current);
        const scale = Math.max(1e-30, ...currents.map(Math.abs));
        const numbers = [...currents, ...r.ports.map((p) => p.flowRate), ...Object.values(r.metrics), r.solver.residual];
        if (!numbers.every(Number.isFinite)) throw new Error(`non-finite number in the result: ${JSON.stringify(r.metrics)}`);
        if (Math.abs(currents.reduce((a, b) => a + b, 0)) > 1e-4 * scale + 1e-15) throw new Error(`Kirchhoff's sum is off: ${currents.join(', ')}`);
        if (r.fields.potential.length !== r.grid.nx * r.grid.ny) throw new Error('fields do not match the grid');
        tally.solved++;
        outcome = 'solved';
      } catch (error) {
        if (error instanceof SolveError && error.kind === 'refused' && error.message.length > 10 && !/\n/.test(error.message)) {
          tally.refused++;
          codes.set(error.code, (codes.get(error.code) ?? 0) + 1);
        } else {
          failures.push(`seed ${seed} (${c.what.join('; ')}, cells ${c.cells}): ${error instanceof Error ? `${error.name}: ${error.message}` : String(error)}`);
        }
      }
      const ms = Date.now() - started;
      spent[outcome] += ms;
      if (ms > slowest.ms) slowest = { ms, seed };
    }
    console.log(
      `fuzz: ${tally.solved} solved, ${tally.refused} refused (${[...codes].map(([k, v]) => `${k} ${v}`).join(', ')}); ` +
        `${(spent.solved / 1000).toFixed(1)} s solving, ${(spent.refused / 1000).toFixed(1)} s refusing; slowest case ${slowest.ms} ms (seed ${slowest.seed})`,
    );
    expect(failures).toEqual([]);
  });
});
