import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/errors.ts';
import { parsePlan } from '../../../core/plan/load.ts';
import { MIGRATIONS, migratePlan, oldestReadableVersion } from '../../../core/plan/migrate.ts';
import type { Migration, RawPlan } from '../../../core/plan/migrate.ts';
import { PLAN_SCHEMA_VERSION } from '../../../core/plan/schema.ts';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parsePlanText } from '../../../core/plan/load.ts';
import { demoJson } from './demoPlans.ts';

/** Version-1 copies of the example plans, kept as they were written by Legwise 0.1. */
const V1_DIR = fileURLToPath(new URL('../../fixtures/plans-v1/', import.meta.url));
const V1_FILES = readdirSync(V1_DIR).filter((f) => f.endsWith('.json'));

/** A pretend older format: legs were called `segments` and the version was 0. */
function asFakeV0(v1: RawPlan): RawPlan {
  const { legs, ...rest } = v1;
  return { ...rest, schemaVersion: 0, segments: legs };
}
const fakeStep0: Migration = (raw) => {
  const { segments, ...rest } = raw;
  return { ...rest, legs: segments, schemaVersion: 1 };
};

describe('plan migrations', () => {
  it('version 2 is current; a current file needs no steps', () => {
    expect(PLAN_SCHEMA_VERSION).toBe(2);
    expect(Object.keys(MIGRATIONS)).toEqual(['1']);
    const raw = demoJson('piston-tourer.json');
    expect(migratePlan(raw)).toEqual(raw);
  });

  it('every version-1 copy of the examples still loads', () => {
    for (const file of V1_FILES) {
      const r = parsePlanText(readFileSync(join(V1_DIR, file), 'utf8'));
      expect(r.ok, file).toBe(true);
    }
  });

  it('an injected v0 → v1 step makes an older file load exactly like its v1 twin', () => {
    const v1 = JSON.parse(readFileSync(join(V1_DIR, 'twelve-legs.json'), 'utf8')) as RawPlan;
    const v0 = asFakeV0(v1);
    const viaStep = parsePlan(v0, { migrations: { ...MIGRATIONS, 0: fakeStep0 } });
    const direct = parsePlan(v1);
    expect(viaStep.ok).toBe(true);
    expect(viaStep.ok && viaStep.plan).toEqual(direct.ok && direct.plan);
    // without the step the old file is refused on its version, naming the readable range
    const refused = parsePlan(v0);
    expect(refused.ok).toBe(false);
    if (!refused.ok)
      expect(refused.issues[0]?.message).toBe('schemaVersion: 0 — must be from 1 to 2');
  });

  it('runs the chain in order up to the target and stamps each version', () => {
    const seen: number[] = [];
    const steps = {
      1: (r: RawPlan) => (seen.push(Number(r.schemaVersion)), { ...r, a: 1 }),
      2: (r: RawPlan) => (seen.push(Number(r.schemaVersion)), { ...r, b: Number(r.a) + 1 }),
    };
    const input = { schemaVersion: 1 };
    const out = migratePlan(input, steps, 3);
    expect(seen).toEqual([1, 2]);
    expect(out).toEqual({ schemaVersion: 3, a: 1, b: 2 });
    expect(input).toEqual({ schemaVersion: 1 }); // the input is left untouched
    expect(oldestReadableVersion(steps, 3)).toBe(1);
  });

  it('a failing step becomes an issue on schemaVersion, not an exception', () => {
    const broken: Migration = () => {
      throw new Error('segments is not a list');
    };
    expect(() => migratePlan({ schemaVersion: 0 }, { 0: broken })).toThrow(InputError);
    const r = parsePlan(asFakeV0(demoJson('light-jet.json')), {
      migrations: { ...MIGRATIONS, 0: broken },
    });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.issues).toHaveLength(1);
      expect(r.issues[0]?.message).toMatch(
        /^schemaVersion: 0 — must be convertible to version 1 \(segments is not a list\)$/,
      );
    }
  });

  it('refuses versions outside what the chain can reach', () => {
    expect(() => migratePlan({ schemaVersion: 5 }, {}, 1)).toThrow(
      /schemaVersion: 5 is out of range/,
    );
    expect(() => migratePlan({ schemaVersion: 0.5 }, { 0: fakeStep0 }, 1)).toThrow(InputError);
  });
});
