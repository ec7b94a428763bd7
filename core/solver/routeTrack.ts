/**
 * Flying the plan's route (plan.route). Legs that name a `toWaypoint` take their true course
 * from the route: the initial course of the WGS-84 geodesic from the last waypoint reached
 * to the one named (Karney 2013, core/route/geodesic.ts; resolveLegRoute groups consecutive
 * legs naming the same waypoint into one run on one geodesic).
 *
 * Distances, so that the ground track between waypoints is the geodesic's length:
 * - In each run, the last cruise leg that ends by distance is "stretched": it flies the
 *   geodesic's length less the ground distance already flown toward the waypoint since the
 *   previous one was reached — every climb and descent leg (named or not) and the run's
 *   other cruise-by-distance legs — and less the ground distance of the climb and descent
 *   legs of the run that follow it directly (a descent into the waypoint). Those follow-on
 *   legs depend on the mass the cruise leaves, so their distance is found by trial flights
 *   from the cruise's end, repeated until it settles (usually at once: a descent at a given
 *   rate and speed or at best glide covers the same ground at any weight).
 * - The waypoint is reached at the end of the last of those follow-on legs, else at the end
 *   of the stretched cruise. A run without a cruise ending by distance has no distance to
 *   adjust: its legs fly their own, the waypoint counts as reached at the end of the run,
 *   and a warning says so.
 * - Loiters and cruises ending by fuel or energy take the course only; their ground
 *   distance is not progress along the route.
 * If the stretched cruise has nothing left to fly (≤ 0 m), it fails and names the leg.
 */
import type { CruiseLeg, Leg, Plan } from '../plan/schema.ts';
import { resolveLegRoute, type LegRouteTarget } from '../route/resolveRoute.ts';
import { flyLeg, type LegContext, type LegOutcome } from './legs/index.ts';
import { legName, refusedLeg } from './legs/common.ts';
import { fmt } from './point.ts';
import type { MissionState } from './segment.ts';
import type { LegResult } from './types.ts';

export interface RoutedLeg {
  target: LegRouteTarget;
  /** The cruise leg that flies what is left of the run's geodesic. */
  stretch: boolean;
  /** For the stretched cruise: the climb and descent legs of the run right after it. */
  trailing: readonly number[];
  /** The waypoint is reached at the end of this leg. */
  reaches: boolean;
}

export interface RouteTrack {
  /** The legs as flown: the route's course where a leg names a waypoint. */
  legs: readonly Leg[];
  routed: readonly (RoutedLeg | undefined)[];
  /** This leg's ground distance is progress toward the next waypoint. */
  counts: readonly boolean[];
  /** The first leg whose waypoint cannot be resolved; the mission stops there. */
  failure: { legIndex: number; message: string } | null;
  warnings: string[];
}

/** Trial rounds for the follow-on legs' distance (it settles in one or two). */
const MAX_ROUNDS = 6;

const isDistanceCruise = (leg: Leg | undefined): leg is CruiseLeg =>
  leg?.kind === 'cruise' && leg.end.by === 'distance';
const isClimbOrDescent = (leg: Leg | undefined) => leg?.kind === 'climb' || leg?.kind === 'descent';

