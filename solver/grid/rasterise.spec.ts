import { loadFixture, makeDesign, type FixtureName } from '../../tests/fixtures/designs';
import type { DesignDocument } from '../../shared/design';
import { fluidRegion } from '../geometry/fluid-region';
import { chooseGrid } from './choose-grid';
import { closureDefect } from './closure';
import { WALL, type CutCellGrid } from './cut-cell-grid';
import { rasterise } from './rasterise';

function gridOf(design: DesignDocument, cells: number): CutCellGrid {
  const region = fluidRegion(design.shapes);
  const frame = chooseGrid(region, { cells });
  return rasterise(region, frame, { ports: design.ports, sideZeta: design.zeta.side, wallZones: design.wallZones }).grid;
}

const gridOfShapes = (shapes: unknown[], cells: number) => gridOf(makeDesign({ shapes: shapes as never, ports: [] }), cells);

function fluidArea(grid: CutCellGrid): number {
  let sum = 0;
  for (const f of grid.fraction) sum += f;
  return sum * grid.spacing * grid.spacing;
}

/** First moment Σ A_c · centroid_c over all fluid cells. */
function firstMoment(grid: CutCellGrid): [number, number] {
  const cut = new Map<number, number>();
  grid.cutCells.forEach((c, k) => cut.set(c, k));
  let mx = 0, my = 0;
  for (let c = 0; c < grid.nx * grid.ny; c++) {
    const f = grid.fraction[c];
    if (!(f > 0)) continue;
    const k = cut.get(c);
    const i = c % grid.nx, j = (c - i) / grid.nx;
    const x = k !== undefined ? grid.cutCentroidX[k] : grid.x0 + (i + 0.5) * grid.spacing;
    const y = k !== undefined ? grid.cutCentroidY[k] : grid.y0 + (j + 0.5) * grid.spacing;
    mx += f * x;
    my += f * y;
  }
  const a = grid.spacing * grid.spacing;
  return [mx * a, my * a];
}

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('rasterise: fractions', () => {
  it('a rect aligned with the grid has fractions and apertures exactly 0 or 1', () => {
    const grid = gridOfShapes([{ op: 'add', type: 'rect', x: 0, y: 0, width: 1e-3, height: 5e-5 }], 200);
    expect(grid.spacing).toBeCloseTo(5e-6, 18);
    expect([grid.nx, grid.ny]).toEqual([202, 12]);
    for (const a of [grid.fraction, grid.apertureX, grid.apertureY]) {
      expect(a.every((v) => v === 0 || v === 1)).toBe(true);
    }
    expect(grid.fluidCells).toBe(200 * 10);
    expect(rel(fluidArea(grid), 5e-8)).toBeLessThan(1e-13);
    // The walls lie on faces: those faces are closed, and each wall piece belongs to the fluid cell beside it.
    expect(grid.apertureX[1 + 5 * 203]).toBe(0);
    expect(grid.apertureX[2 + 5 * 203]).toBe(1);
    for (let s = 0; s < grid.segments.count; s++) expect(grid.fraction[grid.segments.cell[s]]).toBe(1);
    expect(closureDefect(grid).x).toBe(0);
    expect(closureDefect(grid).y).toBe(0);
  });

  it('a wall half-way across a row: fraction ½, side faces ½ open, centroid a quarter cell up', () => {
    // 40 × 5 µm cells along 200 µm; the rect is 2.5 cells tall.
    const grid = gridOfShapes([{ op: 'add', type: 'rect', x: 0, y: 0, width: 2e-4, height: 1.25e-5 }], 40);
    const { nx } = grid;
    const top = 3; // rows 1, 2 full; row 3 half (the margin row is 0)
    for (let i = 1; i <= 40; i++) {
      expect(grid.fraction[i + top * nx]).toBeCloseTo(0.5, 14);
      expect(grid.apertureY[i + top * nx]).toBe(1);
      expect(grid.apertureY[i + (top + 1) * nx]).toBe(0);
      const k = Array.from(grid.cutCells).indexOf(i + top * nx);
      expect((grid.cutCentroidY[k] - grid.y0) / grid.spacing).toBeCloseTo(top + 0.25, 12);
    }
    for (let i = 2; i <= 40; i++) expect(grid.apertureX[i + top * (nx + 1)]).toBeCloseTo(0.5, 14);
    expect(grid.apertureX[1 + top * (nx + 1)]).toBe(0);
  });

  it('a rotated rect: fractions sum to its area, the centroid is its centre, the grid is closed', () => {
    for (const angle of [30, 45, 117]) {
      const grid = gridOfShapes([{ op: 'add', type: 'rect', x: 1e-4, y: 2e-4, width: 8e-4, height: 6e-5, angle }], 300);
      expect(rel(fluidArea(grid), 8e-4 * 6e-5)).toBeLessThan(1e-12);
      const t = (angle * Math.PI) / 180;
      const centre = [1e-4 + 4e-4 * Math.cos(t) - 3e-5 * Math.sin(t), 2e-4 + 4e-4 * Math.sin(t) + 3e-5 * Math.cos(t)];
      const [mx, my] = firstMoment(grid);
      expect(Math.abs(mx / fluidArea(grid) - centre[0])).toBeLessThan(1e-15);
      expect(Math.abs(my / fluidArea(grid) - centre[1])).toBeLessThan(1e-15);
      const defect = closureDefect(grid);
      expect(Math.max(defect.x, defect.y)).toBeLessThan(1e-12);
      for (const a of [grid.fraction, grid.apertureX, grid.apertureY]) expect(a.every((v) => v >= 0 && v <= 1)).toBe(true);
    }
  });

  it('an annular sector: fractions sum to (Θ/2)(r_o² − r_i²)', () => {
    const [ri, ro] = [1e-4, 1.5e-4];
    for (const cells of [17, 64, 500]) {
      const grid = gridOfShapes([
        { op: 'add', type: 'sector', center: [3e-5, -2e-5], innerRadius: ri, outerRadius: ro, startAngle: 10, endAngle: 100 },
      ], cells);
      expect(rel(fluidArea(grid), (Math.PI / 4) * (ro * ro - ri * ri))).toBeLessThan(1e-12);
      const defect = closureDefect(grid);
      expect(Math.max(defect.x, defect.y)).toBeLessThan(1e-12);
    }
  });

  it('a circle minus an off-centre hole: fractions sum to π(R² − r²)', () => {
    const grid = gridOfShapes([
      { op: 'add', type: 'circle', center: [0, 0], radius: 2e-4 },
      { op: 'subtract', type: 'circle', center: [3e-5, 5e-5], radius: 6e-5 },
    ], 123);
    expect(rel(fluidArea(grid), Math.PI * (4e-8 - 3.6e-9))).toBeLessThan(1e-12);
    expect(Math.max(closureDefect(grid).x, closureDefect(grid).y)).toBeLessThan(1e-12);
  });

  it('gives every fixture a closed grid whose outline cells all hold fluid', () => {
    const names: FixtureName[] = ['straight-channel', 'cross-injector', 'bend-90', 'serpentine', 'expansion-chamber', 't-junction'];
    for (const name of names) {
      const design = loadFixture(name);
      const grid = gridOf(design, 400);
      const region = fluidRegion(design.shapes);
      expect({ name, error: rel(fluidArea(grid), region.area) < 1e-12 }).toEqual({ name, error: true });
      const defect = closureDefect(grid);
      expect({ name, closed: Math.max(defect.x, defect.y) < 1e-10 }).toEqual({ name, closed: true });
      const { cell } = grid.segments;
      let unsorted = 0, dry = 0, openToSolid = 0;
      for (let s = 0; s < grid.segments.count; s++) {
        if (s > 0 && cell[s] < cell[s - 1]) unsorted++;
        if (!(grid.fraction[cell[s]] > 0)) dry++;
      }
      // An open face always joins two fluid cells.
      for (let j = 0; j < grid.ny; j++) {
        for (let i = 0; i <= grid.nx; i++) {
          if (grid.apertureX[i + j * (grid.nx + 1)] > 0 && !(grid.fraction[i - 1 + j * grid.nx] > 0 && grid.fraction[i + j * grid.nx] > 0)) openToSolid++;
        }
      }
      expect({ name, unsorted, dry, openToSolid }).toEqual({ name, unsorted: 0, dry: 0, openToSolid: 0 });
      expect(Array.from(grid.cutCells).every((c, k, a) => k === 0 || c > a[k - 1])).toBe(true);
    }
  });
});

