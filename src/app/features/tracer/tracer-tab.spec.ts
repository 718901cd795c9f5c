import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { INSTANT } from '../../core/instant-client';
import { instantComputations } from '../../../workers/instant';
import { parseDesign, type DesignDocument } from '../../../../shared/design';
import cross from '../../../../tests/fixtures/designs/cross-injector.json';
import { ANALYSIS, type AnalysisClient, type WorkerTraceRequest } from '../../core/solver-client';
import { traceOutcome } from '../../../workers/worker-analysis';
import { TracerTab } from './tracer-tab';

function design(): DesignDocument {
  const r = parseDesign(cross);
  if (!r.ok) throw new Error('bad fixture');
  return r.design;
}

describe('TracerTab', () => {
  let fixture: ComponentFixture<TracerTab>;
  let el: HTMLElement;
  let requests: WorkerTraceRequest[];

  async function settle(ms = 0) {
    await new Promise((r) => setTimeout(r, ms));
    fixture.detectChanges();
    await fixture.whenStable();
    fixture.detectChanges();
  }

  const click = (id: string) => (el.querySelector(`[data-testid=${id}]`) as HTMLElement).click();

  beforeEach(async () => {
    jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null);
    requests = [];
    const analysis = {
      // The real tracer on a coarse grid with few particles.
      trace: async (doc: unknown, request: WorkerTraceRequest) => {
        requests.push(request);
        return traceOutcome(doc, { ...request, cells: 80, particles: 150 });
      },
      compare: jest.fn(),
      unitResponses: jest.fn(),
      cancel: jest.fn(),
    } as unknown as AnalysisClient;
    await TestBed.configureTestingModule({ imports: [TracerTab], providers: [{ provide: ANALYSIS, useValue: analysis }, { provide: INSTANT, useValue: instantComputations }] }).compileComponents();
    fixture = TestBed.createComponent(TracerTab);
    fixture.componentRef.setInput('document', design());
    fixture.detectChanges();
    await settle();
    el = fixture.nativeElement;
  });

  it('starts with a band across the leg of the highest potential and a detector at the lowest, and follows it', async () => {
    expect(el.querySelector('[data-testid=tracer-injection]')).not.toBeNull();
    expect(el.querySelector('[data-testid=tracer-detector]')).not.toBeNull();
    click('tracer-run');
    await settle();
    await settle();
    expect(requests).toHaveLength(1);
    expect(requests[0]).toMatchObject({ species: { mobility: 0, diffusivity: 4e-10 }, particles: 1000, seed: 1, injection: { kind: 'line' } });
    expect(Number(el.querySelector('[data-testid=stat-arrived]')!.getAttribute('data-value'))).toBeGreaterThan(20);
    expect(Number(el.querySelector('[data-testid=stat-plates]')!.getAttribute('data-value'))).toBeGreaterThan(1);
    expect(el.querySelector('[data-testid=stat-seed]')!.textContent).toContain('1');
    expect(el.querySelectorAll('[data-testid=arrival-histogram] rect.bar').length).toBeGreaterThanOrEqual(8);
    expect(el.querySelector('[data-testid=tracer-frame]')!.textContent).toContain('in the chip');
    fixture.componentInstance['playing'].set(false);
  });

  it('sets up a pinched plug at the cross with editable loading and dispensing potentials', async () => {
    (el.querySelector('[data-testid=tracer-mode-pinched] button') as HTMLButtonElement).click();
    await settle();
    expect(el.querySelector('[data-testid=tracer-phases]')).not.toBeNull();
    const sLoading = el.querySelector('[data-testid=tracer-phase-0-S]') as HTMLInputElement;
    expect(sLoading.value).toBe('1 kV');
    sLoading.value = '800 V';
    sLoading.dispatchEvent(new Event('change'));
    await settle();
    click('tracer-run');
    await settle();
    await settle();
    expect(requests[0].phases).toHaveLength(2);
    expect(requests[0].phases![0]).toMatchObject({ label: 'loading', potentials: { S: 800, SW: 0 } });
    expect(requests[0].phases![1].duration).toBeUndefined();
    expect(requests[0].injection.kind).toBe('region');
    expect(el.querySelector('[data-testid=tracer-frame]')!.textContent).toMatch(/loading|dispensing/);
    fixture.componentInstance['playing'].set(false);
  });

  it('takes a detector drawn on the map', async () => {
    click('tracer-draw-detector');
    await settle();
    const map = fixture.debugElement.query((d) => d.name === 'osm-tracer-map');
    expect(map.componentInstance.drawMode()).toBe('detector');
    map.componentInstance.drawn.emit({ mode: 'detector', a: [2e-3, 0.9e-3], b: [2e-3, 1.1e-3] });
    await settle();
    expect(fixture.componentInstance['detector']()).toEqual({ from: [2e-3, 0.9e-3], to: [2e-3, 1.1e-3] });
    expect(map.componentInstance.drawMode()).toBeNull();
  });

  it('keeps a drawn detector when the design changes but its shapes do not, and starts again for a new layout', async () => {
    click('tracer-draw-detector');
    await settle();
    const map = fixture.debugElement.query((d) => d.name === 'osm-tracer-map');
    map.componentInstance.drawn.emit({ mode: 'detector', a: [2e-3, 0.9e-3], b: [2e-3, 1.1e-3] });
    await settle();
    const doc = fixture.componentInstance.document();
    fixture.componentRef.setInput('document', { ...doc, ports: doc.ports.map((p) => (p.potential ? { ...p, potential: p.potential / 2 } : p)) });
    await settle();
    await settle();
    expect(fixture.componentInstance['detector']()).toEqual({ from: [2e-3, 0.9e-3], to: [2e-3, 1.1e-3] });
    fixture.componentRef.setInput('document', { ...doc, shapes: [...doc.shapes] });
    await settle();
    await settle();
    expect(fixture.componentInstance['detector']()).not.toEqual({ from: [2e-3, 0.9e-3], to: [2e-3, 1.1e-3] });
  });
});
