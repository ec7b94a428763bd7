/**
 * Speed schedules chosen by the aircraft's state: best range in the leg's wind (most ground
 * distance per unit of fuel or battery energy), best endurance (least consumption per unit
 * time), best rate of climb (most excess power per unit weight, with the engine's lapse) and
 * best glide ((L/D)max). Quasi-steady level flight, L = W, P_required = D·V (Anderson,
 * Introduction to Flight, ch. 6; in wind: maximise ground speed over consumption rate,
 * common practice of cruise planning).
 *
 * Every schedule keeps the stall margin: never below settings.stallFactor × V_stall. The
 * search runs over [stallFactor·V_stall, Mach 0.9] (the polar carries no compressibility);
 * a range or endurance optimum that needs more power than available is moved to the speed
 * where the power required meets the power available. Best endurance, best glide and best
 * range in still air are lift coefficients (optimumCL.ts), so no search is needed there
 * (except for a jet whose TSFC varies with Mach); best range in wind and best climb are
 * bounded 1-D searches (optimize1d.ts), warm-started from
 * the answer at the previous state.
 */
import type { PolarCoefficients } from '../polar.ts';
import { G0 } from '../units.ts';
import type { Ambient, FlightModel } from './model.ts';
import { maximizeBounded, rootBracketed } from './optimize1d.ts';
import { availablePower_W, consumption, shaftPowerFor } from './power.ts';
import { alongTrackSpeed } from './wind.ts';

/** Highest Mach number searched: the parabolic polar says nothing about transonic drag. */
export const MACH_CAP = 0.9;

export interface SpeedContext {
  model: FlightModel;
  mass_kg: number;
  amb: Ambient;
  headwind_m_s: number;
  crosswind_m_s: number;
  /** A previous optimum at a nearby state: lets the search start from it. */
  guess_m_s?: number;
  /** The previous optimum lay at this end of the speed range: check there first. */
  boundHint?: 'lo' | 'hi';
}

export interface SpeedChoice {
  tas_m_s: number;
  /** The unconstrained optimum (before the stall margin, the power limit or the Mach cap). */
  optimum_m_s: number;
  /** What moved the speed off the optimum. */
  limitedBy: 'stall' | 'power' | 'mach' | null;
  /** Where the optimum of the objective lies in the searched range ('lo'/'hi': at that end). */
  optimumAt?: 'lo' | 'hi' | null;
}

/** CD = CD0 + k·(CL − CLminD)² (+ the stall drag rise) without re-validating (core/polar.ts). */
export function dragCoefficientOf(c: PolarCoefficients, CL: number): number {
  const d = CL - c.CLminD;
  const r = c.riseCL;
  if (r !== undefined && CL > r) {
    const e = CL - r;
    return c.CD0 + c.k * d * d + (c.riseK ?? 0) * e * e;
  }
  return c.CD0 + c.k * d * d;
}

/** Drag in level flight at TAS V: D = ½ρV²S·CD(CL), CL = 2W/(ρV²S). */
export function levelDrag_N(ctx: SpeedContext, V: number): number {
  const q = 0.5 * ctx.amb.atm.rho_kg_m3 * V * V;
  const S = ctx.model.S_m2;
  const CL = (ctx.mass_kg * G0) / (q * S);
  return q * S * dragCoefficientOf(ctx.model.polar, CL);
}

function rateAt(ctx: SpeedContext, thrustPower_W: number, V: number): number {
  return consumption(ctx.model.power, ctx.amb, thrustPower_W, V, ctx.amb.atm.rho_kg_m3);
}

function availableAt(ctx: SpeedContext, V: number): number {
  return availablePower_W(ctx.model.power, ctx.amb, V, ctx.amb.atm.rho_kg_m3);
}

/** The propeller's efficiency changes with speed, so the optima are no longer lift coefficients. */
function variableEfficiency(ctx: SpeedContext): boolean {
  return ctx.model.power.prop.kind !== 'constant';
}

/** The lowest speed allowed: settings.stallFactor × V_stall (clean CLmax). */
export function stallMarginTas(ctx: SpeedContext): number {
  const { model, amb } = ctx;
  const Vs = Math.sqrt(
    (2 * ctx.mass_kg * G0) / (amb.atm.rho_kg_m3 * model.S_m2 * model.polar.CLmax),
  );
  return model.settings.stallFactor * Vs;
}

