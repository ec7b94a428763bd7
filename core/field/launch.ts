/**
 * Launch of a UAV without a runway: hand launch or catapult (rail, bungee).
 *
 * Speed check: the airspeed at release must be at least factor × V_stall, factor 1.1–1.2
 * (common practice; default 1.15), V_stall = √(2W/(ρ·S·CLmax)). Release airspeed = release
 * ground speed + headwind. Margin (V_release − V_required)/V_required in the ok / tight /
 * fails semantics of core/solver/types.ts `Check`.
 *
 * Catapult (elementary mechanics, common practice): a stroke s accelerating the aircraft from
 * rest to ground speed V averages a = V²/(2s); the kinetic energy ½·m·V² must come from the
 * stored energy E times the transfer efficiency η (carriage, bungee and friction losses), so
 * the energy gives V = √(2ηE/m) when no release speed is stated.
 */
import { requireFinite, requirePositive, InputError } from '../errors.ts';
import type { CheckState } from '../solver/types.ts';
import { G0 } from '../units.ts';
import { DEFAULT_TIGHT_MARGIN, marginState } from './check.ts';

export const DEFAULT_LAUNCH_FACTOR = 1.15;

export interface CatapultInput {
  stroke_m: number;
  /** Stored energy (spring, bungee, pneumatic). */
  energy_J?: number;
  /** Fraction of the stored energy that ends up as the aircraft's kinetic energy; 1 if omitted. */
  efficiency?: number;
}

export interface LaunchInput {
  mass_kg: number;
  wingArea_m2: number;
  CLmax: number;
  rho_kg_m3: number;
  /** Ground speed at release (hand throw, or catapult end speed). Optional with a catapult energy. */
  launchSpeed_m_s?: number;
  headwind_m_s?: number;
  /** Minimum release airspeed / V_stall; DEFAULT_LAUNCH_FACTOR if omitted. */
  factor?: number;
  tightMargin?: number;
  catapult?: CatapultInput;
}

export interface CatapultResult {
  meanAcceleration_m_s2: number;
  meanAcceleration_g: number;
  /** Kinetic energy at the required release speed (0 when the headwind alone suffices). */
  requiredEnergy_J: number;
  /** η·E, when the energy is given. */
  deliveredEnergy_J: number | null;
}

export interface LaunchResult {
  stallSpeed_m_s: number;
  requiredAirspeed_m_s: number;
  releaseGroundSpeed_m_s: number;
  releaseAirspeed_m_s: number;
  margin: number;
  state: CheckState;
  catapult: CatapultResult | null;
}

export function launchCheck(input: LaunchInput): LaunchResult {
  const m = requireFinite('mass_kg', input.mass_kg, 1e-3, 1e5, 'kg');
  const S = requireFinite('wingArea_m2', input.wingArea_m2, 1e-3, 500, 'm²');
  const CLmax = requireFinite('CLmax', input.CLmax, 0.1, 6);
  const rho = requireFinite('rho_kg_m3', input.rho_kg_m3, 0.05, 1.6, 'kg/m³');
  const Vw = requireFinite('headwind_m_s', input.headwind_m_s ?? 0, -50, 50, 'm/s');
  const factor = requireFinite('factor', input.factor ?? DEFAULT_LAUNCH_FACTOR, 1, 2);
  const tight = requireFinite('tightMargin', input.tightMargin ?? DEFAULT_TIGHT_MARGIN, 0, 0.5);
  const Vs = Math.sqrt((2 * m * G0) / (rho * S * CLmax));
  const requiredAirspeed = factor * Vs;

  const cat = input.catapult;
  let stroke_m = 0;
  let delivered: number | null = null;
  if (cat) {
    stroke_m = requireFinite('catapult.stroke_m', cat.stroke_m, 0.05, 200, 'm');
    const eta = requireFinite('catapult.efficiency', cat.efficiency ?? 1, 0.05, 1);
    if (cat.energy_J !== undefined)
      delivered = eta * requirePositive('catapult.energy_J', cat.energy_J, 'J');
  }
  let Vg: number;
  if (input.launchSpeed_m_s !== undefined) {
    Vg = requireFinite('launchSpeed_m_s', input.launchSpeed_m_s, 0, 150, 'm/s');
  } else if (delivered !== null) {
    Vg = Math.sqrt((2 * delivered) / m);
  } else {
    throw new InputError('launchSpeed_m_s', undefined, 'given, or a catapult with energy_J');
  }
  const releaseAirspeed = Vg + Vw;
  const margin = (releaseAirspeed - requiredAirspeed) / requiredAirspeed;
  let catapult: CatapultResult | null = null;
  if (cat) {
    const a = (Vg * Vg) / (2 * stroke_m);
    const Vneeded = Math.max(0, requiredAirspeed - Vw);
    catapult = {
      meanAcceleration_m_s2: a,
      meanAcceleration_g: a / G0,
      requiredEnergy_J: 0.5 * m * Vneeded * Vneeded,
      deliveredEnergy_J: delivered,
    };
  }
  return {
    stallSpeed_m_s: Vs,
    requiredAirspeed_m_s: requiredAirspeed,
    releaseGroundSpeed_m_s: Vg,
    releaseAirspeed_m_s: releaseAirspeed,
    margin,
    state: marginState(margin, tight),
    catapult,
  };
}
