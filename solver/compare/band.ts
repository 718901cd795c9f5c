import type { Port } from '../../shared/design';
import type { FluidRegion } from '../geometry/fluid-region';
import { polygonsContain, type Vec2 } from '../geometry/ring';
import { histogram, mean, pilotArrivals, traceBand, type TraceFields } from '../tracer';

const { hypot, abs, max, min, sqrt } = Math;

export interface Segment {
  from: Vec2;
  to: Vec2;
}

/**
 * Where Compare releases its band and where it detects it: two lines across the chosen port's channel, `distance`
 * apart, the nearer half a channel width inside the port. The band is released at the nearer line when the flow
 * enters through the port and at the farther one when it leaves there, so it always travels `distance` towards
 * the detector. Both drives use the same lines, particles and seed.
 */
export interface BandSetup {
  release: Segment;
  detector: Segment;
  /** Travel distance between the release and the detector line (m). */
  distance: number;
  /** Width of the channel across the lines (m). */
  width: number;
  particles: number;
  seed: number;
  /** The reference species: electrophoretic mobility 0 (it moves with the liquid), diffusivity D (m²/s). */
  mobility: number;
  diffusivity: number;
  /** Bin edges (s) of both sides' arrival-time histograms, one more than the counts: one time axis for both. */
  edges: number[];
}

/** The tracer's figures for one drive, from the arrival times at the detector (solver/tracer, traceBand). */
export interface BandSpreading {
  /** Particles that crossed the detector (of `particles`). */
  arrived: number;
  /** Mean arrival time t̄ and its variance σ_t² (s, s²), from the release. */
  meanTime: number;
  timeVariance: number;
  /** Mean speed through the detector, normal to it (m/s). */
  speed: number;
  /** Plate height H = U σ_t² / t̄ (m) and plate number N = t̄² / σ_t². */
  plateHeight: number;
  plateNumber: number;
  /** Arrival-time skew across the detector times U (m): the band's tilt. */
  tilt: number;
  /**
   * Axial dispersion the arrival curve implies, D_app = H U / 2 (m²/s). A band released as a line in a uniform
   * stream U with axial diffusivity D arrives at distance L after a first-passage (inverse Gaussian) time with
   * t̄ = L / U and σ_t² = 2 D L / U³ (Schrödinger 1915; Tweedie 1957), so H = 2 D / U.
   */
  effectiveDiffusivity: number;
  /** How long the band was followed (s). */
  duration: number;
  /** Arrival-time histogram on the setup's `edges`. */
  counts: number[];
}

/** Travel distances tried, in channel widths, longest first; the first whose channel stays straight and unbranched wins. */
const TRAVEL = [5, 4, 3, 2, 1.5, 1, 0.5];
/**
 * rms diffusive step of Compare's band, in cells: twice the tracer's default of 0.3, so a time step four times as
 * long where a large Taylor–Aris D_eff sets it (a pressure drive). Measured on the demo cross (pressure side,
 * D_eff ≈ 90 D): the plate height moved by under 3 % against 0.3 cells, within the ≈ 3 % statistical error of
 * 2000 particles; in a straight channel (tests/verification/compare.test.ts) the results agree to within 3 % as well.
 */
const DIFFUSIVE_STEP = 0.6;
/** Detector lines run this fraction of the channel width past each wall, so no particle slips by at a wall. */
const DETECTOR_OVERHANG = 0.02;

/**
 * Places the release and the detector line in the channel at `port`, or says why not. Cross-sections are taken
 * along the port's inward normal every quarter width; all of them between the port and the farther line must lie
 * in the fluid with both walls within 20 % of the width found half a width in (a straight, unbranched stretch).
 * The nearer line sits half a width in, or `inset` in where the flow enters (so that few particles diffuse back
 * out through the port); the travel distance shrinks from five channel widths to half a width, and then the
 * inset towards half a width, until that holds.
 */
