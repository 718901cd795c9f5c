/** Small statistics over samples: mean, variance (unbiased), least-squares slope. */
export function mean(xs: ArrayLike<number>): number {
  let s = 0;
  for (let k = 0; k < xs.length; k++) s += xs[k];
  return xs.length ? s / xs.length : NaN;
}

export function variance(xs: ArrayLike<number>): number {
  const n = xs.length;
  if (n < 2) return NaN;
  const m = mean(xs);
  let s = 0;
  for (let k = 0; k < n; k++) s += (xs[k] - m) ** 2;
  return s / (n - 1);
}

/** Slope of the least-squares line y = a + b x. */
export function slope(xs: ArrayLike<number>, ys: ArrayLike<number>): number {
  const mx = mean(xs);
  const my = mean(ys);
  let sxy = 0;
  let sxx = 0;
  for (let k = 0; k < xs.length; k++) {
    sxy += (xs[k] - mx) * (ys[k] - my);
    sxx += (xs[k] - mx) ** 2;
  }
  return sxx > 0 ? sxy / sxx : NaN;
}

/** Counts of samples in `bins` equal bins over [lo, hi]. */
export function histogram(xs: ArrayLike<number>, lo: number, hi: number, bins: number): number[] {
  const counts = new Array<number>(bins).fill(0);
  const w = (hi - lo) / bins;
  for (let k = 0; k < xs.length; k++) {
    const b = Math.min(bins - 1, Math.max(0, Math.floor((xs[k] - lo) / w)));
    counts[b]++;
  }
  return counts;
}
