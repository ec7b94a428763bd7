/**
 * How fast a speed schedule's true airspeed changes with altitude along a path, dV/dh.
 *
 * Why: a climb or descent at constant CAS, EAS or Mach (or at a best-rate or best-glide
 * speed, which move with the air) accelerates or decelerates in true airspeed, and part of
 * the excess power goes into kinetic energy. The energy equation d(h + V²/2g)/dt = (T − D)V/W
 * gives ḣ·(1 + (V/g)·dV/dh) = (T − D)V/W: the acceleration (energy-share) factor
 * 1 + (V/g)·dV/dh (Anderson, Aircraft Performance and Design, ch. 5, accelerated rate of
 * climb, from memory; Raymer, Aircraft Design, ch. 17). dV/dh is taken at constant mass (the
 * mass term, from the fuel burnt during the climb, is orders of magnitude smaller): 0 for a
 * constant TAS; for the best-rate schedule by implicit differentiation of its optimality
 * condition ∂f/∂V = 0, f = τ·P_avail − D·V: dV/dh = −f_Vh/f_VV (central differences of the
 * smooth f, so the slope carries none of the search's rounding; at the stall-margin or Mach
 * bound, the slope of that bound); for a TAS ∝ ρ^−½ (constant CL, best glide) from dρ/dh; for
 * every other schedule by a difference of its TAS in the air ±PROBE_STEP_M about the point
 * (one-sided near an altitude where the air's gradient jumps, see stencilAt).
 */
import { InputError } from '../errors.ts';
import { airFresh, ambientFresh, fixedSpeedTas, type Ambient, type FlightModel } from './model.ts';
import type { FlightPath } from './point.ts';
import { availablePower_W } from './power.ts';
import { scheduleTas, type ScheduleIo, type ScheduleMemo } from './schedule.ts';
import {
  levelDrag_N,
  MACH_CAP,
  stallMarginTas,
  type SpeedChoice,
  type SpeedContext,
} from './speeds.ts';

/** Altitude step of the differences for dV/dh. */
export const PROBE_STEP_M = 1;

/** How dV/dh is differenced at a point: centrally, or one-sided away from a gradient break. */
export type Stencil = 'central' | 'forward' | 'backward';

/**
 * The stencil at h: central over ±PROBE_STEP_M, unless an altitude where the air's or the
 * engine's gradient jumps (model.breaks_m) lies within PROBE_STEP_M; then a one-sided
 * second-order difference on the side the point lies. At the break itself, the side of the
 * piece being flown (a segment stops and restarts at every break, segment.ts): the side the
 * path comes from where the piece ends there (`pieceEnd_m`), else the side it heads into (up
 * for a climb, down for a descent or glide).
 */
export function stencilAt(
  model: FlightModel,
  path: FlightPath,
  h: number,
  pieceEnd_m?: number,
): Stencil {
  const d = PROBE_STEP_M;
  const breaks = path.aloft !== undefined ? model.aloftBreaks_m : model.breaks_m;
  for (let i = 0; i < breaks.length; i++) {
    const b = breaks[i]!;
    if (b <= h - d || b >= h + d) continue;
    if (b !== h) return b < h ? 'forward' : 'backward';
    const up = (path.vertical.kind === 'climb') !== (b === pieceEnd_m);
    return up ? 'forward' : 'backward';
  }
  return 'central';
}

/** What a probe evaluates: the schedule's TAS, or (for a TAS ∝ ρ^−½) the density. */
const enum Probe {
  Tas,
  Density,
}

/** Probe state shared by the calls of one slope (no allocation in the right-hand side). */
const io: ScheduleIo = { headwind_m_s: 0, crosswind_m_s: 0, speedLimitedBy: null };

/** The probed quantity at altitude h; null outside the air (or the schedule's range). */
function probeAt(
  what: Probe,
  model: FlightModel,
  path: FlightPath,
  mass_kg: number,
  h: number,
  memo: ScheduleMemo,
): number | null {
  const aloft = path.aloft !== undefined;
  try {
    if (what === Probe.Density) return airFresh(model, h, aloft).rho_kg_m3;
    const s = path.speed;
    if (s.kind === 'fixed') return fixedSpeedTas(s.speed, airFresh(model, h, aloft), path.field);
    return scheduleTas(model, path, mass_kg, ambientFresh(model, h, aloft), memo, io);
  } catch (e) {
    if (e instanceof InputError) return null;
    throw e;
  }
}

/**
 * d(probe)/dh at h by the stencil (g0: the probed value at h); a one-sided stencil where one
 * side of a central one is outside the air; 0 where neither side can be had.
 */
function probeSlope(
  what: Probe,
  model: FlightModel,
  path: FlightPath,
  mass_kg: number,
  h: number,
  g0: number,
  stencil: Stencil,
  memo: ScheduleMemo,
): number {
  const d = PROBE_STEP_M;
  const near = (memo.up ??= {});
  const far = (memo.down ??= {});
  if (stencil === 'central') {
    const up = probeAt(what, model, path, mass_kg, h + d, near);
    const down = probeAt(what, model, path, mass_kg, h - d, far);
    if (up !== null && down !== null) return (up - down) / (2 * d);
    stencil = up !== null ? 'forward' : 'backward';
  }
  const s = stencil === 'forward' ? 1 : -1;
  const g1 = probeAt(what, model, path, mass_kg, h + s * d, near);
  const g2 = g1 === null ? null : probeAt(what, model, path, mass_kg, h + 2 * s * d, far);
  if (g1 === null || g2 === null) return 0;
  return (s * (-3 * g0 + 4 * g1 - g2)) / (2 * d);
}

