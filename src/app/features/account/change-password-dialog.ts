import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Api } from '../../core/api';
import { errorMessage, showOnField } from '../../core/error-message';
import { MIN_PASSWORD, sameAs } from '../../core/validators';

/** Change the signed-in user's password (the current one is asked again). */
@Component({
  selector: 'osm-change-password-dialog',
  imports: [MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatProgressBarModule, ReactiveFormsModule],
  templateUrl: './change-password-dialog.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChangePasswordDialog {
  private readonly api = inject(Api);
  private readonly ref = inject(MatDialogRef<ChangePasswordDialog>);
  private readonly snack = inject(MatSnackBar);

  protected readonly minLength = MIN_PASSWORD;
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly form = inject(FormBuilder).nonNullable.group(
    {
      currentPassword: ['', Validators.required],
      newPassword: ['', [Validators.required, Validators.minLength(MIN_PASSWORD)]],
      confirm: ['', Validators.required],
    },
    { validators: sameAs('newPassword', 'confirm') },
  );

  protected submit(): void {
    if (this.form.invalid || this.busy()) {
      this.form.markAllAsTouched();
      return;
    }
    const { currentPassword, newPassword } = this.form.getRawValue();
    this.busy.set(true);
    this.error.set(null);
    this.api.changePassword(currentPassword, newPassword).subscribe({
      next: () => {
        this.snack.open('Password changed.', undefined, { duration: 4000 });
        this.ref.close(true);
      },
      error: (err: unknown) => {
        this.busy.set(false);
        if (!showOnField(this.form, err)) this.error.set(errorMessage(err));
      },
    });
  }
}
