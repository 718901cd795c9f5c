import type { SolveProgress, SolveResult } from '../../solver/solve';

/** What the worker measures of a layout before solving: enough to show cells across the narrowest channel. */
export interface LayoutMeasure {
  /** Width of the narrowest channel (m); null when the layout has none (empty, or no facing walls). */
  narrowest: number | null;
  /** Fluid bounding box [xmin, ymin, xmax, ymax] (m); null when there is no fluid. */
  bounds: [number, number, number, number] | null;
  /** Why the layout could not be measured (shapes that do not combine), if so. */
  problem?: string;
}

export interface WorkerSolveOptions {
  /** Cells along the longer side of the layout; the solver's default (about 10 across the narrowest channel) when absent. */
  cells?: number;
  tolerance?: number;
}

/** A solve's error as plain data (comlink would lose a SolveError's code). */
export interface SolveFailure {
  code: string;
  message: string;
  field?: string;
}

export type SolveOutcome =
  | {
      ok: true;
      /** The result; its field arrays arrive as transferred buffers. */
      result: SolveResult;
      /** Narrowest channel (m) of the solved layout, and the cells across it at the solved spacing. */
      narrowest: number | null;
      cellsAcross: number | null;
      /** The cells option that gives this grid again (settings of a stored run). */
      cells: number;
      /** Worker-side time of the solve (ms). */
      workerMs: number;
    }
  | { ok: false; error: SolveFailure };

/** What the solver worker offers the page (through comlink). */
export interface SolverApi {
  hello(): Promise<{ ready: boolean; at: number }>;
  measure(design: unknown): Promise<LayoutMeasure>;
  /** Solves; progress goes to the (comlink-proxied) callback, a few times a second at most. */
  solve(design: unknown, options: WorkerSolveOptions, onProgress?: (progress: SolveProgress) => void): Promise<SolveOutcome>;
}
