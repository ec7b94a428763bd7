/**
 * Legs flown in the winds-aloft table's weather (windSource 'aloft'): the solver's own
 * look-up (core/solver/aloft.ts) against core/weather/windsAloft.ts `windAt`, a level cruise
 * against the same leg given windAt's wind as its own, a climb through a veering layer
 * against an odex quadrature of dx/dh = GS(h)/ROC(h), and the reserves.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { atmosphereAt, pressureAltitudeFromQnh } from '../../../core/atmosphere.ts';
import type { Plan } from '../../../core/plan/schema.ts';
import { aloftIsaOffset, aloftWind } from '../../../core/solver/aloft.ts';
import { solvePlan } from '../../../core/solver/solve.ts';
import { G0 } from '../../../core/units.ts';
import { windAt, windProfile, type WindLevel } from '../../../core/weather/windsAloft.ts';
import {
  climb,
  cruise,
  electricPowerplant,
  makePlan,
  odexSolve,
  rel,
  TRAUB_UAV,
  type PlanOptions,
} from './fixtures.ts';

const DEG = Math.PI / 180;

/** A layer that veers from south through west to north with height, warmer below. */
const VEERING: WindLevel[] = [
  { altitude_m: 2000, from_deg: 360, speed_m_s: 6, isaOffset_K: -5 },
  { altitude_m: 0, from_deg: 180, speed_m_s: 4, isaOffset_K: 10 },
  { altitude_m: 1000, from_deg: 270, speed_m_s: 8 },
];

describe('the solver reads the table as windAt does', () => {
  it('wind components and ISA offset at any altitude (windAt, core/weather/windsAloft.ts)', () => {
    const profile = windProfile(VEERING);
    const out = { windEast_m_s: 0, windNorth_m_s: 0 };
    fc.assert(
      fc.property(fc.double({ min: -1000, max: 3000, noNaN: true }), (h) => {
        const w = windAt(VEERING, h);
        aloftWind(profile, h, out);
        // the same linear interpolation on vector components (windsAloft.ts, independent code)
        expect(out.windEast_m_s).toBeCloseTo(w.east_m_s, 12);
        expect(out.windNorth_m_s).toBeCloseTo(w.north_m_s, 12);
        expect(aloftIsaOffset(profile, h, 99)).toBeCloseTo(w.isaOffset_K!, 12);
      }),
    );
    // no level with a temperature: the plan's own offset stays
    expect(
      aloftIsaOffset(windProfile([{ altitude_m: 0, from_deg: 90, speed_m_s: 3 }]), 500, 7),
    ).toBe(7);
  });
});

/** One cruise leg at the departure altitude (no climb), table or own wind. */
function levelPlan(h_m: number, over: Partial<Parameters<typeof cruise>[0]>, o: PlanOptions) {
  return makePlan('propeller', [cruise({ course_deg: 65, ...over })], {
    departure_m: h_m,
    ...o,
  });
}

describe('a level cruise in the table', () => {
  for (const qnh_Pa of [101325, 99000]) {
    it(`equals the same leg with windAt's wind and temperature as its own (QNH ${qnh_Pa} Pa)`, () => {
      const h = 1400;
      // The table is indexed by pressure altitude (windsAloft.ts; common practice for winds
      // aloft): Hp = h + Hp(QNH) (atmosphere.ts pressureAltitudeFromQnh).
      const Hp = pressureAltitudeFromQnh(h, qnh_Pa);
      const w = windAt(VEERING, Hp);
      const env = { qnh_Pa, windsAloft: VEERING };
      for (const speed of [
        { kind: 'bestRange' as const },
        { kind: 'tas' as const, speed_m_s: 55 },
      ]) {
        const table = solvePlan(levelPlan(h, { windSource: 'aloft', speed }, { environment: env }));
        const own = solvePlan(
          levelPlan(
            h,
            { wind: { from_deg: w.from_deg, speed_m_s: w.speed_m_s }, speed },
            { environment: { qnh_Pa, isaOffset_K: w.isaOffset_K! } },
          ),
        );
        expect(table.completed).toBe(true);
        // windAt (core/weather/windsAloft.ts) as an independent source of the leg's weather
        expect(rel(table.totals.fuelUsed_kg, own.totals.fuelUsed_kg)).toBeLessThan(1e-9);
        expect(rel(table.totals.time_s, own.totals.time_s)).toBeLessThan(1e-9);
        expect(table.legs[0]!.headwind_m_s).toBeCloseTo(own.legs[0]!.headwind_m_s, 9);
        expect(table.legs[0]!.crosswind_m_s).toBeCloseTo(own.legs[0]!.crosswind_m_s, 9);
      }
    });
  }

  it('a leg set to the table in a plan without one fails and names legs.i.windSource', () => {
    const r = solvePlan(levelPlan(1000, { windSource: 'aloft' }, {}));
    expect(r.failure?.legIndex).toBe(0);
    expect(r.failure?.message).toMatch(/legs\.0\.windSource is 'aloft'.*environment\.windsAloft/);
  });
});

