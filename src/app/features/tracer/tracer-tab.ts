import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSliderModule } from '@angular/material/slider';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { DesignDocument } from '../../../../shared/design';
import { guessCrossRoles, type CrossRoles } from '../../../../shared/cross-roles';
import type { PhaseSpec, TraceRun } from '../../../workers/solver-api';
import { ANALYSIS, type AnalysisProgress } from '../../core/solver-client';
import { QuantityPipe } from '../../ui/quantity-pipe';
import { formatQuantity, parseQuantity } from '../../ui/units';
import { QuantityInput, blurOnEnter } from '../analysis/quantity-input';
import { SeriesPlot, type PlotSeries } from '../analysis/series-plot';
import { ColourBar } from '../fields/colour-bar';
import type { MapPort } from '../fields/field-map';
import { MAPS, colourRange, magnitude } from '../fields/field-maps';
import type { Vec } from '../fields/field-sampling';
import { INSTANT, fluidOutlineOf } from '../../core/instant-client';
import { ArrivalPlot } from './arrival-plot';
import { TracerMap, type DrawMode } from './tracer-map';
import { aliveCount, arrivalHistogram, defaultBand, phaseAt, rectangle, spreadSeries, traceRequest, type InjectionMode, type Segment } from './tracer-model';

/** Time per animation frame (ms): 60 frames in about four seconds. */
const FRAME_MS = 70;

/**
 * The Tracer tab (product.md, capability 6): a band of a species (its own mobility and diffusivity) from a line or
 * a region drawn on the map, or a pinched plug at a cross (loading, then dispensing, with the potentials the
 * engineer sets), followed in the worker to a detector line; the particles animated over the speed map, then the
 * arrival-time curve, variance, plate height and tilt, reproducible from the seed shown.
 */
