/**
 * DXF outlines to a drawing (drawing.ts), read with the general-purpose `dxf-parser`.
 *
 * Used: LINE, ARC, CIRCLE, LWPOLYLINE and 2D POLYLINE (bulge arc segments kept as arcs; closed flag honoured).
 * LINE and ARC entities (and open polylines) are joined end to end into loops. Entities on a layer named
 * "ports" become ports (a TEXT on that layer next to a line names it), on "wall-zones" closed outlines with a
 * "zeta=VOLTS" text inside become wall zones (as our export writes them). Everything else is reported with its handle and position. Units from $INSUNITS,
 * unless a scale is given; a drawing without units is read as millimetres, and the report says so.
 */
import DxfParser from 'dxf-parser';
import type { Vec2 } from '../geometry/ring';
import type { DrawingPort, ImportedDrawing } from './drawing';
import { joinChains, type Chain } from './join';
import { checkRaw, IMPORT_LIMITS, ImportError } from './limits';
import { windingNumber } from '../geometry/ring';
import { arc, gap, line, loopRing, type Segment, type Skipped } from './outline';

const ZONE_LAYERS = new Set(['wall-zones', 'wall_zones', 'wall zones']);
const ZETA = /^\s*zeta\s*=?\s*([-+]?(?:\d+\.?\d*|\.\d+)(?:e[-+]?\d+)?)\s*V?\s*$/i;

/** $INSUNITS codes (AutoCAD DXF reference, HEADER section) in metres. */
const INSUNITS: Record<number, [string, number]> = {
  1: ['inches', 0.0254], 2: ['feet', 0.3048], 4: ['millimetres', 1e-3], 5: ['centimetres', 1e-2], 6: ['metres', 1],
  8: ['microinches', 2.54e-8], 9: ['mils', 2.54e-5], 10: ['yards', 0.9144], 11: ['ångströms', 1e-10], 12: ['nanometres', 1e-9],
  13: ['micrometres', 1e-6], 14: ['decimetres', 0.1],
};

export interface DxfImportOptions {
  /** Metres per drawing unit, overriding $INSUNITS. */
  scale?: number;
}

interface Pt { x: number; y: number; bulge?: number }
interface Entity {
  type: string;
  handle?: string | number;
  layer?: string;
  vertices?: Pt[];
  center?: Pt;
  radius?: number;
  startAngle?: number;
  endAngle?: number;
  shape?: boolean;
  extrusionDirectionZ?: number;
  extrusionDirection?: { z?: number };
  text?: string;
  startPoint?: Pt;
  position?: Pt;
  is3dPolyline?: boolean;
  is3dPolygonMesh?: boolean;
  isPolyfaceMesh?: boolean;
}

function units(header: Record<string, unknown>, given?: number): { s: number; source: string } {
  if (given !== undefined) return { s: given, source: `typed: ${given} m per drawing unit` };
  const code = Number(header['$INSUNITS'] ?? 0);
  const known = INSUNITS[code];
  if (known) return { s: known[1], source: `from the file: $INSUNITS ${code} (${known[0]})` };
  return { s: 1e-3, source: `the file states no units ($INSUNITS ${code}); read as millimetres, type a scale if that is wrong` };
}

function preScan(text: string): void {
  if (text.length > IMPORT_LIMITS.maxBytes) throw new ImportError('too-large', `the DXF is larger than ${IMPORT_LIMITS.maxBytes} bytes`);
  if (text.startsWith('AutoCAD Binary DXF')) throw new ImportError('unsupported', 'binary DXF is not supported; save the drawing as ASCII DXF');
  const head = text.slice(0, 4096).trimStart();
  if (!/^(0\s*[\r\n]+\s*SECTION|999\s*[\r\n])/.test(head)) throw new ImportError('malformed', 'the file is not an ASCII DXF (it does not begin with a SECTION)');
  if (!/(^|[\r\n])\s*0\s*[\r\n]+\s*EOF\s*$/.test(text.slice(-256))) throw new ImportError('malformed', 'the DXF is truncated: it does not end with an EOF marker');
}

