/**
 * Integrates one leg's quasi-steady flight with the Dormand–Prince integrator over the
 * independent variable that ends the leg, so the end needs no event search: ground distance
 * (cruise by distance), consumable left (cruise by fuel or energy, loiter until reserve),
 * altitude (climb, descent) or time (loiter by time).
 *
 * State: time, ground distance, air distance, altitude, mass, consumable left (fuel kg or
 * usable battery J). Fuel burners lose the fuel's mass; an electric aircraft keeps its mass.
 * Limits (stall margin, power, climb rate, consumable, wind) are watched as an event: the leg
 * stops where the first one is broken, located on the dense output.
 */
import { InputError } from '../errors.ts';
import type { LegSeries } from './types.ts';
import type { FlightModel } from './model.ts';
import { integrate, OdeError } from './ode.ts';
import {
  evaluatePoint,
  FlightLimit,
  newPoint,
  type FlightPath,
  type Point,
  type ScheduleMemo,
} from './point.ts';
import { emptyStats, powerMargin, record, type SegmentStats } from './segmentStats.ts';

export type { SegmentStats } from './segmentStats.ts';
export type Independent = 't' | 'x' | 'h' | 'q';
export type LimitKind = 'stall' | 'power' | 'climb' | 'consumable' | 'wind';

/** Mission state carried from leg to leg. */
export interface MissionState {
  t_s: number;
  x_m: number;
  air_m: number;
  h_m: number;
  mass_kg: number;
  /** Fuel kg or usable battery energy J left. */
  left: number;
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

const T = 0;
const X = 1;
const A = 2;
const H = 3;
const M = 4;
const Q = 5;
/** A limit counts as broken only beyond this relative margin (rounding at a limited speed). */
export const LIMIT_TOLERANCE = 1e-9;

function toVector(s: MissionState): Float64Array {
  return Float64Array.of(s.t_s, s.x_m, s.air_m, s.h_m, s.mass_kg, s.left);
}

function indepIndex(i: Independent): number {
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
      const cross = Math.abs(spec.path.crosswind_m_s);
      return Math.min(p.groundSpeed_m_s, p.horizontal_m_s - cross) / p.tas_m_s + LIMIT_TOLERANCE;
    }
  }
}

/** A zero rate of climb is reached only after infinite time; 0.01 m/s stands in for it. */
export function climbFloor(spec: SegmentSpec): number {
  return Math.max(spec.minClimbRate_m_s ?? 0, 0.01);
}

