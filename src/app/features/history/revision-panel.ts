import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked, viewChild } from '@angular/core';
import { FormControl, FormGroup, FormGroupDirective, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { RouterLink } from '@angular/router';
import { Api } from '../../core/api';
import type { Comment, DesignDocument, Id, RevisionSummary, Role, RunListItem, RunSummary } from '../../core/api-types';
import { errorMessage } from '../../core/error-message';
import { canComment } from '../../core/roles';
import { notBlank } from '../../core/validators';
import { LayoutPreview, type PreviewPin } from '../../ui/layout-preview';
import { formatQuantity } from '../../ui/units';

/** "4 ports · 1 warning" from a run's summary. */
export function runResult(summary: RunSummary | null | undefined): string {
  if (!summary) return '—';
  const parts: string[] = [];
  if (Array.isArray(summary.ports)) parts.push(`${summary.ports.length} port${summary.ports.length === 1 ? '' : 's'}`);
  const warnings = Array.isArray(summary.warnings) ? summary.warnings.length : 0;
  parts.push(warnings === 0 ? 'no warnings' : `${warnings} warning${warnings === 1 ? '' : 's'}`);
  return parts.join(' · ');
}

/** One revision in History: its runs, and its comments pinned to the layout. */
@Component({
  selector: 'osm-revision-panel',
  imports: [DatePipe, ReactiveFormsModule, RouterLink, MatTableModule, MatButtonModule, MatIconModule, MatFormFieldModule, MatInputModule, MatTooltipModule, LayoutPreview],
  templateUrl: './revision-panel.html',
  styleUrl: './revision-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionPanel {
  private readonly api = inject(Api);

  readonly revision = input.required<RevisionSummary>();
  readonly designId = input.required<Id>();
  readonly role = input<Role | null>(null);
  readonly refresh = input(0);

  protected readonly runColumns = ['status', 'createdAt', 'author', 'result', 'open'];
  protected readonly runResult = runResult;
  protected readonly runs = signal<RunListItem[] | null>(null);
  protected readonly comments = signal<Comment[] | null>(null);
  protected readonly document = signal<DesignDocument | null>(null);
  protected readonly error = signal<string | null>(null);
  protected readonly mayComment = computed(() => canComment(this.role()));

  protected readonly pin = signal<[number, number] | null>(null);
  protected readonly body = new FormControl('', { nonNullable: true, validators: [Validators.required, notBlank, Validators.maxLength(5000)] });
  protected readonly form = new FormGroup({ body: this.body });
  private readonly formDirective = viewChild(FormGroupDirective);
  protected readonly posting = signal(false);
  protected readonly postError = signal<string | null>(null);

  /** Pins of the comments (numbered as listed) and the one being placed. */
  protected readonly pins = computed<PreviewPin[]>(() => {
    const pins: PreviewPin[] = [];
    (this.comments() ?? []).forEach((c, k) => {
      if (c.at) pins.push({ at: c.at, label: String(k + 1) });
    });
    const placing = this.pin();
    if (placing) pins.push({ at: placing, label: '+' });
    return pins;
  });

  constructor() {
    effect(() => {
      const rev = this.revision();
      this.refresh();
      untracked(() => this.load(rev.id));
    });
  }

  private load(id: Id): void {
    this.api.runs(id).subscribe({ next: (r) => this.runs.set(r), error: (err: unknown) => this.fail(err, () => this.runs.set([])) });
    this.api.comments(id).subscribe({ next: (c) => this.comments.set(c), error: (err: unknown) => this.fail(err, () => this.comments.set([])) });
    if (!this.document()) this.api.revision(id).subscribe({ next: (r) => this.document.set(r.document), error: () => undefined });
  }

  private fail(err: unknown, fallback: () => void): void {
    fallback();
    this.error.set(errorMessage(err));
  }

  protected placePin(at: [number, number]): void {
    if (this.mayComment()) this.pin.set(at);
  }

  protected pinText(at: [number, number]): string {
    return `${formatQuantity(at[0], 'length')}, ${formatQuantity(at[1], 'length')}`;
  }

  protected post(): void {
    if (this.body.invalid || this.posting()) {
      this.body.markAsTouched();
      return;
    }
    this.posting.set(true);
    this.postError.set(null);
    this.api.addComment(this.revision().id, this.body.value.trim(), this.pin()).subscribe({
      next: () => {
        this.posting.set(false);
        this.formDirective()?.resetForm({ body: '' }); // also forgets the submit, so no "required" shows
        this.pin.set(null);
        this.api.comments(this.revision().id).subscribe({ next: (c) => this.comments.set(c) });
      },
      error: (err: unknown) => {
        this.posting.set(false);
        this.postError.set(errorMessage(err));
      },
    });
  }
}
