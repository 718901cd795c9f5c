/**
 * Moving and turning shapes in the Select tool: the ports that go with a shape, the document a drag shows as the
 * pointer moves, and the document after an arrow-key nudge. Pure functions of the document (m, degrees).
 */
import type { DesignDocument } from '../../../../shared/design';
import type { Selection } from './canvas-pointer';
import { portsOnShape, rotatePort, rotateShape, shapeBounds, translatePort, translateShape, wrapAngle } from './shape-transform';
import { snapAngle } from './snap';
import { directionDeg, type Vec } from './tool-geometry';

/** A drag in progress: moving or turning a shape from the document it started on, or a chamber being drawn. */
export type Drag =
  | { kind: 'move'; index: number; start: Vec; base: DesignDocument; ports: number[] }
  | { kind: 'rotate'; index: number; pivot: Vec; startAngle: number; base: DesignDocument; ports: number[] }
  | { kind: 'chamber'; start: Vec };

/** The ports that lie on a shape's outline (indices into the document's ports): they move and turn with it. */
export function attachedPorts(doc: DesignDocument, index: number): number[] {
  const shape = doc.shapes[index];
  const b = shapeBounds(shape);
  return portsOnShape(shape, doc.ports, 1e-9 + 1e-7 * Math.max(b[2] - b[0], b[3] - b[1]));
}

/**
 * The document as a move or turn shows it with the pointer at `snapped` (moves) or `world` (turns, in 5° steps
 * unless `free`); null while the drag has not changed anything.
 */
export function draggedDocument(drag: Exclude<Drag, { kind: 'chamber' }>, pointer: { snapped: Vec; world: Vec; free: boolean }): DesignDocument | null {
  const base = drag.base;
  if (drag.kind === 'move') {
    const dx = pointer.snapped[0] - drag.start[0], dy = pointer.snapped[1] - drag.start[1];
    return dx === 0 && dy === 0 ? null : {
      ...base,
      shapes: base.shapes.map((s, k) => (k === drag.index ? translateShape(s, dx, dy) : s)),
      ports: base.ports.map((q, k) => (drag.ports.includes(k) ? translatePort(q, dx, dy) : q)),
    };
  }
  const raw = directionDeg(drag.pivot, pointer.world) - drag.startAngle;
  const deg = pointer.free ? wrapAngle(raw) : snapAngle(wrapAngle(raw), 5);
  return deg === 0 ? null : {
    ...base,
    shapes: base.shapes.map((s, k) => (k === drag.index ? rotateShape(s, deg, drag.pivot) : s)),
    ports: base.ports.map((q, k) => (drag.ports.includes(k) ? rotatePort(q, deg, drag.pivot) : q)),
  };
}

/** The document with the selected port, or the selected shape and its ports, moved by (dx, dy) (m). */
export function nudgedDocument(doc: DesignDocument, sel: Selection, dx: number, dy: number): DesignDocument {
  if (sel.kind === 'shape') {
    const ports = attachedPorts(doc, sel.index);
    return {
      ...doc,
      shapes: doc.shapes.map((s, k) => (k === sel.index ? translateShape(s, dx, dy) : s)),
      ports: doc.ports.map((p, k) => (ports.includes(k) ? translatePort(p, dx, dy) : p)),
    };
  }
  return { ...doc, ports: doc.ports.map((p, k) => (k === sel.index ? translatePort(p, dx, dy) : p)) };
}
