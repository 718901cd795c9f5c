import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, linkedSignal, output, signal, untracked } from '@angular/core';
import { FormControl, ReactiveFormsModule, Validators, type AbstractControl } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatMenuModule } from '@angular/material/menu';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { Subscription } from 'rxjs';
import type { BufferValues, WallValues } from '../../../../shared/api';
import type { Buffer, DesignDocument } from '../../../../shared/design';
import { HIGH_VOLTAGE_CAUTION } from '../../../../shared/physics';
import { quantityError, quantityValidator, readQuantity, type QuantityRule } from '../../ui/quantity-validator';
import { QuantityPipe } from '../../ui/quantity-pipe';
import { formatQuantity, parsePressureOrHead, pressureToHead, type Dimension } from '../../ui/units';
import type { CanvasPointer } from '../sketch/canvas-pointer';
import { SketchCanvas } from '../sketch/sketch-canvas';
import { shapeBounds, unionBounds } from '../sketch/shape-transform';
import { fluidOutlineOf } from '../../core/instant-client';
import { chamberFromCorners, type Vec } from '../sketch/tool-geometry';
import { CONDITIONS_LIBRARY, type LibraryChoice } from './buffer-library';
import {
  HIGH_VOLTAGE,
  WALLS,
  addZone,
  defaultZoneRegion,
  highVoltagePorts,
  mobilityOf,
  removeZone,
  wallZeta,
  withBuffer,
  withPort,
  withZeta,
  withZone,
  withZoneRegion,
  zetaOf,
  type Wall,
} from './conditions-model';

/** A form control tied to one value of the document: how to show it, and how an entry changes the document. */
interface Binding {
  control: AbstractControl;
  show: (doc: DesignDocument) => unknown;
  /** The edited document, or null when the entry changes nothing. */
  apply: (doc: DesignDocument, value: never) => DesignDocument | null;
  /** Whether the control takes input for this document (e.g. no potential on a floating port). */
  enabled?: (doc: DesignDocument) => boolean;
}

type Text = FormControl<string>;

interface PortRow {
  index: number;
  id: string;
  name: Text;
  floating: FormControl<boolean>;
  potential: Text;
  level: Text;
}

interface ZoneRow {
  index: number;
  rect: boolean;
  description: string;
  fields: Array<{ key: string; label: string; control: Text }>;
  zeta: Text;
  mobility: Text;
}

interface WallRow {
  wall: Wall;
  label: string;
  zeta: Text;
  mobility: Text;
}

const BUFFER_FIELDS: ReadonlyArray<{ key: keyof Buffer; label: string; rule: QuantityRule; hint: string }> = [
  { key: 'relativePermittivity', label: 'Relative permittivity', rule: { dimension: 'dimensionless', min: 1 }, hint: 'ε_r, water 78.4 at 25 °C' },
  { key: 'viscosity', label: 'Viscosity', rule: { dimension: 'viscosity', defaultUnit: 'mPa*s', min: 0, minExclusive: true }, hint: 'mPa·s if no unit' },
  { key: 'density', label: 'Density', rule: { dimension: 'density', defaultUnit: 'kg/m^3', min: 0, minExclusive: true }, hint: 'kg/m³ if no unit' },
  { key: 'conductivity', label: 'Conductivity', rule: { dimension: 'conductivity', defaultUnit: 'S/m', min: 0, minExclusive: true }, hint: 'S/m if no unit; 1 mS/cm = 0.1 S/m' },
  { key: 'ionicStrength', label: 'Ionic strength', rule: { dimension: 'concentration', defaultUnit: 'mM', min: 0, minExclusive: true }, hint: 'mM (= mol/m³) if no unit' },
  { key: 'temperature', label: 'Temperature', rule: { dimension: 'temperature', defaultUnit: 'C' }, hint: '°C if no unit; or K' },
];

const ZONE_RECT_FIELDS: ReadonlyArray<{ key: 'x' | 'y' | 'width' | 'height' | 'angle'; label: string; dimension: Dimension; positive?: boolean }> = [
  { key: 'x', label: 'Corner x', dimension: 'length' },
  { key: 'y', label: 'Corner y', dimension: 'length' },
  { key: 'width', label: 'Width', dimension: 'length', positive: true },
  { key: 'height', label: 'Height', dimension: 'length', positive: true },
  { key: 'angle', label: 'Angle', dimension: 'angle' },
];

