/**
 * What an imported drawing gives (SVG or DXF alike) and how it becomes a design document: closed loops become
 * shapes by even–odd nesting, port segments become ports, wall-zone outlines with a zeta become wall zones;
 * everything not used is in `skipped` with where it is. Conditions not in the file (depth, buffer, zeta) come
 * from `base` or from defaults typical of a glass chip; the user sets them on the Conditions tab.
 */
import { DESIGN_FORMAT, parseDesign, type DesignDocument, type Port, type Region, type Shape, type WallZone } from '../../shared/design';
import type { Vec2 } from '../geometry/ring';
import { IMPORT_LIMITS, ImportError } from './limits';
import { loopsToShapes } from './loops-to-shapes';
import { segmentExtent, type Loop, type Skipped } from './outline';

export interface DrawingPort {
  id?: string;
  name?: string;
  from: Vec2;
  to: Vec2;
  potential: number | null;
  pressure: number;
}

export interface ImportedDrawing {
  format: 'svg' | 'dxf';
  metresPerUnit: number;
  unitsSource: string;
  loops: Loop[];
  ports: DrawingPort[];
  wallZones: Array<{ loop: Loop; zeta: number }>;
  skipped: Skipped[];
}

/** What the preview shows: counts of what was found and the list of what was skipped. */
export interface ImportReport {
  format: 'svg' | 'dxf';
  metresPerUnit: number;
  unitsSource: string;
  found: { loops: number; add: number; subtract: number; circles: number; sectors: number; polygons: number; ports: number; wallZones: number };
  skipped: Skipped[];
  /** [xmin, ymin, xmax, ymax] of the outline (m). */
  bounds: [number, number, number, number];
}

export interface ImportResult {
  design: DesignDocument;
  report: ImportReport;
}

type DesignBase = Pick<DesignDocument, 'depth' | 'buffer' | 'zeta'>;

/** A 20 um deep glass channel with a 10 mM aqueous buffer at 25 °C (typical values, to be set by the user). */
export const IMPORT_DEFAULTS: DesignBase = {
  depth: 2e-5,
  buffer: { relativePermittivity: 78.3, viscosity: 8.9e-4, density: 997, conductivity: 0.14, ionicStrength: 10, temperature: 298.15 },
  zeta: { side: -0.05, floor: -0.05, lid: -0.05 },
};

function checkExtent(d: ImportedDrawing): void {
  const limit = IMPORT_LIMITS.maxCoordinateMetres;
  const far = (v: number) => !Number.isFinite(v) || Math.abs(v) > limit;
  for (const l of [...d.loops, ...d.wallZones.map((z) => z.loop)]) {
    const s = l.segments.find((seg) => far(segmentExtent(seg)));
    if (s) {
      throw new ImportError(
        'out-of-range',
        `${l.source} reaches ${segmentExtent(s).toPrecision(3)} m from the origin at ${d.metresPerUnit} m per drawing unit; a chip fits within ±${limit} m, so the scale or the units are wrong`,
      );
    }
  }
  for (const p of d.ports) {
    if ([...p.from, ...p.to].some(far)) throw new ImportError('out-of-range', `port ${p.id ?? ''} lies beyond ±${limit} m; check the scale`);
  }
}

function region(shape: Shape): Region {
  const { op: _op, ...rest } = shape;
  return rest as Region;
}

function boundsOf(shapes: Shape[]): [number, number, number, number] {
  let x0 = Infinity, y0 = Infinity, x1 = -Infinity, y1 = -Infinity;
  const grow = (x: number, y: number) => {
    x0 = Math.min(x0, x); y0 = Math.min(y0, y); x1 = Math.max(x1, x); y1 = Math.max(y1, y);
  };
  for (const s of shapes) {
    if (s.type === 'polygon') s.points.forEach(([x, y]) => grow(x, y));
    else if (s.type === 'circle') { grow(s.center[0] - s.radius, s.center[1] - s.radius); grow(s.center[0] + s.radius, s.center[1] + s.radius); }
    else if (s.type === 'sector') { grow(s.center[0] - s.outerRadius, s.center[1] - s.outerRadius); grow(s.center[0] + s.outerRadius, s.center[1] + s.outerRadius); }
    else grow(s.x, s.y);
  }
  return x0 <= x1 ? [x0, y0, x1, y1] : [0, 0, 0, 0];
}

/** The drawing as a design document (validated) with its report. Throws ImportError when nothing usable was found. */
export function drawingToDesign(d: ImportedDrawing, name: string, base: DesignBase = IMPORT_DEFAULTS): ImportResult {
  checkExtent(d);
  if (d.loops.length === 0) {
    const why = d.skipped.length ? ` (${d.skipped.length} thing${d.skipped.length === 1 ? '' : 's'} skipped: ${d.skipped.slice(0, 3).map((s) => `${s.entity}: ${s.reason}`).join('; ')})` : '';
    throw new ImportError('empty', `the file has no closed outline to make channels from${why}`);
  }
  if (d.loops.length > IMPORT_LIMITS.maxShapes) throw new ImportError('too-large', `the file has ${d.loops.length} closed loops; a design holds at most ${IMPORT_LIMITS.maxShapes}`);
  const all = [...d.loops.map((l) => l.segments), ...d.wallZones.map((z) => z.loop.segments)].flat();
  const extent = all.reduce((m, s) => Math.max(m, segmentExtent(s)), 0);
  const tol = Math.max(1e-12, extent * 1e-9);
  const shaped = loopsToShapes(d.loops, tol);
  const shapes = shaped.map((s) => s.shape);

  const used = new Set<string>();
  const ports: Port[] = d.ports.map((p, k) => {
    let id = (p.id ?? '').trim().slice(0, 64) || `P${k + 1}`;
    while (used.has(id)) id = `${id}-${k + 1}`;
    used.add(id);
    return { id, ...(p.name ? { name: p.name.slice(0, 200) } : {}), from: p.from, to: p.to, potential: p.potential, pressure: p.pressure };
  });
  const wallZones: WallZone[] = d.wallZones.map((z) => ({ region: region(loopsToShapes([z.loop], tol)[0].shape), zeta: z.zeta }));

  const document = {
    format: DESIGN_FORMAT,
    name: name.slice(0, 200),
    depth: base.depth,
    buffer: base.buffer,
    zeta: base.zeta,
    shapes,
    ports,
    wallZones,
  };
  // Scaling by multiplication leaves 1e-4 as 0.00009999999999999999; 15 significant digits give it back.
  const tidy = JSON.parse(JSON.stringify(document, (_k, v: unknown) => (typeof v === 'number' && v !== 0 ? Number(v.toPrecision(15)) : v)));
  const parsed = parseDesign(tidy);
  if (!parsed.ok) {
    const e = parsed.errors[0];
    throw new ImportError('unsupported', `the drawing does not make a valid design: ${e.field} ${e.message}`);
  }
  const count = (type: Shape['type']) => shapes.filter((s) => s.type === type).length;
  return {
    design: parsed.design,
    report: {
      format: d.format,
      metresPerUnit: d.metresPerUnit,
      unitsSource: d.unitsSource,
      found: {
        loops: shapes.length,
        add: shapes.filter((s) => s.op === 'add').length,
        subtract: shapes.filter((s) => s.op === 'subtract').length,
        circles: count('circle'),
        sectors: count('sector'),
        polygons: count('polygon'),
        ports: ports.length,
        wallZones: wallZones.length,
      },
      skipped: d.skipped,
      bounds: boundsOf(shapes.filter((s) => s.op === 'add')),
    },
  };
}
