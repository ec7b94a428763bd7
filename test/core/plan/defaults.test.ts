/** Defaults must pass the plan schema and stay inside the common-practice sanity ranges. */
import { describe, expect, it } from 'vitest';
import { defaultLeg, newPlan, nextLegId } from '../../../core/plan/defaults.ts';
import { parsePlan } from '../../../core/plan/load.ts';
import { LegSchema } from '../../../core/plan/schema.ts';
import type { LegKind } from '../../../core/plan/schema.ts';

const KINDS: LegKind[] = ['takeoff', 'climb', 'cruise', 'loiter', 'descent', 'landing'];

describe('defaults', () => {
  it('newPlan is a valid plan with no sanity warnings', () => {
    const r = parsePlan(newPlan());
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.warnings).toEqual([]);
      expect(r.plan).toEqual(newPlan());
    }
  });

  it.each(KINDS)('defaultLeg(%s) is valid on its own and inside a plan', (kind) => {
    const leg = defaultLeg(kind, 'x');
    expect(leg.kind).toBe(kind);
    expect(LegSchema.safeParse(leg).success).toBe(true);
    const plan = newPlan();
    plan.legs.push(defaultLeg(kind, nextLegId(plan)));
    expect(parsePlan(plan).ok).toBe(true);
  });

  it('nextLegId never collides', () => {
    const plan = newPlan();
    expect(nextLegId(plan)).toBe('leg-8');
    plan.legs[0] = defaultLeg('takeoff', 'leg-41');
    expect(nextLegId(plan)).toBe('leg-42');
    const ids = new Set(plan.legs.map((l) => l.id));
    for (let i = 0; i < 20; i += 1) {
      const id = nextLegId(plan);
      expect(ids.has(id)).toBe(false);
      ids.add(id);
      plan.legs.push(defaultLeg('cruise', id));
    }
    expect(
      nextLegId({ legs: [defaultLeg('takeoff', 'leg-2'), defaultLeg('landing', 'leg-3')] }),
    ).toBe('leg-4');
  });
});
