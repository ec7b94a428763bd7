/**
 * The committed JSON Schema (schemas/plan.schema.json) is current, and an independent
 * validator (Ajv, draft 2020-12 per json-schema.org) agrees with the loader on the
 * shipped examples and on files a person might get wrong.
 */
import { readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import Ajv2020 from 'ajv/dist/2020.js';
import { describe, expect, it } from 'vitest';
import {
  PLAN_JSON_SCHEMA_PATH,
  SCHEMAS_COMMAND,
  planJsonSchema,
} from '../../../core/plan/jsonSchema.ts';
import { parsePlanText, serializePlan } from '../../../core/plan/load.ts';
import { newPlan } from '../../../core/plan/defaults.ts';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..', '..');
const committedText = readFileSync(path.join(root, PLAN_JSON_SCHEMA_PATH), 'utf8');
const examples = readdirSync(path.join(root, 'examples'))
  .filter((f) => f.endsWith('.json'))
  .map((f) => path.join(root, 'examples', f));

function validator() {
  const ajv = new Ajv2020({ allErrors: true, strict: false });
  return ajv.compile(JSON.parse(committedText) as object);
}

describe('plan JSON Schema', () => {
  it('the committed copy is what the zod schema generates now', () => {
    const fresh = planJsonSchema();
    const committed: unknown = JSON.parse(committedText);
    // Deep equality of the parsed JSON: formatting is Prettier's business.
    if (JSON.stringify(committed) !== JSON.stringify(fresh)) {
      expect.fail(
        `${PLAN_JSON_SCHEMA_PATH} is out of date with core/plan/schema.ts — ` +
          `run \`${SCHEMAS_COMMAND}\` and commit the result`,
      );
    }
    expect(committed).toEqual(fresh);
  });

  it('is draft 2020-12 and closes objects like the loader does', () => {
    const schema = JSON.parse(committedText) as Record<string, unknown>;
    expect(schema.$schema).toBe('https://json-schema.org/draft/2020-12/schema');
    expect(schema.additionalProperties).toBe(false);
    expect(Object.keys(schema.properties as object)).toContain('$schema');
  });

  it('accepts every shipped example and a new plan, as the loader does', () => {
    const validate = validator();
    for (const file of [...examples]) {
      const data: unknown = JSON.parse(readFileSync(file, 'utf8'));
      expect(validate(data), `${path.basename(file)}: ${JSON.stringify(validate.errors)}`).toBe(
        true,
      );
    }
    expect(validate(JSON.parse(serializePlan(newPlan())))).toBe(true);
  });

  it('refuses what the loader refuses: out-of-range number, unknown key, wrong tag', () => {
    const validate = validator();
    const base = JSON.parse(serializePlan(newPlan())) as Record<string, unknown> & {
      aircraft: { wingArea_m2: number; mass: Record<string, number> };
    };
    const cases: Array<[string, (p: typeof base) => void]> = [
      ['negative wing area', (p) => void (p.aircraft.wingArea_m2 = -3)],
      ['unknown key', (p) => void (p.aircraft.mass.ballast_kg = 2)],
      ['wrong format tag', (p) => void (p.format = 'something-else')],
      ['newer version', (p) => void (p.schemaVersion = 99)],
    ];
    for (const [label, spoil] of cases) {
      const copy = structuredClone(base);
      spoil(copy);
      expect(validate(copy), label).toBe(false);
      expect(parsePlanText(JSON.stringify(copy)).ok, label).toBe(false);
    }
  });

  it('a plan carrying a $schema key loads, and saving keeps the key', () => {
    const withKey = {
      $schema: '../schemas/plan.schema.json',
      ...(JSON.parse(serializePlan(newPlan())) as object),
    };
    expect(validator()(withKey)).toBe(true);
    const loaded = parsePlanText(JSON.stringify(withKey));
    expect(loaded.ok).toBe(true);
    if (!loaded.ok) return;
    expect(loaded.plan.$schema).toBe('../schemas/plan.schema.json');
    expect(JSON.parse(serializePlan(loaded.plan)).$schema).toBe('../schemas/plan.schema.json');
  });
});
