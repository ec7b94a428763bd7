/**
 * Missions flown along a plan route (core/solver/routeTrack.ts). Geodesic distances and
 * courses for the checks come from inverseGeodesic (Karney 2013 through geographiclib,
 * core/route/geodesic.ts), computed here independently of the solver's route pass.
 * Waypoints are made-up points over the open South Atlantic.
 */
import { describe, expect, it } from 'vitest';
import { parsePlanText } from '../../../core/plan/load.ts';
import type { Leg, Plan } from '../../../core/plan/schema.ts';
import { inverseGeodesic } from '../../../core/route/geodesic.ts';
import { routeProgress } from '../../../core/solver/routeProgress.ts';
import { solvePlan } from '../../../core/solver/solve.ts';
import {
  climb,
  cruise,
  descent,
  landing,
  loiter,
  makePlan,
  rel,
  takeoff,
  type PlanOptions,
} from './fixtures.ts';
import { demoText } from '../plan/demoPlans.ts';

const WAYPOINTS = [
  { id: 'p0', name: 'Start buoy', lat_deg: -30.0, lon_deg: -20.0 },
  { id: 'p1', name: 'North-east mark', lat_deg: -29.6, lon_deg: -19.4 },
  { id: 'p2', name: 'North mark', lat_deg: -29.1, lon_deg: -19.5 },
  { id: 'p3', name: 'Turn mark', lat_deg: -28.8, lon_deg: -20.2 },
];
const ROUTE: Plan['route'] = { waypoints: WAYPOINTS, magneticVariation_deg: -12 };
const WIND = { speed_m_s: 8, from_deg: 250 };

/** Independent geodesic between two waypoints of the route (Karney 2013, geographiclib). */
function geodesic(a: string, b: string) {
  const p = WAYPOINTS.find((w) => w.id === a)!;
  const q = WAYPOINTS.find((w) => w.id === b)!;
  return inverseGeodesic(p, q);
}

function routePlan(legs: Leg[], o: PlanOptions = {}): Plan {
  return makePlan('propeller', legs, { route: ROUTE, ...o });
}

/** Take-off, climb toward p1, cruise to p1 and p2, climb and cruise toward p3, descend into p3. */
function fullRoute(): Plan {
  return routePlan([
    takeoff({ by: 'fuel', fuel_kg: 1 }),
    climb({ toAltitude_m: 1500, toWaypoint: 'p1', wind: WIND }),
    cruise({ toWaypoint: 'p1', wind: WIND }),
    cruise({ toWaypoint: 'p2', wind: WIND, speed: { kind: 'tas', speed_m_s: 60 } }),
    climb({ toAltitude_m: 2500, toWaypoint: 'p3', wind: WIND }),
    cruise({ toWaypoint: 'p3', wind: WIND }),
    descent({ toWaypoint: 'p3', wind: WIND, toAltitude_m: 0 }),
    landing({ by: 'fuel', fuel_kg: 0.5 }),
  ]);
}

