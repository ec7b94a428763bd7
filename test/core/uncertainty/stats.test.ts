import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/errors.ts';
import { normalSource } from '../../../core/uncertainty/random.ts';
import { mean, pearson, percentile, ranks, spearman } from '../../../core/uncertainty/stats.ts';

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);

describe('ranks and Spearman correlation', () => {
  it('gives tied values the mean of their ranks (Numerical Recipes §14.6 tie rule)', () => {
    // 7 appears twice at sorted positions 3 and 4 → both get 3.5.
    expect(ranks([5, 6, 7, 8, 7])).toEqual([1, 2, 3.5, 5, 3.5]);
    expect(ranks([2, 2, 2])).toEqual([2, 2, 2]);
  });

  it('matches a hand computation with ties', () => {
    // x = 1..5 → ranks 1..5, deviations from the mean 3: −2, −1, 0, 1, 2 (Σ² = 10).
    // y = 5, 6, 7, 8, 7 → ranks 1, 2, 3.5, 5, 3.5, mean 3, deviations −2, −1, 0.5, 2, 0.5 (Σ² = 9.5).
    // Σ products = 4 + 1 + 0 + 2 + 1 = 8, so ρ = 8/√(10·9.5) = 8/√95 = 0.8207827 (hand arithmetic).
    expect(rel(spearman([1, 2, 3, 4, 5], [5, 6, 7, 8, 7]), 8 / Math.sqrt(95))).toBeLessThan(1e-12);
    expect(rel(spearman([1, 2, 3, 4, 5], [5, 6, 7, 8, 7]), 0.8207827)).toBeLessThan(1e-6);
  });

  it('without ties equals 1 − 6Σd²/(n(n² − 1)) (Spearman 1904)', () => {
    // x ranks 1..5, y = 2, 1, 4, 3, 5 → d = −1, 1, −1, 1, 0, Σd² = 4, ρ = 1 − 24/120 = 0.8.
    expect(rel(spearman([10, 20, 30, 40, 50], [2, 1, 4, 3, 5]), 0.8)).toBeLessThan(1e-12);
    // A monotone but non-linear relation has ρ = 1 exactly; reversed, −1.
    expect(spearman([1, 2, 3, 4], [1, 8, 27, 64])).toBe(1);
    expect(spearman([1, 2, 3, 4], [64, 27, 8, 1])).toBe(-1);
  });

  it('returns 0, not NaN, when a sample has no spread', () => {
    expect(pearson([1, 1, 1], [1, 2, 3])).toBe(0);
    expect(spearman([3, 1, 2], [4, 4, 4])).toBe(0);
  });

  it('refuses unequal lengths, empty and non-finite samples', () => {
    expect(() => spearman([1, 2], [1])).toThrow(InputError);
    expect(() => mean([])).toThrow(InputError);
    expect(() => ranks([1, Number.NaN])).toThrow(/values\.1/);
  });
});

describe('percentiles (Hyndman & Fan 1996, definition 7)', () => {
  it('interpolates between order statistics at h = (n − 1)·p', () => {
    // [1, 2, 3, 4]: p = 0.5 → h = 1.5 → 2.5; p = 0.1 → h = 0.3 → 1.3; p = 0.99 → h = 2.97 → 3.97.
    expect(percentile([4, 1, 3, 2], 0.5)).toBeCloseTo(2.5, 12);
    expect(percentile([4, 1, 3, 2], 0.1)).toBeCloseTo(1.3, 12);
    expect(percentile([4, 1, 3, 2], 0.99)).toBeCloseTo(3.97, 12);
    expect(percentile([7], 0.3)).toBe(7);
    expect(() => percentile([1, 2], 1.5)).toThrow(/\bp\b/);
  });
});

describe('normal deviates from a random seed (xoroshiro128+ via pure-rand, Box–Muller 1958)', () => {
  it('repeat for the same random seed and differ for another', () => {
    const a = normalSource(42);
    const b = normalSource(42);
    const c = normalSource(43);
    const xa = Array.from({ length: 10 }, () => a.normal());
    const xb = Array.from({ length: 10 }, () => b.normal());
    const xc = Array.from({ length: 10 }, () => c.normal());
    expect(xa).toEqual(xb);
    expect(xa).not.toEqual(xc);
  });

  it('have mean 0 and variance 1 within 5 standard errors (N(0,1), Box & Muller 1958)', () => {
    const n = 100_000;
    const g = normalSource(7);
    const xs = Array.from({ length: n }, () => g.normal());
    const m = mean(xs);
    const v = xs.reduce((s, x) => s + (x - m) ** 2, 0) / (n - 1);
    expect(Math.abs(m)).toBeLessThan(5 / Math.sqrt(n)); // SE of the mean = 1/√n
    expect(Math.abs(v - 1)).toBeLessThan(5 * Math.sqrt(2 / n)); // SE of the variance ≈ √(2/n)
    // P(|z| < 1.96) = 0.95 (standard normal table), binomial SE √(0.95·0.05/n).
    const inside = xs.filter((x) => Math.abs(x) < 1.959964).length / n;
    expect(Math.abs(inside - 0.95)).toBeLessThan(5 * Math.sqrt((0.95 * 0.05) / n));
  });

  it('refuse a non-integer random seed', () => {
    expect(() => normalSource(1.5)).toThrow(/seed/);
  });
});
