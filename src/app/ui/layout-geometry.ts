import type { DesignDocument, Region, Shape } from '../core/api-types';

/**
 * Plain SVG drawing of a design document for small previews (template choice, history pins): display units are
 * micrometres with y pointing down, so a design point (x, y) in metres lands at (x·1e6, −y·1e6).
 */
export const UM = 1e6;

export interface Box {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

export function toDisplay(p: readonly [number, number]): [number, number] {
  return [p[0] * UM, -p[1] * UM];
}

export function fromDisplay(p: readonly [number, number]): [number, number] {
  return [p[0] / UM, -p[1] / UM];
}

const rad = (deg: number) => (deg * Math.PI) / 180;

function rectCorners(r: Extract<Region, { type: 'rect' }>): [number, number][] {
  const c = Math.cos(rad(r.angle ?? 0));
  const s = Math.sin(rad(r.angle ?? 0));
  const local: [number, number][] = [
    [0, 0],
    [r.width, 0],
    [r.width, r.height],
    [0, r.height],
  ];
  return local.map(([u, v]) => [r.x + u * c - v * s, r.y + u * s + v * c]);
}

function arcPoint(center: readonly [number, number], radius: number, deg: number): [number, number] {
  return [center[0] + radius * Math.cos(rad(deg)), center[1] + radius * Math.sin(rad(deg))];
}

/** Points (metres) that bound a region; arcs are sampled every 10 degrees. */
export function outlinePoints(region: Region): [number, number][] {
  switch (region.type) {
    case 'rect':
      return rectCorners(region);
    case 'circle': {
      const [cx, cy] = region.center;
      return [
        [cx - region.radius, cy - region.radius],
        [cx + region.radius, cy + region.radius],
      ];
    }
    case 'polygon':
      return region.points.map((p) => [p[0], p[1]]);
    case 'sector': {
      const pts: [number, number][] = [];
      const steps = Math.max(2, Math.ceil((region.endAngle - region.startAngle) / 10));
      for (let k = 0; k <= steps; k++) {
        const a = region.startAngle + ((region.endAngle - region.startAngle) * k) / steps;
        pts.push(arcPoint(region.center, region.outerRadius, a));
        pts.push(region.innerRadius > 0 ? arcPoint(region.center, region.innerRadius, a) : [region.center[0], region.center[1]]);
      }
      return pts;
    }
  }
}

/** Bounding box of the layout in display units (µm, y down), or null for an empty layout. */
export function displayBox(doc: Pick<DesignDocument, 'shapes' | 'ports'>): Box | null {
  const pts: [number, number][] = [];
  for (const shape of doc.shapes) if (shape.op === 'add') pts.push(...outlinePoints(shape));
  for (const port of doc.ports) pts.push([port.from[0], port.from[1]], [port.to[0], port.to[1]]);
  if (pts.length === 0) return null;
  const box: Box = { minX: Infinity, minY: Infinity, maxX: -Infinity, maxY: -Infinity };
  for (const p of pts) {
    const [x, y] = toDisplay(p);
    box.minX = Math.min(box.minX, x);
    box.maxX = Math.max(box.maxX, x);
    box.minY = Math.min(box.minY, y);
    box.maxY = Math.max(box.maxY, y);
  }
  return box;
}

const f = (v: number) => Number(v.toFixed(3));

/** SVG path data (display units) of a region. */
export function regionPath(region: Region): string {
  switch (region.type) {
    case 'rect':
    case 'polygon': {
      const pts = region.type === 'rect' ? rectCorners(region) : region.points;
      return pts.map((p, k) => `${k === 0 ? 'M' : 'L'}${toDisplay(p).map(f).join(' ')}`).join(' ') + ' Z';
    }
    case 'circle': {
      const [cx, cy] = toDisplay(region.center);
      const r = region.radius * UM;
      return `M${f(cx - r)} ${f(cy)} A${f(r)} ${f(r)} 0 1 0 ${f(cx + r)} ${f(cy)} A${f(r)} ${f(r)} 0 1 0 ${f(cx - r)} ${f(cy)} Z`;
    }
    case 'sector': {
      // Counter-clockwise in the design is sweep-flag 0 on the y-down display.
      const sweep = region.endAngle - region.startAngle;
      if (sweep >= 360) {
        const outer = regionPath({ type: 'circle', center: region.center, radius: region.outerRadius });
        if (region.innerRadius <= 0) return outer;
        return `${outer} ${regionPath({ type: 'circle', center: region.center, radius: region.innerRadius })}`;
      }
      const large = sweep > 180 ? 1 : 0;
      const R = region.outerRadius * UM;
      const r = region.innerRadius * UM;
      const o0 = toDisplay(arcPoint(region.center, region.outerRadius, region.startAngle)).map(f);
      const o1 = toDisplay(arcPoint(region.center, region.outerRadius, region.endAngle)).map(f);
      let d = `M${o0.join(' ')} A${f(R)} ${f(R)} 0 ${large} 0 ${o1.join(' ')}`;
      if (r > 0) {
        const i1 = toDisplay(arcPoint(region.center, region.innerRadius, region.endAngle)).map(f);
        const i0 = toDisplay(arcPoint(region.center, region.innerRadius, region.startAngle)).map(f);
        d += ` L${i1.join(' ')} A${f(r)} ${f(r)} 0 ${large} 1 ${i0.join(' ')}`;
      } else {
        d += ` L${toDisplay(region.center).map(f).join(' ')}`;
      }
      return `${d} Z`;
    }
  }
}

export function shapePath(shape: Shape): string {
  return regionPath(shape);
}

/** A round length for a scale bar about a fifth of `span` (µm): 1, 2 or 5 times a power of ten. */
export function scaleBarLength(span: number): number {
  const target = span / 5;
  if (!(target > 0)) return 1;
  const p = 10 ** Math.floor(Math.log10(target));
  for (const m of [5, 2, 1]) if (m * p <= target) return m * p;
  return p;
}

/** "500 µm", "2 mm". */
export function formatLength(um: number): string {
  if (um >= 1000) return `${Number((um / 1000).toPrecision(3))} mm`;
  return `${Number(um.toPrecision(3))} µm`;
}
