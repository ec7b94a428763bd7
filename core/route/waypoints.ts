/**
 * A route as an ordered list of waypoints, and its legs: WGS-84 geodesic distance, true
 * course and magnetic course per consecutive pair (geodesics after Karney 2013, see
 * geodesic.ts).
 *
 * Magnetic course = true course − variation, variation east positive ("east is least,
 * west is best", common practice of air navigation). A waypoint's own variation applies
 * to the legs leaving it; otherwise the route-wide value does.
 *
 * A geodesic's course changes along a long leg (by up to tens of degrees on a leg of a
 * few thousand km away from the equator). The solver flies each leg on its initial course;
 * where that matters, `splitLongLegs` inserts points along the geodesic first.
 */
import { InputError, requireFinite } from '../errors.ts';
import { checkLatLon, directGeodesic, inverseGeodesic, normalizeCourse } from './geodesic.ts';

export interface Waypoint {
  id: string;
  name: string;
  lat_deg: number;
  lon_deg: number;
  /** Altitude (GPX `ele`), m above mean sea level. */
  altitude_m?: number;
  /** Magnetic variation at the waypoint, degrees, east positive. */
  magneticVariation_deg?: number;
}

export interface RouteLeg {
  from: Waypoint;
  to: Waypoint;
  distance_m: number;
  /** True initial course, degrees in [0, 360). */
  course_deg: number;
  /** Initial course relative to magnetic north, degrees in [0, 360). */
  magneticCourse_deg: number;
  /** True course on arrival at `to`, degrees in [0, 360). */
  finalCourse_deg: number;
}

export interface RouteOptions {
  /** Route-wide magnetic variation, degrees, east positive (0 when absent). */
  magneticVariation_deg?: number;
  /** Path of the waypoint list in error messages. */
  field?: string;
}

/** Consecutive waypoints closer than this have no defined course. */
export const MIN_LEG_LENGTH_M = 1;
export const MAX_WAYPOINTS = 5000;

export function checkWaypoint(w: Waypoint, field: string): void {
  if (typeof w.id !== 'string' || w.id.length === 0) {
    throw new InputError(`${field}.id`, w.id, 'a non-empty string');
  }
  checkLatLon(w, field);
  if (w.altitude_m !== undefined) {
    requireFinite(`${field}.altitude_m`, w.altitude_m, -1000, 30000, 'm');
  }
  if (w.magneticVariation_deg !== undefined) {
    requireFinite(`${field}.magneticVariation_deg`, w.magneticVariation_deg, -180, 180, 'deg');
  }
}

function checkRoute(waypoints: readonly Waypoint[], field: string): void {
  if (waypoints.length < 2 || waypoints.length > MAX_WAYPOINTS) {
    throw new InputError(
      field,
      `${waypoints.length} waypoints`,
      `between 2 and ${MAX_WAYPOINTS} waypoints`,
    );
  }
  const seen = new Set<string>();
  waypoints.forEach((w, i) => {
    checkWaypoint(w, `${field}.${i}`);
    if (seen.has(w.id)) throw new InputError(`${field}.${i}.id`, w.id, 'unique in the route');
    seen.add(w.id);
  });
}

/** One leg per consecutive pair of waypoints. */
export function routeLegs(waypoints: readonly Waypoint[], opts: RouteOptions = {}): RouteLeg[] {
  const field = opts.field ?? 'route.waypoints';
  checkRoute(waypoints, field);
  const routeVariation = opts.magneticVariation_deg ?? 0;
  requireFinite('route.magneticVariation_deg', routeVariation, -180, 180, 'deg');
  const legs: RouteLeg[] = [];
  for (let i = 1; i < waypoints.length; i++) {
    const from = waypoints[i - 1] as Waypoint;
    const to = waypoints[i] as Waypoint;
    const g = inverseGeodesic(from, to, { a: `${field}.${i - 1}`, b: `${field}.${i}` });
    if (g.distance_m < MIN_LEG_LENGTH_M) {
      throw new InputError(
        `${field}.${i}`,
        to.id,
        `at least ${MIN_LEG_LENGTH_M} m from the waypoint before it (${from.id})`,
      );
    }
    const variation = from.magneticVariation_deg ?? routeVariation;
    legs.push({
      from,
      to,
      distance_m: g.distance_m,
      course_deg: g.initialCourse_deg,
      magneticCourse_deg: normalizeCourse(g.initialCourse_deg - variation),
      finalCourse_deg: g.finalCourse_deg,
    });
  }
  return legs;
}

/** Total geodesic length of the route, m. */
export function routeLength_m(waypoints: readonly Waypoint[], opts: RouteOptions = {}): number {
  return routeLegs(waypoints, opts).reduce((sum, leg) => sum + leg.distance_m, 0);
}

/** Shortest piece `splitLongLegs` accepts, so the output stays small. */
export const MIN_SPLIT_LENGTH_M = 1000;

/**
 * Inserts points along each geodesic so that no leg is longer than `maxLength_m`; the
 * pieces of a leg are equal. Inserted points get ids `${from.id}~k`, altitude and
 * variation interpolated linearly when both ends carry them (else the start's).
 */
export function splitLongLegs(
  waypoints: readonly Waypoint[],
  maxLength_m: number,
  opts: RouteOptions = {},
): Waypoint[] {
  const field = opts.field ?? 'route.waypoints';
  requireFinite('maxLength_m', maxLength_m, MIN_SPLIT_LENGTH_M, Infinity, 'm');
  const legs = routeLegs(waypoints, opts);
  // Pieces per leg; the 1e-9 keeps a leg of exactly k·maxLength (up to rounding) in k pieces.
  const count = (leg: RouteLeg) => Math.max(1, Math.ceil(leg.distance_m / maxLength_m - 1e-9));
  const pieces = legs.reduce((n, leg) => n + count(leg), 0);
  if (pieces + 1 > MAX_WAYPOINTS) {
    throw new InputError(
      'maxLength_m',
      maxLength_m,
      `long enough that the route stays within ${MAX_WAYPOINTS} waypoints (it would need ${pieces + 1})`,
    );
  }
  const ids = new Set(waypoints.map((w) => w.id));
  const out: Waypoint[] = [waypoints[0] as Waypoint];
  legs.forEach((leg, i) => {
    const n = count(leg);
    for (let k = 1; k < n; k++) {
      const f = k / n;
      const p = directGeodesic(leg.from, leg.course_deg, f * leg.distance_m, `${field}.${i}`);
      const inserted: Waypoint = {
        id: uniqueId(`${leg.from.id}~${k}`, ids),
        name: `${leg.from.name} → ${leg.to.name} ${k}/${n}`,
        lat_deg: p.lat_deg,
        lon_deg: p.lon_deg,
      };
      const alt = lerpOptional(leg.from.altitude_m, leg.to.altitude_m, f);
      if (alt !== undefined) inserted.altitude_m = alt;
      const variation = lerpOptional(
        leg.from.magneticVariation_deg,
        leg.to.magneticVariation_deg,
        f,
      );
      if (variation !== undefined) inserted.magneticVariation_deg = variation;
      out.push(inserted);
    }
    out.push(leg.to);
  });
  return out;
}

function lerpOptional(a: number | undefined, b: number | undefined, f: number) {
  if (a === undefined) return undefined;
  return b === undefined ? a : a + (b - a) * f;
}

/** `base`, or `base.2`, `base.3` … — the first not yet in `taken` (which it joins). */
export function uniqueId(base: string, taken: Set<string>): string {
  let id = base;
  for (let n = 2; taken.has(id); n++) id = `${base}.${n}`;
  taken.add(id);
  return id;
}
