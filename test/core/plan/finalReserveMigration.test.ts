/**
 * Migration part finalReserveAtCruise (schema 1 → 2) on the version-1 copies of the examples
 * (test/fixtures/plans-v1/): each file loads with the final reserve at normal cruise — the
 * default of version 2, the rule as operators commonly state it (e.g. 14 CFR 91.151(a)) — and
 * a note saying so; what changed in the numbers is shown against the old rule (best
 * endurance), which the note tells the user how to keep.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { parsePlanText } from '../../../core/plan/load.ts';
import { finalReserveAtCruise } from '../../../core/plan/migrations/finalReserveAtCruise.ts';
import type { Plan } from '../../../core/plan/schema.ts';
import { solvePlan } from '../../../core/solver/solve.ts';

const V1_DIR = fileURLToPath(new URL('../../fixtures/plans-v1/', import.meta.url));

function loadV1(file: string): { plan: Plan; changes: string[] } {
  const r = parsePlanText(readFileSync(join(V1_DIR, file), 'utf8'));
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  return { plan: r.plan, changes: r.changes };
}

const NOTE =
  /final reserve is now flown at normal cruise .* version 1 flew it at best-endurance speed/;

describe('v1 files migrate to the final reserve at normal cruise', () => {
  for (const file of [
    'piston-tourer.json',
    'light-jet.json',
    'twelve-legs.json',
    'route-survey.json',
    'survey-uav-electric.json',
  ]) {
    it(`${file}: the rule is written into the file, with a note`, () => {
      const { plan, changes } = loadV1(file);
      expect(plan.schemaVersion).toBe(2);
      expect(plan.reserves.finalReserveSpeed).toBe('normalCruise');
      expect(plan.reserves.finalReserveLevel).toBe('holdAltitude');
      expect(changes.filter((c) => NOTE.test(c))).toHaveLength(1);
    });
  }

  it('piston tourer: what changed — the 45 min now cost the cruise fuel flow, not the endurance one', () => {
    const { plan } = loadV1('piston-tourer.json');
    const now = solvePlan(plan).reserve;
    const old = solvePlan({
      ...plan,
      reserves: { ...plan.reserves, finalReserveSpeed: 'bestEndurance' },
    }).reserve;
    expect(now.final.rule).toBe('normalCruise');
    expect(now.final.cruiseLegIndex).toBe(3); // the last cruise leg, "Along the coast"
    expect(now.final.time_s).toBe(2700);
    // Cruise (59 m/s TAS) burns more per hour than the best-endurance speed, so the required
    // reserve grows: the honest answer to "45 minutes at normal cruise".
    expect(now.final.rate).toBeGreaterThan(1.2 * old.final.rate);
    expect(now.required.hold).toBeGreaterThan(old.required.hold);
    expect(now.required.total - old.required.total).toBeCloseTo(
      now.required.hold - old.required.hold,
      6,
    );
  });

  it('a small UAV holding 150 m above its field keeps a valid reserve: minimum height set, noted', () => {
    const { plan, changes } = loadV1('survey-uav-electric.json');
    expect(plan.reserves.minHeightAboveField_m).toBe(150); // hold 400 m, field 250 m
    expect(changes.some((c) => /minimum height is set to that/.test(c))).toBe(true);
    expect(solvePlan(plan).reserve.problems).toEqual([]);
  });

  it('files already above the 300 m default get no minimum-height note', () => {
    const { plan, changes } = loadV1('piston-tourer.json');
    expect(plan.reserves.minHeightAboveField_m).toBeUndefined();
    expect(changes.some((c) => /minimum height/.test(c))).toBe(false);
  });

  it('leaves its input alone, an explicit rule alone, and tolerates junk', () => {
    const raw = { reserves: { holdTime_s: 600, finalReserveSpeed: 'bestEndurance' } };
    const notes: string[] = [];
    const out = finalReserveAtCruise(raw, notes);
    expect(out.reserves).toEqual(raw.reserves);
    expect(notes).toEqual([]);
    expect(raw).toEqual({ reserves: { holdTime_s: 600, finalReserveSpeed: 'bestEndurance' } });
    expect(finalReserveAtCruise({ reserves: 'none' }, notes)).toEqual({ reserves: 'none' });
    expect(finalReserveAtCruise({}, notes)).toEqual({});
  });
});
