import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, output, signal, untracked } from '@angular/core';
import { FormControl, ReactiveFormsModule, Validators, type AbstractControl, type ValidationErrors } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatTooltipModule } from '@angular/material/tooltip';
import { Subscription } from 'rxjs';
import type { DesignDocument, Port, Shape } from '../../../../shared/design';
import { quantityControl, quantityError, readQuantity, type QuantityRule } from '../../ui/quantity-validator';
import { PORT_FIELDS, describeShape, shapeFields, MAX_VERTEX_FIELDS, type FieldSpec } from './inspector-fields';
import type { Selection } from './canvas-pointer';
import { rotateShape, shapePivot } from './shape-transform';

interface Item {
  kind: 'shape' | 'port';
  index: number;
  value: Shape | Port;
}

/**
 * The side panel of the sketch: exact dimensions of the selected shape or port, typed with units
 * ("50 um", "1.2 mm", "30 deg"). Each field commits when the engineer leaves it or presses Enter.
 */
@Component({
  selector: 'osm-shape-inspector',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, MatTooltipModule],
  templateUrl: './shape-inspector.html',
  styleUrl: './shape-inspector.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ShapeInspector {
  readonly document = input.required<DesignDocument>();
  readonly selection = input<Selection | null>(null);
  readonly readOnly = input(false);

  readonly shapeChange = output<{ index: number; shape: Shape }>();
  readonly portChange = output<{ index: number; port: Port }>();
  readonly remove = output<void>();

  protected readonly item = computed<Item | null>(() => {
    const sel = this.selection();
    const doc = this.document();
    if (!sel) return null;
    const value = sel.kind === 'shape' ? doc.shapes[sel.index] : doc.ports[sel.index];
    return value ? { kind: sel.kind, index: sel.index, value } : null;
  });

  protected readonly heading = computed(() => {
    const it = this.item();
    if (!it) return '';
    return it.kind === 'port' ? `Port ${(it.value as Port).id}` : `${describeShape(it.value as Shape)} · shapes[${it.index}]`;
  });

  protected readonly fields = computed<FieldSpec<Shape | Port>[]>(() => {
    const it = this.item();
    if (!it) return [];
    return (it.kind === 'shape' ? shapeFields(it.value as Shape) : PORT_FIELDS) as FieldSpec<Shape | Port>[];
  });

  protected readonly moreVertices = computed(() => {
    const it = this.item();
    return it?.kind === 'shape' && (it.value as Shape).type === 'polygon' ? Math.max(0, (it.value as Extract<Shape, { type: 'polygon' }>).points.length - MAX_VERTEX_FIELDS) : 0;
  });

  /** Ids of the ports other than the one being edited (set when the fields are built). */
  private otherPortIds = new Set<string>();
  protected readonly controls = signal<Record<string, FormControl<string>>>({});
  protected readonly idControl = new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(64), (c) => this.uniqueId(c)], updateOn: 'blur' });
  protected readonly nameControl = new FormControl('', { nonNullable: true, validators: [Validators.maxLength(200)], updateOn: 'blur' });
  protected readonly turnControl = quantityControl(0, { dimension: 'angle', defaultUnit: 'deg' });

  private subscriptions = new Subscription();

  constructor() {
    inject(DestroyRef).onDestroy(() => this.subscriptions.unsubscribe());
    // Rebuild the fields whenever the selected object changes (an edit here, a drag, undo, another tab).
    effect(() => {
      const it = this.item();
      const fields = this.fields();
      const readOnly = this.readOnly();
      untracked(() => this.build(it, fields, readOnly));
    });
    this.idControl.valueChanges.subscribe((id) => this.commitPort({ id: id.trim() }, this.idControl));
    this.nameControl.valueChanges.subscribe((name) => this.commitPort({ name: name.trim() === '' ? undefined : name.trim() }, this.nameControl));
    this.turnControl.valueChanges.subscribe((text) => this.turn(text));
  }

  protected error(control: AbstractControl): string {
    return quantityError(control);
  }

  protected idError(): string {
    const e = this.idControl.errors;
    if (!e) return '';
    if (e['required']) return 'A port needs an id';
    if (e['maxlength']) return 'At most 64 characters';
    if (e['taken']) return `"${this.idControl.value}" is used by another port`;
    return '';
  }

  /** Enter commits the field: leaving it is what the blur-updated controls listen to. */
  protected commitOnEnter(event: Event): void {
    (event.target as HTMLElement).blur();
  }

  protected setOp(op: Shape['op']): void {
    const it = this.item();
    if (!it || it.kind !== 'shape' || (it.value as Shape).op === op) return;
    this.shapeChange.emit({ index: it.index, shape: { ...(it.value as Shape), op } });
  }

  protected turnBy(deg: number): void {
    const it = this.item();
    if (!it || it.kind !== 'shape') return;
    const shape = it.value as Shape;
    this.shapeChange.emit({ index: it.index, shape: rotateShape(shape, deg, shapePivot(shape)) });
  }

  private turn(text: string): void {
    const r = readQuantity(text, { dimension: 'angle', defaultUnit: 'deg' });
    if (!r.ok || r.value === 0) return;
    this.turnBy(r.value);
    this.turnControl.setValue('0°', { emitEvent: false });
  }

  private uniqueId(control: AbstractControl): ValidationErrors | null {
    const id = String(control.value ?? '').trim();
    return this.otherPortIds.has(id) ? { taken: true } : null;
  }

  private commitPort(patch: Partial<Port>, control: AbstractControl): void {
    const it = this.item();
    if (!it || it.kind !== 'port' || control.invalid) return;
    const port = { ...(it.value as Port), ...patch };
    if (patch.name === undefined && 'name' in patch) delete port.name;
    this.portChange.emit({ index: it.index, port });
  }

  private build(it: Item | null, fields: FieldSpec<Shape | Port>[], readOnly: boolean): void {
    this.subscriptions.unsubscribe();
    this.subscriptions = new Subscription();
    const controls: Record<string, FormControl<string>> = {};
    if (it) {
      for (const f of fields) {
        const rule: QuantityRule = { dimension: f.dimension, defaultUnit: f.defaultUnit, min: f.positive ? 0 : undefined, minExclusive: f.positive };
        const control = quantityControl(f.get(it.value), rule, 7);
        if (readOnly) control.disable({ emitEvent: false });
        this.subscriptions.add(control.valueChanges.subscribe((text) => this.commitField(f, control, text)));
        controls[f.key] = control;
      }
      if (it.kind === 'port') {
        const port = it.value as Port;
        this.otherPortIds = new Set(this.document().ports.filter((_p, k) => k !== it.index).map((p) => p.id));
        this.idControl.setValue(port.id, { emitEvent: false });
        this.nameControl.setValue(port.name ?? '', { emitEvent: false });
        this.idControl.markAsUntouched();
      }
    }
    for (const c of [this.idControl, this.nameControl, this.turnControl]) {
      if (readOnly) c.disable({ emitEvent: false });
      else c.enable({ emitEvent: false });
    }
    this.controls.set(controls);
  }

  private commitField(f: FieldSpec<Shape | Port>, control: FormControl<string>, text: string): void {
    const it = this.item();
    if (!it || control.invalid) return;
    const r = readQuantity(text, { dimension: f.dimension, defaultUnit: f.defaultUnit });
    if (!r.ok) return;
    if (r.value === f.get(it.value)) return;
    const next = f.set(it.value, r.value);
    if (typeof next === 'string') {
      control.setErrors({ quantity: next });
      return;
    }
    if (it.kind === 'shape') this.shapeChange.emit({ index: it.index, shape: next as Shape });
    else this.portChange.emit({ index: it.index, port: next as Port });
  }
}
