/**
 * Climbs, descents and glides on the energy equation (acceleration factor), the descent
 * steeper than an idle glide, the steep-glide limit, the mean TAS along the flight path, and
 * the cruise-climb's held TAS.
 */
import { describe, expect, it } from 'vitest';
import { tasFromCas, tasFromEas } from '../../../core/airspeed.ts';
import { atmosphereAt } from '../../../core/atmosphere.ts';
import { solvePlan } from '../../../core/solver/solve.ts';
import type { PlanResult } from '../../../core/solver/types.ts';
import { G0 } from '../../../core/units.ts';
import { energyReference, type EnergyPath } from './energyReference.ts';
import {
  ANDERSON_JET,
  TRAUB_UAV,
  climb,
  cruise,
  descent,
  makePlan,
  numbersIn,
  odexSolve,
  rel,
} from './fixtures.ts';

const kJet = 1 / ((Math.PI * ANDERSON_JET.e * ANDERSON_JET.span ** 2) / ANDERSON_JET.S);
const kUav = 1 / (Math.PI * TRAUB_UAV.e * TRAUB_UAV.AR);
const allFinite = (r: PlanResult) => numbersIn(r).every(([, v]) => Number.isFinite(v));

/** The fixture jet (T_SL 40 kN, σ^0.8 lapse, c_t 0.6 1/h) at a throttle, on a speed schedule. */
function jetPath(tas: (h: number) => number, tau: number): EnergyPath {
  const thrust = (h: number) => tau * 40_000 * atmosphereAt(h).sigma ** 0.8;
  return {
    tas,
    thrustPower: (h, V) => thrust(h) * V,
    drag: (h, V, m) => {
      const q = 0.5 * atmosphereAt(h).rho_kg_m3 * V * V;
      const CL = (m * G0) / (q * ANDERSON_JET.S);
      return q * ANDERSON_JET.S * (ANDERSON_JET.CD0 + kJet * CL * CL);
    },
    consumption: (h) => (ANDERSON_JET.ct_1_s / G0) * thrust(h),
    burnsMass: true,
  };
}

describe('climbs at constant CAS and Mach (acceleration factor; odex on the energy equation)', () => {
  const cas = 130;
  const mach = 0.7;
  const casTas = (h: number) => tasFromCas(cas, atmosphereAt(h));
  const machTas = (h: number) => mach * atmosphereAt(h).a_m_s;
  const r = solvePlan(
    makePlan('jet', [
      climb({ toAltitude_m: 8000, speed: { kind: 'cas', speed_m_s: cas }, throttle: 0.9 }),
      // Crosses the tropopause (11 km), where dV/dh at constant Mach jumps to 0.
      climb({ toAltitude_m: 12_500, speed: { kind: 'mach', mach }, throttle: 1 }),
    ]),
  );

  it('CAS 130 m/s to 8000 m: time, distance and fuel as the energy equation gives', () => {
    const leg = r.legs[0]!;
    expect(leg.status).toBe('flown');
    const ref = energyReference(jetPath(casTas, 0.9), 0, 8000, leg.start.mass_kg);
    expect(rel(leg.time_s, ref.time_s)).toBeLessThan(1e-8); // odex, energy equation
    expect(rel(leg.groundDistance_m, ref.groundDistance_m)).toBeLessThan(1e-8); // odex, energy equation
    expect(rel(leg.fuelUsed_kg, ref.used)).toBeLessThan(1e-8); // odex, energy equation
    expect(rel(leg.meanTas_m_s, ref.path_m / ref.time_s)).toBeLessThan(1e-8); // odex: ∫V dt / t
  });

  it('the accelerating climb takes markedly longer than (T − D)V/W alone says', () => {
    // Same path with ROC = (T − D)V/W (no share for the kinetic energy), mass held at the
    // start (odex over altitude): the TAS grows ~50 % over the climb, so the difference is large.
    const p = jetPath(casTas, 0.9);
    const m = r.legs[0]!.start.mass_kg;
    const tNoShare = odexSolve(
      (h) => {
        const V = casTas(h);
        return [(m * G0) / (p.thrustPower(h, V, m) - p.drag(h, V, m) * V)];
      },
      0,
      [0],
      8000,
    )[0]!;
    expect(r.legs[0]!.time_s).toBeGreaterThan(1.08 * tNoShare); // odex; the TAS grows ~50 % (1976 U.S. Standard Atmosphere densities)
  });

  it('Mach 0.7 from 8000 m to 12 500 m across the tropopause matches the energy equation', () => {
    const leg = r.legs[1]!;
    expect(leg.status).toBe('flown');
    const ref = energyReference(jetPath(machTas, 1), 8000, 12_500, leg.start.mass_kg);
    expect(rel(leg.time_s, ref.time_s)).toBeLessThan(1e-8); // odex, energy equation
    expect(rel(leg.groundDistance_m, ref.groundDistance_m)).toBeLessThan(1e-8); // odex, energy equation
    expect(rel(leg.fuelUsed_kg, ref.used)).toBeLessThan(1e-8); // odex, energy equation
  });
});

describe('mean TAS along the flight path', () => {
  it('a steep climb at a fixed TAS shows that TAS; the horizontal air distance is shorter', () => {
    const r = solvePlan(
      makePlan('electric', [
        climb({ toAltitude_m: 1000, speed: { kind: 'tas', speed_m_s: 12 }, throttle: 0.8 }),
      ]),
    );
    const leg = r.legs[0]!;
    expect(leg.status).toBe('flown');
    expect(rel(leg.meanTas_m_s, 12)).toBeLessThan(1e-9); // ∫V dt / t at a constant V
    // sin γ = ROC/V is several per cent here: the horizontal air distance falls short of V·t.
    expect(leg.airDistance_m / leg.time_s).toBeLessThan(12 * 0.995); // horizontal = √(V² − ḣ²) < V (definition)
  });
});

