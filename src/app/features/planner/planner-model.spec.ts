import { parseDesign, type DesignDocument } from '../../../../shared/design';
import cross from '../../../../tests/fixtures/designs/cross-injector.json';
import { defaultPortPlans, defaultTargets, planRequest, plannedDesign, responsesKey, rowProblem, sliderRange, toTargets } from './planner-model';

function design(): DesignDocument {
  const r = parseDesign(cross);
  if (!r.ok) throw new Error('bad fixture');
  return r.design;
}

describe('planner model', () => {
  const doc = design();

  it('turns rows into solver targets: direction as the sign, zero flow, pinch ratios', () => {
    expect(
      toTargets([
        { kind: 'speed', port: 'W', value: 1e-3, direction: 'out', of: null },
        { kind: 'flow', port: 'S', value: 2e-12, direction: 'in', of: null },
        { kind: 'zero', port: 'SW', value: null, direction: 'out', of: null },
        { kind: 'ratio', port: 'B', value: 0.5, direction: 'out', of: 'W' },
      ]),
    ).toEqual([
      { kind: 'speed', port: 'W', value: -1e-3 },
      { kind: 'flow', port: 'S', value: 2e-12 },
      { kind: 'flow', port: 'SW', value: 0 },
      { kind: 'ratio', port: 'B', of: 'W', value: 0.5 },
    ]);
    expect(rowProblem({ kind: 'ratio', port: 'B', value: 0.5, direction: 'out', of: 'B' })).toMatch(/other port/);
    expect(rowProblem({ kind: 'flow', port: 'B', value: null, direction: 'out', of: null })).toMatch(/value/);
  });

  it('starts from the design: grounded ports held, the others planned, 1 mm/s out of the grounded port', () => {
    expect(defaultPortPlans(doc).map((p) => p.mode)).toEqual(['hold', 'plan', 'plan', 'plan']);
    expect(defaultTargets(doc)).toEqual([{ kind: 'speed', port: 'B', value: 1e-3, direction: 'out', of: null }]);
    const plans = defaultPortPlans(doc).map((p) => (p.id === 'S' ? { ...p, mode: 'float' as const } : p.id === 'W' ? { ...p, min: 0, max: 1500 } : p));
    const planned = plannedDesign(doc, plans);
    expect(planned.ports.map((p) => p.potential)).toEqual([0, 1000, null, 600]);
    const request = planRequest(defaultTargets(doc), plans, planned, [{ port: 'B', kind: 'potential' }]);
    expect(request.hold).toEqual([{ port: 'B', kind: 'potential', value: 0 }]);
    expect(request.bounds).toEqual([{ port: 'W', kind: 'potential', min: 0, max: 1500 }]);
  });

  it('keeps the unit responses for new voltages, not for a new layout or a floating port', () => {
    const key = responsesKey(doc);
    expect(responsesKey({ ...doc, name: 'other', ports: doc.ports.map((p) => ({ ...p, potential: 5 })) })).toBe(key);
    expect(responsesKey({ ...doc, depth: 3e-5 })).not.toBe(key);
    expect(responsesKey(plannedDesign(doc, defaultPortPlans(doc).map((p) => (p.id === 'S' ? { ...p, mode: 'float' } : p))))).not.toBe(key);
  });

  it('gives sliders a round range around the setting, or the bounds', () => {
    const plan = { id: 'W', mode: 'plan' as const, hold: 0, min: null, max: null };
    expect(sliderRange(1000, plan)).toMatchObject({ min: -2000, max: 2000 });
    expect(sliderRange(30, plan)).toMatchObject({ min: -100, max: 100 });
    expect(sliderRange(30, { ...plan, min: 0, max: 400 })).toMatchObject({ min: 0, max: 400 });
  });
});
