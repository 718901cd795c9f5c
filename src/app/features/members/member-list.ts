import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, signal, untracked, viewChild } from '@angular/core';
import { FormBuilder, FormGroupDirective, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { Router, RouterLink } from '@angular/router';
import { ROLES } from '../../../../shared/api';
import { Api } from '../../core/api';
import type { Invitation, Member, Role } from '../../core/api-types';
import { Auth } from '../../core/auth';
import { errorMessage, showOnField } from '../../core/error-message';
import { ROLE_HINTS, ROLE_LABELS, roleHint, roleLabel, isOwner } from '../../core/roles';
import { WorkspaceContext } from '../../core/workspace-context';
import { ConfirmDialog, type ConfirmData } from '../../ui/confirm-dialog';

/** Members of the workspace; owners invite by e-mail, change roles and remove people. */
@Component({
  selector: 'osm-member-list',
  imports: [
    DatePipe,
    ReactiveFormsModule,
    RouterLink,
    MatTableModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    MatTooltipModule,
  ],
  templateUrl: './member-list.html',
  styleUrl: './member-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MemberList {
  private readonly api = inject(Api);
  private readonly dialog = inject(MatDialog);
  private readonly snack = inject(MatSnackBar);
  private readonly auth = inject(Auth);
  private readonly router = inject(Router);
  protected readonly context = inject(WorkspaceContext);

  protected readonly roles = ROLES;
  protected readonly roleLabels = ROLE_LABELS;
  protected readonly roleHints = ROLE_HINTS;
  protected readonly roleLabel = roleLabel;
  protected readonly roleHint = roleHint;
  protected readonly owner = computed(() => isOwner(this.context.role()));
  protected readonly memberColumns = ['name', 'email', 'role', 'actions'];
  protected readonly inviteColumns = ['email', 'role', 'createdAt', 'expiresAt', 'actions'];

  protected readonly members = signal<Member[]>([]);
  protected readonly invitations = signal<Invitation[]>([]);
  protected readonly pending = computed(() => this.invitations().filter((i) => !i.acceptedAt));
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);
  protected readonly inviting = signal(false);
  protected readonly inviteError = signal<string | null>(null);
  protected readonly myId = computed(() => String(this.auth.user()?.id ?? ''));

  private readonly inviteDirective = viewChild(FormGroupDirective);
  protected readonly inviteForm = inject(FormBuilder).nonNullable.group({
    email: ['', [Validators.required, Validators.email]],
    role: ['editor' as Role, Validators.required],
  });

  constructor() {
    effect(() => {
      const ws = this.context.current();
      if (ws) untracked(() => this.load());
    });
  }

  private wid(): string | number {
    return this.context.current()!.id;
  }

  protected load(): void {
    this.loading.set(true);
    this.error.set(null);
    this.api.members(this.wid()).subscribe({
      next: (list) => {
        this.members.set(list);
        this.loading.set(false);
      },
      error: (err: unknown) => {
        this.loading.set(false);
        this.error.set(errorMessage(err));
      },
    });
    if (this.owner()) {
      this.api.invitations(this.wid()).subscribe({
        next: (list) => this.invitations.set(list),
        error: () => this.invitations.set([]),
      });
    }
  }

  protected invite(): void {
    if (this.inviteForm.invalid || this.inviting()) {
      this.inviteForm.markAllAsTouched();
      return;
    }
    const { email, role } = this.inviteForm.getRawValue();
    this.inviting.set(true);
    this.inviteError.set(null);
    this.api.invite(this.wid(), email.trim(), role).subscribe({
      next: () => {
        this.inviting.set(false);
        // resetForm also forgets that the form was submitted, so no "required" message shows on the empty field.
        this.inviteDirective()?.resetForm({ email: '', role });
        this.snack.open(`Invitation sent to ${email.trim()}.`, undefined, { duration: 4000 });
        this.load();
      },
      error: (err: unknown) => {
        this.inviting.set(false);
        if (!showOnField(this.inviteForm, err)) this.inviteError.set(errorMessage(err));
      },
    });
  }

  protected changeRole(member: Member, role: Role): void {
    if (role === member.role) return;
    this.api.changeRole(this.wid(), member.userId, role).subscribe({
      next: () => {
        this.snack.open(`${member.name} is now ${ROLE_LABELS[role].toLowerCase()}.`, undefined, { duration: 3000 });
        this.load();
        if (String(member.userId) === this.myId()) this.context.load(true).subscribe();
      },
      error: (err: unknown) => {
        this.snack.open(errorMessage(err), 'Close', { duration: 8000 });
        this.load(); // put the select back to what the server has
      },
    });
  }

  protected withdraw(invitation: Invitation): void {
    this.api.revokeInvitation(this.wid(), invitation.id).subscribe({
      next: () => {
        this.snack.open(`Invitation of ${invitation.email} withdrawn; its link no longer works.`, undefined, { duration: 4000 });
        this.load();
      },
      error: (err: unknown) => this.snack.open(errorMessage(err), 'Close', { duration: 8000 }),
    });
  }

  /** Owners remove anyone; everyone may leave. */
  protected mayRemove(member: Member): boolean {
    return this.owner() || String(member.userId) === this.myId();
  }

  protected remove(member: Member): void {
    const self = String(member.userId) === this.myId();
    this.dialog
      .open<ConfirmDialog, ConfirmData, boolean>(ConfirmDialog, {
        data: {
          title: self ? 'Leave this workspace?' : `Remove ${member.name}?`,
          message: self
            ? 'You lose access to its designs, runs and history.'
            : `${member.name} (${member.email}) loses access to this workspace. Their revisions, runs and comments stay.`,
          confirm: self ? 'Leave' : 'Remove',
        },
      })
      .afterClosed()
      .subscribe((ok) => {
        if (!ok) return;
        this.api.removeMember(this.wid(), member.userId).subscribe({
          next: () => {
            if (self) {
              this.snack.open('You left the workspace.', undefined, { duration: 4000 });
              this.context.reset();
              void this.router.navigate(['/workspaces']);
              return;
            }
            this.snack.open(`${member.name} was removed.`, undefined, { duration: 3000 });
            this.load();
          },
          error: (err: unknown) => this.snack.open(errorMessage(err), 'Close', { duration: 8000 }),
        });
      });
  }
}
