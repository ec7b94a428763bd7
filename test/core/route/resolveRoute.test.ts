import { describe, expect, it } from 'vitest';
import { WGS84_A_M } from '../../../core/route/geodesic.ts';
import { resolveLegRoute, resolveLegTargets } from '../../../core/route/resolveRoute.ts';
import type { Waypoint } from '../../../core/route/waypoints.ts';

const DEG = Math.PI / 180;
const waypoints: Waypoint[] = [
  { id: 'home', name: 'Home', lat_deg: 0, lon_deg: 0 },
  { id: 'east', name: 'East', lat_deg: 0, lon_deg: 1 },
  { id: 'north', name: 'North', lat_deg: 1, lon_deg: 1 },
];

describe('resolveLegTargets', () => {
  it('flies from the last waypoint reached; untargeted legs keep their own course', () => {
    const r = resolveLegTargets({ waypoints, magneticVariation_deg: 2 }, [
      {}, // climb out, no target
      { toWaypoint: 'east' },
      {}, // loiter at east
      { toWaypoint: 'north' },
      { toWaypoint: 'home' },
    ]);
    expect(r[0]).toBeUndefined();
    expect(r[2]).toBeUndefined();
    // along the equator: a·Δλ, course 090 (WGS-84 definition, a exact)
    expect(Math.abs(r[1]!.distance_m / (WGS84_A_M * DEG) - 1)).toBeLessThan(1e-12);
    expect(r[1]!.course_deg).toBeCloseTo(90, 9);
    expect(r[1]!.magneticCourse_deg).toBeCloseTo(88, 9); // 2° E: east is least (common practice)
    expect(r[3]).toMatchObject({ from: { id: 'east' }, to: { id: 'north' } });
    expect(r[3]!.course_deg).toBeCloseTo(0, 9); // along the meridian
    expect(r[4]!.from.id).toBe('north');
    expect(r[4]!.course_deg).toBeGreaterThan(180); // back south-west
    expect(r[4]!.course_deg).toBeLessThan(270);
  });

  it('groups consecutive legs naming the same waypoint into one run on one geodesic', () => {
    const r = resolveLegRoute({ waypoints }, [
      { toWaypoint: 'east' }, // climb toward east
      {}, // an untargeted leg does not break the run
      { toWaypoint: 'east' }, // cruise to east
      { toWaypoint: 'north' },
      { toWaypoint: 'north' },
    ]);
    expect(r.error).toBeNull();
    expect(r.targets[0]).toBe(r.targets[2]);
    expect(r.targets[0]).toMatchObject({ run: 0, waypointIndex: 1, leg: { from: { id: 'home' } } });
    expect(r.targets[3]).toBe(r.targets[4]);
    expect(r.targets[3]).toMatchObject({ run: 1, waypointIndex: 2, leg: { from: { id: 'east' } } });
    const legs = resolveLegTargets({ waypoints }, [{ toWaypoint: 'east' }, { toWaypoint: 'east' }]);
    expect(legs[1]).toBe(legs[0]);
  });

  it('names the leg for an unknown target or a first target where the aircraft starts', () => {
    expect(() => resolveLegTargets({ waypoints }, [{ toWaypoint: 'nowhere' }])).toThrow(
      /legs\.0\.toWaypoint: "nowhere" .*a waypoint of the route/,
    );
    expect(() =>
      resolveLegTargets({ waypoints }, [{}, { toWaypoint: 'home' }, { toWaypoint: 'east' }]),
    ).toThrow(/legs\.1\.toWaypoint: "home" .*already at \(home\)/);
    const partial = resolveLegRoute({ waypoints }, [{ toWaypoint: 'east' }, { toWaypoint: 'x' }]);
    expect(partial.targets).toHaveLength(1); // resolved up to the bad leg
    expect(partial.error?.legIndex).toBe(1);
    expect(partial.error?.error.field).toBe('legs.1.toWaypoint');
    expect(() =>
      resolveLegTargets({ waypoints: [] }, [{ toWaypoint: 'east' }], 'plan.legs'),
    ).toThrow(/plan\.legs\.0\.toWaypoint/);
  });
});
