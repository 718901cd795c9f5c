import { ComponentFixture, TestBed } from '@angular/core/testing';
import { INSTANT } from '../../core/instant-client';
import { instantComputations } from '../../../workers/instant';
import { MatTooltip } from '@angular/material/tooltip';
import { By } from '@angular/platform-browser';
import { parseDesign, type DesignDocument } from '../../../../shared/design';
import { SketchCanvas } from './sketch-canvas';
import { liveProblems } from '../../../workers/worker-live-checks';
import { GEOMETRY_CHECKS } from './live-checks';
import { SketchEditor } from './sketch-editor';

function design(partial: Partial<DesignDocument> = {}): DesignDocument {
  const r = parseDesign({
    format: 'osmolane.design/1',
    name: 'Test',
    depth: 2e-5,
    buffer: { relativePermittivity: 78.4, viscosity: 8.9e-4, density: 997, conductivity: 0.14, ionicStrength: 10, temperature: 298.15 },
    zeta: { side: -0.05 },
    shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: 1e-3, height: 5e-5, angle: 0 }],
    ports: [],
    ...partial,
  });
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.design;
}

async function settle(fixture: ComponentFixture<unknown>): Promise<void> {
  await new Promise((r) => setTimeout(r, 0));
  await fixture.whenStable();
}

