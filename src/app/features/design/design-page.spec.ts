// The tab contents are the teammates' components; here they are stand-ins with the same inputs and outputs.
jest.mock('../sketch/sketch-editor', () => jest.requireActual('./testing/tab-stubs'));
jest.mock('../conditions/conditions-panel', () => jest.requireActual('./testing/tab-stubs'));
jest.mock('../fields/fields-view', () => jest.requireActual('./testing/tab-stubs'));
jest.mock('../sweeps/sweeps-tab', () => jest.requireActual('./testing/tab-stubs'));
jest.mock('../compare/compare-tab', () => jest.requireActual('./testing/tab-stubs'));
jest.mock('../tracer/tracer-tab', () => jest.requireActual('./testing/tab-stubs'));
jest.mock('../planner/planner-tab', () => jest.requireActual('./testing/tab-stubs'));
jest.mock('../double-layer/double-layer-tab', () => jest.requireActual('./testing/tab-stubs'));
import { provideHttpClient } from '@angular/common/http';
import { INSTANT } from '../../core/instant-client';
import { instantComputations } from '../../../workers/instant';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { MatDialog } from '@angular/material/dialog';
import { By } from '@angular/platform-browser';
import { provideRouter } from '@angular/router';
import { of } from 'rxjs';
import { DESIGN_TEMPLATES } from '../designs/templates';
import { AUTOSAVE_DELAY_MS, DesignPage } from './design-page';

const cross = DESIGN_TEMPLATES.find((t) => t.id === 'cross')!.document;
const design = (over: Record<string, unknown> = {}) => ({
  id: 7,
  name: 'Cross injector, 50 um legs',
  version: 3,
  reviewState: 'draft',
  document: cross,
  workspaceId: 1,
  role: 'editor',
  updatedAt: '2026-12-01T10:00:00Z',
  updatedBy: { id: 3, name: 'Priya Raman' },
  ...over,
});

