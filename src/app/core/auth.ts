import { Injectable, computed, inject, signal } from '@angular/core';
import { Observable, catchError, finalize, map, of, shareReplay, throwError } from 'rxjs';
import { Api } from './api';
import type { SessionResponse, User } from './api-types';

/**
 * Remembers (in localStorage) only that this browser signed in, never a token: it spares a signed-out visitor
 * a pointless refresh request on page load. The access token itself lives in memory; the refresh token is the
 * server's httpOnly `osm_refresh` cookie.
 */
const SESSION_HINT = 'osm_session';

/** Who is signed in, and the access token the interceptor sends. */
@Injectable({ providedIn: 'root' })
export class Auth {
  private readonly api = inject(Api);

  private accessToken: string | null = null;
  private readonly currentUser = signal<User | null>(null);
  private readonly restored = signal(false);
  private restoring: Promise<void> | null = null;
  private refreshing: Observable<string> | null = null;
  private renewal: ReturnType<typeof setTimeout> | null = null;

  /** The signed-in user, or null. */
  readonly user = this.currentUser.asReadonly();
  readonly signedIn = computed(() => this.currentUser() !== null);
  /** True once the page-load attempt to resume the session has finished. */
  readonly ready = this.restored.asReadonly();

  token(): string | null {
    return this.accessToken;
  }

  /** On page load: resume the session from the refresh cookie (once); resolves when it is known who is signed in. */
  restore(): Promise<void> {
    this.restoring ??= new Promise<void>((resolve) => {
      if (!hasHint()) {
        this.restored.set(true);
        resolve();
        return;
      }
      this.refresh()
        .pipe(finalize(() => this.restored.set(true)))
        .subscribe({ next: () => resolve(), error: () => resolve() });
    });
    return this.restoring;
  }

  signIn(email: string, password: string): Observable<User> {
    return this.api.signIn(email, password).pipe(map((session) => this.accept(session)));
  }

  /** Takes a session answered by the server (sign-in, refresh, invitation accept). */
  accept(session: SessionResponse): User {
    this.accessToken = session.token;
    this.currentUser.set(session.user);
    this.restored.set(true);
    this.restoring ??= Promise.resolve(); // nothing left to resume on this page
    setHint(true);
    this.scheduleRenewal(session.expiresIn);
    return session.user;
  }

  /**
   * Renews the access token a minute before it expires, so that requests rarely meet a 401 (the interceptor
   * still refreshes on one). Without `expiresIn` from the server it relies on the interceptor alone.
   */
  private scheduleRenewal(expiresIn: number | undefined): void {
    if (this.renewal !== null) clearTimeout(this.renewal);
    this.renewal = null;
    if (!expiresIn || expiresIn <= 90) return;
    this.renewal = setTimeout(() => {
      this.renewal = null;
      this.refresh().subscribe({ error: () => undefined });
    }, (expiresIn - 60) * 1000);
  }

  /** A new access token from the refresh cookie; concurrent callers share one request. Clears the session on failure. */
  refresh(): Observable<string> {
    this.refreshing ??= this.api.refresh().pipe(
      map((session) => {
        this.accept(session);
        return session.token;
      }),
      catchError((err: unknown) => {
        this.clear();
        return throwError(() => err);
      }),
      finalize(() => (this.refreshing = null)),
      shareReplay({ bufferSize: 1, refCount: false }),
    );
    return this.refreshing;
  }

  /** Ends the session on the server (refresh cookie and outstanding tokens), then forgets it here whatever the answer. */
  signOut(): Observable<void> {
    const token = this.accessToken;
    return this.api.signOut(token).pipe(
      catchError(() => of(undefined)),
      map(() => undefined),
      finalize(() => this.clear()),
    );
  }

  /** Forgets the session in this page. */
  clear(): void {
    if (this.renewal !== null) clearTimeout(this.renewal);
    this.renewal = null;
    this.accessToken = null;
    this.currentUser.set(null);
    setHint(false);
  }
}

function hasHint(): boolean {
  try {
    return localStorage.getItem(SESSION_HINT) === '1';
  } catch {
    return true;
  }
}

function setHint(on: boolean): void {
  try {
    if (on) localStorage.setItem(SESSION_HINT, '1');
    else localStorage.removeItem(SESSION_HINT);
  } catch {
    // storage unavailable (private mode): the app still works, it just asks the server on every load
  }
}
