/**
 * Ties mission legs to a route: a leg that names a `toWaypoint` flies the WGS-84 geodesic
 * from the last waypoint reached (the route's first waypoint at the start) to that waypoint,
 * on its initial true course (geodesics after Karney 2013, geodesic.ts). Legs without a
 * target keep their own course and do not move the reference point.
 *
 * Consecutive targeted legs that name the same waypoint form one "run" and share its
 * geodesic (e.g. a climb, a cruise and a descent all flying to the same waypoint); untargeted
 * legs between them do not break the run. The next run starts from the waypoint the previous
 * one flew to. How the solver splits a run's geodesic among its legs is in
 * core/solver/routeTrack.ts.
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

export interface LegRouteTarget {
  /** The geodesic the leg's run flies (the same object for every leg of the run). */
  leg: RouteLeg;
  /** Index of the target in the route's waypoints. */
  waypointIndex: number;
  /** Count of the run among the runs of the plan, from 0. */
  run: number;
}

export interface ResolvedTargets {
  /** One entry per leg up to the first bad one; undefined for a leg without a target. */
  targets: (LegRouteTarget | undefined)[];
  /** The first leg whose target cannot be resolved (its index and why), or null. */
  error: { legIndex: number; error: InputError } | null;
}

/**
 * Resolves the legs' targets up to the first bad one, which is reported instead of thrown:
 * an unknown waypoint, or a first run that names the waypoint the aircraft starts at.
 */
export function resolveLegRoute(
  route: RouteForLegs,
  legs: readonly LegTarget[],
  field = 'legs',
): ResolvedTargets {
  const index = new Map(route.waypoints.map((w, i) => [w.id, i]));
  let at = route.waypoints[0];
  let current: LegRouteTarget | undefined;
  let runs = 0;
  const targets: (LegRouteTarget | undefined)[] = [];
  for (let i = 0; i < legs.length; i++) {
    const id = legs[i]?.toWaypoint;
    if (id === undefined) {
      targets.push(undefined);
      continue;
    }
    if (current !== undefined && current.leg.to.id === id) {
      targets.push(current);
      continue;
    }
    if (current !== undefined) at = current.leg.to;
    const k = index.get(id);
    const to = k === undefined ? undefined : route.waypoints[k];
    const name = `${field}.${i}.toWaypoint`;
    if (to === undefined || k === undefined || at === undefined) {
      return { targets, error: { legIndex: i, error: unknownWaypoint(name, id) } };
    }
    if (to.id === at.id) {
      const error = new InputError(
        name,
        id,
        `a waypoint other than the one the aircraft is already at (${at.id})`,
      );
      return { targets, error: { legIndex: i, error } };
    }
    try {
      const [resolved] = routeLegs([at, to], {
        magneticVariation_deg: route.magneticVariation_deg,
        field: `${field}.${i}.route`,
      });
      current = { leg: resolved as RouteLeg, waypointIndex: k, run: runs++ };
    } catch (e) {
      if (!(e instanceof InputError)) throw e;
      return { targets, error: { legIndex: i, error: e } };
    }
    targets.push(current);
  }
  return { targets, error: null };
}

function unknownWaypoint(field: string, id: string): InputError {
  return new InputError(field, id, 'the id of a waypoint of the route');
}

/**
 * One entry per leg: the geodesic it flies, or undefined for a leg without a target.
 * Throws InputError naming `${field}.${i}.toWaypoint` for an unknown waypoint or for a
 * first target equal to the waypoint the aircraft starts at.
 */
export function resolveLegTargets(
  route: RouteForLegs,
  legs: readonly LegTarget[],
  field = 'legs',
): (RouteLeg | undefined)[] {
  const r = resolveLegRoute(route, legs, field);
  if (r.error !== null) throw r.error.error;
  return r.targets.map((t) => t?.leg);
}