describe('legs flying a route', () => {
  it('the ground track between waypoints is the geodesic: legs sum to the route length', () => {
    const plan = fullRoute();
    const r = solvePlan(plan);
    expect(r.completed).toBe(true);
    const legs = ['p0', 'p1', 'p2', 'p3'].slice(1).map((b, i) => geodesic(`p${i}`, b));
    const length = legs.reduce((s, g) => s + g.distance_m, 0);
    const flown = r.legs.reduce((s, l) => s + l.groundDistance_m, 0);
    // inverseGeodesic (Karney 2013 via geographiclib), independent of the solver's route pass
    expect(rel(flown, length)).toBeLessThan(1e-6);
    expect(rel(r.totals.groundDistance_m, length)).toBeLessThan(1e-6);
    // per waypoint: the ground distance at arrival is the running sum of the geodesics
    const progress = routeProgress(plan, r);
    let sum = 0;
    legs.forEach((g, i) => {
      sum += g.distance_m;
      expect(rel(progress[i + 1]!.x_m!, sum)).toBeLessThan(1e-6); // Karney 2013, as above
    });
    // the first cruise flies what the climb toward p1 leaves of the geodesic
    const toP1 = r.legs[1]!.groundDistance_m + r.legs[2]!.groundDistance_m;
    expect(rel(toP1, legs[0]!.distance_m)).toBeLessThan(1e-9); // Karney 2013, as above
  });

  it('each leg takes the initial course of its geodesic', () => {
    const r = solvePlan(fullRoute());
    const expected: [number, string, string][] = [
      [1, 'p0', 'p1'],
      [2, 'p0', 'p1'],
      [3, 'p1', 'p2'],
      [4, 'p2', 'p3'],
      [5, 'p2', 'p3'],
      [6, 'p2', 'p3'],
    ];
    for (const [i, a, b] of expected) {
      const course = geodesic(a, b).initialCourse_deg;
      // inverseGeodesic initial azimuth (Karney 2013 via geographiclib)
      expect(rel(r.legs[i]!.course_deg!, course)).toBeLessThan(1e-12);
      expect(r.legs[i]!.toWaypoint).toBe(b);
    }
    expect(r.legs[0]!.course_deg).toBeUndefined(); // take-off: no course
  });

  it('flies the same mission as the legs with those courses and distances typed in', () => {
    const plan = fullRoute();
    const r = solvePlan(plan);
    // The same legs without a route, course and distance copied from the result.
    const manual = makePlan(
      'propeller',
      plan.legs.map((leg, i) => {
        const { toWaypoint: _t, ...rest } = leg as Leg & { toWaypoint?: string };
        const out = { ...rest } as Leg;
        if ('course_deg' in out) out.course_deg = r.legs[i]!.course_deg!;
        if (out.kind === 'cruise') {
          out.end = { by: 'distance', distance_m: r.legs[i]!.groundDistance_m };
        }
        return out;
      }),
    );
    const m = solvePlan(manual);
    // same solver, same inputs: agreement to the integrator's tolerance (1e-9, model.ts)
    expect(rel(m.totals.fuelUsed_kg, r.totals.fuelUsed_kg)).toBeLessThan(1e-9);
    expect(rel(m.totals.time_s, r.totals.time_s)).toBeLessThan(1e-9);
  });

  it('the waypoint is reached after the descent into it; its ETA and fuel are that state', () => {
    const plan = fullRoute();
    const r = solvePlan(plan);
    expect(r.legs[2]!.waypointReached).toMatchObject({ id: 'p1', index: 1 });
    expect(r.legs[3]!.waypointReached).toMatchObject({ id: 'p2', index: 2 });
    expect(r.legs[5]!.waypointReached).toBeUndefined();
    expect(r.legs[6]!.waypointReached).toMatchObject({ id: 'p3', name: 'Turn mark', index: 3 });
    const p = routeProgress(plan, r);
    expect(p.map((w) => w.id)).toEqual(['p0', 'p1', 'p2', 'p3']);
    // first waypoint: airborne over it after the take-off allowance (routeProgress.ts)
    expect(p[0]).toMatchObject({ reached: true, legIndex: 1, remainingUnit: 'kg' });
    expect(p[0]!.eta_s).toBe(r.legs[1]!.start.t_s);
    expect(p[0]!.remaining).toBe(r.legs[1]!.start.fuel_kg);
    expect(p[3]!.eta_s).toBe(r.legs[6]!.end.t_s);
    expect(p[3]!.remaining).toBe(r.legs[6]!.end.fuel_kg);
  });

  it('a climb after the cruise in the same run is flown on the geodesic too (trial flights)', () => {
    // The climb's ground distance depends on the mass the cruise leaves: the cruise is
    // shortened by it, found by repeated trial flights.
    const plan = routePlan([
      climb({ toAltitude_m: 1000, toWaypoint: 'p1', wind: WIND }),
      cruise({ toWaypoint: 'p1', wind: WIND }),
      climb({ toAltitude_m: 3000, toWaypoint: 'p1', wind: WIND }),
    ]);
    const r = solvePlan(plan);
    expect(r.completed).toBe(true);
    expect(r.legs[2]!.waypointReached?.id).toBe('p1');
    // inverseGeodesic (Karney 2013 via geographiclib)
    expect(rel(r.totals.groundDistance_m, geodesic('p0', 'p1').distance_m)).toBeLessThan(1e-9);
  });

  it('a loiter naming a waypoint takes the course only and, an orbit, covers no ground', () => {
    const plan = routePlan([
      cruise({ toWaypoint: 'p1', wind: WIND }),
      loiter({ toWaypoint: 'p1', wind: WIND, end: { by: 'time', time_s: 900 } }),
      cruise({ toWaypoint: 'p2', wind: WIND }),
    ]);
    const r = solvePlan(plan);
    expect(r.completed).toBe(true);
    expect(r.legs[1]!.time_s).toBeCloseTo(900, 6);
    expect(r.legs[1]!.course_deg).toBe(r.legs[0]!.course_deg);
    // an orbit over the point: no ground covered, air distance = TAS × time (definition)
    expect(r.legs[1]!.groundDistance_m).toBe(0);
    expect(rel(r.legs[1]!.airDistance_m, r.legs[1]!.meanTas_m_s * 900)).toBeLessThan(1e-9);
    // the cruise to p2 flies the whole geodesic p1→p2 (Karney 2013 via geographiclib)
    expect(rel(r.legs[2]!.groundDistance_m, geodesic('p1', 'p2').distance_m)).toBeLessThan(1e-9);
  });

  it('a loiter until the reserve between route legs still leaves the track on the geodesics', () => {
    const plan = routePlan(
      [
        climb({ toAltitude_m: 1000, toWaypoint: 'p1', wind: WIND }),
        cruise({ toWaypoint: 'p1', wind: WIND }),
        loiter({ wind: WIND, end: { by: 'reserve' } }),
        cruise({ toWaypoint: 'p2', wind: WIND }),
        descent({ toWaypoint: 'p2', wind: WIND }),
      ],
      { reserves: { holdTime_s: 1800, holdAltitude_m: 500 } },
    );
    const r = solvePlan(plan);
    expect(r.completed).toBe(true);
    // the loiter's search flies the route legs after it in every trial: reserve met exactly
    expect(r.reserve.kept).toBe(true);
    expect(Math.abs(r.reserve.margin)).toBeLessThan(1e-6);
    const route = r.totals.groundDistance_m - r.legs[2]!.groundDistance_m;
    const length = geodesic('p0', 'p1').distance_m + geodesic('p1', 'p2').distance_m;
    expect(rel(route, length)).toBeLessThan(1e-9); // Karney 2013 via geographiclib
  });

  it('fails the cruise with a clear message when the climb already covers the route leg', () => {
    // Two marks about 5.6 km apart; a climb to 3000 m covers more ground than that.
    const near = [WAYPOINTS[0]!, { id: 'p1', name: 'Near mark', lat_deg: -29.95, lon_deg: -20.0 }];
    const plan = routePlan(
      [climb({ toAltitude_m: 3000, toWaypoint: 'p1' }), cruise({ toWaypoint: 'p1' })],
      { route: { waypoints: near, magneticVariation_deg: 0 } },
    );
    const r = solvePlan(plan);
    expect(r.legs[0]!.status).toBe('flown');
    // inverseGeodesic (Karney 2013 via geographiclib)
    expect(r.legs[0]!.groundDistance_m).toBeGreaterThan(
      inverseGeodesic(near[0]!, near[1]!).distance_m,
    );
    expect(r.failure?.legIndex).toBe(1);
    expect(r.legs[1]!.error).toMatch(/nothing is left for this cruise \(legs\.1\.toWaypoint\)/);
    expect(r.legs[1]!.error).toMatch(/from waypoint "p0" to "p1"/);
  });

  it('an unknown waypoint fails that leg and names legs.i.toWaypoint', () => {
    const plan = routePlan([cruise({ toWaypoint: 'p1' }), cruise({ toWaypoint: 'nowhere' })]);
    const r = solvePlan(plan);
    expect(r.legs[0]!.status).toBe('flown');
    expect(r.legs[1]!.status).toBe('failed');
    expect(r.failure).toMatchObject({ legIndex: 1 });
    expect(r.failure?.message).toMatch(/legs\.1\.toWaypoint: "nowhere"/);
    const p = routeProgress(plan, r);
    expect(p.map((w) => w.reached)).toEqual([true, true, false, false]);
    expect(p[2]).toMatchObject({ eta_s: null, remaining: null, legIndex: null });
  });

  it('warns when no cruise ending by distance flies to a waypoint', () => {
    const plan = routePlan([
      climb({ toAltitude_m: 1000, toWaypoint: 'p1' }),
      loiter({ toWaypoint: 'p1' }),
    ]);
    const r = solvePlan(plan);
    expect(r.completed).toBe(true);
    expect(r.warnings.some((w) => /no cruise leg that ends by distance.*"p1"/.test(w))).toBe(true);
    expect(r.legs[1]!.waypointReached?.id).toBe('p1');
  });

  it('leaves plans without a route as they were (no route fields in the result)', () => {
    const plan = makePlan('propeller', [cruise({ toWaypoint: 'p1' })]);
    const r = solvePlan(plan);
    expect(r.completed).toBe(true);
    expect(r.legs[0]!.groundDistance_m).toBeCloseTo(100_000, 3); // the leg's own distance
    expect(r.legs[0]!.course_deg).toBeUndefined();
    expect(routeProgress(plan, r)).toEqual([]);
  });
});

describe('examples/route-survey.json', () => {
  it('solves OK and flies the route geodesic length, every waypoint reached', () => {
    const loaded = parsePlanText(demoText('route-survey.json'));
    if (!loaded.ok) throw new Error(JSON.stringify(loaded.issues));
    const plan = loaded.plan;
    const r = solvePlan(plan);
    expect(r.completed).toBe(true);
    expect(r.verdict).toBe('ok');
    const w = plan.route!.waypoints;
    let length = 0;
    for (let i = 1; i < w.length; i++) length += inverseGeodesic(w[i - 1]!, w[i]!).distance_m;
    // inverseGeodesic (Karney 2013 via geographiclib), independent of the solver
    expect(rel(r.totals.groundDistance_m, length)).toBeLessThan(1e-6);
    expect(routeProgress(plan, r).every((p) => p.reached)).toBe(true);
  });
});
