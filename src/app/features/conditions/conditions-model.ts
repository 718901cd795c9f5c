/**
 * Edits of the operating conditions as pure functions on the design document (design-format.md): each returns
 * a new document and leaves the old one as it was.
 */
import type { Buffer, DesignDocument, Port, Region, WallZone, Zeta } from '../../../../shared/design';
import { electroosmoticMobility, LIMITS, zetaFromMobility } from '../../../../shared/physics';

export type Wall = keyof Zeta;

export const WALLS: ReadonlyArray<{ wall: Wall; label: string }> = [
  { wall: 'side', label: 'Side walls' },
  { wall: 'floor', label: 'Floor' },
  { wall: 'lid', label: 'Lid' },
];

/** Potentials above this size (V) get the high-voltage caution (physics.md §6). */
export const HIGH_VOLTAGE = LIMITS.highVoltage;

export function withPort(doc: DesignDocument, index: number, patch: Partial<Port>): DesignDocument {
  return { ...doc, ports: doc.ports.map((p, k) => (k === index ? { ...p, ...patch } : p)) };
}

export function withBuffer(doc: DesignDocument, patch: Partial<Buffer>): DesignDocument {
  return { ...doc, buffer: { ...doc.buffer, ...patch } };
}

export function withZeta(doc: DesignDocument, wall: Wall, zeta: number): DesignDocument {
  return { ...doc, zeta: { ...doc.zeta, [wall]: zeta } };
}

export function withZone(doc: DesignDocument, index: number, patch: Partial<WallZone>): DesignDocument {
  return { ...doc, wallZones: doc.wallZones.map((z, k) => (k === index ? { ...z, ...patch } : z)) };
}

export function withZoneRegion(doc: DesignDocument, index: number, patch: Partial<Extract<Region, { type: 'rect' }>>): DesignDocument {
  return {
    ...doc,
    wallZones: doc.wallZones.map((z, k) => (k === index && z.region.type === 'rect' ? { ...z, region: { ...z.region, ...patch } } : z)),
  };
}

export function addZone(doc: DesignDocument, region: Region, zeta = doc.zeta.side): DesignDocument {
  return { ...doc, wallZones: [...doc.wallZones, { region, zeta }] };
}

export function removeZone(doc: DesignDocument, index: number): DesignDocument {
  return { ...doc, wallZones: doc.wallZones.filter((_z, k) => k !== index) };
}

/** Electroosmotic mobility of a wall with this zeta in the design's buffer: mu_eo = -eps zeta / mu (physics.md §3). */
export function mobilityOf(doc: DesignDocument, zeta: number): number {
  return electroosmoticMobility(doc.buffer.relativePermittivity, doc.buffer.viscosity, zeta);
}

/** The zeta potential that gives the mobility in the design's buffer (the inverse of mobilityOf). */
export function zetaOf(doc: DesignDocument, mobility: number): number {
  return zetaFromMobility(doc.buffer.relativePermittivity, doc.buffer.viscosity, mobility);
}

/**
 * The zeta a library wall material gives: its typical zeta, else the middle of its zeta range, else its typical
 * mobility or the middle of its mobility range turned into zeta with `zetaOfMobility`; null when it has none.
 */
export function wallZeta(
  v: { zeta?: number; zetaMin?: number; zetaMax?: number; mobility?: number; mobilityMin?: number; mobilityMax?: number },
  zetaOfMobility: (mobility: number) => number,
): number | null {
  const mid = (a?: number, b?: number) => (typeof a === 'number' && typeof b === 'number' ? (a + b) / 2 : undefined);
  const zeta = v.zeta ?? mid(v.zetaMin, v.zetaMax);
  if (zeta !== undefined && Number.isFinite(zeta)) return zeta;
  const mobility = v.mobility ?? mid(v.mobilityMin, v.mobilityMax);
  if (mobility !== undefined && Number.isFinite(mobility)) return zetaOfMobility(mobility);
  return null;
}

/** The largest port potential in size (V), 0 when no port has an electrode. */
export function largestPotential(doc: DesignDocument): number {
  return doc.ports.reduce((m, p) => (p.potential === null ? m : Math.max(m, Math.abs(p.potential))), 0);
}

/** Ports whose potential is above the high-voltage limit in size. */
export function highVoltagePorts(doc: DesignDocument): Port[] {
  return doc.ports.filter((p) => p.potential !== null && Math.abs(p.potential) > HIGH_VOLTAGE);
}

/** A rect region for a new wall zone: a tenth of the layout's size, in its middle. */
export function defaultZoneRegion(bounds: [number, number, number, number] | null): Extract<Region, { type: 'rect' }> {
  if (!bounds) return { type: 'rect', x: 0, y: 0, width: 1e-4, height: 1e-4, angle: 0 };
  const size = Math.max(Math.max(bounds[2] - bounds[0], bounds[3] - bounds[1]) / 10, 1e-6);
  return { type: 'rect', x: (bounds[0] + bounds[2]) / 2 - size / 2, y: (bounds[1] + bounds[3]) / 2 - size / 2, width: size, height: size, angle: 0 };
}
