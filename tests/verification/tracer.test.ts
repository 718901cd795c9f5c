import { discretiseDesign } from '../../solver/grid';
import type { CutCellGrid } from '../../solver/grid/cut-cell-grid';
import { traceBand, type TraceFields } from '../../solver/tracer';
import { makeDesign } from '../fixtures/designs';

/**
 * The tracer against closed forms, on prescribed velocity fields (so these tests check the particle method itself:
 * random walk, wall reflection, interpolation, detector statistics). physics.md §5, reference-values.md §6 and §8.
 */

function gridOf(design: ReturnType<typeof makeDesign>, cells: number): CutCellGrid {
  const d = discretiseDesign(design, { cells });
  if (!d.ok || !d.grid) throw new Error(d.problems.map((p) => p.message).join('; '));
  return d.grid;
}

function cellFields(grid: CutCellGrid, f: (x: number, y: number) => [number, number, number, number]) {
  const size = grid.nx * grid.ny;
  const out = { velocityX: new Float64Array(size), velocityY: new Float64Array(size), fieldX: new Float64Array(size), fieldY: new Float64Array(size) };
  for (let j = 0; j < grid.ny; j++) {
    for (let i = 0; i < grid.nx; i++) {
      const c = i + j * grid.nx;
      const [u, v, ex, ey] = f(grid.x0 + (i + 0.5) * grid.spacing, grid.y0 + (j + 0.5) * grid.spacing);
      out.velocityX[c] = u;
      out.velocityY[c] = v;
      out.fieldX[c] = ex;
      out.fieldY[c] = ey;
    }
  }
  return out;
}

