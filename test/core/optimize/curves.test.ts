import { describe, expect, it } from 'vitest';
import { atmosphereAt } from '../../../core/atmosphere.ts';
import { InputError } from '../../../core/errors.ts';
import { powerCurves } from '../../../core/optimize/curves.ts';
import {
  minDragSpeed,
  minPowerSpeed,
  polarCoefficients,
  powerRequired_W,
  stallSpeed,
} from '../../../core/polar.ts';
import { availableThrustPower_W } from '../../../core/propulsion/index.ts';
import { G0 } from '../../../core/units.ts';
import { mission } from './fixtures.ts';

function expectRel(actual: number, expected: number, tol: number): void {
  expect(Math.abs(actual - expected) / Math.abs(expected)).toBeLessThanOrEqual(tol);
}

describe('powerCurves', () => {
  it('piston cruise leg: curves finite, crossing at the maximum level speed, marks in order', () => {
    const plan = mission('prop', 500_000);
    const r = powerCurves(plan, 2, { points: 60 });
    const n = r.tas_m_s.length;
    expect(n).toBe(60);
    for (const a of [r.required_W, r.available_W, r.thrustRequired_N, r.thrustAvailable_N]) {
      expect(a).toHaveLength(n);
      for (const v of a) expect(Number.isFinite(v)).toBe(true);
    }
    const { stall_m_s, bestRange_m_s, bestEndurance_m_s, maxLevel_m_s } = r.marks;
    expect(maxLevel_m_s).not.toBeNull();
    // The speed axis spans 0.95·Vs to 1.6·V_max (or the Mach cap).
    expectRel(r.tas_m_s[0]!, 0.95 * stall_m_s, 1e-12);
    expect(r.tas_m_s[n - 1]!).toBeGreaterThan(maxLevel_m_s!);
    const c = polarCoefficients(plan.aircraft.polar);
    const atm = atmosphereAt(r.altitude_m); // standard QNH and ISA day in the fixture
    const rho = atm.rho_kg_m3;
    const W = r.mass_kg * G0;
    const S = plan.aircraft.wingArea_m2;
    // Anderson, Introduction to Flight, ch. 6: V_max where P_R = P_A (bisected to 1e-7).
    const pa = availableThrustPower_W(plan.aircraft.powerplant, atm, r.altitude_m, maxLevel_m_s!);
    expectRel(powerRequired_W(c, W, rho, S, maxLevel_m_s!), pa, 1e-6);
    // Still air, constant η and BSFC: best endurance at minimum power, best range at (L/D)max
    // (Anderson, ch. 6); both kept above 1.2 × stall (common practice).
    expectRel(stall_m_s, stallSpeed(W, rho, S, c.CLmax), 1e-9);
    expectRel(bestRange_m_s, minDragSpeed(c, W, rho, S), 1e-4);
    expectRel(bestEndurance_m_s, Math.max(minPowerSpeed(c, W, rho, S), 1.2 * stall_m_s), 1e-4);
    // Thrust = power / speed (definition).
    r.tas_m_s.forEach((v, i) => expectRel(r.thrustRequired_N[i]! * v, r.required_W[i]!, 1e-12));
  });

  it('jet: thrust available is flat across speed, T_SL·σ^n', () => {
    const plan = mission('jet', 1_500_000);
    const r = powerCurves(plan, 2);
    const sigma = atmosphereAt(r.altitude_m).sigma;
    const pp = plan.aircraft.powerplant;
    if (pp.type !== 'jet') throw new Error('jet fixture');
    // Thrust lapse T = T_SL·σ^n (common practice, as the plan schema defines it).
    for (const t of r.thrustAvailable_N)
      expectRel(t, pp.maxThrustSL_N * sigma ** (pp.thrustLapseExponent ?? NaN), 1e-9);
  });

  it('refuses an index outside the plan', () => {
    expect(() => powerCurves(mission('prop', 500_000), 9)).toThrow(InputError);
  });
});