@Component({
  selector: 'osm-tracer-tab',
  imports: [
    DecimalPipe,
    ReactiveFormsModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSliderModule,
    MatTooltipModule,
    QuantityPipe,
    ColourBar,
    SeriesPlot,
    ArrivalPlot,
    TracerMap,
  ],
  templateUrl: './tracer-tab.html',
  styleUrl: './tracer-tab.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TracerTab {
  private readonly analysis = inject(ANALYSIS);
  private readonly instant = inject(INSTANT);
  /** Counts preset requests: an answer to an older one is dropped. */
  private presetAsked = 0;

  readonly document = input.required<DesignDocument>();

  protected readonly mobility = new QuantityInput(0, { dimension: 'mobility', defaultUnit: 'm^2/V*s' });
  protected readonly diffusivity = new QuantityInput(4e-10, { dimension: 'diffusivity', defaultUnit: 'm^2/s', min: 0 });
  protected readonly blurOnEnter = blurOnEnter;
  protected readonly mode = signal<InjectionMode>('line');
  protected readonly particles = signal(1000);
  protected readonly seed = signal(1);
  /** Line and region modes: how long to follow the band; null for until it has passed the detector. */
  protected readonly duration = signal<number | null>(null);
  protected readonly durationError = signal<string | null>(null);
  protected readonly line = signal<Segment | null>(null);
  protected readonly region = signal<Array<[number, number]> | null>(null);
  protected readonly detector = signal<Segment | null>(null);
  protected readonly drawMode = signal<DrawMode>(null);
  protected readonly roles = signal<CrossRoles | null>(null);
  protected readonly phases = signal<PhaseSpec[]>([]);
  protected readonly pinchedRegion = signal<Array<[number, number]> | null>(null);
  protected readonly presetError = signal<string | null>(null);

  protected readonly running = signal(false);
  protected readonly progress = signal<AnalysisProgress | null>(null);
  protected readonly error = signal<string | null>(null);
  protected readonly result = signal<{ run: TraceRun; document: DesignDocument; pageMs: number; labels: string[] } | null>(null);
  protected readonly frame = signal(0);
  protected readonly playing = signal(false);
  /** Map view: the whole layout, or the part from the injection to the detector. */
  protected readonly zoomed = signal(false);
  protected readonly mapHeight = 340;

  protected readonly outline = fluidOutlineOf(() => this.document().shapes);
  protected readonly mapPorts = computed<MapPort[]>(() => this.document().ports.map((p) => ({ id: p.id, from: p.from, to: p.to })));
  protected readonly roleNames = ['sample', 'sampleWaste', 'buffer', 'waste'] as const;
  protected readonly roleLabels: Record<(typeof this.roleNames)[number], string> = { sample: 'Sample', sampleWaste: 'Sample waste', buffer: 'Buffer', waste: 'Waste' };

  protected readonly form = computed(() => ({
    mode: this.mode(),
    mobility: this.mobility.value() ?? NaN,
    diffusivity: this.diffusivity.value() ?? NaN,
    particles: this.particles(),
    seed: this.seed(),
    duration: this.duration(),
    line: this.line(),
    region: this.region(),
    detector: this.detector(),
    pinched: this.pinchedRegion() && this.phases().length ? { region: this.pinchedRegion()!, phases: this.phases() } : null,
  }));
  protected readonly request = computed(() => {
    const f = this.form();
    if (!Number.isFinite(f.mobility) || !Number.isFinite(f.diffusivity)) return { problem: 'Enter the species mobility and diffusivity.' };
    return traceRequest(f);
  });
  protected readonly problem = computed(() => {
    const r = this.request();
    return 'problem' in r ? r.problem : null;
  });
  protected readonly shownInjection = computed(() => {
    switch (this.mode()) {
      case 'line': {
        const l = this.line();
        return l ? { kind: 'line' as const, ...l } : null;
      }
      case 'region': {
        const r = this.region();
        return r ? { kind: 'region' as const, polygon: r } : null;
      }
      default: {
        const r = this.pinchedRegion();
        return r ? { kind: 'region' as const, polygon: r } : null;
      }
    }
  });

  /** Bounds of the injection and the detector, with room around them: the map's close view. */
  protected readonly focus = computed<[number, number, number, number] | null>(() => {
    const inj = this.shownInjection(), det = this.detector();
    const pts: Vec[] = [];
    if (inj?.kind === 'line') pts.push(inj.from, inj.to);
    else if (inj) pts.push(...inj.polygon);
    if (det) pts.push(det.from, det.to);
    if (pts.length < 2) return null;
    const xs = pts.map((p) => p[0]), ys = pts.map((p) => p[1]);
    const [x0, x1, y0, y1] = [Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)];
    const pad = 0.25 * Math.max(x1 - x0, y1 - y0);
    return [x0 - pad, y0 - pad, x1 + pad, y1 + pad];
  });

  // ---- the run, as shown
  protected readonly trace = computed(() => this.result()?.run.trace ?? null);
  protected readonly durations = computed(() => this.result()?.run.durations ?? []);
  protected readonly current = computed(() => this.trace()?.frames[Math.min(this.frame(), (this.trace()?.frames.length ?? 1) - 1)] ?? null);
  protected readonly phaseIndex = computed(() => {
    const f = this.current();
    return f ? phaseAt(this.durations(), f.time) : 0;
  });
  private readonly speeds = computed(() => this.result()?.run.solves.map((s) => magnitude(s.fields.velocityX, s.fields.velocityY)) ?? []);
  protected readonly range = computed(() => {
    const all = this.speeds();
    if (!all.length) return null;
    const both = new Float32Array(all.reduce((n, a) => n + a.length, 0));
    let at = 0;
    for (const a of all) {
      both.set(a, at);
      at += a.length;
    }
    return colourRange(both, MAPS.speed);
  });
  protected readonly mapFields = computed(() => this.result()?.run.solves[this.phaseIndex()]?.fields ?? null);
  protected readonly mapValues = computed(() => this.speeds()[this.phaseIndex()] ?? null);
  protected readonly phaseLabel = computed(() => {
    const r = this.result();
    if (!r) return '';
    return r.run.designs.length > 1 ? (r.labels[this.phaseIndex()] ?? `phase ${this.phaseIndex() + 1}`) : '';
  });
  protected readonly alive = computed(() => {
    const f = this.current();
    return f ? aliveCount(f) : 0;
  });
  protected readonly histogram = computed(() => arrivalHistogram(this.trace()?.arrivals.time ?? []));
  protected readonly spread = computed<PlotSeries[]>(() => {
    const t = this.trace();
    if (!t) return [];
    const s = spreadSeries(t.frames);
    return [{ label: 'band spread σ', x: s.t, y: s.sigma }];
  });

  constructor() {
    // A band to start from, and the pinched-plug roles, for each layout (when its outline comes from the worker).
    let shown: unknown = this.outline();
    effect(() => {
      const rings = this.outline();
      if (rings === shown) return;
      shown = rings;
      untracked(() => {
        const doc = this.document();
        const band = defaultBand(doc, rings);
        this.line.set(band?.injection ?? null);
        this.detector.set(band?.detector ?? null);
        this.region.set(null);
        this.roles.set(guessCrossRoles(doc));
        if (this.mode() === 'pinched') void this.applyPreset();
      });
    });
    const destroyRef = inject(DestroyRef);
    let raf = 0;
    let last = 0;
    // Animation: one frame each FRAME_MS while playing.
    effect(() => {
      if (!this.playing()) return;
      const tick = (now: number) => {
        if (!this.playing()) return;
        if (now - last >= FRAME_MS) {
          last = now;
          const n = this.trace()?.frames.length ?? 0;
          if (this.frame() >= n - 1) {
            this.playing.set(false);
            return;
          }
          this.frame.update((f) => f + 1);
        }
        raf = requestAnimationFrame(tick);
      };
      raf = requestAnimationFrame(tick);
    });
    destroyRef.onDestroy(() => {
      cancelAnimationFrame(raf);
      if (this.running()) this.analysis.cancel();
    });
  }

  protected setMode(mode: InjectionMode): void {
    this.presetAsked++;
    this.mode.set(mode);
    this.drawMode.set(null);
    if (mode === 'pinched') void this.applyPreset();
    else if (!this.detector()) this.detector.set(defaultBand(this.document(), this.outline())?.detector ?? null);
  }

  /** The pinched-plug preset for the chosen roles (from the instant worker): injection region, detector, potentials. */
  protected async applyPreset(): Promise<void> {
    const roles = this.roles();
    const asked = ++this.presetAsked;
    this.presetError.set(null);
    const outcome = roles ? await this.instant.pinchedPlug(this.document(), roles, this.mobility.value() ?? 0) : null;
    if (asked !== this.presetAsked || this.mode() !== 'pinched') return;
    if (outcome?.ok) {
      this.phases.set(outcome.preset.phases);
      this.pinchedRegion.set(outcome.preset.injection.polygon);
      this.detector.set(outcome.preset.detector);
    } else {
      if (outcome) this.presetError.set(outcome.message);
      this.phases.set([]);
      this.pinchedRegion.set(null);
    }
  }

  protected setRole(role: keyof CrossRoles, port: string): void {
    const r = this.roles() ?? { sample: '', sampleWaste: '', buffer: '', waste: '' };
    this.roles.set({ ...r, [role]: port });
    void this.applyPreset();
  }

  protected phasePotential(phase: PhaseSpec, port: string): string {
    const v = phase.potentials?.[port];
    return v === undefined ? '' : v === null ? 'floating' : formatQuantity(v, 'potential');
  }

  protected setPhasePotential(index: number, port: string, text: string): void {
    const r = text.trim() === '' || /^float/i.test(text.trim()) ? { ok: true as const, value: null } : parseQuantity(text, 'potential', { defaultUnit: 'V' });
    if (!r.ok) {
      this.presetError.set(`${port}: ${r.message}`);
      return;
    }
    this.presetError.set(null);
    this.phases.update((ps) => ps.map((p, k) => (k === index ? { ...p, potentials: { ...p.potentials, [port]: r.value } } : p)));
  }

  protected setPhaseDuration(index: number, text: string): void {
    if (text.trim() === '' && index === this.phases().length - 1) {
      this.phases.update((ps) => ps.map((p, k) => (k === index ? { ...p, duration: undefined } : p)));
      return;
    }
    const r = parseQuantity(text, 'time', { defaultUnit: 's' });
    if (!r.ok || !(r.value > 0)) {
      this.presetError.set(r.ok ? 'A phase lasts a positive time' : r.message);
      return;
    }
    this.presetError.set(null);
    this.phases.update((ps) => ps.map((p, k) => (k === index ? { ...p, duration: r.value } : p)));
  }

  protected setDuration(text: string): void {
    if (text.trim() === '') {
      this.duration.set(null);
      this.durationError.set(null);
      return;
    }
    const r = parseQuantity(text, 'time', { defaultUnit: 's' });
    if (!r.ok || !(r.value > 0)) {
      this.durationError.set(r.ok ? 'Give a positive time, or leave it empty' : r.message);
      return;
    }
    this.durationError.set(null);
    this.duration.set(r.value);
  }

  protected timeText(v: number | null | undefined): string {
    return v === null || v === undefined ? '' : formatQuantity(v, 'time');
  }

  protected setWhole(target: 'particles' | 'seed', text: string): void {
    const v = Math.round(Number(text));
    if (!Number.isFinite(v)) return;
    if (target === 'particles') this.particles.set(Math.min(20000, Math.max(10, v)));
    else this.seed.set(Math.max(0, v));
  }

  protected onDrawn(event: { mode: Exclude<DrawMode, null>; a: Vec; b: Vec }): void {
    const segment: Segment = { from: [event.a[0], event.a[1]], to: [event.b[0], event.b[1]] };
    if (event.mode === 'detector') this.detector.set(segment);
    else if (event.mode === 'line') this.line.set(segment);
    else this.region.set(rectangle(event.a, event.b));
    this.drawMode.set(null);
  }

  protected toggleDraw(mode: Exclude<DrawMode, null>): void {
    this.drawMode.update((m) => (m === mode ? null : mode));
  }

  protected async run(): Promise<void> {
    const r = this.request();
    if ('problem' in r) return;
    const doc = this.document();
    this.running.set(true);
    this.playing.set(false);
    this.error.set(null);
    this.progress.set({ label: 'starting', fraction: 0 });
    const started = performance.now();
    const outcome = await this.analysis.trace(doc, r.request, (p) => this.progress.set(p));
    this.running.set(false);
    this.progress.set(null);
    if (!outcome.ok) {
      if (outcome.error.code !== 'cancelled') this.error.set(outcome.error.message);
      return;
    }
    const labels = (r.request.phases ?? []).map((p, k) => p.label ?? `phase ${k + 1}`);
    this.result.set({ run: outcome.run, document: doc, pageMs: performance.now() - started, labels });
    this.frame.set(0);
    this.playing.set(true);
  }

  protected cancel(): void {
    this.analysis.cancel();
  }

  protected togglePlay(): void {
    const n = this.trace()?.frames.length ?? 0;
    if (!this.playing() && this.frame() >= n - 1) this.frame.set(0);
    this.playing.update((p) => !p);
  }

  protected scrub(event: Event): void {
    this.playing.set(false);
    this.frame.set((event.target as HTMLInputElement).valueAsNumber);
  }

  protected sqrt(v: number): number {
    return Math.sqrt(v);
  }

  /** 2.426 × 10⁻⁴ */
  protected sci(v: number): string {
    const [m, e] = v.toExponential(3).split('e');
    const sup = e.replace('+', '').replace('-', '⁻').replace(/\d/g, (d) => '⁰¹²³⁴⁵⁶⁷⁸⁹'[Number(d)]);
    return `${m} × 10${sup}`;
  }

  /** Each phase as run: its name and duration (the last maybe chosen to run until the band passed the detector). */
  protected readonly phaseRows = computed(() => {
    const r = this.result();
    if (!r) return [];
    const n = r.run.durations.length;
    return r.run.durations.map((d, k) => {
      const name = n > 1 ? (r.labels[k] ?? `phase ${k + 1}`) : 'followed for';
      const auto = r.run.automatic && k === n - 1 ? ', until past the detector' : '';
      return { label: name.charAt(0).toUpperCase() + name.slice(1), text: `${formatQuantity(d, 'time', { digits: 3 })}${auto}` };
    });
  });

  protected newSeed(): void {
    this.seed.set(1 + Math.floor(Math.random() * 99999));
  }
}
