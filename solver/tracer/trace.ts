import type { Vec2 } from '../geometry/ring';
import type { CutCellGrid } from '../grid/cut-cell-grid';
import { createRandom } from './random';
import { createSampler } from './sampler';
import { mean, slope, variance } from './statistics';
import { createWallStepper } from './walls';

// Math's functions as module locals: hot loops then avoid a global lookup per call (slow in some hosts).
const { sqrt, max, min, hypot, ceil, abs, floor } = Math;

/** Fields of one solved state of the chip (cell-centred, as SolveResult.fields carries them). */
export interface TraceFields {
  grid: CutCellGrid;
  velocityX: ArrayLike<number>;
  velocityY: ArrayLike<number>;
  fieldX: ArrayLike<number>;
  fieldY: ArrayLike<number>;
  /** Channel depth (m) and the floor-and-lid mobility μ_eo_tb (m²/Vs): u_tb = μ_eo_tb E. */
  depth: number;
  floorLidMobility: number;
}

export interface Species {
  /** Electrophoretic mobility μ_ep (m²/Vs), signed. */
  mobility: number;
  /** Molecular diffusivity D (m²/s). */
  diffusivity: number;
}

export type Injection = { kind: 'line'; from: Vec2; to: Vec2 } | { kind: 'region'; polygon: Vec2[] };

/** One stage of a protocol (e.g. loading, then dispensing for a pinched plug): fields held for a time. */
export interface Phase {
  fields: TraceFields;
  duration: number;
}

export interface TraceOptions {
  species: Species;
  injection: Injection;
  phases: Phase[];
  detector?: { from: Vec2; to: Vec2 };
  particles?: number;
  seed?: number;
  /** Time step (s); default from a Courant limit of 0.3 cells per step for advection and for diffusion. */
  dt?: number;
  frames?: number;
  /** Depth-wise Taylor–Aris dispersion (physics.md §5); on by default, off for deep channels where it does not apply. */
  depthDispersion?: boolean;
  shouldStop?: () => boolean;
  onProgress?: (fraction: number) => void;
}

export interface TraceFrame {
  time: number;
  /** x0, y0, x1, y1, ...; NaN for particles absorbed at a port. */
  positions: Float32Array;
  meanX: number;
  meanY: number;
  /** Variance of positions along the band's direction of travel (m²). */
  variance: number;
}

export interface TraceResult {
  particles: number;
  seed: number;
  dt: number;
  steps: number;
  frames: TraceFrame[];
  /** Arrival times at the detector (s, from the start of the last phase) and where along it (0..1). */
  arrivals: { time: Float64Array; along: Float64Array };
  detector?: {
    arrived: number;
    meanTime: number;
    timeVariance: number;
    /** Mean speed through the detector, normal to it (m/s). */
    speed: number;
    plateNumber: number;
    /** H = U σ_t² / t̄ (m). */
    plateHeight: number;
    /** Band tilt: arrival-time skew across the detector times the mean speed (m). */
    tilt: number;
  };
  absorbed: number;
}

/**
 * Follows a band of particles: advection with v = u + μ_ep E, a random walk with the local effective diffusivity
 * D_eff = D + (|u − u_tb| d)² / (210 D) (Taylor 1953, Aris 1956; physics.md §5) plus the drift ∇D_eff that keeps
 * the Itô walk consistent with Fick's law where D_eff varies, specular reflection at walls, absorption at ports
 * (Euler–Maruyama; Kloeden & Platen, Numerical Solution of SDEs, 1992).
 */
