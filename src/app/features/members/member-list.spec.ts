import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { Auth } from '../../core/auth';
import { WorkspaceContext } from '../../core/workspace-context';
import { MemberList } from './member-list';

const members = [
  { userId: 1, email: 'mira.okafor@example.test', name: 'Mira Okafor', role: 'owner' },
  { userId: 2, email: 'jonas.lindqvist@example.test', name: 'Jonas Lindqvist', role: 'editor' },
];

describe('MemberList', () => {
  let fixture: ComponentFixture<MemberList>;
  let http: HttpTestingController;
  let el: HTMLElement;

  async function setup(role: string, me = 1) {
    await TestBed.configureTestingModule({ imports: [MemberList], providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] }).compileComponents();
    http = TestBed.inject(HttpTestingController);
    TestBed.inject(Auth).accept({ token: 't', user: { id: me, email: 'x@example.test', name: 'X' } });
    const ctx = TestBed.inject(WorkspaceContext);
    ctx.load().subscribe();
    http.expectOne('/api/workspaces').flush([{ id: 1, name: 'Tidewater Assay Lab', role }]);
    ctx.select(1);
    fixture = TestBed.createComponent(MemberList);
    fixture.detectChanges();
    await fixture.whenStable();
    http.expectOne('/api/workspaces/1/members').flush(members);
    if (role === 'owner') http.expectOne('/api/workspaces/1/invitations').flush([]);
    await settle();
    el = fixture.nativeElement;
  }

  async function settle() {
    await new Promise((r) => setTimeout(r, 0));
    fixture.detectChanges();
    await fixture.whenStable();
  }

  it('lets an owner invite by e-mail with a role', async () => {
    await setup('owner');
    expect(el.querySelectorAll('mat-select')).toHaveLength(3); // two role cells and the invitation's role
    const email = el.querySelector('[data-testid=invite-email]') as HTMLInputElement;
    email.value = 'nadia.voss@example.test';
    email.dispatchEvent(new Event('input'));
    (el.querySelector('.invite-button') as HTMLButtonElement).click();
    const req = http.expectOne('/api/workspaces/1/invitations');
    expect(req.request.method).toBe('POST');
    expect(req.request.body).toEqual({ email: 'nadia.voss@example.test', role: 'editor' });
    req.flush({ id: 5, email: 'nadia.voss@example.test', role: 'editor', createdAt: '', expiresAt: '', acceptedAt: null });
    http.expectOne('/api/workspaces/1/members').flush(members);
    http.expectOne('/api/workspaces/1/invitations').flush([{ id: 5, email: 'nadia.voss@example.test', role: 'editor', createdAt: '', expiresAt: '', acceptedAt: null }]);
    await settle();
    expect(el.querySelector('[data-testid=invitation-row]')?.textContent).toContain('nadia.voss@example.test');
    expect(el.querySelector('mat-error')).toBeNull();
  });

  it('shows members read-only to others, who may only leave', async () => {
    await setup('editor', 2);
    expect(el.querySelectorAll('[data-testid=member-row]')).toHaveLength(2);
    expect(el.querySelector('mat-select')).toBeNull();
    expect(el.querySelector('[data-testid=invite-email]')).toBeNull();
    expect(el.querySelectorAll('[data-testid=leave-workspace]')).toHaveLength(1);
    http.expectNone('/api/workspaces/1/invitations');
  });
});
