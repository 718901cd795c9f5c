import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Auth } from './auth';

const session = { token: 'tok-1', user: { id: 2, email: 'jonas.lindqvist@example.test', name: 'Jonas Lindqvist' } };

describe('Auth', () => {
  let auth: Auth;
  let http: HttpTestingController;

  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    auth = TestBed.inject(Auth);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('does not ask the server on page load when this browser never signed in', async () => {
    await auth.restore();
    http.expectNone('/api/auth/refresh');
    expect(auth.ready()).toBe(true);
    expect(auth.signedIn()).toBe(false);
  });

  it('resumes the session from the refresh cookie on page load, keeping the token in memory only', async () => {
    localStorage.setItem('osm_session', '1');
    const done = auth.restore();
    const req = http.expectOne('/api/auth/refresh');
    expect(req.request.method).toBe('POST');
    req.flush(session);
    await done;
    expect(auth.user()?.name).toBe('Jonas Lindqvist');
    expect(auth.token()).toBe('tok-1');
    expect(JSON.stringify(localStorage)).not.toContain('tok-1');
  });

  it('ends up signed out when the refresh cookie is no good', async () => {
    localStorage.setItem('osm_session', '1');
    const done = auth.restore();
    http.expectOne('/api/auth/refresh').flush({ error: { code: 'not-signed-in', message: 'ended' } }, { status: 401, statusText: 'Unauthorized' });
    await done;
    expect(auth.ready()).toBe(true);
    expect(auth.signedIn()).toBe(false);
    expect(localStorage.getItem('osm_session')).toBeNull();
  });

  it('signs in, and concurrent refreshes share one request', () => {
    let user = '';
    auth.signIn('jonas.lindqvist@example.test', 'osmolane-demo').subscribe((u) => (user = u.name));
    const req = http.expectOne('/api/auth/sign-in');
    expect(req.request.body).toEqual({ email: 'jonas.lindqvist@example.test', password: 'osmolane-demo' });
    req.flush(session);
    expect(user).toBe('Jonas Lindqvist');

    const tokens: string[] = [];
    auth.refresh().subscribe((t) => tokens.push(t));
    auth.refresh().subscribe((t) => tokens.push(t));
    http.expectOne('/api/auth/refresh').flush({ ...session, token: 'tok-2' });
    expect(tokens).toEqual(['tok-2', 'tok-2']);
    expect(auth.token()).toBe('tok-2');
  });

  it('renews the access token a minute before it expires', () => {
    jest.useFakeTimers();
    try {
      auth.accept({ ...session, expiresIn: 900 });
      jest.advanceTimersByTime(839_000);
      http.expectNone('/api/auth/refresh');
      jest.advanceTimersByTime(2_000);
      http.expectOne('/api/auth/refresh').flush({ ...session, token: 'tok-3', expiresIn: 900 });
      expect(auth.token()).toBe('tok-3');
      auth.clear();
      jest.advanceTimersByTime(900_000);
      http.expectNone('/api/auth/refresh');
    } finally {
      jest.useRealTimers();
    }
  });

  it('signs out on the server with the current token and forgets the session even if the server fails', () => {
    auth.accept(session);
    let done = false;
    auth.signOut().subscribe({ complete: () => (done = true) });
    const req = http.expectOne('/api/auth/sign-out');
    expect(req.request.headers.get('Authorization')).toBe('Bearer tok-1');
    req.flush('down', { status: 502, statusText: 'Bad Gateway' });
    expect(done).toBe(true);
    expect(auth.signedIn()).toBe(false);
    expect(auth.token()).toBeNull();
  });
});
