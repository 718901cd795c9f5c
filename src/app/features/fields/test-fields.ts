import type { SolveFields } from '../../../../shared/result';

/**
 * Fields for specs: an nx × ny grid of spacing h from (x0, y0), values from functions of the cell centre,
 * NaN where `fluid` says no.
 */
export function makeFields(
  nx: number,
  ny: number,
  h: number,
  f: Partial<Record<'potential' | 'fieldX' | 'fieldY' | 'velocityX' | 'velocityY' | 'pressure' | 'vorticity' | 'streamfunction', (x: number, y: number) => number>>,
  fluid: (x: number, y: number) => boolean = () => true,
  x0 = 0,
  y0 = 0,
): SolveFields {
  const n = nx * ny;
  const arr = (g?: (x: number, y: number) => number) => {
    const a = new Float32Array(n);
    for (let j = 0; j < ny; j++) {
      for (let i = 0; i < nx; i++) {
        const x = x0 + (i + 0.5) * h, y = y0 + (j + 0.5) * h;
        a[i + j * nx] = fluid(x, y) ? (g ? g(x, y) : 0) : NaN;
      }
    }
    return a;
  };
  const fraction = arr(() => 1).map((v) => (Number.isNaN(v) ? 0 : 1));
  return {
    nx, ny, spacing: h, x0, y0, fraction,
    potential: arr(f.potential), fieldX: arr(f.fieldX), fieldY: arr(f.fieldY),
    velocityX: arr(f.velocityX), velocityY: arr(f.velocityY), pressure: arr(f.pressure),
    vorticity: arr(f.vorticity), streamfunction: arr(f.streamfunction),
  };
}
