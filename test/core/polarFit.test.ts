import { describe, expect, it } from 'vitest';
import { InputError } from '../../core/errors.ts';
import { fitPolar, type PolarFitPoint } from '../../core/polarFit.ts';

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);

/** Points on CD = CD0 + k·(CL − CLminD)² (the parabolic polar, Anderson, Intro. to Flight, ch. 6). */
function polarPoints(CD0: number, k: number, CLminD: number, CLs: number[]): PolarFitPoint[] {
  return CLs.map((CL) => ({ CL, CD: CD0 + k * (CL - CLminD) ** 2 }));
}

const CLS = Array.from({ length: 17 }, (_, i) => -0.2 + 0.1 * i); // −0.2 … 1.4

/** Deterministic pseudo-noise in [−1, 1] (a fixed sine sequence, no random generator). */
const noise = (i: number): number => Math.sin(12.9898 * (i + 1)) * Math.cos(78.233 * (i + 1));

function expectRefusal(fn: () => unknown): InputError {
  try {
    fn();
  } catch (err) {
    expect(err).toBeInstanceOf(InputError);
    expect((err as InputError).field).toBe('points');
    return err as InputError;
  }
  throw new Error('expected an InputError naming points');
}

describe('fitPolar recovers known coefficients', () => {
  it('exactly from noiseless points, with offset', () => {
    // Synthetic points from the model itself: least squares must return the generating
    // coefficients to rounding (property of linear least squares, common practice).
    const fit = fitPolar(polarPoints(0.025, 0.045, 0.12, CLS), { withOffset: true });
    expect(rel(fit.CD0, 0.025)).toBeLessThan(1e-9);
    expect(rel(fit.k, 0.045)).toBeLessThan(1e-9);
    expect(rel(fit.CLminD, 0.12)).toBeLessThan(1e-9);
    expect(rel(fit.rSquared, 1)).toBeLessThan(1e-9);
    expect(fit.rmse).toBeLessThan(1e-12);
    expect(fit.residuals).toHaveLength(CLS.length);
  });

  it('exactly from noiseless points, symmetric polar (the default)', () => {
    // Synthetic points from the model itself (common practice, as above).
    const fit = fitPolar(polarPoints(0.031, 0.062, 0, CLS));
    expect(rel(fit.CD0, 0.031)).toBeLessThan(1e-9);
    expect(rel(fit.k, 0.062)).toBeLessThan(1e-9);
    expect(fit.CLminD).toBe(0);
  });

  it('exactly from the minimum number of points', () => {
    // Three points determine the parabola, two the symmetric one (interpolation, common practice).
    const three = fitPolar(polarPoints(0.02, 0.05, 0.15, [0.1, 0.6, 1.1]), { withOffset: true });
    expect(rel(three.CLminD, 0.15)).toBeLessThan(1e-9);
    const two = fitPolar(polarPoints(0.02, 0.05, 0, [0.2, 0.9]));
    expect(rel(two.k, 0.05)).toBeLessThan(1e-9);
  });

  it('closely from noisy points, and reports the fit quality consistently', () => {
    // Synthetic points plus ±2e-4 deterministic noise in CD (common practice for a fit test).
    const clean = polarPoints(0.025, 0.045, 0.12, CLS);
    const noisy = clean.map((p, i) => ({ CL: p.CL, CD: p.CD + 2e-4 * noise(i) }));
    const fit = fitPolar(noisy, { withOffset: true });
    expect(fit.rSquared).toBeLessThan(1);
    expect(fit.rSquared).toBeGreaterThan(0.99);
    expect(rel(fit.CD0, 0.025)).toBeLessThan(0.02);
    expect(rel(fit.k, 0.045)).toBeLessThan(0.02);
    expect(Math.abs(fit.CLminD - 0.12)).toBeLessThan(0.02);
    // rmse² = mean of squared residuals; residual = measured − fitted (definitions).
    const meanSq = fit.residuals.reduce((s, r) => s + r * r, 0) / noisy.length;
    expect(rel(fit.rmse, Math.sqrt(meanSq))).toBeLessThan(1e-12);
    const i = 5;
    const CL = noisy[i]?.CL ?? 0;
    const fitted = fit.CD0 + fit.k * (CL - fit.CLminD) ** 2;
    expect(Math.abs((fit.residuals[i] ?? 0) - ((noisy[i]?.CD ?? 0) - fitted))).toBeLessThan(1e-15);
    // Least squares with an intercept: the residuals sum to zero (normal equations).
    expect(Math.abs(fit.residuals.reduce((s, r) => s + r, 0))).toBeLessThan(1e-14);
  });
});

describe('fitPolar refuses what it cannot fit', () => {
  it('too few points', () => {
    expectRefusal(() => fitPolar(polarPoints(0.02, 0.05, 0, [0.2, 0.9]), { withOffset: true }));
    expectRefusal(() => fitPolar(polarPoints(0.02, 0.05, 0, [0.5])));
    expectRefusal(() => fitPolar([]));
  });

  it('non-finite values', () => {
    const pts = polarPoints(0.02, 0.05, 0, [0.2, 0.5, 0.9]);
    expectRefusal(() => fitPolar([...pts, { CL: NaN, CD: 0.03 }]));
    expectRefusal(() => fitPolar([...pts, { CL: 0.4, CD: Infinity }]));
  });

  it('a fit with k ≤ 0 or CD0 ≤ 0, and points that do not determine the parabola', () => {
    // CD falling with CL²: k < 0.
    expectRefusal(() => fitPolar(polarPoints(0.05, -0.01, 0, [0.2, 0.5, 0.9])));
    // Constant CD: k = 0.
    expectRefusal(() => fitPolar(polarPoints(0.05, 0, 0, [0.2, 0.5, 0.9])));
    // Negative minimum drag coefficient.
    expectRefusal(() => fitPolar(polarPoints(-0.01, 0.05, 0, [0.2, 0.5, 0.9])));
    // All points at one CL (or at ±CL for the symmetric fit): the columns are dependent.
    expectRefusal(() =>
      fitPolar(polarPoints(0.02, 0.05, 0, [0.5, 0.5, 0.5]), { withOffset: true }),
    );
    expectRefusal(() => fitPolar(polarPoints(0.02, 0.05, 0, [0.5, -0.5, 0.5])));
  });
});
