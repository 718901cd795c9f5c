import { ChangeDetectionStrategy, Component, computed, effect, inject, input, output, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { SWEEP_OUTPUTS, type SweepOutput, type SweepRequest } from '../../../../shared/api';
import { parseDesign } from '../../../../shared/design';
import { numericFields, SWEEP_CELLS, type NumericField } from '../../../../shared/sweep';
import { Api } from '../../core/api';
import type { RevisionSummary } from '../../core/api-types';
import { errorMessage } from '../../core/error-message';
import { describeDimension } from '../../ui/units';
import { buildRequest, defaultParameter, dimensionOf, type ParameterForm, type RangeKind } from './sweep-request';
import { OUTPUT_LABELS } from './sweep-series';

/**
 * Defines a sweep: a revision, one or two of its document's numeric fields (listed with readable labels), a range
 * for each (linear or logarithmic steps, or a list, typed with units), the outputs and the grid. Says before
 * running how many points it makes and whether they are answered at once by superposition.
 */
@Component({
  selector: 'osm-sweep-form',
  imports: [MatButtonModule, MatButtonToggleModule, MatCheckboxModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule],
  templateUrl: './sweep-form.html',
  styleUrl: './sweep-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SweepForm {
  private readonly api = inject(Api);

  readonly revisions = input.required<RevisionSummary[]>();
  readonly busy = input(false);
  readonly start = output<SweepRequest>();

  protected readonly outputNames = SWEEP_OUTPUTS;
  protected readonly outputLabels = OUTPUT_LABELS;
  protected readonly revisionId = signal<number | null>(null);
  protected readonly fields = signal<NumericField[]>([]);
  protected readonly loadError = signal<string | null>(null);
  protected readonly parameters = signal<ParameterForm[]>([]);
  protected readonly outputs = signal<SweepOutput[]>([...SWEEP_OUTPUTS]);
  protected readonly cells = signal<number | null>(SWEEP_CELLS.default);

  protected readonly built = computed(() => {
    const id = this.revisionId();
    if (id === null) return { ok: false as const, message: 'Save a revision first: sweeps vary a revision.', points: 0 };
    return buildRequest(id, this.parameters(), this.outputs(), this.cells(), this.fields());
  });

  constructor() {
    effect(() => {
      const latest = this.revisions()[0];
      untracked(() => {
        if (latest && this.revisionId() === null) this.chooseRevision(Number(latest.id));
      });
    });
  }

  protected chooseRevision(id: number): void {
    this.revisionId.set(id);
    this.loadError.set(null);
    this.api.revision(id).subscribe({
      next: (rev) => {
        const parsed = parseDesign(rev.document);
        const fields = parsed.ok ? numericFields(parsed.design) : [];
        this.fields.set(fields);
        // Keep parameters the new revision still has; otherwise start from its first field.
        const kept = this.parameters().filter((p) => fields.some((f) => f.pointer === p.pointer));
        this.parameters.set(kept.length ? kept : fields.length ? [defaultParameter(fields[0])] : []);
      },
      error: (err: unknown) => this.loadError.set(errorMessage(err)),
    });
  }

  protected field(pointer: string): NumericField | undefined {
    return this.fields().find((f) => f.pointer === pointer);
  }

  protected hint(p: ParameterForm): string {
    return describeDimension(dimensionOf(this.field(p.pointer)));
  }

  protected update(k: number, change: Partial<ParameterForm>): void {
    this.parameters.update((ps) => ps.map((p, j) => (j === k ? { ...p, ...change } : p)));
  }

  protected choose(k: number, pointer: string): void {
    const f = this.field(pointer);
    if (f) this.parameters.update((ps) => ps.map((p, j) => (j === k ? { ...defaultParameter(f), kind: p.kind === 'log' ? 'linear' : p.kind } : p)));
  }

  protected setKind(k: number, kind: RangeKind): void {
    this.update(k, { kind });
  }

  protected addSecond(): void {
    const used = this.parameters()[0]?.pointer;
    const f = this.fields().find((x) => x.pointer !== used);
    if (f) this.parameters.update((ps) => [...ps.slice(0, 1), { ...defaultParameter(f), steps: 6 }]);
  }

  protected removeSecond(): void {
    this.parameters.update((ps) => ps.slice(0, 1));
  }

  protected toggleOutput(o: SweepOutput, on: boolean): void {
    this.outputs.update((os) => (on ? SWEEP_OUTPUTS.filter((x) => x === o || os.includes(x)) : os.filter((x) => x !== o)));
  }

  protected numberOf(text: string): number | null {
    return text.trim() === '' ? null : Number(text);
  }

  protected run(): void {
    const b = this.built();
    if (b.ok) this.start.emit(b.request);
  }
}
