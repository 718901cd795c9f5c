import { DestroyRef, InjectionToken, computed, effect, inject, signal, untracked, type Signal } from '@angular/core';
import type { Shape } from '../../../shared/design';
import type { InstantApi, OutlineRings } from '../../workers/instant-api';
import type { GeometryChecks } from '../features/sketch/live-checks';

export type { DistanceAxis, EdlInputs, EdlView, InstantApi, OutlineRings, PinchedPlug, PresetOutcome } from '../../workers/instant-api';

/**
 * The instant worker (src/workers/instant.worker.ts): outline, live checks, double layer and presets. The app
 * provides the worker (app.config.ts); component tests provide `instantComputations` in-process.
 */
export const INSTANT = new InjectionToken<InstantApi>('Osmolane instant worker');

/**
 * A signal that follows `work(source())` computed elsewhere (in a worker): it keeps its last answer until the
 * next one arrives, and while one call is out, changes coalesce into one more call with the newest value, so a
 * drag does not queue a call per pointer move. A source that gives the same value again (Object.is) makes no
 * call: `() => doc().shapes` asks again only when the shapes change, not on every edit of the document. Call in an
 * injection context.
 */
export function latestOf<T, R>(source: () => T, work: (value: T) => Promise<R>, initial: R): Signal<R> {
  const input = computed(source);
  const out = signal<R>(initial);
  let alive = true;
  let busy = false;
  let pending: { value: T } | null = null;
  inject(DestroyRef).onDestroy(() => (alive = false));
  const run = (value: T) => {
    busy = true;
    work(value)
      .then((r) => alive && out.set(r), () => undefined)
      .finally(() => {
        busy = false;
        const next = pending;
        pending = null;
        if (alive && next) run(next.value);
      });
  };
  effect(() => {
    const value = input();
    untracked(() => (busy ? (pending = { value }) : run(value)));
  });
  return out.asReadonly();
}

/** The fluid outline of shapes (rings in metres), from the instant worker. Call in an injection context. */
export function fluidOutlineOf(shapes: () => Shape[]): Signal<OutlineRings> {
  const instant = inject(INSTANT);
  return latestOf(shapes, (s) => instant.outline(s), []);
}

/** The sketch's GEOMETRY_CHECKS in the app: the instant worker's. */
export function instantGeometryChecks(): GeometryChecks {
  const instant = inject(INSTANT);
  return (doc) => instant.checkGeometry(doc);
}
