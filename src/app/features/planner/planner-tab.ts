import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, output, signal, untracked } from '@angular/core';
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
import { settingsOf, withSettings } from '../../../../shared/drives';
import { latestOf } from '../../core/instant-client';
import { ANALYSIS, type AnalysisProgress, type PlannerBasis, type PlannerMap, type PlanResult } from '../../core/solver-client';
import { QuantityPipe } from '../../ui/quantity-pipe';
import { ColourBar } from '../fields/colour-bar';
import { FieldMap, type MapPort } from '../fields/field-map';
import { MAPS, colourRange } from '../fields/field-maps';
import { fluidOutlineOf } from '../../core/instant-client';
import { PlannerForm } from './planner-form';
import {
  defaultPortPlans,
  defaultTargets,
  planRequest,
  plannedDesign,
  responsesKey,
  rowProblem,
  sliderRange,
  type PortPlan,
  type TargetRow,
} from './planner-model';

/**
 * The Planner tab (product.md, capability 7): unit responses per electrode computed once in the solver worker and
 * kept there, then reservoir potentials for the engineer's targets by bounded least squares, each target's
 * residual, and sliders that recombine the map from the unit responses at once (no solve; the worker answers
 * within a frame). "Apply to conditions" writes the potentials into the design.
 */
@Component({
  selector: 'osm-planner-tab',
  imports: [
    DecimalPipe,
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
    FieldMap,
    ColourBar,
    PlannerForm,
  ],
  templateUrl: './planner-tab.html',
  styleUrl: './planner-tab.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlannerTab {
  private readonly analysis = inject(ANALYSIS);

  readonly document = input.required<DesignDocument>();
  readonly readOnly = input(false);
  readonly documentChange = output<DesignDocument>();

  protected readonly targets = signal<TargetRow[]>([]);
  protected readonly portPlans = signal<PortPlan[]>([]);
  protected readonly responses = signal<{ key: string; basis: PlannerBasis; pageMs: number } | null>(null);
  protected readonly computing = signal(false);
  /** A plan is out to the worker. */
  protected readonly planning = signal(false);
  protected readonly progress = signal<AnalysisProgress | null>(null);
  protected readonly error = signal<string | null>(null);
  protected readonly plan = signal<PlanResult | null>(null);
  /** Strength of each drive (responses' order): the plan's, then wherever the sliders put them. */
  protected readonly settings = signal<number[] | null>(null);
  protected readonly mapId = signal<PlannerMap>('speed');
  /** Bumped when the colour range should follow the values again (not on every slider step). */
  private readonly rangeVersion = signal(0);
  protected readonly mapHeight = 330;

  protected readonly planned = computed(() => plannedDesign(this.document(), this.portPlans()));
  protected readonly key = computed(() => responsesKey(this.planned()));
  protected readonly ready = computed(() => {
    const r = this.responses();
    return r && r.key === this.key() ? r.basis : null;
  });

  protected readonly outline = fluidOutlineOf(() => this.document().shapes);
  protected readonly mapPorts = computed<MapPort[]>(() => this.document().ports.map((p) => ({ id: p.id, from: p.from, to: p.to })));
  protected readonly rowProblems = computed(() => this.targets().map(rowProblem));
  protected readonly canPlan = computed(() => !!this.ready() && this.targets().length > 0 && this.rowProblems().every((p) => p === null));

  /** The map and port table at the current settings, recombined in the worker (the newest settings win). */
  private readonly live = latestOf(
    () => {
      const b = this.ready(), s = this.settings();
      return b && s ? { basis: b.id, map: this.mapId(), settings: s, rangeVersion: this.rangeVersion() } : null;
    },
    async (q) => {
      if (!q) return null;
      const started = performance.now();
      const outcome = await this.analysis.recombine(q.basis, q.map, q.settings);
      return { ...q, outcome, pageMs: performance.now() - started };
    },
    null,
  );
  /** The quantity of the map shown (it follows the toggle once its recombination arrives). */
  protected readonly spec = computed(() => MAPS[this.live()?.map ?? this.mapId()]);
  /** The newest recombined map (the previous map stays up until a new one arrives, so the view keeps its zoom). */
  protected readonly values = computed(() => {
    const l = this.live();
    return l?.outcome.ok && l.basis === this.ready()?.id ? l.outcome.values : null;
  });
  /** Round trip of the last slider step (page to worker and back), and the worker's share of it. */
  protected readonly slideMs = computed(() => {
    const l = this.live();
    return l?.outcome.ok ? { page: l.pageMs, worker: l.outcome.workerMs } : null;
  });
  /** The colour range: set again when the map, the basis or the range version changes, not on every slider step. */
  private rangeShown: { key: string; range: ReturnType<typeof colourRange> } | null = null;
  protected readonly range = computed(() => {
    const v = this.values(), l = this.live();
    if (!v || !l) return null;
    const key = `${l.basis}|${l.map}|${l.rangeVersion}`;
    if (this.rangeShown?.key !== key) this.rangeShown = { key, range: colourRange(v, this.spec()) };
    return this.rangeShown.range;
  });
  /** Ports' potential, current and flow rate at the current settings (superposed, instant). */
  protected readonly livePorts = computed(() => {
    const l = this.live();
    return l?.outcome.ok && l.basis === this.ready()?.id ? l.outcome.ports : [];
  });
  /** One slider per electrode (planned or held). */
  protected readonly sliders = computed(() => {
    const r = this.ready(), s = this.settings();
    if (!r || !s) return [];
    const plans = new Map(this.portPlans().map((p) => [p.id, p]));
    return r.drives
      .map((d, k) => ({ d, k }))
      .filter(({ d }) => d.kind === 'potential')
      .map(({ d, k }) => {
        const plan = plans.get(d.port) ?? { id: d.port, mode: 'plan' as const, hold: 0, min: null, max: null };
        return { port: d.port, index: k, value: s[k], held: plan.mode === 'hold', ...sliderRange(this.plan()?.settings[k] ?? s[k], plan) };
      });
  });
  protected readonly fields = computed(() => this.ready()?.fields ?? null);

  constructor() {
    // Targets and port roles start from the design (again when its ports change).
    let portsShown = '';
    effect(() => {
      const doc = this.document();
      const ids = doc.ports.map((p) => p.id).join('|');
      if (ids === portsShown) return;
      portsShown = ids;
      untracked(() => {
        this.portPlans.set(defaultPortPlans(doc));
        this.targets.set(defaultTargets(doc));
      });
    });
    // Unit responses, computed in the worker when what they depend on changes (not for new voltages or heads).
    let timer: ReturnType<typeof setTimeout> | undefined;
    effect(() => {
      const key = this.key();
      const design = this.planned();
      if (this.responses()?.key === key) return;
      clearTimeout(timer);
      timer = setTimeout(() => void this.compute(key, design), 300);
    });
    // The map's settings: the design's own until a plan or a slider moves them.
    effect(() => {
      const r = this.ready();
      untracked(() => {
        this.plan.set(null);
        this.settings.set(r ? settingsOf(this.planned(), r.drives) : null);
        this.rangeVersion.update((v) => v + 1);
      });
    });
    // A worker that restarted (another analysis stopped it) has lost the responses: compute them again.
    effect(() => {
      const l = this.live();
      if (l && !l.outcome.ok && l.outcome.error.code === 'stale-basis') untracked(() => this.responses.set(null));
    });
    inject(DestroyRef).onDestroy(() => {
      const basis = this.ready();
      if (basis) void this.analysis.releaseBasis(basis.id).catch(() => undefined);
      clearTimeout(timer);
      if (this.computing()) this.analysis.cancel();
    });
  }

  private async compute(key: string, design: DesignDocument): Promise<void> {
    if (!design.ports.some((p) => p.potential !== null)) {
      this.error.set('Every port floats: give at least one port an electrode to plan.');
      return;
    }
    this.computing.set(true);
    this.error.set(null);
    this.progress.set({ label: 'unit responses', fraction: 0 });
    const started = performance.now();
    const outcome = await this.analysis.unitResponses(design, {}, (p) => this.progress.set(p));
    this.computing.set(false);
    this.progress.set(null);
    if (!outcome.ok) {
      if (outcome.error.code !== 'cancelled') this.error.set(outcome.error.message);
      return;
    }
    // The worker adds a drive for each head that is not zero; the plan holds those heads as they are.
    this.responses.set({ key, basis: outcome.basis, pageMs: performance.now() - started });
  }

  protected recompute(): void {
    this.responses.set(null);
  }

  protected async runPlan(): Promise<void> {
    const r = this.ready();
    if (!r || !this.canPlan()) return;
    const request = planRequest(this.targets(), this.portPlans(), this.planned(), r.drives);
    const asked = JSON.stringify(request);
    this.planning.set(true);
    const outcome = await this.analysis.plan(r.id, request).catch((error: unknown) => ({
      ok: false as const,
      error: { code: 'worker-failed', message: error instanceof Error ? error.message : String(error) },
    }));
    this.planning.set(false);
    // Answered for what was asked: the basis, targets and ports must still be those of the request.
    if (this.ready() !== r || JSON.stringify(planRequest(this.targets(), this.portPlans(), this.planned(), r.drives)) !== asked) return;
    if (!outcome.ok) {
      if (outcome.error.code === 'stale-basis') this.responses.set(null);
      this.error.set(outcome.error.message);
      return;
    }
    this.plan.set(outcome.plan);
    this.settings.set(outcome.plan.settings);
    this.error.set(null);
    this.rangeVersion.update((v) => v + 1);
  }

  protected slide(index: number, event: Event): void {
    const v = (event.target as HTMLInputElement).valueAsNumber;
    if (!Number.isFinite(v)) return;
    this.settings.update((s) => (s ? s.map((x, k) => (k === index ? v : x)) : s));
  }

  protected slideEnd(): void {
    this.rangeVersion.update((v) => v + 1);
  }

  protected setMap(map: PlannerMap): void {
    this.mapId.set(map);
  }

  protected apply(): void {
    const r = this.ready(), s = this.settings();
    if (!r || !s || this.readOnly()) return;
    this.documentChange.emit(withSettings(this.planned(), r.drives, s));
  }

  protected residualShare(t: PlanResult['targets'][number]): number | null {
    const scale = Math.abs(t.wanted);
    return scale > 0 ? Math.abs(t.residual) / scale : null;
  }

  protected dimensionOf(kind: string): 'flowRate' | 'velocity' | 'current' {
    return kind === 'speed' ? 'velocity' : kind === 'current' ? 'current' : 'flowRate';
  }
}
