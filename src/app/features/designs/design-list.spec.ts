import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { Auth } from '../../core/auth';
import { WorkspaceContext } from '../../core/workspace-context';
import { DesignList } from './design-list';

const page = {
  items: [
    { id: 4, name: 'T-mixer with back-pressure check', version: 2, reviewState: 'in review', updatedAt: '2026-12-01T10:00:00Z', updatedBy: { id: 3, name: 'Priya Raman' } },
    { id: 1, name: 'Cross injector, 50 um legs', version: 7, reviewState: 'draft', updatedAt: '2026-11-30T08:00:00Z', updatedBy: null },
  ],
  total: 31,
};

describe('DesignList', () => {
  let fixture: ComponentFixture<DesignList>;
  let http: HttpTestingController;

  async function setup(role: string) {
    await TestBed.configureTestingModule({ imports: [DesignList], providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] }).compileComponents();
    http = TestBed.inject(HttpTestingController);
    TestBed.inject(Auth).accept({ token: 't', user: { id: 2, email: 'j@example.test', name: 'J' } });
    const ctx = TestBed.inject(WorkspaceContext);
    ctx.load().subscribe();
    http.expectOne('/api/workspaces').flush([{ id: 1, name: 'Tidewater Assay Lab', role }]);
    ctx.select(1);
    fixture = TestBed.createComponent(DesignList);
    fixture.detectChanges();
    await settle();
  }

  async function settle() {
    await new Promise((r) => setTimeout(r, 0));
    fixture.detectChanges();
    await fixture.whenStable();
  }

  it('asks the server for one sorted page and shows names, review states and who changed them', async () => {
    await setup('editor');
    const req = http.expectOne((r) => r.url === '/api/workspaces/1/designs');
    expect(req.request.params.toString()).toBe('sort=updatedAt&order=desc&limit=25&offset=0');
    req.flush(page);
    await settle();
    const el: HTMLElement = fixture.nativeElement;
    const rows = el.querySelectorAll('[data-testid=design-row]');
    expect(rows).toHaveLength(2);
    expect(rows[0].textContent).toContain('T-mixer');
    expect(rows[0].textContent).toContain('in review');
    expect(rows[0].textContent).toContain('Priya Raman');
    expect(el.textContent).toContain('of 31');
    expect(el.querySelector('[data-testid=new-design]')).not.toBeNull();
  });

  it('filters on the server after typing stops, from the first page', async () => {
    await setup('editor');
    http.expectOne((r) => r.url === '/api/workspaces/1/designs').flush(page);
    const input = fixture.nativeElement.querySelector('[data-testid=design-filter]') as HTMLInputElement;
    input.value = 'cross';
    input.dispatchEvent(new Event('input'));
    await new Promise((r) => setTimeout(r, 300));
    await settle();
    const req = http.expectOne((r) => r.url === '/api/workspaces/1/designs');
    expect(req.request.params.get('q')).toBe('cross');
    expect(req.request.params.get('offset')).toBe('0');
    req.flush({ items: [page.items[1]], total: 1 });
  });

  it('sorts by name on the server when the header is clicked', async () => {
    await setup('editor');
    http.expectOne((r) => r.url === '/api/workspaces/1/designs').flush(page);
    await settle();
    (fixture.nativeElement.querySelector('.mat-column-name .mat-sort-header-container') as HTMLElement).click();
    await settle();
    const req = http.expectOne((r) => r.url === '/api/workspaces/1/designs');
    expect(req.request.params.get('sort')).toBe('name');
    expect(req.request.params.get('order')).toBe('asc');
    req.flush(page);
  });

  it('offers no "New design" to a viewer', async () => {
    await setup('viewer');
    http.expectOne((r) => r.url === '/api/workspaces/1/designs').flush(page);
    await settle();
    expect(fixture.nativeElement.querySelector('[data-testid=new-design]')).toBeNull();
  });
});
