import { describe, expect, it } from 'vitest';
import { atmosphereAt } from '../../../core/atmosphere.ts';
import { solvePlan } from '../../../core/solver/solve.ts';
import type { Plan } from '../../../core/plan/schema.ts';
import { G0 } from '../../../core/units.ts';
import { energyReference, type EnergyPath } from './energyReference.ts';
import {
  ANDERSON_PROP,
  TRAUB_UAV,
  climb,
  cruise,
  descent,
  electricPowerplant,
  landing,
  makePlan,
  numbersIn,
  rel,
  takeoff,
} from './fixtures.ts';

const DEG = Math.PI / 180;

/** A 10 kg electric aircraft that is easy to check by hand (values invented for the test). */
function handPlan(legs: Plan['legs']): Plan {
  return makePlan('electric', legs, {
    powerplant: electricPowerplant(
      {
        maxShaftPower_W: 1000,
        motorEfficiency: 0.9,
        controllerEfficiency: 0.95,
        propEfficiency: 0.7,
      },
      { energy_J: 2e6, mass_kg: 2, usableFraction: 1, peukertExponent: 1 },
    ),
    aircraft: (a) => ({
      ...a,
      wingArea_m2: 1,
      polar: { CD0: 0.03, induced: { by: 'factor', k: 0.05 }, CLminD: 0, CLmax: 1.4 },
      mass: { empty_kg: 8, payload_kg: 0, mtow_kg: 12 },
    }),
  });
}

describe('a hand-checkable plan', () => {
  it('electric, 36 km at 20 m/s TAS at sea level: E = P_req/η·t', () => {
    // By hand (ISA sea level ρ = 1.225 kg/m³, no Peukert):
    //   W = 10 kg × 9.80665 = 98.0665 N; q = ½·1.225·20² = 245 Pa;
    //   CL = W/(q·S) = 98.0665/245 = 0.400271; CD = 0.03 + 0.05 × 0.400271² = 0.038011;
    //   D = q·S·CD = 9.31266 N; P_req = D·V = 186.253 W;
    //   η = 0.9 × 0.95 × 0.7 = 0.5985 → battery power 311.200 W;
    //   t = 36 000 m / 20 m/s = 1800 s → E = 311.200 × 1800 = 560 160 J.
    const r = solvePlan(
      handPlan([
        cruise({
          end: { by: 'distance', distance_m: 36_000 },
          speed: { kind: 'tas', speed_m_s: 20 },
        }),
      ]),
    );
    const leg = r.legs[0]!;
    expect(leg.status).toBe('flown');
    expect(rel(leg.time_s, 1800)).toBeLessThan(1e-9); // by hand
    expect(rel(leg.energyUsed_J, 560_160)).toBeLessThan(1e-5); // by hand, 6 digits
    const rho = atmosphereAt(0).rho_kg_m3;
    const q = 0.5 * rho * 400;
    const CL = 98.0665 / q;
    const P = q * (0.03 + 0.05 * CL * CL) * 20;
    expect(rel(leg.energyUsed_J, (P / 0.5985) * 1800)).toBeLessThan(1e-9); // same arithmetic, exact ρ
    expect(leg.series.t_s).toHaveLength(24);
    expect(leg.series.energy_J[23]).toBeCloseTo(2e6 - leg.energyUsed_J, 3);
  });
});

