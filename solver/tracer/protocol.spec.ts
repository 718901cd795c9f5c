import { loadFixture, makeDesign } from '../../tests/fixtures/designs';
import { discretiseDesign } from '../grid/discretise';
import { SolveError } from '../result/errors';
import { solveDesign } from '../solve';
import { clipToFluid, phaseDesign, runTrace } from './protocol';
import { guessCrossRoles, pinchedPlug } from './pinched';
import { gridForSolve } from './trace-fields';

const channel = makeDesign({
  shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: 2e-3, height: 5e-5 }],
  ports: [
    { id: 'A', from: [0, 0], to: [0, 5e-5], potential: 200 },
    { id: 'B', from: [2e-3, 0], to: [2e-3, 5e-5], potential: 0 },
  ],
});
const species = { mobility: 0, diffusivity: 1e-10 };

describe('tracing a solved design', () => {
  it('rebuilds the grid of a solve from the same cells, and refuses another one', () => {
    const solved = solveDesign(channel, { cells: 100 });
    const { grid } = gridForSolve(channel, solved.fields, 100);
    expect([grid.nx, grid.ny, grid.spacing]).toEqual([solved.grid.nx, solved.grid.ny, solved.grid.spacing]);
    expect(() => gridForSolve(channel, solved.fields, 120)).toThrow(/not the solve's/);
  });

  it('runs until the band has passed the detector, and is reproducible from its seed', () => {
    const request = {
      species,
      injection: { kind: 'line' as const, from: [2e-4, -1e-5] as [number, number], to: [2e-4, 6e-5] as [number, number] },
      detector: { from: [1.5e-3, 0] as [number, number], to: [1.5e-3, 5e-5] as [number, number] },
      particles: 200,
      seed: 11,
      cells: 100,
      frames: 5,
    };
    const a = runTrace(channel, request);
    expect(a.automatic).toBe(true);
    expect(a.trace.detector?.arrived).toBe(200);
    // Plug flow u = μ_eo E: the mean arrival time is the distance over the speed.
    const speed = a.trace.detector!.speed;
    expect(a.trace.detector!.meanTime * speed).toBeCloseTo(1.3e-3, 4);
    expect(Array.from(runTrace(channel, request).trace.arrivals.time)).toEqual(Array.from(a.trace.arrivals.time));
    expect(Array.from(runTrace(channel, { ...request, seed: 12 }).trace.arrivals.time)).not.toEqual(Array.from(a.trace.arrivals.time));
  });

  it('keeps the fluid part of an injection line drawn past the walls', () => {
    const region = discretiseDesign(channel, { cells: 100 }).region!;
    const clipped = clipToFluid({ kind: 'line', from: [2e-4, -3e-5], to: [2e-4, 8e-5] }, region);
    expect(clipped.from[0]).toBeCloseTo(2e-4, 12);
    expect(clipped.from[1]).toBeGreaterThan(0);
    expect(clipped.from[1]).toBeLessThan(1e-9);
    expect(clipped.to[1]).toBeLessThan(5e-5);
    expect(clipped.to[1]).toBeGreaterThan(5e-5 - 1e-9);
    expect(() => clipToFluid({ kind: 'line', from: [2e-4, 1e-4], to: [3e-4, 2e-4] }, region)).toThrow(/does not cross the fluid/);
  });

  it('refuses phases that name unknown ports, miss a duration, or a detector the band never reaches', () => {
    expect(() => phaseDesign(channel, { label: 'x', potentials: { Q: 1 } })).toThrow(/port "Q"/);
    const base = { species, injection: { kind: 'line' as const, from: [2e-4, 0] as [number, number], to: [2e-4, 5e-5] as [number, number] }, cells: 60, particles: 20 };
    expect(() => runTrace(channel, { ...base, phases: [{ potentials: { A: 0 } }, { duration: 1 }] })).toThrow(/phase 1 needs a duration/);
    expect(() => runTrace(channel, { ...base, detector: { from: [1e-4, 0], to: [1e-4, 5e-5] } })).toThrow(SolveError);
    expect(() => runTrace(channel, base)).toThrow(/give the last phase a duration, or a detector/);
  });
});

describe('pinched plug at a cross', () => {
  const design = loadFixture('cross-injector');

  it('finds the roles and the cross, and sets loading then dispensing potentials', () => {
    const roles = guessCrossRoles(design)!;
    expect(roles).toEqual({ sample: 'S', sampleWaste: 'SW', buffer: 'B', waste: 'W' });
    const preset = pinchedPlug(design, roles, { voltage: 500 });
    expect(preset.centre[0]).toBeCloseTo(1e-3, 9);
    expect(preset.centre[1]).toBeCloseTo(1e-3, 9);
    const [loading, dispensing] = preset.phases;
    // Negative walls: species move from high to low potential. Loading S → SW with the side legs pushing in.
    expect(loading.potentials).toEqual({ S: 500, SW: 0, B: 300, W: 300 });
    expect(loading.duration).toBeGreaterThan(0);
    // Dispensing B → W, both sample legs a little below the cross (pull-back); it runs until the plug passes.
    expect(dispensing.potentials!.B).toBe(500);
    expect(dispensing.potentials!.W).toBe(0);
    expect(dispensing.potentials!.S).toBeLessThan((500 * 2) / 3);
    expect(dispensing.duration).toBeUndefined();
    expect(guessCrossRoles({ ports: design.ports.slice(0, 3) })).toBeNull();
  });

  it('sends a plug the size of the cross down the waste leg to the detector', () => {
    const preset = pinchedPlug(design, guessCrossRoles(design)!);
    const run = runTrace(design, { species, injection: preset.injection, detector: preset.detector, phases: preset.phases, particles: 400, seed: 5, cells: 120, frames: 4 });
    const d = run.trace.detector!;
    // Most of the sample goes to the sample waste or back up the sample leg; a plug of a few tens reaches the detector.
    expect(d.arrived).toBeGreaterThan(10);
    expect(d.arrived).toBeLessThan(200);
    expect(run.durations).toHaveLength(2);
    expect(d.plateNumber).toBeGreaterThan(10);
  });
});
