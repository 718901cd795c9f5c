import { provideHttpClient } from '@angular/common/http';
import { INSTANT } from '../../core/instant-client';
import { instantComputations } from '../../../workers/instant';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { CompressionStream, DecompressionStream } from 'node:stream/web';
import { parseDesign, type DesignDocument } from '../../../../shared/design';
import { readFieldBlob, writeFieldBlob } from '../../../../solver/result/field-blob';
import type { SolveResult } from '../../../../solver/result/types';
import { CANCELLED, SOLVER, type SolveOutcome, type SolverClient } from '../../core/solver-client';
import { measureLayout, solveOutcome } from '../../../workers/worker-solve';
import { FieldsView } from './fields-view';
import { runSummary } from './shown-solve';

// jsdom has neither the compression streams (Node does) nor a 2-D canvas.
Object.assign(globalThis, { CompressionStream, DecompressionStream });
HTMLCanvasElement.prototype.getContext = (() => null) as unknown as typeof HTMLCanvasElement.prototype.getContext;

function straight(potentialA = 40): DesignDocument {
  const r = parseDesign({
    format: 'osmolane.design/1',
    name: 'Straight',
    depth: 2e-5,
    buffer: { relativePermittivity: 78.4, viscosity: 8.9e-4, density: 997, conductivity: 0.14, ionicStrength: 10, temperature: 298.15 },
    zeta: { side: -0.05 },
    shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: 1e-3, height: 5e-5 }],
    ports: [
      { id: 'A', name: 'inlet', from: [0, 0], to: [0, 5e-5], potential: potentialA },
      { id: 'B', name: 'outlet', from: [1e-3, 0], to: [1e-3, 5e-5], potential: 0 },
    ],
  });
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.design;
}

/** The real solver behind a fake worker: same outcome, no Worker. */
function fakeSolver(over: Partial<SolverClient> = {}): SolverClient & { calls: number; last: SolveResult | null } {
  const fake = {
    calls: 0,
    last: null as SolveResult | null,
    hello: async () => ({ ready: true, at: 0 }),
    measure: async (design: unknown) => measureLayout(design),
    solve: async (design: unknown, options: { cells?: number }, onProgress?: (p: { stage: 'potential'; fraction: number }) => void) => {
      fake.calls++;
      onProgress?.({ stage: 'potential', fraction: 0.5 });
      const outcome = solveOutcome(design, { cells: options.cells ?? 80 });
      fake.last = outcome.ok ? outcome.result : null;
      return outcome;
    },
    cancel: jest.fn(),
    ...over,
  };
  return fake;
}

async function settle(fixture: ComponentFixture<unknown>, ms = 0): Promise<void> {
  await new Promise((r) => setTimeout(r, ms));
  fixture.detectChanges();
  await fixture.whenStable();
  fixture.detectChanges();
}

