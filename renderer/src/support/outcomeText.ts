/**
 * Words and numbers of the outcome area: each check's value against its limit in the
 * display units, the verdict sentence, the consumable columns.
 */
import type { Check, PlanResult } from '../../../core/solver/types.ts';
import {
  checkFigures as coreCheckFigures,
  describeMargin,
  describeReserveProblem,
  minutesText,
} from '../../../core/solver/describe.ts';
import type { Quantity, UnitSystem } from '../../../core/units.ts';
import { formatNumber, formatQuantity } from '../../../core/format.ts';

/** "value vs limit" in display units (core/solver/describe.ts: runway lengths in m or ft). */
export function checkFigures(check: Check, system: UnitSystem): string {
  const { value, limit } = coreCheckFigures(check, system);
  return `${value} vs limit ${limit}`;
}

/**
 * A check's margin as people read it (core/solver/describe.ts): a percentage, an absolute
 * difference against a zero limit, a multiple beyond ±999 %, or words for a planner-chosen speed.
 */
export function marginText(check: Check, system: UnitSystem): string {
  return describeMargin(check, system);
}

/** The margin cell's tooltip. */
export function marginTitle(check: Check): string {
  if (check.chosenSpeed)
    return 'Speed chosen by the planner: it keeps the stall margin by construction';
  return 'Margin to the limit';
}

/**
 * The landing line: what is left and the reserve required, each also in minutes at the final
 * reserve's rule (normal cruise or best endurance), or why the reserve cannot be flown.
 */
export function landingLine(result: PlanResult, system: UnitSystem): string {
  const q: Quantity = result.consumable === 'battery' ? 'energy' : 'fuelMass';
  const r = result.reserve;
  const left = formatQuantity(result.landing.remaining, q, system);
  const pct = formatNumber(result.landing.fractionOfStart * 100, 0);
  const need = formatQuantity(r.required.total, q, system);
  if (r.problems.length > 0) {
    const why = r.problems.map((p) => describeReserveProblem(p, system)).join('; ');
    return `On landing ${left} left (${pct} % of the start); the reserve cannot be flown: ${why}.`;
  }
  const f = r.final;
  const rule = f.rule === 'normalCruise' ? 'normal cruise' : 'best endurance';
  const inTime = (s: number) => (r.requiredTime_s > 0 ? ` (${minutesText(s)} at ${rule})` : '');
  const final =
    f.time_s > 0
      ? `; final reserve ${minutesText(f.time_s)} at ${rule}, ${formatQuantity(f.altitude_m, 'altitude', system)}`
      : '';
  return `On landing ${left}${inTime(r.remainingTime_s)} left (${pct} % of the start); the reserve policy asks for ${need}${inTime(r.requiredTime_s)}${final}.`;
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
