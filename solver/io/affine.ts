/**
 * 2D affine maps as SVG writes them, [a b c d e f]: x' = a x + c y + e, y' = b x + d y + f; the `transform`
 * attribute's grammar (SVG 1.1 §7.6: matrix, translate, scale, rotate, skewX, skewY).
 */
import type { Vec2 } from '../geometry/ring';

export type Affine = readonly [number, number, number, number, number, number];

export const IDENTITY: Affine = [1, 0, 0, 1, 0, 0];

/** m ∘ n: apply n first, then m. */
export function compose(m: Affine, n: Affine): Affine {
  return [
    m[0] * n[0] + m[2] * n[1],
    m[1] * n[0] + m[3] * n[1],
    m[0] * n[2] + m[2] * n[3],
    m[1] * n[2] + m[3] * n[3],
    m[0] * n[4] + m[2] * n[5] + m[4],
    m[1] * n[4] + m[3] * n[5] + m[5],
  ];
}

export function apply(m: Affine, p: Vec2): Vec2 {
  return [m[0] * p[0] + m[2] * p[1] + m[4], m[1] * p[0] + m[3] * p[1] + m[5]];
}

export function determinant(m: Affine): number {
  return m[0] * m[3] - m[1] * m[2];
}

/** The uniform scale factor when m maps circles to circles (rotation, reflection, uniform scale), else null. */
export function similarityScale(m: Affine): number | null {
  const k1 = Math.hypot(m[0], m[1]);
  const k2 = Math.hypot(m[2], m[3]);
  const dot = m[0] * m[2] + m[1] * m[3];
  if (!(k1 > 0) || Math.abs(k1 - k2) > 1e-9 * k1 || Math.abs(dot) > 1e-9 * k1 * k2) return null;
  return k1;
}

export class TransformSyntaxError extends Error {}

/** Parses a `transform` attribute; throws TransformSyntaxError naming the problem. */
export function parseTransform(text: string): Affine {
  let m: Affine = IDENTITY;
  const re = /\s*(matrix|translate|scale|rotate|skewX|skewY)\s*\(([^)]*)\)\s*,?/gy;
  let k = 0;
  const body = text.trim();
  while (k < body.length) {
    re.lastIndex = k;
    const hit = re.exec(body);
    if (!hit) throw new TransformSyntaxError(`cannot read the transform "${body.slice(k, k + 30)}"`);
    k = re.lastIndex;
    const nums = hit[2].trim() === '' ? [] : hit[2].trim().split(/[\s,]+/).map(Number);
    if (nums.some((v) => !Number.isFinite(v))) throw new TransformSyntaxError(`bad number in ${hit[1]}(${hit[2]})`);
    const need = (...counts: number[]) => {
      if (!counts.includes(nums.length)) throw new TransformSyntaxError(`${hit[1]} takes ${counts.join(' or ')} numbers, got ${nums.length}`);
    };
    let t: Affine;
    switch (hit[1]) {
      case 'matrix':
        need(6);
        t = [nums[0], nums[1], nums[2], nums[3], nums[4], nums[5]];
        break;
      case 'translate':
        need(1, 2);
        t = [1, 0, 0, 1, nums[0], nums[1] ?? 0];
        break;
      case 'scale':
        need(1, 2);
        t = [nums[0], 0, 0, nums[1] ?? nums[0], 0, 0];
        break;
      case 'rotate': {
        need(1, 3);
        const r = (nums[0] * Math.PI) / 180;
        const rot: Affine = [Math.cos(r), Math.sin(r), -Math.sin(r), Math.cos(r), 0, 0];
        if (nums.length === 3) {
          const [, cx, cy] = nums;
          t = compose(compose([1, 0, 0, 1, cx, cy], rot), [1, 0, 0, 1, -cx, -cy]);
        } else {
          t = rot;
        }
        break;
      }
      case 'skewX':
        need(1);
        t = [1, 0, Math.tan((nums[0] * Math.PI) / 180), 1, 0, 0];
        break;
      default:
        need(1);
        t = [1, Math.tan((nums[0] * Math.PI) / 180), 0, 1, 0, 0];
    }
    m = compose(m, t);
  }
  return m;
}
