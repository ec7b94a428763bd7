/**
 * Last line of the "never NaN" promise (DESIGN.md §6): walks a result and replaces any
 * non-finite number by 0, reporting where, so that a screen never shows NaN or Infinity and
 * the failure is visible instead of hidden. The solver is built so that this never fires.
 */
import type { PlanResult } from './types.ts';

/** Paths of the non-finite numbers found (each replaced by 0 in place). */
export function replaceNonFinite(value: unknown, path = ''): string[] {
  const found: string[] = [];
  walk(value, path ? [path] : [], found);
  return found;
}

/** A path from its parts: object keys joined by dots, array indices in brackets. */
function spell(parts: readonly (string | number)[], last: string | number): string {
  let out = '';
  for (const p of [...parts, last]) {
    if (typeof p === 'number') out += `[${p}]`;
    else out += out ? `.${p}` : p;
  }
  return out;
}

// Results carry thousands of numbers and are walked after every solve (a Monte Carlo solves
// thousands of plans): the path is kept as a stack of parts and spelt out only where
// something is found.
function walk(value: unknown, parts: (string | number)[], found: string[]): void {
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const v: unknown = value[i];
      if (typeof v === 'number') {
        if (!Number.isFinite(v)) {
          value[i] = 0;
          found.push(spell(parts, i));
        }
      } else if (v !== null && typeof v === 'object') {
        parts.push(i);
        walk(v, parts, found);
        parts.pop();
      }
    }
  } else if (value !== null && typeof value === 'object') {
    const obj = value as Record<string, unknown>;
    const keys = Object.keys(obj);
    for (let k = 0; k < keys.length; k++) {
      const key = keys[k]!;
      const v = obj[key];
      if (typeof v === 'number') {
        if (!Number.isFinite(v)) {
          obj[key] = 0;
          found.push(spell(parts, key));
        }
      } else if (v !== null && typeof v === 'object') {
        parts.push(key);
        walk(v, parts, found);
        parts.pop();
      }
    }
  }
}

/** Applies the guard to a plan result and turns any finding into a plan failure. */
export function guardResult(result: PlanResult): PlanResult {
  const found = replaceNonFinite(result);
  if (found.length === 0) return result;
  const first = found[0] ?? '';
  const m = /^legs\[(\d+)\]/.exec(first);
  const legIndex = m ? Number(m[1]) : 0;
  const message = `internal: a non-finite number at ${first} was replaced by 0 (${found.length} in all); please report this plan`;
  result.completed = false;
  result.verdict = 'fails';
  result.failure ??= { legIndex, message };
  result.warnings.push(message);
  return result;
}
