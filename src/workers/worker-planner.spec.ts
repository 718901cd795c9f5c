import { parseDesign, type DesignDocument } from '../../shared/design';
import { solveDesign } from '../../solver/solve';
import { settingsOf, superposeField, unitResponses, withSettings } from '../../solver/planner';
import cross from '../../tests/fixtures/designs/cross-injector.json';
import { PlannerStore, recombine } from './worker-planner';

function design(): DesignDocument {
  const r = parseDesign(cross);
  if (!r.ok) throw new Error('bad fixture');
  return r.design;
}

describe('the Planner in the solver worker', () => {
  const doc = design();
  // Tight linear solves, so that superposition and a direct solve agree far below any physical tolerance.
  const options = { cells: 50, tolerance: 1e-12 };
  const responses = unitResponses(doc, options);
  const n = responses.results[0].fields.velocityX.length;

  it('recombines |u| in one pass per drive, equal to the magnitude of the superposed components', () => {
    const s = [0, 850, 240, 520];
    const speed = recombine(responses, 'speed', s, new Float32Array(n), new Float32Array(n));
    const u = superposeField(responses, 'velocityX', s), v = superposeField(responses, 'velocityY', s);
    for (let c = 0; c < n; c++) {
      if (Number.isNaN(u[c])) expect(Number.isNaN(speed[c])).toBe(true);
      else expect(speed[c]).toBeCloseTo(Math.hypot(u[c], v[c]), 9);
    }
  });

  it('keeps one basis: the page gets its drives and a copy of the grid, then recombines by id; a released basis is gone', () => {
    const store = new PlannerStore();
    const basis = store.keep(responses);
    expect(basis.drives.map((d) => d.port)).toEqual(doc.ports.filter((p) => p.potential !== null).map((p) => p.id));
    const settings = settingsOf(doc, basis.drives);
    expect(settings).toEqual(basis.drives.map((d) => doc.ports.find((p) => p.id === d.port)!.potential));
    expect(basis.fields.fraction).not.toBe(responses.results[0].fields.fraction);
    expect(Array.from(basis.fields.fraction)).toEqual(Array.from(responses.results[0].fields.fraction));

    // The design's own settings recombine to a direct solve of the design (linearity, physics.md §7).
    const out = store.recombine(basis.id, 'potential', settings);
    if (!out.ok) throw new Error(out.error.message);
    const direct = solveDesign(withSettings(doc, basis.drives, settings), options);
    let worst = 0, scale = 0;
    for (let c = 0; c < n; c++) {
      if (Number.isNaN(direct.fields.potential[c])) continue;
      worst = Math.max(worst, Math.abs(out.values[c] - direct.fields.potential[c]));
      scale = Math.max(scale, Math.abs(direct.fields.potential[c]));
    }
    expect(worst / scale).toBeLessThan(1e-6);
    const largest = Math.max(...direct.ports.map((p) => Math.abs(p.current)));
    out.ports.forEach((p, j) => expect(Math.abs(p.current - direct.ports[j].current)).toBeLessThan(1e-8 * largest));

    // A newer basis replaces it: the old id is refused as stale, not answered from the wrong responses.
    const newer = store.keep(responses);
    const stale = store.recombine(basis.id, 'speed', settings);
    expect(stale.ok).toBe(false);
    if (!stale.ok) expect(stale.error.code).toBe('stale-basis');
    expect(store.recombine(newer.id, 'speed', settings).ok).toBe(true);
    store.release(basis.id);
    expect(store.recombine(newer.id, 'speed', settings).ok).toBe(true);
    store.release(newer.id);
    expect(store.recombine(newer.id, 'speed', settings).ok).toBe(false);
  });

  it('plans on the kept basis, and says why a plan cannot be made', () => {
    const store = new PlannerStore();
    const basis = store.keep(responses);
    const target = { kind: 'flow' as const, port: 'B', value: -1e-12 };
    const planned = store.plan(basis.id, { targets: [target], hold: [{ port: 'B', kind: 'potential', value: 0 }] });
    if (!planned.ok) throw new Error(planned.error.message);
    expect(Math.abs(planned.plan.targets[0].residual)).toBeLessThan(1e-6 * 1e-12);
    const refused = store.plan(basis.id, { targets: [{ kind: 'flow', port: 'nowhere', value: 1 }] });
    expect(refused.ok).toBe(false);
    if (!refused.ok) expect(refused.error.message).toMatch(/nowhere/);
  });
});
