/**
 * Winds and temperatures aloft: a table of levels (altitude, direction the wind blows FROM,
 * speed, optional ISA offset) and the wind at any altitude between them.
 *
 * Interpolation is linear in altitude on the wind VECTOR (east and north components of the
 * air's motion), never on the direction angle: across a veering layer the vector mean is
 * what the air does, and it needs no rule for the 360/0 wrap. "From θ" means the air moves
 * toward θ + 180°, so east = −V·sin θ and north = −V·cos θ (meteorological convention,
 * WMO Manual on Codes No. 306, common practice). The ISA offset is interpolated linearly.
 * Outside the table the nearest level holds (constant extrapolation), flagged in the result.
 */
import { MAX_ISA_OFFSET_K, MIN_ISA_OFFSET_K } from '../atmosphere.ts';
import { InputError, requireFinite } from '../errors.ts';

const DEG = Math.PI / 180;

export interface WindLevel {
  /** Pressure altitude of the level, m. */
  altitude_m: number;
  /** Direction the wind blows from, degrees true. */
  from_deg: number;
  speed_m_s: number;
  /** Temperature offset from ISA at this level, K. */
  isaOffset_K?: number;
}

export interface WindAtAltitude {
  from_deg: number;
  speed_m_s: number;
  /** East component of the air's motion, m/s. */
  east_m_s: number;
  /** North component of the air's motion, m/s. */
  north_m_s: number;
  /** Undefined when no level gives one (the plan's own offset then applies). */
  isaOffset_K: number | undefined;
  /** True when the altitude lies outside the table and the nearest level was used. */
  extrapolated: boolean;
}

/** A validated table, sorted by altitude, ready for repeated look-ups. */
export interface WindProfile {
  readonly altitude_m: readonly number[];
  readonly east_m_s: readonly number[];
  readonly north_m_s: readonly number[];
  /** Altitudes and offsets of the levels that carry an ISA offset. */
  readonly isaAltitude_m: readonly number[];
  readonly isaOffset_K: readonly number[];
}

export const WIND_ALTITUDE_MIN_M = -1000;
export const WIND_ALTITUDE_MAX_M = 30000;
/** Above the strongest jet-stream cores observed (about 110 m/s), with room to spare. */
export const WIND_SPEED_MAX_M_S = 150;
export const MAX_WIND_LEVELS = 100;
/** Below this a wind is calm and its direction is reported as 0 (common practice). */
const CALM_M_S = 1e-9;

export function checkWindLevel(level: WindLevel, field: string): void {
  const { altitude_m, from_deg, speed_m_s, isaOffset_K } = level;
  requireFinite(`${field}.altitude_m`, altitude_m, WIND_ALTITUDE_MIN_M, WIND_ALTITUDE_MAX_M, 'm');
  requireFinite(`${field}.from_deg`, from_deg, 0, 360, 'deg');
  requireFinite(`${field}.speed_m_s`, speed_m_s, 0, WIND_SPEED_MAX_M_S, 'm/s');
  if (isaOffset_K !== undefined) {
    requireFinite(`${field}.isaOffset_K`, isaOffset_K, MIN_ISA_OFFSET_K, MAX_ISA_OFFSET_K, 'K');
  }
}

/** Validates and sorts a table; throws InputError naming `${field}.${index}.…`. */
export function windProfile(
  levels: readonly WindLevel[],
  field = 'environment.windsAloft',
): WindProfile {
  if (levels.length < 1 || levels.length > MAX_WIND_LEVELS) {
    throw new InputError(field, `${levels.length} levels`, `between 1 and ${MAX_WIND_LEVELS}`);
  }
  levels.forEach((l, i) => checkWindLevel(l, `${field}.${i}`));
  const order = levels.map((_, i) => i).sort((i, j) => lv(levels, i) - lv(levels, j));
  for (let k = 1; k < order.length; k++) {
    const a = levels[order[k - 1] as number] as WindLevel;
    const b = levels[order[k] as number] as WindLevel;
    if (a.altitude_m === b.altitude_m) {
      throw new InputError(
        `${field}.${order[k]}.altitude_m`,
        b.altitude_m,
        `different from every other level (level ${order[k - 1]} has the same altitude)`,
      );
    }
  }
  const sorted = order.map((i) => levels[i] as WindLevel);
  const withIsa = sorted.filter((l) => l.isaOffset_K !== undefined);
  return {
    altitude_m: sorted.map((l) => l.altitude_m),
    east_m_s: sorted.map((l) => windVector(l.from_deg, l.speed_m_s).east_m_s),
    north_m_s: sorted.map((l) => windVector(l.from_deg, l.speed_m_s).north_m_s),
    isaAltitude_m: withIsa.map((l) => l.altitude_m),
    isaOffset_K: withIsa.map((l) => l.isaOffset_K as number),
  };
}

