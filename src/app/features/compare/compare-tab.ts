import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, signal } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { DesignDocument } from '../../../../shared/design';
import type { Comparison } from '../../../workers/solver-api';
import { ANALYSIS, type AnalysisProgress } from '../../core/solver-client';
import { QuantityPipe } from '../../ui/quantity-pipe';
import { QuantityInput, blurOnEnter } from '../analysis/quantity-input';
import { SeriesPlot, type PlotSeries } from '../analysis/series-plot';
import { ColourBar } from '../fields/colour-bar';
import { FieldMap, type CutLine, type MapPort } from '../fields/field-map';
import { MAPS } from '../fields/field-maps';
import { lineProfile } from '../fields/field-sampling';
import { fluidOutlineOf } from '../../core/instant-client';
import { arrivalSeries, compareRows, compareValues, defaultComparePort, defaultCut, sharedRange, type CompareMap } from './compare-model';

/**
 * The Compare tab (product.md, capability 5): the layout driven by slip (its electrodes, equal heads) and by
 * pressure (heads in the pattern of the port potentials, no field) at the same flow rate through a chosen port.
 * Both solves run in the worker; the maps share one colour scale; a cut line gives both profiles; a band of the
 * reference species traced through each drive gives its spreading and the two arrival-time curves.
 */
@Component({
  selector: 'osm-compare-tab',
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
    MatSlideToggleModule,
    MatTooltipModule,
    QuantityPipe,
    FieldMap,
    ColourBar,
    SeriesPlot,
  ],
  templateUrl: './compare-tab.html',
  styleUrl: './compare-tab.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CompareTab {
  private readonly analysis = inject(ANALYSIS);

  readonly document = input.required<DesignDocument>();

  protected readonly port = signal<string | null>(null);
  protected readonly diffusivity = new QuantityInput(1e-9, { dimension: 'diffusivity', defaultUnit: 'm^2/s', min: 0, minExclusive: true });
  protected readonly blurOnEnter = blurOnEnter;
  protected readonly running = signal(false);
  protected readonly progress = signal<AnalysisProgress | null>(null);
  protected readonly error = signal<string | null>(null);
  protected readonly result = signal<{ comparison: Comparison; document: DesignDocument; pageMs: number } | null>(null);
  protected readonly mapId = signal<CompareMap>('speed');
  protected readonly cutMode = signal(false);
  protected readonly cut = signal<CutLine | null>(null);
  protected readonly mapHeight = 300;

  protected readonly ports = computed(() => this.document().ports);
  protected readonly spec = computed(() => MAPS[this.mapId()]);
  protected readonly comparison = computed(() => this.result()?.comparison ?? null);
  protected readonly stale = computed(() => {
    const r = this.result();
    return !!r && r.document !== this.document();
  });
  protected readonly outline = fluidOutlineOf(() => (this.result()?.document ?? this.document()).shapes);
  protected readonly mapPorts = computed<MapPort[]>(() => (this.result()?.document ?? this.document()).ports.map((p) => ({ id: p.id, from: p.from, to: p.to })));
  protected readonly values = computed(() => {
    const c = this.comparison();
    if (!c) return null;
    return { slip: compareValues(c.slip.result.fields, this.mapId()), pressure: compareValues(c.pressure.result.fields, this.mapId()) };
  });
  protected readonly range = computed(() => {
    const v = this.values();
    return v ? sharedRange(v.slip, v.pressure, this.mapId()) : null;
  });
  protected readonly rows = computed(() => {
    const c = this.comparison();
    return c ? compareRows(c) : [];
  });
  protected readonly arrivals = computed(() => {
    const c = this.comparison();
    return c ? arrivalSeries(c) : [];
  });
  protected readonly matched = computed(() => {
    const c = this.comparison();
    return c ? { slip: c.slip.flowRate, pressure: c.pressure.flowRate, ratio: c.pressure.flowRate / c.slip.flowRate } : null;
  });
  protected readonly heads = computed(() => {
    const c = this.comparison();
    return c ? Object.entries(c.pressures).map(([id, p]) => ({ id, p })) : [];
  });
  protected readonly profiles = computed<PlotSeries[]>(() => {
    const c = this.comparison(), cut = this.cut(), v = this.values();
    if (!c || !cut || !v) return [];
    const f = c.slip.result.fields;
    const length = Math.hypot(cut[1][0] - cut[0][0], cut[1][1] - cut[0][1]);
    const samples = Math.min(400, Math.max(60, Math.ceil((4 * length) / f.spacing)));
    const slip = lineProfile(f, v.slip, cut[0], cut[1], samples, this.outline());
    const pressure = lineProfile(c.pressure.result.fields, v.pressure, cut[0], cut[1], samples, this.outline());
    return [
      { label: 'slip-driven', x: slip.distance, y: slip.values },
      { label: 'pressure-driven', x: pressure.distance, y: pressure.values, tone: 'tertiary', dashed: true },
    ];
  });

  constructor() {
    // Start on the strongest electrode; keep the choice while it exists.
    effect(() => {
      const ids = this.ports().map((p) => p.id);
      const current = this.port();
      if (current === null || !ids.includes(current)) this.port.set(defaultComparePort(this.document()));
    });
    inject(DestroyRef).onDestroy(() => {
      if (this.running()) this.analysis.cancel();
    });
  }

  protected async run(): Promise<void> {
    const port = this.port(), D = this.diffusivity.value();
    if (port === null || D === null) return;
    const doc = this.document();
    this.running.set(true);
    this.error.set(null);
    this.progress.set({ label: 'starting', fraction: 0 });
    const started = performance.now();
    const outcome = await this.analysis.compare(doc, { port, referenceDiffusivity: D }, (p) => this.progress.set(p));
    this.running.set(false);
    this.progress.set(null);
    if (!outcome.ok) {
      if (outcome.error.code !== 'cancelled') this.error.set(outcome.error.message);
      return;
    }
    this.result.set({ comparison: outcome.comparison, document: doc, pageMs: performance.now() - started });
    this.cut.set(defaultCut(doc, port, outcome.comparison.slip.result.fields));
  }

  protected cancel(): void {
    this.analysis.cancel();
  }

  protected setCut(line: CutLine): void {
    this.cut.set(line);
    this.cutMode.set(false);
  }
}
