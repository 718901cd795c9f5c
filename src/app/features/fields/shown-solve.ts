/**
 * What the Fields tab shows: a fresh solve from the worker, or a stored run read back from the server (summary +
 * field blob). One shape for both, so the maps, tables and plots do not care where it came from.
 */
import type { RunDetail, RunSummary } from '../../../../shared/api';
import type { DesignDocument } from '../../../../shared/design';
import type { PortResult, SolveFields, SolveMetrics, SolveResult, SolverStats } from '../../../../shared/result';
import { resultJson } from '../../../../shared/result';

export interface ShownWarning {
  code: string;
  message: string;
  at?: readonly [number, number];
}

export interface ShownSolve {
  source: 'solve' | 'run';
  /** The stored run shown (or the one this solve was saved as). */
  runId: string | number | null;
  /** The document solved (for a run: its revision's document, when it could be read). */
  document: DesignDocument | null;
  ports: PortResult[];
  metrics: Partial<SolveMetrics>;
  warnings: ShownWarning[];
  fields: SolveFields;
  grid: { nx: number; ny: number; spacing: number };
  solver?: Partial<SolverStats>;
  /** Settings: cells along the longer side, and the cells across the narrowest channel they gave. */
  cells: number | null;
  cellsAcross: number | null;
  narrowest: number | null;
  /** For a run: who stored it and when. */
  stored?: { by: string; at: string };
  /** Time of the solve as the page saw it (ms), for a fresh solve. */
  pageMs?: number;
  /** For a fresh solve: the summary a saved run stores. */
  summary?: RunSummary;
}

/** Settings stored with a run (POST .../runs `settings`). */
export interface RunSettings {
  cells: number;
  cellsAcross: number | null;
  narrowest: number | null;
  [key: string]: unknown;
}

export function fromSolve(result: SolveResult, document: DesignDocument, extra: { cells: number; cellsAcross: number | null; narrowest: number | null; pageMs?: number }): ShownSolve {
  return {
    source: 'solve',
    runId: null,
    document,
    ports: result.ports,
    metrics: result.metrics,
    warnings: result.warnings,
    fields: result.fields,
    grid: { nx: result.grid.nx, ny: result.grid.ny, spacing: result.grid.spacing },
    solver: result.solver,
    cells: extra.cells,
    cellsAcross: extra.cellsAcross,
    narrowest: extra.narrowest,
    pageMs: extra.pageMs,
    summary: runSummary(result),
  };
}

/** The run's summary: the command line's JSON result (ports, metrics, warnings, grid, solver), less the fields. */
export function runSummary(result: SolveResult): RunSummary {
  return resultJson(result) as unknown as RunSummary;
}

export function runSettings(shown: Pick<ShownSolve, 'cells' | 'cellsAcross' | 'narrowest'>): RunSettings {
  return { cells: shown.cells ?? 0, cellsAcross: shown.cellsAcross, narrowest: shown.narrowest };
}

const num = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null);

/** A stored run with its fields, as the tab shows it. */
export function fromRun(run: RunDetail, fields: SolveFields, document: DesignDocument | null): ShownSolve {
  const summary = run.summary ?? {};
  const ports: PortResult[] = (summary.ports ?? []).map((p) => {
    const meanSpeed = num(p.meanSpeed);
    // Runs stored before the mean speed was part of the summary have none: the table shows –.
    return {
      id: p.id,
      potential: p.potential ?? null,
      current: num(p.current) ?? NaN,
      flowRate: num(p.flowRate) ?? NaN,
      ...(meanSpeed !== null ? { meanSpeed } : {}),
    };
  });
  const metrics: Partial<SolveMetrics> = {};
  for (const [k, v] of Object.entries(summary.metrics ?? {})) if (v !== null) (metrics as Record<string, number>)[k] = v;
  const settings = run.settings ?? {};
  const grid = (summary['grid'] ?? {}) as Partial<SolveResult['grid']>;
  return {
    source: 'run',
    runId: run.id,
    document,
    ports,
    metrics,
    warnings: (summary.warnings ?? []).map((w) => ({ code: w.code, message: w.message })),
    fields,
    grid: { nx: grid.nx ?? fields.nx, ny: grid.ny ?? fields.ny, spacing: grid.spacing ?? fields.spacing },
    solver: (summary['solver'] ?? undefined) as Partial<SolverStats> | undefined,
    cells: num(settings['cells']),
    cellsAcross: num(settings['cellsAcross']),
    narrowest: num(settings['narrowest']),
    stored: { by: run.author?.name ?? 'someone', at: run.createdAt },
  };
}

/** Base64 of bytes (for the JSON body of POST .../runs), in chunks so large blobs do not overflow the stack. */
export function toBase64(bytes: Uint8Array): string {
  let text = '';
  const chunk = 0x8000;
  for (let k = 0; k < bytes.length; k += chunk) text += String.fromCharCode(...bytes.subarray(k, k + chunk));
  return btoa(text);
}

/** Kirchhoff check of a port table: Σ I and the largest |I| (A). */
export function currentBalance(ports: ReadonlyArray<Pick<PortResult, 'current'>>): { sum: number; largest: number } {
  let sum = 0, largest = 0;
  for (const p of ports) {
    if (!Number.isFinite(p.current)) continue;
    sum += p.current;
    largest = Math.max(largest, Math.abs(p.current));
  }
  return { sum, largest };
}

export function flowBalance(ports: ReadonlyArray<Pick<PortResult, 'flowRate'>>): { sum: number; largest: number } {
  let sum = 0, largest = 0;
  for (const p of ports) {
    if (!Number.isFinite(p.flowRate)) continue;
    sum += p.flowRate;
    largest = Math.max(largest, Math.abs(p.flowRate));
  }
  return { sum, largest };
}
