import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { latestOf } from './instant-client';

/** A worker call the test answers by hand. */
function manualWork() {
  const calls: Array<{ value: number; answer: (r: string) => void }> = [];
  const work = (value: number) => new Promise<string>((answer) => calls.push({ value, answer }));
  return { calls, work };
}

describe('latestOf', () => {
  async function setUp(work: (v: number) => Promise<string>) {
    const source = signal(1);
    @Component({ selector: 'osm-latest-host', template: '' })
    class Host {
      readonly out = latestOf(source, work, 'none');
    }
    const fixture = TestBed.createComponent(Host);
    const settle = async () => {
      fixture.detectChanges();
      await fixture.whenStable();
      await new Promise((r) => setTimeout(r, 0));
    };
    await settle();
    return { source, out: fixture.componentInstance.out, settle, fixture };
  }

  it('keeps its last answer while a call is out, and coalesces changes into one call with the newest value', async () => {
    const { calls, work } = manualWork();
    const { source, out, settle } = await setUp(work);
    expect(out()).toBe('none');
    expect(calls.map((c) => c.value)).toEqual([1]);

    // Three changes while the first call is out: no call yet, the initial value still shown.
    for (const v of [2, 3, 4]) {
      source.set(v);
      await settle();
    }
    expect(calls.map((c) => c.value)).toEqual([1]);
    expect(out()).toBe('none');

    // The first answer shows, and one more call goes out with the newest value only.
    calls[0].answer('for 1');
    await settle();
    expect(out()).toBe('for 1');
    expect(calls.map((c) => c.value)).toEqual([1, 4]);

    calls[1].answer('for 4');
    await settle();
    expect(out()).toBe('for 4');
    expect(calls).toHaveLength(2);
  });

  it('goes on after a failed call, and stops answering once its host is gone', async () => {
    const { calls, work } = manualWork();
    const failing = (v: number) => (v === 2 ? Promise.reject(new Error('worker failed')) : work(v));
    const { source, out, settle, fixture } = await setUp(failing);
    calls[0].answer('for 1');
    await settle();
    source.set(2);
    await settle();
    expect(out()).toBe('for 1');
    source.set(3);
    await settle();
    expect(calls.map((c) => c.value)).toEqual([1, 3]);
    fixture.destroy();
    calls[1].answer('for 3');
    await new Promise((r) => setTimeout(r, 0));
    expect(out()).toBe('for 1');
  });

  it('makes no call when the source gives the same value again (a document edit that keeps its shapes)', async () => {
    const shapes = [{ kind: 'a' }];
    const doc = signal({ name: 'first', shapes });
    const calls: unknown[] = [];
    @Component({ selector: 'osm-same-host', template: '' })
    class Host {
      readonly out = latestOf(() => doc().shapes, async (s) => (calls.push(s), s.length), -1);
    }
    const fixture = TestBed.createComponent(Host);
    const settle = async () => {
      fixture.detectChanges();
      await fixture.whenStable();
      await new Promise((r) => setTimeout(r, 0));
    };
    await settle();
    doc.set({ name: 'renamed', shapes });
    await settle();
    expect(calls).toHaveLength(1);
    doc.set({ name: 'renamed', shapes: [...shapes, { kind: 'b' }] });
    await settle();
    expect(calls).toHaveLength(2);
    expect(fixture.componentInstance.out()).toBe(2);
  });
});
