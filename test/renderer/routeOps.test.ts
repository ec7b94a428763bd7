import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { Plan } from '../../core/plan/schema.ts';
import { parsePlan } from '../../core/plan/load.ts';
import { parseGpx } from '../../core/route/gpx.ts';
import { solvePlan } from '../../core/solver/solve.ts';
import { createPlanStore } from '../../renderer/src/composables/usePlan.ts';
import {
  addWaypoint,
  buildRouteLegs,
  legTargets,
  moveWaypoint,
  routeDistanceLegs,
  waypointsFromGpx,
  withWaypoints,
  withoutRoute,
} from '../../renderer/src/support/routeOps.ts';
import { routeGpx, waypointEstimates } from '../../renderer/src/support/routeExport.ts';
import { examplePlan } from './fixtures.ts';
import { runsPlan } from './routePlans.ts';

const gpxText = readFileSync(new URL('../fixtures/gpx/route.gpx', import.meta.url), 'utf8');

function withFixtureRoute(plan: Plan): Plan {
  const read = parseGpx(gpxText);
  if (!read.ok) throw new Error(read.issues[0]?.message);
  return withWaypoints(plan, waypointsFromGpx(read.route));
}

/** Great-circle distance on a sphere of the IUGG mean radius (Moritz, GRS 80), haversine form. */
function haversine_m(
  a: { lat_deg: number; lon_deg: number },
  b: { lat_deg: number; lon_deg: number },
) {
  const R = 6371008.8;
  const rad = Math.PI / 180;
  const dlat = (b.lat_deg - a.lat_deg) * rad;
  const dlon = (b.lon_deg - a.lon_deg) * rad;
  const h =
    Math.sin(dlat / 2) ** 2 +
    Math.cos(a.lat_deg * rad) * Math.cos(b.lat_deg * rad) * Math.sin(dlon / 2) ** 2;
  return 2 * R * Math.asin(Math.sqrt(h));
}

