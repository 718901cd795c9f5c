/**
 * Undo and redo over whole-document snapshots. The design document is immutable, so a snapshot is the
 * document object itself; the history only keeps references.
 */
export interface History<T> {
  /** Older states, most recent last. */
  readonly past: readonly T[];
  /** States undone, the next one to redo last. */
  readonly future: readonly T[];
}

export const HISTORY_LIMIT = 200;

export function emptyHistory<T>(): History<T> {
  return { past: [], future: [] };
}

/** Records `before` as the state to return to, after an edit; clears what could be redone. */
export function record<T>(history: History<T>, before: T, limit = HISTORY_LIMIT): History<T> {
  const past = [...history.past, before];
  return { past: past.length > limit ? past.slice(past.length - limit) : past, future: [] };
}

/** Steps back from `current`; null when there is nothing to undo. */
export function undo<T>(history: History<T>, current: T): { history: History<T>; state: T } | null {
  if (history.past.length === 0) return null;
  const state = history.past[history.past.length - 1];
  return { history: { past: history.past.slice(0, -1), future: [...history.future, current] }, state };
}

/** Steps forward again from `current`; null when there is nothing to redo. */
export function redo<T>(history: History<T>, current: T): { history: History<T>; state: T } | null {
  if (history.future.length === 0) return null;
  const state = history.future[history.future.length - 1];
  return { history: { past: [...history.past, current], future: history.future.slice(0, -1) }, state };
}
