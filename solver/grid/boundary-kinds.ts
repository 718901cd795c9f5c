/**
 * What each outline piece is: a port (the piece lies on a port segment,
 * within half a cell of its line, parallel to it and projecting inside it) or
 * a side wall with its zeta (zeta.side, or the last wall zone containing the
 * piece's midpoint).
 */
import type { Point, WallZone } from '../../shared/design';
import { regionContains } from '../geometry/region-contains';
import { WALL, type BoundarySegments } from './cut-cell-grid';

/** |sin| of the largest angle between a piece and a port that still counts as lying on it (≈ 11.5°). */
export const PORT_PARALLEL_SIN = 0.2;

export interface PortSegment {
  from: Point;
  to: Point;
}

/**
 * Edge parameters in (0, 1) where edge a→b must be cut so that no piece
 * straddles the end of a port lying along it. Coordinates in any common unit;
 * `reach` is half a cell in that unit.
 */
export function portCuts(
  ax: number, ay: number, bx: number, by: number,
  ports: ReadonlyArray<PortSegment>, reach: number,
): number[] {
  const ex = bx - ax, ey = by - ay;
  const len2 = ex * ex + ey * ey;
  if (len2 === 0) return [];
  const len = Math.sqrt(len2);
  const cuts: number[] = [];
  for (const port of ports) {
    const px = port.to[0] - port.from[0], py = port.to[1] - port.from[1];
    const plen = Math.hypot(px, py);
    if (plen === 0 || Math.abs(ex * py - ey * px) > PORT_PARALLEL_SIN * len * plen) continue;
    for (const end of [port.from, port.to]) {
      const dist = Math.abs(ex * (end[1] - ay) - ey * (end[0] - ax)) / len;
      if (dist > reach * (1 + 1e-9)) continue;
      const t = (ex * (end[0] - ax) + ey * (end[1] - ay)) / len2;
      if (t > 0 && t < 1) cuts.push(t);
    }
  }
  return cuts;
}

/**
 * Fills segments.port (−1 or the port index) from the ports' segments (m).
 * `reach` is half a cell (m). A piece claimed by two ports goes to the first;
 * the pairs are returned so the checks can report overlapping ports.
 */
export function assignPorts(
  segments: BoundarySegments,
  ports: ReadonlyArray<PortSegment>,
  reach: number,
): { portLength: Float64Array; overlaps: Array<[number, number]> } {
  const portLength = new Float64Array(ports.length);
  const overlaps = new Map<string, [number, number]>();
  segments.port.fill(WALL);
  for (let k = 0; k < ports.length; k++) {
    const [fx, fy] = ports[k].from;
    const px = ports[k].to[0] - fx, py = ports[k].to[1] - fy;
    const plen = Math.hypot(px, py);
    if (plen === 0) continue;
    const tx = px / plen, ty = py / plen;
    const slack = 1e-9 * plen;
    for (let s = 0; s < segments.count; s++) {
      const rx = segments.midX[s] - fx, ry = segments.midY[s] - fy;
      const along = rx * tx + ry * ty;
      if (along < -slack || along > plen + slack) continue;
      if (Math.abs(rx * ty - ry * tx) > reach * (1 + 1e-9)) continue;
      // The piece's direction is (−normalY, normalX); it must run along the port.
      if (Math.abs(segments.normalX[s] * tx + segments.normalY[s] * ty) > PORT_PARALLEL_SIN) continue;
      const owner = segments.port[s];
      if (owner !== WALL) {
        overlaps.set(`${owner},${k}`, [owner, k]);
        continue;
      }
      segments.port[s] = k;
      portLength[k] += segments.length[s];
    }
  }
  return { portLength, overlaps: [...overlaps.values()] };
}

/** Fills segments.zeta: zeta.side, overridden by each wall zone (in order) that holds the midpoint. */
export function assignZeta(segments: BoundarySegments, sideZeta: number, zones: ReadonlyArray<WallZone>): void {
  segments.zeta.fill(sideZeta);
  for (const zone of zones) {
    for (let s = 0; s < segments.count; s++) {
      if (regionContains(zone.region, segments.midX[s], segments.midY[s])) segments.zeta[s] = zone.zeta;
    }
  }
}
