import type { CanvasPointer } from './canvas-pointer';
import type { Vec } from './tool-geometry';
import { DEFAULT_TOOL_SETTINGS, constrained, toolClick, toolPreview, type ToolState } from './tool-steps';

describe('tool steps', () => {
  const state = (partial: Partial<ToolState>): ToolState => ({ tool: 'select', points: [], chamberStart: null, settings: DEFAULT_TOOL_SETTINGS, junctionKind: 'tee', ...partial });
  const hover = (at: Vec, shiftKey = false): CanvasPointer => ({ type: 'move', world: at, snapped: at, hit: null, event: { shiftKey } as MouseEvent });
  const noSegment = () => null;

  it('turns the end of a line to the nearest 15° with Shift', () => {
    expect(constrained([0, 0], [1, 0.1], false)).toEqual([1, 0.1]);
    const end = constrained([0, 0], [1, 0.1], true);
    expect(end[0]).toBeCloseTo(Math.hypot(1, 0.1), 12);
    expect(end[1]).toBeCloseTo(0, 12);
  });

  it('draws a straight channel in two clicks, or says why not', () => {
    const first = toolClick(state({ tool: 'straight' }), [0, 0], false, 1e-5);
    expect(first).toEqual({ points: [[0, 0]] });
    const second = toolClick(state({ tool: 'straight', points: [[0, 0]] }), [1e-3, 0], false, 1e-5);
    expect(second.points).toEqual([]);
    expect(second.shapes).toEqual([{ op: 'add', type: 'rect', x: 0, y: -2.5e-5, width: 1e-3, height: 5e-5, angle: 0 }]);
    expect(toolClick(state({ tool: 'straight', points: [[0, 0]] }), [0, 0], false, 1e-5)).toEqual({ points: [], notice: expect.stringContaining('The end is on the start') });
  });

  it('collects freeform corners and closes on a click near the first', () => {
    const pts: Vec[] = [[0, 0], [1e-4, 0], [1e-4, 1e-4]];
    expect(toolClick(state({ tool: 'freeform', points: pts }), [0, 1e-4], false, 1e-5)).toEqual({ points: [...pts, [0, 1e-4]] });
    expect(toolClick(state({ tool: 'freeform', points: pts }), [5e-6, 0], false, 1e-5)).toEqual({ close: true });
  });

  it('says why a junction with legs too short cannot be drawn, and adds a pillar where clicked', () => {
    const short = { ...DEFAULT_TOOL_SETTINGS, junctionLeg: 1e-5 };
    expect(toolClick(state({ tool: 'junction', settings: short }), [0, 0], false, 1e-5)).toEqual({ notice: 'The legs must be longer than half their width.' });
    expect(toolClick(state({ tool: 'pillar' }), [1e-4, 0], false, 1e-5).shapes).toHaveLength(1);
  });

  it('previews the channel to the pointer, and the port a click would make', () => {
    const p = toolPreview(state({ tool: 'straight', points: [[0, 0]] }), hover([1e-3, 0]), noSegment)!;
    expect(p.rubber).toEqual([[0, 0], [1e-3, 0]]);
    expect(p.shapes).toHaveLength(1);
    expect(toolPreview(state({ tool: 'straight' }), hover([1e-3, 0]), noSegment)).toBeNull();
    const segment = { from: [0, 0] as Vec, to: [0, 5e-5] as Vec };
    expect(toolPreview(state({ tool: 'port' }), hover([0, 2e-5]), () => segment)).toEqual({ shapes: [], points: [], segment });
    expect(toolPreview(state({ tool: 'select' }), hover([0, 0]), noSegment)).toBeNull();
  });
});
