import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { SweepView } from './sweep-view';
import { sampleSweep } from './testing';

describe('SweepView', () => {
  let fixture: ComponentFixture<SweepView>;
  let el: HTMLElement;

  async function show(sweep = sampleSweep(), canEdit = true) {
    await TestBed.configureTestingModule({ imports: [SweepView] }).compileComponents();
    fixture = TestBed.createComponent(SweepView);
    fixture.componentRef.setInput('sweep', sweep);
    fixture.componentRef.setInput('canEdit', canEdit);
    fixture.detectChanges();
    await fixture.whenStable();
    el = fixture.nativeElement;
  }

  it('tabulates the points with units and plots each output against the parameter', async () => {
    await show();
    const rows = Array.from(el.querySelectorAll('[data-testid=sweep-row]')).map((r) => Array.from(r.querySelectorAll('td')).map((td) => td.textContent!.trim()));
    expect(rows[0]).toEqual(['1', '50 µm', 'solved', '1 µA', '-1 µA', '10 kV/m', '0', '']);
    expect(rows[2].at(-1)).toBe('high-voltage');
    expect(Array.from(el.querySelectorAll('figcaption')).map((f) => f.textContent)).toEqual(['Port currents', 'Largest field strength', 'Warnings']);
    // Two ports, three points each, in the currents plot.
    expect(el.querySelectorAll('osm-sweep-plot')[0].querySelectorAll('circle.dot').length).toBe(6);
    expect(el.textContent).toContain('Solved point by point by the workers');
  });

  it('picks a point from the plot or the table and offers it as a run to editors', async () => {
    await show();
    const opened: number[] = [];
    fixture.componentInstance.openPoint.subscribe((k) => opened.push(k));
    (el.querySelector('circle.dot[data-index="1"]') as SVGElement).dispatchEvent(new MouseEvent('click', { bubbles: true }));
    fixture.detectChanges();
    expect(el.querySelector('[data-testid=picked-point]')!.textContent).toContain('Point 2');
    (el.querySelector('[data-testid=open-point]') as HTMLButtonElement).click();
    expect(opened).toEqual([1]);
  });

  it('shows a map with a colour bar for two parameters, and no open button for viewers', async () => {
    const base = sampleSweep();
    const p2 = { pointer: '/depth', label: 'Depth', dimension: 'length', range: { kind: 'list' as const, values: [1e-5] }, values: [1e-5] };
    await show({ ...base, parameters: [...base.parameters, p2], points: base.points.map((p) => ({ ...p, values: [...p.values, 1e-5] })) }, false);
    expect(el.querySelector('osm-sweep-map osm-colour-bar svg rect.bar')).not.toBeNull();
    expect(el.querySelectorAll('osm-sweep-map rect.cell').length).toBe(3);
    (el.querySelector('rect.cell[data-index="0"]') as SVGElement).dispatchEvent(new MouseEvent('click', { bubbles: true }));
    fixture.detectChanges();
    expect(el.querySelector('[data-testid=open-point]')).toBeNull();
    expect(el.textContent).toContain('Editors can open this point as a run.');
  });
});