describe('FieldsView', () => {
  let fixture: ComponentFixture<FieldsView>;
  let el: HTMLElement;
  let http: HttpTestingController;
  let solver: ReturnType<typeof fakeSolver>;

  async function create(opts: { doc?: DesignDocument; revisionId?: string | number | null; readOnly?: boolean; runId?: string | number | null; solver?: ReturnType<typeof fakeSolver> } = {}) {
    solver = opts.solver ?? fakeSolver();
    await TestBed.configureTestingModule({
      imports: [FieldsView],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: SOLVER, useValue: solver }, { provide: INSTANT, useValue: instantComputations }],
    }).compileComponents();
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(FieldsView);
    fixture.componentRef.setInput('document', opts.doc ?? straight());
    fixture.componentRef.setInput('revisionId', opts.revisionId ?? null);
    fixture.componentRef.setInput('readOnly', opts.readOnly ?? false);
    if (opts.runId !== undefined) fixture.componentRef.setInput('runId', opts.runId);
    fixture.detectChanges();
    await settle(fixture);
    el = fixture.nativeElement;
  }

  const q = (testid: string) => el.querySelector(`[data-testid="${testid}"]`) as HTMLElement | null;
  const all = (testid: string) => Array.from(el.querySelectorAll(`[data-testid="${testid}"]`)) as HTMLElement[];

  async function clickSolve(): Promise<void> {
    q('solve')!.click();
    await settle(fixture);
    await settle(fixture);
  }

  afterEach(() => http.verify());

  it('before a solve: explains what solving gives, measures the layout for the resolution control, cautions above 50 V', async () => {
    await create({ doc: straight(1500) });
    expect(q('fields-empty')?.textContent).toContain('Solve the design');
    await settle(fixture, 300);
    expect(q('resolution-hint')?.textContent).toContain('Narrowest 50 µm · grid ≈ 202 × 12');
    const caution = q('fields-hv-caution')!;
    expect(caution.classList).toContain('caution');
    expect(caution.textContent).toContain('Port A at 1.5 kV');
    expect(caution.textContent).toContain('can kill');
  });

  it('solves in the worker and shows the port table with Σ I ≈ 0, the map, colour bar, metrics and warnings', async () => {
    await create();
    await clickSolve();
    expect(solver.calls).toBe(1);
    expect(all('port-row')).toHaveLength(2);
    const currents = all('port-current').map((c) => Number(c.getAttribute('data-value')));
    expect(Math.abs(currents[0] + currents[1])).toBeLessThanOrEqual(1e-6 * Math.abs(currents[0]));
    expect(currents[0]).toBeGreaterThan(0); // into the fluid at the higher potential
    expect(q('current-sum')?.textContent?.trim()).toBe('≈ 0');
    expect(q('field-map')).not.toBeNull();
    expect(q('colour-bar')?.textContent).toContain('V');
    expect(q('metrics')?.textContent).toContain('Joule power');
    // The mean speed of each leg is |Q| / (port width × depth): 50 µm × 20 µm here.
    const means = all('port-mean-speed');
    const ports = solver.last!.ports;
    expect(means.map((m, k) => Number(m.getAttribute('data-value')) / (Math.abs(ports[k].flowRate) / (5e-5 * 2e-5)))).toEqual([
      expect.closeTo(1, 9), expect.closeTo(1, 9),
    ]);
    expect(means[0].textContent?.trim()).toMatch(/^[\d.]+ (mm|µm)\/s$/);
    const shear = q('metric-wall-shear')!;
    expect(Number(shear.getAttribute('data-value'))).toBe(solver.last!.metrics.maxWallShearRate);
    expect(shear.textContent?.trim()).toMatch(/^[\d.e+-]+ 1\/s$/);
    await settle(fixture, 300); // the layout measure (narrowest channel) arrives from the worker
    // The model's error against the exact duct at depth/width 0.4: between the +1.57 % (0.25) and +3.77 % (0.5)
    // of the rectangular-duct table in reference-values.md §5.
    const duct = /^\+(\d\.\d) % at depth\/width 0\.40$/.exec(q('duct-note')?.textContent?.trim() ?? '');
    expect(Number(duct?.[1])).toBeGreaterThan(1.57);
    expect(Number(duct?.[1])).toBeLessThan(3.77);
    expect(q('solve-status')?.getAttribute('data-solve-ms')).toMatch(/^\d/);
    // 40 V: no caution; the warnings list has no high-voltage entry.
    expect(q('fields-hv-caution')).toBeNull();
    expect(all('warning').some((w) => w.getAttribute('data-code') === 'high-voltage')).toBe(false);
  });

  it('switches maps: vorticity on the diverging map, field strength in kV/m', async () => {
    await create();
    await clickSolve();
    q('map-fieldStrength')!.querySelector('button')!.click();
    await settle(fixture);
    expect(q('colour-bar')?.textContent).toContain('kV/m');
    expect(q('colour-bar')?.textContent).toContain('|E|');
    q('map-vorticity')!.querySelector('button')!.click();
    await settle(fixture);
    expect(q('colour-bar')?.textContent).toContain('1/s');
  });

  it('saves the run with the revision: settings, the command line’s summary and a field blob that reads back', async () => {
    await create({ revisionId: 5 });
    await clickSolve();
    jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    let saved = 0;
    fixture.componentInstance.runSaved.subscribe(() => saved++);
    (q('save-run') as HTMLButtonElement).click();
    let req = http.match('/api/revisions/5/runs')[0];
    for (let k = 0; k < 50 && !req; k++) {
      await new Promise((r) => setTimeout(r, 20));
      req = http.match('/api/revisions/5/runs')[0];
    }
    expect(req.request.method).toBe('POST');
    const body = req.request.body as { settings: Record<string, unknown>; summary: Record<string, unknown>; fields: string };
    expect(body.settings['cells']).toBeGreaterThan(0);
    expect(body.settings['cellsAcross']).toBeGreaterThan(0);
    expect((body.summary['ports'] as unknown[]).length).toBe(2);
    expect(body.summary['fields']).toBeUndefined();
    const fields = await readFieldBlob(new Uint8Array(Buffer.from(body.fields, 'base64')));
    expect(fields.nx).toBeGreaterThan(10);
    req.flush({ id: 9 });
    await settle(fixture);
    expect(saved).toBe(1);
    expect(TestBed.inject(Router).navigate).toHaveBeenCalledWith([], expect.objectContaining({ queryParams: { run: 9 } }));
    expect((q('save-run') as HTMLButtonElement).disabled).toBe(true);
    expect(q('save-blocker')?.textContent).toContain('Saved with the revision');
  });

  it('will not save without a revision, nor after the document changed, and viewers see no Save run', async () => {
    await create({ revisionId: null });
    await clickSolve();
    expect((q('save-run') as HTMLButtonElement).disabled).toBe(true);
    expect(q('save-blocker')?.textContent).toContain('Save a revision first');
    fixture.componentRef.setInput('revisionId', 5);
    fixture.componentRef.setInput('document', straight(90));
    await settle(fixture);
    expect(q('stale')).not.toBeNull();
    expect(q('save-blocker')?.textContent).toContain('changed since this solve');
    fixture.componentRef.setInput('readOnly', true);
    await settle(fixture);
    expect(q('save-run')).toBeNull();
  });

  it('cancel ends the solve in flight and leaves the maps as they were', async () => {
    let finish: (o: SolveOutcome) => void = () => undefined;
    const s = fakeSolver({
      solve: () => new Promise<SolveOutcome>((resolve) => (finish = resolve)),
      cancel: jest.fn(() => finish(CANCELLED)),
    });
    await create({ solver: s });
    q('solve')!.click();
    await settle(fixture);
    expect(q('cancel-solve')).not.toBeNull();
    expect(q('solve-status')?.textContent).toContain('%');
    q('cancel-solve')!.click();
    await settle(fixture);
    expect(s.cancel).toHaveBeenCalled();
    expect(el.textContent).toContain('Solve stopped');
    expect(q('solve')).not.toBeNull();
    expect(q('port-results')).toBeNull();
  });

  it('shows a refusal from the solver as an error', async () => {
    await create({ solver: fakeSolver({ solve: async () => ({ ok: false, error: { code: 'no-drive', message: 'Nothing drives current or flow.' } }) }) });
    await clickSolve();
    expect(q('fields-error')?.textContent).toContain('Nothing drives current or flow.');
  });

  it('solves when the design page asks (its Solve button)', async () => {
    await create();
    fixture.componentRef.setInput('solveRequest', 1);
    await settle(fixture);
    await settle(fixture);
    expect(solver.calls).toBe(1);
    expect(all('port-row')).toHaveLength(2);
  });

  it('opens a stored run from ?run= without solving: summary, fields blob and its revision’s document', async () => {
    const doc = straight(1500);
    const outcome = solveOutcome(doc, { cells: 80 });
    if (!outcome.ok) throw new Error('solve failed');
    const blob = await writeFieldBlob(outcome.result.fields);
    await create({ runId: 9, readOnly: true });
    http.expectOne('/api/runs/9').flush({
      id: 9, revisionId: 4, status: 'solved', settings: { cells: 80, cellsAcross: 4, narrowest: 5e-5 },
      summary: runSummary(outcome.result), createdAt: '2026-12-01T10:00:00Z', author: { id: 2, name: 'Jonas Lindqvist' }, hasFields: true,
    });
    await settle(fixture);
    http.expectOne('/api/runs/9/fields').flush(blob.buffer.slice(blob.byteOffset, blob.byteOffset + blob.byteLength));
    http.expectOne('/api/revisions/4').flush({ id: 4, number: 2, note: '', designId: 7, document: doc, createdAt: '2026-12-01T09:00:00Z', author: { id: 2, name: 'Jonas Lindqvist' } });
    for (let k = 0; k < 20 && !q('run-shown'); k++) await settle(fixture, 20);
    expect(q('run-shown')?.textContent).toContain('Stored run 9, by Jonas Lindqvist');
    expect(solver.calls).toBe(0);
    expect(all('port-row')).toHaveLength(2);
    expect(q('fields-hv-caution')?.textContent).toContain('Port A at 1.5 kV');
    expect(q('field-map')).not.toBeNull();
    expect(q('save-run')).toBeNull();
    // Stored with the added figures: they read back.
    expect(all('port-mean-speed').map((c) => Number(c.getAttribute('data-value')))).toEqual(outcome.result.ports.map((p) => p.meanSpeed));
  });

  it('opens a run stored before the mean speed and wall shear rate existed: – in their places, the rest as stored', async () => {
    const doc = straight();
    const outcome = solveOutcome(doc, { cells: 80 });
    if (!outcome.ok) throw new Error('solve failed');
    const blob = await writeFieldBlob(outcome.result.fields);
    const summary = runSummary(outcome.result);
    const older = {
      ...summary,
      ports: summary.ports!.map(({ meanSpeed: _m, ...p }) => p),
      metrics: Object.fromEntries(Object.entries(summary.metrics!).filter(([k]) => k !== 'maxWallShearRate')),
    };
    await create({ runId: 5, readOnly: true });
    http.expectOne('/api/runs/5').flush({
      id: 5, revisionId: 4, status: 'solved', settings: { cells: 80 }, summary: older,
      createdAt: '2026-10-01T10:00:00Z', author: { id: 2, name: 'Jonas Lindqvist' }, hasFields: true,
    });
    await settle(fixture);
    http.expectOne('/api/runs/5/fields').flush(blob.buffer.slice(blob.byteOffset, blob.byteOffset + blob.byteLength));
    http.expectOne('/api/revisions/4').flush({ id: 4, number: 1, note: '', designId: 7, document: doc, createdAt: '2026-10-01T09:00:00Z', author: { id: 2, name: 'Jonas Lindqvist' } });
    for (let k = 0; k < 20 && !q('run-shown'); k++) await settle(fixture, 20);
    expect(all('port-row')).toHaveLength(2);
    expect(all('port-mean-speed').map((c) => c.textContent?.trim())).toEqual(['–', '–']);
    expect(all('port-current').map((c) => Number(c.getAttribute('data-value')))).toEqual(outcome.result.ports.map((p) => p.current));
    expect(q('metric-wall-shear')?.textContent?.trim()).toBe('–');
    expect(q('metric-reynolds')?.textContent?.trim()).not.toBe('–');
  });
});