describe('wind (against an independent vector computation)', () => {
  function groundSpeed(
    tas: number,
    course: number,
    speed: number,
    from: number,
  ): { gs: number; heading: number } {
    // Heading found by bisection so that air + wind vectors point along the course (vectors).
    let lo = course - 89;
    let hi = course + 89;
    const cross = (hdg: number) => {
      const e = tas * Math.sin(hdg * DEG) - speed * Math.sin(from * DEG);
      const n = tas * Math.cos(hdg * DEG) - speed * Math.cos(from * DEG);
      return { off: Math.sin(Math.atan2(e, n) - course * DEG), gs: Math.hypot(e, n) };
    };
    for (let i = 0; i < 200; i++) {
      const mid = 0.5 * (lo + hi);
      if (cross(mid).off > 0) hi = mid;
      else lo = mid;
    }
    const heading = 0.5 * (lo + hi);
    return { gs: cross(heading).gs, heading: ((heading % 360) + 360) % 360 };
  }

  for (const [name, from] of [
    ['head', 0],
    ['tail', 180],
    ['cross', 90],
    ['quartering', 225],
  ] as const) {
    it(`${name} wind 8 m/s: time = distance / ground speed, air distance = TAS × time`, () => {
      const r = solvePlan(
        handPlan([
          cruise({
            course_deg: 0,
            wind: { speed_m_s: 8, from_deg: from },
            end: { by: 'distance', distance_m: 36_000 },
            speed: { kind: 'tas', speed_m_s: 20 },
          }),
        ]),
      );
      const leg = r.legs[0]!;
      const { gs, heading } = groundSpeed(20, 0, 8, from);
      const dh = Math.abs(leg.heading_deg - heading) % 360;
      expect(Math.min(dh, 360 - dh)).toBeLessThan(1e-9);
      expect(rel(leg.time_s, 36_000 / gs)).toBeLessThan(1e-9);
      expect(rel(leg.airDistance_m, 20 * leg.time_s)).toBeLessThan(1e-9);
      expect(rel(leg.meanGroundSpeed_m_s, gs)).toBeLessThan(1e-9);
    });
  }

  it('a crosswind stronger than the airspeed fails the leg with a message, not NaN', () => {
    const r = solvePlan(
      handPlan([
        cruise({ wind: { speed_m_s: 25, from_deg: 90 }, speed: { kind: 'tas', speed_m_s: 20 } }),
        landing({ by: 'energy', energy_J: 0 }),
      ]),
    );
    expect(r.completed).toBe(false);
    expect(r.legs[0]!.status).toBe('failed');
    expect(r.legs[0]!.error).toMatch(/wind \(25 m\/s\).*20 m\/s true airspeed/);
    expect(r.legs[1]!.status).toBe('notReached');
    expect(numbersIn(r).every(([, v]) => Number.isFinite(v))).toBe(true);
  });
});

describe('chart series', () => {
  it('every flight leg has 24 samples from its start to its end; allowances have 2', () => {
    const r = solvePlan(
      makePlan('propeller', [
        takeoff({ by: 'fuel', fuel_kg: 2 }),
        climb({ toAltitude_m: 1500 }),
        cruise({ end: { by: 'distance', distance_m: 200_000 } }),
        descent({ toAltitude_m: 300 }),
        landing({ by: 'fuel', fuel_kg: 1 }),
      ]),
    );
    expect(r.completed).toBe(true);
    for (const leg of r.legs) {
      const n = leg.kind === 'takeoff' || leg.kind === 'landing' ? 2 : 24;
      for (const s of Object.values(leg.series)) expect(s).toHaveLength(n);
      expect(leg.series.t_s[0]).toBe(leg.start.t_s);
      expect(leg.series.t_s[n - 1]).toBe(leg.end.t_s);
      expect(leg.series.h_m[0]).toBeCloseTo(leg.start.h_m, 9);
      expect(leg.series.h_m[n - 1]).toBeCloseTo(leg.end.h_m, 9);
      expect(leg.series.fuel_kg[n - 1]).toBe(leg.end.fuel_kg);
      for (let i = 1; i < n; i++)
        expect(leg.series.t_s[i]!).toBeGreaterThanOrEqual(leg.series.t_s[i - 1]!);
    }
  });
});

