import { DatePipe, DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, output, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTooltipModule } from '@angular/material/tooltip';
import { ActivatedRoute, Router } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import type { DesignDocument } from '../../../../shared/design';
import { ductError } from '../../../../shared/duct-model';
import { HIGH_VOLTAGE_CAUTION, LIMITS } from '../../../../shared/physics';
import { readFieldBlob, writeFieldBlob } from '../../../../shared/field-blob';
import type { SolveFields } from '../../../../shared/result';
import { Api } from '../../core/api';
import { errorMessage } from '../../core/error-message';
import { SOLVER, type LayoutMeasure, type SolveProgress } from '../../core/solver-client';
import { QuantityPipe } from '../../ui/quantity-pipe';
import { formatQuantity, parseQuantity } from '../../ui/units';
import { fluidOutlineOf } from '../../core/instant-client';
import { ColourBar } from './colour-bar';
import { FieldMap, type CutLine, type MapMarker, type MapPort } from './field-map';
import { CLIP_SHARE, MAPS, MAP_IDS, colourRange, mapValues, type MapId } from './field-maps';
import { lineProfile, probeFields, type Vec } from './field-sampling';
import { PortTable, type PortRow } from './port-table';
import { ProfilePlot } from './profile-plot';
import { fromRun, fromSolve, runSettings, toBase64, type ShownSolve } from './shown-solve';

/** Cells across the narrowest channel the resolution control offers; 10 is the solver's default. */
export const RESOLUTIONS = [6, 8, 10, 12, 16, 20, 24, 32] as const;
export const DEFAULT_RESOLUTION = 10;
/** Fewest cells along the longer side the solver uses (solver/grid/choose-grid.ts). */
const MIN_CELLS = 16;

/** Share of the whole solve each stage takes, for one progress bar. */
const STAGE_SPAN: Record<SolveProgress['stage'], [number, number]> = {
  geometry: [0, 0.1],
  potential: [0.1, 0.7],
  flow: [0.7, 0.92],
  fields: [0.92, 1],
};
const STAGE_WORDS: Record<SolveProgress['stage'], string> = {
  geometry: 'Building the grid',
  potential: 'Solving the potential',
  flow: 'Solving the flow',
  fields: 'Deriving the fields',
};

/** The largest run blob the server takes in a JSON body (16 MB, base64 is 4/3 of the bytes). */
const MAX_BLOB_BYTES = 11_500_000;

/**
 * The Fields tab: solve the working document in the worker (progress, cancel, resolution), read the maps with
 * colour bars, streamlines, arrows, a hover readout and cut-line profiles, the port table, metrics and warnings;
 * save the run with the revision, or open a stored run (?run=ID) without solving again.
 */
