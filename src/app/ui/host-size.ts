import { DestroyRef, ElementRef, afterNextRender, inject, signal, type Signal } from '@angular/core';

/** A size in whole CSS pixels. */
export interface Size {
  w: number;
  h: number;
}

/**
 * The host element's size, measured after the first render and again whenever it changes (ResizeObserver);
 * `initial` until the element has one (hidden, or under jsdom). Call it in an injection context, e.g. as a
 * component's field initialiser.
 */
export function hostSize(initial: Size): Signal<Size> {
  const host = inject<ElementRef<HTMLElement>>(ElementRef);
  const destroyRef = inject(DestroyRef);
  const size = signal(initial, { equal: (a, b) => a.w === b.w && a.h === b.h });
  afterNextRender(() => {
    const el = host.nativeElement;
    const measure = () => {
      const r = el.getBoundingClientRect();
      if (r.width > 0 && r.height > 0) size.set({ w: Math.floor(r.width), h: Math.floor(r.height) });
    };
    measure();
    if (typeof ResizeObserver !== 'undefined') {
      const ro = new ResizeObserver(measure);
      ro.observe(el);
      destroyRef.onDestroy(() => ro.disconnect());
    }
  });
  return size.asReadonly();
}
