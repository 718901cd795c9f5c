// Math's functions as module locals: hot loops then avoid a global lookup per call (slow in some hosts).
const { imul, log, sqrt, sin, cos, PI } = Math;

/**
 * A seeded pseudo-random source, so a trace is reproducible from its seed.
 * Uniform numbers from the 32-bit "mulberry32" generator (T. Ettinger, public-domain algorithm, 2017);
 * normal deviates by the Box–Muller transform (Box & Muller, Ann. Math. Stat. 29, 610 (1958)).
 */
export interface Random {
  uniform(): number;
  normal(): number;
}

export function createRandom(seed: number): Random {
  let state = seed >>> 0;
  let spare = 0;
  let hasSpare = false;
  const uniform = () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = imul(t ^ (t >>> 15), t | 1);
    t ^= t + imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const normal = () => {
    if (hasSpare) {
      hasSpare = false;
      return spare;
    }
    let u = uniform();
    while (u <= 0) u = uniform();
    const v = uniform();
    const r = sqrt(-2 * log(u));
    spare = r * sin(2 * PI * v);
    hasSpare = true;
    return r * cos(2 * PI * v);
  };
  return { uniform, normal };
}
