/**
 * Best cruise altitude: the plan is solved with the climb before the first cruise leg
 * ending at each altitude of a grid, from 300 m above the departure aerodrome to the lower
 * of the ceiling and the highest altitude the climb can reach, and the altitude that
 * leaves the most fuel or energy on landing wins. Climb and descent costs are included
 * because the whole mission is flown each time. Golden-section refinement around the best
 * grid point (Press et al., Numerical Recipes, §10.2). Infeasible altitudes are marked,
 * never reported as NaN. Legs set to the winds-aloft table fly its wind and temperature at
 * each trial altitude (the solver's own weather), so a lower level with less headwind can
 * win; with a route, the cruise to each waypoint absorbs the longer or shorter climb, so
 * every trial flies the same ground track.
 */
import { InputError } from '../errors.ts';
import { levelsBetween, type LevelGrid } from '../levels.ts';
import type { ClimbLeg, Plan } from '../plan/schema.ts';
import type { PlanResult } from '../solver/types.ts';
import {
  allLegsFlownCleanly,
  clonePlan,
  countOption,
  firstLegIndex,
  legFlownCleanly,
  solveForSearch,
} from './planTools.ts';
import { bisectEdge, goldenSectionMax } from './search1d.ts';
import type { SearchPoint } from './search1d.ts';

/** Lowest cruise altitude considered, above the departure elevation (common practice). */
export const MIN_HEIGHT_ABOVE_DEPARTURE_M = 300;

export interface AltitudeSweepOptions {
  /** Grid points (default 25, at least 3). */
  points?: number;
  /** Refine the best grid point by golden section (default true). */
  refine?: boolean;
  /**
   * Also suggest the best level people fly (500 ft or 100 m steps, optionally the
   * semicircular rule, core/levels.ts): the better of the levels either side of the optimum.
   */
  levels?: LevelGrid;
}

export interface AltitudeSweepResult {
  /** Null when no altitude of the grid lets the whole mission be flown. */
  best: { altitude_m: number; remaining: number } | null;
  /** remaining = fuel (kg) or usable energy (J) on landing; 0 where feasible is false. */
  curve: { altitude_m: number[]; remaining: number[]; feasible: boolean[] };
  /** Top of the grid: the ceiling, or the highest altitude the climb reaches if lower. */
  top_m: number;
  /** Bottom of the grid: MIN_HEIGHT_ABOVE_DEPARTURE_M above the departure elevation. */
  bottom_m: number;
  /**
   * The best altitude is the top of the grid (within 1 m): set by the ceiling, or by the
   * highest altitude the climb reaches; null when it lies below the top.
   */
  limitedBy: 'ceiling' | 'climb' | null;
  /** With `levels`: the flyable level that lands with the most; null if none in range works. */
  level?: { altitude_m: number; remaining: number } | null;
}

/** The climb legs before the first cruise leg, which set the cruise altitude. */
function climbsBeforeCruise(plan: Plan): number[] {
  const firstCruise = firstLegIndex(plan, 'cruise');
  if (firstCruise < 0) throw new InputError('legs', 'no cruise leg', 'a plan with a cruise leg');
  const climbs: number[] = [];
  plan.legs.forEach((l, i) => {
    if (l.kind === 'climb' && i < firstCruise) climbs.push(i);
  });
  if (climbs.length === 0) {
    throw new InputError(
      `legs.${firstCruise}`,
      'no climb before it',
      'a climb leg before the first cruise leg',
    );
  }
  return climbs;
}

/**
 * The level of the grid next below and next above the optimum (inside [lo, top]) that
 * lands with the most; the whole mission is solved at each, as for the optimum itself.
 */
function bestLevel(
  best_m: number,
  lo: number,
  top: number,
  grid: LevelGrid,
  remainingAt: (h: number) => number | null,
): { altitude_m: number; remaining: number } | null {
  const all = levelsBetween(lo, top, grid);
  const below = all.filter((h) => h <= best_m).at(-1);
  const above = all.find((h) => h > best_m);
  let out: { altitude_m: number; remaining: number } | null = null;
  for (const h of [below, above]) {
    if (h === undefined) continue;
    const v = remainingAt(h);
    if (v !== null && (out === null || v > out.remaining)) out = { altitude_m: h, remaining: v };
  }
  return out;
}

/**
 * Best cruise altitude by whole-mission solves. The last climb before the first cruise
 * leg ends at the trial altitude; earlier climbs keep their targets unless those are
 * higher, in which case they stop at the trial altitude too. The descent after the cruise
 * needs no change: descent legs carry only their target and start wherever the aircraft is.
 */
export function bestCruiseAltitude(
  plan: Plan,
  options: AltitudeSweepOptions = {},
): AltitudeSweepResult {
  const climbs = climbsBeforeCruise(plan);
  const points = countOption('options.points', options.points, 25, 3);
  const lo = plan.environment.departureElevation_m + MIN_HEIGHT_ABOVE_DEPARTURE_M;
  const ceiling = plan.aircraft.ceiling_m;
  if (!(ceiling > lo)) {
    throw new InputError(
      'aircraft.ceiling_m',
      ceiling,
      `above the departure elevation + ${MIN_HEIGHT_ABOVE_DEPARTURE_M} m (${lo} m)`,
    );
  }
  const original = climbs.map((i) => (plan.legs[i] as ClimbLeg).toAltitude_m);
  const lastClimb = climbs[climbs.length - 1] as number;
  const work = clonePlan(plan);
  const solveAt = (altitude_m: number): PlanResult => {
    climbs.forEach((i, j) => {
      const leg = work.legs[i] as ClimbLeg;
      leg.toAltitude_m = i === lastClimb ? altitude_m : Math.min(original[j] as number, altitude_m);
    });
    return solveForSearch(work);
  };
  const climbReaches = (altitude_m: number): boolean => {
    const r = solveAt(altitude_m);
    return climbs.every((i) => legFlownCleanly(r, i));
  };

  let top = ceiling;
  if (!climbReaches(ceiling) && climbReaches(lo)) top = bisectEdge(climbReaches, lo, ceiling, 1);

  const remainingAt = (altitude_m: number): number | null => {
    const r = solveAt(altitude_m);
    return allLegsFlownCleanly(r) ? r.landing.remaining : null;
  };
  const curve = {
    altitude_m: [] as number[],
    remaining: [] as number[],
    feasible: [] as boolean[],
  };
  let best: SearchPoint | null = null;
  let bestIndex = -1;
  for (let j = 0; j < points; j++) {
    const h = lo + ((top - lo) * j) / (points - 1);
    const v = remainingAt(h);
    curve.altitude_m.push(h);
    curve.remaining.push(v ?? 0);
    curve.feasible.push(v !== null);
    if (v !== null && (best === null || v > best.value)) {
      best = { x: h, value: v };
      bestIndex = j;
    }
  }
  if (best !== null && (options.refine ?? true) && top > lo) {
    const step = (top - lo) / (points - 1);
    const h0 = lo + step * bestIndex;
    best =
      goldenSectionMax(remainingAt, Math.max(lo, h0 - step), Math.min(top, h0 + step), 1, best) ??
      best;
  }
  const atTop = best !== null && top - best.x <= 1;
  const level =
    options.levels && best !== null
      ? bestLevel(best.x, lo, top, options.levels, remainingAt)
      : undefined;
  return {
    ...(level !== undefined ? { level } : {}),
    best: best === null ? null : { altitude_m: best.x, remaining: best.value },
    curve,
    top_m: top,
    bottom_m: lo,
    limitedBy: atTop ? (top === ceiling ? 'ceiling' : 'climb') : null,
  };
}
