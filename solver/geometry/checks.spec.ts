import { loadFixture, makeDesign, type FixtureName } from '../../tests/fixtures/designs';
import type { DesignDocument, DesignInput } from '../../shared/design';
import { discretiseDesign } from '../grid/discretise';

const channel = { op: 'add', type: 'rect', x: 0, y: 0, width: 1e-3, height: 5e-5 } as const;
const leftPort = { id: 'A', from: [0, 0], to: [0, 5e-5], potential: 100 } as const;
const rightPort = { id: 'B', from: [1e-3, 0], to: [1e-3, 5e-5], potential: 0 } as const;

function design(shapes: unknown[], ports: unknown[] = [leftPort, rightPort], extra: Partial<DesignInput> = {}): DesignDocument {
  return makeDesign({ shapes: shapes as never, ports: ports as never, ...extra });
}

function problemsOf(d: DesignDocument, cells?: number) {
  return discretiseDesign(d, { cells }).problems;
}

describe('geometry checks', () => {
  it('find nothing wrong with the fixtures', () => {
    const names: FixtureName[] = ['straight-channel', 'cross-injector', 'bend-90', 'serpentine', 'expansion-chamber', 't-junction'];
    for (const name of names) {
      const result = discretiseDesign(loadFixture(name));
      expect({ name, problems: result.problems }).toEqual({ name, problems: [] });
      expect(result.ok).toBe(true);
      expect(result.choice!.cellsAcross).toBeGreaterThanOrEqual(8);
    }
  });

  it('refuse an empty layout', () => {
    expect(problemsOf(design([]))).toContainEqual(expect.objectContaining({ code: 'empty-layout', severity: 'error' }));
    const gone = discretiseDesign(design([channel, { ...channel, op: 'subtract', x: -1e-4, y: -1e-4, width: 2e-3, height: 1e-3 }]));
    expect(gone.ok).toBe(false);
    expect(gone.problems).toContainEqual(expect.objectContaining({ code: 'empty-layout', message: expect.stringMatching(/Nothing is left/) }));
  });

  it('refuse a self-crossing polygon and say where it crosses', () => {
    const bowTie = { op: 'add', type: 'polygon', points: [[0, 0], [2e-4, 2e-4], [2e-4, 0], [0, 2e-4]] };
    const [problem] = problemsOf(design([channel, bowTie])).filter((p) => p.code === 'self-crossing-polygon');
    expect(problem).toMatchObject({ severity: 'error', field: 'shapes[1].points', at: [1e-4, 1e-4] });
    expect(problem.message).toMatch(/shapes\[1\] crosses itself near \(100 µm, 100 µm\)/);
  });

  it('refuse a port that is not on the outline, naming the port', () => {
    const across = { id: 'mid', from: [5e-4, 0], to: [5e-4, 5e-5], potential: 3 }; // across the channel, not along a wall
    const away = { id: 'far', from: [0, 2e-4], to: [0, 2.5e-4], potential: 3 };
    const problems = problemsOf(design([channel], [leftPort, rightPort, across, away]), 200);
    const off = problems.filter((p) => p.code === 'port-off-outline');
    expect(off.map((p) => p.field)).toEqual(['ports[2]', 'ports[3]']);
    expect(off[0]).toMatchObject({ severity: 'error', at: [5e-4, 2.5e-5] });
    expect(off[0].message).toMatch(/Port "mid" is not on the outline/);
    expect(off[1].message).toMatch(/Port "far" is not on the outline of the fluid: its middle is 175 µm from the nearest wall/);
  });

  it('warn when only part of a port lies on the outline, and refuse overlapping ports', () => {
    const long = { id: 'L', from: [0, 0], to: [0, 8e-5], potential: 1 };
    const twin = { id: 'twin', from: [0, 1e-5], to: [0, 4e-5], potential: 2 };
    const problems = problemsOf(design([channel], [long, rightPort, twin]), 200);
    expect(problems).toContainEqual(expect.objectContaining({ code: 'port-partly-off-outline', severity: 'warning', message: expect.stringMatching(/Only 63% of port "L"/) }));
    expect(problems).toContainEqual(expect.objectContaining({ code: 'ports-overlap', severity: 'error', message: expect.stringMatching(/Ports "L" and "twin" overlap/) }));
  });

  it('refuse a piece of fluid that touches no port, pointing at it', () => {
    const island = { op: 'add', type: 'circle', center: [5e-4, 3e-4], radius: 5e-5 };
    const problems = problemsOf(design([channel, island]));
    const loose = problems.filter((p) => p.code === 'unconnected-fluid');
    expect(loose).toHaveLength(1);
    expect(loose[0].severity).toBe('error');
    expect(Math.hypot(loose[0].at![0] - 5e-4, loose[0].at![1] - 3e-4)).toBeLessThan(5e-5);
    expect(loose[0].message).toMatch(/touches no port/);
  });

  it('refuse a design with nothing to drive current or flow', () => {
    const same = problemsOf(design([channel], [{ ...leftPort, potential: 5 }, { ...rightPort, potential: 5 }]));
    expect(same).toContainEqual(expect.objectContaining({ code: 'no-drive', severity: 'error' }));
    // A floating port is no electrode: one potential and one floating port drive nothing.
    const floating = problemsOf(design([channel], [leftPort, { ...rightPort, potential: null }]));
    expect(floating).toContainEqual(expect.objectContaining({ code: 'no-drive', message: expect.stringMatching(/floating ports carry no current/) }));
    // A pressure difference is a drive.
    const pressure = problemsOf(design([channel], [{ ...leftPort, potential: null, pressure: 100 }, { ...rightPort, potential: null }]));
    expect(pressure.map((p) => p.code)).not.toContain('no-drive');
    expect(problemsOf(design([channel], []))).toContainEqual(expect.objectContaining({ code: 'no-drive', message: expect.stringMatching(/no ports/) }));
  });

  it('warn when the narrowest channel gets fewer than 8 cells, with the --cells that would do', () => {
    const result = discretiseDesign(design([channel]), { cells: 50 });
    const warning = result.problems.find((p) => p.code === 'under-resolved')!;
    expect(warning.severity).toBe('warning');
    expect(warning.message).toMatch(/50 µm .* only 2\.5 cells across .* use --cells 160 or more/);
    expect(result.ok).toBe(true);
    expect(discretiseDesign(design([channel]), { cells: 160 }).problems).toEqual([]);
  });

  it('warn when the grid had to be capped', () => {
    const result = discretiseDesign(design([channel]), { cells: 4000, maxCells: 20000 });
    expect(result.problems).toContainEqual(expect.objectContaining({ code: 'grid-capped', severity: 'warning' }));
    expect(result.grid!.nx * result.grid!.ny).toBeLessThanOrEqual(20000);
  });

  it('warn about thin slivers left by shapes that nearly line up', () => {
    // A cut 1 nm tall across part of the channel leaves a sliver hole.
    const cut = { op: 'subtract', type: 'rect', x: 4e-4, y: 2.5e-5, width: 2e-4, height: 1e-9 };
    const problems = problemsOf(design([channel, cut]));
    const sliver = problems.find((p) => p.code === 'thin-sliver')!;
    expect(sliver).toMatchObject({ severity: 'warning', at: [expect.closeTo(5e-4, 9), expect.closeTo(2.5e-5, 9)] });
    expect(sliver.message).toMatch(/thin sliver \(about 1 nm wide\)/);
    // A cut meant to sever the channel misses the bottom wall by 10 nm: a thin strip of fluid is left.
    const miss = { op: 'subtract', type: 'rect', x: 4e-4, y: 1e-8, width: 2e-4, height: 6e-5 };
    const result = discretiseDesign(design([channel, miss]));
    expect(result.problems).toContainEqual(expect.objectContaining({ code: 'thin-sliver', message: expect.stringMatching(/about 10 nm wide/) }));
    // The strip is not taken for the narrowest channel when choosing the grid.
    expect(result.widths!.narrowest!.width).toBeCloseTo(5e-5, 12);
  });

  it('drop specks of fluid far below a cell that touch no port, with a warning', () => {
    const speck = { op: 'add', type: 'rect', x: 5e-4, y: 2e-4, width: 1e-7, height: 1e-7 };
    const result = discretiseDesign(design([channel, speck]), { cells: 200 });
    expect(result.ok).toBe(true);
    expect(result.components!.count).toBe(1);
    expect(result.problems).toContainEqual(expect.objectContaining({ code: 'thin-sliver', message: expect.stringMatching(/speck of fluid/) }));
  });
});
