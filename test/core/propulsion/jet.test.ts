/**
 * Jet thrust lapse by engine class and TSFC with Mach and temperature (core/propulsion/jet.ts)
 * against hand evaluation of the published expressions: Mattingly, Aircraft Engine Design
 * (2nd ed.), ch. 2 — the forms are quoted from memory. The expected numbers were evaluated by
 * hand (a separate script, ISA from the 1976 standard's layer formulas; REFERENCES.md), not by
 * the code under test; the 35 000 ft, M 0.72 value is REFERENCES.md's computed check.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { atmosphereAt } from '../../../core/atmosphere.ts';
import { InputError } from '../../../core/errors.ts';
import type { JetLapse, JetPowerplant } from '../../../core/plan/schema.ts';
import {
  jetFuelFlow_kg_s,
  maxThrust_N,
  totalRatios,
  tsfcAt_kg_Ns,
} from '../../../core/propulsion/jet.ts';
import { toSI } from '../../../core/units.ts';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

function jet(thrustLapse?: JetLapse, tsfcMachFactor?: number): JetPowerplant {
  return {
    type: 'jet',
    maxThrustSL_N: 10_000,
    thrustLapse,
    tsfc_kg_Ns: toSI(0.45, 'lb_lbfh'),
    tsfcMachFactor,
    idleFuelFraction: 0.05,
    fuel: { kind: 'jetA1', load_kg: 1000, tankCapacity_L: 2000 },
  };
}

describe('total ratios θ₀, δ₀ (isentropic stagnation, γ = 1.4; exact definitions)', () => {
  it('35 000 ft ISA, M 0.72: θ₀ 0.83808, δ₀ 0.33234 (REFERENCES.md, computed)', () => {
    const r = totalRatios(atmosphereAt(10_668), 0.72);
    expect(rel(r.theta0, 0.83808)).toBeLessThan(1e-5);
    expect(rel(r.delta0, 0.33234)).toBeLessThan(1e-5);
  });
});

describe('engine-class thrust lapse α = T/T_SL (Mattingly ch. 2, from memory; hand-evaluated)', () => {
  // The code rounds the throttle break over w = 0.004 in θ₀ (jet.ts header); every point here
  // lies at least 0.025 in θ₀ from the break, where the rounding is below 1e-5·α.
  // [class, throttle ratio, geopotential altitude m, ISA offset K, Mach, α by hand]
  const cases: [JetLapse['engineClass'], number, number, number, number, number][] = [
    // REFERENCES.md check: below the throttle break, α = δ₀(1 − 0.49√M).
    ['highBypass', 1, 10_668, 0, 0.72, 0.19416],
    // Above the break (θ₀ 1.032): α = δ₀(1 − 0.49√M − 3(θ₀ − TR)/(1.5 + M)).
    ['highBypass', 1, 0, 0, 0.4, 0.714114],
    ['highBypass', 1, 5000, 20, 0.6, 0.397146],
    // Low bypass, dry, normalised by 0.6: α = δ₀(1 − 3.8(θ₀ − TR)/θ₀).
    ['lowBypass', 1, 5000, 0, 0.9, 0.798861],
    ['lowBypass', 1, 0, 15, 0.5, 0.759147],
    // Turbojet, dry, normalised by 0.8: α = δ₀(1 − 0.16√M − 24(θ₀ − TR)/((9 + M)θ₀)).
    ['turbojet', 1, 11_000, 0, 0.8, 0.291753],
    ['turbojet', 1.02, 0, 30, 0.3, 0.717015],
  ];
  for (const [engineClass, throttleRatio, H, dT, M, alpha] of cases) {
    it(`${engineClass}, TR ${throttleRatio}, ${H} m ISA${dT ? `+${dT}` : ''}, M ${M}: α ${alpha}`, () => {
      const pp = jet({ engineClass, throttleRatio });
      expect(rel(maxThrust_N(pp, atmosphereAt(H, dT), M), alpha * 10_000)).toBeLessThan(1e-5);
    });
  }

  it('every class gives its sea-level static thrust at M 0, ISA (α = 1 by the normalisation)', () => {
    for (const engineClass of ['highBypass', 'lowBypass', 'turbojet'] as const) {
      // TR 1.05: the break (rounded over ±0.004 in θ₀, jet.ts) lies above θ₀ = 1.
      const pp = jet({ engineClass, throttleRatio: 1.05 });
      expect(rel(maxThrust_N(pp, atmosphereAt(0), 0), 10_000)).toBeLessThan(1e-12);
    }
  });

  it('overridden coefficients replace the class defaults (same hand form, a = 0.3, b = 2)', () => {
    // High bypass at sea level, M 0.4, TR 1: δ₀ 1.11655, θ₀ 1.032 (as above).
    const expected = 1.116552 * (1 - 0.3 * Math.sqrt(0.4) - (2 * 0.032) / 1.9);
    const pp = jet({
      engineClass: 'highBypass',
      throttleRatio: 1,
      machCoefficient: 0.3,
      breakCoefficient: 2,
    });
    expect(rel(maxThrust_N(pp, atmosphereAt(0), 0.4), expected * 10_000)).toBeLessThan(1e-5);
  });

  it('the high-bypass lapse makes the light-jet example honest: ~5.4 kN of 28 kN at FL350, M 0.72', () => {
    const pp = { ...jet({ engineClass: 'highBypass', throttleRatio: 1 }), maxThrustSL_N: 28_000 };
    // Issue 12's figure; 28 000 × 0.19416 = 5436 N (REFERENCES.md α).
    expect(rel(maxThrust_N(pp, atmosphereAt(10_668), 0.72), 5436.5)).toBeLessThan(1e-4);
  });

  it('thrust is finite and ≥ 0 for every class, altitude, ISA offset and subsonic Mach (property)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom('highBypass', 'lowBypass', 'turbojet' as const),
        fc.double({ min: 0.8, max: 1.3, noNaN: true }),
        fc.double({ min: -500, max: 20_000, noNaN: true }),
        fc.double({ min: -60, max: 50, noNaN: true }),
        fc.double({ min: 0, max: 0.99, noNaN: true }),
        (engineClass, throttleRatio, H, dT, M) => {
          const T = maxThrust_N(jet({ engineClass, throttleRatio }), atmosphereAt(H, dT), M);
          expect(Number.isFinite(T)).toBe(true);
          expect(T).toBeGreaterThanOrEqual(0);
        },
      ),
      { numRuns: 500 },
    );
  });
});

describe('TSFC = (c₁ + c₂·M)·√θ (Mattingly ch. 2, from memory; hand-evaluated)', () => {
  const c1 = toSI(0.45, 'lb_lbfh');
  it('high bypass c₂/c₁ = 1.2 at 35 000 ft, M 0.72: 0.45 × 1.62431 lb/(lbf·h)', () => {
    // √θ = √(0.759355) and (1 + 1.2·0.72) = 1.864 → factor 1.624307 (hand evaluation).
    const got = tsfcAt_kg_Ns(jet(undefined, 1.2), atmosphereAt(10_668), 0.72);
    expect(rel(got, c1 * 1.624307)).toBeLessThan(1e-5);
  });

  it('rises with Mach at fixed θ, linearly: turbojet c₂/c₁ = 0.3/1.1 at 11 000 m', () => {
    const atm = atmosphereAt(11_000);
    const pp = jet(undefined, 0.3 / 1.1);
    // (1 + 0.3/1.1·0.8)·√(216.65/288.15) = 1.056288 (hand evaluation).
    expect(rel(tsfcAt_kg_Ns(pp, atm, 0.8), c1 * 1.056288)).toBeLessThan(1e-5);
    const at = (M: number) => tsfcAt_kg_Ns(pp, atm, M);
    expect(at(0.4)).toBeGreaterThan(at(0.2));
    // Linear in M: equal steps in Mach give equal steps in TSFC.
    expect(rel(at(0.6) - at(0.4), at(0.4) - at(0.2))).toBeLessThan(1e-9);
  });

  it('fuel flow is TSFC × thrust; without a Mach factor TSFC is the constant', () => {
    const atm = atmosphereAt(8000);
    const pp = jet(undefined, 1.2);
    expect(
      rel(jetFuelFlow_kg_s(pp, 3000, atm, 0.7), 3000 * tsfcAt_kg_Ns(pp, atm, 0.7)),
    ).toBeLessThan(1e-14);
    expect(tsfcAt_kg_Ns(jet(), atm, 0.7)).toBe(c1);
  });

  it('the density model without an exponent is refused, naming the field', () => {
    try {
      maxThrust_N(jet(), atmosphereAt(0), 0.3);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).field).toBe('thrustLapseExponent');
    }
  });
});