export function importDxf(text: string, options: DxfImportOptions = {}): ImportedDrawing {
  preScan(text);
  let dxf: { header?: Record<string, unknown>; entities?: Entity[] } | null;
  try {
    dxf = new DxfParser().parseSync(text) as unknown as typeof dxf;
  } catch (error) {
    throw new ImportError('malformed', `the DXF cannot be read: ${String((error as Error).message ?? error).split('\n')[0].slice(0, 160)}`);
  }
  if (!dxf) throw new ImportError('malformed', 'the DXF cannot be read');
  const entities = dxf.entities ?? [];
  if (entities.length > IMPORT_LIMITS.maxEntities) throw new ImportError('too-large', `the DXF has ${entities.length} entities; at most ${IMPORT_LIMITS.maxEntities} are read`);
  const { s, source: unitsSource } = units(dxf.header ?? {}, options.scale);

  const skipped: Skipped[] = [];
  const chains: Chain[] = [];
  const portLines: Array<{ seg: Segment; source: string }> = [];
  const portNames: Array<{ at: Vec2; text: string }> = [];
  const zoneChains: Chain[] = [];
  const zoneLabels: Array<{ at: Vec2; zeta: number; source: string }> = [];
  let segments = 0;

  entities.forEach((e, k) => {
    const source = `${e.type} (${e.handle !== undefined ? `handle ${String(e.handle)}` : `entity ${k + 1}`}${e.layer ? `, layer ${e.layer}` : ''})`;
    const layer = (e.layer ?? '').trim().toLowerCase();
    const mirrored = (e.extrusionDirectionZ ?? e.extrusionDirection?.z ?? 1) < 0;
    const P = (p: Pt | undefined, what = 'a point'): Vec2 => {
      if (!p) throw new ImportError('malformed', `${source} lacks ${what}`);
      checkRaw(p.x, source);
      checkRaw(p.y, source);
      return [(mirrored ? -p.x : p.x) * s, p.y * s];
    };
    const firstAt = (): Vec2 | null => {
      const p = e.vertices?.[0] ?? e.center ?? e.startPoint ?? e.position;
      return p && Number.isFinite(p.x) && Number.isFinite(p.y) ? [p.x * s, p.y * s] : null;
    };
    let segs: Segment[] = [];
    let closed = false;
    switch (e.type) {
      case 'LINE': {
        const [a, b] = [P(e.vertices?.[0], 'a start'), P(e.vertices?.[1], 'an end')];
        if (gap(a, b) > 0) segs = [line(a, b)];
        break;
      }
      case 'ARC':
      case 'CIRCLE': {
        const c = P(e.center, 'a centre');
        checkRaw(e.radius ?? NaN, source);
        const r = (e.radius ?? 0) * s;
        if (!(r > 0)) {
          skipped.push({ entity: source, at: c, reason: 'zero radius' });
          return;
        }
        if (e.type === 'CIRCLE') {
          segs = [arc(c, r, 0, 2 * Math.PI)];
          closed = true;
        } else {
          let a0 = e.startAngle ?? 0, a1 = e.endAngle ?? 0;
          let sweep = a1 - a0;
          while (sweep <= 0) sweep += 2 * Math.PI;
          if (mirrored) { a0 = Math.PI - a0; sweep = -sweep; }
          segs = [arc(c, r, a0, sweep)];
        }
        break;
      }
      case 'LWPOLYLINE':
      case 'POLYLINE': {
        if (e.is3dPolyline || e.is3dPolygonMesh || e.isPolyfaceMesh) {
          skipped.push({ entity: source, at: firstAt(), reason: '3D polylines and meshes are not outlines' });
          return;
        }
        const v = e.vertices ?? [];
        const pts = v.map((p) => P(p));
        closed = !!e.shape;
        const n = pts.length;
        for (let i = 0; i < (closed ? n : n - 1); i++) {
          const a = pts[i], b = pts[(i + 1) % n];
          if (gap(a, b) === 0) continue;
          const bulge = (mirrored ? -1 : 1) * (v[i].bulge ?? 0);
          if (!Number.isFinite(bulge) || Math.abs(bulge) < 1e-12) {
            segs.push(line(a, b));
            continue;
          }
          // Bulge b = tan(θ/4): sweep θ (positive counter-clockwise), centre off the chord's midpoint.
          const L = gap(a, b);
          const ux = (b[0] - a[0]) / L, uy = (b[1] - a[1]) / L;
          const off = (L * (1 - bulge * bulge)) / (4 * bulge);
          const c: Vec2 = [(a[0] + b[0]) / 2 - uy * off, (a[1] + b[1]) / 2 + ux * off];
          const r = (L * (1 + bulge * bulge)) / (4 * Math.abs(bulge));
          segs.push({ ...arc(c, r, Math.atan2(a[1] - c[1], a[0] - c[0]), 4 * Math.atan(bulge)), a, b });
        }
        if (closed && segs.length) segs[segs.length - 1] = { ...segs[segs.length - 1], b: segs[0].a };
        break;
      }
      case 'TEXT':
      case 'MTEXT':
        if (layer === 'ports' && e.text) {
          portNames.push({ at: P(e.startPoint ?? e.position), text: e.text.trim() });
          return;
        }
        if (ZONE_LAYERS.has(layer) && e.text && ZETA.test(e.text)) {
          zoneLabels.push({ at: P(e.startPoint ?? e.position), zeta: Number(ZETA.exec(e.text)![1]), source });
          return;
        }
        skipped.push({ entity: source, at: firstAt(), reason: `text ("${(e.text ?? '').slice(0, 40)}") is not part of an outline` });
        return;
      default:
        skipped.push({ entity: source, at: firstAt(), reason: e.type === 'INSERT' ? 'block references are not expanded; explode blocks before export' : 'this kind of entity is not supported' });
        return;
    }
    segments += segs.length;
    if (segments > IMPORT_LIMITS.maxSegments) throw new ImportError('too-large', `the drawing has more than ${IMPORT_LIMITS.maxSegments} segments`);
    if (segs.length === 0) {
      skipped.push({ entity: source, at: firstAt(), reason: 'zero length' });
      return;
    }
    if (layer === 'ports') {
      if (segs.length === 1 && segs[0].kind === 'line') portLines.push({ seg: segs[0], source });
      else skipped.push({ entity: source, at: segs[0].a, reason: 'on the ports layer but not one straight line' });
      return;
    }
    if (ZONE_LAYERS.has(layer)) {
      zoneChains.push({ source, segments: segs });
      return;
    }
    chains.push({ source, segments: segs });
  });

  let size = 0;
  for (const c of chains) for (const g of c.segments) size = Math.max(size, Math.abs(g.a[0]), Math.abs(g.a[1]), Math.abs(g.b[0]), Math.abs(g.b[1]));
  const tol = Math.max(1e-12, size * 1e-7);
  const joined = joinChains(chains, tol);
  for (const c of joined.open) skipped.push({ entity: c.source, at: c.segments[0].a, reason: 'an open outline: its ends meet no other piece, so it encloses no fluid' });

  const ports: DrawingPort[] = portLines.map(({ seg }) => {
    const mid: Vec2 = [(seg.a[0] + seg.b[0]) / 2, (seg.a[1] + seg.b[1]) / 2];
    const len = gap(seg.a, seg.b);
    const label = portNames.find((t) => gap(t.at, mid) <= len);
    return { id: label?.text, from: seg.a, to: seg.b, potential: null, pressure: 0 };
  });
  const zones = joinChains(zoneChains, tol);
  const wallZones: ImportedDrawing['wallZones'] = [];
  for (const c of zones.open) skipped.push({ entity: c.source, at: c.segments[0].a, reason: 'a wall-zone outline that is not closed' });
  const labelled = new Set<number>();
  for (const loop of zones.loops) {
    const ring = loopRing(loop);
    const k = zoneLabels.findIndex((t, i) => !labelled.has(i) && windingNumber([ring], t.at[0], t.at[1]) !== 0);
    if (k < 0) {
      skipped.push({ entity: loop.source, at: loop.segments[0].a, reason: 'a wall-zone outline without a "zeta=VOLTS" text inside it' });
      continue;
    }
    labelled.add(k);
    wallZones.push({ loop, zeta: zoneLabels[k].zeta });
  }
  zoneLabels.forEach((t, i) => {
    if (!labelled.has(i)) skipped.push({ entity: t.source, at: t.at, reason: 'a zeta text inside no wall-zone outline' });
  });
  return { format: 'dxf', metresPerUnit: s, unitsSource, loops: joined.loops, ports, wallZones, skipped };
}
