/**
 * Invariants of the closed-form range and endurance models, the polar optima and the
 * electric forms, over wide random inputs (fast-check). Each relation says why it holds.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import * as breguet from '../../core/breguet.ts';
import {
  electricBestRangeSpeedTraub,
  enduranceElectricTraub,
  rangeElectricHepperle,
  rangeElectricTraub,
} from '../../core/electricEndurance.ts';
import { InputError } from '../../core/errors.ts';
import {
  dragCoefficient,
  inducedDragFactor,
  jetBestRangePoint,
  liftToDrag,
  maxLiftToDrag,
  minPowerPoint,
} from '../../core/polar.ts';

const num = (min: number, max: number) => fc.double({ min, max, noNaN: true });
const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);

interface Args {
  ct: number;
  cp: number;
  eta: number;
  V: number;
  rho: number;
  S: number;
  CD0: number;
  k: number;
  CL: number;
  CD: number;
  W0: number;
  W1: number;
}

/** Wide but physical ranges: from model gliders to airliners, sea level to the stratosphere. */
const argsArb = fc
  .record({
    ct: num(1e-5, 1e-3),
    cp: num(1e-8, 1e-5),
    eta: num(0.05, 1),
    V: num(1, 400),
    rho: num(0.01, 1.5),
    S: num(0.05, 1000),
    CD0: num(0.003, 0.3),
    k: num(0.001, 1),
    CL: num(0.01, 4),
    W0: num(1, 1e7),
    fuelFraction: num(1e-6, 0.95),
  })
  .map(({ fuelFraction, ...a }): Args => ({
    ...a,
    CD: a.CD0 + a.k * a.CL * a.CL,
    W1: a.W0 * (1 - fuelFraction),
  }));

type Form = { name: string; fn: (a: Args) => number; params: (keyof Args)[] };
// prettier-ignore
const FORMS: Form[] = [
  { name: 'rangeJetCruiseClimb', fn: breguet.rangeJetCruiseClimb, params: ['ct', 'V', 'CL', 'CD', 'W0', 'W1'] },
  { name: 'rangeJetConstantAltitudeCL', fn: breguet.rangeJetConstantAltitudeCL, params: ['ct', 'rho', 'S', 'CL', 'CD', 'W0', 'W1'] },
  { name: 'rangeJetConstantAltitudeSpeed', fn: breguet.rangeJetConstantAltitudeSpeed, params: ['ct', 'V', 'rho', 'S', 'CD0', 'k', 'W0', 'W1'] },
  { name: 'enduranceJetConstantCL', fn: breguet.enduranceJetConstantCL, params: ['ct', 'CL', 'CD', 'W0', 'W1'] },
  { name: 'enduranceJetConstantAltitudeSpeed', fn: breguet.enduranceJetConstantAltitudeSpeed, params: ['ct', 'V', 'rho', 'S', 'CD0', 'k', 'W0', 'W1'] },
  { name: 'rangePropConstantCL', fn: breguet.rangePropConstantCL, params: ['eta', 'cp', 'CL', 'CD', 'W0', 'W1'] },
  { name: 'rangePropConstantAltitudeSpeed', fn: breguet.rangePropConstantAltitudeSpeed, params: ['eta', 'cp', 'V', 'rho', 'S', 'CD0', 'k', 'W0', 'W1'] },
  { name: 'endurancePropConstantAltitudeCL', fn: breguet.endurancePropConstantAltitudeCL, params: ['eta', 'cp', 'rho', 'S', 'CL', 'CD', 'W0', 'W1'] },
  { name: 'endurancePropCruiseClimb', fn: breguet.endurancePropCruiseClimb, params: ['eta', 'cp', 'V', 'CL', 'CD', 'W0', 'W1'] },
  { name: 'endurancePropConstantAltitudeSpeed', fn: breguet.endurancePropConstantAltitudeSpeed, params: ['eta', 'cp', 'V', 'rho', 'S', 'CD0', 'k', 'W0', 'W1'] },
];

/** Forms whose result depends on the weights only through ln(W0/W1). */
const LOG_FORMS = [
  'rangeJetCruiseClimb',
  'enduranceJetConstantCL',
  'rangePropConstantCL',
  'endurancePropCruiseClimb',
];

const BAD = fc.oneof(fc.constantFrom(0, NaN, Infinity, -Infinity), num(-1e9, -1e-9));