const ZETA_RULE: QuantityRule = { dimension: 'potential', defaultUnit: 'mV', min: -1, max: 1 };
const MOBILITY_RULE: QuantityRule = { dimension: 'mobility', defaultUnit: 'm^2/V*s' };
const DIGITS = 6;

function textControl(rule: QuantityRule | (() => QuantityRule)): Text {
  return new FormControl('', { nonNullable: true, validators: quantityValidator(rule), updateOn: 'blur' });
}

/**
 * The Conditions tab: reservoirs (ports) with potential or floating and pressure or head; the buffer by hand or
 * from the library; side-wall, floor and lid zeta or mobility; wall zones; channel depth. Every value is typed
 * with units and committed when the field is left; each commit emits a new design document.
 */
@Component({
  selector: 'osm-conditions-panel',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatMenuModule,
    MatSlideToggleModule,
    MatTableModule,
    MatTooltipModule,
    QuantityPipe,
    SketchCanvas,
  ],
  templateUrl: './conditions-panel.html',
  styleUrl: './conditions-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ConditionsPanel {
  readonly document = input.required<DesignDocument>();
  readonly readOnly = input(false);
  /** The workspace whose library the pick menus read (the navigation's workspace when not given). */
  readonly workspaceId = input<string | number | null>(null);
  readonly documentChange = output<DesignDocument>();

  private readonly library = inject(CONDITIONS_LIBRARY);

  protected readonly doc = linkedSignal(() => this.document());
  protected readonly walls = WALLS;
  protected readonly bufferFields = BUFFER_FIELDS;
  protected readonly caution = HIGH_VOLTAGE_CAUTION;
  protected readonly highVoltageLimit = HIGH_VOLTAGE;
  protected readonly portColumns = ['id', 'name', 'electrode', 'potential', 'level'];

  /** How reservoir levels are shown: as gauge pressure, or as a head of buffer above the chip. */
  protected readonly levelMode = signal<'pressure' | 'head'>('pressure');

  protected readonly depth = textControl({ dimension: 'length', defaultUnit: 'um', min: 0, minExclusive: true });
  protected readonly buffer: Record<keyof Buffer, Text> = Object.fromEntries(
    BUFFER_FIELDS.map((f) => [f.key, textControl(f.rule)]),
  ) as Record<keyof Buffer, Text>;
  protected readonly wallRows: WallRow[] = WALLS.map((w) => ({ ...w, zeta: textControl(ZETA_RULE), mobility: textControl(MOBILITY_RULE) }));
  protected readonly portRows = signal<PortRow[]>([]);
  protected readonly zoneRows = signal<ZoneRow[]>([]);

  protected readonly hotPorts = computed(() => highVoltagePorts(this.doc()));
  protected readonly outline = fluidOutlineOf(() => this.doc().shapes);
  protected readonly drawingZone = signal(false);
  private zoneStart: Vec | null = null;
  protected readonly zoneDraft = signal<Vec[] | null>(null);

  protected readonly bufferChoices = signal<LibraryChoice<BufferValues>[] | null>(null);
  protected readonly wallChoices = signal<LibraryChoice<WallValues>[] | null>(null);
  protected readonly libraryError = signal('');

  private fixed: Binding[] = [];
  private dynamic: Binding[] = [];
  private dynamicSubs = new Subscription();
  private readonly fixedSubs = new Subscription();
  /** Last potential of each port before it was made floating, to restore when an electrode goes back. */
  private readonly lastPotential = new Map<string, number>();
  private shape = '';

  constructor() {
    inject(DestroyRef).onDestroy(() => {
      this.fixedSubs.unsubscribe();
      this.dynamicSubs.unsubscribe();
    });
    this.fixed = [
      {
        control: this.depth,
        show: (d) => formatQuantity(d.depth, 'length', { digits: DIGITS }),
        apply: (d, text: string) => this.quantity(text, { dimension: 'length', defaultUnit: 'um' }, (v) => ({ ...d, depth: v })),
      },
      ...BUFFER_FIELDS.map<Binding>((f) => ({
        control: this.buffer[f.key],
        show: (d) => formatQuantity(d.buffer[f.key], f.rule.dimension, { digits: DIGITS }),
        apply: (d, text: string) =>
          this.quantity(text, f.rule, (v) => withBuffer(d, { [f.key]: v })),
      })),
      ...this.wallRows.flatMap<Binding>((row) => [
        {
          control: row.zeta,
          show: (d) => formatQuantity(d.zeta[row.wall], 'potential', { digits: DIGITS }),
          apply: (d, text: string) => this.quantity(text, ZETA_RULE, (v) => withZeta(d, row.wall, v)),
        },
        {
          control: row.mobility,
          show: (d) => formatQuantity(mobilityOf(d, d.zeta[row.wall]), 'mobility', { digits: 4 }),
          apply: (d, text: string) => this.mobility(d, text, (z) => withZeta(d, row.wall, z), row.mobility),
        },
      ]),
    ];
    for (const b of this.fixed) this.fixedSubs.add(this.listen(b));

    effect(() => {
      const doc = this.doc();
      const readOnly = this.readOnly();
      this.levelMode();
      untracked(() => this.sync(doc, readOnly));
    });
  }

  // ---------------------------------------------------------------- committing

  private commit(next: DesignDocument): void {
    if (next === this.doc()) return;
    this.doc.set(next);
    this.documentChange.emit(next);
  }

  private listen(b: Binding): Subscription {
    return b.control.valueChanges.subscribe((value) => {
      if (b.control.invalid || this.readOnly()) return;
      const next = b.apply(this.doc(), value as never);
      if (next) this.commit(next);
      else b.control.setValue(b.show(this.doc()), { emitEvent: false });
    });
  }

  private quantity(text: string, rule: QuantityRule, apply: (v: number) => DesignDocument): DesignDocument | null {
    const r = readQuantity(text, rule);
    return r.ok ? apply(r.value) : null;
  }

  private mobility(doc: DesignDocument, text: string, apply: (zeta: number) => DesignDocument, control: AbstractControl): DesignDocument | null {
    const r = readQuantity(text, MOBILITY_RULE);
    if (!r.ok) return null;
    const zeta = zetaOf(doc, r.value);
    if (Math.abs(zeta) > 1) {
      control.setErrors({ quantity: `Gives a zeta of ${formatQuantity(zeta, 'potential')} in this buffer; zeta must be within ±1 V` });
      return null;
    }
    return apply(zeta);
  }

  /** Shows the document in the controls; rebuilds the port and zone rows when their number or kinds change. */
  private sync(doc: DesignDocument, readOnly: boolean): void {
    const shape = JSON.stringify([doc.ports.map((p) => p.id), doc.wallZones.map((z) => z.region.type)]);
    if (shape !== this.shape) {
      this.shape = shape;
      this.buildRows(doc);
    }
    for (const b of [...this.fixed, ...this.dynamic]) {
      const value = b.show(doc);
      if (b.control.value !== value) b.control.setValue(value, { emitEvent: false });
      const enabled = !readOnly && (b.enabled?.(doc) ?? true);
      if (enabled && b.control.disabled) b.control.enable({ emitEvent: false });
      if (!enabled && b.control.enabled) b.control.disable({ emitEvent: false });
    }
  }

  private levelRule(): QuantityRule {
    const density = this.doc().buffer.density;
    const head = this.levelMode() === 'head';
    return {
      dimension: 'pressure',
      parse: (text) =>
        head && /^\s*[-+]?[\d.]+(e[-+]?\d+)?\s*$/i.test(text) ? parsePressureOrHead(`${text} mm`, density) : parsePressureOrHead(text, density, { defaultUnit: 'Pa' }),
    };
  }

  protected showLevel(doc: DesignDocument, pressure: number): string {
    if (this.levelMode() === 'pressure') return formatQuantity(pressure, 'pressure', { digits: DIGITS });
    return formatQuantity(pressureToHead(pressure, doc.buffer.density), 'length', { digits: DIGITS });
  }

  private buildRows(doc: DesignDocument): void {
    this.dynamicSubs.unsubscribe();
    this.dynamicSubs = new Subscription();
    this.dynamic = [];
    const ports: PortRow[] = doc.ports.map((port, index) => {
      const row: PortRow = {
        index,
        id: port.id,
        name: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(200)], updateOn: 'blur' }),
        floating: new FormControl(false, { nonNullable: true }),
        potential: textControl({ dimension: 'potential', defaultUnit: 'V' }),
        level: textControl(() => this.levelRule()),
      };
      this.dynamic.push(
        {
          control: row.name,
          show: (d) => d.ports[index]?.name ?? '',
          apply: (d, name: string) => withPort(d, index, { name: name.trim() === '' ? undefined : name.trim() }),
        },
        {
          control: row.floating,
          show: (d) => d.ports[index]?.potential === null,
          apply: (d, floating: boolean) => {
            const p = d.ports[index];
            if (!p || floating === (p.potential === null)) return null;
            if (floating) {
              this.lastPotential.set(p.id, p.potential as number);
              return withPort(d, index, { potential: null });
            }
            return withPort(d, index, { potential: this.lastPotential.get(p.id) ?? 0 });
          },
        },
        {
          control: row.potential,
          show: (d) => {
            const v = d.ports[index]?.potential;
            return v === null || v === undefined ? '' : formatQuantity(v, 'potential', { digits: DIGITS });
          },
          apply: (d, text: string) => this.quantity(text, { dimension: 'potential', defaultUnit: 'V' }, (v) => withPort(d, index, { potential: v })),
          enabled: (d) => d.ports[index]?.potential !== null,
        },
        {
          control: row.level,
          show: (d) => this.showLevel(d, d.ports[index]?.pressure ?? 0),
          apply: (d, text: string) => this.quantity(text, this.levelRule(), (v) => withPort(d, index, { pressure: v })),
        },
      );
      return row;
    });
    const zones: ZoneRow[] = doc.wallZones.map((zone, index) => {
      const rect = zone.region.type === 'rect';
      const row: ZoneRow = {
        index,
        rect,
        description: rect ? 'Rectangle' : `${zone.region.type} region (edit its outline in the design file)`,
        fields: rect
          ? ZONE_RECT_FIELDS.map((f) => ({
              key: f.key,
              label: f.label,
              control: textControl({ dimension: f.dimension, defaultUnit: f.dimension === 'angle' ? 'deg' : 'um', min: f.positive ? 0 : undefined, minExclusive: f.positive }),
            }))
          : [],
        zeta: textControl(ZETA_RULE),
        mobility: textControl(MOBILITY_RULE),
      };
      for (const [k, f] of row.fields.entries()) {
        const spec = ZONE_RECT_FIELDS[k];
        this.dynamic.push({
          control: f.control,
          show: (d) => {
            const r = d.wallZones[index]?.region;
            return r?.type === 'rect' ? formatQuantity(r[spec.key], spec.dimension, { digits: DIGITS }) : '';
          },
          apply: (d, text: string) =>
            this.quantity(text, { dimension: spec.dimension, defaultUnit: spec.dimension === 'angle' ? 'deg' : 'um' }, (v) => withZoneRegion(d, index, { [spec.key]: v })),
        });
      }
      this.dynamic.push(
        {
          control: row.zeta,
          show: (d) => formatQuantity(d.wallZones[index]?.zeta ?? 0, 'potential', { digits: DIGITS }),
          apply: (d, text: string) => this.quantity(text, ZETA_RULE, (v) => withZone(d, index, { zeta: v })),
        },
        {
          control: row.mobility,
          show: (d) => formatQuantity(mobilityOf(d, d.wallZones[index]?.zeta ?? 0), 'mobility', { digits: 4 }),
          apply: (d, text: string) => this.mobility(d, text, (z) => withZone(d, index, { zeta: z }), row.mobility),
        },
      );
      return row;
    });
    for (const b of this.dynamic) this.dynamicSubs.add(this.listen(b));
    this.portRows.set(ports);
    this.zoneRows.set(zones);
  }

  // ---------------------------------------------------------------- template helpers

  protected error(control: AbstractControl): string {
    return quantityError(control);
  }

  protected blurOnEnter(event: Event): void {
    (event.target as HTMLElement).blur();
  }

  protected otherLevel(pressure: number): string {
    const doc = this.doc();
    return this.levelMode() === 'pressure'
      ? `= ${formatQuantity(pressureToHead(pressure, doc.buffer.density), 'length', { digits: 3 })} of buffer`
      : `= ${formatQuantity(pressure, 'pressure', { digits: 3 })}`;
  }

  protected addZone(): void {
    const doc = this.doc();
    this.commit(addZone(doc, defaultZoneRegion(unionBounds(doc.shapes.map(shapeBounds)))));
  }

  protected removeZone(index: number): void {
    this.commit(removeZone(this.doc(), index));
  }

  /** Drawing a zone on the layout: drag a rectangle while "Draw a zone" is on. */
  protected onLayoutPointer(p: CanvasPointer): void {
    if (!this.drawingZone() || this.readOnly()) return;
    if (p.type === 'down' && p.event.button === 0) {
      this.zoneStart = p.snapped;
      this.zoneDraft.set([p.snapped, p.snapped]);
    } else if (p.type === 'move' && this.zoneStart) {
      this.zoneDraft.set([this.zoneStart, p.snapped]);
    } else if (p.type === 'up' && this.zoneStart) {
      const rect = chamberFromCorners(this.zoneStart, p.snapped);
      this.zoneStart = null;
      this.zoneDraft.set(null);
      if (rect) {
        const { op: _op, ...region } = rect;
        this.commit(addZone(this.doc(), region));
        this.drawingZone.set(false);
      }
    }
  }

  protected readonly zonePreview = computed(() => {
    const d = this.zoneDraft();
    const rect = d ? chamberFromCorners(d[0], d[1]) : null;
    return rect ? { shapes: [rect], points: [] } : null;
  });

  // ---------------------------------------------------------------- library

  protected loadBuffers(): void {
    this.libraryError.set('');
    this.library.buffers(this.workspaceId()).subscribe({
      next: (list) => this.bufferChoices.set(list),
      error: () => {
        this.bufferChoices.set([]);
        this.libraryError.set('The library could not be read.');
      },
    });
  }

  protected loadWalls(): void {
    this.libraryError.set('');
    this.library.walls(this.workspaceId()).subscribe({
      next: (list) => this.wallChoices.set(list),
      error: () => {
        this.wallChoices.set([]);
        this.libraryError.set('The library could not be read.');
      },
    });
  }

  protected pickBuffer(choice: LibraryChoice<BufferValues>): void {
    const patch: Partial<Buffer> = {};
    for (const f of BUFFER_FIELDS) {
      const v = choice.values[f.key];
      if (typeof v === 'number' && Number.isFinite(v)) patch[f.key] = v;
    }
    this.commit(withBuffer(this.doc(), patch));
  }

  protected pickWall(wall: Wall, choice: LibraryChoice<WallValues>): void {
    const doc = this.doc();
    const zeta = wallZeta(choice.values, (mobility) => zetaOf(doc, mobility));
    if (zeta === null || Math.abs(zeta) > 1) {
      this.libraryError.set(`"${choice.name}" has no usable zeta or mobility.`);
      return;
    }
    this.libraryError.set('');
    this.commit(withZeta(doc, wall, zeta));
  }

  protected describeWall(choice: LibraryChoice<WallValues>): string {
    const v = choice.values;
    const range = (a: number | undefined, b: number | undefined, dim: 'potential' | 'mobility') =>
      typeof a === 'number' && typeof b === 'number' ? `${formatQuantity(a, dim, { digits: 3 })} to ${formatQuantity(b, dim, { digits: 3 })}` : null;
    if (typeof v.zeta === 'number') return `ζ ${formatQuantity(v.zeta, 'potential', { digits: 3 })}`;
    const zetas = range(v.zetaMax, v.zetaMin, 'potential');
    if (zetas) return `ζ ${zetas}, middle taken`;
    if (typeof v.mobility === 'number') return `μeo ${formatQuantity(v.mobility, 'mobility', { digits: 3 })}`;
    const mobilities = range(v.mobilityMin, v.mobilityMax, 'mobility');
    return mobilities ? `μeo ${mobilities}, middle taken` : '';
  }
}
