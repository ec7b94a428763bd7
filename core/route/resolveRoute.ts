/**
 * Ties mission legs to a route: a leg that names a `toWaypoint` flies the WGS-84 geodesic
 * from where the aircraft is (the route's first waypoint at the start, then the last
 * waypoint reached) to that waypoint, on its initial true course (geodesics after Karney
 * 2013, geodesic.ts). Legs without a target keep their own course and do not move the
 * reference point. The solver (or a pre-pass over the plan) copies `course_deg` into the
 * leg and, for a leg ending at the waypoint, takes `distance_m` as its ground distance.
 */
import { InputError } from '../errors.ts';
import { routeLegs, type RouteLeg, type Waypoint } from './waypoints.ts';

export interface LegTarget {
  toWaypoint?: string;
}

export interface RouteForLegs {
  waypoints: readonly Waypoint[];
  /** Route-wide magnetic variation, degrees, east positive. */
  magneticVariation_deg?: number;
}

/**
 * One entry per leg: the geodesic it flies, or undefined for a leg without a target.
 * Throws InputError naming `${field}.${i}.toWaypoint` for an unknown waypoint or for a
 * target equal to the current position.
 */
export function resolveLegTargets(
  route: RouteForLegs,
  legs: readonly LegTarget[],
  field = 'legs',
): (RouteLeg | undefined)[] {
  const byId = new Map(route.waypoints.map((w) => [w.id, w]));
  let at = route.waypoints[0];
  return legs.map((leg, i) => {
    const id = leg.toWaypoint;
    if (id === undefined) return undefined;
    const to = byId.get(id);
    if (!to || !at) {
      throw new InputError(`${field}.${i}.toWaypoint`, id, 'the id of a waypoint of the route');
    }
    if (to.id === at.id) {
      throw new InputError(
        `${field}.${i}.toWaypoint`,
        id,
        `a waypoint other than the one the aircraft is already at (${at.id})`,
      );
    }
    const [resolved] = routeLegs([at, to], {
      magneticVariation_deg: route.magneticVariation_deg,
      field: `${field}.${i}.route`,
    });
    at = to;
    return resolved;
  });
}
