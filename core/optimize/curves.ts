/**
 * Power (thrust power) and thrust, required and available, across airspeed at the altitude
 * and weight where a chosen leg starts — the classic performance chart (Anderson,
 * Introduction to Flight, ch. 6: power required and available, maximum velocity) — with the
 * stall, best-range, best-endurance and maximum-level speeds marked. Best range and best
 * endurance come from the solver's own speed schedules (core/solver/speeds.ts), so the marks
 * are the speeds the solver flies, best range in the leg's wind (or the winds-aloft table's).
 */
import { withMissionWind } from '../solver/missionWind.ts';
import { InputError } from '../errors.ts';
import type { Leg, Plan } from '../plan/schema.ts';
import { courseTrig, crosswindOf, headwindOf } from '../solver/aloft.ts';
import { ambientAt, buildModel, type Ambient } from '../solver/model.ts';
import { bestEnduranceTas, bestRangeTas, MACH_CAP } from '../solver/speeds.ts';
import type { SpeedContext } from '../solver/speeds.ts';
import { windComponents, type WindComponents } from '../solver/wind.ts';
import { countOption, solveForSearch } from './planTools.ts';
import {
  availablePowerAt,
  flightConditions,
  maxLevelSpeed,
  requiredPowerAt,
  stallSpeedAt,
} from './envelope.ts';

export interface PowerCurves {
  /** Where the curves hold: the leg's start altitude (MSL) and mass. */
  altitude_m: number;
  mass_kg: number;
  tas_m_s: number[];
  /** Thrust power required, D·V. */
  required_W: number[];
  /** Thrust power available at full throttle. */
  available_W: number[];
  thrustRequired_N: number[];
  thrustAvailable_N: number[];
  marks: {
    /** Clean stall speed (no stall factor). */
    stall_m_s: number;
    bestRange_m_s: number;
    bestEndurance_m_s: number;
    /** Null when level flight is impossible at full power at this altitude and weight. */
    maxLevel_m_s: number | null;
  };
}

export interface PowerCurveOptions {
  /** Number of speeds (default 80, at least 10). */
  points?: number;
}

function legWindAt(legPlan: Leg, course: number | undefined, amb: Ambient): WindComponents {
  if (!('wind' in legPlan)) return { headwind_m_s: 0, crosswind_m_s: 0 };
  const course_deg = course ?? legPlan.course_deg;
  if (!amb.aloft) return windComponents(course_deg, legPlan.wind);
  const { sinCourse, cosCourse } = courseTrig(course_deg);
  const e = amb.windEast_m_s;
  const n = amb.windNorth_m_s;
  return {
    headwind_m_s: headwindOf(e, n, sinCourse, cosCourse),
    crosswind_m_s: crosswindOf(e, n, sinCourse, cosCourse),
  };
}

export function powerCurves(
  asGiven: Plan,
  legIndex: number,
  options: PowerCurveOptions = {},
): PowerCurves {
  const plan = withMissionWind(asGiven);
  const legPlan = plan.legs[legIndex];
  if (!Number.isInteger(legIndex) || legPlan === undefined) {
    throw new InputError('legIndex', legIndex, `an integer from 0 to ${plan.legs.length - 1}`);
  }
  const leg = solveForSearch(plan).legs[legIndex];
  if (leg === undefined || leg.status === 'notReached') {
    throw new InputError(`legs.${legIndex}`, legIndex, 'a leg the plan reaches');
  }
  const { h_m, mass_kg } = leg.start;
  const model = buildModel(plan);
  // The leg's weather as the solver flies it: its own wind, or the winds-aloft table's wind
  // and air at the leg's altitude; its course from the route when it flies to a waypoint.
  const aloft = 'windSource' in legPlan && legPlan.windSource === 'aloft' && model.aloft !== null;
  const cond = flightConditions(plan, h_m, mass_kg, aloft);
  const amb = ambientAt(model, h_m, aloft);
  const wind = legWindAt(legPlan, leg.course_deg, amb);
  const ctx: SpeedContext = { model, mass_kg, amb, ...wind };

  const stall_m_s = stallSpeedAt(cond);
  const maxLevel_m_s = maxLevelSpeed(plan, cond);
  const bestRange_m_s = bestRangeTas(ctx).tas_m_s;
  const bestEndurance_m_s = bestEnduranceTas(ctx).tas_m_s;

  const lo = 0.95 * stall_m_s;
  const vRef = maxLevel_m_s ?? Math.max(bestRange_m_s, 2 * stall_m_s);
  // 1.6 × max level speed, but not past the Mach cap of the drag model unless the
  // crossing itself lies beyond it (then just past the crossing).
  const hi = Math.max(Math.min(1.6 * vRef, MACH_CAP * cond.atm.a_m_s), 1.05 * vRef, 1.5 * lo);
  const n = countOption('options.points', options.points, 80, 10);
  const out: PowerCurves = {
    altitude_m: h_m,
    mass_kg,
    tas_m_s: [],
    required_W: [],
    available_W: [],
    thrustRequired_N: [],
    thrustAvailable_N: [],
    marks: { stall_m_s, bestRange_m_s, bestEndurance_m_s, maxLevel_m_s },
  };
  for (let j = 0; j < n; j++) {
    const V = lo + ((hi - lo) * j) / (n - 1);
    const req = requiredPowerAt(cond, V);
    const avail = availablePowerAt(plan, cond, V);
    out.tas_m_s.push(V);
    out.required_W.push(req);
    out.available_W.push(avail);
    out.thrustRequired_N.push(req / V);
    out.thrustAvailable_N.push(avail / V);
  }
  return out;
}
