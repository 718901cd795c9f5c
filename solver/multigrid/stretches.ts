import type { Operator5 } from './operator';

/**
 * The runs of active volumes cut into stretches where the stencil changes between uniform and general. A volume
 * is uniform when its four faces have one conductance g and its diagonal is 4g (no boundary or reaction term):
 * the inside of a channel on a potential grid, away from walls, cut cells and ports, which is most of it
 * (91 % of the serpentine's volumes at 1024 cells, 82 % on the next level). There the kernels read neither the
 * faces nor the diagonal: (A x)_c = g (4 x_c − Σ x_nb), and the relaxation is x_c = (b_c + g Σ x_nb) / 4g. The
 * short stencil gives the same values up to rounding (the constant-coefficient interior of structured-grid
 * multigrid codes). Volumes of the first and last rows are always general (their stencils keep the tests).
 */
export interface Stretches {
  /** Pairs [first, end) of volume indices, row by row; together they are the runs. */
  bounds: Int32Array;
  /** rowStart[j] is the index (a stretch, not a bound) of row j's first stretch; rowStart[n2] = their count. */
  rowStart: Int32Array;
  /** Per stretch: g > 0 when every volume of it is uniform with conductance g, else 0. */
  conductance: Float64Array;
}

/** Uniform stretches shorter than this are left in the general ones around them. */
const MIN_UNIFORM = 4;

/**
 * Builds the stretches while the volumes of each run are visited in order. The caller keeps the conductance of
 * the current streak (`g`, 0 for general volumes) and calls change(c, g) where volume c starts a streak with
 * another one; uniform streaks shorter than MIN_UNIFORM stay general.
 */
export class StretchList {
  /** Conductance of the current streak. */
  g = 0;
  private bounds: number[] = [];
  private conductance: number[] = [];
  private rowStart: Int32Array;
  private general = 0; // start of the general stretch being gathered
  private streak = 0; // start of the current streak

  constructor(private n2: number) {
    this.rowStart = new Int32Array(n2 + 1);
  }

  row(j: number): void {
    this.rowStart[j] = this.conductance.length;
  }

  run(first: number): void {
    this.general = this.streak = first;
    this.g = 0;
  }

  change(c: number, g: number): void {
    this.closeStreak(c);
    this.streak = c;
    this.g = g;
  }

  end(end: number): void {
    this.closeStreak(end);
    if (this.general < end) this.push(this.general, end, 0);
  }

  done(): Stretches {
    this.rowStart[this.n2] = this.conductance.length;
    return { bounds: Int32Array.from(this.bounds), rowStart: this.rowStart, conductance: Float64Array.from(this.conductance) };
  }

  private closeStreak(end: number): void {
    if (this.g > 0 && end - this.streak >= MIN_UNIFORM) {
      if (this.general < this.streak) this.push(this.general, this.streak, 0);
      this.push(this.streak, end, this.g);
      this.general = end;
    }
  }

  private push(first: number, end: number, g: number): void {
    this.bounds.push(first, end);
    this.conductance.push(g);
  }
}

/** The stretches of an operator whose runs and diagonal are in place, found from its arrays. */
export function findStretches(op: Operator5): Stretches {
  const { n1, n2, gx, gy, diag } = op;
  const runs = op.runs!, rowRuns = op.rowRuns!;
  const list = new StretchList(n2);
  for (let j = 0; j < n2; j++) {
    list.row(j);
    const inside = j > 0 && j < n2 - 1;
    for (let k = rowRuns[j], last = rowRuns[j + 1]; k < last; k += 2) {
      const first = runs[k], end = runs[k + 1];
      list.run(first);
      let streak = 0;
      for (let c = first; c < end; c++) {
        const w = gx[c + j];
        const g = inside && w > 0 && gx[c + j + 1] === w && gy[c] === w && gy[c + n1] === w && diag[c] === 4 * w ? w : 0;
        if (g !== streak) list.change(c, (streak = g));
      }
      list.end(end);
    }
  }
  return list.done();
}