function searchBounds(ctx: SpeedContext): [number, number] {
  return [stallMarginTas(ctx), MACH_CAP * ctx.amb.atm.a_m_s];
}

const LIMIT_OF = { lo: 'stall', hi: 'mach' } as const;

function choose(ctx: SpeedContext, f: (V: number) => number, powerLimited: boolean): SpeedChoice {
  const [lo, hi] = searchBounds(ctx);
  if (!(hi > lo)) return { tas_m_s: lo, optimum_m_s: lo, limitedBy: 'mach', optimumAt: 'hi' };
  const m = maximizeBounded(f, lo, hi, ctx.guess_m_s, ctx.boundHint);
  const limitedBy = m.atBound === null ? null : LIMIT_OF[m.atBound];
  const choice: SpeedChoice = { tas_m_s: m.x, optimum_m_s: m.x, limitedBy, optimumAt: m.atBound };
  if (powerLimited) limitToPower(ctx, choice, lo, hi);
  return choice;
}

/** The speed flying at lift coefficient CL, kept inside the search range (still air). */
function atLiftCoefficient(ctx: SpeedContext, CL: number): SpeedChoice {
  const [lo, hi] = searchBounds(ctx);
  const V = Math.sqrt((2 * ctx.mass_kg * G0) / (ctx.amb.atm.rho_kg_m3 * ctx.model.S_m2 * CL));
  let choice: SpeedChoice;
  if (!(hi > lo)) choice = { tas_m_s: lo, optimum_m_s: lo, limitedBy: 'mach', optimumAt: 'hi' };
  else if (V <= lo) choice = { tas_m_s: lo, optimum_m_s: lo, limitedBy: 'stall', optimumAt: 'lo' };
  else if (V >= hi) choice = { tas_m_s: hi, optimum_m_s: hi, limitedBy: 'mach', optimumAt: 'hi' };
  else choice = { tas_m_s: V, optimum_m_s: V, limitedBy: null, optimumAt: null };
  if (hi > lo) limitToPower(ctx, choice, lo, hi);
  return choice;
}

/**
 * Best range: maximise ground speed along the course per unit consumption rate, i.e. ground
 * distance per kg of fuel (fuel burners) or per J of battery energy (electric). In still air
 * the optimum is a lift coefficient (optimumCL.ts) unless an idle floor flattens the
 * consumption there; otherwise a bounded 1-D search.
 */
export function bestRangeTas(ctx: SpeedContext): SpeedChoice {
  const hw = ctx.headwind_m_s;
  const cw = ctx.crosswind_m_s;
  if (hw === 0 && cw === 0 && !variableEfficiency(ctx)) {
    const power = ctx.model.power;
    if (machDependentTsfc(ctx)) {
      // TSFC rises with Mach: the optimum is no fixed lift coefficient; search below.
    } else if (power.type === 'electric' && power.peukertExponent !== 1) {
      const choice = electricStillAirRange(ctx);
      if (choice !== null) return choice;
    } else {
      const choice = atLiftCoefficient(ctx, ctx.model.optimumCL.range);
      if (choice.limitedBy !== null || aboveIdle(ctx, choice.tas_m_s)) return choice;
    }
  }
  return choose(
    ctx,
    (V) => alongTrackSpeed(V, hw, cw) / rateAt(ctx, levelDrag_N(ctx, V) * V, V),
    true,
  );
}

/**
 * Electric best range in still air with the Peukert correction, which applies only at or
 * above the rated discharge power (core/propulsion/electric.ts): the drain is P·max(1, x^(n−1))
 * with x = P·Rt/E, never below the Peukert drain P·x^(n−1) nor below P. So Traub's optimum
 * holds where it draws at least the rated power, the (L/D)max optimum where that draws at
 * most the rated power; otherwise the optimum is the speed between them that draws exactly
 * the rated power (both objectives fall away from it; the power rises with speed there, both
 * speeds being above the minimum-power speed). Null only if a limit moved one of the speeds
 * (the caller then searches).
 */
function electricStillAirRange(ctx: SpeedContext): SpeedChoice | null {
  const peukert = atLiftCoefficient(ctx, ctx.model.optimumCL.range);
  if (ratedPowerRatio(ctx, peukert.tas_m_s) >= 1) return peukert;
  const plain = atLiftCoefficient(ctx, ctx.model.optimumCL.glide);
  if (ratedPowerRatio(ctx, plain.tas_m_s) <= 1) return plain;
  if (peukert.limitedBy !== null || plain.limitedBy !== null) return null;
  const V = rootBracketed((v) => ratedPowerRatio(ctx, v) - 1, peukert.tas_m_s, plain.tas_m_s);
  return { tas_m_s: V, optimum_m_s: V, limitedBy: null, optimumAt: null };
}

