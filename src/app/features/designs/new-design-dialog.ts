import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import { Api } from '../../core/api';
import type { Design } from '../../core/api-types';
import { errorMessage, showOnField } from '../../core/error-message';
import { notBlank } from '../../core/validators';
import { LayoutPreview } from '../../ui/layout-preview';
import { DESIGN_TEMPLATES, documentFrom, type DesignTemplate } from './templates';

export interface NewDesignData {
  workspaceId: number | string;
}

/** Name a new design and start it blank or from a template; answers the created design. */
@Component({
  selector: 'osm-new-design-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatRadioModule, MatProgressBarModule, LayoutPreview],
  templateUrl: './new-design-dialog.html',
  styleUrl: './new-design-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NewDesignDialog {
  private readonly api = inject(Api);
  private readonly ref = inject(MatDialogRef<NewDesignDialog, Design>);
  private readonly data = inject<NewDesignData>(MAT_DIALOG_DATA);

  protected readonly templates = DESIGN_TEMPLATES;
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly form = inject(FormBuilder).nonNullable.group({
    name: ['', [Validators.required, notBlank, Validators.maxLength(200)]],
    template: ['blank' as DesignTemplate['id'], Validators.required],
  });

  protected submit(): void {
    if (this.form.invalid || this.busy()) {
      this.form.markAllAsTouched();
      return;
    }
    const { name, template } = this.form.getRawValue();
    const chosen = this.templates.find((t) => t.id === template) ?? this.templates[0];
    const clean = name.trim();
    this.busy.set(true);
    this.error.set(null);
    this.api.createDesign(this.data.workspaceId, clean, documentFrom(chosen, clean)).subscribe({
      next: (design) => this.ref.close(design),
      error: (err: unknown) => {
        this.busy.set(false);
        if (!showOnField(this.form, err)) this.error.set(errorMessage(err));
      },
    });
  }
}
