/**
 * A recorded track turned into a route: repeated points (a stationary receiver) dropped and
 * a long track thinned to n points evenly spaced along its length, both ends kept. Spacing
 * uses the haversine distance (geodesic.ts), accurate to well under 1 % over track steps.
 */
import { sphericalDistance_m } from './geodesic.ts';
import type { Waypoint } from './waypoints.ts';

/** Track points closer than this along the track are repeats. */
export const TRACK_MIN_SPACING_M = 2;

/** The kept points, or undefined when the track has no length. */
export function thinTrack(points: readonly Waypoint[], n: number): Waypoint[] | undefined {
  const cum = [0];
  for (let i = 1; i < points.length; i++) {
    const step = sphericalDistance_m(points[i - 1] as Waypoint, points[i] as Waypoint);
    cum.push((cum[i - 1] as number) + step);
  }
  const last = points.length - 1;
  const total = cum[last] as number;
  if (!(total >= 2 * TRACK_MIN_SPACING_M)) return undefined;
  const thin = points.length > n;
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
  return keep.map((i) => points[i] as Waypoint);
}
