import { describe, expect, it } from 'vitest';
import { InputError } from '../../core/errors.ts';
import type { Polar } from '../../core/plan/schema.ts';
import {
  dragCoefficient,
  dragForce,
  inducedDragFactor,
  jetBestRangePoint,
  jetBestRangeSpeed,
  liftCoefficient,
  liftToDrag,
  maxLiftToDrag,
  minDragSpeed,
  minPowerPoint,
  minPowerSpeed,
  polarCoefficients,
  powerRequired_W,
  speedForLiftCoefficient,
  stallSpeed,
  type PolarCoefficients,
} from '../../core/polar.ts';
import { goldenMax } from '../support/goldenMax.ts';

/** Relative difference |a − b|/|b|. */
const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);

function geometryPolar(CD0: number, e: number, AR: number, CLminD = 0): Polar {
  return { CD0, induced: { by: 'geometry', e, AR }, CLminD, CLmax: 1.6 };
}

function expectInputError(fn: () => unknown, field: string): void {
  try {
    fn();
  } catch (err) {
    expect(err).toBeInstanceOf(InputError);
    expect((err as InputError).field).toBe(field);
    return;
  }
  throw new Error(`expected an InputError naming ${field}`);
}

describe('light single-engine propeller airplane (Anderson, Introduction to Flight, ch. 6)', () => {
  // Inputs as published: W0 13 127.5 N, S 16.165 m², span 10.912 m, CD0 0.025, e 0.8, sea level.
  const W0 = 13127.5;
  const S = 16.165;
  const AR = (10.912 * 10.912) / S;
  const c = polarCoefficients(geometryPolar(0.025, 0.8, AR));
  const rho = 1.225; // 1976 U.S. Standard Atmosphere, sea level

  it('reproduces the computed polar optima to their printed digits', () => {
    // Anderson, Introduction to Flight, ch. 6, computed from published inputs (REFERENCES.md).
    expect(rel(c.k, 0.05402)).toBeLessThan(5e-4);
    expect(rel(maxLiftToDrag(c).LD, 13.61)).toBeLessThan(5e-4);
    expect(rel(minPowerPoint(c).value, 12.79)).toBeLessThan(5e-4);
  });

  it('reproduces the minimum-drag and minimum-power speeds at take-off weight', () => {
    // Anderson, Introduction to Flight, ch. 6, computed from published inputs (REFERENCES.md).
    expect(rel(minDragSpeed(c, W0, rho, S), 44.15)).toBeLessThan(5e-4);
    expect(rel(minPowerSpeed(c, W0, rho, S), 33.54)).toBeLessThan(5e-4);
  });
});

describe('small business jet (Anderson, Introduction to Flight, ch. 6)', () => {
  // Inputs as published: S 29.54 m², span 16.25 m, CD0 0.02, e 0.81.
  const c = polarCoefficients(geometryPolar(0.02, 0.81, (16.25 * 16.25) / 29.54));

  it('reproduces (L/D)max and (CL^0.5/CD)max to their printed digits', () => {
    // Anderson, Introduction to Flight, ch. 6, computed from published inputs (REFERENCES.md).
    expect(rel(maxLiftToDrag(c).LD, 16.86)).toBeLessThan(5e-4);
    expect(rel(jetBestRangePoint(c).value, 23.4)).toBeLessThan(5e-4);
  });
});

