/**
 * Integrates one leg's quasi-steady flight with the Dormand–Prince integrator over the
 * independent variable that ends the leg, so the end needs no event search: ground distance
 * (cruise by distance), consumable left (cruise by fuel or energy, loiter until reserve),
 * altitude (climb, descent) or time (loiter by time).
 *
 * State: time, ground distance, horizontal air distance, altitude, mass, consumable left
 * (fuel kg or usable battery J) and the air path length ∫V dt (the mean TAS of a leg). Fuel burners lose the fuel's mass; an electric aircraft keeps its mass.
 * Limits (stall margin, power, climb rate, consumable, wind) are watched as an event: the leg
 * stops where the first one is broken, located on the dense output.
 */
import { InputError } from '../errors.ts';
import type { FlightModel } from './model.ts';
import { integrate, OdeError, type OdeStep } from './ode.ts';
import { evaluatePoint, FlightLimit, newPoint, type Point, type ScheduleMemo } from './point.ts';
import {
  A,
  altitudeStops,
  climbFloor,
  emptySeries,
  fromVector,
  H,
  indepIndex,
  limitMargin,
  M,
  P,
  pushSample,
  Q,
  STATE_SIZE,
  T,
  toVector,
  X,
  type LimitKind,
  type MissionState,
  type SegmentOutcome,
  type SegmentSpec,
} from './segmentParts.ts';
import { emptyStats, record } from './segmentStats.ts';

export type { SegmentStats } from './segmentStats.ts';
export {
  climbFloor,
  limitMargin,
  LIMIT_TOLERANCE,
  type Independent,
  type LimitKind,
  type MissionState,
  type SegmentOutcome,
  type SegmentSpec,
} from './segmentParts.ts';

/** Hysteresis of the idle-kink watch (fraction of the maximum), so a restart does not re-fire. */
const KINK_SLACK = 1e-9;
/** Restarts at idle kinks per segment; beyond, the rest is integrated across them. */
const MAX_KINK_RESTARTS = 16;

/** Flies one segment from `start`; never throws for a failure of the flight itself. */
export function flySegment(
  model: FlightModel,
  spec: SegmentSpec,
  start: MissionState,
): SegmentOutcome {
  return new SegmentFlight(model, spec, start).fly();
}

/**
 * One segment's integration. A class rather than a nest of closures: a segment is flown
 * thousands of times in a sweep or a Monte Carlo, and its callbacks are bound once here.
 */
class SegmentFlight {
  private readonly memo: ScheduleMemo = {};
  /** Limits watched; over the consumable itself the end is exact, so not that one. */
  private readonly limits: readonly LimitKind[];
  private readonly fuel: boolean;
  private readonly ix: number;
  private readonly y0: Float64Array;
  private readonly s0: number;
  private readonly stats = emptyStats();
  private readonly series = emptySeries();
  /**
   * One point, remembered by the state it was evaluated at: the integrator's last stage of a
   * step is at the step's end, so the event and the statistics there cost nothing.
   */
  private readonly point: Point;
  private readonly seenAt = new Float64Array(STATE_SIZE).fill(NaN);
  private readonly floorHalf: number;
  /** The end of the last accepted step. */
  private readonly last: Float64Array;
  private readonly scratch = new Float64Array(STATE_SIZE);
  private steps = 0;
  /** Chart samples: how many, and the next one due. */
  private readonly n: number;
  private nextSample = 1;
  /** ±1: the side of the idle kink being flown (power.ts idleExcess); 0: not watched. */
  private kinkSign = 1;
  /** Why a trial stage could not be evaluated (reported if no step at all can be taken). */
  private outside: Error | null = null;
  private worstKind: LimitKind | null = null;
  private readonly rhs: (s: number, y: Float64Array, dy: Float64Array) => void;
  private readonly event: (s: number, y: Float64Array) => number;
  private readonly onStep: (step: OdeStep) => void;

