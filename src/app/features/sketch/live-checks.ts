import { InjectionToken, effect, inject, signal, type Signal } from '@angular/core';
import type { DesignDocument, DesignProblem } from '../../../../shared/design';

export type GeometryChecks = (doc: DesignDocument) => DesignProblem[] | Promise<DesignProblem[]>;

/** No checks: what the sketch shows where no solver worker is provided (tests that do not care about checks). */
export const NO_GEOMETRY_CHECKS: GeometryChecks = () => [];

/**
 * How the sketch runs its live checks (empty layout, self-crossing outlines, slivers, ports off the outline or
 * overlapping, fluid that touches no port, nothing that drives). The app provides the instant worker's
 * (app.config.ts); the sketch asks a moment after the last change and shows the answer
 * when it comes, if the drawing has not changed meanwhile. The default checks nothing: the solver stays off the
 * main thread.
 */
export const GEOMETRY_CHECKS = new InjectionToken<GeometryChecks>('Osmolane live geometry checks', {
  providedIn: 'root',
  factory: () => NO_GEOMETRY_CHECKS,
});

/**
 * The problems the live checks find in a document, asked a moment (200 ms) after its last change; an answer is
 * kept only if the document is still the one it was asked about. Call in an injection context.
 */
export function liveProblemsOf(doc: () => DesignDocument): Signal<DesignProblem[]> {
  const checks = inject(GEOMETRY_CHECKS);
  const problems = signal<DesignProblem[]>([]);
  effect((onCleanup) => {
    const asked = doc();
    const timer = setTimeout(() => {
      Promise.resolve(checks(asked)).then(
        (found) => {
          if (doc() === asked) problems.set(found);
        },
        () => undefined,
      );
    }, 200);
    onCleanup(() => clearTimeout(timer));
  });
  return problems.asReadonly();
}