describe('a climb through a veering layer', () => {
  it('matches an odex quadrature of dx/dh = GS(h)/ROC(h), dt/dh = 1/ROC, dE/dh = −P/ROC', () => {
    // Electric UAV (mass constant, no power lapse) at a fixed TAS and throttle (Traub 2011
    // aircraft, REFERENCES.md); quasi-steady climb ROC = (τ·η_p·P_max − D·V)/W (Anderson,
    // Introduction to Flight, ch. 6); wind triangle GS = √(V_h² − cross²) − head (common
    // practice); wind and temperature from windAt (windsAloft.ts).
    const V = 12;
    const tau = 0.4;
    const course = 45;
    const pp = electricPowerplant();
    if (pp.type !== 'electric') throw new Error('electric');
    const plan = makePlan(
      'electric',
      [
        climb({
          toAltitude_m: 2000,
          speed: { kind: 'tas', speed_m_s: V },
          throttle: tau,
          course_deg: course,
          windSource: 'aloft',
        }),
      ],
      { environment: { windsAloft: VEERING }, arrival_m: 2000 },
    );
    const r = solvePlan(plan);
    expect(r.completed).toBe(true);
    const W = TRAUB_UAV.m * G0;
    const k = 1 / (Math.PI * TRAUB_UAV.e * TRAUB_UAV.AR);
    const thrust = tau * pp.propEfficiency * pp.maxShaftPower_W;
    const drain = (tau * pp.maxShaftPower_W) / (pp.motorEfficiency * pp.controllerEfficiency);
    const f = (h: number) => {
      const w = windAt(VEERING, h);
      const rho = atmosphereAt(h, w.isaOffset_K).rho_kg_m3;
      const q = 0.5 * rho * V * V;
      const CL = W / (q * TRAUB_UAV.S);
      const D = q * TRAUB_UAV.S * (TRAUB_UAV.CD0 + k * CL * CL);
      const roc = (thrust - D * V) / W;
      const head = w.speed_m_s * Math.cos((w.from_deg - course) * DEG);
      const cross = w.speed_m_s * Math.sin((w.from_deg - course) * DEG);
      const gs = Math.sqrt(V * V - roc * roc - cross * cross) - head;
      return [gs / roc, 1 / roc, -drain / roc];
    };
    // odex (Bulirsch–Stoer) as an independent integrator; kinks at the 1000 m level are
    // integrated as two smooth pieces.
    const mid = odexSolve((h) => f(h), 0, [0, 0, 0], 1000);
    const [x, t, dE] = odexSolve((h) => f(h), 1000, mid, 2000) as [number, number, number];
    const leg = r.legs[0]!;
    expect(rel(leg.groundDistance_m, x)).toBeLessThan(1e-7);
    expect(rel(leg.time_s, t)).toBeLessThan(1e-7);
    expect(rel(leg.energyUsed_J, -dE)).toBeLessThan(1e-7);
  });
});

describe('reserves when legs fly in the table', () => {
  function withReserves(levels: WindLevel[]): Plan {
    return makePlan('propeller', [cruise({ windSource: 'aloft' })], {
      environment: { windsAloft: levels },
      reserves: {
        alternateDistance_m: 100_000,
        alternateAltitude_m: 1500,
        holdTime_s: 1800,
        holdAltitude_m: 1500,
      },
    });
  }

  it('fly the alternate into the table wind (conservative) and both in its air', () => {
    const calm = solvePlan(withReserves([{ altitude_m: 0, from_deg: 0, speed_m_s: 0 }]));
    const still = solvePlan(
      makePlan('propeller', [cruise()], {
        reserves: {
          alternateDistance_m: 100_000,
          alternateAltitude_m: 1500,
          holdTime_s: 1800,
          holdAltitude_m: 1500,
        },
      }),
    );
    // a calm table at ISA is the plan's own still air: the same reserves (same solver)
    expect(rel(calm.reserve.required.total, still.reserve.required.total)).toBeLessThan(1e-12);
    // calm where the mission flies (0 m), 15 m/s at the reserves' 1500 m
    const windy = solvePlan(
      withReserves([
        { altitude_m: 1000, from_deg: 0, speed_m_s: 0 },
        { altitude_m: 1500, from_deg: 0, speed_m_s: 15 },
      ]),
    );
    // 15 m/s taken as a headwind: more fuel to the alternate (common practice: plan the
    // unknown direction into the wind); the hold's fuel over a time does not depend on wind
    expect(windy.reserve.required.alternate).toBeGreaterThan(1.1 * calm.reserve.required.alternate);
    expect(rel(windy.reserve.required.hold, calm.reserve.required.hold)).toBeLessThan(1e-9);
    const warm = solvePlan(
      withReserves([{ altitude_m: 0, from_deg: 0, speed_m_s: 0, isaOffset_K: 30 }]),
    );
    // the table's temperature is used: a hot day changes the hold (ISA+ΔT, atmosphere.ts)
    expect(rel(warm.reserve.required.hold, calm.reserve.required.hold)).toBeGreaterThan(1e-4);
  });
});
