/**
 * Piston or turboprop engine driving a propeller: shaft power lapse with density, optional
 * critical altitude, fuel flow BSFC × shaft power.
 *
 * Lapse: Gagg & Ferrar (1934) P/P_SL = 1.132σ − 0.132 for normally aspirated piston engines,
 * as cited by Gudmundsson, General Aviation Aircraft Design, ch. 7 (from memory); or σ^n
 * (common practice). A turbocharged or supercharged engine holds its sea-level power up to
 * the critical pressure altitude; above it the same lapse applies to σ/σ_crit, where σ_crit
 * is the density ratio at the critical pressure altitude on the same (ISA+ΔT) day, so power
 * is continuous there. With no critical altitude (0) the lapse applies to σ itself, so a hot
 * day costs a normally aspirated engine power even at sea level.
 * Fuel flow ṁ = BSFC·P_shaft; weight-specific c_p = BSFC·g0 (1/m) as in the Breguet forms
 * (Anderson, Introduction to Flight, ch. 6).
 */
import { standardAtmosphere, type AtmosphereState } from '../atmosphere.ts';
import { InputError, requireFinite, requirePositive } from '../errors.ts';
import type { PropellerPowerplant } from '../plan/schema.ts';
import { G0 } from '../units.ts';

/** Gagg–Ferrar reaches zero power at σ = 0.132/1.132; the fit says nothing beyond. */
export const GAGG_FERRAR_ZERO_SIGMA = 0.132 / 1.132;

/** Power ratio P/P_ref for a density ratio relative to the reference state. */
export function powerLapse(lapse: PropellerPowerplant['lapse'], sigmaRatio: number): number {
  requirePositive('sigma', sigmaRatio);
  if (lapse.model === 'gaggFerrar') return Math.max(0, 1.132 * sigmaRatio - 0.132);
  const n = requireFinite('lapse.exponent', lapse.exponent, 0);
  return Math.pow(sigmaRatio, n);
}

/**
 * σ/σ_crit on the day of `atm`: both states share the ISA offset ΔT = T − T_std(H_p), so
 * σ/σ_crit = (p/p_crit)·(T_crit/T) with T_crit = T_std(H_crit) + ΔT (common practice).
 */
function densityRatioToCritical(
  atm: AtmosphereState,
  pressureAltitude_m: number,
  criticalAltitude_m: number,
): number {
  const here = standardAtmosphere(pressureAltitude_m, 'pressureAltitude_m');
  const crit = standardAtmosphere(criticalAltitude_m, 'criticalAltitude_m');
  const T_crit = crit.T_K + (atm.T_K - here.T_K);
  if (!(T_crit > 0)) throw new InputError('atm.T_K', atm.T_K, 'a temperature above 0 K');
  return (atm.p_Pa / crit.p_Pa) * (T_crit / atm.T_K);
}

/** Maximum shaft power at the given air state and pressure altitude. */
export function maxShaftPower_W(
  prop: PropellerPowerplant,
  atm: AtmosphereState,
  pressureAltitude_m: number,
): number {
  const P_SL = requirePositive('maxPowerSL_W', prop.maxPowerSL_W, 'W');
  const H_crit = requireFinite('criticalAltitude_m', prop.criticalAltitude_m, 0, Infinity, 'm');
  requireFinite('pressureAltitude_m', pressureAltitude_m, -Infinity, Infinity, 'm');
  requirePositive('atm.sigma', atm.sigma);
  requirePositive('atm.p_Pa', atm.p_Pa, 'Pa');
  requirePositive('atm.T_K', atm.T_K, 'K');
  if (H_crit === 0) return P_SL * powerLapse(prop.lapse, atm.sigma);
  if (pressureAltitude_m <= H_crit) return P_SL;
  return P_SL * powerLapse(prop.lapse, densityRatioToCritical(atm, pressureAltitude_m, H_crit));
}

/** Fuel mass flow BSFC·P for a shaft power P ≥ 0. */
export function propFuelFlow_kg_s(prop: PropellerPowerplant, shaftPower_W: number): number {
  const bsfc = requirePositive('bsfc_kg_J', prop.bsfc_kg_J, 'kg/J');
  return bsfc * requireFinite('shaftPower_W', shaftPower_W, 0, Infinity, 'W');
}

/** Weight-specific power fuel consumption c_p = BSFC·g0, 1/m. */
export function weightSpecificBsfc_1_m(prop: PropellerPowerplant): number {
  return requirePositive('bsfc_kg_J', prop.bsfc_kg_J, 'kg/J') * G0;
}
