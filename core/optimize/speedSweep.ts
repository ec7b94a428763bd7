/**
 * Best airspeed for one cruise or loiter leg, found by solving the whole plan with that
 * leg flown at a fixed TAS: a sweep from the stall limit (stallFactor·Vs at the leg's start
 * weight and altitude) to the maximum level speed, then golden-section refinement around
 * the best sweep point (Press et al., Numerical Recipes, §10.2). Because the real solver
 * flies each candidate, the leg's wind, weight change and flight program are all included:
 * the cruise optimum maximises ground distance per unit fuel or energy (Anderson,
 * Introduction to Flight, ch. 6, for the still-air optima), the loiter optimum maximises
 * endurance.
 */
import { withMissionWind } from '../solver/missionWind.ts';
import { InputError } from '../errors.ts';
import type { CruiseLeg, LoiterLeg, Plan } from '../plan/schema.ts';
import { MACH_CAP } from '../solver/speeds.ts';
import type { PlanResult } from '../solver/types.ts';
import { flightConditions, maxLevelSpeed, stallSpeedAt } from './envelope.ts';
import {
  clonePlan,
  consumableUsed,
  countOption,
  legFlownCleanly,
  requireLeg,
  solveForSearch,
} from './planTools.ts';
import { goldenSectionMax } from './search1d.ts';
import type { SearchPoint } from './search1d.ts';

/** Highest TAS a plan may hold (schema limit) and the Mach bound of the drag model. */
const MAX_TAS_M_S = 400;
const MAX_MACH = MACH_CAP;

export interface SpeedSweepOptions {
  /** Sweep points before refinement (default 25, at least 5). */
  points?: number;
  /** Refine the best sweep point by golden section (default true). */
  refine?: boolean;
}

/** What the leg's value means: its consumption (kg or J), ground distance (m) or time (s). */
export type LegObjective =
  | { quantity: 'consumption'; sense: 'min' }
  | { quantity: 'groundDistance'; sense: 'max' }
  | { quantity: 'time'; sense: 'max' };

export interface SpeedSweepResult {
  objective: LegObjective;
  best: { tas_m_s: number; value: number };
  /** Sweep points at which the leg could be flown (infeasible speeds are left out). */
  curve: { tas_m_s: number[]; value: number[] };
  /** stallFactor·Vs at the leg's start weight and altitude: the lowest speed swept. */
  stallLimit_m_s: number;
  /** The highest speed swept: maximum level speed, bounded by 400 m/s TAS and the solver's Mach cap. */
  maxSpeed_m_s: number;
}

/** The value the optimum is judged by, from the kind of leg and how it ends. */
export function legObjective(leg: CruiseLeg | LoiterLeg): LegObjective {
  if (leg.kind === 'cruise') {
    return leg.end.by === 'distance'
      ? { quantity: 'consumption', sense: 'min' }
      : { quantity: 'groundDistance', sense: 'max' };
  }
  return leg.end.by === 'time'
    ? { quantity: 'consumption', sense: 'min' }
    : { quantity: 'time', sense: 'max' };
}

/** The objective's value for leg i of a solved plan, or null where the leg was not flown cleanly. */
export function legObjectiveValue(
  result: PlanResult,
  i: number,
  objective: LegObjective,
): number | null {
  const leg = result.legs[i];
  if (leg === undefined || !legFlownCleanly(result, i)) return null;
  if (objective.quantity === 'consumption') return consumableUsed(result, leg);
  if (objective.quantity === 'groundDistance') return leg.groundDistance_m;
  return leg.time_s;
}