describe('allowances', () => {
  it('take-off by fuel, by mass fraction and by time at maximum power; landing by time at approach power (propeller)', () => {
    const plan = makePlan('propeller', [
      takeoff({ by: 'fuel', fuel_kg: 5 }),
      takeoff({ by: 'massFraction', fraction: 0.01 }),
      takeoff({ by: 'time', time_s: 60 }),
      landing({ by: 'time', time_s: 120 }),
    ]);
    const r = solvePlan(plan);
    const m0 = ANDERSON_PROP.W0_N / G0;
    expect(rel(r.legs[0]!.fuelUsed_kg, 5)).toBeLessThan(1e-12);
    expect(rel(r.legs[1]!.fuelUsed_kg, 0.01 * (m0 - 5))).toBeLessThan(1e-12);
    // Gagg–Ferrar at σ = 1 gives the full sea-level power; fuel = BSFC·P·t (propulsion model).
    expect(
      rel(r.legs[2]!.fuelUsed_kg, ANDERSON_PROP.bsfc_kg_J * ANDERSON_PROP.maxPower_W * 60),
    ).toBeLessThan(1e-12);
    // Landing: the level-flight power required at 1.3 × V_stall (CLmax 2, no flaps given;
    // common practice), D·V from the polar (Anderson, Introduction to Flight, ch. 6), shaft
    // power D·V/η, fuel = BSFC × shaft power × time (idle floor 0).
    const m = r.legs[3]!.start.mass_kg;
    const rho = atmosphereAt(0).rho_kg_m3;
    const S = ANDERSON_PROP.S;
    const Vs = Math.sqrt((2 * m * G0) / (rho * S * 2));
    const V = 1.3 * Vs;
    const q = 0.5 * rho * V * V;
    const CL = (m * G0) / (q * S);
    const kk = 1 / ((Math.PI * ANDERSON_PROP.e * ANDERSON_PROP.span ** 2) / S);
    const P = q * S * (ANDERSON_PROP.CD0 + kk * CL * CL) * V;
    const fuel = ANDERSON_PROP.bsfc_kg_J * (P / ANDERSON_PROP.eta) * 120;
    expect(rel(r.legs[3]!.fuelUsed_kg, fuel)).toBeLessThan(1e-12);
    // Well below the old charge at maximum power (the approach needs about 27 % of it here).
    expect(r.legs[3]!.fuelUsed_kg).toBeLessThan(
      0.5 * ANDERSON_PROP.bsfc_kg_J * ANDERSON_PROP.maxPower_W * 120,
    );
    expect(r.legs[3]!.time_s).toBe(120);
    expect(rel(r.legs[3]!.end.mass_kg, m0 - r.totals.fuelUsed_kg)).toBeLessThan(1e-12);
  });

  it('an electric aircraft cannot take an allowance as a fuel mass fraction', () => {
    const r = solvePlan(makePlan('electric', [takeoff({ by: 'massFraction', fraction: 0.01 })]));
    expect(r.legs[0]!.status).toBe('failed');
    expect(r.failure?.message).toMatch(/mass fraction needs a fuel-burning powerplant/);
  });
});

