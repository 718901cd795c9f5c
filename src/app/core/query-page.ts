import { signal, type Signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { catchError, of, switchMap, tap, type Observable } from 'rxjs';
import type { Page } from './api-types';
import { errorMessage } from './error-message';

export interface QueryPage<T> {
  page: Signal<Page<T>>;
  /** A request is under way. */
  loading: Signal<boolean>;
  /** Why the last request failed (the page is then empty), or null. */
  error: Signal<string | null>;
}

/**
 * The page of a server-side list that follows a query: asked for again whenever the query changes (an answer
 * still on its way is dropped). `fetch` gives null where there is nothing to ask yet (no workspace): an empty
 * page. Call it in an injection context, e.g. as a component's field.
 */
export function queryPage<Q, T>(query: Signal<Q>, fetch: (q: Q) => Observable<Page<T>> | null): QueryPage<T> {
  const empty = (): Page<T> => ({ items: [], total: 0 });
  const page = signal<Page<T>>(empty());
  const loading = signal(true);
  const error = signal<string | null>(null);
  toObservable(query)
    .pipe(
      tap(() => {
        loading.set(true);
        error.set(null);
      }),
      switchMap((q) => {
        const request = fetch(q);
        return request
          ? request.pipe(
              catchError((err: unknown) => {
                error.set(errorMessage(err));
                return of(empty());
              }),
            )
          : of(empty());
      }),
      takeUntilDestroyed(),
    )
    .subscribe((p) => {
      page.set(p);
      loading.set(false);
    });
  return { page: page.asReadonly(), loading: loading.asReadonly(), error: error.asReadonly() };
}
