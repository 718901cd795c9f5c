import { ChangeDetectionStrategy, Component, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { Port } from '../../../../shared/design';
import { formatQuantity, parseQuantity, type Dimension } from '../../ui/units';
import { TARGET_KINDS, type PortMode, type PortPlan, type TargetKind, type TargetRow } from './planner-model';

const DEFAULT_UNIT: Partial<Record<Dimension, string>> = { velocity: 'mm/s', flowRate: 'nL/min', current: 'uA', potential: 'V' };

/**
 * What the engineer asks of the planner: targets (kind, port, direction or the other port of a ratio, value
 * with units) and, per port, whether its potential is planned (within bounds), held (ground is 0 V) or left
 * floating. Values are read with the app's unit parser when a field is left.
 */
@Component({
  selector: 'osm-planner-form',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, MatTooltipModule],
  templateUrl: './planner-form.html',
  styleUrl: './planner-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlannerForm {
  readonly ports = input.required<ReadonlyArray<Port>>();
  readonly targets = input.required<ReadonlyArray<TargetRow>>();
  readonly portPlans = input.required<ReadonlyArray<PortPlan>>();
  readonly disabled = input(false);
  readonly targetsChange = output<TargetRow[]>();
  readonly portPlansChange = output<PortPlan[]>();

  protected readonly kinds = TARGET_KINDS;
  /** Messages for entries that did not read, by "t3" (target row) or "p1.min" (port row and field). */
  protected readonly errors = signal<Record<string, string>>({});

  protected dimensionOf(kind: TargetKind): Dimension | null {
    return TARGET_KINDS.find((k) => k.kind === kind)?.dimension ?? null;
  }

  protected valueText(row: TargetRow): string {
    const dim = this.dimensionOf(row.kind);
    if (row.value === null || !dim) return '';
    return dim === 'dimensionless' ? String(row.value) : formatQuantity(row.value, dim);
  }

  protected setTarget(index: number, change: Partial<TargetRow>): void {
    const rows = this.targets().map((r, k) => (k === index ? { ...r, ...change } : r));
    const row = rows[index];
    if (change.kind !== undefined) {
      // A new kind starts from a sensible value in its own unit.
      row.value = change.kind === 'speed' ? 1e-3 : change.kind === 'flow' ? 100e-12 / 60 : change.kind === 'current' ? 1e-5 : change.kind === 'ratio' ? 0.5 : null;
      if (change.kind === 'ratio' && !row.of) row.of = this.ports().find((p) => p.id !== row.port)?.id ?? null;
      this.clearError(`t${index}`);
    }
    this.targetsChange.emit(rows);
  }

  protected readValue(index: number, text: string): void {
    const row = this.targets()[index];
    const dim = this.dimensionOf(row.kind);
    if (!dim) return;
    const r = parseQuantity(text, dim, { defaultUnit: DEFAULT_UNIT[dim] });
    if (!r.ok) return this.setError(`t${index}`, r.message);
    if (dim !== 'dimensionless' && r.value < 0) return this.setError(`t${index}`, 'Give the size here and the direction beside it');
    this.clearError(`t${index}`);
    this.setTarget(index, { value: r.value });
  }

  protected addTarget(): void {
    const port = this.ports()[0]?.id;
    if (!port) return;
    this.targetsChange.emit([...this.targets(), { kind: 'zero', port, value: null, direction: 'out', of: null }]);
  }

  protected removeTarget(index: number): void {
    this.clearError(`t${index}`);
    this.targetsChange.emit(this.targets().filter((_, k) => k !== index));
  }

  protected setMode(index: number, mode: PortMode): void {
    this.portPlansChange.emit(this.portPlans().map((p, k) => (k === index ? { ...p, mode } : p)));
  }

  protected readPotential(index: number, field: 'hold' | 'min' | 'max', text: string): void {
    const key = `p${index}.${field}`;
    if (text.trim() === '' && field !== 'hold') {
      this.clearError(key);
      this.portPlansChange.emit(this.portPlans().map((p, k) => (k === index ? { ...p, [field]: null } : p)));
      return;
    }
    const r = parseQuantity(text, 'potential', { defaultUnit: 'V' });
    if (!r.ok) return this.setError(key, r.message);
    this.clearError(key);
    this.portPlansChange.emit(this.portPlans().map((p, k) => (k === index ? { ...p, [field]: r.value } : p)));
  }

  protected potentialText(v: number | null): string {
    return v === null ? '' : formatQuantity(v, 'potential');
  }

  protected blur(event: Event): void {
    (event.target as HTMLElement | null)?.blur();
  }

  private setError(key: string, message: string): void {
    this.errors.update((e) => ({ ...e, [key]: message }));
  }

  private clearError(key: string): void {
    this.errors.update((e) => {
      const { [key]: _gone, ...rest } = e;
      return rest;
    });
  }
}
