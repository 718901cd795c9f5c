/**
 * Joins open chains of segments end to end into closed loops: drawings often give a channel's outline as
 * separate LINE and ARC entities (or open paths) that only meet at their ends. Ends closer than `tolerance`
 * meet; a chain may be walked backwards. What cannot be closed is returned as open chains for the report.
 */
import type { Vec2 } from '../geometry/ring';
import { gap, reverseSegment, type Segment } from './outline';

export interface Chain {
  segments: Segment[];
  source: string;
}

export interface Joined {
  loops: Chain[];
  open: Chain[];
}

const first = (c: Chain): Vec2 => c.segments[0].a;
const last = (c: Chain): Vec2 => c.segments[c.segments.length - 1].b;

function reversed(c: Chain): Chain {
  return { source: c.source, segments: c.segments.map(reverseSegment).reverse() };
}

/** Snaps the ends of consecutive segments onto each other (they are within tolerance already). */
function weld(segments: Segment[]): Segment[] {
  for (let k = 1; k < segments.length; k++) segments[k] = { ...segments[k], a: segments[k - 1].b };
  return segments;
}

export function isClosed(c: Chain, tolerance: number): boolean {
  return c.segments.length > 0 && gap(first(c), last(c)) <= tolerance;
}

/** Closes chains whose ends meet and joins the rest end to end (spatial hash on the ends, cell = tolerance). */
export function joinChains(chains: ReadonlyArray<Chain>, tolerance: number): Joined {
  const loops: Chain[] = [];
  const pending: Chain[] = [];
  for (const c of chains) {
    if (c.segments.length === 0) continue;
    if (isClosed(c, tolerance) && !(c.segments.length === 1 && c.segments[0].kind === 'line')) loops.push(c);
    else pending.push(c);
  }
  const cell = Math.max(tolerance, 1e-300);
  const key = (p: Vec2) => `${Math.floor(p[0] / cell)},${Math.floor(p[1] / cell)}`;
  const index = new Map<string, Set<number>>();
  const add = (p: Vec2, id: number) => {
    const k = key(p);
    let s = index.get(k);
    if (!s) index.set(k, (s = new Set()));
    s.add(id);
  };
  pending.forEach((c, id) => {
    add(first(c), id);
    add(last(c), id);
  });
  const used = new Array<boolean>(pending.length).fill(false);
  const near = (p: Vec2, self: number): { id: number; atStart: boolean } | null => {
    const i = Math.floor(p[0] / cell), j = Math.floor(p[1] / cell);
    let best: { id: number; atStart: boolean; d: number } | null = null;
    for (let di = -1; di <= 1; di++) {
      for (let dj = -1; dj <= 1; dj++) {
        for (const id of index.get(`${i + di},${j + dj}`) ?? []) {
          if (id === self || used[id]) continue;
          const c = pending[id];
          const ds = gap(first(c), p), de = gap(last(c), p);
          if (ds <= tolerance && (!best || ds < best.d)) best = { id, atStart: true, d: ds };
          if (de <= tolerance && (!best || de < best.d)) best = { id, atStart: false, d: de };
        }
      }
    }
    return best;
  };
  const open: Chain[] = [];
  for (let start = 0; start < pending.length; start++) {
    if (used[start]) continue;
    used[start] = true;
    let chain: Chain = { source: pending[start].source, segments: [...pending[start].segments] };
    const sources = new Set([pending[start].source]);
    // Grow forward from the end, then (turned round) from the other end.
    for (let pass = 0; pass < 2 && !isClosed(chain, tolerance); pass++) {
      for (;;) {
        if (chain.segments.length > 1 && isClosed(chain, tolerance)) break;
        const hit = near(last(chain), start);
        if (!hit) break;
        used[hit.id] = true;
        const next = hit.atStart ? pending[hit.id] : reversed(pending[hit.id]);
        chain.segments.push(...next.segments);
        sources.add(next.source);
      }
      if (!isClosed(chain, tolerance)) chain = reversed(chain);
    }
    const source = sources.size === 1 ? chain.source : `${sources.size} joined entities (${[...sources].slice(0, 3).join(', ')}${sources.size > 3 ? ', …' : ''})`;
    const whole = { source, segments: weld(chain.segments) };
    if (chain.segments.length > 1 && isClosed(chain, tolerance)) loops.push(whole);
    else open.push(whole);
  }
  return { loops, open };
}
