/**
 * The final reserve at normal cruise (core/solver/finalReserve.ts): the hold time flown at
 * the plan's cruise speed schedule, checked against the same physics written out again and
 * integrated with odex (an independent ODE integrator): level flight L = W at the cruise
 * TAS, D = ½ρV²S(CD0 + k·CL²) (Anderson, Introduction to Flight, ch. 6), fuel flow = TSFC × D
 * for the jet (definition of TSFC), the ISA air of core/atmosphere.ts (ISA, ICAO Doc 7488,
 * tested against its table elsewhere). The reserve rule itself is common practice (e.g.
 * 14 CFR 91.151(a): a time at normal cruising speed).
 */
import { describe, expect, it } from 'vitest';
import { atmosphereAt } from '../../../core/atmosphere.ts';
import { normalCruiseOf } from '../../../core/solver/finalReserve.ts';
import { solvePlan } from '../../../core/solver/solve.ts';
import { G0 } from '../../../core/units.ts';
import {
  ANDERSON_JET,
  climb,
  cruise,
  jetPowerplant,
  makePlan,
  odexSolve,
  rel,
} from './fixtures.ts';

const k = 1 / ((Math.PI * ANDERSON_JET.e * ANDERSON_JET.span ** 2) / ANDERSON_JET.S);
const tsfc_kg_Ns = ANDERSON_JET.ct_1_s / G0;

/** Fuel burned holding TAS V level at altitude h for t seconds from mass m0, by odex. */
function odexHoldFuel(m0: number, V: number, h: number, t: number): number {
  const rho = atmosphereAt(h).rho_kg_m3;
  const q = 0.5 * rho * V * V;
  const rate = (m: number) => {
    const CL = (m * G0) / (q * ANDERSON_JET.S);
    const D = q * ANDERSON_JET.S * (ANDERSON_JET.CD0 + k * CL * CL);
    return tsfc_kg_Ns * D;
  };
  const [m1] = odexSolve((_t, y) => [-rate(y[0]!)], 0, [m0], t);
  return m0 - m1!;
}

describe('final reserve at normal cruise', () => {
  const V = 180;
  const hold = 2700;

  it('equals the hold time at the cruise speed schedule: odex to 1e-6', () => {
    // Cruise at 180 m/s TAS at the field's elevation, hold there (no climb to it).
    const plan = makePlan(
      'jet',
      [
        cruise({
          speed: { kind: 'tas', speed_m_s: V },
          end: { by: 'distance', distance_m: 300_000 },
        }),
      ],
      { powerplant: jetPowerplant(), reserves: { holdTime_s: hold, holdAltitude_m: 0 } },
    );
    const r = solvePlan(plan);
    const f = r.reserve.final;
    expect(f.rule).toBe('normalCruise'); // the default (no finalReserveSpeed in the file)
    expect(f.cruiseLegIndex).toBe(0);
    expect(f.climb).toBe(0);
    const m0 = r.legs[0]!.end.mass_kg;
    const expected = odexHoldFuel(m0, V, 0, hold);
    expect(rel(f.timed, expected)).toBeLessThan(1e-6);
    expect(rel(r.reserve.required.hold, expected)).toBeLessThan(1e-6);
    expect(rel(f.tas_m_s, V)).toBeLessThan(1e-9); // flown at the cruise TAS
    // minutes: the required reserve over the mean rate of the timed part
    expect(rel(r.reserve.requiredTime_s, (r.reserve.required.total / f.timed) * hold)).toBeLessThan(
      1e-12,
    );
  });

  it('at the hold altitude after the climb from the field, which is counted', () => {
    const h = 3000;
    const plan = makePlan(
      'jet',
      [
        cruise({
          speed: { kind: 'tas', speed_m_s: V },
          end: { by: 'distance', distance_m: 300_000 },
        }),
      ],
      { reserves: { holdTime_s: hold, holdAltitude_m: h } },
    );
    const r = solvePlan(plan);
    const f = r.reserve.final;
    expect(f.level).toBe('holdAltitude');
    expect(f.altitude_m).toBe(h);
    expect(f.climb).toBeGreaterThan(0);
    const mTop = r.legs[0]!.end.mass_kg - f.climb;
    expect(rel(f.timed, odexHoldFuel(mTop, V, h, hold))).toBeLessThan(1e-6);
    expect(rel(r.reserve.required.hold, f.climb + f.timed)).toBeLessThan(1e-14);
  });

  it('at the last cruise altitude when the policy says so', () => {
    const plan = makePlan(
      'jet',
      [
        climb({ toAltitude_m: 4000, speed: { kind: 'bestRate' }, throttle: 1 }),
        cruise({
          speed: { kind: 'tas', speed_m_s: V },
          end: { by: 'distance', distance_m: 200_000 },
        }),
      ],
      { arrival_m: 4000, reserves: { holdTime_s: hold, finalReserveLevel: 'lastCruise' } },
    );
    expect(normalCruiseOf(plan)).toMatchObject({ altitude_m: 4000, legIndex: 1 });
    const r = solvePlan(plan);
    const f = r.reserve.final;
    expect(f.level).toBe('lastCruise');
    expect(f.altitude_m).toBe(4000);
    expect(f.climb).toBe(0); // the mission ends at 4000 m here
    expect(rel(f.timed, odexHoldFuel(r.legs[1]!.end.mass_kg, V, 4000, hold))).toBeLessThan(1e-6);
  });

  it('best endurance burns less per hour than normal cruise (the rule matters)', () => {
    const legs = [
      cruise({
        speed: { kind: 'tas', speed_m_s: V },
        end: { by: 'distance', distance_m: 300_000 },
      }),
    ];
    const atCruise = solvePlan(makePlan('jet', legs, { reserves: { holdTime_s: hold } }));
    const atEndurance = solvePlan(
      makePlan('jet', legs, { reserves: { holdTime_s: hold, finalReserveSpeed: 'bestEndurance' } }),
    );
    expect(atEndurance.reserve.final.rule).toBe('bestEndurance');
    // Least drag is least jet fuel flow (definition of best endurance for a jet).
    expect(atEndurance.reserve.final.timed).toBeLessThan(atCruise.reserve.final.timed);
  });
});
