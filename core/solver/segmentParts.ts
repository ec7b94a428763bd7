/**
 * The parts of a segment (segment.ts) that are plain data: the mission state and its vector
 * layout, the segment's specification and outcome, the limits watched along it with their
 * relative margins, and the chart samples.
 */
import type { FlightModel } from './model.ts';
import type { FlightPath, Point } from './point.ts';
import { powerMargin, type SegmentStats } from './segmentStats.ts';
import type { LegSeries } from './types.ts';

export type Independent = 't' | 'x' | 'h' | 'q';
/**
 * 'wind': no ground speed along the course; 'station': an orbit over a point (loiter) whose
 * airspeed does not exceed the wind speed, so the aircraft drifts downwind.
 */
export type LimitKind = 'stall' | 'power' | 'climb' | 'consumable' | 'wind' | 'station';

/** Mission state carried from leg to leg. */
export interface MissionState {
  t_s: number;
  x_m: number;
  air_m: number;
  h_m: number;
  mass_kg: number;
  /** Fuel kg or usable battery energy J left. */
  left: number;
  /**
   * Air path length ∫V dt (true airspeed along the flight path, climbs and descents
   * included); 0 when absent. `air_m` is the horizontal part, ∫√(V² − ḣ²) dt.
   */
  path_m?: number;
}

export interface SegmentSpec {
  path: FlightPath;
  indep: Independent;
  /** Value of the independent variable where the segment ends. */
  to: number;
  limits: readonly LimitKind[];
  /** Climb-rate floor (m/s) for the `climb` limit. */
  minClimbRate_m_s?: number;
  /** Chart samples (0: none). */
  samples: number;
}

export interface SegmentOutcome {
  end: MissionState;
  /** Which limit or error stopped the segment early (null: reached `to`). */
  stoppedBy: LimitKind | 'error' | null;
  /** Why it stopped, for `stoppedBy` = 'error'. */
  message: string;
  /** Flight condition at the end (or at the stop). */
  endPoint: Point;
  steps: number;
  stats: SegmentStats;
  series: LegSeries;
}

export const T = 0;
export const X = 1;
export const A = 2;
export const H = 3;
export const M = 4;
export const Q = 5;
export const P = 6;
/** Length of the state vector. */
export const STATE_SIZE = 7;
/** A limit counts as broken only beyond this relative margin (rounding at a limited speed). */
export const LIMIT_TOLERANCE = 1e-9;

export function toVector(s: MissionState): Float64Array {
  return Float64Array.of(s.t_s, s.x_m, s.air_m, s.h_m, s.mass_kg, s.left, s.path_m ?? 0);
}

export function indepIndex(i: Independent): number {
  return i === 't' ? T : i === 'x' ? X : i === 'h' ? H : Q;
}

/**
 * Relative margin of each limit at a point (negative: broken). Flight limits get
 * LIMIT_TOLERANCE of slack (a speed held exactly at a limit must not trip it by rounding);
 * the consumable gets none, so a stop for it never leaves a negative amount.
 */
export function limitMargin(
  kind: LimitKind,
  p: Point,
  left: number,
  model: FlightModel,
  spec: SegmentSpec,
): number {
  switch (kind) {
    case 'stall':
      return p.stallRatio / model.settings.stallFactor - 1 + LIMIT_TOLERANCE;
    case 'power':
      return powerMargin(p) + LIMIT_TOLERANCE;
    case 'climb': {
      const floor = climbFloor(spec);
      return (p.climb_m_s - floor) / floor + LIMIT_TOLERANCE;
    }
    case 'consumable':
      return left / (model.consumableStart > 1e-9 ? model.consumableStart : 1);
    case 'wind': {
      const cross = Math.abs(p.crosswind_m_s);
      return Math.min(p.groundSpeed_m_s, p.horizontal_m_s - cross) / p.tas_m_s + LIMIT_TOLERANCE;
    }
    case 'station':
      return (
        (p.horizontal_m_s - Math.hypot(p.headwind_m_s, p.crosswind_m_s)) / p.tas_m_s +
        LIMIT_TOLERANCE
      );
  }
}

/** A zero rate of climb is reached only after infinite time; 0.01 m/s stands in for it. */
export function climbFloor(spec: SegmentSpec): number {
  return Math.max(spec.minClimbRate_m_s ?? 0, 0.01);
}

export function pushSample(
  series: LegSeries,
  fuel: boolean,
  y: Float64Array,
  h_m: number,
  tas_m_s: number,
): void {
  series.t_s.push(y[T]!);
  series.x_m.push(y[X]!);
  series.h_m.push(h_m);
  series.mass_kg.push(y[M]!);
  series.fuel_kg.push(fuel ? y[Q]! : 0);
  series.energy_J.push(fuel ? 0 : y[Q]!);
  series.tas_m_s.push(tas_m_s);
}

export function fromVector(y: Float64Array, h_m: number): MissionState {
  return {
    t_s: y[T]!,
    x_m: y[X]!,
    air_m: y[A]!,
    h_m,
    mass_kg: y[M]!,
    left: y[Q]!,
    path_m: y[P]!,
  };
}

export function emptySeries(): LegSeries {
  return { t_s: [], x_m: [], h_m: [], mass_kg: [], fuel_kg: [], energy_J: [], tas_m_s: [] };
}

/**
 * Where a climb or descent stops and starts afresh: the model's gradient breaks strictly
 * between its start s0 and its end, in the order flown (none for other segments).
 */
export function altitudeStops(model: FlightModel, spec: SegmentSpec, s0: number): number[] {
  if (spec.indep !== 'h') return [];
  const breaks = spec.path.aloft !== undefined ? model.aloftBreaks_m : model.breaks_m;
  const lo = Math.min(s0, spec.to);
  const hi = Math.max(s0, spec.to);
  const inside = breaks.filter((b) => b > lo && b < hi);
  return spec.to >= s0 ? inside : inside.reverse();
}
