import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { Auth } from '../../core/auth';
import { problemOf } from '../../core/error-message';
import { WorkspaceContext } from '../../core/workspace-context';

/** A path inside the app to return to after signing in; anything else (another site, sign-in itself) is dropped. */
export function safeReturnPath(next: string | undefined | null): string | null {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return null;
  if (/^\/(sign-in|forgot-password)(\?|\/|$)/.test(next)) return null;
  return next;
}

@Component({
  selector: 'osm-sign-in',
  imports: [ReactiveFormsModule, RouterLink, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatProgressBarModule],
  templateUrl: './sign-in.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignIn {
  private readonly auth = inject(Auth);
  private readonly router = inject(Router);
  private readonly workspaces = inject(WorkspaceContext);

  /** Where to go afterwards (query parameter). */
  readonly next = input<string>();
  /** Set when the session ended by itself (query parameter). */
  readonly ended = input<string>();
  /** Set after a password reset (query parameter). */
  readonly reset = input<string>();

  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly form = inject(FormBuilder).nonNullable.group({
    email: ['', [Validators.required, Validators.email]],
    password: ['', Validators.required],
  });

  protected submit(): void {
    if (this.form.invalid || this.busy()) {
      this.form.markAllAsTouched();
      return;
    }
    const { email, password } = this.form.getRawValue();
    this.busy.set(true);
    this.error.set(null);
    this.auth.signIn(email.trim(), password).subscribe({
      next: () => {
        this.workspaces.reset();
        void this.router.navigateByUrl(safeReturnPath(this.next()) ?? '/workspaces');
      },
      error: (err: unknown) => {
        this.busy.set(false);
        const problem = problemOf(err);
        this.error.set(problem.status === 401 ? 'The e-mail address or the password is wrong.' : problem.message);
      },
    });
  }
}
