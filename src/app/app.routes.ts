import { inject } from '@angular/core';
import { Router, type CanActivateFn, type Routes } from '@angular/router';
import { Auth } from './core/auth';
import { leaveCheckGuard, signedInGuard, signedOutGuard, workspaceGuard } from './core/guards';

/** "/": signed in → the workspaces; signed out → sign-in. */
const startGuard: CanActivateFn = async () => {
  const auth = inject(Auth);
  const router = inject(Router);
  await auth.restore();
  return router.createUrlTree([auth.signedIn() ? '/workspaces' : '/sign-in']);
};

export const routes: Routes = [
  { path: '', pathMatch: 'full', canActivate: [startGuard], children: [] },

  // Signed out
  { path: 'sign-in', canActivate: [signedOutGuard], loadComponent: () => import('./features/sign-in/sign-in').then((m) => m.SignIn), title: 'Sign in · Osmolane' },
  {
    path: 'forgot-password',
    canActivate: [signedOutGuard],
    loadComponent: () => import('./features/sign-in/forgot-password').then((m) => m.ForgotPassword),
    title: 'Reset password · Osmolane',
  },
  // From mails: open whether or not someone is signed in here.
  { path: 'reset', loadComponent: () => import('./features/sign-in/reset-password').then((m) => m.ResetPassword), title: 'New password · Osmolane' },
  { path: 'invite', loadComponent: () => import('./features/sign-in/accept-invitation').then((m) => m.AcceptInvitation), title: 'Join a workspace · Osmolane' },

  // Signed in
  {
    path: '',
    canActivate: [signedInGuard],
    children: [
      { path: 'workspaces', loadComponent: () => import('./features/workspaces/workspace-list').then((m) => m.WorkspaceList), title: 'Workspaces · Osmolane' },
      {
        path: 'workspaces/:wid',
        canActivate: [workspaceGuard],
        children: [
          { path: '', pathMatch: 'full', redirectTo: 'designs' },
          { path: 'designs', loadComponent: () => import('./features/designs/design-list').then((m) => m.DesignList), title: 'Designs · Osmolane' },
          { path: 'library', loadComponent: () => import('./features/library/library-page').then((m) => m.LibraryPage), title: 'Library · Osmolane' },
          { path: 'members', loadComponent: () => import('./features/members/member-list').then((m) => m.MemberList), title: 'Members · Osmolane' },
          { path: 'activity', loadComponent: () => import('./features/activity/activity-log').then((m) => m.ActivityLog), title: 'Activity · Osmolane' },
        ],
      },
      {
        path: 'designs/:id',
        loadComponent: () => import('./features/design/design-page').then((m) => m.DesignPage),
        canDeactivate: [leaveCheckGuard],
        title: 'Design · Osmolane',
      },
    ],
  },
  // The development mailbox (the server answers 404 in production): open signed out too, for reset mails.
  { path: 'mailbox', loadComponent: () => import('./features/mailbox/mailbox').then((m) => m.Mailbox), title: 'Mailbox · Osmolane' },
  { path: 'mailbox/:id', loadComponent: () => import('./features/mailbox/mail-view').then((m) => m.MailView), title: 'Mail · Osmolane' },
  { path: '**', redirectTo: '' },
];
