/**
 * Splitting outline edges into pieces that each lie in one grid cell.
 *
 * Coordinates here are grid units: u = (x − x0)/h, v = (y − y0)/h, so cell
 * (i, j) is the unit square [i, i+1] × [j, j+1]. An edge is cut where it
 * crosses a grid line (and at any extra parameters, e.g. the ends of a port);
 * crossing points are placed exactly on the line, so each piece lies inside
 * one cell. A piece lying exactly on a grid line goes to the cell on its
 * fluid side (the fluid is on the left of the direction of travel).
 */

export interface Pieces {
  count: number;
  cell: Int32Array;
  ax: Float64Array;
  ay: Float64Array;
  bx: Float64Array;
  by: Float64Array;
}

export function createPieces(capacity = 1024): Pieces {
  return {
    count: 0,
    cell: new Int32Array(capacity),
    ax: new Float64Array(capacity),
    ay: new Float64Array(capacity),
    bx: new Float64Array(capacity),
    by: new Float64Array(capacity),
  };
}

function grow(p: Pieces): void {
  const n = p.cell.length * 2;
  const copy = <T extends Int32Array | Float64Array>(a: T, make: (n: number) => T): T => {
    const b = make(n);
    b.set(a);
    return b;
  };
  p.cell = copy(p.cell, (n) => new Int32Array(n));
  p.ax = copy(p.ax, (n) => new Float64Array(n));
  p.ay = copy(p.ay, (n) => new Float64Array(n));
  p.bx = copy(p.bx, (n) => new Float64Array(n));
  p.by = copy(p.by, (n) => new Float64Array(n));
}

/** Shortest piece kept, in grid units. */
const MIN_PIECE = 1e-12;
/** Crossings closer than this in the edge parameter are one point (a grid vertex). */
const SAME_T = 1e-12;

// Scratch space reused between calls (kept small; grows on demand).
let scratchT = new Float64Array(64);
let scratchU = new Float64Array(64);
let scratchV = new Float64Array(64);
let scratchKind = new Uint8Array(64); // bit 1: on a vertical line, bit 2: on a horizontal line

function ensureScratch(n: number): void {
  if (scratchT.length >= n) return;
  const size = Math.max(n, scratchT.length * 2);
  scratchT = new Float64Array(size);
  scratchU = new Float64Array(size);
  scratchV = new Float64Array(size);
  scratchKind = new Uint8Array(size);
}

/**
 * Adds the pieces of edge (ua, va) → (ub, vb) to `pieces`.
 * `extra` holds edge parameters in (0, 1) where the edge must also be cut.
 */
export function splitEdge(
  pieces: Pieces,
  nx: number,
  ny: number,
  ua: number,
  va: number,
  ub: number,
  vb: number,
  extra: ReadonlyArray<number> = [],
): void {
  const du = ub - ua, dv = vb - va;
  const kxFirst = du > 0 ? Math.floor(ua) + 1 : Math.ceil(ua) - 1;
  const kyFirst = dv > 0 ? Math.floor(va) + 1 : Math.ceil(va) - 1;
  const countX = du > 0 ? Math.max(0, Math.ceil(ub) - kxFirst) : du < 0 ? Math.max(0, kxFirst - Math.floor(ub)) : 0;
  const countY = dv > 0 ? Math.max(0, Math.ceil(vb) - kyFirst) : dv < 0 ? Math.max(0, kyFirst - Math.floor(vb)) : 0;
  ensureScratch(countX + countY + extra.length + 2);

  // Merge the x-line and y-line crossings (each already ordered in t).
  let n = 0;
  const push = (t: number, u: number, v: number, kind: number) => {
    scratchT[n] = t; scratchU[n] = u; scratchV[n] = v; scratchKind[n] = kind; n++;
  };
  push(0, ua, va, 0);
  const sx = du > 0 ? 1 : -1, sy = dv > 0 ? 1 : -1;
  let ix = 0, iy = 0;
  while (ix < countX || iy < countY) {
    const kx = kxFirst + sx * ix, ky = kyFirst + sy * iy;
    const tx = ix < countX ? (kx - ua) / du : Infinity;
    const ty = iy < countY ? (ky - va) / dv : Infinity;
    if (Math.abs(tx - ty) <= SAME_T) {
      push(tx, kx, ky, 3); ix++; iy++;
    } else if (tx < ty) {
      push(tx, kx, va + tx * dv, 1); ix++;
    } else {
      push(ty, ua + ty * du, ky, 2); iy++;
    }
  }
  push(1, ub, vb, 0);

  // Extra cuts: insert in order (there are only a few).
  for (const t of extra) {
    if (!(t > SAME_T && t < 1 - SAME_T)) continue;
    let at = 1;
    while (at < n && scratchT[at] < t) at++;
    if (Math.abs(scratchT[at] - t) <= SAME_T || Math.abs(scratchT[at - 1] - t) <= SAME_T) continue;
    for (let k = n; k > at; k--) {
      scratchT[k] = scratchT[k - 1]; scratchU[k] = scratchU[k - 1]; scratchV[k] = scratchV[k - 1]; scratchKind[k] = scratchKind[k - 1];
    }
    scratchT[at] = t; scratchU[at] = ua + t * du; scratchV[at] = va + t * dv; scratchKind[at] = 0;
    n++;
  }

  for (let k = 0; k + 1 < n; k++) {
    const pu = scratchU[k], pv = scratchV[k], qu = scratchU[k + 1], qv = scratchV[k + 1];
    if (Math.hypot(qu - pu, qv - pv) < MIN_PIECE) continue;
    let i: number, j: number;
    if (pu === qu && Number.isInteger(pu)) {
      // On a vertical grid line: fluid on the left of travel, so +u side when going down.
      i = qv < pv ? pu : pu - 1;
      j = Math.floor((pv + qv) / 2);
    } else if (pv === qv && Number.isInteger(pv)) {
      // On a horizontal grid line: fluid on the +v side when going in +u.
      j = qu > pu ? pv : pv - 1;
      i = Math.floor((pu + qu) / 2);
    } else {
      i = Math.floor((pu + qu) / 2);
      j = Math.floor((pv + qv) / 2);
    }
    i = Math.min(nx - 1, Math.max(0, i));
    j = Math.min(ny - 1, Math.max(0, j));
    if (pieces.count === pieces.cell.length) grow(pieces);
    const s = pieces.count++;
    pieces.cell[s] = i + j * nx;
    pieces.ax[s] = pu; pieces.ay[s] = pv; pieces.bx[s] = qu; pieces.by[s] = qv;
  }
}