function fieldOf(fn: () => unknown): string {
  try {
    fn();
  } catch (err) {
    if (err instanceof InputError) return err.field;
    throw err;
  }
  return '(no error)';
}

describe.each(FORMS)('$name', ({ name, fn, params }) => {
  it('is finite and positive for any valid input', () => {
    fc.assert(
      fc.property(argsArb, (a) => {
        const r = fn(a);
        expect(Number.isFinite(r)).toBe(true);
        expect(r).toBeGreaterThan(0);
      }),
    );
  });

  it('grows with the fuel burned (smaller W1)', () => {
    // Every integrand dx/dW or dt/dW is negative, so lowering W1 adds a positive piece.
    fc.assert(
      fc.property(argsArb, num(0.01, 0.9), (a, extra) => {
        const lower = { ...a, W1: a.W1 * (1 - extra) };
        expect(fn(lower)).toBeGreaterThan(fn(a));
      }),
    );
  });

  it('does not grow with CD0', () => {
    // More parasite drag means more drag at every weight (CD = CD0 + k·CL² for the constant-CL
    // forms, D = q·S·CD0 + k·W²/(q·S) for the constant-speed ones), so less range and
    // endurance; where induced drag dominates the change can vanish in rounding.
    fc.assert(
      fc.property(argsArb, num(0.01, 2), (a, more) => {
        const CD0 = a.CD0 * (1 + more);
        const worse = { ...a, CD0, CD: CD0 + a.k * a.CL * a.CL };
        const before = fn(a);
        const after = fn(worse);
        expect(after < before || rel(after, before) < 1e-12).toBe(true);
      }),
    );
  });

  it('shows the expected dependence on weight at a fixed fuel fraction', () => {
    // Log forms: W0 and W1 enter only as ln(W0/W1), so scaling both changes nothing.
    // Jet at constant altitude and CL: R ∝ √W0 − √W1 — a heavier aircraft flies faster at the
    // same CL for the same TSFC·thrust per weight, so it goes further.
    // Propeller endurance at constant altitude and CL: E ∝ W1^−½ − W0^−½ — power required
    // grows as W^1.5 while fuel grows only as W, so a heavier aircraft stays up shorter.
    // Constant-speed forms: no general direction (a heavier aircraft may move towards or away
    // from its minimum-drag speed), so they are not checked here.
    fc.assert(
      fc.property(argsArb, num(1.01, 10), (a, s) => {
        const heavier = { ...a, W0: a.W0 * s, W1: a.W1 * s };
        // Scaling W0 and W1 rounds each by ~1 ulp, which the burn W0 − W1 magnifies.
        const roundingTol = 1e-12 + (1e-14 * a.W0) / (a.W0 - a.W1);
        if (LOG_FORMS.includes(name)) expect(rel(fn(heavier), fn(a))).toBeLessThan(roundingTol);
        if (name === 'rangeJetConstantAltitudeCL') expect(fn(heavier)).toBeGreaterThan(fn(a));
        if (name === 'endurancePropConstantAltitudeCL') expect(fn(heavier)).toBeLessThan(fn(a));
      }),
    );
  });

  it('refuses any non-positive or non-finite parameter, naming it', () => {
    fc.assert(
      fc.property(argsArb, fc.constantFrom(...params), BAD, (a, key, bad) => {
        expect(fieldOf(() => fn({ ...a, [key]: bad }))).toBe(key);
      }),
    );
  });

  it('refuses W1 ≥ W0, naming W1', () => {
    fc.assert(
      fc.property(argsArb, num(0, 1), (a, over) => {
        expect(fieldOf(() => fn({ ...a, W1: a.W0 * (1 + over) }))).toBe('W1');
      }),
    );
  });

  if (params.includes('eta')) {
    it('refuses a propeller efficiency outside (0, 1], naming eta', () => {
      fc.assert(
        fc.property(argsArb, fc.oneof(num(1 + 1e-9, 10), num(-1, 0)), (a, eta) => {
          expect(fieldOf(() => fn({ ...a, eta }))).toBe('eta');
        }),
      );
    });
  }
});

