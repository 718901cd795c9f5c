/**
 * Exact point-in-shape tests for wall-zone regions (no polygon approximation).
 * Points on the boundary count as inside.
 */
import type { Region } from '../../shared/design';
import { cosSinDeg } from './angles';
import { windingNumber } from './ring';

const SLACK = 1e-12;

export function regionContains(region: Region, x: number, y: number): boolean {
  switch (region.type) {
    case 'rect': {
      // Local coordinates: turn (x − x_c, y − y_c) back by −angle.
      const [c, s] = cosSinDeg(region.angle);
      const dx = x - region.x, dy = y - region.y;
      const u = dx * c + dy * s, v = -dx * s + dy * c;
      const eu = SLACK * region.width, ev = SLACK * region.height;
      return u >= -eu && u <= region.width + eu && v >= -ev && v <= region.height + ev;
    }
    case 'circle': {
      const r = region.radius * (1 + SLACK);
      return (x - region.center[0]) ** 2 + (y - region.center[1]) ** 2 <= r * r;
    }
    case 'sector': {
      const dx = x - region.center[0], dy = y - region.center[1];
      const r = Math.hypot(dx, dy);
      if (r < region.innerRadius * (1 - SLACK) || r > region.outerRadius * (1 + SLACK)) return false;
      const sweep = region.endAngle - region.startAngle;
      if (sweep >= 360 || r === 0) return true;
      const theta = (Math.atan2(dy, dx) * 180) / Math.PI;
      const from = (((theta - region.startAngle) % 360) + 360) % 360;
      return from <= sweep + 1e-9 || from >= 360 - 1e-9;
    }
    case 'polygon':
      return windingNumber([region.points as [number, number][]], x, y) !== 0 || onPolygonEdge(region.points, x, y);
  }
}

function onPolygonEdge(points: ReadonlyArray<readonly [number, number]>, x: number, y: number): boolean {
  for (let k = 0; k < points.length; k++) {
    const a = points[k], b = points[(k + 1) % points.length];
    const ex = b[0] - a[0], ey = b[1] - a[1];
    const len2 = ex * ex + ey * ey;
    if (len2 === 0) continue;
    const t = ((x - a[0]) * ex + (y - a[1]) * ey) / len2;
    if (t < 0 || t > 1) continue;
    const dist2 = (a[0] + t * ex - x) ** 2 + (a[1] + t * ey - y) ** 2;
    if (dist2 <= SLACK * SLACK * len2) return true;
  }
  return false;
}