function lv(levels: readonly WindLevel[], i: number): number {
  return (levels[i] as WindLevel).altitude_m;
}

/** The wind at an altitude from a table or a prepared profile. */
export function windAt(
  levelsOrProfile: readonly WindLevel[] | WindProfile,
  altitude_m: number,
  field = 'altitude_m',
): WindAtAltitude {
  requireFinite(field, altitude_m, WIND_ALTITUDE_MIN_M, WIND_ALTITUDE_MAX_M, 'm');
  const p = Array.isArray(levelsOrProfile)
    ? windProfile(levelsOrProfile)
    : (levelsOrProfile as WindProfile);
  const east = interpolate(p.altitude_m, p.east_m_s, altitude_m);
  const north = interpolate(p.altitude_m, p.north_m_s, altitude_m);
  const isa =
    p.isaAltitude_m.length > 0
      ? interpolate(p.isaAltitude_m, p.isaOffset_K, altitude_m).value
      : undefined;
  return {
    ...windFromVector(east.value, north.value),
    east_m_s: east.value,
    north_m_s: north.value,
    isaOffset_K: isa,
    extrapolated: east.extrapolated,
  };
}

/** East/north motion of the air for a wind from `from_deg` at `speed_m_s`. */
export function windVector(from_deg: number, speed_m_s: number) {
  return {
    east_m_s: -speed_m_s * Math.sin(from_deg * DEG),
    north_m_s: -speed_m_s * Math.cos(from_deg * DEG),
  };
}

/** Direction (from, [0, 360)) and speed of the air motion (east, north). */
export function windFromVector(east_m_s: number, north_m_s: number) {
  const speed_m_s = Math.hypot(east_m_s, north_m_s);
  if (speed_m_s < CALM_M_S) return { from_deg: 0, speed_m_s };
  const from = Math.atan2(-east_m_s, -north_m_s) / DEG;
  const r = (from + 360) % 360;
  return { from_deg: r >= 360 ? 0 : r + 0, speed_m_s };
}

/** Linear between the bracketing points; the end value outside (flagged). */
function interpolate(xs: readonly number[], ys: readonly number[], x: number) {
  const n = xs.length;
  const first = xs[0] as number;
  const last = xs[n - 1] as number;
  if (x <= first) return { value: ys[0] as number, extrapolated: x < first };
  if (x >= last) return { value: ys[n - 1] as number, extrapolated: x > last };
  let i = 1;
  while ((xs[i] as number) < x) i++;
  const x0 = xs[i - 1] as number;
  const x1 = xs[i] as number;
  const y0 = ys[i - 1] as number;
  const y1 = ys[i] as number;
  return { value: y0 + ((y1 - y0) * (x - x0)) / (x1 - x0), extrapolated: false };
}

export interface HeadCross {
  /** + headwind, − tailwind, m/s. */
  headwind_m_s: number;
  /** + from the right of the course, m/s. */
  crosswind_m_s: number;
}

/**
 * Head and cross components against a true course (same signs as the solver's wind
 * triangle): of a single wind, or of a table's wind at `altitude_m`.
 */
export function headTailCross(
  wind: { from_deg: number; speed_m_s: number } | readonly WindLevel[] | WindProfile,
  course_deg: number,
  altitude_m?: number,
): HeadCross {
  requireFinite('course_deg', course_deg, -360, 360, 'deg');
  let w: { from_deg: number; speed_m_s: number };
  if ('from_deg' in wind) {
    requireFinite('wind.from_deg', wind.from_deg, 0, 360, 'deg');
    requireFinite('wind.speed_m_s', wind.speed_m_s, 0, WIND_SPEED_MAX_M_S, 'm/s');
    w = wind;
  } else {
    if (altitude_m === undefined) {
      throw new InputError('altitude_m', altitude_m, 'given when the wind comes from a table');
    }
    w = windAt(wind, altitude_m);
  }
  const rel = (w.from_deg - course_deg) * DEG;
  return { headwind_m_s: w.speed_m_s * Math.cos(rel), crosswind_m_s: w.speed_m_s * Math.sin(rel) };
}
