/**
 * The quasi-steady flight condition at one point of a leg: airspeed from the leg's speed
 * schedule, lift and drag from the polar, thrust power, consumption and vertical speed.
 *
 * Quasi-steady point-mass performance with L = W (small flight-path angles; Anderson,
 * Introduction to Flight, ch. 6): CL = 2W/(ρV²S), D = ½ρV²S·CD(CL).
 * Level flight: thrust power D·V. On a slope the energy equation d(h + V²/2g)/dt = (T − D)V/W
 * holds with the acceleration factor k_a = 1 + (V/g)·dV/dh of the speed schedule
 * (slope.ts; Anderson, Aircraft Performance and Design, ch. 5): climb at a throttle τ,
 * ROC = (τ·P_avail − D·V)/(W·k_a); descent at a given rate, thrust power D·V − W·RoD·k_a
 * (idle consumption below idle; below zero the descent is steeper than an idle glide and
 * needs drag devices); glide at idle with the thrust the idle fuel flow implies (idleThrust.ts),
 * sink = (D·V − P_idle)/(W·k_a), = V/((L/D)·k_a) with no idle thrust. Paths steeper than
 * 30° (sin γ = MAX_SIN_GAMMA) are outside the small-angle model and stop the leg.
 * An orbit over a point (loiter) covers no ground; it can hold station while its horizontal
 * airspeed exceeds the wind speed (a circle flown in a steady wind drifts with the air mass,
 * and the aircraft gets back upwind only while it is faster than the wind; common practice).
 * Cruise-climb: V and CL fixed, the density follows the weight, ρ = 2W/(V²·S·CL) (Anderson,
 * Aircraft Performance and Design, ch. 5). Horizontal airspeed √(V² − ḣ²) enters the wind
 * triangle.
 * A path with `aloft` takes the air and, with `aloft.wind`, the wind at each altitude from
 * the winds-aloft table (model.ts, aloft.ts); best range then uses the local wind.
 */
import { G0 } from '../units.ts';
import { altitudeForDensity, ambientAt, type Ambient, type FlightModel } from './model.ts';
import { idleThrustPower_W } from './idleThrust.ts';
import { availablePower_W, consumption, idleExcess } from './power.ts';
import { scheduleTas, type ScheduleMemo, type SpeedSchedule } from './schedule.ts';
import { scheduleSlope } from './slope.ts';
import { dragCoefficientOf, type SpeedChoice } from './speeds.ts';
import { alongTrackSpeed } from './wind.ts';
import { crosswindOf, headwindOf } from './aloft.ts';

export type { ScheduleMemo, SpeedSchedule } from './schedule.ts';

export type VerticalMode =
  | { kind: 'level' }
  /** Constant TAS (the schedule) and CL; altitude follows the weight. */
  | { kind: 'cruiseClimb'; CL: number }
  | { kind: 'climb'; throttle: number }
  | { kind: 'descent'; rate_m_s: number }
  | { kind: 'glide' };

/**
 * Weather from the winds-aloft table: its air always, its wind against the course when
 * `wind`; with `allHeadwind` the table's whole wind speed as a headwind (a course not part of
 * the plan, such as the reserve alternate's: the conservative assumption).
 */
export interface AloftPath {
  wind: boolean;
  sinCourse: number;
  cosCourse: number;
  allHeadwind?: boolean;
}

export interface FlightPath {
  speed: SpeedSchedule;
  vertical: VerticalMode;
  /** The wind components held along the path (unless `aloft.wind`). */
  headwind_m_s: number;
  crosswind_m_s: number;
  /** Air (and wind) from the winds-aloft table; absent: the plan's ISA offset and the fixed wind. */
  aloft?: AloftPath;
  /** Plan path of the leg's speed, for messages (e.g. `legs.3.speed`). */
  field: string;
  /**
   * An orbit over a point (loiter): no ground is covered (ground speed 0) and the wind
   * components are the wind's whole speed as `headwind_m_s` (legs/loiter.ts).
   */
  orbit?: boolean;
}

/** Steepest flight path the small-angle model is used for (sin γ). */
export const MAX_SIN_GAMMA = 0.5;

/** Smallest acceleration factor accepted (a schedule slowing down this fast is not flyable). */
const MIN_ACCEL_FACTOR = 0.05;