describe('climb and descent (against odex quadrature of the energy equation, energyReference.ts)', () => {
  const W = TRAUB_UAV.m * G0;
  const k = 1 / (Math.PI * TRAUB_UAV.e * TRAUB_UAV.AR);
  /** Traub 2011 power required at TAS V and density ρ. */
  const Preq = (rho: number, V: number) =>
    0.5 * rho * V ** 3 * TRAUB_UAV.S * TRAUB_UAV.CD0 + (2 * W * W * k) / (rho * V * TRAUB_UAV.S);
  const eas = 10;
  const tasAt = (h: number) => eas / Math.sqrt(atmosphereAt(h).sigma);
  /** 240 W of thrust power at full throttle (η_p·P_shaft = 0.8 × 300 W). */
  const uavClimb = (tau: number): EnergyPath => ({
    tas: tasAt,
    thrustPower: () => tau * 240,
    drag: (h, V) => Preq(atmosphereAt(h).rho_kg_m3, V) / V,
    consumption: () => (tau * 240) / 0.6, // battery drain, chain η = 0.6, n = 1
    burnsMass: false,
  });

  it('time, distance and energy to climb at constant EAS match the energy equation', () => {
    const tau = 0.3;
    const r = solvePlan(
      makePlan('electric', [
        climb({ toAltitude_m: 3000, speed: { kind: 'eas', speed_m_s: eas }, throttle: tau }),
      ]),
    );
    const leg = r.legs[0]!;
    expect(leg.status).toBe('flown');
    const ref = energyReference(uavClimb(tau), 0, 3000, TRAUB_UAV.m);
    expect(rel(leg.time_s, ref.time_s)).toBeLessThan(1e-7); // odex, energy equation
    expect(rel(leg.groundDistance_m, ref.groundDistance_m)).toBeLessThan(1e-7);
    expect(rel(leg.energyUsed_J, ref.used)).toBeLessThan(1e-7);
    expect(rel(leg.meanTas_m_s, ref.path_m / ref.time_s)).toBeLessThan(1e-7);
  });

  it('fails where the rate of climb falls below 0.5 m/s, naming that altitude', () => {
    const tau = 0.14;
    const r = solvePlan(
      makePlan(
        'electric',
        [
          climb({ toAltitude_m: 6000, speed: { kind: 'eas', speed_m_s: eas }, throttle: tau }),
          cruise(),
        ],
        {
          powerplant: electricPowerplant({}, { energy_J: 5e6 }),
        },
      ),
    );
    // Energy equation: ḣ·(1 + (V/g)·dV/dh) = (T − D)V/W; dV/dh by a 1 cm central difference.
    const roc = (h: number) => {
      const V = tasAt(h);
      const dVdh = (tasAt(h + 0.01) - tasAt(h - 0.01)) / 0.02;
      return (tau * 240 - Preq(atmosphereAt(h).rho_kg_m3, V)) / (W * (1 + (V / G0) * dVdh));
    };
    // Ceiling by bisection on ROC(h) = 0.5 m/s (computed here; mass is constant).
    let lo = 0;
    let hi = 6000;
    for (let i = 0; i < 100; i++) {
      const mid = 0.5 * (lo + hi);
      if (roc(mid) > 0.5) lo = mid;
      else hi = mid;
    }
    const leg = r.legs[0]!;
    expect(leg.status).toBe('failed');
    expect(rel(leg.end.h_m, lo)).toBeLessThan(1e-6);
    expect(leg.error).toMatch(/cannot climb above \d+ m: rate of climb falls below 0\.5 m\/s/);
    expect(r.legs[1]!.status).toBe('notReached');
    expect(r.failure?.legIndex).toBe(0);
  });

  it('a glide at (L/D)max matches the energy equation and uses no battery energy', () => {
    // The physics changed with the acceleration factor: a glide at constant CL slows down in
    // TAS as the air thickens, and that kinetic energy flattens the path below the still-air
    // Δh·√((L/D)max² − 1) (which it now exceeds).
    const r = solvePlan(
      makePlan('electric', [descent({ toAltitude_m: 0, mode: { by: 'glide' } })], {
        departure_m: 1000,
        arrival_m: 0,
      }),
    );
    const leg = r.legs[0]!;
    const LD = 1 / (2 * Math.sqrt(k * TRAUB_UAV.CD0)); // (L/D)max, Anderson ch. 6
    const CL = Math.sqrt(TRAUB_UAV.CD0 / k);
    const ref = energyReference(
      {
        tas: (h) => Math.sqrt((2 * W) / (atmosphereAt(h).rho_kg_m3 * TRAUB_UAV.S * CL)),
        thrustPower: () => 0,
        drag: () => W / LD,
        consumption: () => 0,
        burnsMass: false,
      },
      1000,
      0,
      TRAUB_UAV.m,
    );
    expect(rel(leg.groundDistance_m, ref.groundDistance_m)).toBeLessThan(1e-7); // odex
    expect(rel(leg.time_s, ref.time_s)).toBeLessThan(1e-7);
    expect(leg.groundDistance_m).toBeGreaterThan(1000 * Math.sqrt(LD * LD - 1));
    expect(leg.energyUsed_J).toBe(0);
  });

  it('a climb to a lower altitude is refused with a message', () => {
    const r = solvePlan(makePlan('electric', [climb({ toAltitude_m: 100 })], { departure_m: 500 }));
    expect(r.legs[0]!.error).toMatch(/below the current altitude/);
  });
});
