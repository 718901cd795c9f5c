import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { By } from '@angular/platform-browser';
import { provideRouter } from '@angular/router';
import { DESIGN_TEMPLATES } from '../designs/templates';
import { LayoutPreview } from '../../ui/layout-preview';
import { RevisionPanel, runResult } from './revision-panel';

const cross = DESIGN_TEMPLATES.find((t) => t.id === 'cross')!.document;
const revision = { id: 41, number: 2, note: 'legs 50 um', createdAt: '2026-12-01T09:00:00Z', author: { id: 2, name: 'Jonas Lindqvist' } };

describe('RevisionPanel', () => {
  let fixture: ComponentFixture<RevisionPanel>;
  let http: HttpTestingController;
  let el: HTMLElement;

  async function open(role: string) {
    await TestBed.configureTestingModule({ imports: [RevisionPanel], providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] }).compileComponents();
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(RevisionPanel);
    fixture.componentRef.setInput('revision', revision);
    fixture.componentRef.setInput('designId', 7);
    fixture.componentRef.setInput('role', role);
    fixture.detectChanges();
    http.expectOne('/api/revisions/41/runs').flush([
      { id: 90, status: 'solved', createdAt: '2026-12-01T09:30:00Z', author: { id: 2, name: 'Jonas Lindqvist' }, summary: { ports: [{ id: 'S' }, { id: 'W' }], warnings: [{ code: 'x', message: 'y' }] } },
    ]);
    http.expectOne('/api/revisions/41/comments').flush([
      { id: 1, body: 'Check the corner at B', at: [1e-3, 0], createdAt: '2026-12-01T09:40:00Z', author: { id: 3, name: 'Priya Raman' } },
    ]);
    http.expectOne('/api/revisions/41').flush({ ...revision, designId: 7, document: cross });
    await new Promise((r) => setTimeout(r, 0));
    fixture.detectChanges();
    await fixture.whenStable();
    el = fixture.nativeElement;
  }

  it('lists the runs of the revision with a way to open each in Fields', async () => {
    await open('viewer');
    const row = el.querySelector('[data-testid=run-row]')!;
    expect(row.textContent).toContain('solved');
    expect(row.textContent).toContain('2 ports · 1 warning');
    expect(el.querySelector('[data-testid=open-run]')?.getAttribute('href')).toBe('/designs/7?tab=fields&run=90');
  });

  it('shows comments with their pins; a viewer cannot comment', async () => {
    await open('viewer');
    expect(el.querySelector('[data-testid=comment]')?.textContent).toContain('Check the corner at B');
    expect(el.querySelector('[data-testid=comment]')?.textContent).toContain('1 mm, 0 µm');
    expect(el.querySelectorAll('osm-layout-preview .pin')).toHaveLength(1);
    expect(el.querySelector('[data-testid=comment-body]')).toBeNull();
  });

  it('lets a reviewer comment, pinned to a point picked on the layout', async () => {
    await open('reviewer');
    fixture.debugElement.query(By.directive(LayoutPreview)).componentInstance.pick.emit([5e-4, 2.5e-5]);
    const body = el.querySelector('[data-testid=comment-body]') as HTMLTextAreaElement;
    body.value = 'Sliver here?';
    body.dispatchEvent(new Event('input'));
    fixture.detectChanges();
    (el.querySelector('.comment-form button[type=submit]') as HTMLButtonElement).click();
    const req = http.expectOne({ method: 'POST', url: '/api/revisions/41/comments' });
    expect(req.request.body).toEqual({ body: 'Sliver here?', at: [5e-4, 2.5e-5] });
    req.flush({ id: 2 });
    http.expectOne('/api/revisions/41/comments').flush([]);
  });

  it('summarises a run in words', () => {
    expect(runResult({ ports: [{ id: 'A' }], warnings: [] })).toBe('1 port · no warnings');
    expect(runResult(undefined)).toBe('—');
  });
});
