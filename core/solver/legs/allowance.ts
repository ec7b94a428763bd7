/**
 * Take-off and landing allowances: a fixed amount of fuel or battery energy, a fraction of
 * the current mass (fuel burners), or a time at the current altitude: for take-off at maximum
 * power or thrust (the jet's thrust power taken at 1.2 × V_stall with CLmaxFlaps when given,
 * common practice for the take-off safety speed); for landing at approach power, the
 * level-flight power required D·V at 1.3 × V_stall with CLmaxFlaps when given (common practice
 * for the approach speed; the clean polar's drag at that CL, so flap and gear drag are not in
 * it), never below the engine's idle consumption. The consumption is constant over the time
 * (the air and, for the allowance, the mass are those at its start), so the amount is
 * rate × time.
 */
import type { LandingLeg, TakeoffLeg } from '../../plan/schema.ts';
import { availableThrustPower_W, consumptionRate } from '../../propulsion/index.ts';
import { G0 } from '../../units.ts';
import { ambientAt, stallTas, type FlightModel } from '../model.ts';
import { dragCoefficientOf } from '../speeds.ts';
import { fmt } from '../point.ts';
import type { MissionState } from '../segment.ts';
import {
  baseResult,
  consumableWord,
  flightState,
  legName,
  refusedLeg,
  type LegContext,
  type LegOutcome,
} from './common.ts';

/** Take-off safety speed over the stall speed (common practice). */
const TAKEOFF_SPEED_FACTOR = 1.2;
/** Approach speed over the stall speed in the landing configuration (common practice). */
export const APPROACH_SPEED_FACTOR = 1.3;

/** Thrust power of the time allowance: maximum for take-off, approach power for landing. */
function allowancePower(
  model: FlightModel,
  kind: 'takeoff' | 'landing',
  mass_kg: number,
  h_m: number,
): { P_W: number; V_m_s: number } {
  const amb = ambientAt(model, h_m);
  const factor = kind === 'takeoff' ? TAKEOFF_SPEED_FACTOR : APPROACH_SPEED_FACTOR;
  const V = factor * stallTas(model, mass_kg, amb.atm, model.CLmaxFlaps);
  if (kind === 'takeoff') {
    return {
      P_W: availableThrustPower_W(model.pp, amb.atm, amb.pressureAltitude_m, V, model.power.prop),
      V_m_s: V,
    };
  }
  const q = 0.5 * amb.atm.rho_kg_m3 * V * V;
  const CL = (mass_kg * G0) / (q * model.S_m2);
  return { P_W: q * model.S_m2 * dragCoefficientOf(model.polar, CL) * V, V_m_s: V };
}

export function flyAllowance(
  ctx: LegContext,
  leg: TakeoffLeg | LandingLeg,
  start: MissionState,
): LegOutcome {
  const model = ctx.model;
  const a = leg.allowance;
  const fuel = model.consumable === 'fuel';
  let amount: number;
  let time = 0;
  if (a.by === 'fuel') {
    if (!fuel)
      return refusedLeg(
        ctx,
        leg,
        start,
        'an allowance in fuel needs a fuel-burning powerplant (use energy or time)',
      );
    amount = a.fuel_kg;
  } else if (a.by === 'energy') {
    if (fuel)
      return refusedLeg(
        ctx,
        leg,
        start,
        'an allowance in battery energy needs an electric powerplant (use fuel or time)',
      );
    amount = a.energy_J;
  } else if (a.by === 'massFraction') {
    if (!fuel)
      return refusedLeg(
        ctx,
        leg,
        start,
        'an allowance as a mass fraction needs a fuel-burning powerplant (use energy or time)',
      );
    amount = a.fraction * start.mass_kg;
  } else {
    try {
      const amb = ambientAt(model, start.h_m);
      const { P_W, V_m_s } = allowancePower(model, leg.kind, start.mass_kg, start.h_m);
      amount =
        consumptionRate(model.pp, P_W, V_m_s, amb.atm, amb.pressureAltitude_m, model.power.prop) *
        a.time_s;
    } catch (e) {
      return refusedLeg(ctx, leg, start, e instanceof Error ? e.message : String(e));
    }
    time = a.time_s;
  }
  const short = amount > start.left;
  const used = short ? Math.max(start.left, 0) : amount;
  const spentTime = short && amount > 0 ? (time * used) / amount : time;
  const end: MissionState = {
    ...start,
    t_s: start.t_s + spentTime,
    mass_kg: fuel ? start.mass_kg - used : start.mass_kg,
    left: start.left - used,
  };
  const unit = fuel ? 'kg' : 'J';
  const error = short
    ? `${legName(ctx.index, leg)}: ${consumableWord(model)} exhausted: the allowance needs ${fmt(amount)} ${unit} but ${fmt(start.left)} ${unit} were left`
    : null;
  const r = baseResult(ctx, leg, start, end, short ? 'failed' : 'flown', error);
  if (short) r.stopCause = 'consumable';
  const s0 = flightState(model, start);
  const s1 = flightState(model, end);
  r.series = {
    t_s: [s0.t_s, s1.t_s],
    x_m: [s0.x_m, s1.x_m],
    h_m: [s0.h_m, s1.h_m],
    mass_kg: [s0.mass_kg, s1.mass_kg],
    fuel_kg: [s0.fuel_kg, s1.fuel_kg],
    energy_J: [s0.energy_J, s1.energy_J],
    tas_m_s: [0, 0],
  };
  return {
    result: r,
    end,
    failed: short,
    warnings: [],
    checks: { minStallRatio: null, power: null, climb: null, maxAltitude_m: null },
  };
}
