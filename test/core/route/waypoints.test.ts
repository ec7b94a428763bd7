import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/errors.ts';
import { WGS84_A_M, inverseGeodesic } from '../../../core/route/geodesic.ts';
import {
  routeLegs,
  routeLength_m,
  splitLongLegs,
  type Waypoint,
} from '../../../core/route/waypoints.ts';

const DEG = Math.PI / 180;

function wp(id: string, lat_deg: number, lon_deg: number, extra: Partial<Waypoint> = {}): Waypoint {
  return { id, name: id.toUpperCase(), lat_deg, lon_deg, ...extra };
}

function rel(x: number, ref: number): number {
  return Math.abs(x / ref - 1);
}

describe('routeLegs', () => {
  it('along the equator: course 090, length a·Δλ (WGS-84 definition, a exact)', () => {
    const legs = routeLegs([wp('a', 0, 10), wp('b', 0, 12), wp('c', 0, 13)]);
    expect(legs).toHaveLength(2);
    expect(rel(legs[0]!.distance_m, WGS84_A_M * 2 * DEG)).toBeLessThan(1e-12);
    expect(rel(legs[1]!.distance_m, WGS84_A_M * 1 * DEG)).toBeLessThan(1e-12);
    expect(legs[0]!.course_deg).toBeCloseTo(90, 9);
    expect(legs[0]!.finalCourse_deg).toBeCloseTo(90, 9);
    expect(legs[0]!.from.id).toBe('a');
    expect(legs[1]!.to.id).toBe('c');
  });

  it('along a meridian: courses 000 and 180 (geometry of the ellipsoid)', () => {
    const legs = routeLegs([wp('a', 40, 5), wp('b', 41, 5), wp('c', 39, 5)]);
    expect(legs[0]!.course_deg).toBeCloseTo(0, 9);
    expect(legs[1]!.course_deg).toBeCloseTo(180, 9);
  });

  it('magnetic course = true − variation, east positive ("east is least, west is best", common practice)', () => {
    const route = [wp('a', 0, 0), wp('b', 0, 1)]; // true course 090
    expect(routeLegs(route, { magneticVariation_deg: 10 })[0]!.magneticCourse_deg).toBeCloseTo(
      80,
      9,
    );
    expect(routeLegs(route, { magneticVariation_deg: -5 })[0]!.magneticCourse_deg).toBeCloseTo(
      95,
      9,
    );
    expect(routeLegs(route)[0]!.magneticCourse_deg).toBeCloseTo(90, 9); // no variation given
    // across north: true 000 with 10°E gives 350 (arithmetic mod 360)
    const north = [wp('a', 0, 0), wp('b', 1, 0)];
    expect(routeLegs(north, { magneticVariation_deg: 10 })[0]!.magneticCourse_deg).toBeCloseTo(
      350,
      9,
    );
    // a waypoint's own variation beats the route-wide one for the legs leaving it
    const own = [wp('a', 0, 0, { magneticVariation_deg: -20 }), wp('b', 0, 1), wp('c', 0, 2)];
    const legs = routeLegs(own, { magneticVariation_deg: 10 });
    expect(legs[0]!.magneticCourse_deg).toBeCloseTo(110, 9);
    expect(legs[1]!.magneticCourse_deg).toBeCloseTo(80, 9);
  });

  it('a long leg changes course along the geodesic (initial differs from final, geometry)', () => {
    // 45°N, 0° to 45°N, 90°E: the geodesic bulges poleward, leaving NE and arriving SE.
    const [leg] = routeLegs([wp('a', 45, 0), wp('b', 45, 90)]);
    expect(leg!.course_deg).toBeLessThan(90);
    expect(leg!.finalCourse_deg).toBeGreaterThan(90);
    // symmetric about the mid meridian: initial + final = 180 (geometry of the ellipsoid)
    expect(leg!.course_deg + leg!.finalCourse_deg).toBeCloseTo(180, 9);
  });

  it('refuses bad routes with the field named (InputError)', () => {
    const ok = [wp('a', 0, 0), wp('b', 0, 1), wp('c', 0, 2), wp('d', 0, 3)];
    const badLat = ok.map((w, i) => (i === 3 ? { ...w, lat_deg: 91 } : w));
    expect(() => routeLegs(badLat)).toThrow(
      /route\.waypoints\.3\.lat_deg: 91 .*between -90 and 90/,
    );
    expect(() => routeLegs([wp('a', 0, 0)])).toThrow(/route\.waypoints: .*between 2 and 5000/);
    expect(() => routeLegs([wp('a', 0, 0), wp('a', 0, 1)])).toThrow(/route\.waypoints\.1\.id/);
    expect(() => routeLegs([wp('a', 0, 0), wp('b', 0, 0)])).toThrow(/at least 1 m/);
    expect(() => routeLegs(ok, { magneticVariation_deg: 200 })).toThrow(InputError);
    expect(() => routeLegs([wp('a', 0, 0, { altitude_m: NaN }), wp('b', 0, 1)])).toThrow(
      /route\.waypoints\.0\.altitude_m/,
    );
    expect(() => routeLegs(badLat, { field: 'plan.route.waypoints' })).toThrow(
      /plan\.route\.waypoints\.3\.lat_deg/,
    );
  });
});

