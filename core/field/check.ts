/**
 * Distance required against distance available, with a safety factor, in the ok / tight /
 * fails semantics of core/solver/types.ts `Check`: margin = (limit − value)/limit with
 * value = factor × required and limit = available; fails below 0, tight below tightMargin.
 *
 * Factors are common practice and user-settable (from memory): take-off 1.15 (115 % of the
 * all-engines take-off distance in transport certification) or 1.33 (light-aircraft safety
 * guidance); landing 1.43 (= 1/0.7, landing within 70 % of the distance available) or 1.67
 * (= 1/0.6, jet transports).
 */
import { requireFinite } from '../errors.ts';
import type { CheckState } from '../solver/types.ts';

export const COMMON_TAKEOFF_FACTOR = 1.15;
export const COMMON_LANDING_FACTOR = 1.43;
export const DEFAULT_TIGHT_MARGIN = 0.1;

export interface RunwayCheckInput {
  required_m: number;
  available_m: number;
  /** Safety factor ≥ 1 applied to the required distance; 1 if omitted. */
  factor?: number;
  /** A margin below this is tight (the plan's settings.tightMargin); 0.1 if omitted. */
  tightMargin?: number;
}

export interface RunwayCheck {
  required_m: number;
  /** factor × required: the value compared with the limit. */
  factored_m: number;
  available_m: number;
  margin: number;
  state: CheckState;
}

/** ok / tight / fails from a relative margin. */
export function marginState(margin: number, tightMargin: number): CheckState {
  if (margin < 0) return 'fails';
  return margin < tightMargin ? 'tight' : 'ok';
}

export function runwayCheck(input: RunwayCheckInput): RunwayCheck {
  const required_m = requireFinite('required_m', input.required_m, 0, 1e6, 'm');
  const available_m = requireFinite('available_m', input.available_m, 1, 1e6, 'm');
  const factor = requireFinite('factor', input.factor ?? 1, 1, 3);
  const tight = requireFinite('tightMargin', input.tightMargin ?? DEFAULT_TIGHT_MARGIN, 0, 0.5);
  const factored_m = factor * required_m;
  const margin = (available_m - factored_m) / available_m;
  return { required_m, factored_m, available_m, margin, state: marginState(margin, tight) };
}
