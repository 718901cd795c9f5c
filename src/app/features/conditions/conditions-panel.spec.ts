import { ComponentFixture, TestBed } from '@angular/core/testing';
import { INSTANT } from '../../core/instant-client';
import { instantComputations } from '../../../workers/instant';
import { of } from 'rxjs';
import { parseDesign, type DesignDocument } from '../../../../shared/design';
import { SketchCanvas } from '../sketch/sketch-canvas';
import { CONDITIONS_LIBRARY, type ConditionsLibrary } from './buffer-library';
import { ConditionsPanel } from './conditions-panel';

function design(): DesignDocument {
  const r = parseDesign({
    format: 'osmolane.design/1',
    name: 'T',
    depth: 2e-5,
    buffer: { relativePermittivity: 78.4, viscosity: 8.9e-4, density: 997, conductivity: 0.14, ionicStrength: 10, temperature: 298.15 },
    zeta: { side: -0.05 },
    shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: 1e-3, height: 5e-5 }],
    ports: [
      { id: 'A', from: [0, 0], to: [0, 5e-5], potential: 0 },
      { id: 'B', from: [1e-3, 0], to: [1e-3, 5e-5], potential: 0 },
    ],
  });
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.design;
}

const library: ConditionsLibrary = {
  buffers: () => of([{ id: 1, name: 'Borate 10 mM', source: 'test', values: { conductivity: 0.05, ionicStrength: 10 } }]),
  walls: () => of([{ id: 2, name: 'Glass', source: 'test', values: { mobility: 4e-8 } }]),
};

async function settle(fixture: ComponentFixture<unknown>): Promise<void> {
  await new Promise((r) => setTimeout(r, 0));
  await fixture.whenStable();
}

