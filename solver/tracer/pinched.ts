import type { DesignDocument, Port } from '../../shared/design';
import type { Vec2 } from '../geometry/ring';
import { electroosmoticMobility } from '../physics/electrokinetics';
import { SolveError } from '../result/errors';
import type { CrossRoles } from '../../shared/cross-roles';
import type { PhaseSpec } from './protocol';
import type { Injection } from './trace';

/** The port roles of a cross and their guess from names live in shared/cross-roles.ts (the app guesses them too). */
export { guessCrossRoles, type CrossRoles } from '../../shared/cross-roles';

const { hypot, abs, max, min } = Math;

/**
 * A pinched plug at a cross (pinched injection): sample fills the sample leg, loading draws it across the cross
 * to the sample waste while the buffer and waste legs push in a little (the pinch), then dispensing drives buffer
 * from the buffer port to the waste and pulls the sample back from the cross into both side legs, so a plug the
 * size of the cross moves down the waste leg to the detector.
 */
export interface PinchedPlug {
  roles: CrossRoles;
  /** Where the legs' centre lines cross (m). */
  centre: Vec2;
  /** The sample leg, from the cross centre up to eight leg widths (at most nine tenths of the way to the sample port). */
  injection: Extract<Injection, { kind: 'region' }>;
  /** Across the waste leg. */
  detector: { from: Vec2; to: Vec2 };
  /** Loading (with a duration) and dispensing (until the plug has passed the detector). */
  phases: [PhaseSpec, PhaseSpec];
}

/**
 * The preset: geometry from the ports (each leg runs from the cross centre to its port's midpoint), voltages from
 * a resistor estimate of the cross potential (legs of equal width and depth), signs so the species moves from
 * sample to sample waste (μ_app = μ_eo + μ_ep). The engineer edits the potentials and durations afterwards.
 */
export function pinchedPlug(
  design: DesignDocument,
  roles: CrossRoles,
  options: { voltage?: number; speciesMobility?: number; detectorDistance?: number } = {},
): PinchedPlug {
  const port = (id: string): Port => {
    const p = design.ports.find((q) => q.id === id);
    if (!p) throw new SolveError('invalid-option', `no port "${id}" in the design`, { field: 'roles' });
    return p;
  };
  const [S, SW, B, W] = [port(roles.sample), port(roles.sampleWaste), port(roles.buffer), port(roles.waste)];
  if (new Set([S.id, SW.id, B.id, W.id]).size < 4) throw new SolveError('invalid-option', 'the four roles of a cross need four different ports', { field: 'roles' });
  const centre = crossing(mid(S), mid(SW), mid(B), mid(W));
  if (!centre) throw new SolveError('invalid-option', `the ${S.id}–${SW.id} and ${B.id}–${W.id} legs do not cross`, { field: 'roles' });
  const leg = (p: Port) => {
    const m = mid(p);
    const length = hypot(m[0] - centre[0], m[1] - centre[1]);
    return { length, dir: [(m[0] - centre[0]) / length, (m[1] - centre[1]) / length] as Vec2, width: hypot(p.to[0] - p.from[0], p.to[1] - p.from[1]) };
  };
  const [ls, lsw, lb, lw] = [leg(S), leg(SW), leg(B), leg(W)];

  const { relativePermittivity: epsR, viscosity } = design.buffer;
  const apparent = electroosmoticMobility(epsR, viscosity, design.zeta.side) + (options.speciesMobility ?? 0);
  if (!(abs(apparent) > 0)) throw new SolveError('invalid-option', 'the species does not move in a field here (electroosmotic plus electrophoretic mobility is zero)', { field: 'species' });
  const designMax = max(0, ...design.ports.map((p) => abs(p.potential ?? 0)));
  const size = options.voltage ?? (designMax > 0 ? designMax : 400);
  // Species move from high to low potential when μ_app > 0.
  const V = Math.sign(apparent) * abs(size);
  const round = (v: number) => Number(v.toPrecision(3));

  // Sample fills its leg from the cross centre up to eight widths (or nine tenths of the leg): enough to keep the
  // cross full through loading, short enough that most particles end up in the plug or the sample waste.
  const reach = min(0.9 * ls.length, 8 * ls.width);
  const crossLoading = (V * lsw.length) / (ls.length + lsw.length);
  const crossDispensing = (V * lw.length) / (lb.length + lw.length);
  const loading: PhaseSpec = {
    label: 'loading',
    potentials: { [S.id]: round(V), [SW.id]: 0, [B.id]: round(1.2 * crossLoading), [W.id]: round(1.2 * crossLoading) },
    // Long enough for the sample's front to travel 60 % of the filled length at the estimated leg speed.
    duration: round((0.6 * reach) / (abs(apparent) * (abs(V - crossLoading) / ls.length))),
  };
  const dispensing: PhaseSpec = {
    label: 'dispensing',
    potentials: { [B.id]: round(V), [W.id]: 0, [S.id]: round(0.8 * crossDispensing), [SW.id]: round(0.8 * crossDispensing) },
  };

  const along = (l: typeof ls, s: number, t: number): Vec2 => [centre[0] + l.dir[0] * s - l.dir[1] * t, centre[1] + l.dir[1] * s + l.dir[0] * t];
  const injection: PinchedPlug['injection'] = {
    kind: 'region',
    polygon: [along(ls, 0, -ls.width / 2), along(ls, reach, -ls.width / 2), along(ls, reach, ls.width / 2), along(ls, 0, ls.width / 2)],
  };
  const d = options.detectorDistance ?? min(0.5 * lw.length, 1e-3);
  const detector = { from: along(lw, d, -lw.width / 2), to: along(lw, d, lw.width / 2) };
  return { roles, centre, injection, detector, phases: [loading, dispensing] };
}

function mid(p: Port): Vec2 {
  return [(p.from[0] + p.to[0]) / 2, (p.from[1] + p.to[1]) / 2];
}

/** Where the line a1–a2 meets the line b1–b2 (null when they are parallel). */
function crossing(a1: Vec2, a2: Vec2, b1: Vec2, b2: Vec2): Vec2 | null {
  const rx = a2[0] - a1[0], ry = a2[1] - a1[1];
  const sx = b2[0] - b1[0], sy = b2[1] - b1[1];
  const den = rx * sy - ry * sx;
  if (abs(den) < 1e-12 * hypot(rx, ry) * hypot(sx, sy)) return null;
  const t = ((b1[0] - a1[0]) * sy - (b1[1] - a1[1]) * sx) / den;
  return [a1[0] + t * rx, a1[1] + t * ry];
}
