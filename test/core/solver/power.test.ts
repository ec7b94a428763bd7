/**
 * The solver's unvalidated powerplant evaluation (core/solver/power.ts) must give the same
 * numbers as the validated models of core/propulsion/index.ts, which it stands in for inside
 * the integrator; and the still-air lift coefficients of core/solver/optimumCL.ts must match
 * the polar optima of core/polar.ts and Traub's best-range speed.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { atmosphereAt } from '../../../core/atmosphere.ts';
import { electricBestRangeSpeedTraub } from '../../../core/electricEndurance.ts';
import type { Powerplant } from '../../../core/plan/schema.ts';
import {
  jetBestRangePoint,
  maxLiftToDrag,
  minPowerPoint,
  type PolarCoefficients,
} from '../../../core/polar.ts';
import { availableThrustPower_W, consumptionRate } from '../../../core/propulsion/index.ts';
import { goldenSection } from '../../../core/solver/optimize1d.ts';
import { clMaximizing, optimumCL } from '../../../core/solver/optimumCL.ts';
import {
  availablePower_W,
  consumption,
  engineMaximum,
  powerConstants,
} from '../../../core/solver/power.ts';
import { electricPowerplant, jetPowerplant, propPowerplant, rel } from './fixtures.ts';

const powerplants: [string, Powerplant][] = [
  ['jet with idle', jetPowerplant({ idleFuelFraction: 0.06 })],
  [
    'jet, high-bypass lapse and Mach TSFC',
    jetPowerplant({
      idleFuelFraction: 0.06,
      thrustLapse: { engineClass: 'highBypass', throttleRatio: 1.05 },
      tsfcMachFactor: 1.2,
    }),
  ],
  [
    'jet, turbojet lapse, throttle break at sea-level static',
    jetPowerplant({ thrustLapse: { engineClass: 'turbojet', throttleRatio: 1 } }),
  ],
  [
    'jet, low-bypass lapse with overridden coefficients',
    jetPowerplant({
      thrustLapse: {
        engineClass: 'lowBypass',
        throttleRatio: 1.02,
        machCoefficient: 0.1,
        breakCoefficient: 3,
      },
      tsfcMachFactor: 0.33,
    }),
  ],
  [
    'turbocharged propeller with idle',
    propPowerplant({ idlePowerFraction: 0.1, criticalAltitude_m: 3000 }),
  ],
  ['propeller, σ^0.8 lapse', propPowerplant({ lapse: { model: 'densityPower', exponent: 0.8 } })],
  ['electric, Peukert 1.25', electricPowerplant({}, { peukertExponent: 1.25 })],
  ['electric, ideal pack', electricPowerplant()],
  [
    'propeller, momentum-theory curve',
    propPowerplant({
      idlePowerFraction: 0.1,
      propeller: {
        model: 'momentum',
        diameter_m: 1.9,
        cruiseAltitude_m: 2000,
        cruisePowerFraction: 0.75,
        cruiseSpeed_m_s: 60,
      },
    }),
  ],
  [
    'electric, η(V) table',
    electricPowerplant(
      {
        propeller: {
          model: 'table',
          by: 'airspeed',
          points: [
            { x: 5, efficiency: 0.4 },
            { x: 12, efficiency: 0.7 },
            { x: 25, efficiency: 0.78 },
          ],
        },
      },
      { peukertExponent: 1.1 },
    ),
  ],
];

describe('power.ts agrees with core/propulsion (same models, validated once)', () => {
  for (const [name, pp] of powerplants) {
    it(`${name}: available power and consumption over altitude, speed and demand`, () => {
      const c = powerConstants(pp, atmosphereAt(0));
      fc.assert(
        fc.property(
          fc.double({ min: -300, max: 12_000, noNaN: true }),
          fc.double({ min: 5, max: 250, noNaN: true }),
          fc.double({ min: -2e5, max: 2e6, noNaN: true }),
          (Hp, V, P) => {
            const atm = atmosphereAt(Hp, 10);
            const max = engineMaximum(pp, atm, Hp);
            // Identical formulas; only the order of a product or two may differ (rounding).
            const rho = atm.rho_kg_m3;
            const avail = availableThrustPower_W(pp, atm, Hp, V);
            expect(rel(availablePower_W(c, { atm, engineMax: max }, V, rho), avail)).toBeLessThan(
              1e-14,
            );
            const rate = consumptionRate(pp, P, V, atm, Hp);
            const mine = consumption(c, { atm, engineMax: max }, P, V, rho);
            if (rate === 0) expect(mine).toBe(0);
            else expect(rel(mine, rate)).toBeLessThan(1e-13);
          },
        ),
        { numRuns: 300 },
      );
    });
  }
});

describe('still-air optimum lift coefficients', () => {
  // A cambered polar (CLminD ≠ 0) exercises the general root; values from memory, typical of
  // a light aircraft.
  const polars: PolarCoefficients[] = [
    { CD0: 0.025, k: 0.054, CLminD: 0, CLmax: 1.6 },
    { CD0: 0.02, k: 0.045, CLminD: 0.2, CLmax: 1.5 },
    { CD0: 0.03, k: 0.06, CLminD: -0.1, CLmax: 1.4 },
  ];
  for (const c of polars) {
    it(`match core/polar.ts (CLminD = ${c.CLminD}) and a golden-section search`, () => {
      // Anderson, Introduction to Flight, ch. 6: (L/D)max, max CL^1.5/CD, max CL^0.5/CD.
      expect(rel(clMaximizing(c, 1), maxLiftToDrag(c).CL)).toBeLessThan(1e-14);
      expect(rel(clMaximizing(c, 1.5), minPowerPoint(c).CL)).toBeLessThan(1e-14);
      expect(rel(clMaximizing(c, 0.5), jetBestRangePoint(c).CL)).toBeLessThan(1e-14);
      // Any 0 < m < 2: the maximum of CL^m/CD found numerically; a golden-section search
      // locates a maximum to about √ε only (Press et al., Numerical Recipes, §10.2).
      for (const m of [0.3, 1.1875, 1.8]) {
        const f = (CL: number) => Math.pow(CL, m) / (c.CD0 + c.k * (CL - c.CLminD) ** 2);
        const found = goldenSection(f, 1e-3, 10, 1e-12);
        expect(rel(clMaximizing(c, m), found)).toBeLessThan(1e-7);
      }
    });
  }

  it('electric best range with Peukert n: Traub’s U_R for a symmetric polar', () => {
    const c: PolarCoefficients = { CD0: 0.03, k: 1 / (Math.PI * 0.85 * 9), CLminD: 0, CLmax: 1.5 };
    for (const n of [1, 1.1, 1.3, 1.6]) {
      const pp = electricPowerplant({}, { peukertExponent: n });
      const CL = optimumCL(c, powerConstants(pp, atmosphereAt(0))).range;
      const W = 2.5 * 9.80665;
      const rho = 1.225;
      const S = 0.55;
      const V = Math.sqrt((2 * W) / (rho * S * CL));
      // Traub, J. Aircraft 48(2), 2011 (REFERENCES.md): U_R = √(2W/ρS)·[k(n+1)/(CD0(3n−1))]^¼.
      const traub = electricBestRangeSpeedTraub({ W, rho, S, CD0: c.CD0, k: c.k, n });
      expect(rel(V, traub)).toBeLessThan(1e-13);
    }
  });
});
