/**
 * JSON Schema (draft 2020-12, json-schema.org) of the plan file, generated from the zod
 * schema with zod 4's own `z.toJSONSchema`, so editors can validate and complete plan
 * files. The committed copy lives in schemas/; `npm run schemas` regenerates it and a
 * test fails when it is out of date.
 *
 * Generated for the file as written (zod's input side: fields with defaults are
 * optional), and closed like the loader: an object accepts only its own keys
 * (`additionalProperties: false`). Rules zod cannot express in JSON Schema (unique leg
 * and waypoint ids, cross-field rules in load.ts) are still checked by the loader only.
 */
import { z } from 'zod';
import { PLAN_FORMAT, PLAN_SCHEMA_VERSION, PlanSchema } from './schema.ts';

export type JsonSchema = Record<string, unknown>;

/** Where the committed schema lives, relative to the project root. */
export const PLAN_JSON_SCHEMA_PATH = 'schemas/plan.schema.json';
/** The command that regenerates every committed schema. */
export const SCHEMAS_COMMAND = 'npm run schemas';

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** Closes every object that lists its properties, as the loader refuses unknown fields. */
function closeObjects(node: unknown): unknown {
  if (Array.isArray(node)) return node.map(closeObjects);
  if (!isObject(node)) return node;
  const out: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(node)) out[key] = closeObjects(value);
  if (out.type === 'object' && isObject(out.properties) && !('additionalProperties' in out))
    out.additionalProperties = false;
  return out;
}

export function planJsonSchema(): JsonSchema {
  const generated = z.toJSONSchema(PlanSchema, { io: 'input', unrepresentable: 'any' });
  const { $schema, ...body } = generated as JsonSchema;
  return {
    $schema,
    title: 'Legwise plan',
    description:
      `A Legwise plan file (format "${PLAN_FORMAT}", schema version ${PLAN_SCHEMA_VERSION}). ` +
      'Every quantity is SI with its unit in its key. Generated from core/plan/schema.ts; ' +
      `regenerate with \`${SCHEMAS_COMMAND}\`. Estimates for planning only.`,
    ...(closeObjects(body) as JsonSchema),
  };
}

/** The committed text: two-space JSON with a final newline (what Prettier keeps). */
export function schemaText(schema: JsonSchema): string {
  return `${JSON.stringify(schema, null, 2)}\n`;
}
