import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { Api } from '../../core/api';
import type { InvitationPreview, SessionResponse } from '../../core/api-types';
import { Auth } from '../../core/auth';
import { problemOf, showOnField } from '../../core/error-message';
import { ROLE_HINTS, ROLE_LABELS } from '../../core/roles';
import { MIN_PASSWORD, notBlank, sameAs } from '../../core/validators';
import { WorkspaceContext } from '../../core/workspace-context';

/**
 * `/invite?token=…` from the invitation mail: creates the account, or joins with an existing one, then opens the
 * workspace.
 */
@Component({
  selector: 'osm-accept-invitation',
  imports: [ReactiveFormsModule, RouterLink, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatProgressBarModule],
  templateUrl: './accept-invitation.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AcceptInvitation {
  private readonly api = inject(Api);
  private readonly router = inject(Router);
  private readonly workspaces = inject(WorkspaceContext);
  protected readonly auth = inject(Auth);

  readonly token = input<string>();

  protected readonly minLength = MIN_PASSWORD;
  protected readonly roleLabels = ROLE_LABELS;
  protected readonly roleHints = ROLE_HINTS;
  protected readonly info = signal<InvitationPreview | null>(null);
  protected readonly loadError = signal<string | null>(null);
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);

  /** How this person joins: as the signed-in user, with an existing account's password, or with a new account. */
  protected readonly mode = computed<'loading' | 'invalid' | 'signed-in' | 'other-user' | 'existing' | 'new'>(() => {
    const info = this.info();
    if (this.loadError()) return 'invalid';
    if (!info || !this.auth.ready()) return 'loading';
    const user = this.auth.user();
    if (user) return user.email.toLowerCase() === info.email.toLowerCase() ? 'signed-in' : 'other-user';
    return info.accountExists ? 'existing' : 'new';
  });

  private readonly fb = inject(FormBuilder).nonNullable;
  protected readonly newAccount = this.fb.group(
    {
      name: ['', [Validators.required, notBlank, Validators.maxLength(200)]],
      password: ['', [Validators.required, Validators.minLength(MIN_PASSWORD)]],
      confirm: ['', Validators.required],
    },
    { validators: sameAs('password', 'confirm') },
  );
  protected readonly existing = this.fb.group({ password: ['', Validators.required] });

  constructor() {
    void this.auth.restore();
    effect(() => {
      const token = this.token();
      untracked(() => this.load(token));
    });
  }

  private load(token: string | undefined): void {
    this.info.set(null);
    this.loadError.set(null);
    if (!token) {
      this.loadError.set('This page needs the link from the invitation mail.');
      return;
    }
    this.api.invitation(token).subscribe({
      next: (info) => this.info.set(info),
      error: (err: unknown) => {
        const problem = problemOf(err);
        this.loadError.set(
          problem.status === 404 || problem.status === 400 || problem.status === 410
            ? 'This invitation is not valid any more: it has expired, was used already, or was withdrawn. Ask the workspace owner for a new one.'
            : problem.message,
        );
      },
    });
  }

  protected createAccount(): void {
    if (this.newAccount.invalid) {
      this.newAccount.markAllAsTouched();
      return;
    }
    const { name, password } = this.newAccount.getRawValue();
    this.accept({ name: name.trim(), password }, this.newAccount);
  }

  protected joinWithPassword(): void {
    if (this.existing.invalid) {
      this.existing.markAllAsTouched();
      return;
    }
    this.accept({ password: this.existing.getRawValue().password }, this.existing);
  }

  protected joinSignedIn(): void {
    this.accept({}, null);
  }

  protected signOutFirst(): void {
    this.auth.signOut().subscribe({ complete: () => this.workspaces.reset() });
  }

  private accept(body: { name?: string; password?: string }, form: typeof this.newAccount | typeof this.existing | null): void {
    const token = this.token();
    if (!token || this.busy()) return;
    this.busy.set(true);
    this.error.set(null);
    this.api.acceptInvitation(token, body).subscribe({
      next: (session) => this.enter(session),
      error: (err: unknown) => {
        this.busy.set(false);
        const problem = problemOf(err);
        if (form && showOnField(form, err)) return;
        this.error.set(problem.status === 401 ? 'The password is wrong.' : problem.message);
      },
    });
  }

  /** Signed in as the new member: open the workspace just joined. */
  private enter(session: SessionResponse): void {
    this.auth.accept(session);
    this.workspaces.reset();
    const name = this.info()?.workspaceName;
    this.workspaces.load(true).subscribe({
      next: (list) => {
        const joined = list.find((w) => w.name === name);
        void this.router.navigate(joined ? ['/workspaces', String(joined.id), 'designs'] : ['/workspaces']);
      },
      error: () => void this.router.navigate(['/workspaces']),
    });
  }
}
