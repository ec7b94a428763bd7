/**
 * Wind triangle for a course held over the ground in a steady wind (common practice of air
 * navigation; e.g. FAA Pilot's Handbook of Aeronautical Knowledge, ch. 16, from memory).
 *
 * The wind is given by the direction it blows FROM (meteorological convention). Against a
 * course χ a wind of speed V_w from ψ has a headwind component V_w·cos(ψ − χ) and a crosswind
 * component V_w·sin(ψ − χ) (positive from the right). The aircraft heads into the crosswind
 * by the wind correction angle WCA = asin(crosswind/TAS), so its ground speed is
 * TAS·cos(WCA) − headwind. No solution exists when the crosswind reaches the airspeed, or
 * when the headwind leaves no forward ground speed.
 */
import { InputError } from '../errors.ts';
import type { Wind } from '../plan/schema.ts';

const DEG = Math.PI / 180;

export interface WindComponents {
  /** + headwind, − tailwind. */
  headwind_m_s: number;
  /** + from the right of the course. */
  crosswind_m_s: number;
}

export interface WindTriangle extends WindComponents {
  heading_deg: number;
  /** Heading minus course, + to the right. */
  correction_deg: number;
  groundSpeed_m_s: number;
}

export function windComponents(course_deg: number, wind: Wind): WindComponents {
  const rel = (wind.from_deg - course_deg) * DEG;
  return {
    headwind_m_s: wind.speed_m_s * Math.cos(rel),
    crosswind_m_s: wind.speed_m_s * Math.sin(rel),
  };
}

/**
 * Ground speed along the course for a horizontal airspeed, continued below the point where
 * the course can no longer be held so that it stays continuous and increasing in airspeed:
 * a value ≤ 0 means no ground speed along the course is possible (used by speed searches).
 */
export function alongTrackSpeed(
  tas_m_s: number,
  headwind_m_s: number,
  crosswind_m_s: number,
): number {
  const cross = Math.abs(crosswind_m_s);
  if (tas_m_s <= cross) return tas_m_s - cross - headwind_m_s;
  return Math.sqrt(tas_m_s * tas_m_s - cross * cross) - headwind_m_s;
}

/** Heading, ground speed and wind components for a course; throws when there is no solution. */
export function windTriangle(tas_m_s: number, course_deg: number, wind: Wind): WindTriangle {
  if (!Number.isFinite(tas_m_s) || tas_m_s <= 0) {
    throw new InputError('tas_m_s', tas_m_s, 'a finite number above 0 m/s');
  }
  const { headwind_m_s, crosswind_m_s } = windComponents(course_deg, wind);
  if (Math.abs(crosswind_m_s) >= tas_m_s) {
    throw new InputError(
      'wind.speed_m_s',
      wind.speed_m_s,
      `such that its crosswind component (${round(Math.abs(crosswind_m_s))} m/s) stays below the true airspeed ${round(tas_m_s)} m/s`,
    );
  }
  const correction = Math.asin(crosswind_m_s / tas_m_s);
  const groundSpeed_m_s = tas_m_s * Math.cos(correction) - headwind_m_s;
  if (!(groundSpeed_m_s > 0)) {
    throw new InputError(
      'wind.speed_m_s',
      wind.speed_m_s,
      `such that the true airspeed ${round(tas_m_s)} m/s leaves a ground speed above 0 along the course`,
    );
  }
  return {
    heading_deg: normalizeDegrees(course_deg + correction / DEG),
    correction_deg: correction / DEG,
    groundSpeed_m_s,
    headwind_m_s,
    crosswind_m_s,
  };
}

/** Angle in [0, 360). */
export function normalizeDegrees(deg: number): number {
  const d = deg % 360;
  const r = d < 0 ? d + 360 : d;
  // `+ 0` turns −0 into 0; rounding can carry a tiny negative angle up to 360 itself.
  return r >= 360 ? 0 : r + 0;
}

function round(v: number): number {
  return Number(v.toPrecision(4));
}
