/**
 * Words and numbers of the outcome area: each check's value against its limit in the
 * display units, the verdict sentence, the consumable columns.
 */
import type { Check, PlanResult } from '../../../core/solver/types.ts';
import { checkFigures as coreCheckFigures } from '../../../core/solver/describe.ts';
import type { Quantity, UnitSystemId } from '../../../core/units.ts';
import { formatNumber } from '../../../core/format.ts';

/** "value vs limit" in display units (core/solver/describe.ts: runway lengths in m or ft). */
export function checkFigures(check: Check, system: UnitSystemId): string {
  const { value, limit } = coreCheckFigures(check, system);
  return `${value} vs limit ${limit}`;
}

export function marginText(check: Check): string {
  if (!Number.isFinite(check.margin)) return '';
  const pct = check.margin * 100;
  return `${formatNumber(pct, Math.abs(pct) < 10 ? 1 : 0, true)} %`;
}

export function verdictSentence(result: PlanResult): string {
  if (result.failure)
    return `The plan cannot be flown: leg ${result.failure.legIndex + 1} — ${result.failure.message}`;
  const fails = result.checks.filter((c) => c.state === 'fails').length;
  const tight = result.checks.filter((c) => c.state === 'tight').length;
  if (fails > 0) return `${fails} check${fails === 1 ? '' : 's'} fail${fails === 1 ? 's' : ''}.`;
  if (tight > 0) return `Every check passes; ${tight} with little margin.`;
  return 'Every check passes with margin.';
}

/** Checks in the order a person should read them: failures, then tight, then the rest. */
export function orderedChecks(checks: readonly Check[]): Check[] {
  const rank = { fails: 0, tight: 1, ok: 2 } as const;
  return checks
    .map((c, i) => ({ c, i }))
    .sort((a, b) => rank[a.c.state] - rank[b.c.state] || a.i - b.i)
    .map(({ c }) => c);
}

export function consumableQuantity(result: PlanResult): Quantity {
  return result.consumable === 'battery' ? 'energy' : 'fuelMass';
}
