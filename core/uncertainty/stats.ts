/**
 * Sample statistics for the Monte Carlo summaries.
 *
 * Percentiles: linear interpolation between order statistics at h = (n − 1)·p, definition 7
 * of Hyndman & Fan, "Sample Quantiles in Statistical Packages", Am. Statistician 50(4), 1996
 * (the default of R and NumPy). Spearman's rank correlation: Pearson's correlation of the
 * ranks, ties given the mean of the ranks they span (Spearman 1904; the tie rule is the usual
 * one, e.g. Press et al., Numerical Recipes, §14.6).
 */
import { InputError, requireFinite } from '../errors.ts';

function finiteArray(field: string, xs: readonly number[]): void {
  if (xs.length === 0) throw new InputError(field, xs.length, 'at least one value');
  xs.forEach((x, i) => requireFinite(`${field}.${i}`, x));
}

export function mean(xs: readonly number[], field = 'values'): number {
  finiteArray(field, xs);
  let s = 0;
  for (const x of xs) s += x;
  return s / xs.length;
}

/** Percentile p ∈ [0, 1] of values already sorted ascending (Hyndman–Fan definition 7). */
export function percentileSorted(sorted: readonly number[], p: number): number {
  requireFinite('p', p, 0, 1);
  if (sorted.length === 0) throw new InputError('values', 0, 'at least one value');
  const h = (sorted.length - 1) * p;
  const lo = Math.floor(h);
  const a = sorted[lo] as number;
  const b = sorted[Math.min(lo + 1, sorted.length - 1)] as number;
  return a + (h - lo) * (b - a);
}

export function percentile(xs: readonly number[], p: number, field = 'values'): number {
  finiteArray(field, xs);
  return percentileSorted(
    [...xs].sort((a, b) => a - b),
    p,
  );
}

/** Ranks 1..n, tied values sharing the mean of their ranks. */
export function ranks(xs: readonly number[], field = 'values'): number[] {
  finiteArray(field, xs);
  const order = xs.map((_, i) => i).sort((i, j) => (xs[i] as number) - (xs[j] as number));
  const r = new Array<number>(xs.length).fill(0);
  let start = 0;
  while (start < order.length) {
    let end = start;
    const v = xs[order[start] as number] as number;
    while (end + 1 < order.length && xs[order[end + 1] as number] === v) end++;
    const shared = (start + end) / 2 + 1;
    for (let i = start; i <= end; i++) r[order[i] as number] = shared;
    start = end + 1;
  }
  return r;
}

/** Pearson's correlation; 0 when either sample has no spread (no information, not NaN). */
export function pearson(xs: readonly number[], ys: readonly number[]): number {
  if (xs.length !== ys.length)
    throw new InputError('ys.length', ys.length, `equal to xs.length ${xs.length}`);
  const mx = mean(xs, 'xs');
  const my = mean(ys, 'ys');
  let sxy = 0;
  let sxx = 0;
  let syy = 0;
  for (let i = 0; i < xs.length; i++) {
    const dx = (xs[i] as number) - mx;
    const dy = (ys[i] as number) - my;
    sxy += dx * dy;
    sxx += dx * dx;
    syy += dy * dy;
  }
  if (sxx === 0 || syy === 0) return 0;
  return Math.max(-1, Math.min(1, sxy / Math.sqrt(sxx * syy)));
}

export function spearman(xs: readonly number[], ys: readonly number[]): number {
  if (xs.length !== ys.length)
    throw new InputError('ys.length', ys.length, `equal to xs.length ${xs.length}`);
  return pearson(ranks(xs, 'xs'), ranks(ys, 'ys'));
}
