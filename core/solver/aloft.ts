/**
 * The winds-aloft table as the integrator's right-hand side reads it: the same interpolation
 * as core/weather/windsAloft.ts `windAt` (linear in pressure altitude on the wind's east and
 * north components and on the ISA offset; the nearest level outside the table), written
 * without validation or allocation because it runs at every new altitude of a climb or
 * descent. test/core/solver/aloft.test.ts checks it against `windAt`.
 *
 * Against a true course χ, with the air moving (east e, north n): headwind = −(e·sin χ +
 * n·cos χ), crosswind from the right = −(e·cos χ − n·sin χ) — the components of the wind
 * triangle (wind.ts) for a wind from atan2(−e, −n) (meteorological convention).
 */
import type { WindProfile } from '../weather/windsAloft.ts';

const DEG = Math.PI / 180;

/** Linear between the bracketing levels; the end value outside. `xs` sorted, non-empty. */
export function lerpLevels(xs: readonly number[], ys: readonly number[], x: number): number {
  const n = xs.length;
  if (n === 0) return 0;
  if (x <= (xs[0] as number)) return ys[0] as number;
  if (x >= (xs[n - 1] as number)) return ys[n - 1] as number;
  let i = 1;
  while ((xs[i] as number) < x) i++;
  const x0 = xs[i - 1] as number;
  const x1 = xs[i] as number;
  const y0 = ys[i - 1] as number;
  const y1 = ys[i] as number;
  return y0 + ((y1 - y0) * (x - x0)) / (x1 - x0);
}

/** The table's ISA offset at pressure altitude Hp, or `fallback_K` when no level gives one. */
export function aloftIsaOffset(profile: WindProfile, Hp_m: number, fallback_K: number): number {
  return profile.isaAltitude_m.length > 0
    ? lerpLevels(profile.isaAltitude_m, profile.isaOffset_K, Hp_m)
    : fallback_K;
}

/** Writes the table's wind at Hp (east and north motion of the air, m/s) into `out`. */
export function aloftWind(
  profile: WindProfile,
  Hp_m: number,
  out: { windEast_m_s: number; windNorth_m_s: number },
): void {
  out.windEast_m_s = lerpLevels(profile.altitude_m, profile.east_m_s, Hp_m);
  out.windNorth_m_s = lerpLevels(profile.altitude_m, profile.north_m_s, Hp_m);
}

/** sin and cos of a true course, computed once per leg. */
export function courseTrig(course_deg: number): { sinCourse: number; cosCourse: number } {
  return { sinCourse: Math.sin(course_deg * DEG), cosCourse: Math.cos(course_deg * DEG) };
}

/** + headwind, − tailwind, m/s. */
export function headwindOf(east: number, north: number, sinCourse: number, cosCourse: number) {
  return -(east * sinCourse + north * cosCourse);
}

/** + from the right of the course, m/s. */
export function crosswindOf(east: number, north: number, sinCourse: number, cosCourse: number) {
  return -(east * cosCourse - north * sinCourse);
}
