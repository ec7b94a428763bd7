/**
 * Turning an optimizer's suggestion into a plan edit. The cruise-altitude rule is the one
 * core/optimize/altitudeSweep.ts evaluates: the last climb before the first cruise leg ends
 * at the new altitude, earlier climbs stop there too if they aimed higher.
 */
import type { Plan } from '../../../core/plan/schema.ts';

/** Indices of the climb legs before the first cruise leg. */
export function climbsBeforeCruise(plan: Plan): number[] {
  const firstCruise = plan.legs.findIndex((l) => l.kind === 'cruise');
  if (firstCruise < 0) return [];
  return plan.legs.flatMap((l, i) => (l.kind === 'climb' && i < firstCruise ? [i] : []));
}

export function withCruiseAltitude(plan: Plan, altitude_m: number): Plan {
  const climbs = climbsBeforeCruise(plan);
  const last = climbs[climbs.length - 1];
  const legs = plan.legs.map((leg, i) => {
    if (leg.kind !== 'climb' || !climbs.includes(i)) return leg;
    return {
      ...leg,
      toAltitude_m: i === last ? altitude_m : Math.min(leg.toAltitude_m, altitude_m),
    };
  });
  return { ...plan, legs };
}

/** The cruise altitude the plan flies now: where its last climb before cruise ends. */
export function currentCruiseAltitude(plan: Plan): number | null {
  const climbs = climbsBeforeCruise(plan);
  const last = climbs[climbs.length - 1];
  const leg = last === undefined ? undefined : plan.legs[last];
  return leg?.kind === 'climb' ? leg.toAltitude_m : null;
}

/** Rounds a suggested value for entry: speeds to 0.1 m/s, altitudes to 1 m, payload to 0.1 kg. */
export function roundSuggestion(value: number, step: number): number {
  return Math.round(value / step) * step;
}
