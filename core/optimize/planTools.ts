/**
 * Small helpers shared by the optimizers: copying a plan before changing it, reading the
 * consumable (fuel kg or usable battery J) out of a result, telling whether a leg was
 * really flown, and the reserve margin on landing. The optimizers never change the plan
 * they are given: every variant is a deep copy that is solved with `solvePlan`.
 */
import { InputError, requireFinite } from '../errors.ts';
import type { Fuel, Leg, LegKind, Plan, Powerplant } from '../plan/schema.ts';
import { solvePlan } from '../solver/solve.ts';
import type { LegResult, PlanResult } from '../solver/types.ts';
import { FUEL_DENSITY_KG_L } from '../units.ts';

// Core type-checks against ES2022 only, which does not declare the HTML structured-clone
// function that every supported runtime (Node ≥ 17, browsers) provides globally.
declare function structuredClone<T>(value: T): T;

/** A deep copy of the plan, safe to modify. */
export function clonePlan(plan: Plan): Plan {
  return structuredClone(plan);
}

/** Optimizer solves need no chart series: the fewest samples the solver allows. */
export function solveForSearch(plan: Plan): PlanResult {
  return solvePlan(plan, { samplesPerLeg: 2 });
}

/** A copy of the plan with leg `index` replaced by `leg`. */
export function withLeg(plan: Plan, index: number, leg: Leg): Plan {
  const copy = clonePlan(plan);
  copy.legs[index] = leg;
  return copy;
}

/** The leg at `legIndex`, refused with InputError unless it exists and is of one of `kinds`. */
export function requireLeg(plan: Plan, legIndex: number, kinds: readonly LegKind[]): Leg {
  const leg = Number.isInteger(legIndex) ? plan.legs[legIndex] : undefined;
  if (leg === undefined) {
    throw new InputError('legIndex', legIndex, `an integer from 0 to ${plan.legs.length - 1}`);
  }
  if (!kinds.includes(leg.kind)) {
    throw new InputError(`legs.${legIndex}.kind`, leg.kind, `one of ${kinds.join(', ')}`);
  }
  return leg;
}

export function isElectric(pp: Powerplant): boolean {
  return pp.type === 'electric';
}

/** Fuel (kg) or usable battery energy (J) used on a leg, in the plan's consumable. */
export function consumableUsed(result: PlanResult, leg: LegResult): number {
  return result.consumable === 'fuel' ? leg.fuelUsed_kg : leg.energyUsed_J;
}

/**
 * True when leg `i` was completed and none of its own checks (stall, power, ceiling …)
 * fails; plan-wide checks (MTOW, tank, reserve) are judged separately by the caller.
 */
export function legFlownCleanly(result: PlanResult, i: number): boolean {
  const leg = result.legs[i];
  if (leg === undefined || leg.status !== 'flown') return false;
  return !result.checks.some((c) => c.legIndex === i && c.state === 'fails');
}

/** True when every leg was flown and no per-leg check fails. */
export function allLegsFlownCleanly(result: PlanResult): boolean {
  return result.completed && !result.checks.some((c) => c.legIndex !== null && c.state === 'fails');
}

/**
 * Reserve margin on landing in the consumable's unit (kg of fuel or J of usable energy):
 * what is left minus what the reserve policy requires. Positive = reserve kept.
 */
export function reserveMargin(result: PlanResult): number {
  return result.landing.remaining - result.reserve.required.total;
}

/** Mass of fuel a full tank holds (typical density of the kind unless the plan overrides it). */
export function tankCapacity_kg(fuel: Fuel): number {
  return fuel.tankCapacity_L * (fuel.density_kg_L ?? FUEL_DENSITY_KG_L[fuel.kind]);
}

/** Index of the first leg of `kind`, or −1. */
export function firstLegIndex(plan: Plan, kind: LegKind): number {
  return plan.legs.findIndex((l) => l.kind === kind);
}

/** A count option (grid points): the default when absent, else an integer within [min, max]. */
export function countOption(
  field: string,
  value: number | undefined,
  fallback: number,
  min: number,
  max = 10_000,
): number {
  if (value === undefined) return fallback;
  requireFinite(field, value, min, max);
  if (!Number.isInteger(value))
    throw new InputError(field, value, `an integer from ${min} to ${max}`);
  return value;
}
