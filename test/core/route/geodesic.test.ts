import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/errors.ts';
import {
  WGS84_A_M,
  directGeodesic,
  inverseGeodesic,
  sphericalDistance_m,
} from '../../../core/route/geodesic.ts';
import { vincentyInverse } from './vincenty.ts';

function rel(x: number, ref: number): number {
  return Math.abs(x / ref - 1);
}

/** Smallest difference of two angles in degrees, across the 360/0 wrap. */
function angleDiff(a: number, b: number): number {
  const d = Math.abs(a - b) % 360;
  return Math.min(d, 360 - d);
}

describe('inverseGeodesic and directGeodesic, published values', () => {
  it("reproduces the examples in the package README (geographiclib-geodesic 2.2.0, README.md 'Examples')", () => {
    // README: Wellington (41.32S, 174.81E) to Salamanca (40.96N, 5.50W) "19959679.267 m"
    const r = inverseGeodesic(
      { lat_deg: -41.32, lon_deg: 174.81 },
      { lat_deg: 40.96, lon_deg: -5.5 },
    );
    expect(Math.abs(r.distance_m - 19959679.267)).toBeLessThan(0.0005); // printed to 1 mm
    // README: 20000 km on azimuth 225 from Perth (32.06S, 115.74E) is "(32.11195529, -63.95925278)"
    const p = directGeodesic({ lat_deg: -32.06, lon_deg: 115.74 }, 225, 20000e3);
    expect(Math.abs(p.lat_deg - 32.11195529)).toBeLessThan(5e-9); // printed to 8 decimals
    expect(Math.abs(p.lon_deg - -63.95925278)).toBeLessThan(5e-9);
  });

  // Karney's published test set GeodTest.dat (doi:10.5281/zenodo.32156), lines as reproduced
  // in the package's test/geodesictest.js: lat1, lon1, azi1, lat2, lon2, azi2, s12.
  // Kept as text with the published digits (more than a double holds).
  const geodTest = [
    '35.60777 -139.44815 111.098748429560326 -11.17491 -69.95921 129.289270889708762 8935244.5604818305',
    '-21.97856 142.59065 -32.44456876433189 41.84138 98.56635 -41.84359951440466 8394328.894657671',
    '-50.56724 -16.30485 -105.439679907590164 -33.56571 -94.97412 -47.348547835650331 6455670.5118668696',
  ].map((line) => line.split(' ').map(Number));

  it.each(geodTest)(
    'matches GeodTest.dat line from (%f, %f) (Karney, published test set)',
    (lat1, lon1, azi1, lat2, lon2, azi2, s12) => {
      const r = inverseGeodesic({ lat_deg: lat1, lon_deg: lon1 }, { lat_deg: lat2, lon_deg: lon2 });
      expect(rel(r.distance_m, s12)).toBeLessThan(1e-12);
      expect(angleDiff(r.initialCourse_deg, azi1)).toBeLessThan(1e-9);
      expect(angleDiff(r.finalCourse_deg, azi2)).toBeLessThan(1e-9);
      const p = directGeodesic({ lat_deg: lat1, lon_deg: lon1 }, azi1, s12);
      expect(Math.abs(p.lat_deg - lat2)).toBeLessThan(1e-9);
      expect(angleDiff(p.lon_deg, lon2)).toBeLessThan(1e-9);
    },
  );

  it('quarter meridian of WGS-84 is 10 001 965.729 m (Karney, "Algorithms for geodesics", 2013)', () => {
    const r = inverseGeodesic({ lat_deg: 0, lon_deg: 0 }, { lat_deg: 90, lon_deg: 0 });
    expect(rel(r.distance_m, 10001965.729)).toBeLessThan(1e-10);
    expect(r.initialCourse_deg).toBeCloseTo(0, 9); // due north along the meridian
  });

  it('equatorial arcs are a·Δλ: quarter 10 018 754.171 m, 1° 111 319.491 m (a exact, WGS-84 definition)', () => {
    const quarter = inverseGeodesic({ lat_deg: 0, lon_deg: 0 }, { lat_deg: 0, lon_deg: 90 });
    expect(rel(quarter.distance_m, (WGS84_A_M * Math.PI) / 2)).toBeLessThan(1e-12);
    expect(rel(quarter.distance_m, 10018754.171)).toBeLessThan(1e-10);
    expect(quarter.initialCourse_deg).toBeCloseTo(90, 9); // due east
    expect(quarter.finalCourse_deg).toBeCloseTo(90, 9);
    const degree = inverseGeodesic({ lat_deg: 0, lon_deg: -0.5 }, { lat_deg: 0, lon_deg: 0.5 });
    expect(rel(degree.distance_m, 111319.491)).toBeLessThan(1e-8);
  });
});