export function traceBand(o: TraceOptions): TraceResult {
  const n = o.particles ?? 2000;
  const seed = o.seed ?? 1;
  const rng = createRandom(seed);
  const grid = o.phases[0].fields.grid;
  const h = grid.spacing;
  const pos = new Float64Array(2 * n);
  const alive = new Uint8Array(n).fill(1);
  inject(o.injection, grid, pos, rng);

  const stages = o.phases.map((phase) => prepare(phase.fields, o.species, o.depthDispersion ?? true));
  const vmax = max(...stages.map((s) => s.vmax), 1e-30);
  const dmax = max(...stages.map((s) => s.dmax));
  const dt = o.dt ?? min((0.3 * h) / vmax, (0.3 * h) ** 2 / (2 * dmax));
  const total = o.phases.reduce((s, p) => s + p.duration, 0);
  const steps = ceil(total / dt);
  const frameCount = o.frames ?? 40;
  const frames: TraceFrame[] = [];
  const arrivalTime: number[] = [];
  const arrivalAlong: number[] = [];
  const arrived = new Uint8Array(n);
  const lastStart = total - o.phases[o.phases.length - 1].duration;
  let absorbed = 0;
  const tmp = new Float64Array(5);
  const p = new Float64Array(2);
  let nextFrame = 0;
  let phaseIndex = 0;
  let phaseEnd = o.phases[0].duration;

  for (let step = 0; step <= steps; step++) {
    const t = step * dt;
    if (nextFrame < frameCount && t >= (nextFrame * total) / max(1, frameCount - 1) - 1e-15) {
      frames.push(frame(t, pos, alive, stages[phaseIndex]));
      nextFrame++;
    }
    if (step === steps) break;
    while (t >= phaseEnd - 1e-15 && phaseIndex < o.phases.length - 1) phaseEnd += o.phases[++phaseIndex].duration;
    const stage = stages[phaseIndex];
    for (let k = 0; k < n; k++) {
      if (!alive[k]) continue;
      const x = pos[2 * k];
      const y = pos[2 * k + 1];
      if (!stage.sampler.sample(x, y, tmp)) continue;
      const sd = sqrt(2 * max(tmp[2], 0) * dt);
      const dx = (tmp[0] + tmp[3]) * dt + sd * rng.normal();
      const dy = (tmp[1] + tmp[4]) * dt + sd * rng.normal();
      p[0] = x;
      p[1] = y;
      const port = stage.walls.step(p, dx, dy);
      if (o.detector && !arrived[k] && t >= lastStart) {
        // A particle absorbed at a port is tested along its whole step, so a detector on the port still counts it.
        const hit = port >= 0 ? crossing(x, y, x + dx, y + dy, o.detector.from, o.detector.to) : crossing(x, y, p[0], p[1], o.detector.from, o.detector.to);
        if (hit) {
          arrived[k] = 1;
          arrivalTime.push(t - lastStart + hit[0] * dt);
          arrivalAlong.push(hit[1]);
        }
      }
      pos[2 * k] = p[0];
      pos[2 * k + 1] = p[1];
      if (port >= 0) {
        alive[k] = 0;
        absorbed++;
      }
    }
    if (step % 256 === 0) {
      o.onProgress?.(step / steps);
      if (o.shouldStop?.()) break;
    }
  }

  const result: TraceResult = {
    particles: n,
    seed,
    dt,
    steps,
    frames,
    arrivals: { time: Float64Array.from(arrivalTime), along: Float64Array.from(arrivalAlong) },
    absorbed,
  };
  if (o.detector && arrivalTime.length > 2) {
    const det = o.detector;
    const speed = detectorSpeed(stages[stages.length - 1], det.from, det.to);
    const tMean = mean(arrivalTime);
    const tVar = variance(arrivalTime);
    result.detector = {
      arrived: arrivalTime.length,
      meanTime: tMean,
      timeVariance: tVar,
      speed,
      plateNumber: (tMean * tMean) / tVar,
      plateHeight: (speed * tVar) / tMean,
      tilt: slope(arrivalAlong, arrivalTime) * speed,
    };
  }
  return result;
}

interface Stage {
  sampler: ReturnType<typeof createSampler>;
  walls: ReturnType<typeof createWallStepper>;
  vmax: number;
  dmax: number;
  vx: Float64Array;
  vy: Float64Array;
}

function prepare(f: TraceFields, species: Species, depthDispersion: boolean): Stage {
  const { grid } = f;
  const { nx, ny, spacing: h, fraction } = grid;
  const size = nx * ny;
  const vx = new Float64Array(size);
  const vy = new Float64Array(size);
  const deff = new Float64Array(size);
  const D = species.diffusivity;
  let vmax = 0;
  let dmax = D;
  for (let c = 0; c < size; c++) {
    if (fraction[c] <= 0) continue;
    const ex = finite(f.fieldX[c]);
    const ey = finite(f.fieldY[c]);
    const ux = finite(f.velocityX[c]);
    const uy = finite(f.velocityY[c]);
    vx[c] = ux + species.mobility * ex;
    vy[c] = uy + species.mobility * ey;
    vmax = max(vmax, hypot(vx[c], vy[c]));
    let d = D;
    if (depthDispersion && D > 0) {
      // Pressure-driven part of the flow relative to the floor-and-lid slip: u − u_tb, u_tb = μ_tb E.
      const px = ux - f.floorLidMobility * ex;
      const py = uy - f.floorLidMobility * ey;
      d += ((px * px + py * py) * f.depth * f.depth) / (210 * D);
    }
    deff[c] = d;
    dmax = max(dmax, d);
  }
  // ∇D_eff by central differences between fluid cells (one-sided next to walls).
  const gx = new Float64Array(size);
  const gy = new Float64Array(size);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const c = i + j * nx;
      if (fraction[c] <= 0) continue;
      gx[c] = gradient(deff, fraction, c, i > 0 ? c - 1 : -1, i < nx - 1 ? c + 1 : -1, h);
      gy[c] = gradient(deff, fraction, c, j > 0 ? c - nx : -1, j < ny - 1 ? c + nx : -1, h);
    }
  }
  return { sampler: createSampler(grid, [vx, vy, deff, gx, gy]), walls: createWallStepper(grid), vmax, dmax, vx, vy };
}

function gradient(v: Float64Array, fraction: Float64Array, c: number, lo: number, hi: number, h: number): number {
  const okLo = lo >= 0 && fraction[lo] > 0;
  const okHi = hi >= 0 && fraction[hi] > 0;
  if (okLo && okHi) return (v[hi] - v[lo]) / (2 * h);
  if (okHi) return (v[hi] - v[c]) / h;
  if (okLo) return (v[c] - v[lo]) / h;
  return 0;
}

