import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { Api } from '../../core/api';
import { Auth } from '../../core/auth';
import { problemOf } from '../../core/error-message';
import { MIN_PASSWORD, sameAs } from '../../core/validators';

/** `/reset?token=…` from the reset mail: choose a new password. */
@Component({
  selector: 'osm-reset-password',
  imports: [ReactiveFormsModule, RouterLink, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatProgressBarModule],
  templateUrl: './reset-password.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResetPassword {
  private readonly api = inject(Api);
  private readonly auth = inject(Auth);
  private readonly router = inject(Router);

  readonly token = input<string>();

  protected readonly minLength = MIN_PASSWORD;
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly form = inject(FormBuilder).nonNullable.group(
    {
      newPassword: ['', [Validators.required, Validators.minLength(MIN_PASSWORD)]],
      confirm: ['', Validators.required],
    },
    { validators: sameAs('newPassword', 'confirm') },
  );

  protected submit(): void {
    const token = this.token();
    if (!token || this.form.invalid || this.busy()) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.error.set(null);
    this.api.resetPassword(token, this.form.getRawValue().newPassword).subscribe({
      next: () => {
        // Whoever was signed in here, the next step is a fresh sign-in with the new password.
        this.auth.clear();
        void this.router.navigate(['/sign-in'], { queryParams: { reset: 1 } });
      },
      error: (err: unknown) => {
        this.busy.set(false);
        const problem = problemOf(err);
        this.error.set(
          problem.status === 400 && problem.field !== 'newPassword'
            ? 'This link has expired or was already used. Ask for a new one.'
            : problem.message,
        );
      },
    });
  }
}
