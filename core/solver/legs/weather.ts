/**
 * A leg's weather: its own wind against its course, or (windSource 'aloft') the winds-aloft
 * table's wind and air at every altitude flown (core/solver/model.ts, point.ts, aloft.ts).
 */
import type { ClimbLeg, CruiseLeg, DescentLeg, LoiterLeg } from '../../plan/schema.ts';
import { courseTrig, crosswindOf, headwindOf } from '../aloft.ts';
import { ambientAt, type FlightModel } from '../model.ts';
import type { AloftPath } from '../point.ts';
import { windComponents, type WindComponents } from '../wind.ts';

/** A leg's wind against its course: its own, or the winds-aloft table's (`aloft`). */
export interface LegWind extends WindComponents {
  course_deg: number;
  aloft?: AloftPath;
}

/**
 * The wind of a leg with a course. With windSource 'aloft' the components come from the
 * table at each altitude flown (the fixed ones here are 0); a plan without a table cannot
 * fly such a leg, and the reason is returned instead.
 */
export function legWind(
  model: FlightModel,
  index: number,
  leg: ClimbLeg | CruiseLeg | LoiterLeg | DescentLeg,
): LegWind | string {
  const course_deg = leg.course_deg;
  if (leg.windSource !== 'aloft') return { ...windComponents(course_deg, leg.wind), course_deg };
  if (model.aloft === null) {
    return `legs.${index}.windSource is 'aloft' but the plan has no winds-aloft table (environment.windsAloft)`;
  }
  return {
    headwind_m_s: 0,
    crosswind_m_s: 0,
    course_deg,
    aloft: { wind: true, ...courseTrig(course_deg) },
  };
}

/**
 * Wind components reported for a leg: its own, or for a table wind those at the altitude
 * midway between the leg's start and end (exact for a level leg).
 */
export function reportedWind(model: FlightModel, wind: LegWind, h0_m: number, h1_m: number) {
  const a = wind.aloft;
  if (a === undefined || !a.wind) return wind;
  try {
    const amb = ambientAt(model, 0.5 * (h0_m + h1_m), true);
    const e = amb.windEast_m_s;
    const n = amb.windNorth_m_s;
    return {
      headwind_m_s: headwindOf(e, n, a.sinCourse, a.cosCourse),
      crosswind_m_s: crosswindOf(e, n, a.sinCourse, a.cosCourse),
    };
  } catch {
    return wind;
  }
}