describe('SketchEditor', () => {
  let fixture: ComponentFixture<SketchEditor>;
  let emitted: DesignDocument[];

  async function create(doc: DesignDocument, readOnly = false): Promise<HTMLElement> {
    // The worker's checks, run here in place of the worker (async, as the worker answers).
    await TestBed.configureTestingModule({
      imports: [SketchEditor],
      providers: [{ provide: GEOMETRY_CHECKS, useValue: async (doc: DesignDocument) => liveProblems(doc) }, { provide: INSTANT, useValue: instantComputations }],
    }).compileComponents();
    fixture = TestBed.createComponent(SketchEditor);
    fixture.componentRef.setInput('document', doc);
    fixture.componentRef.setInput('readOnly', readOnly);
    emitted = [];
    fixture.componentInstance.documentChange.subscribe((d) => emitted.push(d));
    fixture.detectChanges();
    await settle(fixture);
    return fixture.nativeElement as HTMLElement;
  }

  function canvas(): SketchCanvas {
    return fixture.debugElement.query((de) => de.componentInstance instanceof SketchCanvas).componentInstance as SketchCanvas;
  }

  /** Fires a pointer sequence on the drawing at a point given in metres. */
  function clickAt(el: HTMLElement, world: [number, number], target?: Element): void {
    const [x, y] = canvas().toScreen(world);
    const svg = el.querySelector('svg.osm-canvas-svg')!;
    const at = target ?? svg;
    const init = { clientX: x, clientY: y, bubbles: true, button: 0 };
    at.dispatchEvent(new MouseEvent('pointerdown', init));
    at.dispatchEvent(new MouseEvent('pointerup', init));
    at.dispatchEvent(new MouseEvent('click', init));
  }

  async function chooseTool(el: HTMLElement, id: string): Promise<void> {
    (el.querySelector(`[data-testid=tool-${id}] button`) as HTMLButtonElement).click();
    await settle(fixture);
  }

  it('shows the tools with their shortcuts', async () => {
    const el = await create(design());
    const labels = [...el.querySelectorAll('[data-testid=sketch-tools] .tool-label')].map((t) => t.textContent?.trim());
    expect(labels).toEqual(['Select', 'Straight', 'Bend', 'Junction', 'Chamber', 'Pillar', 'Freeform', 'Port']);
    const tips = fixture.debugElement.queryAll(By.directive(MatTooltip)).map((d) => d.injector.get(MatTooltip).message);
    expect(tips).toContain('Straight (S): Click the start of the centre line, then its end.');
    expect(tips).toContain('Undo (Ctrl+Z)');
  });

  it('emits a new document when a pillar is placed, and undo and redo step through it', async () => {
    const doc = design();
    const el = await create(doc);
    await chooseTool(el, 'pillar');
    clickAt(el, [5e-4, 0]);
    await settle(fixture);
    expect(emitted).toHaveLength(1);
    const added = emitted[0].shapes[1];
    expect(added).toMatchObject({ op: 'subtract', type: 'circle', radius: 2.5e-5 });
    expect(added.type === 'circle' && added.center[0]).toBeCloseTo(5e-4, 9);
    expect(doc.shapes).toHaveLength(1); // the input was not changed in place

    (el.querySelector('[data-testid=undo]') as HTMLButtonElement).click();
    await settle(fixture);
    expect(emitted[1]).toBe(doc);
    (el.querySelector('[data-testid=redo]') as HTMLButtonElement).click();
    await settle(fixture);
    expect(emitted[2]).toBe(emitted[0]);
  });

  it('draws a straight channel from two clicks on its centre line, with the width from the field', async () => {
    const el = await create(design({ shapes: [] }));
    await chooseTool(el, 'straight');
    const width = el.querySelector('[data-testid=straight-width]') as HTMLInputElement;
    width.value = '40 um';
    width.dispatchEvent(new Event('input'));
    width.dispatchEvent(new Event('blur'));
    await settle(fixture);
    clickAt(el, [0, 0]);
    clickAt(el, [0, 4e-4]);
    await settle(fixture);
    expect(emitted).toHaveLength(1);
    const rect = emitted[0].shapes[0];
    expect(rect).toMatchObject({ type: 'rect', angle: 90 });
    if (rect.type === 'rect') {
      expect(rect.height).toBeCloseTo(4e-5, 12);
      expect(rect.width).toBeCloseTo(4e-4, 9);
      expect(rect.x).toBeCloseTo(2e-5, 9);
    }
  });

  it('puts a port across a channel end, named A, and deletes a selected shape with Del', async () => {
    const el = await create(design());
    await chooseTool(el, 'port');
    clickAt(el, [1e-3, 2e-5]);
    await settle(fixture);
    expect(emitted).toHaveLength(1);
    const port = emitted[0].ports[0];
    expect(port.id).toBe('A');
    expect(port.from[0]).toBeCloseTo(1e-3, 12);
    expect(port.to[0]).toBeCloseTo(1e-3, 12);
    expect(Math.abs(port.to[1] - port.from[1])).toBeCloseTo(5e-5, 12);

    await chooseTool(el, 'select');
    const shape = el.querySelector('[data-testid=shape-0]')!;
    clickAt(el, [5e-4, 2.5e-5], shape);
    await settle(fixture);
    expect(el.querySelector('[data-testid=inspector-heading]')?.textContent).toContain('Rectangle');
    el.querySelector('svg')!.dispatchEvent(new KeyboardEvent('keydown', { key: 'Delete', bubbles: true }));
    await settle(fixture);
    expect(emitted[emitted.length - 1].shapes).toHaveLength(0);
  });

  it('commits an exact dimension typed with units in the side panel', async () => {
    const el = await create(design());
    const shape = el.querySelector('[data-testid=shape-0]')!;
    clickAt(el, [5e-4, 2.5e-5], shape);
    await settle(fixture);
    const height = el.querySelector('[data-testid=field-height]') as HTMLInputElement;
    expect(height.value).toBe('50 µm');
    height.value = '0.08 mm';
    height.dispatchEvent(new Event('input'));
    height.dispatchEvent(new Event('blur'));
    await settle(fixture);
    const rect = emitted[0].shapes[0];
    expect(rect.type === 'rect' && rect.height).toBeCloseTo(8e-5, 12);
  });

  it('drags a chamber, closes a freeform outline with Enter and turns a junction preset into several shapes', async () => {
    const el = await create(design({ shapes: [] }));
    const svg = el.querySelector('svg.osm-canvas-svg')!;
    const fire = (type: string, world: [number, number]) => {
      const [x, y] = canvas().toScreen(world);
      svg.dispatchEvent(new MouseEvent(type, { clientX: x, clientY: y, bubbles: true, button: 0 }));
    };
    await chooseTool(el, 'chamber');
    fire('pointerdown', [0, 0]);
    fire('pointermove', [2e-4, 1e-4]);
    fire('pointerup', [2e-4, 1e-4]);
    await settle(fixture);
    expect(emitted[0].shapes[0]).toMatchObject({ type: 'rect', x: 0, y: 0, angle: 0 });

    await chooseTool(el, 'freeform');
    for (const p of [[3e-4, 0], [5e-4, 0], [4e-4, 2e-4]] as Array<[number, number]>) clickAt(el, p);
    svg.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter', bubbles: true }));
    await settle(fixture);
    const poly = emitted[1].shapes[1];
    expect(poly.type === 'polygon' && poly.points).toHaveLength(3);

    await chooseTool(el, 'junction');
    (el.querySelector('[data-testid=junction-cross] button') as HTMLButtonElement).click();
    await settle(fixture);
    clickAt(el, [0, 6e-4]);
    await settle(fixture);
    expect(emitted[2].shapes).toHaveLength(4);
  });

  it('shows the geometry checks', async () => {
    const el = await create(design());
    await new Promise((r) => setTimeout(r, 200));
    await fixture.whenStable();
    expect(el.querySelector('[data-testid=problems]')?.textContent).toContain('no ports');
  });

  it('hides the tools and undo when read-only', async () => {
    const el = await create(design(), true);
    expect(el.querySelector('[data-testid=sketch-tools]')).toBeNull();
    expect(el.querySelector('[data-testid=undo]')).toBeNull();
    expect(el.querySelector('[data-testid=tool-options]')).toBeNull();
    expect(el.querySelector('[data-testid=read-only-note]')).not.toBeNull();
    el.querySelector('svg')!.dispatchEvent(new KeyboardEvent('keydown', { key: 'o', bubbles: true }));
    clickAt(el, [5e-4, 0]);
    await settle(fixture);
    expect(emitted).toHaveLength(0);
  });
});
