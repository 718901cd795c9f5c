/** Lengths and places in plain words for problem messages (the UI also gets `at` in metres). */
export function formatLength(metres: number): string {
  const a = Math.abs(metres);
  if (!Number.isFinite(metres)) return String(metres);
  if (a >= 1e-3) return `${+(metres * 1e3).toPrecision(3)} mm`;
  if (a >= 1e-6 || a === 0) return `${+(metres * 1e6).toPrecision(3)} µm`;
  return `${+(metres * 1e9).toPrecision(3)} nm`;
}

export function formatPoint(p: readonly [number, number]): string {
  return `(${+(p[0] * 1e6).toPrecision(4)} µm, ${+(p[1] * 1e6).toPrecision(4)} µm)`;
}