/** The speed range a sweep may cover for leg i: from the stall limit to the maximum level speed. */
export function legSpeedRange(
  plan: Plan,
  base: PlanResult,
  legIndex: number,
): { lo_m_s: number; hi_m_s: number; stallLimit_m_s: number } {
  const start = base.legs[legIndex]?.start;
  if (start === undefined || base.legs[legIndex]?.status === 'notReached') {
    throw new InputError(`legs.${legIndex}`, legIndex, 'a leg the plan reaches');
  }
  const leg = plan.legs[legIndex];
  const aloft = leg !== undefined && 'windSource' in leg && leg.windSource === 'aloft';
  const cond = flightConditions(plan, start.h_m, start.mass_kg, aloft);
  const stallLimit_m_s = plan.settings.stallFactor * stallSpeedAt(cond);
  const vMax = maxLevelSpeed(plan, cond);
  const hi = Math.min(vMax ?? 0, MAX_TAS_M_S, MAX_MACH * cond.atm.a_m_s);
  // A hair above the limit so rounding never puts the first point on the wrong side of it.
  const lo = stallLimit_m_s * (1 + 1e-6);
  if (!(hi > lo)) {
    throw new InputError(
      `legs.${legIndex}`,
      Math.round(hi * 100) / 100,
      `a maximum level speed above the stall limit ${stallLimit_m_s.toFixed(2)} m/s at the leg's altitude and weight`,
    );
  }
  return { lo_m_s: lo, hi_m_s: hi, stallLimit_m_s };
}

/**
 * Best TAS for leg `legIndex` (a cruise or loiter leg). Value: cruise by distance and loiter
 * by time → the leg's consumption (minimised); cruise by fuel or energy → ground distance
 * (maximised); loiter until reserve → time (maximised).
 */
export function bestSpeedForLeg(
  asGiven: Plan,
  legIndex: number,
  options: SpeedSweepOptions = {},
): SpeedSweepResult {
  const plan = withMissionWind(asGiven);
  const leg = requireLeg(plan, legIndex, ['cruise', 'loiter']) as CruiseLeg | LoiterLeg;
  const points = countOption('options.points', options.points, 25, 5);
  const objective = legObjective(leg);
  const sign = objective.sense === 'max' ? 1 : -1;
  const { lo_m_s, hi_m_s, stallLimit_m_s } = legSpeedRange(plan, solveForSearch(plan), legIndex);

  // One private copy whose leg speed is changed between solves; `plan` is never touched.
  const work = clonePlan(plan);
  const workLeg = work.legs[legIndex] as CruiseLeg | LoiterLeg;
  const valueAt = (tas_m_s: number): number | null => {
    workLeg.speed = { kind: 'tas', speed_m_s: tas_m_s };
    return legObjectiveValue(solveForSearch(work), legIndex, objective);
  };

  const curve = { tas_m_s: [] as number[], value: [] as number[] };
  let bestIndex = -1;
  const xs: number[] = [];
  for (let j = 0; j < points; j++) xs.push(lo_m_s + ((hi_m_s - lo_m_s) * j) / (points - 1));
  for (const x of xs) {
    const v = valueAt(x);
    if (v === null) continue;
    curve.tas_m_s.push(x);
    curve.value.push(v);
    const bestValue = bestIndex < 0 ? undefined : curve.value[bestIndex];
    if (bestValue === undefined || sign * v > sign * bestValue) bestIndex = curve.value.length - 1;
  }
  const x0 = curve.tas_m_s[bestIndex];
  const v0 = curve.value[bestIndex];
  if (x0 === undefined || v0 === undefined) {
    throw new InputError(
      `legs.${legIndex}`,
      leg.id,
      `a leg that can be flown at some speed from ${lo_m_s.toFixed(2)} to ${hi_m_s.toFixed(2)} m/s TAS`,
    );
  }
  let best: SearchPoint = { x: x0, value: sign * v0 };
  if (options.refine ?? true) {
    const step = (hi_m_s - lo_m_s) / (points - 1);
    const a = Math.max(lo_m_s, x0 - step);
    const b = Math.min(hi_m_s, x0 + step);
    const signed = (x: number) => {
      const v = valueAt(x);
      return v === null ? null : sign * v;
    };
    best = goldenSectionMax(signed, a, b, 1e-5 * hi_m_s, best) ?? best;
  }
  return {
    objective,
    best: { tas_m_s: best.x, value: sign * best.value },
    curve,
    stallLimit_m_s,
    maxSpeed_m_s: hi_m_s,
  };
}
