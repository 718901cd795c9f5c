/**
 * Design shapes as polygons (metres): outer ring counter-clockwise, holes clockwise.
 *
 * - rect: lower-left corner (x, y), turned by `angle` about that corner;
 * - sector: annular sector about `center` from startAngle to endAngle
 *   (counter-clockwise), exact area (Θ/2)(r_o² − r_i²) by the arc rule in arc.ts;
 *   a full turn becomes a disc or an annulus with a hole;
 * - circle: exact area π r²;
 * - polygon: the points as given, turned counter-clockwise if needed.
 */
import type { Region } from '../../shared/design';
import { cosSinDeg } from './angles';
import { ARC_TOLERANCE, arcVertices, circleVertices } from './arc';
import { orientRing, type PolygonRings, type Ring } from './ring';

export function rectRing(x: number, y: number, width: number, height: number, angleDeg = 0): Ring {
  const [c, s] = cosSinDeg(angleDeg);
  return [
    [x, y],
    [x + width * c, y + width * s],
    [x + width * c - height * s, y + width * s + height * c],
    [x - height * s, y + height * c],
  ];
}

export function sectorRings(
  cx: number,
  cy: number,
  innerRadius: number,
  outerRadius: number,
  startDeg: number,
  endDeg: number,
  tolerance = ARC_TOLERANCE,
): PolygonRings {
  if (endDeg - startDeg >= 360) {
    const outer = circleVertices(cx, cy, outerRadius, tolerance);
    if (innerRadius <= 0) return [outer];
    return [outer, circleVertices(cx, cy, innerRadius, tolerance).reverse()];
  }
  const outer = arcVertices(cx, cy, outerRadius, startDeg, endDeg, tolerance);
  const inner: Ring = innerRadius > 0 ? arcVertices(cx, cy, innerRadius, startDeg, endDeg, tolerance).reverse() : [[cx, cy]];
  return [outer.concat(inner)];
}

/** The outline of a shape or wall-zone region. */
export function shapeOutline(shape: Region, tolerance = ARC_TOLERANCE): PolygonRings {
  switch (shape.type) {
    case 'rect':
      return [rectRing(shape.x, shape.y, shape.width, shape.height, shape.angle)];
    case 'circle':
      return [circleVertices(shape.center[0], shape.center[1], shape.radius, tolerance)];
    case 'sector':
      return sectorRings(
        shape.center[0],
        shape.center[1],
        shape.innerRadius,
        shape.outerRadius,
        shape.startAngle,
        shape.endAngle,
        tolerance,
      );
    case 'polygon':
      return [orientRing(shape.points.map((p) => [p[0], p[1]] as [number, number]), true)];
  }
}

/** Exact area of a shape (m²), for checks and tests. */
export function shapeArea(shape: Region): number {
  switch (shape.type) {
    case 'rect':
      return shape.width * shape.height;
    case 'circle':
      return Math.PI * shape.radius * shape.radius;
    case 'sector': {
      const sweep = (Math.min(shape.endAngle - shape.startAngle, 360) * Math.PI) / 180;
      return (sweep / 2) * (shape.outerRadius ** 2 - shape.innerRadius ** 2);
    }
    case 'polygon': {
      let twice = 0;
      const p = shape.points;
      for (let k = 0; k < p.length; k++) {
        const a = p[k], b = p[(k + 1) % p.length];
        twice += a[0] * b[1] - b[0] * a[1];
      }
      return Math.abs(twice) / 2;
    }
  }
}

/**
 * The smallest feature a shape draws (m): the short side of a rect, the
 * diameter of a circle, the radial width of a sector, 2A/P of a polygon.
 */
export function shapeFeatureSize(shape: Region): number {
  switch (shape.type) {
    case 'rect':
      return Math.min(shape.width, shape.height);
    case 'circle':
      return 2 * shape.radius;
    case 'sector':
      return shape.outerRadius - shape.innerRadius;
    case 'polygon': {
      let perimeter = 0;
      const p = shape.points;
      for (let k = 0; k < p.length; k++) {
        const a = p[k], b = p[(k + 1) % p.length];
        perimeter += Math.hypot(b[0] - a[0], b[1] - a[1]);
      }
      return perimeter > 0 ? (2 * shapeArea(shape)) / perimeter : 0;
    }
  }
}

/** The largest arc radius of a shape (m); 0 for shapes with straight edges only. */
export function shapeArcRadius(shape: Region): number {
  switch (shape.type) {
    case 'circle':
      return shape.radius;
    case 'sector':
      return shape.outerRadius;
    default:
      return 0;
  }
}
