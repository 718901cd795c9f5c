import { parseDesign, type DesignDocument } from '../../shared/design';
import { junctionShapes } from '../app/features/sketch/tool-geometry';
import { liveProblems } from './worker-live-checks';

function design(partial: Record<string, unknown>): DesignDocument {
  const r = parseDesign({
    format: 'osmolane.design/1',
    name: 'Checks',
    depth: 2e-5,
    buffer: { relativePermittivity: 78.4, viscosity: 8.9e-4, density: 997, conductivity: 0.14, ionicStrength: 10, temperature: 298.15 },
    zeta: { side: -0.05 },
    shapes: junctionShapes('tee', [0, 0], 5e-4, 5e-5),
    ports: [],
    ...partial,
  });
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.design;
}

const port = (id: string, from: [number, number], to: [number, number], potential: number | null) => ({ id, from, to, potential, pressure: 0 });

describe('liveProblems', () => {
  it('finds nothing wrong with a T junction driven from its three ends', () => {
    const doc = design({
      ports: [port('A', [-5e-4, -2.5e-5], [-5e-4, 2.5e-5], 100), port('B', [5e-4, -2.5e-5], [5e-4, 2.5e-5], 0), port('C', [-2.5e-5, -5e-4], [2.5e-5, -5e-4], null)],
    });
    expect(liveProblems(doc)).toEqual([]);
  });

  it('points at a port that is not on the outline', () => {
    const doc = design({ ports: [port('A', [-5e-4, -2.5e-5], [-5e-4, 2.5e-5], 100), port('B', [0, 3e-4], [5e-5, 3e-4], 0)] });
    const off = liveProblems(doc).find((p) => p.code === 'port-off-outline');
    expect(off?.field).toBe('ports[1]');
    expect(off?.at?.[1]).toBeCloseTo(3e-4, 12);
  });
});
