import { TestBed } from '@angular/core/testing';
import { PortTable, type PortRow } from './port-table';

/** Two ports of a straight channel 50 µm wide and 20 µm deep carrying 60 nL/min: |Q| / (w d) = 1 mm/s. */
const Q = 1e-12;
const rows: PortRow[] = [
  { id: 'A', name: 'inlet', floating: false, potential: 40, current: 2.8e-6, flowRate: Q, meanSpeed: Q / (5e-5 * 2e-5) },
  { id: 'B', name: 'outlet', floating: false, potential: 0, current: -2.8e-6, flowRate: -Q, meanSpeed: Q / (5e-5 * 2e-5) },
];

async function render(ports: PortRow[]): Promise<HTMLElement> {
  await TestBed.configureTestingModule({ imports: [PortTable] }).compileComponents();
  const fixture = TestBed.createComponent(PortTable);
  fixture.componentRef.setInput('ports', ports);
  fixture.detectChanges();
  await fixture.whenStable();
  return fixture.nativeElement as HTMLElement;
}

const cells = (el: HTMLElement, testid: string) => Array.from(el.querySelectorAll(`[data-testid="${testid}"]`)).map((c) => c.textContent?.trim());

describe('PortTable', () => {
  it('shows each port’s mean speed with its unit, from the one unit formatter', async () => {
    const el = await render(rows);
    const headers = Array.from(el.querySelectorAll('th')).map((h) => h.textContent?.replace('info', '').trim());
    expect(headers).toEqual(['Port', 'Potential', 'Current', 'Flow', 'Speed']);
    expect(cells(el, 'port-mean-speed')).toEqual(['1 mm/s', '1 mm/s']);
    expect(cells(el, 'port-flow')).toEqual(['60 nL/min', '-60 nL/min']);
    expect(el.querySelector('[data-testid="port-mean-speed"]')?.getAttribute('data-value')).toBe(String(Q / (5e-5 * 2e-5)));
  });

  it('writes slow legs in µm/s', async () => {
    const el = await render([{ ...rows[0], meanSpeed: 2.5e-5 }]);
    expect(cells(el, 'port-mean-speed')).toEqual(['25 µm/s']);
  });

  it('shows – for a stored run from before the mean speed, and still balances the rest', async () => {
    const older = rows.map(({ meanSpeed: _m, ...p }) => p);
    const el = await render(older);
    expect(cells(el, 'port-mean-speed')).toEqual(['–', '–']);
    expect(cells(el, 'port-flow')).toEqual(['60 nL/min', '-60 nL/min']);
    expect(el.querySelector('[data-testid="flow-sum"]')?.textContent?.trim()).toBe('≈ 0');
  });
});
