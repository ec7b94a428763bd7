/** The demo plan files, read once for the plan and CLI tests. */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

export const DEMO_FILES = [
  'survey-uav-electric.json',
  'piston-tourer.json',
  'light-jet.json',
  'twelve-legs.json',
] as const;

export function examplePath(file: string): string {
  return fileURLToPath(new URL(`../../../examples/${file}`, import.meta.url));
}

export function demoText(file: string): string {
  return readFileSync(examplePath(file), 'utf8');
}

/** A fresh, mutable copy of a demo plan as parsed JSON. */
export function demoJson(file: string): Record<string, unknown> {
  return JSON.parse(demoText(file)) as Record<string, unknown>;
}

/** Sets a value at a dotted path (numbers index arrays) in parsed JSON; `undefined` deletes. */
export function setAt(root: unknown, path: string, value: unknown): void {
  const keys = path.split('.');
  let node = root as Record<string, unknown>;
  for (const key of keys.slice(0, -1)) node = node[key] as Record<string, unknown>;
  const last = keys[keys.length - 1] as string;
  if (value === undefined) delete node[last];
  else node[last] = value;
}