function finite(v: number): number {
  return Number.isFinite(v) ? v : 0;
}

function inject(inj: Injection, grid: CutCellGrid, pos: Float64Array, rng: ReturnType<typeof createRandom>): void {
  const n = pos.length / 2;
  if (inj.kind === 'line') {
    for (let k = 0; k < n; k++) {
      const s = (k + 0.5) / n;
      pos[2 * k] = inj.from[0] + s * (inj.to[0] - inj.from[0]);
      pos[2 * k + 1] = inj.from[1] + s * (inj.to[1] - inj.from[1]);
    }
    return;
  }
  const xs = inj.polygon.map((q) => q[0]);
  const ys = inj.polygon.map((q) => q[1]);
  const [xlo, xhi, ylo, yhi] = [min(...xs), max(...xs), min(...ys), max(...ys)];
  const { nx, ny, spacing: h, x0, y0, fraction } = grid;
  let k = 0;
  for (let tries = 0; k < n && tries < 1000 * n; tries++) {
    const x = xlo + rng.uniform() * (xhi - xlo);
    const y = ylo + rng.uniform() * (yhi - ylo);
    const i = floor((x - x0) / h);
    const j = floor((y - y0) / h);
    if (i < 0 || j < 0 || i >= nx || j >= ny || fraction[i + j * nx] < 1 || !insidePolygon(x, y, inj.polygon)) continue;
    pos[2 * k] = x;
    pos[2 * k + 1] = y;
    k++;
  }
  if (k < n) throw new Error('the injection region holds too little fluid to place the particles');
}

function insidePolygon(x: number, y: number, poly: Vec2[]): boolean {
  let inside = false;
  for (let a = 0, b = poly.length - 1; a < poly.length; b = a++) {
    const [xa, ya] = poly[a];
    const [xb, yb] = poly[b];
    if (ya > y !== yb > y && x < ((xb - xa) * (y - ya)) / (yb - ya) + xa) inside = !inside;
  }
  return inside;
}

/** Where the step a → b crosses the detector segment: [fraction of the step, position along the detector], or null. */
function crossing(ax: number, ay: number, bx: number, by: number, from: Vec2, to: Vec2): [number, number] | null {
  const rx = bx - ax;
  const ry = by - ay;
  const sx = to[0] - from[0];
  const sy = to[1] - from[1];
  const den = rx * sy - ry * sx;
  if (den === 0) return null;
  const qx = from[0] - ax;
  const qy = from[1] - ay;
  const t = (qx * sy - qy * sx) / den;
  const u = (qx * ry - qy * rx) / den;
  return t >= 0 && t <= 1 && u >= 0 && u <= 1 ? [t, u] : null;
}

/** Mean of the velocity component normal to the detector along it (flux per length). */
function detectorSpeed(stage: Stage, from: Vec2, to: Vec2): number {
  const len = hypot(to[0] - from[0], to[1] - from[1]);
  const nxd = (to[1] - from[1]) / len;
  const nyd = -(to[0] - from[0]) / len;
  const out = new Float64Array(5);
  let s = 0;
  let m = 0;
  for (let k = 0; k < 200; k++) {
    const u = (k + 0.5) / 200;
    if (!stage.sampler.sample(from[0] + u * (to[0] - from[0]), from[1] + u * (to[1] - from[1]), out)) continue;
    s += out[0] * nxd + out[1] * nyd;
    m++;
  }
  return m ? abs(s / m) : NaN;
}

function frame(time: number, pos: Float64Array, alive: Uint8Array, stage: Stage): TraceFrame {
  const n = alive.length;
  const positions = new Float32Array(2 * n);
  const tmp = new Float64Array(5);
  let sx = 0;
  let sy = 0;
  let vx = 0;
  let vy = 0;
  let m = 0;
  for (let k = 0; k < n; k++) {
    if (!alive[k]) {
      positions[2 * k] = NaN;
      positions[2 * k + 1] = NaN;
      continue;
    }
    positions[2 * k] = pos[2 * k];
    positions[2 * k + 1] = pos[2 * k + 1];
    sx += pos[2 * k];
    sy += pos[2 * k + 1];
    if (stage.sampler.sample(pos[2 * k], pos[2 * k + 1], tmp)) {
      vx += tmp[0];
      vy += tmp[1];
    }
    m++;
  }
  const meanX = m ? sx / m : NaN;
  const meanY = m ? sy / m : NaN;
  const vl = hypot(vx, vy);
  const ex = vl > 0 ? vx / vl : 1;
  const ey = vl > 0 ? vy / vl : 0;
  let v = 0;
  for (let k = 0; k < n; k++) if (alive[k]) v += ((pos[2 * k] - meanX) * ex + (pos[2 * k + 1] - meanY) * ey) ** 2;
  return { time, positions, meanX, meanY, variance: m > 1 ? v / (m - 1) : NaN };
}
