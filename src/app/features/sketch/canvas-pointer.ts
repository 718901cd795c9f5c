/**
 * What the sketch canvas tells its editor about the pointer, and how it reads what the pointer is over from the
 * `data-hit` codes of the drawing (`shape:2`, `port:0`, `rotate`, `problem:1`).
 */
import type { Shape } from '../../../../shared/design';
import type { Segment } from './port-placement';
import type { Vec } from './tool-geometry';

/** What the pointer is over: a shape, a port, the rotate handle or a problem marker (empty space: null). */
export type Hit = { kind: 'shape'; index: number } | { kind: 'port'; index: number } | { kind: 'rotate' } | { kind: 'problem'; index: number };

export type Selection = { kind: 'shape' | 'port'; index: number };

export interface CanvasPointer {
  type: 'down' | 'move' | 'up' | 'click' | 'dblclick' | 'leave';
  /** Where the pointer is (m). */
  world: Vec;
  /** The same point on the snap grid (or as it is while Alt is held). */
  snapped: Vec;
  hit: Hit | null;
  event: MouseEvent;
}

/** What a tool shows while it is being used (m). */
export interface SketchPreview {
  shapes: Shape[];
  points: Vec[];
  /** A rubber-band line from the last point to the pointer. */
  rubber?: [Vec, Vec] | null;
  /** A port that a click would make. */
  segment?: Segment | null;
}

/**
 * Left-button drags: `pan-empty` pans only from empty space (Select moves shapes), `pan-anywhere` pans from
 * anywhere (click tools still get clean clicks), `draw` never pans (Chamber drags a rect). The wheel always zooms
 * and the middle button always pans.
 */
export type DragMode = 'pan-empty' | 'pan-anywhere' | 'draw';

/** What the event target, or the nearest element around it with a `data-hit` code, stands for. */
export function hitOf(target: EventTarget | null): Hit | null {
  const el = target instanceof Element ? target.closest('[data-hit]') : null;
  const code = el?.getAttribute('data-hit');
  if (!code) return null;
  const [kind, index] = code.split(':');
  if (kind === 'rotate') return { kind: 'rotate' };
  if (kind === 'shape' || kind === 'port' || kind === 'problem') return { kind, index: Number(index) };
  return null;
}
