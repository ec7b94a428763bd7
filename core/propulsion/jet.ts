/**
 * Turbojet/turbofan model: maximum thrust lapses with density, fuel flow is TSFC × thrust.
 *
 * T_max = T_SL·σ^n (common practice, n ≈ 0.7–1; Anderson, Aircraft Performance and Design,
 * ch. 3, from memory). Fuel flow ṁ = TSFC·T with TSFC in kg/(N·s); the weight-specific
 * c_t = TSFC·g0 (1/s) is the consumption used by the Breguet forms (Anderson, Introduction
 * to Flight, ch. 6).
 *
 * Neither the maximum thrust nor the TSFC varies with Mach number here (real engines lose
 * thrust and burn more per unit thrust as Mach rises): use values for the cruise Mach.
 */
import type { AtmosphereState } from '../atmosphere.ts';
import { requireFinite, requirePositive } from '../errors.ts';
import type { JetPowerplant } from '../plan/schema.ts';
import { G0 } from '../units.ts';

/** Maximum thrust at the given air state, T_SL·σ^n. */
export function maxThrust_N(jet: JetPowerplant, atm: AtmosphereState): number {
  const T_SL = requirePositive('maxThrustSL_N', jet.maxThrustSL_N, 'N');
  const n = requireFinite('thrustLapseExponent', jet.thrustLapseExponent, 0);
  const sigma = requirePositive('atm.sigma', atm.sigma);
  return T_SL * Math.pow(sigma, n);
}

/** Fuel mass flow TSFC·T for a thrust T ≥ 0. */
export function jetFuelFlow_kg_s(jet: JetPowerplant, thrust_N: number): number {
  const tsfc = requirePositive('tsfc_kg_Ns', jet.tsfc_kg_Ns, 'kg/(N·s)');
  return tsfc * requireFinite('thrust_N', thrust_N, 0, Infinity, 'N');
}

/** Weight-specific thrust fuel consumption c_t = TSFC·g0, 1/s. */
export function weightSpecificTsfc_1_s(jet: JetPowerplant): number {
  return requirePositive('tsfc_kg_Ns', jet.tsfc_kg_Ns, 'kg/(N·s)') * G0;
}
