import type { DesignDocument, Port } from '../../../../shared/design';
import { attachedPorts, draggedDocument, nudgedDocument } from './shape-drag';

describe('shape drags', () => {
  const onEnd: Port = { id: 'A', from: [0, 0], to: [0, 5e-5], potential: 0, pressure: 0 };
  const apart: Port = { id: 'B', from: [3e-3, 0], to: [3e-3, 5e-5], potential: 0, pressure: 0 };
  const doc = {
    shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: 1e-3, height: 5e-5, angle: 0 }],
    ports: [onEnd, apart],
  } as unknown as DesignDocument;

  it('takes along the ports on the shape outline only', () => {
    expect(attachedPorts(doc, 0)).toEqual([0]);
  });

  it('moves the shape and its ports with the snapped pointer; no move, no draft', () => {
    const drag = { kind: 'move' as const, index: 0, start: [0, 0] as [number, number], base: doc, ports: [0] };
    const moved = draggedDocument(drag, { snapped: [2e-4, 1e-4], world: [0, 0], free: false })!;
    expect(moved.shapes[0]).toMatchObject({ x: 2e-4, y: 1e-4 });
    expect(moved.ports[0].from).toEqual([2e-4, 1e-4]);
    expect(moved.ports[1]).toBe(apart);
    expect(draggedDocument(drag, { snapped: [0, 0], world: [0, 0], free: false })).toBeNull();
  });

  it('turns in 5° steps, or freely with Alt', () => {
    const pivot: [number, number] = [5e-4, 2.5e-5];
    const drag = { kind: 'rotate' as const, index: 0, pivot, startAngle: 0, base: doc, ports: [0] };
    const at = (deg: number): [number, number] => [pivot[0] + Math.cos((deg * Math.PI) / 180), pivot[1] + Math.sin((deg * Math.PI) / 180)];
    const snapped = draggedDocument(drag, { snapped: [0, 0], world: at(31), free: false })!;
    expect(snapped.shapes[0].type === 'rect' && snapped.shapes[0].angle).toBeCloseTo(30, 9);
    const free = draggedDocument(drag, { snapped: [0, 0], world: at(31), free: true })!;
    expect(free.shapes[0].type === 'rect' && free.shapes[0].angle).toBeCloseTo(31, 9);
    expect(draggedDocument(drag, { snapped: [0, 0], world: at(2), free: false })).toBeNull();
  });

  it('nudges a shape with its ports, or a port alone', () => {
    const shapeMoved = nudgedDocument(doc, { kind: 'shape', index: 0 }, 1e-5, 0);
    expect(shapeMoved.shapes[0]).toMatchObject({ x: 1e-5 });
    expect(shapeMoved.ports[0].from).toEqual([1e-5, 0]);
    const portMoved = nudgedDocument(doc, { kind: 'port', index: 1 }, 0, -1e-5);
    expect(portMoved.shapes).toBe(doc.shapes);
    expect(portMoved.ports[1].from).toEqual([3e-3, -1e-5]);
  });
});