const lat = fc.double({ min: -89, max: 89, noNaN: true });
const lon = fc.double({ min: -180, max: 180, noNaN: true });
const point = fc.record({ lat_deg: lat, lon_deg: lon });

describe('geodesics, properties', () => {
  it('agree with Vincenty 1975 (independent method) to 1 mm and 1e-6 deg away from antipodes', () => {
    fc.assert(
      fc.property(point, point, (a, b) => {
        const g = inverseGeodesic(a, b);
        fc.pre(g.distance_m > 1000 && g.distance_m < 15_000_000);
        const v = vincentyInverse(a.lat_deg, a.lon_deg, b.lat_deg, b.lon_deg);
        expect(Math.abs(g.distance_m - v.s)).toBeLessThan(1e-3);
        expect(angleDiff(g.initialCourse_deg, v.azi1)).toBeLessThan(1e-6);
        expect(angleDiff(g.finalCourse_deg, v.azi2)).toBeLessThan(1e-6);
      }),
      { numRuns: 1000 },
    );
  });

  it('are symmetric: same length both ways, the way back leaves on the arrival course + 180° (geometry)', () => {
    fc.assert(
      fc.property(point, point, (a, b) => {
        const ab = inverseGeodesic(a, b);
        const ba = inverseGeodesic(b, a);
        fc.pre(ab.distance_m > 1 && ab.distance_m < 19_000_000);
        expect(Math.abs(ab.distance_m - ba.distance_m)).toBeLessThan(1e-6);
        expect(angleDiff(ba.initialCourse_deg, ab.finalCourse_deg + 180)).toBeLessThan(1e-6);
      }),
      { numRuns: 1000 },
    );
  });

  it('direct then inverse returns the distance and course (round trip, exact problem pair)', () => {
    const course = fc.double({ min: 0, max: 359.999, noNaN: true });
    const dist = fc.double({ min: 1, max: 18_000_000, noNaN: true });
    fc.assert(
      fc.property(point, course, dist, (a, c, d) => {
        const p = directGeodesic(a, c, d);
        const back = inverseGeodesic(a, p);
        expect(Math.abs(back.distance_m - d)).toBeLessThan(1e-6);
        expect(angleDiff(back.initialCourse_deg, c)).toBeLessThan(1e-6);
        expect(angleDiff(back.finalCourse_deg, p.finalCourse_deg)).toBeLessThan(1e-6);
      }),
      { numRuns: 1000 },
    );
  });

  it('haversine on the mean sphere is within 0.6 % for legs under 1000 km (cross-check)', () => {
    // The sphere of radius R1 = 6 371 008.8 m differs from WGS-84's radii of curvature by up to
    // 0.56 % (meridian at the equator, a·(1 − e²) = 6 335 439 m), computed from the definition.
    const offset = fc.double({ min: -9, max: 9, noNaN: true });
    fc.assert(
      fc.property(point, offset, offset, (a, dLat, dLon) => {
        const lat_deg = Math.max(-90, Math.min(90, a.lat_deg + dLat));
        const lon_deg = ((a.lon_deg + dLon + 540) % 360) - 180;
        const b = { lat_deg, lon_deg };
        const g = inverseGeodesic(a, b).distance_m;
        fc.pre(g > 1000 && g < 1_000_000);
        expect(rel(sphericalDistance_m(a, b), g)).toBeLessThan(0.006);
      }),
      { numRuns: 1000 },
    );
    // A 1° meridian arc at the equator: geodesic 110 574 m vs spherical 111 195 m (0.56 %).
    const e = { lat_deg: 0, lon_deg: 0 };
    const n = { lat_deg: 1, lon_deg: 0 };
    expect(rel(sphericalDistance_m(e, n), inverseGeodesic(e, n).distance_m)).toBeGreaterThan(0.005);
  });
});

describe('input checks', () => {
  it('refuses latitudes and longitudes out of range, naming the field (InputError)', () => {
    const ok = { lat_deg: 0, lon_deg: 0 };
    expect(() =>
      inverseGeodesic(ok, { lat_deg: 90.5, lon_deg: 0 }, { b: 'route.waypoints.3' }),
    ).toThrow(/route\.waypoints\.3\.lat_deg: 90\.5 .*between -90 and 90 deg/);
    expect(() => inverseGeodesic({ lat_deg: 0, lon_deg: -181 }, ok)).toThrow(InputError);
    expect(() => inverseGeodesic({ lat_deg: NaN, lon_deg: 0 }, ok)).toThrow(/from\.lat_deg/);
    expect(() => directGeodesic(ok, 90, -1)).toThrow(/distance_m/);
    expect(() => directGeodesic(ok, Infinity, 1)).toThrow(/course_deg/);
    expect(() => sphericalDistance_m(ok, { lat_deg: 0, lon_deg: 200 })).toThrow(/to\.lon_deg/);
  });
});