export function placeBand(
  region: FluidRegion,
  port: Port,
  inflow: boolean,
  inset = 0,
): { release: Segment; detector: Segment; distance: number; width: number } | string {
  const [ax, ay] = port.from;
  const [bx, by] = port.to;
  const w = hypot(bx - ax, by - ay);
  const noRoom = `the channel at port ${port.id} has no straight stretch half a width long to release and detect a band in`;
  if (!(w > 0)) return noRoom;
  const t: Vec2 = [(bx - ax) / w, (by - ay) / w];
  const m: Vec2 = [(ax + bx) / 2, (ay + by) / 2];
  const inside = (x: number, y: number) => polygonsContain(region.polygons, x, y);
  let n: Vec2 = [-t[1], t[0]];
  if (!inside(m[0] + 0.25 * w * n[0], m[1] + 0.25 * w * n[1])) n = [t[1], -t[0]];
  if (!inside(m[0] + 0.25 * w * n[0], m[1] + 0.25 * w * n[1])) return noRoom;

  const sections = new Map<number, { lo: number; hi: number } | null>();
  const section = (s: number) => {
    if (!sections.has(s)) sections.set(s, crossSection(region, [m[0] + s * n[0], m[1] + s * n[1]], t));
    return sections.get(s)!;
  };
  const first = section(0.5 * w);
  if (!first) return noRoom;
  const width = first.hi - first.lo;
  const centre = (first.hi + first.lo) / 2;
  const straight = (s: number) => {
    const c = section(s);
    return !!c && abs(c.hi - c.lo - width) <= 0.2 * width && abs((c.hi + c.lo) / 2 - centre) <= 0.2 * width;
  };
  const fits = (far: number) => {
    for (let q = 1; q * 0.25 * width < far; q++) if (!straight(q * 0.25 * width)) return false;
    return straight(far) && !crossesOutline(region, [m[0] + 0.25 * w * n[0], m[1] + 0.25 * w * n[1]], [m[0] + far * n[0], m[1] + far * n[1]]);
  };
  const line = (s: number, overhang: number): Segment => {
    const c = section(s)!;
    const pad = overhang * width;
    const cx = m[0] + s * n[0], cy = m[1] + s * n[1];
    return { from: [cx + (c.lo - pad) * t[0], cy + (c.lo - pad) * t[1]], to: [cx + (c.hi + pad) * t[0], cy + (c.hi + pad) * t[1]] };
  };
  const nears: number[] = [];
  // An inset that is not a finite length (no diffusion to escape by) falls back to half a width.
  for (let s = inflow && Number.isFinite(inset) ? max(0.5 * w, inset) : 0.5 * w; s > 0.5 * w; s /= 2) nears.push(s);
  nears.push(0.5 * w);
  for (const near of nears) {
    if (near !== 0.5 * w && !straight(near)) continue;
    for (const lengths of TRAVEL) {
      const far = near + lengths * width;
      if (!fits(far)) continue;
      // The release line stays a millionth of the width inside the walls (particles placed in the fluid).
      return inflow
        ? { release: line(near, -1e-6), detector: line(far, DETECTOR_OVERHANG), distance: far - near, width }
        : { release: line(far, -1e-6), detector: line(near, DETECTOR_OVERHANG), distance: far - near, width };
    }
  }
  return noRoom;
}

/** The nearest outline crossings either side of `c` along ±t: offsets lo < 0 < hi (m), or null when c is not in the fluid or a side is open. */
function crossSection(region: FluidRegion, c: Vec2, t: Vec2): { lo: number; hi: number } | null {
  if (!polygonsContain(region.polygons, c[0], c[1])) return null;
  let lo = -Infinity;
  let hi = Infinity;
  for (const rings of region.polygons) {
    for (const ring of rings) {
      for (let k = 0, len = ring.length; k < len; k++) {
        const [px, py] = ring[k];
        const ex = ring[(k + 1) % len][0] - px, ey = ring[(k + 1) % len][1] - py;
        const den = t[0] * ey - t[1] * ex;
        if (den === 0) continue;
        const u = ((px - c[0]) * ey - (py - c[1]) * ex) / den;
        const v = ((px - c[0]) * t[1] - (py - c[1]) * t[0]) / den;
        if (v < 0 || v > 1) continue;
        if (u > 0 && u < hi) hi = u;
        if (u < 0 && u > lo) lo = u;
      }
    }
  }
  return Number.isFinite(lo) && Number.isFinite(hi) ? { lo, hi } : null;
}

/** Whether the segment a–b crosses an edge of the fluid outline. */
function crossesOutline(region: FluidRegion, a: Vec2, b: Vec2): boolean {
  const dx = b[0] - a[0], dy = b[1] - a[1];
  for (const rings of region.polygons) {
    for (const ring of rings) {
      for (let k = 0, len = ring.length; k < len; k++) {
        const [px, py] = ring[k];
        const ex = ring[(k + 1) % len][0] - px, ey = ring[(k + 1) % len][1] - py;
        const den = dx * ey - dy * ex;
        if (den === 0) continue;
        const s = ((px - a[0]) * ey - (py - a[1]) * ex) / den;
        const u = ((px - a[0]) * dy - (py - a[1]) * dx) / den;
        if (s >= 0 && s <= 1 && u >= 0 && u <= 1) return true;
      }
    }
  }
  return false;
}

export interface BandRun {
  times: Float64Array;
  detector: NonNullable<ReturnType<typeof traceBand>['detector']> | undefined;
  duration: number;
  dt: number;
}

/**
 * Follows the reference species' band from the release to the detector line in one drive's fields.
 *
 * Time step: the tracer's advective limit (0.3 cells per step) and an rms diffusive step of DIFFUSIVE_STEP cells,
 * from the largest speed and D_eff in the stretch of channel the band crosses (its lines' box grown by a channel
 * width) rather than over the whole chip: elsewhere a fast leg would set a step far smaller than this band needs.
 * Particles that left that box have already arrived or were lost at a port.
 *
 * Duration: a pilot without diffusion gives the median streamline's arrival t₅₀ (solver/tracer pilotArrivals;
 * the slowest streamline creeps along a no-slip wall in a pressure drive and says little about the band); the
 * band is followed for max(2 t₅₀, t₅₀ + 8 σ), with σ² = 2 D* L / U³ the first-passage variance (see
 * BandSpreading.effectiveDiffusivity) for U = L / t₅₀ and the largest local D* in that stretch.
 * Null when the band does not reach the detector.
 */
