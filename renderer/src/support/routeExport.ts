/**
 * The route as GPX 1.1 for a navigation device or a flight folder (core/route/gpxWrite.ts),
 * each waypoint with the plan's estimate: time from departure and fuel (or battery energy)
 * left when the aircraft gets there. The first waypoint is where the mission starts; each other
 * one takes the state at the end of the first flown leg that reaches it (the solver's
 * `waypointReached`, core/solver/routeTrack.ts).
 */
import type { Plan } from '../../../core/plan/schema.ts';
import type { FlightState, PlanResult } from '../../../core/solver/types.ts';
import { writeGpx, type WaypointEstimate } from '../../../core/route/gpx.ts';
import { CAUTION } from './wording.ts';

/** One estimate per waypoint, or null when some waypoint is not reached by a flown leg. */
export function waypointEstimates(plan: Plan, result: PlanResult): WaypointEstimate[] | null {
  const waypoints = plan.route?.waypoints ?? [];
  const battery = result.consumable === 'battery';
  const estimate = (s: FlightState): WaypointEstimate => ({
    eta_s: s.t_s,
    remaining: battery ? s.energy_J : s.fuel_kg,
    remainingUnit: battery ? 'J' : 'kg',
  });
  const out: WaypointEstimate[] = [];
  for (const k of waypoints.keys()) {
    const leg =
      k === 0
        ? result.legs[0]
        : result.legs.find((l) => l.status === 'flown' && l.waypointReached?.index === k);
    if (!leg || leg.status === 'notReached') return null;
    out.push(estimate(k === 0 ? leg.start : leg.end));
  }
  return out;
}

/** GPX text of the plan's route, with estimates when every waypoint has one. */
export function routeGpx(
  plan: Plan,
  result: PlanResult | null,
): { text: string; withEstimates: boolean } {
  const route = plan.route;
  if (!route) throw new Error('the plan has no route');
  const estimates = result ? waypointEstimates(plan, result) : null;
  const text = writeGpx({ name: plan.name, waypoints: route.waypoints }, estimates ?? [], {
    creator: 'Legwise',
    description: `${plan.name}. ${CAUTION}`,
  });
  return { text, withEstimates: estimates !== null };
}
