import { describe, expect, it } from 'vitest';
import { atmosphereAt } from '../../../core/atmosphere.ts';
import { InputError } from '../../../core/errors.ts';
import { bestSpeedForLeg } from '../../../core/optimize/speedSweep.ts';
import type { Plan } from '../../../core/plan/schema.ts';
import { minDragSpeed, minPowerSpeed, polarCoefficients } from '../../../core/polar.ts';
import { solvePlan } from '../../../core/solver/solve.ts';
import { G0 } from '../../../core/units.ts';
import { jetCruiseByFuel, propCruiseByFuel } from './fixtures.ts';

function expectRel(actual: number, expected: number, tol: number): void {
  expect(Math.abs(actual - expected) / Math.abs(expected)).toBeLessThanOrEqual(tol);
}

/** Density and weight halfway through leg i (by fuel), from a solve of the plan. */
function midLeg(plan: Plan, i: number, fuel_kg: number): { rho: number; W: number } {
  const leg = solvePlan(plan).legs[i];
  if (leg === undefined) throw new Error('no leg');
  // Standard QNH: pressure altitude = altitude, ISA day (1976 U.S. Standard Atmosphere).
  return {
    rho: atmosphereAt(leg.start.h_m).rho_kg_m3,
    W: (leg.start.mass_kg - fuel_kg / 2) * G0,
  };
}

describe('bestSpeedForLeg', () => {
  it('propeller cruise by fuel in still air: optimum at the (L/D)max speed of mid-cruise weight', () => {
    const fuel = 100;
    const plan = propCruiseByFuel(fuel);
    const r = bestSpeedForLeg(plan, 0);
    const c = polarCoefficients(plan.aircraft.polar);
    const { rho, W } = midLeg(plan, 0, fuel);
    // Anderson, Introduction to Flight, ch. 6: propeller range ∝ (η/c)·L/D at constant η and
    // BSFC, so the best speed flies (L/D)max. At one fixed TAS the weight (and so CL) drifts
    // by about 7.5 % over this leg, so the (L/D)max speed falls by about 3.8 % from start to
    // end; the best constant speed is a weighted mean of those speeds, which to first order
    // is the mid-weight one. 0.5 % is tight enough to tell it from the start-weight speed
    // (about 1.9 % higher) yet leaves room for the second-order weighting.
    expectRel(r.best.tas_m_s, minDragSpeed(c, W, rho, plan.aircraft.wingArea_m2), 0.005);
    expect(r.objective).toEqual({ quantity: 'groundDistance', sense: 'max' });
  });

  it('jet cruise by fuel at constant altitude: optimum near 3^(1/4)·V_mindrag', () => {
    const fuel = 800;
    const plan = jetCruiseByFuel(fuel, 6700);
    const r = bestSpeedForLeg(plan, 1);
    const c = polarCoefficients(plan.aircraft.polar);
    const { rho, W } = midLeg(plan, 1, fuel);
    // Anderson, Introduction to Flight, ch. 6: jet range at constant altitude is set by
    // CL^½/CD, best at V = 3^(1/4)·V_mindrag; same mid-weight argument (weight falls about
    // 9 % over the leg), 0.5 % tolerance.
    const expected = Math.pow(3, 0.25) * minDragSpeed(c, W, rho, plan.aircraft.wingArea_m2);
    expectRel(r.best.tas_m_s, expected, 0.005);
  });

  it('the best-range speed rises with the headwind (0, 10, 20 m/s)', () => {
    // Common practice of cruise planning: fly faster into a headwind.
    const speeds = [0, 10, 20].map(
      (hw) => bestSpeedForLeg(propCruiseByFuel(100, hw), 0).best.tas_m_s,
    );
    expect(speeds[1]!).toBeGreaterThan(speeds[0]! * 1.01);
    expect(speeds[2]!).toBeGreaterThan(speeds[1]! * 1.01);
  });

  it('propeller loiter by time: optimum at the minimum-power speed of mid-loiter weight', () => {
    const plan = propCruiseByFuel(100);
    // A high CLmax keeps the stall limit below the minimum-power speed for this check.
    plan.aircraft.polar.CLmax = 2.4;
    plan.legs[0] = {
      kind: 'loiter',
      id: 'hold',
      label: '',
      course_deg: 0,
      wind: { speed_m_s: 0, from_deg: 0 },
      end: { by: 'time', time_s: 3 * 3600 },
      speed: { kind: 'bestEndurance' },
    };
    const r = bestSpeedForLeg(plan, 0);
    const used = r.best.value;
    const c = polarCoefficients(plan.aircraft.polar);
    const { rho, W } = midLeg(plan, 0, used);
    // Anderson, Introduction to Flight, ch. 6: propeller endurance is best at minimum power
    // required (max CL^1.5/CD); mid-weight argument as above, 0.5 % tolerance.
    expectRel(r.best.tas_m_s, minPowerSpeed(c, W, rho, plan.aircraft.wingArea_m2), 0.005);
    expect(r.objective).toEqual({ quantity: 'consumption', sense: 'min' });
  });

  it('returns a finite curve starting at the stall limit, and the best is no worse than any point', () => {
    const plan = propCruiseByFuel(100);
    const r = bestSpeedForLeg(plan, 0, { points: 15 });
    expect(r.curve.tas_m_s.length).toBe(r.curve.value.length);
    expect(r.curve.tas_m_s.length).toBeGreaterThan(5);
    for (const v of [...r.curve.tas_m_s, ...r.curve.value]) expect(Number.isFinite(v)).toBe(true);
    expect(r.curve.tas_m_s[0]!).toBeGreaterThanOrEqual(r.stallLimit_m_s);
    // Maximised value (ground distance): the refined best is at least every sweep point.
    for (const v of r.curve.value) expect(r.best.value).toBeGreaterThanOrEqual(v);
  });

  it('never changes the plan it is given', () => {
    const plan = propCruiseByFuel(100);
    const before = JSON.stringify(plan);
    bestSpeedForLeg(plan, 0, { points: 7 });
    expect(JSON.stringify(plan)).toBe(before);
  });

  it('refuses a leg that is not cruise or loiter, an index outside the plan and a bad option', () => {
    const plan = jetCruiseByFuel(500, 6000);
    expect(() => bestSpeedForLeg(plan, 0)).toThrow(InputError);
    expect(() => bestSpeedForLeg(plan, 5)).toThrow(InputError);
    expect(() => bestSpeedForLeg(plan, 0.5)).toThrow(InputError);
    expect(() => bestSpeedForLeg(plan, 1, { points: 2.5 })).toThrow(InputError);
    expect(() => bestSpeedForLeg(plan, 1, { points: Number.NaN })).toThrow(InputError);
  });
});
