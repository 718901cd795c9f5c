import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';
import { SweepsTab } from './sweeps-tab';
import { sampleSweep } from './testing';

describe('SweepsTab', () => {
  let fixture: ComponentFixture<SweepsTab>;
  let http: HttpTestingController;
  let el: HTMLElement;

  async function settle() {
    await new Promise((r) => setTimeout(r, 0));
    fixture.detectChanges();
    await fixture.whenStable();
  }

  async function open(role: string, sweeps: unknown[]) {
    await TestBed.configureTestingModule({ imports: [SweepsTab], providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] }).compileComponents();
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(SweepsTab);
    fixture.componentRef.setInput('designId', 3);
    fixture.componentRef.setInput('role', role);
    fixture.detectChanges();
    http.expectOne('/api/designs/3/revisions').flush([{ id: 11, number: 2, note: 'first', createdAt: '2026-12-02T00:00:00Z', author: { id: 1, name: 'J' } }]);
    http.expectOne('/api/designs/3/sweeps').flush(sweeps);
    await settle();
    el = fixture.nativeElement;
  }

  afterEach(() => http.verify());

  it('follows the newest sweep through its event stream and opens a picked point as a run in Fields', async () => {
    const { points: _p, ...summary } = sampleSweep({ status: 'solving', done: 0 });
    await open('editor', [summary]);
    const stream = http.expectOne('/api/sweeps/7/events');
    const done = sampleSweep();
    stream.flush(`event: snapshot\ndata: ${JSON.stringify({ type: 'snapshot', sweep: { ...done, status: 'solving' } })}\n\n` +
      `event: status\ndata: ${JSON.stringify({ type: 'status', sweep: { ...summary, status: 'solved', done: 3 } })}\n\n`);
    await settle();
    expect(el.querySelector('[data-testid=sweep-state]')!.textContent).toBe('solved');
    expect(el.querySelectorAll('[data-testid=sweep-row]').length).toBe(3);
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    (el.querySelectorAll('[data-testid=sweep-row]')[2] as HTMLElement).click();
    await settle();
    (el.querySelector('[data-testid=open-point]') as HTMLButtonElement).click();
    http.expectOne({ method: 'POST', url: '/api/sweeps/7/points/2/run' }).flush({ id: 40 });
    expect(navigate).toHaveBeenCalledWith(['/designs', '3'], { queryParams: { tab: 'fields', run: 40 } });
  });

  it('offers a new sweep to editors when there is none, and nothing to start for viewers', async () => {
    await open('editor', []);
    http.expectOne('/api/revisions/11').flush({ id: 11, number: 2, note: '', designId: 3, document: sampleDocument(), createdAt: '', author: { id: 1, name: 'J' } });
    await settle();
    expect(el.querySelector('osm-sweep-form')).not.toBeNull();
    expect(el.querySelector('[data-testid=sweep-summary]')!.textContent).toContain('11 points');
    (el.querySelector('[data-testid=run-sweep]') as HTMLButtonElement).click();
    const req = http.expectOne({ method: 'POST', url: '/api/sweeps' });
    expect(req.request.body).toMatchObject({ revisionId: 11, parameters: [{ pointer: '/ports/0/potential', range: { kind: 'linear', from: 0, to: 800, steps: 11 } }], cells: 120 });
    req.flush({ ...sampleSweep(), id: 8, method: 'superposed' });
    await settle();
    http.expectOne('/api/sweeps/8/events').flush('');
    await settle();
    expect(el.textContent).toContain('Answered at once by superposition');
  });

  it('shows viewers the sweeps but no way to start one', async () => {
    await open('viewer', []);
    expect(el.querySelector('[data-testid=new-sweep]')).toBeNull();
    expect(el.querySelector('osm-sweep-form')).toBeNull();
    expect(el.textContent).toContain('Editors and owners start them.');
  });
});

function sampleDocument() {
  return {
    format: 'osmolane.design/1', name: 'T', depth: 2e-5,
    buffer: { relativePermittivity: 78.4, viscosity: 8.9e-4, density: 997, conductivity: 0.14, ionicStrength: 10, temperature: 298.15 },
    zeta: { side: -0.05 },
    shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: 1e-3, height: 5e-5 }],
    ports: [{ id: 'A', from: [0, 0], to: [0, 5e-5], potential: 400 }, { id: 'B', from: [1e-3, 0], to: [1e-3, 5e-5], potential: 0 }],
  };
}
