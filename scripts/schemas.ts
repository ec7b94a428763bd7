/**
 * `npm run schemas`: writes the JSON Schemas generated from the zod schemas to schemas/.
 * Run it after changing core/plan/schema.ts; test/core/plan/jsonSchema.test.ts fails
 * while the committed copy is out of date.
 */
import { writeFileSync, mkdirSync } from 'node:fs';
import path from 'node:path';
import process from 'node:process';
import { fileURLToPath } from 'node:url';
import prettier from 'prettier';
import { PLAN_JSON_SCHEMA_PATH, planJsonSchema, schemaText } from '../core/plan/jsonSchema.ts';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const outputs: Array<[string, string]> = [[PLAN_JSON_SCHEMA_PATH, schemaText(planJsonSchema())]];
for (const [relative, text] of outputs) {
  const file = path.join(root, relative);
  mkdirSync(path.dirname(file), { recursive: true });
  // Formatted as `npx prettier` would, so the format check stays clean.
  const options = (await prettier.resolveConfig(file)) ?? {};
  writeFileSync(file, await prettier.format(text, { ...options, filepath: file }));
  process.stdout.write(`wrote ${relative}\n`);
}
