import { ChangeDetectionStrategy, Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { plotArea } from './plot-area';

@Component({ template: '', changeDetection: ChangeDetectionStrategy.OnPush })
class Host {
  readonly height = signal(200);
  readonly left = signal(50);
  readonly area = plotArea({ left: 50, right: 10, top: 5, bottom: 15 }, 300, () => this.height(), () => this.left());
}

function rect(width: number, height: number): DOMRect {
  return { width, height, x: 0, y: 0, left: 0, top: 0, right: width, bottom: height, toJSON: () => ({}) };
}

async function render(width: number, height: number) {
  await TestBed.configureTestingModule({ imports: [Host] }).compileComponents();
  const fixture = TestBed.createComponent(Host);
  jest.spyOn(fixture.nativeElement as HTMLElement, 'getBoundingClientRect').mockReturnValue(rect(width, height));
  fixture.detectChanges();
  await fixture.whenStable();
  return fixture.componentInstance;
}

describe('plotArea', () => {
  it('takes the host’s measured width in whole pixels, and the area inside the margins', async () => {
    const host = await render(420.7, 200);
    expect(host.area.width()).toBe(420);
    expect(host.area.innerW()).toBe(360);
    expect(host.area.innerH()).toBe(180);
    host.left.set(80);
    host.height.set(150);
    expect(host.area.innerW()).toBe(330);
    expect(host.area.innerH()).toBe(130);
  });

  it('keeps the starting width while the host has no size, and at least 40 px of area', async () => {
    const host = await render(0, 0);
    expect(host.area.width()).toBe(300);
    host.height.set(30);
    host.left.set(290);
    expect(host.area.innerH()).toBe(40);
    expect(host.area.innerW()).toBe(40);
  });
});