  constructor(
    private readonly model: FlightModel,
    private readonly spec: SegmentSpec,
    start: MissionState,
  ) {
    this.limits = spec.indep === 'q' ? spec.limits.filter((k) => k !== 'consumable') : spec.limits;
    this.fuel = model.consumable === 'fuel';
    this.ix = indepIndex(spec.indep);
    this.y0 = toVector(start);
    this.s0 = this.y0[this.ix]!;
    this.point = newPoint(model, start.h_m);
    this.floorHalf = 0.5 * climbFloor(spec);
    this.last = new Float64Array(this.y0);
    this.n = Math.max(spec.samples, 2);
    this.rhs = this.safeDerivatives.bind(this);
    this.event = this.eventValue.bind(this);
    this.onStep = this.accepted.bind(this);
  }

  fly(): SegmentOutcome {
    const { spec, y0 } = this;
    try {
      const p0 = this.observe(y0);
      record(this.stats, p0);
      this.stats.startTas_m_s = p0.tas_m_s;
      this.sample(y0, p0);
      if (this.worstMargin(y0, p0) < 0) return this.outcome(this.worstKind, '', y0, p0.h_m);
      // Watch the idle kink of the consumption: stop where it is crossed and start afresh, so
      // that no step straddles a jump in the derivative.
      this.kinkSign = p0.idleExcess >= 0 ? 1 : -1;
      let x = this.s0;
      let y = y0;
      // Over altitude, also stop and start afresh where the air's gradient jumps (the
      // acceleration factor of a climb or descent jumps there; slope.ts).
      const stops = altitudeStops(this.model, spec, this.s0);
      let stop = 0;
      for (let restarts = 0; ; restarts++) {
        const to = stops[stop] ?? spec.to;
        if (stops.length > 0) {
          // At a break the schedule's dV/dh is taken on this piece's side (slope.ts).
          this.memo.pieceEnd_m = to;
          this.seenAt.fill(NaN);
        }
        const res = integrate(this.rhs, x, y, to, {
          rtol: this.model.rtol,
          atol: 1e-12,
          // The legs are smooth and nearly linear in their independent variable: the first
          // trial step is the whole rest of the leg; the error control shrinks it as needed.
          initialStep: Math.abs(to - x),
          maxSteps: 20_000,
          event: this.event,
          onStep: this.onStep,
        });
        // The independent variable is exactly where the integrator stopped (its own column
        // only carries rounding).
        res.y[this.ix] = res.x;
        const p1 = this.observe(res.y);
        if (!res.stoppedByEvent && to !== spec.to) {
          stop++;
          x = res.x;
          y = res.y;
          continue;
        }
        if (!res.stoppedByEvent) return this.finish(null, res.y, p1);
        const margin = this.worstMargin(res.y, p1);
        if (this.kinkSign !== 0 && this.kinkMargin(p1) < margin) {
          // Crossed the kink: watch for the way back, unless this went nowhere.
          this.kinkSign = res.x !== x && restarts < MAX_KINK_RESTARTS ? -this.kinkSign : 0;
          x = res.x;
          y = res.y;
          continue;
        }
        return this.finish(this.worstKind, res.y, p1);
      }
    } catch (e) {
      if (e instanceof FlightLimit || e instanceof InputError || e instanceof OdeError) {
        return this.failed(e instanceof OdeError && this.outside !== null ? this.outside : e);
      }
      throw e;
    }
  }

  private failed(why: Error): SegmentOutcome {
    const { last, series } = this;
    let p: Point | null;
    try {
      p = this.observe(last);
    } catch {
      p = null;
    }
    const h = p ? p.h_m : last[H]!;
    if (series.t_s[series.t_s.length - 1] !== last[T] || series.t_s.length < 2) {
      pushSample(series, this.fuel, last, h, p ? p.tas_m_s : 0);
    }
    return this.outcome('error', why.message, last, h);
  }