describe('splitLongLegs', () => {
  it('keeps every piece within the limit and the total length (points lie on the geodesic)', () => {
    const route = [
      wp('a', 45, 0, { altitude_m: 1000 }),
      wp('b', 45, 90, { altitude_m: 3000 }),
      wp('c', 30, 100),
    ];
    const split = splitLongLegs(route, 500_000);
    const legs = routeLegs(split);
    for (const leg of legs) expect(leg.distance_m).toBeLessThanOrEqual(500_000 * (1 + 1e-9));
    // sum of the pieces of a geodesic is its length (geodesic additivity), to 1e-9 relative
    expect(rel(routeLength_m(split), routeLength_m(route))).toBeLessThan(1e-9);
    expect(split[0]).toBe(route[0]);
    expect(split[split.length - 1]).toBe(route[2]);
    expect(new Set(split.map((w) => w.id)).size).toBe(split.length); // ids stay unique
    // altitude interpolated linearly along the first leg (both ends carry one)
    const firstPieces = legs.findIndex((l) => l.to.id === 'b') + 1;
    expect(split[1]!.altitude_m).toBeCloseTo(1000 + 2000 / firstPieces, 9);
    // where the far end has none the start's holds
    const afterB = split[firstPieces + 1]!;
    expect(afterB.altitude_m).toBe(3000);
  });

  it('the course along the split geodesic turns gradually (each piece continues the last, property)', () => {
    const point = fc.record({
      lat_deg: fc.double({ min: -70, max: 70, noNaN: true }),
      lon_deg: fc.double({ min: -180, max: 180, noNaN: true }),
    });
    fc.assert(
      fc.property(point, point, (a, b) => {
        const d = inverseGeodesic(a, b).distance_m;
        fc.pre(d > 200_000 && d < 15_000_000);
        const split = splitLongLegs(
          [wp('a', a.lat_deg, a.lon_deg), wp('b', b.lat_deg, b.lon_deg)],
          d / 7,
        );
        const legs = routeLegs(split);
        expect(legs).toHaveLength(7);
        for (let i = 1; i < legs.length; i++) {
          // arriving course of one piece = leaving course of the next (same geodesic)
          const diff = Math.abs(legs[i]!.course_deg - legs[i - 1]!.finalCourse_deg) % 360;
          expect(Math.min(diff, 360 - diff)).toBeLessThan(1e-6);
          expect(rel(legs[i]!.distance_m, d / 7)).toBeLessThan(1e-9);
        }
      }),
      { numRuns: 300 },
    );
  });

  it('refuses a limit that is too short or would make too many points (InputError)', () => {
    const route = [wp('a', 0, 0), wp('b', 0, 90)];
    expect(() => splitLongLegs(route, 10)).toThrow(/maxLength_m/);
    expect(() => splitLongLegs(route, 1000)).toThrow(/within 5000 waypoints/);
  });
});
