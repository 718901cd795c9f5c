import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { DesignDocument } from '../../../../shared/design';
import { SOLVER } from '../../core/solver-client';
import { QuantityPipe } from '../../ui/quantity-pipe';
import { QuantityInput, blurOnEnter } from '../analysis/quantity-input';
import { SeriesPlot } from '../analysis/series-plot';
import { INSTANT, latestOf, type DistanceAxis, type EdlInputs } from '../../core/instant-client';

/** Tangential field assumed for the slip velocity and vorticities unless the engineer types another. */
const DEFAULT_FIELD = 1e4;

/**
 * The Double layer tab (product.md, capability 8): for the design's buffer and a wall zeta, the potential,
 * velocity and vorticity across the electric double layer, the Debye length, the finite-EDL corrections of the
 * mean slip for the channel depth (slit) and the narrowest channel (capillary), and whether the thin-EDL model
 * holds for this layout.
 */
@Component({
  selector: 'osm-double-layer-tab',
  imports: [
    DecimalPipe,
    ReactiveFormsModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatTooltipModule,
    QuantityPipe,
    SeriesPlot,
  ],
  templateUrl: './double-layer-tab.html',
  styleUrl: './double-layer-tab.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DoubleLayerTab {
  private readonly solver = inject(SOLVER);
  private readonly instant = inject(INSTANT);

  readonly document = input.required<DesignDocument>();

  protected readonly ionicStrength = new QuantityInput(null, { dimension: 'concentration', defaultUnit: 'mM', min: 0, minExclusive: true });
  protected readonly zeta = new QuantityInput(null, { dimension: 'potential', defaultUnit: 'mV', min: -1, max: 1 });
  protected readonly temperature = new QuantityInput(null, { dimension: 'temperature', defaultUnit: 'degC', min: 200, max: 500 });
  protected readonly field = new QuantityInput(DEFAULT_FIELD, { dimension: 'fieldStrength', defaultUnit: 'V/m', min: 0, minExclusive: true });
  protected readonly blurOnEnter = blurOnEnter;

  protected readonly axis = signal<DistanceAxis>('nm');
  /** The layout's narrowest channel, measured in the worker (null until measured, or when there is none). */
  protected readonly narrowest = signal<number | null>(null);
  protected readonly measuring = signal(false);

  protected readonly buffer = computed(() => this.document().buffer);
  /** What the profiles are drawn for; null while an input does not read as a number. */
  private readonly inputs = computed<{ inputs: EdlInputs; axis: DistanceAxis } | null>(() => {
    const I = this.ionicStrength.value(), z = this.zeta.value(), T = this.temperature.value(), E = this.field.value();
    if (I === null || z === null || T === null || E === null) return null;
    const b = this.buffer();
    const inputs = { ionicStrength: I, zeta: z, temperature: T, field: E, relativePermittivity: b.relativePermittivity, viscosity: b.viscosity, depth: this.document().depth, width: this.narrowest() };
    return { inputs, axis: this.axis() };
  });
  /** The profiles and report from the instant worker, with the axis they were drawn for; null while inputs are incomplete. */
  private readonly answer = latestOf(this.inputs, async (q) => (q ? { axis: q.axis, view: await this.instant.doubleLayer(q.inputs, q.axis) } : null), null);
  protected readonly view = computed(() => this.answer()?.view ?? null);
  /** The x axis as the shown profiles have it (the toggle's choice once its answer has come). */
  private readonly shownAxis = computed(() => this.answer()?.axis ?? this.axis());
  protected readonly xTitle = computed(() => (this.shownAxis() === 'nm' ? 'distance from the wall' : 'distance from the wall / λ_D'));
  protected readonly xDimension = computed(() => (this.shownAxis() === 'nm' ? ('length' as const) : ('dimensionless' as const)));
  /** Whether the inputs differ from the design's buffer and side-wall zeta. */
  protected readonly edited = computed(() => {
    const doc = this.document();
    const near = (a: number | null, b: number) => a !== null && Math.abs(a - b) <= 1e-6 * Math.max(Math.abs(b), 1e-12);
    return !(near(this.ionicStrength.value(), doc.buffer.ionicStrength) && near(this.zeta.value(), doc.zeta.side) && near(this.temperature.value(), doc.buffer.temperature));
  });

  constructor() {
    // The design's buffer and side-wall zeta fill the inputs (again when the design's values change).
    let shown: unknown = null;
    effect(() => {
      const doc = this.document();
      const key = `${doc.buffer.ionicStrength}|${doc.buffer.temperature}|${doc.zeta.side}`;
      if (key === shown) return;
      shown = key;
      untracked(() => this.fromDesign());
    });
    // The narrowest channel, from the worker's measure of the shapes.
    let measuredShapes: unknown = null;
    let alive = true;
    inject(DestroyRef).onDestroy(() => (alive = false));
    effect(() => {
      const doc = this.document();
      if (doc.shapes === measuredShapes) return;
      measuredShapes = doc.shapes;
      this.measuring.set(true);
      this.solver.measure(doc).then(
        (m) => alive && (this.narrowest.set(m.narrowest), this.measuring.set(false)),
        () => alive && this.measuring.set(false),
      );
    });
  }

  /** A small ratio as a percentage with two significant digits ("0.015 %"). */
  protected percent(ratio: number | undefined): string {
    return ratio === undefined ? '–' : `${Number((ratio * 100).toPrecision(2))} %`;
  }

  protected fromDesign(): void {
    const doc = this.document();
    this.ionicStrength.set(doc.buffer.ionicStrength);
    this.zeta.set(doc.zeta.side);
    this.temperature.set(doc.buffer.temperature);
  }
}
