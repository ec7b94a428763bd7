/**
 * Speed × altitude map of one cruise or loiter leg: the leg is flown by the solver's own leg
 * integrator (core/solver/legs) at every (TAS, altitude) pair, starting from the mass and
 * consumable the mission has when it reaches the leg, and the consumption per unit ground
 * distance (cruise) or per unit time (loiter) is recorded. Pairs where the leg cannot be
 * flown (stall margin, power, wind, consumable, above the ceiling) hold `null`, never NaN.
 * Only the leg itself is integrated, not the whole mission, so a 100 × 60 map stays fast.
 */
import { InputError, requireFinite } from '../errors.ts';
import type { CruiseLeg, LoiterLeg, Plan } from '../plan/schema.ts';
import { flyLeg } from '../solver/legs/index.ts';
import { buildModel, type SolveTolerance } from '../solver/model.ts';
import type { MissionState } from '../solver/segment.ts';
import type { Consumable } from '../solver/types.ts';
import { clonePlan, requireLeg, solveForSearch } from './planTools.ts';

export interface SpeedAltitudeGrid {
  speeds_m_s: number[];
  altitudes_m: number[];
  consumable: Consumable;
  /** Cruise: kg/m or J/m of ground distance; loiter: kg/s or J/s. */
  per: 'distance' | 'time';
  /** values[altitudeIndex][speedIndex]; null where the leg cannot be flown. */
  values: (number | null)[][];
  /** Accepted integrator steps over the whole map. */
  steps: number;
  /** Legs flown (speeds × altitudes). */
  legsFlown: number;
}

/** Schema limits on a fixed TAS and on altitudes. */
const MAX_TAS_M_S = 400;
const MIN_ALTITUDE_M = -400;
const MAX_ALTITUDE_M = 20_000;

export interface SweepOptions {
  /**
   * Integration accuracy of each leg flown: 'precise' (default, as solvePlan) or 'fast'
   * (relative tolerance 1e-6, plenty for a chart).
   */
  tolerance?: SolveTolerance;
}

export function speedAltitudeSweep(
  plan: Plan,
  legIndex: number,
  speeds_m_s: readonly number[],
  altitudes_m: readonly number[],
  options: SweepOptions = {},
): SpeedAltitudeGrid {
  requireLeg(plan, legIndex, ['cruise', 'loiter']);
  speeds_m_s.forEach((v, i) => {
    requireFinite(`speeds_m_s.${i}`, v, 0, MAX_TAS_M_S, 'm/s');
    if (v <= 0) throw new InputError(`speeds_m_s.${i}`, v, 'above 0 m/s');
  });
  altitudes_m.forEach((h, i) =>
    requireFinite(`altitudes_m.${i}`, h, MIN_ALTITUDE_M, MAX_ALTITUDE_M, 'm'),
  );
  const legStart = solveForSearch(plan).legs[legIndex];
  if (legStart === undefined || legStart.status === 'notReached') {
    throw new InputError(`legs.${legIndex}`, legIndex, 'a leg the plan reaches');
  }
  const work = clonePlan(plan);
  const leg = work.legs[legIndex] as CruiseLeg | LoiterLeg;
  // A leg flying to a waypoint takes its course from the route, as in the mission.
  if (legStart.course_deg !== undefined) leg.course_deg = legStart.course_deg;
  const model = buildModel(work, options.tolerance ?? 'precise');
  const ctx = { model, index: legIndex, samples: 0 };
  const { mass_kg } = legStart.start;
  const left = model.consumable === 'fuel' ? legStart.start.fuel_kg : legStart.start.energy_J;
  const per = leg.kind === 'cruise' ? 'distance' : 'time';
  // A loiter "until reserve" is given what it used in the mission as planned.
  const loiterConsume = model.consumable === 'fuel' ? legStart.fuelUsed_kg : legStart.energyUsed_J;
  const ceiling = plan.aircraft.ceiling_m;

  const grid: SpeedAltitudeGrid = {
    speeds_m_s: [...speeds_m_s],
    altitudes_m: [...altitudes_m],
    consumable: model.consumable,
    per,
    values: [],
    steps: 0,
    legsFlown: 0,
  };
  const speed = { kind: 'tas' as const, speed_m_s: 1 };
  leg.speed = speed;
  for (const h_m of altitudes_m) {
    const row: (number | null)[] = [];
    for (const v of speeds_m_s) {
      speed.speed_m_s = v;
      const start: MissionState = { t_s: 0, x_m: 0, air_m: 0, path_m: 0, h_m, mass_kg, left };
      const out = flyLeg(ctx, leg, start, loiterConsume);
      grid.steps += out.result.steps;
      grid.legsFlown++;
      const r = out.result;
      const used = model.consumable === 'fuel' ? r.fuelUsed_kg : r.energyUsed_J;
      const span = per === 'distance' ? r.groundDistance_m : r.time_s;
      const aboveCeiling = (out.checks.maxAltitude_m ?? h_m) > ceiling;
      row.push(out.failed || aboveCeiling || !(span > 0) ? null : used / span);
    }
    grid.values.push(row);
  }
  return grid;
}
