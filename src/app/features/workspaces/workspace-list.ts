import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import type { Workspace } from '../../core/api-types';
import { Api } from '../../core/api';
import { errorMessage, showOnField } from '../../core/error-message';
import { ROLE_HINTS, ROLE_LABELS, roleHint, roleLabel } from '../../core/roles';
import { notBlank } from '../../core/validators';
import { WorkspaceContext } from '../../core/workspace-context';

/** My workspaces, and a new one. */
@Component({
  selector: 'osm-workspace-list',
  imports: [ReactiveFormsModule, RouterLink, MatTableModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './workspace-list.html',
  styleUrl: './workspace-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WorkspaceList {
  private readonly api = inject(Api);
  private readonly router = inject(Router);
  protected readonly context = inject(WorkspaceContext);

  /** Set by the workspace guard when a link pointed at a workspace that is not mine (query parameter). */
  readonly missing = input<string>();

  protected readonly columns = ['name', 'role', 'open'];
  protected readonly roleLabels = ROLE_LABELS;
  protected readonly roleHints = ROLE_HINTS;
  protected readonly roleLabel = roleLabel;
  protected readonly roleHint = roleHint;
  protected readonly loading = signal(true);
  protected readonly loadError = signal<string | null>(null);
  protected readonly busy = signal(false);
  protected readonly createError = signal<string | null>(null);
  protected readonly form = inject(FormBuilder).nonNullable.group({
    name: ['', [Validators.required, notBlank, Validators.maxLength(120)]],
  });

  constructor() {
    this.context.load(true).subscribe({
      next: () => this.loading.set(false),
      error: (err: unknown) => {
        this.loading.set(false);
        this.loadError.set(errorMessage(err));
      },
    });
  }

  protected open(ws: Workspace): void {
    this.context.select(ws.id);
    void this.router.navigate(['/workspaces', String(ws.id), 'designs']);
  }

  protected create(): void {
    if (this.form.invalid || this.busy()) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.createError.set(null);
    this.api.createWorkspace(this.form.getRawValue().name.trim()).subscribe({
      next: (ws) => {
        this.busy.set(false);
        this.context.add(ws);
        this.open(ws);
      },
      error: (err: unknown) => {
        this.busy.set(false);
        if (!showOnField(this.form, err)) this.createError.set(errorMessage(err));
      },
    });
  }
}