/** (L/D)max of the polar, at the best-glide lift coefficient. */
function maxLiftToDragOf(model: FlightModel): number {
  const CL = model.optimumCL.glide;
  return CL / dragCoefficientOf(model.polar, CL);
}

/** A condition the point model cannot represent; the leg stops with this message. */
export class FlightLimit extends Error {
  override readonly name = 'FlightLimit';
}

export interface Point {
  h_m: number;
  amb: Ambient;
  tas_m_s: number;
  /** Horizontal airspeed √(V² − ḣ²). */
  horizontal_m_s: number;
  /** Ground speed along the course; ≤ 0 when the wind cannot be beaten. */
  groundSpeed_m_s: number;
  /** Wind components against the course here (+ headwind, + from the right). */
  headwind_m_s: number;
  crosswind_m_s: number;
  CL: number;
  CD: number;
  drag_N: number;
  /** Thrust power the engine delivers (may be ≤ 0 in a descent: idle). */
  thrustPower_W: number;
  /** Power the flight path needs: D·V in level flight, D·V ± W·ḣ on a slope. */
  powerRequired_W: number;
  powerAvailable_W: number;
  /** Fuel kg/s (fuel burners) or battery drain W (electric). */
  rate: number;
  /** Demand above the idle floor as a fraction of the maximum (power.ts idleExcess). */
  idleExcess: number;
  /** Vertical speed ḣ, + up. */
  climb_m_s: number;
  /** V/V_stall = √(CLmax/CL). */
  stallRatio: number;
  speedLimitedBy: SpeedChoice['limitedBy'];
  /** The climb was steeper than MAX_SIN_GAMMA allows at full throttle; less power is used. */
  climbCapped: boolean;
  /** Acceleration factor 1 + (V/g)·dV/dh of the path (1 level or at constant TAS). */
  accelFactor: number;
  /** Descent and glide: the sink rate of an idle glide at this speed, D·V/(W·k_a); else 0. */
  idleSink_m_s: number;
}

export function newPoint(model: FlightModel, h_m: number): Point {
  return {
    h_m,
    amb: ambientAt(model, h_m),
    tas_m_s: 0,
    horizontal_m_s: 0,
    groundSpeed_m_s: 0,
    headwind_m_s: 0,
    crosswind_m_s: 0,
    CL: 0,
    CD: 0,
    drag_N: 0,
    thrustPower_W: 0,
    powerRequired_W: 0,
    powerAvailable_W: 0,
    rate: 0,
    idleExcess: 0,
    climb_m_s: 0,
    stallRatio: 0,
    speedLimitedBy: null,
    climbCapped: false,
    accelFactor: 1,
    idleSink_m_s: 0,
  };
}

