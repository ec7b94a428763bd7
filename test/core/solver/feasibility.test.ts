import { describe, expect, it } from 'vitest';
import { atmosphereAt, pressureAltitudeFromPressure } from '../../../core/atmosphere.ts';
import { rangePropConstantAltitudeSpeed } from '../../../core/breguet.ts';
import { describeCheck } from '../../../core/solver/describe.ts';
import { InputError } from '../../../core/errors.ts';
import { fuelDensity_kg_L } from '../../../core/propulsion/index.ts';
import { guardResult } from '../../../core/solver/guard.ts';
import { solvePlan } from '../../../core/solver/solve.ts';
import type { PlanResult } from '../../../core/solver/types.ts';
import { G0 } from '../../../core/units.ts';
import {
  ANDERSON_JET,
  ANDERSON_PROP,
  climb,
  cruise,
  electricPowerplant,
  landing,
  makePlan,
  numbersIn,
  propPowerplant,
  rel,
} from './fixtures.ts';

const check = (r: PlanResult, id: string) => r.checks.find((c) => c.id === id);
const allFinite = (r: PlanResult) => numbersIn(r).every(([, v]) => Number.isFinite(v));

describe('feasibility checks, each broken on purpose', () => {
  it('overweight: take-off mass above MTOW fails the mtow check (the legs are still flown)', () => {
    const m0 = ANDERSON_PROP.W0_N / G0;
    const r = solvePlan(
      makePlan('propeller', [cruise()], {
        aircraft: (a) => ({ ...a, mass: { ...a.mass, mtow_kg: 1200 } }),
      }),
    );
    const c = check(r, 'mtow')!;
    expect(c.state).toBe('fails');
    expect(rel(c.value, m0)).toBeLessThan(1e-12);
    expect(rel(c.margin, (1200 - m0) / 1200)).toBeLessThan(1e-12); // margin definition (types.ts)
    expect(r.completed).toBe(true);
    expect(r.verdict).toBe('fails');
  });

  it('a take-off mass within 10 % of MTOW is tight', () => {
    const m0 = ANDERSON_PROP.W0_N / G0;
    const r = solvePlan(
      makePlan('propeller', [cruise()], {
        aircraft: (a) => ({ ...a, mass: { ...a.mass, mtow_kg: m0 * 1.05 } }),
      }),
    );
    expect(check(r, 'mtow')!.state).toBe('tight');
  });

  it('fuel over the tank capacity fails the tank check (volume by the fuel density)', () => {
    const pp = propPowerplant({ fuel: { kind: 'avgas', load_kg: 166, tankCapacity_L: 200 } });
    const r = solvePlan(makePlan('propeller', [cruise()], { powerplant: pp }));
    const c = check(r, 'tank')!;
    expect(c.state).toBe('fails');
    expect(c.quantity).toBe('volume');
    expect(
      rel(
        c.value,
        (166 / fuelDensity_kg_L({ kind: 'avgas', load_kg: 166, tankCapacity_L: 200 })) * 1e-3,
      ),
    ).toBeLessThan(1e-12);
    expect(c.limit).toBeCloseTo(0.2, 12);
  });

  it('a reserve not kept fails the reserve check', () => {
    const r = solvePlan(
      makePlan('propeller', [cruise({ end: { by: 'distance', distance_m: 1_500_000 } })], {
        reserves: { holdTime_s: 6 * 3600 },
      }),
    );
    expect(r.completed).toBe(true);
    expect(r.reserve.kept).toBe(false);
    expect(check(r, 'reserve')!.state).toBe('fails');
    expect(r.verdict).toBe('fails');
  });

  it('a fixed speed below the stall margin fails the leg, naming the speed and the limit', () => {
    // V_stall = √(2·13127.5/(1.225·16.165·2)) = 25.75 m/s at sea level; 1.2·V_stall = 30.9 m/s.
    const r = solvePlan(
      makePlan('propeller', [
        cruise({ speed: { kind: 'tas', speed_m_s: 30 } }),
        landing({ by: 'fuel', fuel_kg: 1 }),
      ]),
    );
    expect(r.legs[0]!.status).toBe('failed');
    expect(r.legs[0]!.error).toMatch(
      /airspeed 30 m\/s is below 1\.2 × stall speed \(30\.9\d* m\/s\)/,
    );
    expect(r.legs[1]!.status).toBe('notReached');
    expect(r.failure?.legIndex).toBe(0);
    expect(check(r, 'stall:0')!.state).toBe('fails');
    expect(allFinite(r)).toBe(true);
  });

  it('a power shortfall fails the leg, naming power required and available', () => {
    const r = solvePlan(
      makePlan('propeller', [cruise({ speed: { kind: 'tas', speed_m_s: 100 } })]),
    );
    expect(r.legs[0]!.status).toBe('failed');
    expect(r.legs[0]!.error).toMatch(/needs \d+ W of thrust power but only \d+ W is available/);
    expect(check(r, 'power:0')!.state).toBe('fails');
    expect(r.verdict).toBe('fails');
  });

  it('climbing above the aircraft ceiling fails the one plan-level ceiling check', () => {
    const r = solvePlan(
      makePlan('propeller', [
        climb({ toAltitude_m: 3000 }),
        cruise({ end: { by: 'distance', distance_m: 20_000 } }),
        climb({ toAltitude_m: 5500 }),
        cruise({ end: { by: 'distance', distance_m: 20_000 } }),
      ]),
    );
    expect(r.legs[2]!.status).toBe('flown');
    const ceilings = r.checks.filter((c) => c.id.startsWith('ceiling'));
    expect(ceilings.map((c) => c.id)).toEqual(['ceiling']);
    const c = ceilings[0]!;
    expect(c.state).toBe('fails');
    expect(c.legIndex).toBeNull();
    // The highest point is the top of the second climb (5500 m, the fixture's ceiling is 5000 m).
    expect(c.value).toBeCloseTo(5500, 6);
    expect(c.limit).toBe(5000);
    expect(c.subject).toMatch(/^Leg 3 /);
    expect(check(r, 'climb:0')!.quantity).toBe('verticalSpeed');
  });

  it('the ceiling is compared with the pressure altitude (low QNH: higher than above MSL)', () => {
    const qnh = 98_000;
    const r = solvePlan(
      makePlan('propeller', [climb({ toAltitude_m: 3000 })], { environment: { qnh_Pa: qnh } }),
    );
    const c = check(r, 'ceiling')!;
    // Hp = h + Hp(QNH) (core/atmosphere.ts; 1976 U.S. Standard Atmosphere pressure relation).
    const offset = pressureAltitudeFromPressure(qnh);
    expect(offset).toBeGreaterThan(250);
    expect(rel(c.value, 3000 + offset)).toBeLessThan(1e-9);
    expect(c.detail).toMatch(/^Highest pressure altitude \d+ m \(Leg 1 \(climb\)\)/);
    expect(describeCheck(c, 'si')).toMatch(/^Highest pressure altitude /);
  });

  it('a jet power check carries the thrust; per-leg sentences do not repeat the leg', () => {
    const V = 200;
    const h = 5000;
    const r = solvePlan(
      makePlan(
        'jet',
        [
          cruise({
            speed: { kind: 'tas', speed_m_s: V },
            end: { by: 'distance', distance_m: 100_000 },
          }),
        ],
        { departure_m: h },
      ),
    );
    const c = check(r, 'power:0')!;
    // Level flight: thrust = drag D = q·S·(CD0 + k·CL²) at the heaviest point, the start
    // (Anderson, Introduction to Flight, ch. 6); available T_SL·σ^0.8 (fixture lapse).
    const atm = atmosphereAt(h);
    const q = 0.5 * atm.rho_kg_m3 * V * V;
    const CL = ANDERSON_JET.W0_N / (q * ANDERSON_JET.S);
    const kJet = 1 / ((Math.PI * ANDERSON_JET.e * ANDERSON_JET.span ** 2) / ANDERSON_JET.S);
    const D = q * ANDERSON_JET.S * (ANDERSON_JET.CD0 + kJet * CL * CL);
    expect(rel(c.thrustRequired_N!, D)).toBeLessThan(1e-9);
    expect(rel(c.thrustAvailable_N!, 40_000 * atm.sigma ** 0.8)).toBeLessThan(1e-9);
    expect(rel(c.value, D * V)).toBeLessThan(1e-9);
    expect(describeCheck(c, 'aviation')).toMatch(/^Needs \d+ lbf of thrust, \d+ lbf available\.$/);
    expect(c.label).toBe('Leg 1 (cruise): power');
    for (const x of r.checks) expect(x.detail).not.toMatch(/^Leg \d/);
  });

  it('going below the battery floor fails the socFloor check', () => {
    const r = solvePlan(
      makePlan('electric', [cruise({ end: { by: 'distance', distance_m: 20_000 } })], {
        reserves: { socFloor: 0.9 },
      }),
    );
    const c = check(r, 'socFloor')!;
    expect(c.state).toBe('fails');
    expect(c.value).toBeLessThan(0.9);
    expect(rel(c.value, r.landing.soc)).toBeLessThan(1e-12);
  });

  it('fuel exhausted mid-leg: the leg fails there and the result holds everything up to it', () => {
    const V = 55;
    const r = solvePlan(
      makePlan('propeller', [
        cruise({
          end: { by: 'distance', distance_m: 5_000_000 },
          speed: { kind: 'tas', speed_m_s: V },
        }),
        landing({ by: 'fuel', fuel_kg: 1 }),
      ]),
    );
    const leg = r.legs[0]!;
    expect(leg.status).toBe('failed');
    expect(leg.error).toMatch(/fuel exhausted after \d+ m of 5000000 m/);
    expect(leg.end.fuel_kg).toBeGreaterThanOrEqual(0);
    expect(leg.end.fuel_kg).toBeLessThan(1e-6);
    // Where the fuel runs out: the propeller range at constant altitude and speed burning the
    // whole load (Anderson, Introduction to Flight, ch. 6, core/breguet.ts).
    const R = rangePropConstantAltitudeSpeed({
      eta: ANDERSON_PROP.eta,
      cp: ANDERSON_PROP.bsfc_kg_J * G0,
      V,
      rho: atmosphereAt(0).rho_kg_m3,
      S: ANDERSON_PROP.S,
      CD0: ANDERSON_PROP.CD0,
      k: 1 / ((Math.PI * ANDERSON_PROP.e * ANDERSON_PROP.span ** 2) / ANDERSON_PROP.S),
      W0: ANDERSON_PROP.W0_N,
      W1: ANDERSON_PROP.W0_N - ANDERSON_PROP.fuel_N,
    });
    expect(rel(leg.groundDistance_m, R)).toBeLessThan(1e-6);
    expect(r.totals.groundDistance_m).toBe(leg.groundDistance_m);
    expect(leg.series.x_m.at(-1)).toBe(leg.end.x_m);
    expect(r.legs[1]!.status).toBe('notReached');
    expect(r.completed).toBe(false);
    expect(allFinite(r)).toBe(true);
  });

  it('a cruise by fuel asking for more than is on board flies until empty and fails', () => {
    const r = solvePlan(makePlan('propeller', [cruise({ end: { by: 'fuel', fuel_kg: 500 } })]));
    expect(r.legs[0]!.status).toBe('failed');
    expect(r.legs[0]!.end.fuel_kg).toBe(0);
    expect(r.failure?.message).toMatch(/asks for 500 kg/);
  });

  it('a battery exhausted mid-leg reports the battery', () => {
    const r = solvePlan(
      makePlan('electric', [cruise({ end: { by: 'distance', distance_m: 500_000 } })], {
        powerplant: electricPowerplant(),
      }),
    );
    expect(r.legs[0]!.error).toMatch(/usable battery energy exhausted/);
    expect(r.landing.remaining).toBeGreaterThanOrEqual(0);
  });
});

describe('the finiteness guard', () => {
  it('replaces a non-finite number by 0 and turns it into a plan failure', () => {
    const r = solvePlan(makePlan('propeller', [cruise()]));
    r.legs[0]!.series.h_m[3] = Number.NaN;
    r.totals.time_s = Infinity;
    const g = guardResult(r);
    expect(g.legs[0]!.series.h_m[3]).toBe(0);
    expect(g.totals.time_s).toBe(0);
    expect(g.completed).toBe(false);
    expect(g.verdict).toBe('fails');
    expect(g.failure?.message).toMatch(
      /^internal: a non-finite number at legs\[0\]\.series\.h_m\[3\]/,
    );
    expect(g.warnings.some((w) => w.startsWith('internal'))).toBe(true);
  });

  it('bad options are refused with InputError (plans never are)', () => {
    const plan = makePlan('propeller', [cruise()]);
    expect(() => solvePlan(plan, { samplesPerLeg: 1 })).toThrow(InputError);
    expect(() => solvePlan(plan, { samplesPerLeg: 2.5 })).toThrow(/samplesPerLeg/);
  });
});
