/**
 * Invariants of the field-performance models (fast-check). Aircraft values are invented
 * for the test, inside the common-practice ranges of REFERENCES.md: a 1270 kg piston tourer
 * (134 kW, Gagg–Ferrar lapse, 1.9 m propeller) and a 9 t twin jet (28 kN, σ^0.8).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { fieldAir, type FieldAirInput } from '../../../core/field/air.ts';
import { landingDistance, type LandingInput } from '../../../core/field/landing.ts';
import {
  takeoffGroundRoll,
  takeoffDistance,
  type TakeoffInput,
} from '../../../core/field/takeoff.ts';
import { fieldThrustModel } from '../../../core/field/thrust.ts';
import type { Powerplant } from '../../../core/plan/schema.ts';

const fuel = { kind: 'avgas' as const, load_kg: 150, tankCapacity_L: 250 };
const piston: Powerplant = {
  type: 'propeller',
  engine: 'piston',
  maxPowerSL_W: 134000,
  lapse: { model: 'gaggFerrar' },
  criticalAltitude_m: 0,
  propEfficiency: 0.8,
  bsfc_kg_J: 7.6e-8,
  idlePowerFraction: 0.1,
  fuel,
};
const jet: Powerplant = {
  type: 'jet',
  maxThrustSL_N: 28000,
  thrustLapseExponent: 0.8,
  tsfc_kg_Ns: 1.93e-5,
  idleFuelFraction: 0.06,
  fuel: { kind: 'jetA1', load_kg: 2600, tankCapacity_L: 3400 },
};
const airframes = {
  piston: {
    pp: piston,
    mass_kg: 1200,
    wingArea_m2: 16.2,
    CD0: 0.035,
    k: 1 / (Math.PI * 0.78 * 7.4),
    CLmax: 2,
  },
  jet: {
    pp: jet,
    mass_kg: 8500,
    wingArea_m2: 29.5,
    CD0: 0.025,
    k: 1 / (Math.PI * 0.81 * 8.9),
    CLmax: 1.9,
  },
};
type Kind = keyof typeof airframes;

interface Case {
  kind: Kind;
  air: FieldAirInput;
  massScale?: number;
  headwind_m_s?: number;
  slope?: number;
}

function takeoff(c: Case): number {
  const a = airframes[c.kind];
  const { atm, pressureAltitude_m } = fieldAir(c.air);
  const input: TakeoffInput = {
    ...a,
    mass_kg: a.mass_kg * (c.massScale ?? 1),
    rho_kg_m3: atm.rho_kg_m3,
    thrust: fieldThrustModel(a.pp, atm, pressureAltitude_m, { propDiameter_m: 1.9 }),
    surface: 'dryHard',
    headwind_m_s: c.headwind_m_s ?? 0,
    slope: c.slope ?? 0,
  };
  const r = takeoffGroundRoll(input);
  if (!r.ok) throw new Error(r.reason);
  return r.groundRoll_m;
}

function landing(c: Case): number {
  const a = airframes[c.kind];
  const input: LandingInput = {
    ...a,
    mass_kg: a.mass_kg * (c.massScale ?? 1),
    rho_kg_m3: fieldAir(c.air).atm.rho_kg_m3,
    surface: 'dryHard',
    headwind_m_s: c.headwind_m_s ?? 0,
    slope: c.slope ?? 0,
  };
  const r = landingDistance(input);
  if (!r.ok) throw new Error(r.reason);
  return r.totalDistance_m;
}

const kind = fc.constantFrom<Kind>('piston', 'jet');
const sortedPair = (lo: number, hi: number) =>
  fc
    .tuple(
      fc.double({ min: lo, max: hi, noNaN: true }),
      fc.double({ min: lo, max: hi, noNaN: true }),
    )
    .filter(([a, b]) => Math.abs(a - b) > 1e-3 * (hi - lo))
    .map(([a, b]): [number, number] => (a < b ? [a, b] : [b, a]));

describe('take-off ground roll (properties; physics common practice)', () => {
  it('grows with field elevation (density altitude)', () => {
    fc.assert(
      fc.property(
        kind,
        sortedPair(0, 3000),
        fc.double({ min: -15, max: 25, noNaN: true }),
        (k, [e1, e2], dT) => {
          expect(takeoff({ kind: k, air: { elevation_m: e2, isaOffset_K: dT } })).toBeGreaterThan(
            takeoff({ kind: k, air: { elevation_m: e1, isaOffset_K: dT } }),
          );
        },
      ),
    );
  });

  it('grows with outside air temperature', () => {
    fc.assert(
      fc.property(
        kind,
        sortedPair(250, 320),
        fc.double({ min: 0, max: 2500, noNaN: true }),
        (k, [T1, T2], e) => {
          expect(takeoff({ kind: k, air: { elevation_m: e, temperature_K: T2 } })).toBeGreaterThan(
            takeoff({ kind: k, air: { elevation_m: e, temperature_K: T1 } }),
          );
        },
      ),
    );
  });

  it('grows with weight, roughly as W² (exponent between 2 and 3.5)', () => {
    // Closed form s ∝ W² (Anderson, Introduction to Flight, ch. 6); drag and friction at the
    // higher lift-off speed, and η·P/V for propellers, make it grow a little faster.
    fc.assert(
      fc.property(kind, sortedPair(0.8, 1.1), (k, [m1, m2]) => {
        const air = { elevation_m: 500 };
        const s1 = takeoff({ kind: k, air, massScale: m1 });
        const s2 = takeoff({ kind: k, air, massScale: m2 });
        const exponent = Math.log(s2 / s1) / Math.log(m2 / m1);
        expect(exponent).toBeGreaterThan(2);
        expect(exponent).toBeLessThan(3.5);
      }),
    );
  });

  it('shrinks with headwind and grows uphill', () => {
    fc.assert(
      fc.property(kind, sortedPair(-5, 15), sortedPair(-0.03, 0.03), (k, [w1, w2], [g1, g2]) => {
        const air = { elevation_m: 200 };
        expect(takeoff({ kind: k, air, headwind_m_s: w2 })).toBeLessThan(
          takeoff({ kind: k, air, headwind_m_s: w1 }),
        );
        expect(takeoff({ kind: k, air, slope: g2 })).toBeGreaterThan(
          takeoff({ kind: k, air, slope: g1 }),
        );
      }),
    );
  });

  it('total distance exceeds the ground roll', () => {
    fc.assert(
      fc.property(kind, fc.double({ min: 0, max: 2000, noNaN: true }), (k, e) => {
        const a = airframes[k];
        const { atm, pressureAltitude_m } = fieldAir({ elevation_m: e });
        const r = takeoffDistance({
          ...a,
          rho_kg_m3: atm.rho_kg_m3,
          thrust: fieldThrustModel(a.pp, atm, pressureAltitude_m, { propDiameter_m: 1.9 }),
          surface: 'shortDryGrass',
        });
        if (!r.ok) throw new Error(r.reason);
        expect(r.totalDistance_m).toBeGreaterThan(r.groundRoll_m);
        expect(r.airDistance_m).toBeGreaterThan(0);
      }),
    );
  });
});

describe('landing distance (properties; physics common practice)', () => {
  it('grows with elevation and temperature, shrinks with headwind, grows downhill', () => {
    fc.assert(
      fc.property(
        kind,
        sortedPair(0, 3000),
        sortedPair(-5, 12),
        sortedPair(-0.03, 0.03),
        (k, [e1, e2], [w1, w2], [g1, g2]) => {
          expect(landing({ kind: k, air: { elevation_m: e2 } })).toBeGreaterThan(
            landing({ kind: k, air: { elevation_m: e1 } }),
          );
          expect(landing({ kind: k, air: { elevation_m: e1, isaOffset_K: 20 } })).toBeGreaterThan(
            landing({ kind: k, air: { elevation_m: e1, isaOffset_K: 0 } }),
          );
          const air = { elevation_m: 100 };
          expect(landing({ kind: k, air, headwind_m_s: w2 })).toBeLessThan(
            landing({ kind: k, air, headwind_m_s: w1 }),
          );
          // A landing uphill (g2) stops shorter than one downhill (g1).
          expect(landing({ kind: k, air, slope: g2 })).toBeLessThan(
            landing({ kind: k, air, slope: g1 }),
          );
        },
      ),
    );
  });
});