/** Evaluates the flight condition at (mass, altitude) into `out`. */
export function evaluatePoint(
  model: FlightModel,
  path: FlightPath,
  mass_kg: number,
  h_m: number,
  memo: ScheduleMemo,
  out: Point,
): Point {
  const W = mass_kg * G0;
  const S = model.S_m2;
  const v = path.vertical;
  if (!(mass_kg > 0)) throw new FlightLimit(`the mass fell to ${mass_kg} kg`);
  const aloft = path.aloft;
  let h = h_m;
  if (v.kind === 'cruiseClimb' && path.speed.kind === 'constantTas') {
    const V0 = path.speed.tas_m_s;
    h = altitudeForDensity(model, (2 * W) / (V0 * V0 * S * v.CL), aloft !== undefined);
  }
  const amb = ambientAt(model, h, aloft !== undefined);
  if (aloft !== undefined && aloft.allHeadwind === true) {
    out.headwind_m_s = Math.hypot(amb.windEast_m_s, amb.windNorth_m_s);
    out.crosswind_m_s = 0;
  } else if (aloft !== undefined && aloft.wind) {
    const { windEast_m_s: e, windNorth_m_s: n } = amb;
    out.headwind_m_s = headwindOf(e, n, aloft.sinCourse, aloft.cosCourse);
    out.crosswind_m_s = crosswindOf(e, n, aloft.sinCourse, aloft.cosCourse);
  } else {
    out.headwind_m_s = path.headwind_m_s;
    out.crosswind_m_s = path.crosswind_m_s;
  }
  const V = scheduleTas(model, path, mass_kg, amb, memo, out);
  if (!(V > 0 && V < amb.atm.a_m_s)) {
    throw new FlightLimit(
      `the airspeed ${fmt(V)} m/s is outside the subsonic range at ${fmt(h)} m`,
    );
  }
  const q = 0.5 * amb.atm.rho_kg_m3 * V * V;
  const CL = W / (q * S);
  const CD = dragCoefficientOf(model.polar, CL);
  const D = q * S * CD;
  const rho = amb.atm.rho_kg_m3;
  const avail = availablePower_W(model.power, amb, V, rho);
  let climb = 0;
  let thrust = D * V;
  let required = D * V;
  let accel = 1;
  out.climbCapped = false;
  out.idleSink_m_s = 0;
  if (v.kind === 'climb' || v.kind === 'descent' || v.kind === 'glide') {
    accel = 1 + (V / G0) * scheduleSlope(model, path, mass_kg, amb, V, memo, out);
    if (!(accel > MIN_ACCEL_FACTOR)) {
      throw new FlightLimit(
        `the speed schedule changes too fast with altitude at ${fmt(h)} m (acceleration factor ${fmt(accel)})`,
      );
    }
  }
  if (v.kind === 'climb') {
    thrust = v.throttle * avail;
    climb = (thrust - D * V) / (W * accel);
    if (climb > MAX_SIN_GAMMA * V) {
      climb = MAX_SIN_GAMMA * V;
      thrust = D * V + W * climb * accel;
      out.climbCapped = true;
    }
    required = thrust;
  } else if (v.kind === 'descent') {
    if (v.rate_m_s >= MAX_SIN_GAMMA * V) {
      throw new FlightLimit(
        `a descent rate of ${fmt(v.rate_m_s)} m/s is steeper than 30° at ${fmt(V)} m/s airspeed`,
      );
    }
    climb = -v.rate_m_s;
    required = D * V - W * v.rate_m_s * accel;
    thrust = required;
    out.idleSink_m_s = (D * V - idleThrustPower_W(model.power, amb, V, rho)) / (W * accel);
  } else if (v.kind === 'glide') {
    // At idle the engine gives the thrust its idle fuel flow implies (idleThrust.ts).
    const idle = idleThrustPower_W(model.power, amb, V, rho);
    const sink = (D * V - idle) / (W * accel);
    if (!(sink > 0)) {
      throw new FlightLimit(
        `at idle the engine's thrust power (${fmt(idle)} W) at ${fmt(V)} m/s at least balances the drag (${fmt(D * V)} W): the aircraft cannot glide down at idle (lower the idle fraction or descend at a rate)`,
      );
    }
    if (sink >= MAX_SIN_GAMMA * V) {
      throw new FlightLimit(
        `a glide at ${fmt(V)} m/s would be steeper than 30° (L/D ${fmt(CL / CD)} there, (L/D)max ${fmt(maxLiftToDragOf(model))}; a glide needs an L/D above about ${fmt(1 / MAX_SIN_GAMMA)})`,
      );
    }
    climb = -sink;
    required = 0;
    thrust = 0;
    out.idleSink_m_s = sink;
  }
  const horizontal = Math.sqrt(V * V - climb * climb);
  out.h_m = h;
  out.amb = amb;
  out.tas_m_s = V;
  out.horizontal_m_s = horizontal;
  out.groundSpeed_m_s =
    path.orbit === true ? 0 : alongTrackSpeed(horizontal, out.headwind_m_s, out.crosswind_m_s);
  out.CL = CL;
  out.CD = CD;
  out.drag_N = D;
  out.thrustPower_W = thrust;
  out.powerRequired_W = required;
  out.powerAvailable_W = avail;
  out.rate = consumption(model.power, amb, thrust, V, rho);
  out.idleExcess = idleExcess(model.power, amb, thrust, V, rho);
  out.climb_m_s = climb;
  out.accelFactor = accel;
  out.stallRatio = Math.sqrt(model.polar.CLmax / CL);
  return out;
}

/** Numbers in messages: 4 significant digits, no exponent for everyday magnitudes. */
export function fmt(v: number): string {
  if (!Number.isFinite(v)) return String(v);
  const a = Math.abs(v);
  if (a >= 1e4 && a < 1e9) return String(Math.round(v));
  return String(Number(v.toPrecision(4)));
}
