/**
 * A recorded track turned into a route: repeated points (a stationary receiver) dropped and
 * a long track thinned to n points evenly spaced along its length, both ends kept. Spacing
 * uses the haversine distance (geodesic.ts), accurate to well under 1 % over track steps.
 * Works on coordinate arrays (one pass, O(n)), so a logger file of 200 000 points never
 * becomes 200 000 waypoint objects.
 */
import { haversine_m, sphericalDistance_m } from './geodesic.ts';
import type { Waypoint } from './waypoints.ts';

/** Track points closer than this along the track are repeats. */
export const TRACK_MIN_SPACING_M = 2;

/**
 * Indices of the kept points among the first `count` of lat/lon (degrees, already checked
 * to be in range), or undefined when the track has no length.
 */
export function thinTrackIndices(
  lat: ArrayLike<number>,
  lon: ArrayLike<number>,
  count: number,
  n: number,
): number[] | undefined {
  const cum = new Float64Array(Math.max(1, count));
  for (let i = 1; i < count; i++) {
    const step = haversine_m(
      lat[i - 1] as number,
      lon[i - 1] as number,
      lat[i] as number,
      lon[i] as number,
    );
    cum[i] = (cum[i - 1] as number) + step;
  }
  const last = count - 1;
  const total = cum[last] as number;
  if (!(count >= 2 && total >= 2 * TRACK_MIN_SPACING_M)) return undefined;
  const thin = count > n;
  const step = total / (n - 1);
  const keep = [0];
  let next = step;
  for (let i = 1; i < last; i++) {
    const at = cum[i] as number;
    const spaced = at - (cum[keep[keep.length - 1] as number] as number) >= TRACK_MIN_SPACING_M;
    if (spaced && (!thin || at >= next)) {
      keep.push(i);
      next = (Math.floor(at / step) + 1) * step;
    }
  }
  // The end replaces a kept point too close to it, so no leg is shorter than the spacing.
  if (total - (cum[keep[keep.length - 1] as number] as number) < TRACK_MIN_SPACING_M) keep.pop();
  keep.push(last);
  return keep;
}

/** The kept points, or undefined when the track has no length (coordinates checked). */
export function thinTrack(points: readonly Waypoint[], n: number): Waypoint[] | undefined {
  for (let i = 1; i < points.length; i++) {
    sphericalDistance_m(points[i - 1] as Waypoint, points[i] as Waypoint);
  }
  const keep = thinTrackIndices(
    points.map((p) => p.lat_deg),
    points.map((p) => p.lon_deg),
    points.length,
    n,
  );
  return keep?.map((i) => points[i] as Waypoint);
}
