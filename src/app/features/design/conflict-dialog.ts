import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import type { Design } from '../../core/api-types';

export interface ConflictData {
  /** The design as the server has it now (someone else's save). */
  theirs: Design;
  /** May the person overwrite the design and create copies (editor, owner)? */
  mayWrite: boolean;
}

/** How to resolve a conflict: nothing is decided for the person. */
export type ConflictChoice = 'overwrite' | 'theirs' | 'copy';

/**
 * Shown when autosave finds that someone else saved the design first (409). Nothing was written; the person
 * chooses: overwrite with mine, take theirs, or keep mine as a new design.
 */
@Component({
  selector: 'osm-conflict-dialog',
  imports: [DatePipe, MatDialogModule, MatButtonModule, MatIconModule],
  template: `
    <h2 mat-dialog-title><mat-icon class="warn" aria-hidden="true">sync_problem</mat-icon>Someone saved this design first</h2>
    <mat-dialog-content>
      <p>
        <strong>{{ data.theirs.updatedBy?.name ?? 'Someone' }}</strong> saved
        <strong>{{ data.theirs.name }}</strong>
        @if (data.theirs.updatedAt) {
          at {{ data.theirs.updatedAt | date: 'HH:mm:ss' }}
        }
        while you were editing. Your latest changes are not saved yet, and nothing was overwritten.
      </p>
      <dl class="choices">
        <dt>Overwrite with mine</dt>
        <dd>Their changes are replaced by yours (they stay in any revision they saved).</dd>
        <dt>Take theirs</dt>
        <dd>Your unsaved changes are dropped and their version opens here.</dd>
        <dt>Save mine as a copy</dt>
        <dd>Yours becomes a new design beside this one; this one keeps their version.</dd>
      </dl>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button matButton type="button" [mat-dialog-close]="'theirs'" data-testid="conflict-theirs">Take theirs</button>
      @if (data.mayWrite) {
        <button matButton type="button" [mat-dialog-close]="'copy'" data-testid="conflict-copy">Save mine as a copy</button>
        <button matButton="filled" type="button" [mat-dialog-close]="'overwrite'" data-testid="conflict-overwrite">Overwrite with mine</button>
      }
    </mat-dialog-actions>
  `,
  styles: `
    h2 { display: flex; align-items: center; gap: 8px; }
    .warn { color: var(--mat-sys-tertiary); }
    .choices { margin: 0; display: grid; grid-template-columns: max-content 1fr; gap: 6px 16px; }
    dt { font-weight: 600; }
    dd { margin: 0; color: var(--mat-sys-on-surface-variant); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ConflictDialog {
  protected readonly data = inject<ConflictData>(MAT_DIALOG_DATA);
}
