import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { SweepDetail, SweepPoint } from '../../../../shared/api';
import { formatQuantity, type Dimension } from '../../ui/units';
import { SweepMap } from './sweep-map';
import { SweepPlot } from './sweep-plot';
import { seriesGroups, sweepCsv, sweepSeries, type Series } from './sweep-series';
import { isFinished } from './sweep-state';

/**
 * One sweep: its state and progress (cancel while it runs), plots of each output against the parameter (a map
 * for two parameters), the table of points, CSV, and the point a click picks, which opens as a run.
 */
@Component({
  selector: 'osm-sweep-view',
  imports: [DecimalPipe, MatButtonModule, MatFormFieldModule, MatIconModule, MatProgressBarModule, MatSelectModule, MatTableModule, MatTooltipModule, SweepPlot, SweepMap],
  templateUrl: './sweep-view.html',
  styleUrl: './sweep-view.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SweepView {
  readonly sweep = input.required<SweepDetail>();
  readonly canEdit = input(false);
  readonly busy = input(false);
  readonly cancel = output<void>();
  /** Open this point as a run (its index). */
  readonly openPoint = output<number>();

  protected readonly selected = signal<number | null>(null);
  protected readonly mapKey = signal<string | null>(null);

  protected readonly running = computed(() => !isFinished(this.sweep().status));
  protected readonly progress = computed(() => {
    const s = this.sweep();
    return s.total ? (100 * s.done) / s.total : 0;
  });
  protected readonly series = computed(() => sweepSeries(this.sweep()));
  protected readonly groups = computed(() => seriesGroups(this.series()));
  protected readonly twoParameters = computed(() => this.sweep().parameters.length === 2);
  protected readonly mapSeries = computed<Series | null>(() => {
    const all = this.series();
    return all.find((s) => s.key === this.mapKey()) ?? all[0] ?? null;
  });
  protected readonly columns = computed(() => [
    'index',
    ...this.sweep().parameters.map((_, k) => `p${k}`),
    'status',
    ...this.series().map((s) => s.key),
    ...(this.sweep().outputs.includes('warnings') ? ['codes'] : []),
  ]);
  protected readonly point = computed<SweepPoint | null>(() => {
    const k = this.selected();
    return k === null ? null : (this.sweep().points[k] ?? null);
  });
  protected readonly csvName = computed(() => `sweep-${this.sweep().id}.csv`);

  protected quantity(value: number, dimension: string): string {
    return Number.isFinite(value) ? formatQuantity(value, dimension as Dimension, { digits: 4 }) : '–';
  }

  protected select(index: number): void {
    this.selected.set(index);
  }

  protected codes(p: SweepPoint): string {
    return (p.result?.warnings ?? []).map((w) => w.code).join(', ');
  }

  protected download(): void {
    const blob = new Blob([sweepCsv(this.sweep(), this.series())], { type: 'text/csv' });
    const url = URL.createObjectURL(blob);
    const a = document.createElement('a');
    a.href = url;
    a.download = this.csvName();
    a.click();
    setTimeout(() => URL.revokeObjectURL(url), 1000);
  }
}
