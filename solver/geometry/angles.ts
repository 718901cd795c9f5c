/**
 * Cosine and sine of an angle in degrees, exact at whole quarter turns so that
 * rectangles turned by 90° stay aligned with the grid to the last bit.
 */
export function cosSinDeg(degrees: number): [number, number] {
  const turn = ((degrees % 360) + 360) % 360;
  if (turn === 0) return [1, 0];
  if (turn === 90) return [0, 1];
  if (turn === 180) return [-1, 0];
  if (turn === 270) return [0, -1];
  const radians = (turn * Math.PI) / 180;
  return [Math.cos(radians), Math.sin(radians)];
}

export const DEG = Math.PI / 180;
