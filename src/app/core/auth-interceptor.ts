import { HttpErrorResponse, type HttpHandlerFn, type HttpInterceptorFn, type HttpRequest } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, switchMap, throwError } from 'rxjs';
import { AUTH_MODE } from './api';
import { Auth } from './auth';

function withToken(req: HttpRequest<unknown>, token: string): HttpRequest<unknown> {
  return req.clone({ setHeaders: { Authorization: `Bearer ${token}` } });
}

/**
 * Adds the bearer token to API requests. When a request that carried a token answers 401, the access token
 * has expired: it refreshes once (from the refresh cookie) and repeats the request. When the refresh fails
 * the session has ended, and the page goes to sign-in with the way back kept.
 */
export const authInterceptor: HttpInterceptorFn = (req: HttpRequest<unknown>, next: HttpHandlerFn) => {
  if (req.context.get(AUTH_MODE) === 'public' || !req.url.startsWith('/api/')) return next(req);
  const auth = inject(Auth);
  const router = inject(Router);
  const token = auth.token();
  if (!token) return next(req);
  return next(withToken(req, token)).pipe(
    catchError((err: unknown) => {
      if (!(err instanceof HttpErrorResponse) || err.status !== 401) return throwError(() => err);
      // Someone else may have refreshed meanwhile: then just repeat with the newer token.
      const newer = auth.token();
      const fresh = newer && newer !== token ? [newer] : null;
      const retry$ = fresh
        ? next(withToken(req, fresh[0]))
        : auth.refresh().pipe(
            catchError((refreshErr: unknown) => {
              const here = router.url;
              const back = here && here !== '/' && !here.startsWith('/sign-in') ? { next: here } : {};
              void router.navigate(['/sign-in'], { queryParams: { ...back, ended: 1 } });
              return throwError(() => refreshErr);
            }),
            switchMap((t) => next(withToken(req, t))),
          );
      return retry$;
    }),
  );
};
