import { describe, expect, it } from 'vitest';
import { maxPayload } from '../../../core/optimize/maxPayload.ts';
import type { Plan } from '../../../core/plan/schema.ts';
import { solvePlan } from '../../../core/solver/solve.ts';
import { mission } from './fixtures.ts';

function verdictWith(plan: Plan, payload_kg: number) {
  const copy = structuredClone(plan);
  copy.aircraft.mass.payload_kg = payload_kg;
  return solvePlan(copy).verdict;
}

describe('maxPayload', () => {
  it('reserve-limited mission: passes at the answer and fails 1 % above it', () => {
    const plan = mission('prop', 1_700_000);
    const r = maxPayload(plan);
    expect(r.feasible).toBe(true);
    expect(r.limitingCheck).toBe('reserve');
    // Definition of the maximum: the verdict holds at it and fails just above (the 1 % step is
    // far above the bisection tolerance of 1e-7 relative).
    expect(verdictWith(plan, r.payload_kg)).not.toBe('fails');
    expect(verdictWith(plan, r.payload_kg * 1.01)).toBe('fails');
  });

  it('short mission: MTOW limits, payload = MTOW − empty − fuel', () => {
    const plan = mission('prop', 500_000);
    const r = maxPayload(plan);
    const { mtow_kg, empty_kg } = plan.aircraft.mass;
    const fuel =
      plan.aircraft.powerplant.type === 'propeller' ? plan.aircraft.powerplant.fuel.load_kg : NaN;
    expect(r.limitingCheck).toBe('mtow');
    // Mass balance (definition of take-off mass), relative 1e-12.
    expect(Math.abs(r.payload_kg - (mtow_kg - empty_kg - fuel)) / r.payload_kg).toBeLessThan(1e-12);
    expect(verdictWith(plan, r.payload_kg)).not.toBe('fails');
    expect(verdictWith(plan, r.payload_kg * 1.01)).toBe('fails');
  });

  it('electric: the pack mass counts against MTOW', () => {
    const plan = mission('electric', 20_000);
    const r = maxPayload(plan);
    const pp = plan.aircraft.powerplant;
    const pack = pp.type === 'electric' ? pp.battery.mass_kg : NaN;
    const { mtow_kg, empty_kg } = plan.aircraft.mass;
    expect(Math.abs(r.payload_kg - (mtow_kg - empty_kg - pack)) / r.payload_kg).toBeLessThan(1e-12);
  });

  it('a mission that fails even empty reports zero payload, infeasible, with the reason', () => {
    const r = maxPayload(mission('prop', 2_500_000));
    expect(r).toMatchObject({ payload_kg: 0, feasible: false, limitingCheck: 'reserve' });
  });

  it('never changes the plan', () => {
    const plan = mission('prop', 1_700_000);
    const before = JSON.stringify(plan);
    maxPayload(plan);
    expect(JSON.stringify(plan)).toBe(before);
  });
});
