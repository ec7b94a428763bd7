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
 * where the power required meets the power available.
 */
import { dragCoefficient, maxLiftToDrag } from '../polar.ts';
import { availableThrustPower_W, consumptionRate } from '../propulsion/index.ts';
import { G0 } from '../units.ts';
import type { Ambient, FlightModel } from './model.ts';
import { maximizeBounded, rootBracketed } from './optimize1d.ts';
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
}

export interface SpeedChoice {
  tas_m_s: number;
  /** The unconstrained optimum (before the stall margin, the power limit or the Mach cap). */
  optimum_m_s: number;
  /** What moved the speed off the optimum. */
  limitedBy: 'stall' | 'power' | 'mach' | null;
}

/** Drag in level flight at TAS V: D = ½ρV²S·CD(CL), CL = 2W/(ρV²S). */
export function levelDrag_N(ctx: SpeedContext, V: number): number {
  const q = 0.5 * ctx.amb.atm.rho_kg_m3 * V * V;
  const S = ctx.model.S_m2;
  const CL = (ctx.mass_kg * G0) / (q * S);
  return q * S * dragCoefficient(ctx.model.polar, CL);
}

function rateAt(ctx: SpeedContext, thrustPower_W: number, V: number): number {
  return consumptionRate(ctx.model.pp, thrustPower_W, V, ctx.amb.atm, ctx.amb.pressureAltitude_m);
}

function availableAt(ctx: SpeedContext, V: number): number {
  return availableThrustPower_W(ctx.model.pp, ctx.amb.atm, ctx.amb.pressureAltitude_m, V);
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

function choose(ctx: SpeedContext, f: (V: number) => number, powerLimited: boolean): SpeedChoice {
  const [lo, hi] = searchBounds(ctx);
  if (!(hi > lo)) return { tas_m_s: lo, optimum_m_s: lo, limitedBy: 'mach' };
  const m = maximizeBounded(f, lo, hi, ctx.guess_m_s);
  const limitedBy = m.atBound === 'lo' ? 'stall' : m.atBound === 'hi' ? 'mach' : null;
  const choice: SpeedChoice = { tas_m_s: m.x, optimum_m_s: m.x, limitedBy };
  if (powerLimited) limitToPower(ctx, choice, lo, hi);
  return choice;
}

/**
 * Best range: maximise ground speed along the course per unit consumption rate, i.e. ground
 * distance per kg of fuel (fuel burners) or per J of battery energy (electric).
 */
export function bestRangeTas(ctx: SpeedContext): SpeedChoice {
  const hw = ctx.headwind_m_s;
  const cw = ctx.crosswind_m_s;
  return choose(
    ctx,
    (V) => alongTrackSpeed(V, hw, cw) / rateAt(ctx, levelDrag_N(ctx, V) * V, V),
    true,
  );
}

/**
 * Best endurance: least fuel flow or battery drain per unit time. Where the engine would run
 * below idle, every slow enough speed costs the same idle flow; the speed of least demand
 * (thrust for a jet, thrust power otherwise — the optimum of the unfloored model) is taken,
 * so that the choice stays a smooth function of the state.
 */
export function bestEnduranceTas(ctx: SpeedContext): SpeedChoice {
  const power = (V: number) => levelDrag_N(ctx, V) * V;
  const choice = choose(ctx, (V) => -rateAt(ctx, power(V), V), true);
  const V = choice.tas_m_s;
  const idle = rateAt(ctx, 0, V);
  if (idle > 0 && rateAt(ctx, power(V), V) <= idle * (1 + 1e-9)) {
    const demand =
      ctx.model.pp.type === 'jet' ? (v: number) => -levelDrag_N(ctx, v) : (v: number) => -power(v);
    return choose(ctx, demand, true);
  }
  return choice;
}

/** Best rate of climb at a throttle setting: most excess thrust power τ·P_avail − D·V. */
export function bestClimbTas(ctx: SpeedContext, throttle: number): SpeedChoice {
  return choose(ctx, (V) => throttle * availableAt(ctx, V) - levelDrag_N(ctx, V) * V, false);
}

/** Best glide: the (L/D)max speed, V = √(2W/(ρ·S·CL*)) (Anderson, Introduction to Flight, ch. 6). */
export function bestGlideTas(ctx: SpeedContext): SpeedChoice {
  const { model, amb } = ctx;
  const CL = maxLiftToDrag(model.polar).CL;
  const V = Math.sqrt((2 * ctx.mass_kg * G0) / (amb.atm.rho_kg_m3 * model.S_m2 * CL));
  const [lo] = searchBounds(ctx);
  return V < lo
    ? { tas_m_s: lo, optimum_m_s: V, limitedBy: 'stall' }
    : { tas_m_s: V, optimum_m_s: V, limitedBy: null };
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