describe('symmetric polar identities (Anderson, Introduction to Flight, ch. 6)', () => {
  const e = 0.82;
  const AR = 9.5;
  const CD0 = 0.027;
  const c = polarCoefficients(geometryPolar(CD0, e, AR));

  it('k = 1/(π·e·AR), or the given factor', () => {
    // Anderson, Introduction to Flight, ch. 6 (definition of k).
    expect(rel(inducedDragFactor(geometryPolar(CD0, e, AR)), 1 / (Math.PI * e * AR))).toBeLessThan(
      1e-15,
    );
    const given: Polar = { CD0, induced: { by: 'factor', k: 0.04 }, CLminD: 0, CLmax: 1.4 };
    expect(rel(inducedDragFactor(given), 0.04)).toBeLessThan(1e-15);
  });

  it('at (L/D)max induced drag equals CD0 and (L/D)max = ½·√(π·e·AR/CD0)', () => {
    const best = maxLiftToDrag(c);
    expect(rel(c.k * best.CL * best.CL, CD0)).toBeLessThan(1e-12); // Anderson ch. 6
    expect(rel(best.CD, 2 * CD0)).toBeLessThan(1e-12); // Anderson ch. 6
    expect(rel(best.LD, 0.5 * Math.sqrt((Math.PI * e * AR) / CD0))).toBeLessThan(1e-12); // Anderson ch. 6
  });

  it('minimum power at CL = √(3·CD0/k) with CD = 4·CD0; jet best range at CL = √(CD0/(3k)), CD = 4/3·CD0', () => {
    const mp = minPowerPoint(c);
    expect(rel(mp.CL, Math.sqrt((3 * CD0) / c.k))).toBeLessThan(1e-12); // Anderson ch. 6
    expect(rel(mp.CD, 4 * CD0)).toBeLessThan(1e-12); // Anderson ch. 6
    const jr = jetBestRangePoint(c);
    expect(rel(jr.CL, Math.sqrt(CD0 / (3 * c.k)))).toBeLessThan(1e-12); // Anderson ch. 6
    expect(rel(jr.CD, (4 / 3) * CD0)).toBeLessThan(1e-12); // Anderson ch. 6
  });

  it('V_minpower = 3^(−1/4)·V_mindrag and jet best-range speed = 3^(1/4)·V_mindrag', () => {
    const W = 9000;
    const rho = 0.9;
    const S = 14;
    const Vmd = minDragSpeed(c, W, rho, S);
    expect(rel(minPowerSpeed(c, W, rho, S), Math.pow(3, -0.25) * Vmd)).toBeLessThan(1e-12); // Anderson ch. 6
    expect(rel(jetBestRangeSpeed(c, W, rho, S), Math.pow(3, 0.25) * Vmd)).toBeLessThan(1e-12); // Anderson ch. 6
  });

  it('drag at the minimum-drag speed is W/(L/D)max and power required is D·V', () => {
    const W = 9000;
    const rho = 1.1;
    const S = 14;
    const V = minDragSpeed(c, W, rho, S);
    // Level flight L = W, D = W/(L/D) (Anderson, Introduction to Flight, ch. 6).
    expect(rel(dragForce(c, W, rho, S, V), W / maxLiftToDrag(c).LD)).toBeLessThan(1e-12);
    expect(rel(powerRequired_W(c, W, rho, S, V), (W / maxLiftToDrag(c).LD) * V)).toBeLessThan(
      1e-12,
    );
  });

  it('lift coefficient, speed for a CL and stall speed are consistent with L = ½ρV²S·CL', () => {
    // Definition of the lift coefficient (Anderson, Introduction to Flight, ch. 5).
    const W = 5000;
    const Vs = stallSpeed(W, 1.225, 12, 1.5);
    expect(rel(liftCoefficient(W, 1.225, 12, Vs), 1.5)).toBeLessThan(1e-14);
    expect(
      rel(speedForLiftCoefficient(W, 1.225, 12, 0.4), Math.sqrt((2 * W) / (1.225 * 12 * 0.4))),
    ).toBeLessThan(1e-14);
  });
});