describe('descent steeper than an idle glide', () => {
  const uavDrag = (h: number, V: number) => {
    const q = 0.5 * atmosphereAt(h).rho_kg_m3 * V * V;
    const CL = (TRAUB_UAV.m * G0) / (q * TRAUB_UAV.S);
    return q * TRAUB_UAV.S * (TRAUB_UAV.CD0 + kUav * CL * CL);
  };
  const descentAt = (rate_m_s: number) =>
    solvePlan(
      makePlan(
        'electric',
        [
          descent({
            toAltitude_m: 0,
            mode: { by: 'rate', rate_m_s, speed: { kind: 'tas', speed_m_s: 12 } },
          }),
        ],
        { departure_m: 500, arrival_m: 0 },
      ),
    );

  it('warns, naming the leg, the rate and the idle-glide sink, and prints no negative power', () => {
    const r = descentAt(2);
    expect(r.completed).toBe(true);
    const w = r.warnings.find((x) => /steeper than an idle glide/.test(x));
    expect(w).toBeDefined();
    expect(w).toMatch(/^Leg 1 \(descent\): a descent at 2 m\/s is steeper than an idle glide/);
    expect(w).toMatch(/needs drag devices .* or a lower rate\.$/);
    // The sink of an idle glide at 12 m/s TAS is D·V/W (constant TAS: no acceleration factor;
    // Anderson, Introduction to Flight, ch. 6), at the altitude the warning names.
    const m = /idle-glide sink ([\d.]+) m\/s at ([\d.]+) m/.exec(w!)!;
    const sink = (uavDrag(Number(m[2]), 12) * 12) / (TRAUB_UAV.m * G0);
    expect(rel(Number(m[1]), sink)).toBeLessThan(5e-4); // 4 printed digits
    expect(sink).toBeLessThan(2); // sanity: this descent is steeper than the idle glide
    expect(r.checks.find((c) => c.id === 'power:0')).toBeUndefined();
    expect(r.checks.every((c) => c.quantity !== 'power' || c.value >= 0)).toBe(true);
  });

  it('a descent shallower than the idle glide has its power check and no warning', () => {
    const r = descentAt(0.3);
    expect(r.warnings.some((x) => /idle glide/.test(x))).toBe(false);
    const c = r.checks.find((x) => x.id === 'power:0')!;
    expect(c.value).toBeGreaterThan(0); // positive power needed (D·V − W·RoD > 0)
    expect(c.state).toBe('ok');
  });
});

describe('glides steeper than 30° fail the leg', () => {
  for (const [CD0, LDmax] of [
    [0.3, 0.9129], // (L/D)max = 1/(2√(k·CD0)) with k = 1 (Anderson, Introduction to Flight, ch. 6)
    [0.1, 1.581],
  ] as const) {
    it(`(L/D)max ${LDmax}: the glide fails quoting (L/D)max and the limit, no NaN`, () => {
      const r = solvePlan(
        makePlan('electric', [descent({ toAltitude_m: 0, mode: { by: 'glide' } })], {
          departure_m: 500,
          arrival_m: 0,
          aircraft: (a) => ({
            ...a,
            polar: { CD0, induced: { by: 'factor', k: 1 }, CLminD: 0, CLmax: 1.5 },
          }),
        }),
      );
      expect(r.completed).toBe(false);
      expect(r.legs[0]!.status).toBe('failed');
      expect(r.legs[0]!.error).toMatch(/steeper than 30°/);
      expect(r.legs[0]!.error).toContain(`(L/D)max ${LDmax}`);
      expect(r.legs[0]!.error).toMatch(/L\/D above about 2/);
      expect(allFinite(r)).toBe(true);
    });
  }
});

describe('cruise-climb at a given EAS', () => {
  it('warns that the EAS is converted to a TAS at the start of the leg and held', () => {
    const h0 = 1500;
    const r = solvePlan(
      makePlan(
        'propeller',
        [
          cruise({
            program: 'cruiseClimb',
            speed: { kind: 'eas', speed_m_s: 50 },
            end: { by: 'distance', distance_m: 200_000 },
          }),
        ],
        { departure_m: h0 },
      ),
    );
    const w = r.warnings.find((x) => /cruise-climb holds its true airspeed/.test(x));
    expect(w).toMatch(/EAS 50 m\/s is converted at the start of the leg to ([\d.]+) m\/s TAS/);
    const tas = Number(/to ([\d.]+) m\/s TAS/.exec(w!)![1]);
    // EAS = TAS·√σ (core/airspeed.ts; Anderson, Introduction to Flight, ch. 3).
    expect(rel(tas, tasFromEas(50, atmosphereAt(h0)))).toBeLessThan(5e-4); // 4 printed digits
    expect(rel(r.legs[0]!.meanTas_m_s, tasFromEas(50, atmosphereAt(h0)))).toBeLessThan(1e-9); // held TAS (definition of the cruise-climb)
    const plain = solvePlan(
      makePlan(
        'propeller',
        [cruise({ program: 'cruiseClimb', speed: { kind: 'tas', speed_m_s: 55 } })],
        { departure_m: h0 },
      ),
    );
    expect(plain.warnings.some((x) => /holds its true airspeed/.test(x))).toBe(false);
  });
});