describe('DesignPage', () => {
  let fixture: ComponentFixture<DesignPage>;
  let http: HttpTestingController;
  let el: HTMLElement;

  async function open(over: Record<string, unknown> = {}, tab?: string, revisions: unknown[] = []) {
    await TestBed.configureTestingModule({
      imports: [DesignPage],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: INSTANT, useValue: instantComputations }],
    }).compileComponents();
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(DesignPage);
    fixture.componentRef.setInput('id', '7');
    if (tab) fixture.componentRef.setInput('tab', tab);
    fixture.detectChanges();
    http.expectOne('/api/designs/7').flush(design(over));
    http.match('/api/workspaces').forEach((r) => r.flush([{ id: 1, name: 'Tidewater Assay Lab', role: over['role'] ?? 'editor' }]));
    http.expectOne('/api/designs/7/revisions').flush(revisions);
    await settle();
    el = fixture.nativeElement;
  }

  async function settle() {
    await new Promise((r) => setTimeout(r, 0));
    fixture.detectChanges();
    await fixture.whenStable();
  }

  function edit(document: unknown) {
    fixture.debugElement.query(By.css('osm-sketch-editor')).componentInstance.documentChange.emit(document);
    fixture.detectChanges();
  }

  afterEach(() => {
    http.verify();
    jest.useRealTimers();
  });

  it('shows the design with its review state and all its tabs, Sketch to History', async () => {
    await open();
    expect(el.querySelector('[data-testid=design-name]')?.textContent).toContain('Cross injector');
    expect(el.querySelector('[data-testid=review-chip]')?.textContent).toContain('draft');
    expect(Array.from(el.querySelectorAll('[role=tab]')).map((t) => t.textContent?.trim())).toEqual(['Sketch', 'Conditions', 'Fields', 'Compare', 'Tracer', 'Planner', 'Double layer', 'Sweeps', 'History']);
    expect(el.querySelector('osm-sketch-editor')?.textContent).toContain('editable');
    expect(el.querySelector('[data-testid=save-revision]')).not.toBeNull();
    expect(el.querySelector('[data-testid=save-state]')?.textContent).toContain('All changes saved');
  });

  it('autosaves the draft after a quiet moment, with the version it started from', async () => {
    await open();
    jest.useFakeTimers();
    const changed = { ...cross, depth: 30e-6 };
    edit(changed);
    expect(el.querySelector('[data-testid=save-state]')?.textContent).toContain('Unsaved changes');
    edit({ ...changed, depth: 31e-6 });
    jest.advanceTimersByTime(AUTOSAVE_DELAY_MS - 100);
    http.expectNone({ method: 'PUT' });
    jest.advanceTimersByTime(200);
    const put = http.expectOne({ method: 'PUT', url: '/api/designs/7' });
    expect(put.request.body).toEqual({ document: { ...changed, depth: 31e-6 }, version: 3 });
    put.flush(design({ version: 4, document: put.request.body.document }));
    jest.useRealTimers();
    await settle();
    expect(el.querySelector('[data-testid=save-state]')?.textContent).toContain('All changes saved');
  });

  it('never overwrites silently: a 409 asks, and "Overwrite with mine" saves again on top of their version', async () => {
    await open();
    const dialog = jest.spyOn(TestBed.inject(MatDialog), 'open').mockReturnValue({ afterClosed: () => of('overwrite') } as never);
    jest.useFakeTimers();
    const mine = { ...cross, depth: 25e-6 };
    edit(mine);
    jest.advanceTimersByTime(AUTOSAVE_DELAY_MS + 10);
    jest.useRealTimers();
    http.expectOne({ method: 'PUT', url: '/api/designs/7' }).flush({ error: { code: 'conflict', message: 'Someone saved first' } }, { status: 409, statusText: 'Conflict' });
    await settle();
    expect(el.querySelector('[data-testid=save-state]')?.getAttribute('data-state')).toBe('conflict');
    http.expectOne({ method: 'GET', url: '/api/designs/7' }).flush(design({ version: 5, document: { ...cross, depth: 40e-6 } }));
    await settle();
    expect(dialog).toHaveBeenCalled();
    const again = http.expectOne({ method: 'PUT', url: '/api/designs/7' });
    expect(again.request.body).toEqual({ document: mine, version: 5 });
    again.flush(design({ version: 6, document: mine }));
    await settle();
    expect(el.querySelector('[data-testid=save-state]')?.textContent).toContain('All changes saved');
  });

  it('"Take theirs" drops my unsaved change and shows their version', async () => {
    await open();
    jest.spyOn(TestBed.inject(MatDialog), 'open').mockReturnValue({ afterClosed: () => of('theirs') } as never);
    jest.useFakeTimers();
    edit({ ...cross, depth: 25e-6 });
    jest.advanceTimersByTime(AUTOSAVE_DELAY_MS + 10);
    jest.useRealTimers();
    http.expectOne({ method: 'PUT', url: '/api/designs/7' }).flush({}, { status: 409, statusText: 'Conflict' });
    await settle();
    const theirs = { ...cross, depth: 40e-6 };
    http.expectOne({ method: 'GET', url: '/api/designs/7' }).flush(design({ version: 5, document: theirs }));
    await settle();
    http.expectNone({ method: 'PUT' });
    expect(fixture.debugElement.query(By.css('osm-sketch-editor')).componentInstance.document()).toEqual(theirs);
    expect(el.querySelector('[data-testid=save-state]')?.textContent).toContain('All changes saved');
  });

  it('is read-only for a viewer: no save, no revision, the tabs told so', async () => {
    await open({ role: 'viewer' });
    expect(el.querySelector('[data-testid=read-only]')).not.toBeNull();
    expect(el.querySelector('[data-testid=save-revision]')).toBeNull();
    expect(el.querySelector('[data-testid=save-state]')).toBeNull();
    expect(el.querySelector('[data-testid=review-menu]')).toBeNull();
    expect(el.querySelector('osm-sketch-editor')?.textContent).toContain('read-only');
    edit({ ...cross, depth: 1e-5 });
    await new Promise((r) => setTimeout(r, AUTOSAVE_DELAY_MS + 50));
    http.expectNone({ method: 'PUT' });
  });

  it('gives the Fields tab the latest revision only while the document is that revision', async () => {
    await open({}, 'fields', [{ id: 41, number: 2, note: 'legs 50 um', createdAt: '2026-12-01T09:00:00Z', author: { id: 2, name: 'Jonas Lindqvist' } }]);
    http.expectOne('/api/revisions/41').flush({ id: 41, designId: 7, number: 2, note: 'legs 50 um', document: cross, createdAt: '', author: { id: 2, name: 'J' } });
    await settle();
    expect(el.querySelector('osm-fields-view')?.textContent).toContain('revision 41');
    expect(el.querySelector('[data-testid=revision-offer]')).toBeNull();
    jest.useFakeTimers();
    // An edit made elsewhere (the Sketch tab is not open here).
    (fixture.componentInstance as unknown as { onDocumentChange(d: unknown): void }).onDocumentChange({ ...cross, depth: 1e-5 });
    jest.useRealTimers();
    await settle();
    expect(el.querySelector('osm-fields-view')?.textContent).toContain('revision none');
    expect(el.querySelector('[data-testid=revision-offer]')?.textContent).toContain('changed since revision 2');
  });
});
