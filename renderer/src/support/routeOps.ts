/**
 * Editing the plan's route: waypoints from a GPX file or typed in, and the mission legs
 * tied to them. A leg with `toWaypoint` flies the WGS-84 geodesic from the last waypoint
 * reached to that one; consecutive legs naming the same waypoint form one run on one
 * geodesic (core/route/resolveRoute.ts). The solver takes each such leg's track from the
 * route and stretches the run's last cruise that ends by distance to what is left of the
 * geodesic (core/solver/routeTrack.ts); the plan keeps the numbers the person typed.
 * Pure functions over plain plan data.
 */
import type { CruiseLeg, Leg, Plan, WaypointData } from '../../../core/plan/schema.ts';
import type { GpxRoute } from '../../../core/route/gpx.ts';
import { resolveLegRoute, type LegRouteTarget } from '../../../core/route/resolveRoute.ts';
import { routeLegs } from '../../../core/route/waypoints.ts';
import { defaultLeg } from '../../../core/plan/defaults.ts';
import { insertLeg, uniqueLegId } from './legOps.ts';

/** Route waypoints in the plan's form (GPX names and ids are already clipped by parseGpx). */
export function waypointsFromGpx(route: GpxRoute): WaypointData[] {
  return route.waypoints.map((w) => ({ ...w }));
}

/** The plan with this route; variation kept from the route it replaces (0 for a new one). */
export function withWaypoints(plan: Plan, waypoints: WaypointData[]): Plan {
  const magneticVariation_deg = plan.route?.magneticVariation_deg ?? 0;
  return { ...plan, route: { waypoints, magneticVariation_deg } };
}

/** The plan without a route; legs keep the track and distance they had from it. */
export function withoutRoute(plan: Plan): Plan {
  const { route: _dropped, ...rest } = plan;
  const legs = plan.legs.map((leg) => {
    if (!('toWaypoint' in leg) || leg.toWaypoint === undefined) return leg;
    const { toWaypoint: _target, ...kept } = leg;
    return kept as Leg;
  });
  return { ...rest, legs };
}

export function newWaypointId(waypoints: readonly WaypointData[]): string {
  const taken = new Set(waypoints.map((w) => w.id));
  for (let n = waypoints.length + 1; ; n++) if (!taken.has(`wp${n}`)) return `wp${n}`;
}

/** Two waypoints to start a route by hand, half a degree apart. */
export function startingWaypoints(): WaypointData[] {
  return [
    { id: 'wp1', name: 'Start', lat_deg: 0, lon_deg: 0 },
    { id: 'wp2', name: 'End', lat_deg: 0.5, lon_deg: 0.5 },
  ];
}

/** A new waypoint after `index`, a little beyond it (the person types the real position). */
export function addWaypoint(waypoints: readonly WaypointData[], index: number): WaypointData[] {
  const at = waypoints[index] ?? waypoints[waypoints.length - 1];
  const id = newWaypointId(waypoints);
  const lat = Math.min(90, Math.max(-90, (at?.lat_deg ?? 0) + 0.1));
  const lon = (((at?.lon_deg ?? 0) + 0.1 + 540) % 360) - 180;
  const w: WaypointData = {
    id,
    name: id.toUpperCase(),
    lat_deg: Number(lat.toFixed(4)),
    lon_deg: Number(lon.toFixed(4)),
  };
  const i = Math.min(index + 1, waypoints.length);
  return [...waypoints.slice(0, i), w, ...waypoints.slice(i)];
}

export function moveWaypoint(
  waypoints: readonly WaypointData[],
  from: number,
  to: number,
): WaypointData[] {
  const target = Math.min(Math.max(0, to), waypoints.length - 1);
  const moved = waypoints[from];
  if (!moved || target === from) return waypoints.slice();
  const rest = waypoints.filter((_, i) => i !== from);
  return [...rest.slice(0, target), moved, ...rest.slice(target)];
}

export interface LegTargets {
  /** One entry per leg up to the first that cannot be resolved; undefined: no waypoint. */
  targets: (LegRouteTarget | undefined)[];
  /** Why a leg's waypoint cannot be flown to (it names the leg and the waypoint), or null. */
  problem: string | null;
}

/** Each leg's run on the route (core/route/resolveRoute.ts); never throws. */
export function legTargets(plan: Plan): LegTargets {
  if (!plan.route) return { targets: plan.legs.map(() => undefined), problem: null };
  const legs = plan.legs.map((l) => ({ toWaypoint: 'toWaypoint' in l ? l.toWaypoint : undefined }));
  try {
    const r = resolveLegRoute(plan.route, legs);
    return { targets: r.targets, problem: r.error ? r.error.error.message : null };
  } catch (err) {
    return { targets: [], problem: err instanceof Error ? err.message : String(err) };
  }
}

/**
 * Legs whose ground distance the route sets: in each run, the last cruise that ends by
 * distance (the rule of core/solver/routeTrack.ts). Their own distance field does not count.
 */
export function routeDistanceLegs(plan: Plan, targets = legTargets(plan).targets): Set<number> {
  const lastOfRun = new Map<number, number>();
  targets.forEach((t, i) => {
    const leg = plan.legs[i];
    if (t && leg?.kind === 'cruise' && leg.end.by === 'distance') lastOfRun.set(t.run, i);
  });
  return new Set(lastOfRun.values());
}

const hasTarget = (leg: Leg) => 'toWaypoint' in leg && leg.toWaypoint !== undefined;
/** A cruise leg flying to a waypoint: what "Build legs from route" makes and replaces. */
export const isRouteCruise = (leg: Leg) => leg.kind === 'cruise' && hasTarget(leg);

/** Where new route legs go: before the final run of descent and landing legs. */
function insertionPoint(legs: readonly Leg[]): number {
  let at = legs.length;
  while (at > 0 && ['descent', 'landing'].includes(legs[at - 1]?.kind ?? '')) at--;
  return at;
}

/**
 * One cruise leg per route leg, flying to its waypoint. Its track and distance are set to the
 * geodesic's as a starting point (the solver takes them from the route anyway); speed,
 * altitude program and wind come from the plan's first cruise leg (or the defaults). With
 * `replace`, the cruise legs flying to waypoints are removed and the new ones take their
 * place; climbs and descents to waypoints stay.
 */
export function buildRouteLegs(plan: Plan, options: { replace: boolean }): Plan {
  if (!plan.route) return plan;
  const pieces = routeLegs(plan.route.waypoints, {
    magneticVariation_deg: plan.route.magneticVariation_deg,
  });
  const firstOld = plan.legs.findIndex(isRouteCruise);
  let legs: Leg[] = options.replace
    ? plan.legs.filter((l) => !isRouteCruise(l))
    : plan.legs.slice();
  let at = options.replace && firstOld >= 0 ? firstOld : insertionPoint(legs);
  const template =
    plan.legs.find((l): l is CruiseLeg => l.kind === 'cruise' && !hasTarget(l)) ??
    plan.legs.find((l): l is CruiseLeg => l.kind === 'cruise');
  for (const piece of pieces) {
    const id = uniqueLegId(legs, 'cruise');
    const base = template ?? (defaultLeg('cruise', id) as CruiseLeg);
    const leg: CruiseLeg = {
      ...structuredClone(base),
      id,
      label: `To ${piece.to.name.trim() || piece.to.id}`.slice(0, 120),
      course_deg: piece.course_deg,
      end: { by: 'distance', distance_m: piece.distance_m },
      toWaypoint: piece.to.id,
    };
    legs = insertLeg(legs, leg, at++);
  }
  return { ...plan, legs };
}