function pushSample(
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

/** Flies one segment from `start`; never throws for a failure of the flight itself. */
export function flySegment(
  model: FlightModel,
  spec: SegmentSpec,
  start: MissionState,
): SegmentOutcome {
  const memo: ScheduleMemo = {};
  // Over the consumable itself the end is exact: its own limit would only see rounding.
  const limits = spec.indep === 'q' ? spec.limits.filter((k) => k !== 'consumable') : spec.limits;
  const fuel = model.consumable === 'fuel';
  const ix = indepIndex(spec.indep);
  const y0 = toVector(start);
  const s0 = y0[ix]!;
  const stats = emptyStats();
  const series: LegSeries = {
    t_s: [],
    x_m: [],
    h_m: [],
    mass_kg: [],
    fuel_kg: [],
    energy_J: [],
    tas_m_s: [],
  };
  // One point, remembered by the state it was evaluated at: the integrator's last stage of
  // a step is at the step's end, so the event and the statistics there cost nothing.
  const obsPoint = newPoint(model, start.h_m);
  const seenAt = new Float64Array(6).fill(NaN);
  const floorHalf = 0.5 * climbFloor(spec);
  const last = new Float64Array(y0);
  let steps = 0;
  const outcome = (
    stoppedBy: SegmentOutcome['stoppedBy'],
    message: string,
    y: Float64Array,
    h_m: number,
  ): SegmentOutcome => {
    const end = fromVector(y, h_m);
    return { end, stoppedBy, message, endPoint: obsPoint, steps, stats, series };
  };
  const sample = (y: Float64Array, p: Point) => pushSample(series, fuel, y, p.h_m, p.tas_m_s);

  const observe = (y: Float64Array): Point => {
    if (
      y[M] === seenAt[M] &&
      y[H] === seenAt[H] &&
      y[T] === seenAt[T] &&
      y[X] === seenAt[X] &&
      y[A] === seenAt[A] &&
      y[Q] === seenAt[Q]
    ) {
      return obsPoint;
    }
    seenAt.fill(NaN);
    evaluatePoint(model, spec.path, y[M]!, y[H]!, memo, obsPoint);
    seenAt.set(y);
    return obsPoint;
  };
  const rhs = (_s: number, y: Float64Array, dy: Float64Array): void => {
    const p = observe(y);
    let per = 1;
    if (spec.indep === 'x') {
      if (!(p.groundSpeed_m_s > 0)) throw new FlightLimit('no ground speed along the course');
      per = p.groundSpeed_m_s;
    } else if (spec.indep === 'h') {
      per = spec.path.vertical.kind === 'climb' ? Math.max(p.climb_m_s, floorHalf) : p.climb_m_s;
      if (per === 0) throw new FlightLimit('no vertical speed');
    } else if (spec.indep === 'q') {
      if (!(p.rate > 0)) throw new FlightLimit('nothing is consumed');
      per = -p.rate;
    }
    dy[T] = 1 / per;
    dy[X] = p.groundSpeed_m_s / per;
    dy[A] = p.horizontal_m_s / per;
    dy[H] = spec.path.vertical.kind === 'cruiseClimb' ? 0 : p.climb_m_s / per;
    dy[M] = fuel ? -p.rate / per : 0;
    dy[Q] = -p.rate / per;
  };
  const worstMargin = (y: Float64Array, p: Point): { kind: LimitKind | null; margin: number } => {
    let kind: LimitKind | null = null;
    let margin = Infinity;
    for (const k of limits) {
      const m = limitMargin(k, p, y[Q]!, model, spec);
      if (m < margin) {
        margin = m;
        kind = k;
      }
    }
    return { kind, margin };
  };

  try {
    const p0 = observe(y0);
    record(stats, p0);
    stats.startTas_m_s = p0.tas_m_s;
    sample(y0, p0);
    const w0 = worstMargin(y0, p0);
    if (w0.margin < 0) return outcome(w0.kind, '', y0, p0.h_m);
    const n = Math.max(spec.samples, 2);
    let nextSample = 1;
    const sampleAt = (i: number) => (i === n - 1 ? spec.to : s0 + ((spec.to - s0) * i) / (n - 1));
    const scratch = new Float64Array(6);
    const dir = spec.to >= s0 ? 1 : -1;
    const res = integrate(rhs, s0, y0, spec.to, {
      rtol: 1e-9,
      atol: 1e-12,
      maxSteps: 20_000,
      event: limits.length ? (_s, y) => worstMargin(y, observe(y)).margin : undefined,
      onStep: (step) => {
        steps++;
        while (spec.samples > 0 && nextSample < n && dir * (sampleAt(nextSample) - step.x1) < 0) {
          step.interpolate(sampleAt(nextSample), scratch);
          sample(scratch, observe(scratch));
          record(stats, obsPoint);
          nextSample++;
        }
        last.set(step.y1);
        record(stats, observe(step.y1));
      },
    });
    // The independent variable ends exactly where asked (its own column only carries rounding).
    res.y[ix] = res.x;
    const p1 = observe(res.y);
    if (series.t_s.length === 1 || series.t_s[series.t_s.length - 1] !== res.y[T])
      sample(res.y, p1);
    if (res.stoppedByEvent) return outcome(worstMargin(res.y, p1).kind, '', res.y, p1.h_m);
    return outcome(null, '', res.y, p1.h_m);
  } catch (e) {
    if (e instanceof FlightLimit || e instanceof InputError || e instanceof OdeError) {
      const p = safeObserve(observe, last);
      const h = p ? p.h_m : last[H]!;
      if (series.t_s[series.t_s.length - 1] !== last[T] || series.t_s.length < 2) {
        pushSample(series, fuel, last, h, p ? p.tas_m_s : 0);
      }
      return outcome('error', e.message, last, h);
    }
    throw e;
  }
}

function safeObserve(observe: (y: Float64Array) => Point, y: Float64Array): Point | null {
  try {
    return observe(y);
  } catch {
    return null;
  }
}

function fromVector(y: Float64Array, h_m: number): MissionState {
  return { t_s: y[T]!, x_m: y[X]!, air_m: y[A]!, h_m, mass_kg: y[M]!, left: y[Q]! };
}
