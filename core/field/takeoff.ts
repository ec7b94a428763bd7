/**
 * Take-off distance: ground roll by integration of the ground-roll equation, then the air
 * distance to clear the screen height.
 *
 * Ground roll: from rest (airspeed = headwind) to the lift-off speed V_LO = 1.1·V_stall with
 * the take-off CLmax (common practice; Raymer, Aircraft Design, ch. 17; Anderson uses 1.2 in
 * Introduction to Flight, ch. 6 — settable). Forces and integration in groundRun.ts, thrust
 * model in thrust.ts.
 *
 * Air distance (Raymer, Aircraft Design, ch. 17, and Anderson, Aircraft Performance and
 * Design, ch. 6; from memory): a circular-arc transition at V_TR = 1.15·V_stall with load
 * factor n = 1.2, radius R = V_TR²/(g·(n − 1)) = V_TR²/(0.2·g), up to the climb angle γ with
 * sin γ = (T − D)/W at V_TR; then a straight climb to the screen. If the arc reaches the screen
 * first, the air distance is the chord √(R² − (R − h)²). Over the ground the air path is
 * scaled by ground speed / airspeed (common practice).
 *
 * Closed form (Anderson, Introduction to Flight, ch. 6, and Aircraft Performance and Design,
 * ch. 6): with constant thrust and no drag, friction, slope or wind, s = V_LO²·W/(2gT), which
 * with V_LO = 1.1·V_stall is s = 1.21·W²/(g·ρ·S·CLmax·T).
 */
import { requireFinite, requirePositive, InputError } from '../errors.ts';
import { FT, G0 } from '../units.ts';
import {
  groundRunParams,
  groundStallSpeed,
  integrateRun,
  runwayAcceleration,
  type GroundAircraft,
  type GroundRunParams,
  type RunwayConditions,
} from './groundRun.ts';
import { surfaceFriction, type SurfaceFriction, type SurfaceId } from './surfaces.ts';
import { checkThrustModel, thrustAt, thrustBreakSpeed, type ThrustModel } from './thrust.ts';

/** V_LO / V_stall (common practice). */
export const DEFAULT_LIFTOFF_FACTOR = 1.1;
/** Screen height: 50 ft (common practice for take-off and landing distances). */
export const DEFAULT_SCREEN_HEIGHT_M = 50 * FT;
/** Transition speed over stall speed and load factor in the transition arc (Raymer, from memory). */
export const TRANSITION_SPEED_FACTOR = 1.15;
export const TRANSITION_LOAD_FACTOR = 1.2;

export interface TakeoffInput extends GroundAircraft, RunwayConditions {
  thrust: ThrustModel;
  /** Named surface (rolling μ from surfaces.ts) or explicit coefficients. */
  surface: SurfaceId | SurfaceFriction;
  /** V_LO / V_stall; DEFAULT_LIFTOFF_FACTOR if omitted. */
  liftoffFactor?: number;
  /** Screen height for the air distance; DEFAULT_SCREEN_HEIGHT_M if omitted. */
  screenHeight_m?: number;
}

export interface GroundRollOk {
  ok: true;
  stallSpeed_m_s: number;
  liftoffSpeed_m_s: number;
  groundRoll_m: number;
  time_s: number;
}
export interface FieldFailure {
  ok: false;
  stallSpeed_m_s: number;
  /** One plain sentence naming what limits the aircraft. */
  reason: string;
}
export type GroundRollResult = GroundRollOk | FieldFailure;

export interface TakeoffOk extends Omit<GroundRollOk, 'ok'> {
  ok: true;
  /** Ground distance from lift-off to the screen. */
  airDistance_m: number;
  totalDistance_m: number;
  climbGradient: number;
  transitionRadius_m: number;
}
export type TakeoffResult = TakeoffOk | FieldFailure;

interface Resolved {
  p: GroundRunParams;
  thrust: ThrustModel;
  mu: number;
  Vs: number;
  V_LO: number;
  screen_m: number;
}