describe('rasterise: ports and wall zones', () => {
  // The example of design-format.md.
  const example = makeDesign({
    shapes: [
      { op: 'add', type: 'rect', x: 0, y: 0, width: 1e-3, height: 5e-5, angle: 0 },
      { op: 'add', type: 'sector', center: [0, 0], innerRadius: 1e-4, outerRadius: 1.5e-4, startAngle: 0, endAngle: 90 },
      { op: 'add', type: 'polygon', points: [[0, 0], [1e-4, 0], [1e-4, 1e-4]] },
      { op: 'add', type: 'circle', center: [5e-4, 2.5e-5], radius: 1e-5 },
      { op: 'subtract', type: 'circle', center: [5e-4, 2.5e-5], radius: 5e-6 },
    ],
    ports: [
      { id: 'S', name: 'sample', from: [0, 0], to: [0, 5e-5], potential: 0, pressure: 0 },
      { id: 'W', name: 'waste', from: [1e-3, 0], to: [1e-3, 5e-5], potential: null, pressure: 0 },
    ],
    wallZones: [{ region: { type: 'rect', x: 4e-4, y: -1e-5, width: 2e-4, height: 7e-5, angle: 0 }, zeta: -0.01 }],
  });

  it('finds the outline under each port of the design-format.md example', () => {
    for (const cells of [100, 400, 1000]) {
      const grid = gridOf(example, cells);
      expect(grid.portLength[0]).toBeCloseTo(5e-5, 17);
      expect(grid.portLength[1]).toBeCloseTo(5e-5, 17);
      const seg = grid.segments;
      for (let s = 0; s < seg.count; s++) {
        if (seg.port[s] === 0) {
          expect(seg.normalX[s]).toBe(-1);
          expect(seg.midX[s]).toBeCloseTo(0, 18);
        } else if (seg.port[s] === 1) {
          expect(seg.normalX[s]).toBe(1);
          expect(seg.midX[s]).toBeCloseTo(1e-3, 15);
        }
      }
    }
  });

  it('takes a port drawn up to half a cell off the outline, cut at the ends of the port', () => {
    const design = makeDesign({
      shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: 1e-3, height: 1e-4 }],
      ports: [
        { id: 'A', from: [1e-6, 2e-5], to: [1e-6, 7e-5], potential: 1 }, // 1 µm inside, covers 50 of the 100 µm
        { id: 'B', from: [1e-3, 0], to: [1e-3, 1e-4], potential: 0 },
      ],
    });
    const grid = gridOf(design, 250); // h = 4 µm
    expect(grid.portLength[0]).toBeCloseTo(5e-5, 15);
    expect(grid.portLength[1]).toBeCloseTo(1e-4, 15);
  });

  it('gives side walls zeta.side, or the zeta of the wall zone around them', () => {
    const grid = gridOf(example, 400);
    const seg = grid.segments;
    let inZone = 0;
    for (let s = 0; s < seg.count; s++) {
      const x = seg.midX[s];
      if (x > 4e-4 && x < 6e-4) {
        expect(seg.zeta[s]).toBe(-0.01);
        inZone++;
      } else if (x < 3.9e-4 || x > 6.1e-4) {
        expect(seg.zeta[s]).toBe(-0.05);
      }
    }
    expect(inZone).toBeGreaterThan(10);
    // The hole around (5e-4, 2.5e-5) is inside the zone: its wall segments face the hole's centre.
    const hole = Array.from({ length: seg.count }, (_, s) => s).filter(
      (s) => Math.hypot(seg.midX[s] - 5e-4, seg.midY[s] - 2.5e-5) < 6e-6,
    );
    expect(hole.length).toBeGreaterThan(4);
    for (const s of hole) {
      expect(seg.port[s]).toBe(WALL);
      const toCentre = [5e-4 - seg.midX[s], 2.5e-5 - seg.midY[s]];
      expect(seg.normalX[s] * toCentre[0] + seg.normalY[s] * toCentre[1]).toBeGreaterThan(0);
    }
  });
});
