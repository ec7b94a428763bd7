/**
 * Actuator-disk momentum theory (core/propulsion/momentum.ts) against the closed forms of
 * McCormick, Aerodynamics, Aeronautics and Flight Mechanics, ch. 6, with the computed check
 * values of shared/REFERENCES.md ("Propeller momentum theory").
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/errors.ts';
import {
  calibrateProfileFactor,
  diskArea_m2,
  diskVelocity,
  idealEfficiency,
  idealStaticThrust,
  momentumEfficiency,
  momentumThrust_N,
  shaftPowerForThrustPower,
} from '../../../core/propulsion/momentum.ts';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
const A = diskArea_m2(1.9);

describe('momentum theory closed forms (McCormick ch. 6; REFERENCES.md computed values)', () => {
  it('ideal static thrust T0 = (2ρA·P²)^(1/3): ρ 1.225, D 1.9 m, 113.9 kW → 4483 N', () => {
    expect(rel(idealStaticThrust(113_900, 1.225, A), 4483)).toBeLessThan(2e-4); // REFERENCES.md
  });

  it('ideal efficiency 2/(1 + √(1 + 2T/(ρV²A))): 2500 N at 30 m/s → 0.7656, 1800 N at 60 m/s → 0.9368', () => {
    expect(rel(idealEfficiency(2500, 30, 1.225, A), 0.7656)).toBeLessThan(1e-4); // REFERENCES.md
    expect(rel(idealEfficiency(1800, 60, 1.225, A), 0.9368)).toBeLessThan(1e-4); // REFERENCES.md
  });

  it('the disk fed with the full power (η_p = 1) has the static thrust of the closed form', () => {
    // McCormick ch. 6: T0 = (2ρA·P²)^(1/3) is the V → 0 limit of T(V + w) = P.
    expect(rel(momentumThrust_N(113_900, 0, 1.225, A, 1), 4483)).toBeLessThan(2e-4);
  });

  it('the cubic root gives the thrust whose closed-form ideal efficiency is T·V/P', () => {
    // Consistency with McCormick's η_i formula: for the thrust the cubic returns at speed V,
    // η_i(T, V) must equal T·V/(η_p·P).
    for (const V of [5, 30, 60, 120]) {
      const T = momentumThrust_N(113_900, V, 1.225, A, 1);
      expect(rel(idealEfficiency(T, V, 1.225, A), (T * V) / 113_900)).toBeLessThan(1e-12);
      const Tp = momentumThrust_N(113_900, V, 1.225, A, 0.85);
      expect(rel(idealEfficiency(Tp, V, 1.225, A), (Tp * V) / (0.85 * 113_900))).toBeLessThan(
        1e-12,
      );
    }
  });

  it('the root u of u³ − V·u² = K solves the cubic (computed; cubic residual)', () => {
    for (const [V, K] of [
      [0, 1e4],
      [30, 1e4],
      [200, 1],
      [1, 1e9],
    ] as const) {
      const u = diskVelocity(V, K);
      expect(Math.abs(u * u * (u - V) - K) / K).toBeLessThan(1e-9);
    }
  });

  it('the shaft power for a thrust power inverts the efficiency (round trip, computed)', () => {
    for (const V of [10, 40, 80]) {
      const P = 60_000;
      const eta = momentumEfficiency(P, V, 1.0, A, 0.84);
      expect(rel(shaftPowerForThrustPower(eta * P, V, 1.0, A, 0.84), P)).toBeLessThan(1e-12);
    }
  });

  it('calibration makes the efficiency at the cruise point the given one', () => {
    const profile = calibrateProfileFactor(0.8, 60, 0.96, 76_000, A);
    expect(rel(momentumEfficiency(76_000, 60, 0.96, A, profile), 0.8)).toBeLessThan(1e-12);
    expect(profile).toBeGreaterThan(0.8);
    expect(profile).toBeLessThan(1);
  });

  it('refuses a cruise efficiency the disk loading cannot give, naming the field', () => {
    // A 0.3 m disk absorbing 76 kW at 30 m/s: ideal efficiency far below 0.85.
    const small = diskArea_m2(0.3);
    expect(() =>
      calibrateProfileFactor(0.85, 30, 1.225, 76_000, small, 'x.propEfficiency'),
    ).toThrow(InputError);
    try {
      calibrateProfileFactor(0.85, 30, 1.225, 76_000, small, 'x.propEfficiency');
    } catch (e) {
      expect((e as InputError).field).toBe('x.propEfficiency');
      expect((e as InputError).message).toMatch(/at most 0\.\d+ for this propeller diameter/);
    }
  });
});

describe('momentum theory properties (fast-check)', () => {
  const input = fc.record({
    P: fc.double({ min: 1, max: 5e6, noNaN: true }),
    V: fc.double({ min: 0.5, max: 300, noNaN: true }),
    rho: fc.double({ min: 0.05, max: 1.5, noNaN: true }),
    D: fc.double({ min: 0.05, max: 6, noNaN: true }),
    profile: fc.double({ min: 0.3, max: 1, noNaN: true }),
  });

  it('efficiency in (0, 1), thrust and power available ≥ 0, no NaN for any valid input', () => {
    fc.assert(
      fc.property(input, ({ P, V, rho, D, profile }) => {
        const area = diskArea_m2(D);
        const eta = momentumEfficiency(P, V, rho, area, profile);
        const T = momentumThrust_N(P, V, rho, area, profile);
        expect(Number.isFinite(eta) && Number.isFinite(T)).toBe(true);
        expect(eta).toBeGreaterThan(0);
        expect(eta).toBeLessThan(1);
        expect(eta * P).toBeGreaterThanOrEqual(0);
        expect(T).toBeGreaterThan(0);
        expect(eta).toBeLessThanOrEqual(profile);
      }),
    );
  });

  it('efficiency rises with airspeed and thrust falls with it (momentum theory, McCormick ch. 6)', () => {
    fc.assert(
      fc.property(input, ({ P, V, rho, D, profile }) => {
        const area = diskArea_m2(D);
        const e1 = momentumEfficiency(P, V, rho, area, profile);
        const e2 = momentumEfficiency(P, V * 1.1, rho, area, profile);
        expect(e2).toBeGreaterThanOrEqual(e1 * (1 - 1e-12));
        const t1 = momentumThrust_N(P, V, rho, area, profile);
        const t2 = momentumThrust_N(P, V * 1.1, rho, area, profile);
        expect(t2).toBeLessThanOrEqual(t1 * (1 + 1e-12));
      }),
    );
  });
});