function resolve(input: TakeoffInput): Resolved {
  const p = groundRunParams(input, input);
  const thrust = checkThrustModel(input.thrust);
  const mu = surfaceFriction(input.surface).muRoll;
  const f = requireFinite('liftoffFactor', input.liftoffFactor ?? DEFAULT_LIFTOFF_FACTOR, 1, 1.5);
  // With CL_g ≥ CLmax/f² the wheels would leave the ground before V_LO.
  if (p.CL_ground >= p.CLmax / (f * f)) {
    throw new InputError(
      'CL_ground',
      p.CL_ground,
      `below CLmax/liftoffFactor² = ${(p.CLmax / (f * f)).toPrecision(4)}`,
    );
  }
  const Vs = groundStallSpeed(p);
  const V_LO = f * Vs;
  if (Math.abs(p.headwind) >= V_LO) {
    throw new InputError(
      'headwind_m_s',
      p.headwind,
      `smaller in size than the lift-off speed ${V_LO.toPrecision(4)} m/s`,
    );
  }
  const screen_m = requireFinite(
    'screenHeight_m',
    input.screenHeight_m ?? DEFAULT_SCREEN_HEIGHT_M,
    0,
    100,
    'm',
  );
  return { p, thrust, mu, Vs, V_LO, screen_m };
}

function roll(r: Resolved): GroundRollResult {
  const { p, thrust, mu, Vs, V_LO } = r;
  const run = integrateRun(
    (V) => runwayAcceleration(p, V, thrustAt(thrust, V), mu),
    p.headwind,
    V_LO,
    p.headwind,
    [0, thrustBreakSpeed(thrust)],
  );
  if (!run.ok) {
    return {
      ok: false,
      stallSpeed_m_s: Vs,
      reason: `thrust no longer exceeds drag, rolling friction and slope at ${run.stuckAt_m_s.toFixed(1)} m/s airspeed, below the lift-off speed ${V_LO.toFixed(1)} m/s`,
    };
  }
  return {
    ok: true,
    stallSpeed_m_s: Vs,
    liftoffSpeed_m_s: V_LO,
    groundRoll_m: run.distance_m,
    time_s: run.time_s,
  };
}

/** Ground roll from rest to lift-off. */
export function takeoffGroundRoll(input: TakeoffInput): GroundRollResult {
  return roll(resolve(input));
}

/** Ground roll plus air distance to the screen height. */
export function takeoffDistance(input: TakeoffInput): TakeoffResult {
  const r = resolve(input);
  const ground = roll(r);
  if (!ground.ok) return ground;
  const { p, thrust, Vs, screen_m } = r;
  const V = TRANSITION_SPEED_FACTOR * Vs;
  // Airborne: lift carries the weight, induced drag out of ground effect.
  const CL = (2 * p.weight_N) / (p.rho * V * V * p.S);
  const drag = 0.5 * p.rho * V * V * p.S * (p.CD0 + p.k * CL * CL);
  const sinGamma = (thrustAt(thrust, V) - drag) / p.weight_N;
  if (!(sinGamma > 0)) {
    return {
      ok: false,
      stallSpeed_m_s: Vs,
      reason: `no climb gradient at ${V.toFixed(1)} m/s: thrust does not exceed drag`,
    };
  }
  const gamma = Math.asin(Math.min(sinGamma, 1));
  const R = (V * V) / (G0 * (TRANSITION_LOAD_FACTOR - 1));
  const hTransition = R * (1 - Math.cos(gamma));
  const airPath =
    hTransition >= screen_m
      ? Math.sqrt(R * R - (R - screen_m) * (R - screen_m))
      : R * Math.sin(gamma) + (screen_m - hTransition) / Math.tan(gamma);
  const airDistance_m = (airPath * (V - p.headwind)) / V;
  return {
    ...ground,
    airDistance_m,
    totalDistance_m: ground.groundRoll_m + airDistance_m,
    climbGradient: Math.tan(gamma),
    transitionRadius_m: R,
  };
}

export interface ClosedFormInput {
  weight_N: number;
  rho_kg_m3: number;
  wingArea_m2: number;
  CLmax: number;
  thrust_N: number;
  liftoffFactor?: number;
}

/** s = f²·W²/(g·ρ·S·CLmax·T); f = 1.1 gives Anderson's 1.21 form. */
export function takeoffGroundRollClosedForm(input: ClosedFormInput): number {
  const W = requirePositive('weight_N', input.weight_N, 'N');
  const rho = requirePositive('rho_kg_m3', input.rho_kg_m3, 'kg/m³');
  const S = requirePositive('wingArea_m2', input.wingArea_m2, 'm²');
  const CLmax = requirePositive('CLmax', input.CLmax);
  const T = requirePositive('thrust_N', input.thrust_N, 'N');
  const f = requireFinite('liftoffFactor', input.liftoffFactor ?? DEFAULT_LIFTOFF_FACTOR, 1, 1.5);
  return (f * f * W * W) / (G0 * rho * S * CLmax * T);
}