describe('polar with a minimum-drag offset (REFERENCES.md, computed)', () => {
  const c: PolarCoefficients = { CD0: 0.02, k: 0.05, CLminD: 0.15, CLmax: 1.5 };

  it('(L/D)max at CL* = √(CLm² + CDmin/k) = 0.65 with L/D 20.000', () => {
    const best = maxLiftToDrag(c);
    expect(rel(best.CL, 0.65)).toBeLessThan(1e-12); // REFERENCES.md offset case, computed
    expect(rel(best.LD, 20.0)).toBeLessThan(2.5e-5); // REFERENCES.md offset case, computed
    expect(rel(liftToDrag(c, best.CL), best.LD)).toBeLessThan(1e-12);
  });

  it('max CL^1.5/CD at CL 0.98578 (17.819) and max CL^0.5/CD at CL 0.42859 (27.414)', () => {
    const mp = minPowerPoint(c);
    expect(rel(mp.CL, 0.98578)).toBeLessThan(1e-5); // REFERENCES.md offset case, computed
    expect(rel(mp.value, 17.819)).toBeLessThan(5e-5); // REFERENCES.md offset case, computed
    const jr = jetBestRangePoint(c);
    expect(rel(jr.CL, 0.42859)).toBeLessThan(2e-5); // REFERENCES.md offset case, computed
    expect(rel(jr.value, 27.414)).toBeLessThan(5e-5); // REFERENCES.md offset case, computed
  });

  it.each([
    ['L/D', 1, (p: PolarCoefficients) => maxLiftToDrag(p).CL],
    ['CL^1.5/CD', 1.5, (p: PolarCoefficients) => minPowerPoint(p).CL],
    ['CL^0.5/CD', 0.5, (p: PolarCoefficients) => jetBestRangePoint(p).CL],
  ])(
    'the %s optimum agrees with numerical maximisation, also for a negative offset',
    (_, m, opt) => {
      // Independent check: golden-section maximisation of CL^m/CD (common practice).
      for (const CLminD of [0.15, -0.3, 0.6]) {
        const p = { ...c, CLminD };
        const numeric = goldenMax((CL) => Math.pow(CL, m) / dragCoefficient(p, CL), 1e-6, 5);
        expect(rel(opt(p), numeric)).toBeLessThan(1e-6);
      }
    },
  );
});

describe('input validation', () => {
  const c: PolarCoefficients = { CD0: 0.025, k: 0.05, CLminD: 0, CLmax: 1.5 };

  it('refuses non-positive or non-finite weight, density, area, speed and CL', () => {
    expectInputError(() => liftCoefficient(-1, 1.2, 10, 30), 'weight_N');
    expectInputError(() => liftCoefficient(1000, 0, 10, 30), 'rho');
    expectInputError(() => liftCoefficient(1000, 1.2, Infinity, 30), 'S');
    expectInputError(() => liftCoefficient(1000, 1.2, 10, NaN), 'V');
    expectInputError(() => speedForLiftCoefficient(1000, 1.2, 10, 0), 'CL');
    expectInputError(() => stallSpeed(1000, 1.2, 10, -1), 'CLmax');
    expectInputError(() => dragForce(c, 1000, 1.2, 10, 0), 'V');
    expectInputError(() => dragCoefficient(c, NaN), 'CL');
    expectInputError(() => liftToDrag(c, Infinity), 'CL');
  });

  it('refuses bad polar coefficients', () => {
    expectInputError(() => maxLiftToDrag({ ...c, CD0: 0 }), 'CD0');
    expectInputError(() => minPowerPoint({ ...c, k: -0.01 }), 'k');
    expectInputError(() => jetBestRangePoint({ ...c, CLminD: NaN }), 'CLminD');
    expectInputError(() => inducedDragFactor(geometryPolar(0.02, 0, 8)), 'polar.induced.e');
    expectInputError(() => inducedDragFactor(geometryPolar(0.02, 1.2, 8)), 'polar.induced.e');
    expectInputError(() => inducedDragFactor(geometryPolar(0.02, 0.8, -3)), 'polar.induced.AR');
    expectInputError(() => polarCoefficients(geometryPolar(-0.02, 0.8, 8)), 'CD0');
  });
});
