import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { INSTANT } from '../../core/instant-client';
import { instantComputations } from '../../../workers/instant';
import { parseDesign, type DesignDocument } from '../../../../shared/design';
import cross from '../../../../tests/fixtures/designs/cross-injector.json';
import { SOLVER } from '../../core/solver-client';
import { DoubleLayerTab } from './double-layer-tab';

function design(): DesignDocument {
  const r = parseDesign(cross);
  if (!r.ok) throw new Error('bad fixture');
  return r.design;
}

describe('DoubleLayerTab', () => {
  let fixture: ComponentFixture<DoubleLayerTab>;
  let el: HTMLElement;

  async function settle() {
    await new Promise((r) => setTimeout(r, 0));
    fixture.detectChanges();
    await fixture.whenStable();
    fixture.detectChanges();
  }

  async function type(testId: string, text: string) {
    const input = el.querySelector(`[data-testid=${testId}]`) as HTMLInputElement;
    input.value = text;
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new Event('blur'));
    await settle();
  }

  beforeEach(async () => {
    const measure = jest.fn(async () => ({ narrowest: 5e-5, bounds: [0, 0, 3e-3, 2e-3] as [number, number, number, number] }));
    await TestBed.configureTestingModule({ imports: [DoubleLayerTab], providers: [{ provide: SOLVER, useValue: { measure } }, { provide: INSTANT, useValue: instantComputations }] }).compileComponents();
    fixture = TestBed.createComponent(DoubleLayerTab);
    fixture.componentRef.setInput('document', design());
    fixture.detectChanges();
    await settle();
    el = fixture.nativeElement;
  });

  it('shows the Debye length of the design’s 10 mM buffer at 25 °C, 3.04 nm, and that the thin-EDL model holds', () => {
    expect(el.querySelector('[data-testid=debye-length]')!.textContent).toBe('3.04 nm');
    expect(Number(el.querySelector('[data-testid=debye-length]')!.getAttribute('data-value'))).toBeCloseTo(3.04e-9, 11);
    expect(el.querySelector('[data-testid=edl-narrowest]')!.textContent).toBe('50 µm');
    // λ_D / depth: 3.04 nm / 20 µm.
    expect(el.querySelector('[data-testid=edl-ratio]')!.textContent).toBe('0.015 %');
    expect(el.querySelector('[data-testid=edl-verdict]')!.textContent).toContain('model holds');
    expect(el.querySelectorAll('osm-series-plot')).toHaveLength(3);
    expect(el.querySelectorAll('[data-testid=edl-plot-potential] path[data-series]')).toHaveLength(2);
  });

  it('follows typed values with units: a dilute buffer makes the double layer thick and the verdict a caution', async () => {
    await type('edl-ionic-strength', '0.01 mM');
    expect(el.querySelector('[data-testid=debye-length]')!.textContent).toBe('96.1 nm');
    await type('edl-ionic-strength', '0.0001 mM');
    expect(el.querySelector('[data-testid=edl-verdict]')!.classList).toContain('caution');
    (el.querySelector('[data-testid=edl-from-design]') as HTMLButtonElement).click();
    await settle();
    expect(el.querySelector('[data-testid=debye-length]')!.textContent).toBe('3.04 nm');
  });

  it('explains an unreadable entry and shows nothing it cannot compute', async () => {
    await type('edl-zeta', 'fifty');
    expect(el.querySelector('[data-testid=edl-invalid]')).not.toBeNull();
    expect(el.querySelector('mat-error')!.textContent).toContain('not a potential');
  });
});
