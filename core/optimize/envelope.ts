/**
 * The level-flight envelope at one altitude and weight: stall speed, the power (or thrust
 * power) required and available, and the maximum level speed where the two curves cross
 * on the fast side. Steady level flight, L = W, T = D (Anderson, Introduction to Flight,
 * ch. 6: power required and available, maximum velocity).
 */
import type { AtmosphereState } from '../atmosphere.ts';
import { minDragSpeed, minPowerSpeed, powerRequired_W, stallSpeed } from '../polar.ts';
import type { PolarCoefficients } from '../polar.ts';
import type { Plan } from '../plan/schema.ts';
import { availableThrustPower_W, type PropellerCurve } from '../propulsion/index.ts';
import { ambientAt, buildModel } from '../solver/model.ts';
import { G0 } from '../units.ts';
import { bisectEdge } from './search1d.ts';

/** Where and how heavy: everything the level-flight relations need. */
export interface FlightConditions {
  /** Altitude above mean sea level with the plan's QNH. */
  h_m: number;
  pressureAltitude_m: number;
  atm: AtmosphereState;
  mass_kg: number;
  weight_N: number;
  wingArea_m2: number;
  polar: PolarCoefficients;
  /** The propeller's efficiency curve (constant 1 for a jet; unused there). */
  propCurve: PropellerCurve;
}

/**
 * The air at h (the solver's own relation, Hp = h + Hp(QNH), ISA+ΔT; with `aloft` and a
 * winds-aloft table, the table's temperature there) and the weight.
 */
export function flightConditions(
  plan: Plan,
  h_m: number,
  mass_kg: number,
  aloft = false,
): FlightConditions {
  const model = buildModel(plan);
  const amb = ambientAt(model, h_m, aloft);
  return {
    h_m,
    pressureAltitude_m: amb.pressureAltitude_m,
    atm: amb.atm,
    mass_kg,
    weight_N: mass_kg * G0,
    wingArea_m2: model.S_m2,
    polar: model.polar,
    propCurve: model.power.prop,
  };
}

export function stallSpeedAt(c: FlightConditions): number {
  return stallSpeed(c.weight_N, c.atm.rho_kg_m3, c.wingArea_m2, c.polar.CLmax);
}

export function requiredPowerAt(c: FlightConditions, V_m_s: number): number {
  return powerRequired_W(c.polar, c.weight_N, c.atm.rho_kg_m3, c.wingArea_m2, V_m_s);
}

export function availablePowerAt(plan: Plan, c: FlightConditions, V_m_s: number): number {
  const pp = plan.aircraft.powerplant;
  return availableThrustPower_W(pp, c.atm, c.pressureAltitude_m, V_m_s, c.propCurve);
}

function excessPower_W(plan: Plan, c: FlightConditions, V_m_s: number): number {
  return availablePowerAt(plan, c, V_m_s) - requiredPowerAt(c, V_m_s);
}

/**
 * The highest speed at which level flight is possible at full power or thrust (the fast
 * crossing of available and required), or null when required exceeds available at every
 * speed above the stall. Bisected to 1e-7 relative.
 */
export function maxLevelSpeed(plan: Plan, c: FlightConditions): number | null {
  const vStall = stallSpeedAt(c);
  const rho = c.atm.rho_kg_m3;
  const candidates = [
    vStall,
    minPowerSpeed(c.polar, c.weight_N, rho, c.wingArea_m2),
    minDragSpeed(c.polar, c.weight_N, rho, c.wingArea_m2),
    Math.pow(3, 0.25) * minDragSpeed(c.polar, c.weight_N, rho, c.wingArea_m2),
  ].filter((v) => v >= vStall);
  let vGood = vStall;
  let best = -Infinity;
  for (const v of candidates) {
    const excess = excessPower_W(plan, c, v);
    if (excess > best) {
      best = excess;
      vGood = v;
    }
  }
  if (!(best > 0)) return null;
  let vBad = 2 * vGood;
  // Required power grows like V³ and available at most like V, so doubling ends quickly.
  for (let n = 0; n < 40 && excessPower_W(plan, c, vBad) > 0; n++) {
    vGood = vBad;
    vBad *= 2;
  }
  return bisectEdge((v) => excessPower_W(plan, c, v) > 0, vGood, vBad, 1e-7 * vBad);
}