/** Battery power in level flight at V over the rated discharge power E/Rt. */
function ratedPowerRatio(ctx: SpeedContext, V: number): number {
  const c = ctx.model.power;
  const P = levelDrag_N(ctx, V) * V;
  return (
    (shaftPowerFor(c, P, V, ctx.amb.atm.rho_kg_m3) / c.driveEfficiency) * c.ratedTimeOverEnergy_s_J
  );
}

/** The demand at V is above the idle floor (so consumption follows it). */
function aboveIdle(ctx: SpeedContext, V: number): boolean {
  const P = levelDrag_N(ctx, V) * V;
  const idle = rateAt(ctx, 0, V);
  return idle === 0 || rateAt(ctx, P, V) > idle * (1 + 1e-9);
}

/**
 * Best endurance: least fuel flow or battery drain per unit time. Every consumption model
 * grows with its demand (thrust for a jet, thrust power otherwise), so the optimum is the
 * speed of least demand, a lift coefficient (optimumCL.ts) whatever the wind. Where the
 * engine would run below idle, every slow enough speed costs the same idle flow; the speed of
 * least demand is still taken, so that the choice stays a smooth function of the state.
 */
export function bestEnduranceTas(ctx: SpeedContext): SpeedChoice {
  if (machDependentTsfc(ctx)) {
    return choose(ctx, (V) => 1 / rateAt(ctx, levelDrag_N(ctx, V) * V, V), true);
  }
  if (variableEfficiency(ctx)) {
    // Least shaft power D·V/η(V): a search, since η rises with V (propellerCurve.ts).
    const c = ctx.model.power;
    const rho = ctx.amb.atm.rho_kg_m3;
    return choose(ctx, (V) => -shaftPowerFor(c, levelDrag_N(ctx, V) * V, V, rho), true);
  }
  return atLiftCoefficient(ctx, ctx.model.optimumCL.endurance);
}

/**
 * A jet whose TSFC grows with Mach (core/propulsion/jet.ts): its range and endurance optima
 * are no longer fixed lift coefficients, so they are searched like the range in wind.
 */
function machDependentTsfc(ctx: SpeedContext): boolean {
  return ctx.model.power.type === 'jet' && ctx.model.power.tsfcMachFactor !== null;
}

/** Best rate of climb at a throttle setting: most excess thrust power τ·P_avail − D·V. */
export function bestClimbTas(ctx: SpeedContext, throttle: number): SpeedChoice {
  return choose(ctx, (V) => throttle * availableAt(ctx, V) - levelDrag_N(ctx, V) * V, false);
}

/** Best glide: the (L/D)max speed, V = √(2W/(ρ·S·CL*)) (Anderson, Introduction to Flight, ch. 6). */
export function bestGlideTas(ctx: SpeedContext): SpeedChoice {
  const { model, amb } = ctx;
  const CL = model.optimumCL.glide;
  const V = Math.sqrt((2 * ctx.mass_kg * G0) / (amb.atm.rho_kg_m3 * model.S_m2 * CL));
  const [lo] = searchBounds(ctx);
  return V < lo
    ? { tas_m_s: lo, optimum_m_s: V, limitedBy: 'stall', optimumAt: 'lo' }
    : { tas_m_s: V, optimum_m_s: V, limitedBy: null, optimumAt: null };
}

/**
 * When the chosen speed needs more than the maximum power, move to where the power required
 * meets the power available on the side of the optimum (fast or slow side of the power
 * curve). When no speed in the bracket can be flown level, the choice is left unchanged and
 * the leg reports the shortfall.
 */
function limitToPower(ctx: SpeedContext, choice: SpeedChoice, lo: number, hi: number): void {
  const excess = (V: number) => availableAt(ctx, V) - levelDrag_N(ctx, V) * V;
  const V = choice.tas_m_s;
  if (excess(V) >= 0) return;
  const best = maximizeBounded(excess, lo, hi).x;
  if (!(excess(best) > 0)) return;
  choice.tas_m_s = rootBracketed(excess, best, V);
  choice.limitedBy = 'power';
}
