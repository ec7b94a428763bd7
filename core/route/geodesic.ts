/**
 * Geodesics on the WGS-84 ellipsoid: distance and courses between two points (inverse
 * problem) and the point reached along a course (direct problem).
 *
 * Model: Karney, "Algorithms for geodesics", J. Geodesy 87 (2013) 43–55, through his own
 * JavaScript port (geographiclib-geodesic), accurate to about 15 nm anywhere on the
 * ellipsoid including nearly antipodal points. WGS-84: a = 6 378 137 m,
 * f = 1/298.257223563 (NIMA TR8350.2). The haversine distance on a sphere of the IUGG
 * mean radius R1 = 6 371 008.8 m (Moritz, "Geodetic Reference System 1980") is kept only
 * as a cross-check; it differs from the ellipsoid by up to about 0.6 %.
 */
import geodesic from 'geographiclib-geodesic';
import { InputError, requireFinite } from '../errors.ts';

const WGS84 = geodesic.Geodesic.WGS84;
const DEG = Math.PI / 180;

/** WGS-84 semi-major axis, m (exact by definition). */
export const WGS84_A_M = 6378137;
/** IUGG mean Earth radius R1 = (2a + b)/3, m. */
export const MEAN_EARTH_RADIUS_M = 6371008.8;
/** No shortest path is longer than half the equator, π·a. */
export const MAX_GEODESIC_M = Math.PI * WGS84_A_M;

export interface LatLon {
  readonly lat_deg: number;
  readonly lon_deg: number;
}

export interface InverseResult {
  /** Length of the shortest path on the ellipsoid, m. */
  distance_m: number;
  /** True course at the start, degrees in [0, 360). */
  initialCourse_deg: number;
  /** True course on arrival, degrees in [0, 360). */
  finalCourse_deg: number;
}

export interface DirectResult extends LatLon {
  /** True course on arrival, degrees in [0, 360). */
  finalCourse_deg: number;
}

/** Throws InputError naming `${field}.lat_deg` / `${field}.lon_deg` when out of range. */
export function checkLatLon(p: LatLon, field: string): void {
  requireFinite(`${field}.lat_deg`, p.lat_deg, -90, 90, 'deg');
  requireFinite(`${field}.lon_deg`, p.lon_deg, -180, 180, 'deg');
}

/** Shortest path from a to b; `fields` name the points in error messages. */
export function inverseGeodesic(
  a: LatLon,
  b: LatLon,
  fields: { a?: string; b?: string } = {},
): InverseResult {
  checkLatLon(a, fields.a ?? 'from');
  checkLatLon(b, fields.b ?? 'to');
  const r = WGS84.Inverse(a.lat_deg, a.lon_deg, b.lat_deg, b.lon_deg);
  // The standard output mask always fills s12, azi1 and azi2; the typings mark them optional.
  const { s12, azi1, azi2 } = r;
  if (s12 === undefined || azi1 === undefined || azi2 === undefined) {
    throw new InputError('geodesic', r, 'a solvable inverse problem');
  }
  return {
    distance_m: s12,
    initialCourse_deg: normalizeCourse(azi1),
    finalCourse_deg: normalizeCourse(azi2),
  };
}

/** The point reached from `start` along the geodesic leaving on `course_deg` (true). */
export function directGeodesic(
  start: LatLon,
  course_deg: number,
  distance_m: number,
  field = 'start',
): DirectResult {
  checkLatLon(start, field);
  requireFinite('course_deg', course_deg, -360, 360, 'deg');
  requireFinite('distance_m', distance_m, 0, MAX_GEODESIC_M, 'm');
  const r = WGS84.Direct(start.lat_deg, start.lon_deg, course_deg, distance_m);
  const { lat2, lon2, azi2 } = r;
  if (lat2 === undefined || lon2 === undefined || azi2 === undefined) {
    throw new InputError('geodesic', r, 'a solvable direct problem');
  }
  return { lat_deg: lat2, lon_deg: lon2, finalCourse_deg: normalizeCourse(azi2) };
}

/**
 * Great-circle distance on a sphere of the IUGG mean radius by the haversine formula
 * (Sinnott, "Virtues of the haversine", Sky & Telescope 68 (1984) 159). A cross-check only.
 */
export function sphericalDistance_m(
  a: LatLon,
  b: LatLon,
  fields: { a?: string; b?: string } = {},
): number {
  checkLatLon(a, fields.a ?? 'from');
  checkLatLon(b, fields.b ?? 'to');
  return haversine_m(a.lat_deg, a.lon_deg, b.lat_deg, b.lon_deg);
}

/** The haversine kernel for coordinates already checked (track thinning's inner loop). */
export function haversine_m(lat1: number, lon1: number, lat2: number, lon2: number): number {
  const dLat = (lat2 - lat1) * DEG;
  const dLon = (lon2 - lon1) * DEG;
  const h =
    Math.sin(dLat / 2) ** 2 + Math.cos(lat1 * DEG) * Math.cos(lat2 * DEG) * Math.sin(dLon / 2) ** 2;
  return 2 * MEAN_EARTH_RADIUS_M * Math.asin(Math.min(1, Math.sqrt(h)));
}

/** Course in [0, 360); the library gives azimuths in [−180, 180]. */
export function normalizeCourse(deg: number): number {
  const r = ((deg % 360) + 360) % 360;
  // `+ 0` turns −0 into 0; rounding can carry a tiny negative angle up to 360 itself.
  return r >= 360 ? 0 : r + 0;
}