/** The route's legs, courses and distances for a plan; null for a plan without a route. */
export function routeTrack(plan: Plan): RouteTrack | null {
  const route = plan.route;
  if (route === undefined) return null;
  const resolved = resolveLegRoute(
    route,
    plan.legs.map((l) => ({ toWaypoint: 'toWaypoint' in l ? l.toWaypoint : undefined })),
  );
  const targets = resolved.targets;
  const legs = plan.legs.map((leg, i) => {
    const t = targets[i];
    return t !== undefined && 'course_deg' in leg ? { ...leg, course_deg: t.leg.course_deg } : leg;
  });
  const routed: (RoutedLeg | undefined)[] = targets.map((target) =>
    target === undefined ? undefined : { target, stretch: false, trailing: [], reaches: false },
  );
  const counts = legs.map((l) => isClimbOrDescent(l));
  const warnings: string[] = [];
  const runs = new Map<number, number[]>();
  targets.forEach((t, i) => {
    if (t !== undefined) runs.set(t.run, [...(runs.get(t.run) ?? []), i]);
  });
  for (const members of runs.values()) {
    const stretch = members.filter((i) => isDistanceCruise(legs[i])).pop();
    const last = members[members.length - 1] as number;
    if (stretch === undefined) {
      (routed[last] as RoutedLeg).reaches = true;
      const to = (targets[last] as LegRouteTarget).leg.to.id;
      warnings.push(
        `${legName(last, legs[last] as Leg)}: no cruise leg that ends by distance flies to waypoint "${to}", so the legs to it fly their own distances and the track need not end there.`,
      );
      continue;
    }
    for (const i of members) if (i !== stretch && isDistanceCruise(legs[i])) counts[i] = true;
    const trailing: number[] = [];
    for (let j = stretch + 1; routed[j]?.target.run === routed[stretch]?.target.run; j++) {
      if (!isClimbOrDescent(legs[j])) break;
      trailing.push(j);
    }
    const r = routed[stretch] as RoutedLeg;
    r.stretch = true;
    r.trailing = trailing;
    (routed[trailing[trailing.length - 1] ?? stretch] as RoutedLeg).reaches = true;
  }
  const failure =
    resolved.error === null
      ? null
      : {
          legIndex: resolved.error.legIndex,
          message: resolved.error.error.message,
        };
  return { legs, routed, counts, failure, warnings };
}

/** Ground distance flown toward the next waypoint after leg i (0 once it reaches one). */
export function alongAfter(track: RouteTrack, i: number, along_m: number, flown_m: number) {
  if (track.routed[i]?.reaches) return 0;
  return track.counts[i] ? along_m + flown_m : along_m;
}

/** Marks a flown leg with its waypoint, course and (if reached) the waypoint reached. */
export function annotateLeg(plan: Plan, routed: RoutedLeg, out: LegOutcome): void {
  const r: LegResult = out.result;
  const to = routed.target.leg.to;
  r.toWaypoint = to.id;
  r.course_deg = routed.target.leg.course_deg;
  if (routed.reaches && !out.failed && plan.route !== undefined) {
    r.waypointReached = { id: to.id, name: to.name, index: routed.target.waypointIndex };
  }
}

/**
 * Flies the stretched cruise leg `ctx.index` from `start`, `along_m` of the geodesic having
 * been flown since the previous waypoint (see the header).
 */
export function flyRouteCruise(
  ctx: LegContext,
  legs: readonly Leg[],
  routed: RoutedLeg,
  start: MissionState,
  along_m: number,
): LegOutcome {
  const leg = legs[ctx.index] as CruiseLeg;
  const L = routed.target.leg.distance_m;
  const followOn = (s: MissionState): number | null => {
    let x = s;
    for (const j of routed.trailing) {
      const o = flyLeg({ model: ctx.model, index: j, samples: 0 }, legs[j] as Leg, x);
      if (o.failed) return null;
      x = o.end;
    }
    return x.x_m - s.x_m;
  };
  const hasFollowOn = routed.trailing.length > 0;
  let trail = hasFollowOn ? (followOn(start) ?? 0) : 0;
  for (let round = 1; ; round++) {
    const distance_m = L - along_m - trail;
    if (!(distance_m > 0)) {
      const { from, to } = routed.target.leg;
      return refusedLeg(
        ctx,
        leg,
        start,
        `the climb and descent legs on the way from waypoint "${from.id}" to "${to.id}" fly ${fmt(along_m + trail)} m of its ${fmt(L)} m, so nothing is left for this cruise (legs.${ctx.index}.toWaypoint)`,
      );
    }
    const out = flyLeg(ctx, { ...leg, end: { by: 'distance', distance_m } }, start);
    if (!hasFollowOn || out.failed || round >= MAX_ROUNDS) return out;
    const next = followOn(out.end);
    if (next === null || Math.abs(next - trail) <= ctx.model.rtol * 1e-3 * L) return out;
    trail = next;
  }
}
