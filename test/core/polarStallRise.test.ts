/**
 * The drag rise near the stall (core/polar.ts stallDragRise, a stated quadratic onset, from
 * memory) and the optimum lift coefficients with it (core/solver/optimumCL.ts), checked
 * against a brute-force maximisation.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../core/errors.ts';
import { dragCoefficient, polarCoefficients } from '../../core/polar.ts';
import type { Polar } from '../../core/plan/schema.ts';
import { clMaximizing, optimumCL } from '../../core/solver/optimumCL.ts';
import type { PowerConstants } from '../../core/solver/power.ts';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
// k = 0.05 given directly; a polar whose minimum-power CL (√(3·CD0/k) = 1.342, Anderson
// ch. 6) lies above a rise onset of 1.1 — the case where the parabola would fly too slow.
const polar: Polar = {
  CD0: 0.03,
  induced: { by: 'factor', k: 0.05 },
  CLminD: 0,
  CLmax: 1.5,
  stallDragRise: { onsetCL: 1.1, atCLmax: 0.04 },
};

describe('stall drag rise', () => {
  const c = polarCoefficients(polar);
  const parabola = (CL: number) => 0.03 + 0.05 * CL * CL;

  it('is zero up to the onset and the stated ΔCD at CLmax (its definition)', () => {
    expect(dragCoefficient(c, 1.0)).toBeCloseTo(parabola(1.0), 15);
    expect(dragCoefficient(c, 1.1)).toBeCloseTo(parabola(1.1), 15);
    expect(rel(dragCoefficient(c, 1.5), parabola(1.5) + 0.04)).toBeLessThan(1e-14);
  });

  it('is smooth at the onset (C¹: one-sided slopes agree, central differences)', () => {
    const h = 1e-7;
    const left = (dragCoefficient(c, 1.1) - dragCoefficient(c, 1.1 - h)) / h;
    const right = (dragCoefficient(c, 1.1 + h) - dragCoefficient(c, 1.1)) / h;
    expect(Math.abs(left - right)).toBeLessThan(1e-5);
  });

  it('moves the minimum-power CL below the parabola optimum, to the brute-force maximum', () => {
    const power = { type: 'propeller', peukertExponent: 1 } as PowerConstants;
    const opt = optimumCL(c, power);
    // Anderson ch. 6: parabola optimum of CL^1.5/CD at √(3·CD0/k).
    expect(rel(clMaximizing(c, 1.5), Math.sqrt((3 * 0.03) / 0.05))).toBeLessThan(1e-12);
    let best = 0;
    let bestCL = 0;
    for (let CL = 0.5; CL <= 1.5; CL += 1e-6) {
      const v = CL ** 1.5 / dragCoefficient(c, CL);
      if (v > best) [best, bestCL] = [v, CL];
    }
    expect(opt.endurance).toBeLessThan(1.342);
    expect(Math.abs(opt.endurance - bestCL)).toBeLessThan(1e-5); // brute force, computed
    // (L/D)max CL = √(CD0/k) = 0.775 lies below the onset: unchanged (Anderson ch. 6).
    expect(rel(opt.glide, Math.sqrt(0.03 / 0.05))).toBeLessThan(1e-12);
  });

  it('refuses an onset at or above CLmax, naming the field', () => {
    const bad = { ...polar, stallDragRise: { onsetCL: 1.5, atCLmax: 0.04 } };
    expect(() => polarCoefficients(bad)).toThrow(InputError);
    try {
      polarCoefficients(bad);
    } catch (e) {
      expect((e as InputError).field).toBe('polar.stallDragRise.onsetCL');
    }
  });

  it('never lowers the drag and is never NaN (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.3, max: 0.95, noNaN: true }),
        fc.double({ min: 0, max: 0.5, noNaN: true }),
        fc.double({ min: -1, max: 2, noNaN: true }),
        (onsetShare, atCLmax, CLshare) => {
          const p = { ...polar, stallDragRise: { onsetCL: onsetShare * 1.5, atCLmax } };
          const cc = polarCoefficients(p);
          const CL = CLshare * 1.5;
          const CD = dragCoefficient(cc, CL);
          expect(Number.isFinite(CD)).toBe(true);
          expect(CD).toBeGreaterThanOrEqual(parabola(CL) * (1 - 1e-15));
        },
      ),
    );
  });
});
