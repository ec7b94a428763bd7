/**
 * Per-waypoint estimates of a solved plan with a route: time from the start of the mission
 * (ETA) and fuel (kg) or usable battery energy (J) left, for the GPX export and the screens.
 *
 * The first waypoint is the departure point: its estimate is the state at the start of the
 * first leg after the take-off allowance(s), i.e. airborne over it with the allowance used
 * (the allowance covers taxi, run-up and take-off at the field; the route starts in the air).
 * Every other waypoint takes the state at the end of the leg that reached it
 * (LegResult.waypointReached, set by the solver; routeTrack.ts says which leg that is). A
 * waypoint reached more than once keeps its first arrival; one not reached (the mission
 * stops before, or no leg flies to it) has no estimate.
 */
import type { Plan } from '../plan/schema.ts';
import type { FlightState, PlanResult } from './types.ts';

export interface WaypointProgress {
  /** Index in plan.route.waypoints. */
  index: number;
  id: string;
  name: string;
  reached: boolean;
  /** The leg whose end (first waypoint: start) the estimate is taken at; null if not reached. */
  legIndex: number | null;
  /** Time from the start of the mission, s (null if not reached). */
  eta_s: number | null;
  /** Fuel (kg) or usable battery energy (J) left (null if not reached). */
  remaining: number | null;
  remainingUnit: 'kg' | 'J';
  /** Ground distance from the start of the mission, m (null if not reached). */
  x_m: number | null;
}

/** One entry per route waypoint, in route order; empty for a plan without a route. */
export function routeProgress(plan: Plan, result: PlanResult): WaypointProgress[] {
  const waypoints = plan.route?.waypoints ?? [];
  const battery = result.consumable === 'battery';
  const unit = battery ? 'J' : 'kg';
  const out: WaypointProgress[] = waypoints.map((w, index) => ({
    index,
    id: w.id,
    name: w.name,
    reached: false,
    legIndex: null,
    eta_s: null,
    remaining: null,
    remainingUnit: unit,
    x_m: null,
  }));
  const mark = (k: number, legIndex: number, s: FlightState) => {
    const p = out[k];
    if (p === undefined || p.reached) return;
    p.reached = true;
    p.legIndex = legIndex;
    p.eta_s = s.t_s;
    p.remaining = battery ? s.energy_J : s.fuel_kg;
    p.x_m = s.x_m;
  };
  const first = result.legs.findIndex((l) => l.kind !== 'takeoff');
  const departure = result.legs[first];
  if (departure !== undefined && departure.status !== 'notReached') {
    mark(0, first, departure.start);
  }
  for (const leg of result.legs) {
    const w = leg.waypointReached;
    if (w !== undefined && leg.status === 'flown') mark(w.index, leg.index, leg.end);
  }
  return out;
}