@Component({
  selector: 'osm-fields-view',
  imports: [
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSlideToggleModule,
    MatTooltipModule,
    QuantityPipe,
    DatePipe,
    DecimalPipe,
    ColourBar,
    FieldMap,
    PortTable,
    ProfilePlot,
  ],
  templateUrl: './fields-view.html',
  styleUrl: './fields-view.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FieldsView {
  private readonly solver = inject(SOLVER);
  private readonly api = inject(Api);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly snack = inject(MatSnackBar);

  /** The working document to solve. */
  readonly document = input.required<DesignDocument>();
  /** The revision a saved run belongs to; null while the document differs from the latest revision. */
  readonly revisionId = input<string | number | null>(null);
  readonly readOnly = input(false);
  /** A stored run to show (History's "Open in Fields", ?run=ID). */
  readonly runId = input<string | number | null>(null);
  /** Bumped by the design page's Solve button: solve now. */
  readonly solveRequest = input(0);
  /** A run was stored (History reads again). */
  readonly runSaved = output<void>();

  protected readonly maps = MAP_IDS.map((id) => MAPS[id]);
  protected readonly resolutions = RESOLUTIONS;
  protected readonly caution = HIGH_VOLTAGE_CAUTION;
  protected readonly highVoltage = LIMITS.highVoltage;
  protected readonly clipPercent = CLIP_SHARE * 100;
  /** Height of the map row (px; fields-view.scss). */
  protected readonly mapHeight = 400;

  protected readonly measure = signal<LayoutMeasure | null>(null);
  protected readonly resolution = signal<number>(DEFAULT_RESOLUTION);
  protected readonly progress = signal<SolveProgress | null>(null);
  protected readonly shown = signal<ShownSolve | null>(null);
  protected readonly error = signal<string | null>(null);
  protected readonly notice = signal<string | null>(null);
  protected readonly loadingRun = signal(false);
  protected readonly saving = signal(false);
  protected readonly mapId = signal<MapId>('potential');
  protected readonly showStreamlines = signal(true);
  protected readonly showArrows = signal(false);
  protected readonly cutMode = signal(false);
  protected readonly cut = signal<CutLine | null>(null);
  protected readonly hover = signal<Vec | null>(null);
  /** Page-side time of the last solve: performance.now() around the worker call (ms). */
  protected readonly solveMs = signal<number | null>(null);

  protected readonly solving = computed(() => this.progress() !== null);
  protected readonly overall = computed(() => {
    const p = this.progress();
    if (!p) return 0;
    const [a, b] = STAGE_SPAN[p.stage];
    return Math.round(100 * (a + (b - a) * Math.min(1, Math.max(0, p.fraction))));
  });
  protected readonly stageText = computed(() => {
    const p = this.progress();
    return p ? `${STAGE_WORDS[p.stage]}… ${this.overall()} %` : '';
  });

  /** Cells along the longer side for the chosen resolution; undefined for the solver's default. */
  private readonly cellsOption = computed(() => {
    const m = this.measure(), across = this.resolution();
    if (across === DEFAULT_RESOLUTION || !m?.narrowest || !m.bounds) return undefined;
    const [x0, y0, x1, y1] = m.bounds;
    return Math.max(MIN_CELLS, Math.ceil((Math.max(x1 - x0, y1 - y0) / m.narrowest) * across));
  });
  /** "narrowest 50 µm · grid ≈ 1002 × 402" for the resolution control. */
  protected readonly resolutionHint = computed(() => {
    const m = this.measure();
    if (!m) return 'Measuring the layout…';
    if (!m.narrowest || !m.bounds) return m.problem ? `The layout cannot be measured: ${m.problem}` : 'No channel to measure yet';
    const [x0, y0, x1, y1] = m.bounds;
    const h = m.narrowest / this.resolution();
    const nx = Math.ceil((x1 - x0) / h) + 2, ny = Math.ceil((y1 - y0) / h) + 2;
    return `Narrowest ${formatQuantity(m.narrowest, 'length', { digits: 3 })} · grid ≈ ${nx} × ${ny}`;
  });

  /**
   * The depth-averaged model's pressure-driven flow rate against the exact rectangular duct for the narrowest
   * channel (physics.md §3: the UI states it for the user's aspect ratio).
   */
  protected readonly ductNote = computed(() => {
    const narrowest = this.measure()?.narrowest;
    if (!narrowest) return null;
    const e = ductError(this.document().depth, narrowest);
    const sign = e.error >= 0 ? '+' : '−';
    return {
      text: `${sign}${Math.abs(e.error * 100).toFixed(1)} % at depth/width ${e.aspect.toPrecision(2)}`,
      tip:
        'Pressure-driven flow rate of the depth-averaged (Brinkman) model against the exact rectangular-duct series ' +
        'for the narrowest channel; slip-driven plug flow is not affected.',
    };
  });

  // ---- what is shown

  protected readonly spec = computed(() => MAPS[this.mapId()]);
  protected readonly fields = computed<SolveFields | null>(() => this.shown()?.fields ?? null);
  protected readonly values = computed(() => {
    const f = this.fields();
    return f ? mapValues(f, this.mapId()) : null;
  });
  protected readonly range = computed(() => {
    const v = this.values();
    return v ? colourRange(v, this.spec()) : null;
  });
  protected readonly r0 = this.range;
  /** The solved document: the outline, port names and cautions belong to it (a run's may differ from the draft). */
  private readonly solvedDocument = computed(() => this.shown()?.document ?? this.document());
  protected readonly outline = fluidOutlineOf(() => this.solvedDocument().shapes);
  protected readonly mapPorts = computed<MapPort[]>(() => this.solvedDocument().ports.map((p) => ({ id: p.id, from: p.from, to: p.to })));
  protected readonly markers = computed<MapMarker[]>(() =>
    this.warningRows()
      .filter((w) => w.at)
      .map((w) => ({ at: w.at!, label: String(w.index), title: w.message })),
  );
  protected readonly portRows = computed<PortRow[]>(() => {
    const s = this.shown();
    if (!s) return [];
    const doc = this.solvedDocument();
    return s.ports.map((p) => {
      const port = doc.ports.find((q) => q.id === p.id);
      return { ...p, name: port?.name ?? p.id, floating: port ? port.potential === null : false };
    });
  });
  /** Warnings, numbered; the high-voltage one is the caution banner instead. */
  protected readonly warningRows = computed(() =>
    (this.shown()?.warnings ?? [])
      .filter((w) => w.code !== 'high-voltage')
      .map((w, k) => ({ ...w, index: k + 1 })),
  );
  /** Ports above the high-voltage limit: the solved ones when a result is shown (floating ones included). */
  protected readonly hotPorts = computed(() => {
    const s = this.shown();
    const list = s
      ? s.ports.map((p) => ({ id: p.id, potential: p.potential }))
      : this.document().ports.map((p) => ({ id: p.id, potential: p.potential }));
    return list.filter((p): p is { id: string; potential: number } => p.potential !== null && Math.abs(p.potential) > LIMITS.highVoltage);
  });
  protected readonly probe = computed(() => {
    const f = this.fields(), p = this.hover();
    return f && p ? probeFields(f, p, this.outline()) : null;
  });
  protected readonly profile = computed(() => {
    const f = this.fields(), c = this.cut(), v = this.values();
    if (!f || !c || !v) return null;
    const length = Math.hypot(c[1][0] - c[0][0], c[1][1] - c[0][1]);
    const samples = Math.min(600, Math.max(60, Math.ceil((3 * length) / f.spacing)));
    return lineProfile(f, v, c[0], c[1], samples, this.outline());
  });
  protected readonly cutText = computed(() => {
    const c = this.cut();
    return c ? [pointText(c[0]), pointText(c[1])] : ['', ''];
  });
  /** The document changed after this solve: the maps are of an older layout or conditions. */
  protected readonly stale = computed(() => {
    const s = this.shown();
    return !!s && s.source === 'solve' && s.document !== this.document();
  });
  protected readonly maySave = computed(() => {
    const s = this.shown();
    return !this.readOnly() && !!s && s.source === 'solve' && s.runId === null && this.revisionId() !== null && !this.stale();
  });
  protected readonly saveBlocker = computed(() => {
    const s = this.shown();
    if (this.readOnly() || !s || s.source !== 'solve') return null;
    if (s.runId !== null) return 'Saved with the revision.';
    if (this.stale()) return 'The layout or conditions changed since this solve; solve again to save a run.';
    if (this.revisionId() === null) return 'Save a revision first: runs are stored with the revision they were solved for.';
    return null;
  });

  constructor() {
    const destroyRef = inject(DestroyRef);
    destroyRef.onDestroy(() => {
      if (this.progress()) this.solver.cancel();
    });

    // Measure the layout (in the worker) whenever its shapes change, for the resolution control.
    let measureTimer: ReturnType<typeof setTimeout> | undefined;
    let measuredShapes: unknown = null;
    effect(() => {
      const doc = this.document();
      if (doc.shapes === measuredShapes) return;
      measuredShapes = doc.shapes;
      clearTimeout(measureTimer);
      measureTimer = setTimeout(() => this.measureLayout(doc), 250);
    });
    destroyRef.onDestroy(() => clearTimeout(measureTimer));

    // A stored run named by the route.
    effect(() => {
      const id = this.runId();
      if (id === null || id === undefined || id === '') return;
      untracked(() => {
        if (String(this.shown()?.runId) !== String(id)) void this.openRun(id);
      });
    });

    // The design page's Solve button.
    let handled = 0;
    effect(() => {
      const request = this.solveRequest();
      if (request > handled) {
        handled = request;
        untracked(() => void this.solve());
      }
    });
  }

  // ---- solving

  protected async solve(): Promise<void> {
    if (this.solving()) return;
    const doc = this.document();
    this.error.set(null);
    this.notice.set(null);
    this.progress.set({ stage: 'geometry', fraction: 0 });
    const cells = this.cellsOption();
    const started = performance.now();
    const outcome = await this.solver.solve(doc, { cells }, (p) => {
      if (this.progress()) this.progress.set(p);
    });
    const ms = performance.now() - started;
    this.progress.set(null);
    if (!outcome.ok) {
      if (outcome.error.code === 'cancelled') this.notice.set('Solve stopped; the maps below are unchanged.');
      else this.error.set(outcome.error.message);
      return;
    }
    this.solveMs.set(ms);
    this.shown.set(fromSolve(outcome.result, doc, { ...outcome, pageMs: ms }));
    this.hover.set(null);
    if (this.runId() !== null) this.setRunParam(null);
  }

  protected cancel(): void {
    this.solver.cancel();
    // A measure waiting behind the stopped solve ended with its worker: ask the fresh one.
    this.measureLayout(this.document());
  }

  private measureLayout(doc: DesignDocument): void {
    this.solver.measure(doc).then(
      (m) => {
        if (this.document() === doc) this.measure.set(m);
      },
      () => {
        if (this.document() === doc && !this.measure()) this.measure.set({ narrowest: null, bounds: null, problem: 'the solver worker did not answer' });
      },
    );
  }

  protected setResolution(value: number): void {
    this.resolution.set(value);
  }

  // ---- runs

  protected async saveRun(): Promise<void> {
    const s = this.shown(), revisionId = this.revisionId();
    if (!s || !this.maySave() || revisionId === null || !s.summary) return;
    this.saving.set(true);
    try {
      const blob = await writeFieldBlob(s.fields);
      if (blob.length > MAX_BLOB_BYTES) throw new Error(`The fields take ${formatBytes(blob.length)} compressed, more than a run can store; solve at a lower resolution.`);
      const created = await firstValueFrom(this.api.saveRun(revisionId, { settings: runSettings(s), summary: s.summary, fields: toBase64(blob) }));
      this.shown.update((x) => (x === s ? { ...x, runId: created.id } : x));
      this.snack.open('Run saved with the revision; teammates can open it from History.', undefined, { duration: 4000 });
      this.runSaved.emit();
      this.setRunParam(created.id);
    } catch (err) {
      this.error.set(`The run was not saved: ${errorMessage(err)}`);
    } finally {
      this.saving.set(false);
    }
  }

  private async openRun(id: string | number): Promise<void> {
    if (this.solving()) this.solver.cancel();
    this.loadingRun.set(true);
    this.error.set(null);
    this.notice.set(null);
    try {
      const run = await firstValueFrom(this.api.run(id));
      if (!run.hasFields) throw new Error('this run was stored without its fields');
      const [bytes, revision] = await Promise.all([
        firstValueFrom(this.api.runFields(id)),
        firstValueFrom(this.api.revision(run.revisionId)).catch(() => null),
      ]);
      const fields = await readFieldBlob(new Uint8Array(bytes));
      if (String(this.runId()) !== String(id)) return;
      this.shown.set(fromRun(run, fields, (revision?.document as DesignDocument | undefined) ?? null));
      this.hover.set(null);
    } catch (err) {
      this.error.set(`The run could not be opened: ${errorMessage(err)}`);
    } finally {
      this.loadingRun.set(false);
    }
  }

  private setRunParam(id: string | number | null): void {
    void this.router.navigate([], { relativeTo: this.route, queryParams: { run: id }, queryParamsHandling: 'merge', replaceUrl: true });
  }

  // ---- map interaction

  protected setCut(line: CutLine): void {
    this.cut.set(line);
    this.cutMode.set(false);
  }

  /** Typed cut ends, "x, y" in µm unless a unit is given. */
  protected typeCutEnd(end: 0 | 1, text: string): void {
    const p = readPoint(text);
    if (!p) return;
    const c = this.cut();
    const other = c ? c[1 - end] : p;
    this.cut.set(end === 0 ? [p, other] : [other, p]);
  }

  protected quantityText(value: number | null | undefined, dimension: Parameters<typeof formatQuantity>[1]): string {
    return value === null || value === undefined || !Number.isFinite(value) ? '–' : formatQuantity(value, dimension);
  }

  protected pointText(p: Vec): string {
    return pointText(p);
  }
}

function pointText(p: Vec): string {
  return `${+(p[0] * 1e6).toFixed(1)}, ${+(p[1] * 1e6).toFixed(1)} µm`;
}

/** "120, -40" (µm) or "1.2 mm, 40 um" → a point in metres. */
export function readPoint(text: string): Vec | null {
  const parts = text.split(',').map((s) => s.trim());
  if (parts.length !== 2) return null;
  // "120, -40 µm": the unit written once at the end counts for both.
  const unit = /[a-zµμ]+\s*$/i.exec(parts[1])?.[0].trim();
  const read = (s: string) => parseQuantity(s, 'length', { defaultUnit: unit ?? 'um' });
  const x = read(parts[0]), y = read(parts[1]);
  return x.ok && y.ok ? [x.value, y.value] : null;
}

function formatBytes(n: number): string {
  return n >= 1e6 ? `${(n / 1e6).toFixed(1)} MB` : `${Math.round(n / 1e3)} kB`;
}
