/**
 * Landing distance from the screen height: approach, flare, free roll and braking roll.
 *
 * Speeds (common practice; Raymer, Aircraft Design, ch. 17, from memory): approach
 * V_a = 1.3·V_stall, flare V_f = 1.23·V_stall, touchdown V_TD = 1.15·V_stall, V_stall with
 * the landing CLmax. Approach on a straight path of angle θ_a (3° common practice; steeper for
 * light aircraft and small UAVs) down to the flare height h_f = R·(1 − cos θ_a), then a
 * circular flare of radius R = V_f²/(0.2·g) (load factor 1.2) over R·sin θ_a. Free roll for a
 * few seconds at V_TD before the brakes act (3 s common practice; Raymer suggests about 1 s
 * for small aircraft and 3 s for large ones). Braking roll by integration of
 * m·dV/dt = −D − μ_brake·(W·cosθ − L) − W·sinθ from V_TD to rest (groundRun.ts): no reverse
 * thrust, idle thrust neglected (both common practice for a conservative estimate).
 * Over the ground each air segment is scaled by ground speed / airspeed.
 */
import { requireFinite, InputError } from '../errors.ts';
import { G0 } from '../units.ts';
import {
  groundRunParams,
  groundStallSpeed,
  integrateRun,
  runwayAcceleration,
} from './groundRun.ts';
import type { GroundAircraft, RunwayConditions } from './groundRun.ts';
import { surfaceFriction, type SurfaceFriction, type SurfaceId } from './surfaces.ts';
import { DEFAULT_SCREEN_HEIGHT_M, type FieldFailure } from './takeoff.ts';

export const APPROACH_SPEED_FACTOR = 1.3;
export const FLARE_SPEED_FACTOR = 1.23;
export const TOUCHDOWN_SPEED_FACTOR = 1.15;
export const DEFAULT_APPROACH_ANGLE_DEG = 3;
export const DEFAULT_FREE_ROLL_S = 3;
const FLARE_LOAD_FACTOR = 1.2;

export interface LandingInput extends GroundAircraft, RunwayConditions {
  /** Named surface (braking μ from surfaces.ts) or explicit coefficients. */
  surface: SurfaceId | SurfaceFriction;
  approachAngle_deg?: number;
  freeRoll_s?: number;
  screenHeight_m?: number;
}

export interface LandingOk {
  ok: true;
  stallSpeed_m_s: number;
  approachSpeed_m_s: number;
  touchdownSpeed_m_s: number;
  /** Ground distance from the screen to touchdown (approach + flare). */
  airDistance_m: number;
  freeRoll_m: number;
  brakingRoll_m: number;
  brakingTime_s: number;
  /** Free roll + braking roll. */
  groundRoll_m: number;
  totalDistance_m: number;
}
export type LandingResult = LandingOk | FieldFailure;

export function landingDistance(input: LandingInput): LandingResult {
  const p = groundRunParams(input, input);
  const mu = surfaceFriction(input.surface).muBrake;
  const theta =
    (requireFinite(
      'approachAngle_deg',
      input.approachAngle_deg ?? DEFAULT_APPROACH_ANGLE_DEG,
      0.5,
      15,
      'deg',
    ) *
      Math.PI) /
    180;
  const freeRoll_s = requireFinite(
    'freeRoll_s',
    input.freeRoll_s ?? DEFAULT_FREE_ROLL_S,
    0,
    30,
    's',
  );
  const screen_m = requireFinite(
    'screenHeight_m',
    input.screenHeight_m ?? DEFAULT_SCREEN_HEIGHT_M,
    0,
    100,
    'm',
  );
  if (p.CL_ground >= p.CLmax / TOUCHDOWN_SPEED_FACTOR ** 2) {
    throw new InputError(
      'CL_ground',
      p.CL_ground,
      `below CLmax/${TOUCHDOWN_SPEED_FACTOR}² = ${(p.CLmax / TOUCHDOWN_SPEED_FACTOR ** 2).toPrecision(4)}`,
    );
  }
  const Vs = groundStallSpeed(p);
  const Va = APPROACH_SPEED_FACTOR * Vs;
  const Vf = FLARE_SPEED_FACTOR * Vs;
  const Vtd = TOUCHDOWN_SPEED_FACTOR * Vs;
  const Vw = p.headwind;
  if (Math.abs(Vw) >= Vtd) {
    throw new InputError(
      'headwind_m_s',
      Vw,
      `smaller in size than the touchdown speed ${Vtd.toPrecision(4)} m/s`,
    );
  }
  const R = (Vf * Vf) / (G0 * (FLARE_LOAD_FACTOR - 1));
  const hFlare = R * (1 - Math.cos(theta));
  let approachPath = 0;
  let flarePath: number;
  if (hFlare >= screen_m) {
    flarePath = Math.sqrt(R * R - (R - screen_m) * (R - screen_m));
  } else {
    approachPath = (screen_m - hFlare) / Math.tan(theta);
    flarePath = R * Math.sin(theta);
  }
  const airDistance_m = (approachPath * (Va - Vw)) / Va + (flarePath * (Vf - Vw)) / Vf;
  const freeRoll_m = freeRoll_s * (Vtd - Vw);
  const run = integrateRun((V) => runwayAcceleration(p, V, 0, mu), Vtd, Vw, Vw, [0]);
  if (!run.ok) {
    return {
      ok: false,
      stallSpeed_m_s: Vs,
      reason: `braking and drag no longer decelerate the aircraft at ${run.stuckAt_m_s.toFixed(1)} m/s airspeed (downhill slope too steep for the surface)`,
    };
  }
  return {
    ok: true,
    stallSpeed_m_s: Vs,
    approachSpeed_m_s: Va,
    touchdownSpeed_m_s: Vtd,
    airDistance_m,
    freeRoll_m,
    brakingRoll_m: run.distance_m,
    brakingTime_s: run.time_s,
    groundRoll_m: freeRoll_m + run.distance_m,
    totalDistance_m: airDistance_m + freeRoll_m + run.distance_m,
  };
}
