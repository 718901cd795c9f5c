import { Component, inject, signal } from '@angular/core';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { ImportReport } from '../../../../shared/api';
import { Api } from '../../core/api';
import type { Id } from '../../core/api-types';
import { errorMessage } from '../../core/error-message';

export interface ImportOutlineData {
  workspaceId: Id;
}

/** Scale as typed: empty (from the file) or metres per drawing unit, e.g. 1e-6 or 0.001. */
function scaleValue(text: string | null): number | undefined {
  const t = (text ?? '').trim();
  return t === '' ? undefined : Number(t);
}

/**
 * Import outline: choose an SVG or DXF, optionally type the scale, preview what the server found and what it
 * skipped (with where), then create the design. Nothing is stored until "Create design".
 */
@Component({
  selector: 'osm-import-outline-dialog',
  imports: [MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatIconModule, MatProgressBarModule, ReactiveFormsModule],
  templateUrl: './import-outline-dialog.html',
  styleUrl: './import-outline-dialog.scss',
})
export class ImportOutlineDialog {
  private readonly api = inject(Api);
  private readonly ref = inject<MatDialogRef<ImportOutlineDialog, { id: number }>>(MatDialogRef);
  private readonly data = inject<ImportOutlineData>(MAT_DIALOG_DATA);

  protected readonly file = signal<File | null>(null);
  protected readonly report = signal<ImportReport | null>(null);
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly scale = new FormControl('', { validators: [Validators.pattern(/^\s*(\d+\.?\d*|\.\d+)(e[-+]?\d+)?\s*$/i)] });
  protected readonly name = new FormControl('', { nonNullable: true, validators: [Validators.maxLength(200)] });

  protected pick(event: Event): void {
    const input = event.target as HTMLInputElement;
    const f = input.files?.[0] ?? null;
    this.file.set(f);
    this.report.set(null);
    this.error.set(null);
    if (f && !this.name.value) this.name.setValue(f.name.replace(/\.[^.]*$/, ''));
    if (f) this.preview();
  }

  protected preview(): void {
    const f = this.file();
    if (!f || this.scale.invalid) return;
    this.busy.set(true);
    this.error.set(null);
    this.api.previewImport(this.data.workspaceId, f, scaleValue(this.scale.value)).subscribe({
      next: (r) => {
        this.report.set(r.report);
        this.busy.set(false);
      },
      error: (e: unknown) => {
        this.report.set(null);
        this.error.set(errorMessage(e));
        this.busy.set(false);
      },
    });
  }

  protected create(): void {
    const f = this.file();
    if (!f || !this.report()) return;
    this.busy.set(true);
    this.api.importDesign(this.data.workspaceId, f, scaleValue(this.scale.value), this.name.value.trim() || undefined).subscribe({
      next: (r) => this.ref.close(r.design),
      error: (e: unknown) => {
        this.error.set(errorMessage(e));
        this.busy.set(false);
      },
    });
  }

  protected um(v: number): string {
    return `${Number((v * 1e6).toPrecision(4))}`;
  }

  protected size(r: ImportReport): string {
    const [x0, y0, x1, y1] = r.bounds;
    const mm = (v: number) => Number((v * 1e3).toPrecision(4));
    return `${mm(x1 - x0)} mm × ${mm(y1 - y0)} mm`;
  }
}
