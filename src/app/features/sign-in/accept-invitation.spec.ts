import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { Auth } from '../../core/auth';
import { AcceptInvitation } from './accept-invitation';

describe('AcceptInvitation', () => {
  let fixture: ComponentFixture<AcceptInvitation>;
  let http: HttpTestingController;
  let el: HTMLElement;

  async function open(preview: unknown) {
    localStorage.clear();
    await TestBed.configureTestingModule({ imports: [AcceptInvitation], providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] }).compileComponents();
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(AcceptInvitation);
    fixture.componentRef.setInput('token', 'tok123');
    fixture.detectChanges();
    const req = http.expectOne('/api/invitations/tok123');
    if (preview) req.flush(preview);
    else req.flush({ error: { code: 'not-found', message: 'gone' } }, { status: 404, statusText: 'Not Found' });
    await settle();
    el = fixture.nativeElement;
  }

  async function settle() {
    await new Promise((r) => setTimeout(r, 0));
    fixture.detectChanges();
    await fixture.whenStable();
  }

  function type(name: string, value: string) {
    const input = el.querySelector<HTMLInputElement>(`input[formcontrolname=${name}]`)!;
    input.value = value;
    input.dispatchEvent(new Event('input'));
  }

  it('makes the account and opens the workspace just joined', async () => {
    await open({ workspaceName: 'Tidewater Assay Lab', email: 'nadia@example.test', role: 'editor', accountExists: false });
    expect(el.querySelector('[data-testid=invitation-summary]')?.textContent).toContain('Tidewater Assay Lab');
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    type('name', 'Nadia Voss');
    type('password', 'a-long-pass-phrase');
    type('confirm', 'a-long-pass-phrase');
    (el.querySelector('button[type=submit]') as HTMLButtonElement).click();
    const accept = http.expectOne('/api/invitations/tok123/accept');
    expect(accept.request.body).toEqual({ name: 'Nadia Voss', password: 'a-long-pass-phrase' });
    expect(accept.request.headers.has('Authorization')).toBe(false);
    accept.flush({ token: 'new', user: { id: 9, email: 'nadia@example.test', name: 'Nadia Voss' } });
    http.expectOne('/api/workspaces').flush([{ id: 1, name: 'Tidewater Assay Lab', role: 'editor' }]);
    expect(TestBed.inject(Auth).user()?.name).toBe('Nadia Voss');
    expect(navigate).toHaveBeenCalledWith(['/workspaces', '1', 'designs']);
  });

  it('asks an existing account for its password only', async () => {
    await open({ workspaceName: 'Tidewater Assay Lab', email: 'tom.beck@example.test', role: 'viewer', accountExists: true });
    expect(el.querySelector('input[formcontrolname=name]')).toBeNull();
    type('password', 'osmolane-demo');
    (el.querySelector('button[type=submit]') as HTMLButtonElement).click();
    const accept = http.expectOne('/api/invitations/tok123/accept');
    expect(accept.request.body).toEqual({ password: 'osmolane-demo' });
    accept.flush({ error: { code: 'invalid', message: 'This is not the password of the account', field: 'password' } }, { status: 400, statusText: 'Bad Request' });
    await settle();
    expect(el.textContent).toContain('This is not the password of the account');
  });

  it('says when the link is no longer valid', async () => {
    await open(null);
    expect(el.querySelector('[role=alert]')?.textContent).toContain('not valid any more');
  });
});