/**
 * dV/dh of the schedule at (mass, amb.h_m) where it flies V (see the header): 0 at a constant
 * TAS; for a TAS ∝ ρ^−½ at constant mass (constant CL, best glide: a lift coefficient, or the
 * stall margin) −V/(2ρ)·dρ/dh; implicit differentiation for the best-rate schedule; a
 * difference of the schedule's TAS otherwise.
 */
export function scheduleSlope(
  model: FlightModel,
  path: FlightPath,
  mass_kg: number,
  amb: Ambient,
  V_m_s: number,
  memo: ScheduleMemo,
  from: ScheduleIo,
): number {
  const s = path.speed;
  if (s.kind === 'constantTas' || (s.kind === 'fixed' && s.speed.kind === 'tas')) return 0;
  const h = amb.h_m;
  const stencil = stencilAt(model, path, h, memo.pieceEnd_m);
  if (s.kind === 'constantCL' || s.kind === 'bestGlide') {
    const rho = amb.atm.rho_kg_m3;
    const slope = probeSlope(Probe.Density, model, path, mass_kg, h, rho, stencil, memo);
    return (-V_m_s / (2 * rho)) * slope;
  }
  if (s.kind === 'bestClimb') {
    const slope = bestClimbSlope(model, path, mass_kg, amb, V_m_s, from.speedLimitedBy, stencil);
    if (slope !== null) return slope;
  }
  io.headwind_m_s = from.headwind_m_s;
  io.crosswind_m_s = from.crosswind_m_s;
  return probeSlope(Probe.Tas, model, path, mass_kg, h, V_m_s, stencil, memo);
}

/** Relative speed step of the implicit differentiation. */
const SPEED_STEP = 1e-3;

/** Excess thrust power τ·P_avail − D·V of level flight at V in the air of `ctx`. */
function excessPower(ctx: SpeedContext, tau: number, V: number): number {
  return (
    tau * availablePower_W(ctx.model.power, ctx.amb, V, ctx.amb.atm.rho_kg_m3) -
    levelDrag_N(ctx, V) * V
  );
}

/** ∂f/∂V of excessPower by a central difference of step dv. */
function excessSlope(ctx: SpeedContext, tau: number, V: number, dv: number): number {
  return (excessPower(ctx, tau, V + dv) - excessPower(ctx, tau, V - dv)) / (2 * dv);
}

/** What bestClimbSlope differences over altitude. */
const enum ClimbProbe {
  /** ∂f/∂V at the optimum speed (interior optimum). */
  ExcessSlope,
  /** The stall-margin speed (optimum at the low bound). */
  StallMargin,
  /** The Mach cap (optimum at the high bound). */
  MachCap,
}

function climbProbe(
  what: ClimbProbe,
  ctx: SpeedContext,
  tau: number,
  V: number,
  dv: number,
): number {
  if (what === ClimbProbe.StallMargin) return stallMarginTas(ctx);
  if (what === ClimbProbe.MachCap) return MACH_CAP * ctx.amb.atm.a_m_s;
  return excessSlope(ctx, tau, V, dv);
}

/**
 * dV/dh of the best-rate schedule (see the header); null where f is not curved downward (the
 * caller then differences the schedule itself) or the air ends within the stencil.
 */
function bestClimbSlope(
  model: FlightModel,
  path: FlightPath,
  mass_kg: number,
  amb: Ambient,
  V: number,
  limitedBy: SpeedChoice['limitedBy'],
  stencil: Stencil,
): number | null {
  const tau = path.vertical.kind === 'climb' ? path.vertical.throttle : 1;
  const ctx: SpeedContext = { model, mass_kg, amb, headwind_m_s: 0, crosswind_m_s: 0 };
  const dv = SPEED_STEP * V;
  let fVV = 1;
  let what = ClimbProbe.ExcessSlope;
  if (limitedBy === 'stall') what = ClimbProbe.StallMargin;
  else if (limitedBy === 'mach') what = ClimbProbe.MachCap;
  else {
    fVV =
      (excessPower(ctx, tau, V + dv) -
        2 * excessPower(ctx, tau, V) +
        excessPower(ctx, tau, V - dv)) /
      (dv * dv);
    if (!(fVV < 0)) return null;
  }
  const g0 = climbProbe(what, ctx, tau, V, dv);
  const d = PROBE_STEP_M;
  const aloft = path.aloft !== undefined;
  const at = [0, 0];
  const offsets =
    stencil === 'central' ? [d, -d] : stencil === 'forward' ? [d, 2 * d] : [-d, -2 * d];
  try {
    for (let i = 0; i < 2; i++) {
      ctx.amb = ambientFresh(model, amb.h_m + offsets[i]!, aloft);
      at[i] = climbProbe(what, ctx, tau, V, dv);
    }
  } catch (e) {
    if (e instanceof InputError) return null;
    throw e;
  }
  const s = stencil === 'backward' ? -1 : 1;
  const slope =
    stencil === 'central'
      ? (at[0]! - at[1]!) / (2 * d)
      : (s * (-3 * g0 + 4 * at[0]! - at[1]!)) / (2 * d);
  return what === ClimbProbe.ExcessSlope ? -slope / fVV : slope;
}
