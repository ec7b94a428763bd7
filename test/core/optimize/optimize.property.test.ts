import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/errors.ts';
import { bestCruiseAltitude } from '../../../core/optimize/altitudeSweep.ts';
import { powerCurves } from '../../../core/optimize/curves.ts';
import { speedAltitudeSweep } from '../../../core/optimize/grid.ts';
import { maxPayload } from '../../../core/optimize/maxPayload.ts';
import { payloadRange } from '../../../core/optimize/payloadRange.ts';
import { reserveSensitivity } from '../../../core/optimize/sensitivity.ts';
import { bestSpeedForLeg } from '../../../core/optimize/speedSweep.ts';
import { PlanSchema } from '../../../core/plan/schema.ts';
import type { CruiseLeg, Plan } from '../../../core/plan/schema.ts';
import { mission } from './fixtures.ts';

/** Every number reachable in `value` (objects, arrays) — all must be finite. */
function numbersIn(value: unknown, out: number[] = []): number[] {
  if (typeof value === 'number') out.push(value);
  else if (Array.isArray(value)) for (const v of value) numbersIn(v, out);
  else if (value !== null && typeof value === 'object')
    for (const v of Object.values(value)) numbersIn(v, out);
  return out;
}

/** Runs an optimizer: a result with only finite numbers, or an InputError for a plan it cannot serve. */
function expectFiniteOrInputError(f: () => unknown): void {
  let result: unknown;
  try {
    result = f();
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return;
  }
  for (const v of numbersIn(result)) expect(Number.isFinite(v)).toBe(true);
}

/** A uniform value in [min, max] on a 1/1000 grid (fc.double leans towards its ends). */
const between = (min: number, max: number) =>
  fc.integer({ min: 0, max: 1000 }).map((i) => min + ((max - min) * i) / 1000);

const planArb = fc
  .record({
    kind: fc.constantFrom('prop' as const, 'jet' as const, 'electric' as const),
    cd0Scale: between(0.8, 1.4),
    areaScale: between(0.85, 1.2),
    payloadScale: between(0, 1.5),
    distanceScale: between(0.2, 1.6),
    wind_m_s: between(0, 15),
    windFrom_deg: between(0, 359),
    isaOffset_K: between(-20, 25),
  })
  .map((r): Plan => {
    const base = { prop: 800_000, jet: 1_500_000, electric: 25_000 }[r.kind];
    const plan = mission(r.kind, base * r.distanceScale);
    plan.aircraft.polar.CD0 *= r.cd0Scale;
    plan.aircraft.wingArea_m2 *= r.areaScale;
    plan.aircraft.mass.payload_kg *= r.payloadScale;
    plan.environment.isaOffset_K = r.isaOffset_K;
    const cruise = plan.legs[2] as CruiseLeg;
    cruise.wind = { speed_m_s: r.wind_m_s, from_deg: r.windFrom_deg };
    return PlanSchema.parse(plan);
  });

describe('optimizers on random valid plans', () => {
  it('never return NaN or Infinity, and never change the plan', () => {
    // DESIGN.md section 6 (robustness): no NaN or Infinity in any result. Few runs: each one solves the mission a few hundred times (kept under ~15 s in total).
    fc.assert(
      fc.property(planArb, (plan) => {
        const before = JSON.stringify(plan);
        expectFiniteOrInputError(() => bestSpeedForLeg(plan, 2, { points: 7 }));
        expectFiniteOrInputError(() => bestCruiseAltitude(plan, { points: 5 }));
        expectFiniteOrInputError(() => payloadRange(plan, { points: 3 }));
        expectFiniteOrInputError(() => maxPayload(plan));
        expectFiniteOrInputError(() => reserveSensitivity(plan));
        expectFiniteOrInputError(() => powerCurves(plan, 2, { points: 20 }));
        expectFiniteOrInputError(() => speedAltitudeSweep(plan, 2, [20, 60, 160], [500, 3000]));
        expect(JSON.stringify(plan)).toBe(before);
      }),
      { numRuns: 8, seed: 20260407 },
    );
  });
});