export function runBand(
  fields: TraceFields,
  lines: { release: Segment; detector: Segment; distance: number; width: number },
  species: { mobility: number; diffusivity: number },
  options: { particles: number; seed: number; shouldStop?: () => boolean; onProgress?: (fraction: number) => void },
): BandRun | null {
  const injection = { kind: 'line' as const, from: lines.release.from, to: lines.release.to };
  const pilot = pilotArrivals([fields], [], injection, lines.detector, species.mobility, options.seed, options.shouldStop);
  if (pilot.length === 0) return null;
  const median = Float64Array.from(pilot).sort()[pilot.length >> 1];
  const local = localLimits(fields, lines, species);
  const h = fields.grid.spacing;
  const dt = min((0.3 * h) / max(local.speed, 1e-30), (DIFFUSIVE_STEP * h) ** 2 / (2 * local.diffusivity));
  const speed = lines.distance / median;
  const sigma = sqrt((2 * local.diffusivity * lines.distance) / (speed * speed * speed));
  const duration = max(2 * median, median + 8 * sigma);
  const trace = traceBand({
    species,
    injection,
    phases: [{ fields, duration }],
    detector: lines.detector,
    particles: options.particles,
    seed: options.seed,
    dt,
    frames: 2,
    shouldStop: options.shouldStop,
    onProgress: options.onProgress,
  });
  return { times: trace.arrivals.time, detector: trace.detector, duration, dt };
}

/**
 * The largest species speed |u + μ_ep E| and local diffusivity D_eff = D + (|u − u_tb| d)² / (210 D) (physics.md
 * §5, as traceBand uses it) over the fluid cells in the box of the band's lines grown by one channel width.
 */
function localLimits(f: TraceFields, lines: { release: Segment; detector: Segment; width: number }, species: { mobility: number; diffusivity: number }): { speed: number; diffusivity: number } {
  const { nx, ny, spacing: h, x0, y0, fraction } = f.grid;
  const xs = [lines.release.from[0], lines.release.to[0], lines.detector.from[0], lines.detector.to[0]];
  const ys = [lines.release.from[1], lines.release.to[1], lines.detector.from[1], lines.detector.to[1]];
  const pad = lines.width;
  const i0 = max(0, Math.floor((min(...xs) - pad - x0) / h)), i1 = min(nx - 1, Math.ceil((max(...xs) + pad - x0) / h));
  const j0 = max(0, Math.floor((min(...ys) - pad - y0) / h)), j1 = min(ny - 1, Math.ceil((max(...ys) + pad - y0) / h));
  const D = species.diffusivity;
  let speed = 0;
  let diffusivity = D;
  for (let j = j0; j <= j1; j++) {
    for (let i = i0; i <= i1; i++) {
      const c = i + j * nx;
      if (!(fraction[c] > 0)) continue;
      const ux = finite(f.velocityX[c]), uy = finite(f.velocityY[c]), ex = finite(f.fieldX[c]), ey = finite(f.fieldY[c]);
      speed = max(speed, hypot(ux + species.mobility * ex, uy + species.mobility * ey));
      if (D > 0) {
        const px = ux - f.floorLidMobility * ex, py = uy - f.floorLidMobility * ey;
        diffusivity = max(diffusivity, D + ((px * px + py * py) * f.depth * f.depth) / (210 * D));
      }
    }
  }
  return { speed, diffusivity };
}

function finite(v: number): number {
  return Number.isFinite(v) ? v : 0;
}

/** Both sides' arrival times on one set of about √n bins (at most 40): edges (s) and counts per side. */
export function sharedHistogram(sides: ReadonlyArray<Float64Array | null>): { edges: number[]; counts: (number[] | null)[] } {
  let lo = Infinity;
  let hi = -Infinity;
  let most = 0;
  for (const times of sides) {
    if (!times) continue;
    for (let k = 0; k < times.length; k++) {
      lo = min(lo, times[k]);
      hi = max(hi, times[k]);
    }
    most = max(most, times.length);
  }
  if (!(hi >= lo)) return { edges: [], counts: sides.map(() => null) };
  if (!(hi > lo)) {
    const pad = abs(lo) * 0.01 || 1e-6;
    lo -= pad;
    hi += pad;
  }
  const bins = min(40, max(8, Math.round(sqrt(most))));
  const edges = Array.from({ length: bins + 1 }, (_, k) => lo + ((hi - lo) * k) / bins);
  return { edges, counts: sides.map((times) => (times ? histogram(times, lo, hi, bins) : null)) };
}
