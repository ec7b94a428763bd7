import { describe, expect, it } from 'vitest';
import { atmosphereAt } from '../../../core/atmosphere.ts';
import { rangeJetConstantAltitudeSpeed } from '../../../core/breguet.ts';
import { InputError } from '../../../core/errors.ts';
import { speedAltitudeSweep } from '../../../core/optimize/grid.ts';
import type { CruiseLeg } from '../../../core/plan/schema.ts';
import { polarCoefficients } from '../../../core/polar.ts';
import { solvePlan } from '../../../core/solver/solve.ts';
import { G0 } from '../../../core/units.ts';
import { mission } from './fixtures.ts';

function expectRel(actual: number, expected: number, tol: number): void {
  expect(Math.abs(actual - expected) / Math.abs(expected)).toBeLessThanOrEqual(tol);
}

describe('speedAltitudeSweep', () => {
  it('jet constant-altitude, constant-speed cruise matches the Breguet integral', () => {
    const plan = mission('jet', 1_500_000);
    const start = solvePlan(plan).legs[2]!.start;
    const g = speedAltitudeSweep(plan, 2, [150, 180], [6000, 9000]);
    const c = polarCoefficients(plan.aircraft.polar);
    const pp = plan.aircraft.powerplant;
    if (pp.type !== 'jet') throw new Error('jet fixture');
    g.altitudes_m.forEach((h, i) =>
      g.speeds_m_s.forEach((V, j) => {
        const perMetre = g.values[i]![j]!;
        const fuel = perMetre * 1_500_000;
        // Anderson, Aircraft Performance and Design, ch. 5: R = (V/c_t)·∫dW/D at constant
        // altitude and speed; the fuel the map reports must give back the leg's distance.
        // Integrator vs closed form: 1e-6 relative (DESIGN.md accuracy bar).
        const R = rangeJetConstantAltitudeSpeed({
          ct: pp.tsfc_kg_Ns * G0,
          V,
          rho: atmosphereAt(h).rho_kg_m3, // standard QNH and ISA day in the fixture
          S: plan.aircraft.wingArea_m2,
          CD0: c.CD0,
          k: c.k,
          W0: start.mass_kg * G0,
          W1: (start.mass_kg - fuel) * G0,
        });
        expectRel(R, 1_500_000, 1e-6);
      }),
    );
    expect(g.per).toBe('distance');
    expect(g.consumable).toBe('fuel');
    expect(g.legsFlown).toBe(4);
    expect(g.steps).toBeGreaterThan(0);
  });

  it('agrees with the whole-plan solve at the leg’s own altitude and speed', () => {
    const plan = mission('prop', 500_000);
    const g = speedAltitudeSweep(plan, 2, [45], [1500]);
    const copy = structuredClone(plan);
    (copy.legs[2] as CruiseLeg).speed = { kind: 'tas', speed_m_s: 45 };
    const leg = solvePlan(copy).legs[2]!;
    // Consistency with the solver (same integrator, same start state): relative 1e-9.
    expectRel(g.values[0]![0]!, leg.fuelUsed_kg / leg.groundDistance_m, 1e-9);
  });

  it('holds null below the stall limit, above the maximum level speed and above the ceiling', () => {
    const plan = mission('prop', 300_000);
    const g = speedAltitudeSweep(plan, 2, [20, 45, 120], [1000, 4000, 5500]);
    expect(g.values).toHaveLength(3);
    // Computed from the fixture (Anderson, Introduction to Flight, ch. 5–6 relations): 1.2 × stall
    // ≈ 36 m/s at 1 km; the maximum level speed is about 78 m/s, and power required grows
    // about as V³, so 120 m/s would need over three times the engine's power.
    expect(g.values[0]![0]).toBeNull();
    expect(g.values[0]![2]).toBeNull();
    expect(g.values[0]![1]).toBeGreaterThan(0);
    // Fixture ceiling 5000 m.
    expect(g.values[2]!.every((v) => v === null)).toBe(true);
    for (const row of g.values)
      for (const v of row) expect(v === null || Number.isFinite(v)).toBe(true);
  });

  it('a loiter leg is mapped per unit time', () => {
    const plan = mission('prop', 300_000);
    plan.legs[2] = {
      kind: 'loiter',
      id: 'hold',
      label: '',
      course_deg: 0,
      wind: { speed_m_s: 0, from_deg: 0 },
      end: { by: 'time', time_s: 3600 },
      speed: { kind: 'bestEndurance' },
    };
    const g = speedAltitudeSweep(plan, 2, [40, 50], [1500]);
    expect(g.per).toBe('time');
    // Propeller: fuel flow = BSFC·P/η, so it rises with speed above V_minpower (Anderson, ch. 6).
    expect(g.values[0]![1]!).toBeGreaterThan(g.values[0]![0]!);
  });

  it('refuses speeds and altitudes outside the plan limits, and other leg kinds', () => {
    const plan = mission('prop', 300_000);
    expect(() => speedAltitudeSweep(plan, 2, [0], [1000])).toThrow(InputError);
    expect(() => speedAltitudeSweep(plan, 2, [Number.NaN], [1000])).toThrow(InputError);
    expect(() => speedAltitudeSweep(plan, 2, [50], [25_000])).toThrow(InputError);
    expect(() => speedAltitudeSweep(plan, 1, [50], [1000])).toThrow(InputError);
  });
});
