import { inject } from '@angular/core';
import { Router, type CanActivateFn, type CanDeactivateFn } from '@angular/router';
import { catchError, map, of } from 'rxjs';
import { Auth } from './auth';
import { WorkspaceContext } from './workspace-context';

/** Only for signed-in users; others go to sign-in and come back here afterwards. (Inject before any await.) */
export const signedInGuard: CanActivateFn = async (_route, state) => {
  const auth = inject(Auth);
  const router = inject(Router);
  await auth.restore();
  return auth.signedIn() ? true : router.createUrlTree(['/sign-in'], { queryParams: { next: state.url } });
};

/** Sign-in and password reset pages: a signed-in user goes to the workspaces instead. */
export const signedOutGuard: CanActivateFn = async () => {
  const auth = inject(Auth);
  const router = inject(Router);
  await auth.restore();
  return auth.signedIn() ? router.createUrlTree(['/workspaces']) : true;
};

/** Pages of one workspace (`:wid`): makes it the current workspace, or goes back to the list when it is not mine. */
export const workspaceGuard: CanActivateFn = (route) => {
  const ctx = inject(WorkspaceContext);
  const router = inject(Router);
  const wid = route.paramMap.get('wid') ?? '';
  return ctx.load().pipe(
    map((list) => {
      if (!list.some((w) => String(w.id) === wid)) return router.createUrlTree(['/workspaces'], { queryParams: { missing: wid } });
      ctx.select(wid);
      return true;
    }),
    catchError(() => of(router.createUrlTree(['/workspaces']))),
  );
};

/** A page with work that may not be stored yet. */
export interface LeaveCheck {
  /** Resolves true when it is fine to leave (saved, or the person chose to leave anyway). */
  mayLeave(): Promise<boolean> | boolean;
}

export const leaveCheckGuard: CanDeactivateFn<LeaveCheck> = (component) => component.mayLeave();
