/**
 * Which connected pieces of fluid have a reference potential.
 *
 * A piece whose ports are all floating (potential null) has no electrode: its potential is an
 * arbitrary constant and no current flows through it (a floating port carries zero net current,
 * so the only solution is a uniform potential). Such pieces are left out of the potential solve:
 * their field is zero and their potential undefined (NaN). Pressure can still drive flow there.
 */
import type { Port } from '../../shared/design';
import type { FluidComponents } from '../grid/components';
import type { CutCellGrid } from '../grid/cut-cell-grid';
import { fluidRuns, RunList } from '../grid/fluid-runs';

export interface ElectrodePieces {
  /** 1 for a fluid cell in a piece with at least one electrode (a port with a potential). */
  active: Uint8Array;
  /** Whether that is every fluid cell (no piece is left out). */
  everyFluidCell: boolean;
  /**
   * Runs of active cells, row by row, and the index of each row's first run (as Operator5.runs and rowRuns);
   * the grid's own runs of fluid cells when every fluid cell is active (read only).
   */
  runs: Int32Array;
  rowRuns: Int32Array;
  /** Per port: whether it lies in a piece with an electrode (false also for ports on no fluid). */
  portReferenced: boolean[];
  /** Number of fluid pieces without an electrode that touch a port. */
  floatingPieces: number;
  /** A cell of each such piece (for messages). */
  floatingSeeds: number[];
}

export function electrodePieces(grid: CutCellGrid, components: FluidComponents, ports: ReadonlyArray<Pick<Port, 'potential'>>): ElectrodePieces {
  const { label } = components;
  const hasElectrode = new Uint8Array(components.count);
  const touched = new Uint8Array(components.count);
  const seg = grid.segments;
  for (let s = 0; s < seg.count; s++) {
    const k = seg.port[s];
    const piece = label[seg.cell[s]];
    if (k < 0 || piece < 0) continue;
    touched[piece] = 1;
    if (ports[k].potential !== null) hasElectrode[piece] = 1;
  }
  // Over the grid's runs of fluid cells (found when it was built), not the box; they are the active runs too
  // when every piece has an electrode.
  const { nx, ny } = grid;
  const fluid = fluidRuns(grid);
  const active = new Uint8Array(nx * ny);
  const list = new RunList();
  const rowRuns = new Int32Array(ny + 1);
  let everyFluidCell = true;
  for (let j = 0; j < ny; j++) {
    rowRuns[j] = list.count;
    for (let k = fluid.rowRuns[j], last = fluid.rowRuns[j + 1]; k < last; k += 2) {
      const end = fluid.runs[k + 1];
      let first = -1; // start of the run of active cells being gathered
      for (let c = fluid.runs[k]; c < end; c++) {
        const piece = label[c]; // ≥ 0 on every fluid cell (components.ts)
        if (piece >= 0 && hasElectrode[piece] !== 0) {
          active[c] = 1;
          if (first < 0) first = c;
        } else {
          everyFluidCell = false;
          if (first >= 0) list.push(first, c);
          first = -1;
        }
      }
      if (first >= 0) list.push(first, end);
    }
  }
  rowRuns[ny] = list.count;
  const runs = everyFluidCell ? fluid : { runs: list.array(), rowRuns };
  const portReferenced = ports.map(() => false);
  for (let s = 0; s < seg.count; s++) {
    const k = seg.port[s];
    const piece = label[seg.cell[s]];
    if (k >= 0 && piece >= 0 && hasElectrode[piece]) portReferenced[k] = true;
  }
  const floatingSeeds: number[] = [];
  for (let p = 0; p < components.count; p++) if (touched[p] && !hasElectrode[p]) floatingSeeds.push(components.seed[p]);
  return { active, everyFluidCell, runs: runs.runs, rowRuns: runs.rowRuns, portReferenced, floatingPieces: floatingSeeds.length, floatingSeeds };
}
