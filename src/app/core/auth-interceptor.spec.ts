import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { Api } from './api';
import { Auth } from './auth';
import { authInterceptor } from './auth-interceptor';

const user = { id: 2, email: 'jonas.lindqvist@example.test', name: 'Jonas Lindqvist' };
const unauthorized = { status: 401, statusText: 'Unauthorized' };

describe('authInterceptor', () => {
  let http: HttpClient;
  let backend: HttpTestingController;
  let auth: Auth;

  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([authInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpClient);
    backend = TestBed.inject(HttpTestingController);
    auth = TestBed.inject(Auth);
  });

  afterEach(() => backend.verify());

  it('adds the bearer token to API requests', () => {
    auth.accept({ token: 'tok-1', user });
    http.get('/api/workspaces').subscribe();
    expect(backend.expectOne('/api/workspaces').request.headers.get('Authorization')).toBe('Bearer tok-1');
  });

  it('sends no token with public requests (sign-in, refresh, invitation look-up)', () => {
    auth.accept({ token: 'tok-1', user });
    TestBed.inject(Api).invitation('abc').subscribe();
    expect(backend.expectOne('/api/invitations/abc').request.headers.has('Authorization')).toBe(false);
  });

  it('refreshes once on 401 and repeats the request with the new token', () => {
    auth.accept({ token: 'old', user });
    let answer: unknown;
    http.get('/api/workspaces').subscribe((r) => (answer = r));
    backend.expectOne('/api/workspaces').flush({ error: { code: 'not-signed-in', message: 'expired' } }, unauthorized);
    backend.expectOne('/api/auth/refresh').flush({ token: 'new', user });
    const retry = backend.expectOne('/api/workspaces');
    expect(retry.request.headers.get('Authorization')).toBe('Bearer new');
    retry.flush([{ id: 1, name: 'Tidewater Assay Lab', role: 'editor' }]);
    expect(answer).toEqual([{ id: 1, name: 'Tidewater Assay Lab', role: 'editor' }]);
  });

  it('goes to sign-in, keeping the way back, when the refresh fails too', () => {
    const router = TestBed.inject(Router);
    const navigate = jest.spyOn(router, 'navigate').mockResolvedValue(true);
    jest.spyOn(router, 'url', 'get').mockReturnValue('/designs/4?tab=fields');
    auth.accept({ token: 'old', user });
    let failed = false;
    http.get('/api/workspaces').subscribe({ error: () => (failed = true) });
    backend.expectOne('/api/workspaces').flush({}, unauthorized);
    backend.expectOne('/api/auth/refresh').flush({}, unauthorized);
    expect(failed).toBe(true);
    expect(auth.signedIn()).toBe(false);
    expect(navigate).toHaveBeenCalledWith(['/sign-in'], { queryParams: { next: '/designs/4?tab=fields', ended: 1 } });
  });

  it('does not refresh a second time when the repeated request is refused again', () => {
    auth.accept({ token: 'old', user });
    let status = 0;
    http.post('/api/auth/password', {}).subscribe({ error: (e: { status: number }) => (status = e.status) });
    backend.expectOne('/api/auth/password').flush({}, unauthorized);
    backend.expectOne('/api/auth/refresh').flush({ token: 'new', user });
    backend.expectOne('/api/auth/password').flush({}, unauthorized);
    backend.expectNone('/api/auth/refresh');
    expect(status).toBe(401);
    expect(auth.signedIn()).toBe(true);
  });

  it('leaves requests without a session alone', () => {
    let status = 0;
    http.get('/api/workspaces').subscribe({ error: (e: { status: number }) => (status = e.status) });
    const req = backend.expectOne('/api/workspaces');
    expect(req.request.headers.has('Authorization')).toBe(false);
    req.flush({}, unauthorized);
    backend.expectNone('/api/auth/refresh');
    expect(status).toBe(401);
  });
});
