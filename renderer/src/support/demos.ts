/**
 * The demo plans shipped in examples/, bundled into the page by Vite's JSON import and
 * checked with the same loader as any plan file.
 */
import { parsePlan } from '../../../core/plan/load.ts';
import type { Plan } from '../../../core/plan/schema.ts';

export interface DemoPlan {
  /** File name without `.json`, e.g. `twelve-legs`. */
  id: string;
  name: string;
  data: unknown;
}

const files = import.meta.glob<unknown>('../../../examples/*.json', {
  eager: true,
  import: 'default',
});

const nameOf = (data: unknown) =>
  typeof data === 'object' && data !== null && typeof (data as { name?: unknown }).name === 'string'
    ? (data as { name: string }).name
    : '';

/** The demos by name; each is checked only when chosen, keeping the page start quick. */
export const DEMO_PLANS: readonly DemoPlan[] = Object.entries(files)
  .map(([path, data]) => ({
    id: path.replace(/^.*\//, '').replace(/\.json$/, ''),
    name: nameOf(data),
    data,
  }))
  .filter((d) => d.name !== '')
  .sort((a, b) => a.name.localeCompare(b.name));

export function loadDemo(id: string): Plan | null {
  const demo = DEMO_PLANS.find((d) => d.id === id);
  const loaded = demo ? parsePlan(structuredClone(demo.data)) : null;
  return loaded?.ok ? loaded.plan : null;
}
