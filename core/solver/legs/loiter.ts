/**
 * Loiter leg: an orbit over a point, level at the current altitude, at best-endurance or a
 * given speed, for a time (integrated over time) or for an amount of the consumable
 * (integrated over the consumable left; the solver uses this for "until reserve", see
 * loiterReserve.ts).
 *
 * An orbit needs no course: it covers no ground (ground distance 0, air distance V·t), and
 * its consumption does not depend on the wind (quasi-steady level flight; the turn itself is
 * outside the model, README "What the models leave out"). The wind only decides whether the
 * aircraft can hold station: a circle flown in a steady wind drifts with the air mass, and
 * the aircraft gets back upwind only while its airspeed exceeds the wind speed (common
 * practice of air navigation). With a wind at least the airspeed the leg fails, naming the
 * wind and the airspeed. The leg's course is kept only to give the table's wind direction a
 * reference; it does not change the result.
 */
import type { LoiterLeg } from '../../plan/schema.ts';
import type { AloftPath, FlightPath, SpeedSchedule } from '../point.ts';
import type { LimitKind, MissionState, SegmentSpec } from '../segment.ts';
import {
  flyFlightLeg,
  legWind,
  refusedLeg,
  type LegContext,
  type LegOutcome,
  type LegWind,
} from './common.ts';

/** `consume`: for an "until reserve" loiter, the amount of fuel kg or battery J to use. */
export function flyLoiter(
  ctx: LegContext,
  leg: LoiterLeg,
  start: MissionState,
  consume = 0,
): LegOutcome {
  const wind = legWind(ctx.model, ctx.index, leg);
  if (typeof wind === 'string') return refusedLeg(ctx, leg, start, wind);
  const speed: SpeedSchedule =
    leg.speed.kind === 'bestEndurance'
      ? { kind: 'bestEndurance' }
      : { kind: 'fixed', speed: leg.speed };
  const orbit = orbitWind(wind);
  const path = orbitPath(`legs.${ctx.index}.speed`, speed, orbit);
  const fixedSpeed = speed.kind === 'fixed';
  const limits: LimitKind[] = ['power', 'consumable', 'station'];
  if (fixedSpeed) limits.push('stall');
  const spec: SegmentSpec =
    leg.end.by === 'time'
      ? { path, indep: 't', to: start.t_s + leg.end.time_s, limits, samples: ctx.samples }
      : { path, indep: 'q', to: Math.max(start.left - consume, 0), limits, samples: ctx.samples };
  const out = flyFlightLeg(ctx, leg, start, spec, orbit, {
    stall: true,
    power: true,
    climb: false,
  });
  // Round an orbit the wind is as much a tailwind as a headwind: no mean component, and the
  // heading turns through every direction (the course is reported as the heading).
  out.result.headwind_m_s = 0;
  out.result.crosswind_m_s = 0;
  out.result.heading_deg = wind.course_deg;
  return out;
}

/**
 * The wind an orbit sees: its whole speed, carried as a headwind (the point model's wind
 * components), the table's wind likewise (`allHeadwind`).
 */
function orbitWind(wind: LegWind): LegWind {
  if (wind.aloft !== undefined) {
    const aloft: AloftPath = { ...wind.aloft, allHeadwind: true };
    return { headwind_m_s: 0, crosswind_m_s: 0, course_deg: wind.course_deg, aloft };
  }
  return {
    headwind_m_s: Math.hypot(wind.headwind_m_s, wind.crosswind_m_s),
    crosswind_m_s: 0,
    course_deg: wind.course_deg,
  };
}

function orbitPath(field: string, speed: SpeedSchedule, wind: LegWind): FlightPath {
  const path: FlightPath = {
    speed,
    vertical: { kind: 'level' },
    headwind_m_s: wind.headwind_m_s,
    crosswind_m_s: wind.crosswind_m_s,
    field,
    orbit: true,
  };
  if (wind.aloft !== undefined) path.aloft = wind.aloft;
  return path;
}
