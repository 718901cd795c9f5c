import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { notBlank } from '../../core/validators';

export interface SaveRevisionData {
  /** The number the new revision will get, when known. */
  next: number | null;
  /** Why the revision is asked for (e.g. before storing a run). */
  reason?: string;
}

/** Asks for the note of a new revision; closes with the note. */
@Component({
  selector: 'osm-save-revision-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule],
  template: `
    <h2 mat-dialog-title>Save revision{{ data.next ? ' ' + data.next : '' }}</h2>
    <form [formGroup]="form" (ngSubmit)="submit()" novalidate>
      <mat-dialog-content>
        @if (data.reason) {
          <p class="muted">{{ data.reason }}</p>
        }
        <p class="muted">A revision freezes the layout and conditions as they are now. It never changes afterwards; runs and comments attach to it.</p>
        <mat-form-field class="note">
          <mat-label>Note</mat-label>
          <textarea matInput formControlName="note" rows="3" maxlength="2000" required cdkFocusInitial data-testid="revision-note"></textarea>
          <mat-hint>What changed, or why this one matters.</mat-hint>
          <mat-hint align="end">{{ note.value.length }} / 2000</mat-hint>
          @if (note.hasError('required') || note.hasError('blank')) {
            <mat-error>Write a short note.</mat-error>
          }
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button matButton type="button" mat-dialog-close>Cancel</button>
        <button matButton="filled" type="submit" data-testid="revision-save">Save revision</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `.note { width: 100%; } p { margin-top: 0; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SaveRevisionDialog {
  private readonly ref = inject(MatDialogRef<SaveRevisionDialog, string>);
  protected readonly data = inject<SaveRevisionData>(MAT_DIALOG_DATA);
  protected readonly note = new FormControl('', { nonNullable: true, validators: [Validators.required, notBlank, Validators.maxLength(2000)] });
  protected readonly form = new FormGroup({ note: this.note });

  protected submit(): void {
    if (this.note.invalid) {
      this.note.markAsTouched();
      return;
    }
    this.ref.close(this.note.value.trim());
  }
}
