import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { INSTANT } from '../../core/instant-client';
import { instantComputations } from '../../../workers/instant';
import { parseDesign, type DesignDocument } from '../../../../shared/design';
import cross from '../../../../tests/fixtures/designs/cross-injector.json';
import { ANALYSIS, type AnalysisClient } from '../../core/solver-client';
import { responsesOutcome } from '../../../workers/worker-analysis';
import { PlannerStore, type PlannerMap } from '../../../workers/worker-planner';
import type { PlanRequest } from '../../../../solver/planner';
import { PlannerTab } from './planner-tab';

function design(): DesignDocument {
  const r = parseDesign(cross);
  if (!r.ok) throw new Error('bad fixture');
  return r.design;
}

describe('PlannerTab', () => {
  let fixture: ComponentFixture<PlannerTab>;
  let el: HTMLElement;
  let calls: unknown[];
  let emitted: DesignDocument[];

  async function settle(ms = 0) {
    await new Promise((r) => setTimeout(r, ms));
    fixture.detectChanges();
    await fixture.whenStable();
    fixture.detectChanges();
  }

  beforeEach(async () => {
    jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null);
    calls = [];
    emitted = [];
    // The worker's own pieces, in-process: unit responses kept in a PlannerStore, recombined and planned there.
    const store = new PlannerStore();
    const analysis = {
      unitResponses: async (doc: unknown) => {
        calls.push(doc);
        const outcome = responsesOutcome(doc, { cells: 60 });
        return outcome.ok ? { ok: true, workerMs: outcome.workerMs, basis: store.keep(outcome.responses) } : outcome;
      },
      recombine: async (id: number, map: PlannerMap, settings: number[]) => store.recombine(id, map, settings),
      plan: async (id: number, request: PlanRequest) => store.plan(id, request),
      releaseBasis: async (id: number) => store.release(id),
      compare: jest.fn(),
      trace: jest.fn(),
      cancel: jest.fn(),
    } as unknown as AnalysisClient;
    await TestBed.configureTestingModule({ imports: [PlannerTab], providers: [{ provide: ANALYSIS, useValue: analysis }, { provide: INSTANT, useValue: instantComputations }] }).compileComponents();
    fixture = TestBed.createComponent(PlannerTab);
    fixture.componentRef.setInput('document', design());
    fixture.componentInstance.documentChange.subscribe((d) => emitted.push(d));
    fixture.detectChanges();
    await settle(350);
    await settle();
    el = fixture.nativeElement;
  });

  it('computes the unit responses once, plans the default target with a tiny residual, and applies the potentials', async () => {
    expect(calls).toHaveLength(1);
    expect(el.querySelector('[data-testid=planner-responses]')!.textContent).toContain('4 unit responses');
    expect(el.querySelectorAll('[data-testid^=planner-slider-]')).toHaveLength(4);
    expect(el.querySelector('[data-testid=planner-map]')).not.toBeNull();
    // The grounded port B: 1 mm/s out of it, B held at 0 V.
    expect((el.querySelector('[data-testid=target-value-0]') as HTMLInputElement).value).toBe('1 mm/s');
    (el.querySelector('[data-testid=planner-plan]') as HTMLButtonElement).click();
    await settle();
    const residual = el.querySelector('[data-testid=planner-residual]')!;
    expect(Number(residual.getAttribute('data-share'))).toBeLessThan(1e-9);
    // Out of B: negative flow rate into the chip.
    expect(Number(el.querySelector('[data-testid=planner-live-B]')!.getAttribute('data-flow'))).toBeLessThan(0);
    (el.querySelector('[data-testid=planner-apply]') as HTMLButtonElement).click();
    await settle();
    expect(emitted).toHaveLength(1);
    expect(emitted[0].ports.find((p) => p.id === 'B')!.potential).toBe(0);
    const W = Number(el.querySelector('[data-testid=planner-slider-W] .value')!.getAttribute('data-value'));
    expect(emitted[0].ports.find((p) => p.id === 'W')!.potential).toBeCloseTo(W, 9);
  });

  it('recombines the map and the port flows when a slider moves, without a solve', async () => {
    const before = Number(el.querySelector('[data-testid=planner-live-W]')!.getAttribute('data-flow'));
    const map = fixture.debugElement.query((d) => d.nativeElement.getAttribute?.('data-testid') === 'planner-map');
    const valuesBefore = map.componentInstance.values();
    const thumb = el.querySelector('[data-testid=planner-slider-W] input') as HTMLInputElement;
    thumb.value = String(Number(thumb.value) + 200);
    thumb.dispatchEvent(new Event('input'));
    await settle();
    expect(Number(el.querySelector('[data-testid=planner-live-W]')!.getAttribute('data-flow'))).not.toBeCloseTo(before, 15);
    expect(map.componentInstance.values()).not.toBe(valuesBefore);
    expect(el.querySelector('[data-testid=planner-step-ms]')).not.toBeNull();
    expect(calls).toHaveLength(1);
  });

  it('computes again when a port is left floating', async () => {
    const fixtureEl = fixture.debugElement.query((d) => d.name === 'osm-planner-form');
    fixtureEl.componentInstance.portPlansChange.emit(
      fixtureEl.componentInstance.portPlans().map((p: { id: string }) => (p.id === 'S' ? { ...p, mode: 'float' } : p)),
    );
    await settle(350);
    await settle();
    expect(calls).toHaveLength(2);
    expect((calls[1] as DesignDocument).ports.find((p) => p.id === 'S')!.potential).toBeNull();
    expect(el.querySelectorAll('[data-testid^=planner-slider-]')).toHaveLength(3);
  });
});
