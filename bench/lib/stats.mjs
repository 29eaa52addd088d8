// Small statistics for benchmark repetitions (medians; paired ratios).

/** Median of finite numbers (mean of the middle two for an even count); null for none. */
export function median(xs) {
  const v = xs.filter((x) => typeof x === 'number' && Number.isFinite(x)).sort((a, b) => a - b);
  if (v.length === 0) return null;
  const m = v.length >> 1;
  return v.length % 2 ? v[m] : (v[m - 1] + v[m]) / 2;
}

/** Median of the per-rep ratios num[i] / den[i] (pairs with a missing side are skipped). */
export function pairedRatio(num, den) {
  const r = [];
  for (let i = 0; i < Math.min(num.length, den.length); i++) {
    if (Number.isFinite(num[i]) && Number.isFinite(den[i]) && den[i] > 0) r.push(num[i] / den[i]);
  }
  return median(r);
}

/** Smallest and largest finite value, for the spread column. */
export function range(xs) {
  const v = xs.filter((x) => Number.isFinite(x));
  return v.length ? [Math.min(...v), Math.max(...v)] : null;
}
