import type { DesignDocument } from '../../core/api-types';

/** JSON with object keys sorted, so that two documents compare by content, not by key order. */
export function canonicalJson(value: unknown): string {
  return JSON.stringify(value, (_key, v: unknown) =>
    v && typeof v === 'object' && !Array.isArray(v)
      ? Object.fromEntries(Object.entries(v as Record<string, unknown>).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)))
      : v,
  );
}

/** True when the two documents describe the same design (same content in any key order). */
export function sameDocument(a: DesignDocument | null | undefined, b: DesignDocument | null | undefined): boolean {
  if (!a || !b) return false;
  return a === b || canonicalJson(a) === canonicalJson(b);
}
