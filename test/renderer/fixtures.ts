/** Demo plans from examples/, loaded the way the page loads them (through the plan loader). */
import { readFileSync } from 'node:fs';
import { parsePlanText } from '../../core/plan/load.ts';
import type { Plan } from '../../core/plan/schema.ts';

export function examplePlan(name: string): Plan {
  const text = readFileSync(new URL(`../../examples/${name}.json`, import.meta.url), 'utf8');
  const loaded = parsePlanText(text);
  if (!loaded.ok)
    throw new Error(`examples/${name}.json does not load: ${loaded.issues[0]?.message}`);
  return loaded.plan;
}