describe('ConditionsPanel', () => {
  let fixture: ComponentFixture<ConditionsPanel>;
  let emitted: DesignDocument[];
  let el: HTMLElement;

  async function create(doc: DesignDocument, readOnly = false): Promise<void> {
    await TestBed.configureTestingModule({ imports: [ConditionsPanel], providers: [{ provide: CONDITIONS_LIBRARY, useValue: library }, { provide: INSTANT, useValue: instantComputations }] }).compileComponents();
    fixture = TestBed.createComponent(ConditionsPanel);
    fixture.componentRef.setInput('document', doc);
    fixture.componentRef.setInput('readOnly', readOnly);
    emitted = [];
    fixture.componentInstance.documentChange.subscribe((d) => emitted.push(d));
    fixture.detectChanges();
    await settle(fixture);
    el = fixture.nativeElement;
  }

  function input(testid: string): HTMLInputElement {
    return el.querySelector(`[data-testid="${testid}"]`) as HTMLInputElement;
  }

  async function type(testid: string, text: string): Promise<void> {
    const i = input(testid);
    i.value = text;
    i.dispatchEvent(new Event('input'));
    i.dispatchEvent(new Event('blur'));
    await settle(fixture);
  }

  it('takes a potential in kV, emits the document in volts, and shows the high-voltage caution', async () => {
    await create(design());
    expect(el.querySelector('[data-testid=hv-caution]')).toBeNull();
    await type('potential-A', '1.2 kV');
    expect(emitted).toHaveLength(1);
    expect(emitted[0].ports[0].potential).toBeCloseTo(1200, 9);
    expect(input('potential-A').value).toBe('1.2 kV');
    const caution = el.querySelector('[data-testid=hv-caution]')?.textContent ?? '';
    expect(caution).toContain('Port A at 1.2 kV');
    expect(caution).toContain('can kill');
    expect(caution).toMatch(/never touch reservoirs/i);
  });

  it('turns a head of buffer into pressure with the buffer density', async () => {
    await create(design());
    (el.querySelector('[data-testid=level-head] button') as HTMLButtonElement).click();
    await settle(fixture);
    await type('level-B', '3 mm');
    expect(emitted[0].ports[1].pressure).toBeCloseTo(997 * 9.80665 * 0.003, 9);
    expect(input('level-B').value).toBe('3 mm');
    (el.querySelector('[data-testid=level-pressure] button') as HTMLButtonElement).click();
    await settle(fixture);
    expect(input('level-B').value).toBe('29.3317 Pa');
  });

  it('says what is wrong with a value, with the unit it wants', async () => {
    await create(design());
    await type('potential-A', '50 um');
    expect(emitted).toHaveLength(0);
    expect(el.querySelector('mat-error')?.textContent).toContain('"50 um" is a length; enter a potential, e.g. 1.2 kV or -40 mV');
    await type('depth', '-5 um');
    expect(el.textContent).toContain('Must be greater than 0 µm');
  });

  it('makes a port floating and disables its potential', async () => {
    await create(design());
    (el.querySelector('[data-testid=floating-B] button') as HTMLButtonElement).click();
    await settle(fixture);
    expect(emitted[0].ports[1].potential).toBeNull();
    expect(input('potential-B').disabled).toBe(true);
  });

  it('shows the mobility for a zeta and sets zeta from a mobility', async () => {
    await create(design());
    expect(input('mobility-side').value).toBe('3.9 × 10⁻⁸ m²/(V·s)');
    await type('mobility-floor', '4.5e-8 m^2/V/s');
    const zeta = emitted[0].zeta.floor;
    expect(zeta).toBeCloseTo((-4.5e-8 * 8.9e-4) / (78.4 * 8.8541878188e-12), 9);
    expect(input('zeta-floor').value).toBe(`${+(zeta * 1e3).toPrecision(6)} mV`);
  });

  it('loads a buffer from the library', async () => {
    await create(design());
    (el.querySelector('[data-testid=buffer-library]') as HTMLButtonElement).click();
    await settle(fixture);
    const item = [...document.querySelectorAll('.mat-mdc-menu-item')].find((b) => b.textContent?.includes('Borate')) as HTMLButtonElement;
    item.click();
    await settle(fixture);
    expect(emitted[0].buffer).toMatchObject({ conductivity: 0.05, ionicStrength: 10, density: 997 });
  });

  it('adds a wall zone by numbers', async () => {
    await create(design());
    (el.querySelector('[data-testid=add-zone]') as HTMLButtonElement).click();
    await settle(fixture);
    expect(emitted[0].wallZones).toHaveLength(1);
    expect(el.querySelector('[data-testid=zone-0]')).not.toBeNull();
  });

  it('draws a wall zone on the layout', async () => {
    await create(design());
    (el.querySelector('[data-testid=draw-zone]') as HTMLButtonElement).click();
    await settle(fixture);
    const canvas = fixture.debugElement.query((de) => de.componentInstance instanceof SketchCanvas).componentInstance as SketchCanvas;
    const svg = el.querySelector('svg.osm-canvas-svg')!;
    const fire = (type: string, world: [number, number]) => {
      const [x, y] = canvas.toScreen(world);
      svg.dispatchEvent(new MouseEvent(type, { clientX: x, clientY: y, bubbles: true, button: 0 }));
    };
    fire('pointerdown', [2e-4, -1e-4]);
    fire('pointermove', [4e-4, 1e-4]);
    fire('pointerup', [4e-4, 1e-4]);
    await settle(fixture);
    const zone = emitted[0].wallZones[0];
    expect(zone.zeta).toBe(-0.05);
    expect(zone.region.type).toBe('rect');
    if (zone.region.type === 'rect') {
      expect(zone.region.width).toBeGreaterThan(1e-4);
      expect(zone.region.height).toBeGreaterThan(1e-4);
    }
  });

  it('is read-only for a viewer', async () => {
    await create(design(), true);
    expect(input('potential-A').disabled).toBe(true);
    expect(input('depth').disabled).toBe(true);
    expect(el.querySelector('[data-testid=add-zone]')).toBeNull();
  });
});
