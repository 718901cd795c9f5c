import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { parseDesign, type DesignDocument } from '../../../../shared/design';
import bend from '../../../../tests/fixtures/designs/bend-90.json';
import { INSTANT } from '../../core/instant-client';
import { ANALYSIS, type AnalysisClient } from '../../core/solver-client';
import { instantComputations } from '../../../workers/instant';
import { compareOutcome } from '../../../workers/worker-analysis';
import { CompareTab } from './compare-tab';

function design(over: Partial<DesignDocument> = {}): DesignDocument {
  const r = parseDesign({ ...bend, ...over });
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.design;
}

/** The real analysis behind a fake worker: same outcome, no Worker, a coarse grid. */
function fakeAnalysis(): AnalysisClient & { calls: unknown[] } {
  const fake = {
    calls: [] as unknown[],
    compare: async (doc: unknown, options: { port: string; referenceDiffusivity?: number }, onProgress?: (p: { label: string; fraction: number }) => void) => {
      fake.calls.push(options);
      onProgress?.({ label: 'slip-driven solve', fraction: 0.2 });
      return compareOutcome(doc, { ...options, cells: 60 });
    },
    unitResponses: jest.fn(),
    trace: jest.fn(),
    cancel: jest.fn(),
  };
  return fake as unknown as AnalysisClient & { calls: unknown[] };
}

describe('CompareTab', () => {
  let fixture: ComponentFixture<CompareTab>;
  let el: HTMLElement;
  let analysis: ReturnType<typeof fakeAnalysis>;

  async function settle() {
    await new Promise((r) => setTimeout(r, 0));
    fixture.detectChanges();
    await fixture.whenStable();
    fixture.detectChanges();
  }

  async function open(doc: DesignDocument) {
    // jsdom draws no canvas: the maps skip their image quietly.
    jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null);
    analysis = fakeAnalysis();
    await TestBed.configureTestingModule({ imports: [CompareTab], providers: [{ provide: ANALYSIS, useValue: analysis }, { provide: INSTANT, useValue: instantComputations }] }).compileComponents();
    fixture = TestBed.createComponent(CompareTab);
    fixture.componentRef.setInput('document', doc);
    fixture.detectChanges();
    await settle();
    el = fixture.nativeElement;
  }

  it('runs both drives in the worker and shows both maps on one scale, the matched flow, the table and the profiles', async () => {
    const doc = design();
    await open(doc);
    const strongest = doc.ports.reduce((a, b) => (Math.abs(b.potential ?? 0) > Math.abs(a.potential ?? 0) ? b : a)).id;
    (el.querySelector('[data-testid=compare-run]') as HTMLButtonElement).click();
    await settle();
    await settle();
    expect(analysis.calls).toEqual([{ port: strongest, referenceDiffusivity: 1e-9 }]);
    expect(el.querySelector('[data-testid=compare-map-slip]')).not.toBeNull();
    expect(el.querySelector('[data-testid=compare-map-pressure]')).not.toBeNull();
    expect(el.querySelectorAll('osm-colour-bar')).toHaveLength(1);
    expect(Number(el.querySelector('[data-testid=matched-flow]')!.getAttribute('data-ratio'))).toBeCloseTo(1, 6);
    expect(el.querySelector('[data-testid=row-flow]')).not.toBeNull();
    expect(el.querySelector('[data-testid=row-dispersion]')!.textContent).toMatch(/Taylor–Aris/);
    // The tracer's band per side: plate height, spread and mean arrival time, and both arrival curves on one plot.
    for (const id of ['row-band-plate', 'row-band-spread', 'row-band-mean', 'row-band-dispersion']) expect(el.querySelector(`[data-testid=${id}]`)).not.toBeNull();
    const plate = el.querySelector('[data-testid=row-band-plate]')!.querySelectorAll('td');
    expect(plate[0].textContent).toMatch(/m/);
    expect(Number(plate[2].textContent!.replace(/,/g, ''))).toBeGreaterThan(1);
    expect(el.querySelector('[data-testid=compare-band]')!.textContent).toContain('2000 particles');
    expect(el.querySelectorAll('[data-testid=compare-arrivals] path[data-series]')).toHaveLength(2);
    expect(el.querySelector('[data-testid=compare-arrivals] path[data-series="pressure-driven"]')!.getAttribute('d')).toMatch(/^M/);
    expect(el.querySelector('[data-testid=compare-band-problem]')).toBeNull();
    // The first cut line crosses the chosen port's channel: both profiles are drawn.
    expect(el.querySelectorAll('[data-testid=compare-profile] path[data-series]')).toHaveLength(2);
    expect(el.querySelector('[data-testid=compare-profile] path[data-series="slip-driven"]')!.getAttribute('d')).toMatch(/^M/);
    (el.querySelector('[data-testid=compare-map-vorticity] button') as HTMLButtonElement).click();
    await settle();
    expect(el.querySelector('[data-testid=compare-colour-bar]')!.textContent).toContain('ω');
  });

  it('says why when the layout has no electrode to drive the slip case', async () => {
    const doc = design();
    await open(design({ ports: doc.ports.map((p) => ({ ...p, potential: 0, pressure: 100 })) }));
    (el.querySelector('[data-testid=compare-run]') as HTMLButtonElement).click();
    await settle();
    await settle();
    expect(el.querySelector('[data-testid=compare-error]')!.textContent).toContain('no electrode above 0 V');
    expect(el.querySelector('[data-testid=compare-map-slip]')).toBeNull();
  });
});
