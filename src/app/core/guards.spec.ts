import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, UrlTree, provideRouter, type ActivatedRouteSnapshot, type RouterStateSnapshot } from '@angular/router';
import { firstValueFrom, isObservable, type Observable } from 'rxjs';
import { Auth } from './auth';
import { signedInGuard, signedOutGuard, workspaceGuard } from './guards';
import { WorkspaceContext } from './workspace-context';

const user = { id: 2, email: 'jonas.lindqvist@example.test', name: 'Jonas Lindqvist' };
const state = (url: string) => ({ url }) as RouterStateSnapshot;
const route = (wid: string) => ({ paramMap: new Map([['wid', wid]]) }) as unknown as ActivatedRouteSnapshot;

async function run(guard: () => unknown): Promise<unknown> {
  const result = TestBed.runInInjectionContext(guard);
  const settled = await result;
  return isObservable(settled) ? firstValueFrom(settled as Observable<unknown>) : settled;
}

describe('route guards', () => {
  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
  });

  it('sends a signed-out visitor to sign-in with the way back', async () => {
    const result = await run(() => signedInGuard({} as ActivatedRouteSnapshot, state('/designs/4')));
    expect(TestBed.inject(Router).serializeUrl(result as UrlTree)).toBe('/sign-in?next=%2Fdesigns%2F4');
  });

  it('waits for the session to resume on page load before deciding', async () => {
    localStorage.setItem('osm_session', '1');
    const pending = run(() => signedInGuard({} as ActivatedRouteSnapshot, state('/workspaces')));
    await new Promise((r) => setTimeout(r, 0));
    TestBed.inject(HttpTestingController).expectOne('/api/auth/refresh').flush({ token: 't', user });
    expect(await pending).toBe(true);
  });

  it('keeps a signed-in user away from the sign-in page', async () => {
    TestBed.inject(Auth).accept({ token: 't', user });
    const result = await run(() => signedOutGuard({} as ActivatedRouteSnapshot, state('/sign-in')));
    expect(TestBed.inject(Router).serializeUrl(result as UrlTree)).toBe('/workspaces');
  });

  it('makes a workspace of mine current, and turns away one that is not mine', async () => {
    TestBed.inject(Auth).accept({ token: 't', user });
    const http = TestBed.inject(HttpTestingController);
    const mine = run(() => workspaceGuard(route('1'), state('/workspaces/1/designs')));
    await new Promise((r) => setTimeout(r, 0));
    http.expectOne('/api/workspaces').flush([{ id: 1, name: 'Tidewater Assay Lab', role: 'editor' }]);
    expect(await mine).toBe(true);
    expect(TestBed.inject(WorkspaceContext).current()?.name).toBe('Tidewater Assay Lab');
    const other = await run(() => workspaceGuard(route('9'), state('/workspaces/9/designs')));
    expect(TestBed.inject(Router).serializeUrl(other as UrlTree)).toBe('/workspaces?missing=9');
  });
});