  private outcome(
    stoppedBy: SegmentOutcome['stoppedBy'],
    message: string,
    y: Float64Array,
    h_m: number,
  ): SegmentOutcome {
    const { point, steps, stats, series } = this;
    return { end: fromVector(y, h_m), stoppedBy, message, endPoint: point, steps, stats, series };
  }

  private sample(y: Float64Array, p: Point): void {
    pushSample(this.series, this.fuel, y, p.h_m, p.tas_m_s);
  }

  private finish(stoppedBy: LimitKind | null, y: Float64Array, p: Point): SegmentOutcome {
    const t = this.series.t_s;
    if (t.length === 1 || t[t.length - 1] !== y[T]) this.sample(y, p);
    return this.outcome(stoppedBy, '', y, p.h_m);
  }

  private observe(y: Float64Array): Point {
    const seen = this.seenAt;
    if (
      y[M] === seen[M] &&
      y[H] === seen[H] &&
      y[T] === seen[T] &&
      y[X] === seen[X] &&
      y[A] === seen[A] &&
      y[Q] === seen[Q] &&
      y[P] === seen[P]
    ) {
      return this.point;
    }
    seen.fill(NaN);
    evaluatePoint(this.model, this.spec.path, y[M]!, y[H]!, this.memo, this.point);
    seen.set(y);
    return this.point;
  }

  /**
   * A trial stage outside the flyable region (the mass or the air run out beyond the end of
   * the leg, no ground speed) makes the step non-finite, so the integrator rejects it and
   * shrinks; only when no step at all can be taken does the segment stop, with this reason.
   */
  private safeDerivatives(s: number, y: Float64Array, dy: Float64Array): void {
    try {
      this.derivatives(s, y, dy);
    } catch (e) {
      if (!(e instanceof FlightLimit || e instanceof InputError)) throw e;
      this.outside = e;
      dy.fill(NaN);
    }
  }

  private derivatives(_s: number, y: Float64Array, dy: Float64Array): void {
    const { spec, fuel } = this;
    const p = this.observe(y);
    let per = 1;
    if (spec.indep === 'x') {
      if (!(p.groundSpeed_m_s > 0)) throw new FlightLimit('no ground speed along the course');
      per = p.groundSpeed_m_s;
    } else if (spec.indep === 'h') {
      per =
        spec.path.vertical.kind === 'climb' ? Math.max(p.climb_m_s, this.floorHalf) : p.climb_m_s;
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
    dy[P] = p.tas_m_s / per;
  }

  /** The least limit margin at y (Infinity with no limits); its kind in `worstKind`. */
  private worstMargin(y: Float64Array, p: Point): number {
    let kind: LimitKind | null = null;
    let margin = Infinity;
    for (const k of this.limits) {
      const m = limitMargin(k, p, y[Q]!, this.model, this.spec);
      if (m < margin) {
        margin = m;
        kind = k;
      }
    }
    this.worstKind = kind;
    return margin;
  }

  private kinkMargin(p: Point): number {
    return this.kinkSign * p.idleExcess + KINK_SLACK;
  }

  private eventValue(_s: number, y: Float64Array): number {
    const p = this.observe(y);
    const g = this.worstMargin(y, p);
    return this.kinkSign !== 0 ? Math.min(g, this.kinkMargin(p)) : g;
  }

  private sampleAt(i: number): number {
    const { spec, s0, n } = this;
    return i === n - 1 ? spec.to : s0 + ((spec.to - s0) * i) / (n - 1);
  }

  private accepted(step: OdeStep): void {
    this.steps++;
    const dir = this.spec.to >= this.s0 ? 1 : -1;
    while (
      this.spec.samples > 0 &&
      this.nextSample < this.n &&
      dir * (this.sampleAt(this.nextSample) - step.x1) < 0
    ) {
      step.interpolate(this.sampleAt(this.nextSample), this.scratch);
      this.sample(this.scratch, this.observe(this.scratch));
      record(this.stats, this.point);
      this.nextSample++;
    }
    this.last.set(step.y1);
    record(this.stats, this.observe(step.y1));
  }
}
