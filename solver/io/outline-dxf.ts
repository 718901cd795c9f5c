/**
 * The mask outline as ASCII DXF (AutoCAD 2000 group codes): $INSUNITS 13 (micrometres) with coordinates in µm;
 * each loop of the fluid a closed LWPOLYLINE on layer "outline" whose arc segments carry their bulge
 * (tan of a quarter of the sweep, positive counter-clockwise), whole circles as CIRCLE; ports as LINE with a
 * TEXT of their id on layer "ports"; wall zones as closed LWPOLYLINE on layer "wall-zones" with a TEXT
 * "zeta=VOLTS" inside each (a DXF has no other place for the value; our import reads it back).
 */
import type { DesignDocument, Region } from '../../shared/design';
import { rectRing } from '../geometry/shape-outline';
import { maskOutline, regionLoop } from './mask-outline';
import type { Loop } from './outline';
import { um } from './outline-svg';

const LAYERS: Array<[string, number]> = [['outline', 4], ['ports', 30], ['wall-zones', 6]];

/** A point inside a region, where its zeta label goes. */
function insidePoint(r: Region): [number, number] {
  switch (r.type) {
    case 'rect': {
      const ring = rectRing(r.x, r.y, r.width, r.height, r.angle);
      return [(ring[0][0] + ring[2][0]) / 2, (ring[0][1] + ring[2][1]) / 2];
    }
    case 'circle':
      return r.center;
    case 'sector': {
      const mid = ((r.startAngle + r.endAngle) / 2) * (Math.PI / 180);
      const rr = (r.innerRadius + r.outerRadius) / 2;
      return [r.center[0] + rr * Math.cos(mid), r.center[1] + rr * Math.sin(mid)];
    }
    case 'polygon': {
      const [a, b, c] = r.points;
      return [(a[0] + b[0] + c[0]) / 3, (a[1] + b[1] + c[1]) / 3];
    }
  }
}

function regionSize(r: Region): number {
  if (r.type === 'rect') return Math.min(r.width, r.height);
  if (r.type === 'circle') return r.radius;
  if (r.type === 'sector') return r.outerRadius - r.innerRadius;
  return Math.hypot(r.points[1][0] - r.points[0][0], r.points[1][1] - r.points[0][1]);
}

class DxfWriter {
  private readonly out: string[] = [];
  private handle = 0x100;

  group(code: number, value: string | number): this {
    this.out.push(String(code), String(value));
    return this;
  }

  entity(type: string, layer: string): this {
    return this.group(0, type).group(5, (this.handle++).toString(16).toUpperCase()).group(100, 'AcDbEntity').group(8, layer);
  }

  loop(loop: Loop, layer: string): void {
    const segs = loop.segments;
    if (segs.length === 1 && segs[0].kind === 'arc' && Math.abs(segs[0].sweep) >= 2 * Math.PI - 1e-9) {
      const s = segs[0];
      this.entity('CIRCLE', layer).group(100, 'AcDbCircle').group(10, um(s.center[0])).group(20, um(s.center[1])).group(30, 0).group(40, um(s.radius));
      return;
    }
    this.entity('LWPOLYLINE', layer).group(100, 'AcDbPolyline').group(90, segs.length).group(70, 1);
    for (const s of segs) {
      this.group(10, um(s.a[0])).group(20, um(s.a[1]));
      if (s.kind === 'arc') this.group(42, Math.tan(s.sweep / 4).toPrecision(15));
    }
  }

  text(): string {
    return this.out.join('\n') + '\n';
  }
}

export function designToDxf(design: DesignDocument): string {
  const w = new DxfWriter();
  const mask = maskOutline(design);
  const [x0, y0, x1, y1] = Number.isFinite(mask.bounds[0]) ? mask.bounds : [0, 0, 0, 0];
  w.group(999, `Osmolane channel outline: ${design.name.replace(/[\r\n]+/g, ' ').slice(0, 200)}; units micrometres`);
  w.group(0, 'SECTION').group(2, 'HEADER');
  w.group(9, '$ACADVER').group(1, 'AC1015');
  w.group(9, '$INSUNITS').group(70, 13);
  w.group(9, '$MEASUREMENT').group(70, 1);
  w.group(9, '$EXTMIN').group(10, um(x0)).group(20, um(y0)).group(30, 0);
  w.group(9, '$EXTMAX').group(10, um(x1)).group(20, um(y1)).group(30, 0);
  w.group(0, 'ENDSEC');
  w.group(0, 'SECTION').group(2, 'TABLES').group(0, 'TABLE').group(2, 'LAYER').group(70, LAYERS.length);
  for (const [name, colour] of LAYERS) w.group(0, 'LAYER').group(2, name).group(70, 0).group(62, colour).group(6, 'CONTINUOUS');
  w.group(0, 'ENDTAB').group(0, 'ENDSEC');
  w.group(0, 'SECTION').group(2, 'ENTITIES');
  for (const poly of mask.polygons) for (const loop of poly.loops) w.loop(loop, 'outline');
  for (const p of design.ports) {
    w.entity('LINE', 'ports').group(100, 'AcDbLine')
      .group(10, um(p.from[0])).group(20, um(p.from[1])).group(30, 0)
      .group(11, um(p.to[0])).group(21, um(p.to[1])).group(31, 0);
    const len = Math.hypot(p.to[0] - p.from[0], p.to[1] - p.from[1]);
    w.entity('TEXT', 'ports').group(100, 'AcDbText')
      .group(10, um((p.from[0] + p.to[0]) / 2)).group(20, um((p.from[1] + p.to[1]) / 2)).group(30, 0)
      .group(40, um(len / 4)).group(1, p.id.replace(/[\r\n]+/g, ' '));
  }
  design.wallZones.forEach((z, k) => {
    w.loop(regionLoop(z.region, `wall zone ${k + 1}`), 'wall-zones');
    const [x, y] = insidePoint(z.region);
    w.entity('TEXT', 'wall-zones').group(100, 'AcDbText').group(10, um(x)).group(20, um(y)).group(30, 0)
      .group(40, um(regionSize(z.region) / 10)).group(1, `zeta=${z.zeta}`);
  });
  w.group(0, 'ENDSEC').group(0, 'EOF');
  return w.text();
}