describe('route legs', () => {
  const plan = withFixtureRoute(examplePlan('twelve-legs'));
  const waypoints = plan.route?.waypoints ?? [];

  it('a GPX route becomes the plan route and the plan still passes its check', () => {
    expect(waypoints.map((w) => w.name)).toEqual(['Start <field>', 'Ridge → north', 'Lake']);
    expect(parsePlan(plan).ok).toBe(true);
  });

  it('builds one cruise leg per route leg, before the final descent and landing', () => {
    const built = buildRouteLegs(plan, { replace: true });
    const added = built.legs.filter((l) => 'toWaypoint' in l && l.toWaypoint);
    expect(added.map((l) => ('toWaypoint' in l ? l.toWaypoint : ''))).toEqual(['wp2', 'wp3']);
    // The fixture route has 3 waypoints, so 2 route legs (test fixture route.gpx).
    expect(built.legs.length).toBe(plan.legs.length + 2);
    const last = built.legs.slice(-2).map((l) => l.kind);
    expect(last).toEqual(plan.legs.slice(-2).map((l) => l.kind));
    for (const [k, leg] of added.entries()) {
      if (leg.kind !== 'cruise' || leg.end.by !== 'distance')
        throw new Error('a cruise leg by distance');
      const a = waypoints[k];
      const b = waypoints[k + 1];
      if (!a || !b) throw new Error('fixture has 3 waypoints');
      // WGS-84 geodesic against the spherical haversine: within 0.6 % (Moritz, GRS 80 mean radius;
      // the sphere differs from the ellipsoid by up to about 0.6 %).
      expect(Math.abs(leg.end.distance_m / haversine_m(a, b) - 1)).toBeLessThan(0.006);
    }
    expect(parsePlan(built).ok).toBe(true);
    // Built again with replace: the same number of legs, not two sets.
    expect(buildRouteLegs(built, { replace: true }).legs.length).toBe(built.legs.length);
    expect(buildRouteLegs(built, { replace: false }).legs.length).toBe(built.legs.length + 2);
  });

  it('the solver flies route legs on the route; moving a waypoint changes the flight, not the legs', () => {
    const store = createPlanStore(buildRouteLegs(plan, { replace: true }));
    const i = store.draft.value.legs.findIndex((l) => 'toWaypoint' in l && l.toWaypoint === 'wp2');
    const before = store.draft.value.legs[i];
    const flown = (p: Plan) => solvePlan(p, { samplesPerLeg: 2 }).legs[i];
    const course0 = flown(store.draft.value)?.course_deg;
    // The track the solver flies is the route's (core/route/resolveRoute.ts, Karney geodesics).
    expect(course0).toBe(legTargets(store.draft.value).targets[i]?.leg.course_deg);
    store.setValue('route.waypoints.1.lat_deg', 47.6, 'route.waypoints.1.lat_deg');
    expect(store.draft.value.legs[i]).toBe(before);
    const course1 = flown(store.draft.value)?.course_deg;
    expect(course1).toBe(legTargets(store.draft.value).targets[i]?.leg.course_deg);
    expect(course1).not.toBe(course0);
    expect(flown(store.draft.value)?.waypointReached?.id).toBe('wp2');
  });

  it('names the cruise that takes its distance from the route: the last of each run', () => {
    // A climb, a cruise and a descent to one waypoint, two cruises and a descent to the next.
    const survey = runsPlan();
    const stretched = routeDistanceLegs(survey);
    const runs = legTargets(survey).targets;
    for (const i of stretched) {
      const leg = survey.legs[i];
      expect(leg?.kind === 'cruise' && leg.end.by === 'distance').toBe(true);
      const later = survey.legs.slice(i + 1).findIndex((l, k) => {
        const t = runs[i + 1 + k];
        return t?.run === runs[i]?.run && l.kind === 'cruise' && l.end.by === 'distance';
      });
      expect(later).toBe(-1);
    }
    expect(stretched.size).toBe(new Set(runs.filter((t) => t).map((t) => t?.run)).size);
    // Legs 2 and 9 of routePlans.ts: the last cruise by distance of each of its two runs.
    expect([...stretched]).toEqual([2, 9]);
  });

  it('adds, moves and removes waypoints; removing the route keeps the legs flyable', () => {
    // One waypoint added to the fixture's 3.
    const more = addWaypoint(waypoints, 0);
    expect(more).toHaveLength(4);
    expect(new Set(more.map((w) => w.id)).size).toBe(4);
    expect(moveWaypoint(more, 1, 0)[0]).toBe(more[1]);
    const built = buildRouteLegs(plan, { replace: true });
    const bare = withoutRoute(built);
    expect(bare.route).toBeUndefined();
    expect(bare.legs.some((l) => 'toWaypoint' in l && l.toWaypoint)).toBe(false);
    expect(parsePlan(bare).ok).toBe(true);
  });

  it('exports GPX with the time and fuel expected at every waypoint', () => {
    const built = buildRouteLegs(plan, { replace: true });
    const result = solvePlan(built, { samplesPerLeg: 2 });
    const est = waypointEstimates(built, result);
    // One estimate per waypoint of the fixture (3).
    expect(est).toHaveLength(3);
    // The first waypoint is where the mission starts: time 0, the fuel load.
    expect(est?.[0]?.eta_s).toBe(0);
    expect(est?.[0]?.remaining).toBe(result.legs[0]?.start.fuel_kg);
    // The last: the end of the leg the solver says reaches it.
    const last = result.legs.find((l) => l.waypointReached?.index === 2);
    expect(est?.[2]?.remaining).toBe(last?.end.fuel_kg);
    expect(est?.[2]?.eta_s).toBe(last?.end.t_s);
    const gpx = routeGpx(built, result);
    expect(gpx.withEstimates).toBe(true);
    expect(gpx.text).toContain('<lw:eta_s>');
    const back = parseGpx(gpx.text);
    expect(back.ok && back.route.waypoints.map((w) => w.id)).toEqual(['wp1', 'wp2', 'wp3']);
  });
});