describe('polar optima', () => {
  const polarArb = fc.record({
    CD0: num(0.003, 0.3),
    k: num(0.001, 1),
    CLminD: fc.oneof(fc.constant(0), num(-0.5, 1)),
    CLmax: num(0.3, 4),
  });

  it('no CL > 0 beats (L/D)max, (CL^1.5/CD)max or (CL^0.5/CD)max, with or without offset', () => {
    // Each optimum is the global maximum of its ratio over CL > 0 (Anderson, Introduction to
    // Flight, ch. 6; the offset case by the same stationarity argument).
    fc.assert(
      fc.property(polarArb, num(1e-4, 10), (c, CL) => {
        const CD = dragCoefficient(c, CL);
        expect(liftToDrag(c, CL)).toBeLessThanOrEqual(maxLiftToDrag(c).LD * (1 + 1e-12));
        expect(Math.pow(CL, 1.5) / CD).toBeLessThanOrEqual(minPowerPoint(c).value * (1 + 1e-12));
        expect(Math.sqrt(CL) / CD).toBeLessThanOrEqual(jetBestRangePoint(c).value * (1 + 1e-12));
      }),
    );
  });

  it('optimum points are finite and ordered: CL jet range < CL (L/D)max < CL min power', () => {
    // CL^m/CD peaks at larger CL for larger m (Anderson ch. 6: √(1/3), 1, √3 times √(CD0/k)).
    fc.assert(
      fc.property(polarArb, (c) => {
        const a = jetBestRangePoint(c).CL;
        const b = maxLiftToDrag(c).CL;
        const m = minPowerPoint(c).CL;
        expect([a, b, m].every(Number.isFinite)).toBe(true);
        expect(a).toBeLessThan(b);
        expect(b).toBeLessThan(m);
      }),
    );
  });

  it('refuses an Oswald efficiency outside (0, 1], naming it', () => {
    fc.assert(
      fc.property(fc.oneof(num(1 + 1e-9, 5), num(-1, 0), fc.constantFrom(NaN, Infinity)), (e) => {
        const polar = {
          CD0: 0.02,
          induced: { by: 'geometry' as const, e, AR: 8 },
          CLminD: 0,
          CLmax: 1.5,
        };
        expect(fieldOf(() => inducedDragFactor(polar))).toBe('polar.induced.e');
      }),
    );
  });
});

describe('electric forms', () => {
  const traubArb = fc.record({
    energy_J: num(1e3, 1e10),
    eta: num(0.05, 1),
    powerRequired_W: num(1, 1e7),
    peukertExponent: num(1, 1.6),
    ratedTime_s: num(60, 360000),
    V: num(1, 200),
  });

  it('are finite and positive for any valid input', () => {
    fc.assert(
      fc.property(traubArb, num(1e4, 2e6), num(1, 60), num(1e-3, 0.95), (a, Es, LD, f) => {
        const values = [
          enduranceElectricTraub(a),
          rangeElectricTraub(a),
          rangeElectricHepperle({
            specificEnergy_J_kg: Es,
            eta: a.eta,
            LD,
            batteryMassFraction: f,
          }),
        ];
        expect(values.every((v) => Number.isFinite(v) && v > 0)).toBe(true);
      }),
    );
  });

  it('endurance grows with pack energy and shrinks with power required', () => {
    // t = Rt^(1−n)·(η·E/P)^n with n ≥ 1 is increasing in E and decreasing in P (Traub 2011).
    fc.assert(
      fc.property(traubArb, num(1.01, 10), (a, s) => {
        const t = enduranceElectricTraub(a);
        expect(enduranceElectricTraub({ ...a, energy_J: a.energy_J * s })).toBeGreaterThan(t);
        expect(
          enduranceElectricTraub({ ...a, powerRequired_W: a.powerRequired_W * s }),
        ).toBeLessThan(t);
      }),
    );
  });

  it('the best-range speed never exceeds the minimum-drag speed (n ≥ 1)', () => {
    // [k(n+1)/(CD0(3n−1))]^¼ ≤ (k/CD0)^¼ since (n+1)/(3n−1) ≤ 1 for n ≥ 1: Peukert losses
    // reward flying slower (derived from Traub 2011).
    fc.assert(
      fc.property(
        num(0.1, 1e6),
        num(0.05, 1.5),
        num(0.05, 500),
        num(0.003, 0.3),
        num(0.001, 1),
        num(1, 2),
        (W, rho, S, CD0, k, n) => {
          const VR = electricBestRangeSpeedTraub({ W, rho, S, CD0, k, n });
          const Vmd = Math.sqrt((2 * W) / (rho * S)) * Math.pow(k / CD0, 0.25);
          expect(Number.isFinite(VR)).toBe(true);
          expect(VR).toBeLessThanOrEqual(Vmd * (1 + 1e-12));
        },
      ),
    );
  });
});
