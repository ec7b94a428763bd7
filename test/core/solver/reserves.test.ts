import { describe, expect, it } from 'vitest';
import { atmosphereAt } from '../../../core/atmosphere.ts';
import { endurancePropConstantAltitudeCL } from '../../../core/breguet.ts';
import { solvePlan } from '../../../core/solver/solve.ts';
import { G0 } from '../../../core/units.ts';
import {
  ANDERSON_PROP,
  TRAUB_UAV,
  cruise,
  landing,
  loiter,
  makePlan,
  propPowerplant,
  rel,
  takeoff,
} from './fixtures.ts';

const kProp = 1 / ((Math.PI * ANDERSON_PROP.e * ANDERSON_PROP.span ** 2) / ANDERSON_PROP.S);
const cp = ANDERSON_PROP.bsfc_kg_J * G0;

describe('reserves', () => {
  it('contingency is exactly the fraction of the trip fuel without the allowance legs', () => {
    const r = solvePlan(
      makePlan(
        'propeller',
        [
          takeoff({ by: 'fuel', fuel_kg: 5 }),
          cruise({ end: { by: 'distance', distance_m: 300_000 } }),
          landing({ by: 'fuel', fuel_kg: 2 }),
        ],
        { reserves: { contingencyFraction: 0.05 } },
      ),
    );
    // Definition (reserves.ts, common practice): the contingency covers the flight, not the
    // fixed taxi/take-off and landing allowances.
    const flight = r.totals.fuelUsed_kg - 5 - 2;
    expect(rel(r.reserve.required.contingency, 0.05 * flight)).toBeLessThan(1e-12);
    expect(rel(r.reserve.required.contingency, 0.05 * r.legs[1]!.fuelUsed_kg)).toBeLessThan(1e-12);
    expect(rel(r.reserve.required.total, r.reserve.required.contingency)).toBeLessThan(1e-14);
  });

  it('hold at best endurance burns what the propeller endurance closed form gives', () => {
    const hold = 3600;
    const h = 1000;
    const r = solvePlan(
      makePlan('propeller', [cruise({ end: { by: 'distance', distance_m: 200_000 } })], {
        reserves: { holdTime_s: hold, holdAltitude_m: h, finalReserveSpeed: 'bestEndurance' },
      }),
    );
    // The timed part starts at the top of the climb from the field (counted separately).
    const f = r.reserve.final;
    expect(f.climb).toBeGreaterThan(0);
    expect(rel(r.reserve.required.hold, f.climb + f.timed)).toBeLessThan(1e-14); // definition
    const W0 = (r.legs[0]!.end.mass_kg - f.climb) * G0;
    const rho = atmosphereAt(h).rho_kg_m3;
    const CL = Math.sqrt((3 * ANDERSON_PROP.CD0) / kProp);
    const CD = 4 * ANDERSON_PROP.CD0;
    // Anderson, Introduction to Flight, ch. 6: E = (η/c_p)(CL^1.5/CD)√(2ρS)(W1^−½ − W0^−½), solved for W1.
    const invSqrtW1 =
      W0 ** -0.5 +
      (hold * cp) / (ANDERSON_PROP.eta * (CL ** 1.5 / CD) * Math.sqrt(2 * rho * ANDERSON_PROP.S));
    const fuel = (W0 - invSqrtW1 ** -2) / G0;
    expect(rel(f.timed, fuel)).toBeLessThan(1e-6);
  });

  it('an alternate at the landing altitude is a cruise at best range: the propeller range closed form', () => {
    // With an alternate altitude above the landing altitude the alternate is now a climb,
    // cruise and glide (alternateReserve.ts, tested below); at the landing altitude it is the
    // level cruise this closed form describes.
    const d = 150_000;
    const r = solvePlan(
      makePlan('propeller', [cruise({ end: { by: 'distance', distance_m: 100_000 } })], {
        reserves: { alternateDistance_m: d, alternateAltitude_m: 0 },
      }),
    );
    const W0 = r.legs[0]!.end.mass_kg * G0;
    const LDmax = 1 / (2 * Math.sqrt(kProp * ANDERSON_PROP.CD0));
    // Anderson, Introduction to Flight, ch. 6: R = (η/c_p)(L/D) ln(W0/W1) at (L/D)max, solved for W1.
    const W1 = W0 * Math.exp((-d * cp) / (ANDERSON_PROP.eta * LDmax));
    expect(rel(r.reserve.required.alternate, (W0 - W1) / G0)).toBeLessThan(1e-6);
  });

  it('electric hold at the minimum-power speed uses P_min/η × t (Traub 2011, n = 1); floor = socFloor × usable', () => {
    const hold = 1200;
    // CLmax 2.5 keeps the minimum-power CL (1.47) inside the 1.2 stall margin.
    const r = solvePlan(
      makePlan('electric', [cruise({ end: { by: 'distance', distance_m: 5000 } })], {
        reserves: {
          holdTime_s: hold,
          holdAltitude_m: 0,
          socFloor: 0.2,
          finalReserveSpeed: 'bestEndurance',
        },
        aircraft: (a) => ({ ...a, polar: { ...a.polar, CLmax: 2.5 } }),
      }),
    );
    const W = TRAUB_UAV.m * G0;
    const k = 1 / (Math.PI * TRAUB_UAV.e * TRAUB_UAV.AR);
    const rho = atmosphereAt(0).rho_kg_m3;
    const CL = Math.sqrt((3 * TRAUB_UAV.CD0) / k);
    const V = Math.sqrt((2 * W) / (rho * TRAUB_UAV.S * CL));
    const P = (W * (4 * TRAUB_UAV.CD0) * V) / CL; // D·V at the minimum-power point, CD = 4·CD0
    expect(rel(P, 14.07)).toBeLessThan(1e-3); // REFERENCES.md computed example: 14.07 W
    expect(rel(r.reserve.required.hold, (P / TRAUB_UAV.eta) * hold)).toBeLessThan(1e-6);
    expect(rel(r.reserve.required.floor, 0.2 * TRAUB_UAV.energy_J)).toBeLessThan(1e-14);
    const q = r.reserve.required;
    expect(rel(q.total, q.contingency + q.alternate + q.hold + q.floor)).toBeLessThan(1e-14);
  });

  it('loiter until reserve lands with exactly the reserve required', () => {
    const plan = makePlan(
      'propeller',
      [
        takeoff({ by: 'fuel', fuel_kg: 2 }),
        cruise({ end: { by: 'distance', distance_m: 100_000 } }),
        loiter({ end: { by: 'reserve' } }),
        cruise({
          end: { by: 'distance', distance_m: 100_000 },
          course_deg: 180,
          wind: { speed_m_s: 10, from_deg: 200 },
        }),
        landing({ by: 'fuel', fuel_kg: 1 }),
      ],
      {
        reserves: {
          contingencyFraction: 0.05,
          holdTime_s: 1800,
          holdAltitude_m: 500,
          finalReserveSpeed: 'bestEndurance',
        },
      },
    );
    const r = solvePlan(plan);
    expect(r.completed).toBe(true);
    // The loiter is best endurance at sea level, so its time for the fuel it burns is the
    // propeller endurance at constant altitude and CL (Anderson, Introduction to Flight, ch. 6).
    const L = r.legs[2]!;
    const endurance = endurancePropConstantAltitudeCL({
      eta: ANDERSON_PROP.eta,
      cp,
      rho: atmosphereAt(0).rho_kg_m3,
      S: ANDERSON_PROP.S,
      CL: Math.sqrt((3 * ANDERSON_PROP.CD0) / kProp),
      CD: 4 * ANDERSON_PROP.CD0,
      W0: L.start.mass_kg * G0,
      W1: L.end.mass_kg * G0,
    });
    expect(rel(L.time_s, endurance)).toBeLessThan(1e-6);
    expect(L.time_s).toBeGreaterThan(3600);
    expect(rel(r.landing.remaining, r.reserve.required.total)).toBeLessThan(1e-8);
    expect(r.landing.remaining).toBeGreaterThanOrEqual(r.reserve.required.total);
    expect(r.reserve.kept).toBe(true);
    expect(r.checks.find((c) => c.id === 'reserve')?.state).toBe('tight');
  });

  it('loiter until reserve with nothing to spare loiters for 0 s and says so', () => {
    const plan = makePlan(
      'propeller',
      [
        cruise({ end: { by: 'distance', distance_m: 100_000 } }),
        loiter({ end: { by: 'reserve' } }),
      ],
      {
        reserves: { holdTime_s: 6 * 3600 },
        powerplant: propPowerplant({ fuel: { kind: 'avgas', load_kg: 50, tankCapacity_L: 300 } }),
      },
    );
    const r = solvePlan(plan);
    expect(r.legs[1]!.time_s).toBe(0);
    expect(r.warnings.some((w) => /no loiter is possible/.test(w))).toBe(true);
    expect(r.checks.find((c) => c.id === 'reserve')?.state).toBe('fails');
  });
});