describe('tracer: sample bands against closed forms', () => {
  it('plug flow spreads as σ² = σ0² + 2 D t, within 5 % (reference-values.md §6, ideal plug flow)', () => {
    const design = makeDesign({
      shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: 2e-3, height: 5e-5 }],
      ports: [
        { id: 'A', from: [0, 0], to: [0, 5e-5], potential: 100 },
        { id: 'B', from: [2e-3, 0], to: [2e-3, 5e-5], potential: 0 },
      ],
    });
    const grid = gridOf(design, 400);
    const mobility = 3.9e-8; // floor-and-lid and side-wall mobility: electroosmotic plug flow u = μ_eo E
    const E = 2.5e4;
    const fields: TraceFields = { grid, depth: 2e-5, floorLidMobility: mobility, ...cellFields(grid, () => [mobility * E, 0, E, 0]) };
    const D = 1e-9;
    const r = traceBand({
      species: { mobility: 0, diffusivity: D },
      injection: { kind: 'line', from: [4e-4, 1e-7], to: [4e-4, 5e-5 - 1e-7] },
      phases: [{ fields, duration: 0.8 }],
      particles: 8000,
      seed: 7,
      frames: 5,
    });
    const last = r.frames[r.frames.length - 1];
    expect(last.variance / (2 * D * last.time)).toBeGreaterThan(0.95);
    expect(last.variance / (2 * D * last.time)).toBeLessThan(1.05);
    // The band moves with the plug speed.
    expect((last.meanX - 4e-4) / last.time / (mobility * E)).toBeCloseTo(1, 2);
  });

  it('pressure-driven flow between side walls disperses as D (1 + Pe²/210), within 10 % (Taylor 1953, Aris 1956)', () => {
    const w = 2e-5;
    const design = makeDesign({
      depth: 1,
      shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: 6e-3, height: w }],
      ports: [
        { id: 'A', from: [0, 0], to: [0, w], potential: null, pressure: 100 },
        { id: 'B', from: [6e-3, 0], to: [6e-3, w], potential: null, pressure: 0 },
      ],
    });
    const grid = gridOf(design, 3000);
    const U = 1e-3;
    const D = 1e-9;
    // Plane Poiseuille profile between the side walls, mean U; no field.
    const fields: TraceFields = {
      grid,
      depth: 1,
      floorLidMobility: 0,
      ...cellFields(grid, (_x, y) => [1.5 * U * (1 - ((2 * (y - w / 2)) / w) ** 2), 0, 0, 0]),
    };
    const r = traceBand({
      species: { mobility: 0, diffusivity: D },
      injection: { kind: 'line', from: [5e-4, 1e-8], to: [5e-4, w - 1e-8] },
      phases: [{ fields, duration: 4 }],
      particles: 3000,
      seed: 11,
      frames: 9,
      dt: 5e-4,
      depthDispersion: false,
    });
    // Late-time growth rate, well after the transverse mixing time w²/D = 0.4 s.
    const a = r.frames[4];
    const b = r.frames[8];
    const measured = (b.variance - a.variance) / (2 * (b.time - a.time));
    const pe = (U * w) / D;
    const expected = D * (1 + (pe * pe) / 210);
    expect(measured / expected).toBeGreaterThan(0.9);
    expect(measured / expected).toBeLessThan(1.1);
  });

  it('a band through an isolated bend tilts by 2 Θ r_c ln(r_o/r_i) (reference-values.md §8, the 1/r model, no diffusion)', () => {
    const ri = 1e-4;
    const ro = 2e-4;
    const theta = Math.PI / 2;
    const design = makeDesign({
      shapes: [{ op: 'add', type: 'sector', center: [0, 0], innerRadius: ri, outerRadius: ro, startAngle: 0, endAngle: 90 }],
      ports: [
        { id: 'A', from: [ri, 0], to: [ro, 0], potential: 10 },
        { id: 'B', from: [0, ri], to: [0, ro], potential: 0 },
      ],
    });
    const grid = gridOf(design, 200);
    const mobility = 3.9e-8;
    const dV = 10;
    // E = ΔV/(Θ r) along +θ (A at 10 V, B at 0 V): the exact field of the sector.
    const fields: TraceFields = {
      grid,
      depth: 2e-5,
      floorLidMobility: mobility,
      ...cellFields(grid, (x, y) => {
        const r2 = x * x + y * y;
        const e = dV / theta / r2; // |E|/r, so E = e·(−y, x)
        return [mobility * e * -y, mobility * e * x, e * -y, e * x];
      }),
    };
    const r = traceBand({
      species: { mobility: 0, diffusivity: 0 },
      injection: { kind: 'line', from: [ri + 2e-6, 1e-6], to: [ro - 2e-6, 1e-6] },
      detector: { from: [0, ri], to: [0, ro] },
      phases: [{ fields, duration: 0.4 }], // the outermost particle needs Θ² r_o² / (μ ΔV) = 0.25 s
      particles: 400,
      seed: 3,
      dt: 2e-4,
    });
    const rc = (ri + ro) / 2;
    const expected = 2 * theta * rc * Math.log(ro / ri);
    expect(r.detector?.arrived).toBeGreaterThan(390);
    // Mean speed through the detector equals the lead speed μ ΔV ln(ro/ri)/(Θ w) (current continuity).
    expect(r.detector!.speed / ((mobility * dV * Math.log(ro / ri)) / (theta * (ro - ri)))).toBeCloseTo(1, 2);
    expect(r.detector!.tilt / expected).toBeGreaterThan(0.97);
    expect(r.detector!.tilt / expected).toBeLessThan(1.03);
  });

  it('is reproducible with a seed', () => {
    const design = makeDesign({
      shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: 1e-3, height: 5e-5 }],
      ports: [
        { id: 'A', from: [0, 0], to: [0, 5e-5], potential: 100 },
        { id: 'B', from: [1e-3, 0], to: [1e-3, 5e-5], potential: 0 },
      ],
    });
    const grid = gridOf(design, 200);
    const fields: TraceFields = { grid, depth: 2e-5, floorLidMobility: 0, ...cellFields(grid, (_x, y) => [1e-3 * (1 - ((y - 2.5e-5) / 2.5e-5) ** 2), 0, 0, 0]) };
    const run = (seed: number) =>
      traceBand({ species: { mobility: 0, diffusivity: 1e-9 }, injection: { kind: 'line', from: [1e-4, 1e-6], to: [1e-4, 4.9e-5] }, phases: [{ fields, duration: 0.2 }], particles: 200, seed, frames: 3 });
    const a = run(5);
    const b = run(5);
    const c = run(6);
    expect(Array.from(a.frames[2].positions)).toEqual(Array.from(b.frames[2].positions));
    expect(Array.from(a.frames[2].positions)).not.toEqual(Array.from(c.frames[2].positions));
  });
});
