import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators, type ValidatorFn } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Api } from '../../core/api';
import type { LibraryItem, LibraryItemRequest, LibraryKind } from '../../core/api-types';
import { errorMessage, problemOf } from '../../core/error-message';
import { notBlank } from '../../core/validators';
import { describeDimension } from '../../ui/units';
import { LIBRARY_FIELDS, fieldValidators, fieldValue, shownValue, valueOf, type LibraryField } from './library-fields';

export interface LibraryItemData {
  workspaceId: number | string;
  kind: LibraryKind;
  /** Absent for a new item. */
  item?: LibraryItem;
}

/** A wall needs at least one zeta potential or mobility. */
const someValue: ValidatorFn = (group) => {
  const values = Object.values((group as FormGroup).controls).map((c) => (typeof c.value === 'string' ? c.value.trim() : ''));
  return values.some((v) => v !== '') ? null : { noValue: true };
};

/** Add or edit a buffer or wall material of the workspace; quantities typed with their units. */
@Component({
  selector: 'osm-library-item-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatProgressBarModule],
  templateUrl: './library-item-dialog.html',
  styleUrl: './library-item-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LibraryItemDialog {
  private readonly api = inject(Api);
  private readonly ref = inject(MatDialogRef<LibraryItemDialog, LibraryItem>);
  protected readonly data = inject<LibraryItemData>(MAT_DIALOG_DATA);

  protected readonly fields: LibraryField[] = LIBRARY_FIELDS[this.data.kind];
  protected readonly describe = describeDimension;
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);

  protected readonly values = new FormGroup(
    Object.fromEntries(
      this.fields.map((f) => [
        f.key,
        new FormControl(this.data.item ? shownValue(this.data.kind, this.data.item, f.key) : '', { nonNullable: true, validators: fieldValidators(f) }),
      ]),
    ),
    this.data.kind === 'wall' ? { validators: someValue } : {},
  );

  protected readonly form = new FormGroup({
    name: new FormControl(this.data.item?.name ?? '', { nonNullable: true, validators: [Validators.required, notBlank, Validators.maxLength(200)] }),
    values: this.values,
    note: new FormControl(this.initialNote(), { nonNullable: true, validators: [Validators.maxLength(1000)] }),
    source: new FormControl(this.data.item?.source ?? '', { nonNullable: true, validators: [Validators.maxLength(1000)] }),
  });

  private initialNote(): string {
    const note = this.data.item ? valueOf(this.data.item, 'note') : '';
    return typeof note === 'string' ? note : '';
  }

  protected control(key: string): FormControl<string> {
    return this.values.controls[key] as FormControl<string>;
  }

  protected submit(): void {
    if (this.form.invalid || this.busy()) {
      this.form.markAllAsTouched();
      return;
    }
    // Keep values this form does not know about (written by another client) as they were.
    const values: Record<string, unknown> = { ...(this.data.item?.values ?? {}) };
    for (const f of this.fields) {
      const v = fieldValue(f, this.control(f.key).value);
      if (v === null) delete values[f.key];
      else values[f.key] = v;
    }
    const raw = this.form.getRawValue();
    if (this.data.kind === 'wall') {
      if (raw.note.trim()) values['note'] = raw.note.trim();
      else delete values['note'];
    }
    const body: LibraryItemRequest = {
      kind: this.data.kind,
      name: raw.name.trim(),
      values: values as LibraryItemRequest['values'],
      ...(raw.source.trim() ? { source: raw.source.trim() } : {}),
    };
    this.busy.set(true);
    this.error.set(null);
    const request = this.data.item ? this.api.updateLibraryItem(this.data.item.id, body) : this.api.addLibraryItem(this.data.workspaceId, body);
    request.subscribe({
      next: (item) => this.ref.close(item),
      error: (err: unknown) => {
        this.busy.set(false);
        const problem = problemOf(err);
        const key = problem.field?.replace(/^values\./, '');
        const control = key ? (this.values.get(key) ?? this.form.get(key)) : null;
        if (control) {
          control.setErrors({ server: problem.message });
          control.markAsTouched();
        } else {
          this.error.set(errorMessage(err));
        }
      },
    });
  }
}
