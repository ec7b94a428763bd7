/**
 * Wind errors along a route are correlated: a forecast that is 5 kt too weak on one leg is
 * most likely too weak on the next. Each flight draws one shared standard-normal error (for
 * wind speed, and one for direction) and every leg (and every winds-aloft level) its own;
 * the leg's error is
 *
 *   z_leg = √ρ · z_shared + √(1 − ρ) · z_own,
 *
 * a standard normal again (variance ρ + (1 − ρ) = 1), with correlation ρ between any two legs
 * of the flight (the usual one-factor construction of equicorrelated normals; common
 * practice). ρ = 1: every leg has the same error; ρ = 0: independent.
 *
 * The default ρ = 0.8 is common practice for a pre-flight estimate (from memory, not a
 * published value): forecast wind errors stay correlated over several hundred kilometres,
 * more than most flights planned here, so most of a leg's error is shared by the flight.
 */
import { requireFinite } from '../errors.ts';
import type { NormalSource } from './random.ts';

/** Correlation of the wind errors of two legs of one flight when the plan does not say. */
export const DEFAULT_WIND_CORRELATION = 0.8;

/** The flight's shared errors and the weights that mix them with each leg's own. */
export interface SharedWindError {
  speed: number;
  direction: number;
  sharedWeight: number;
  ownWeight: number;
}

export function checkWindCorrelation(rho: number, field: string): number {
  return requireFinite(field, rho, 0, 1);
}

/** Draws the flight's shared errors (two normal deviates) for correlation ρ. */
export function drawSharedWindError(rng: NormalSource, rho: number): SharedWindError {
  const speed = rng.normal();
  const direction = rng.normal();
  return { speed, direction, sharedWeight: Math.sqrt(rho), ownWeight: Math.sqrt(1 - rho) };
}

/** A leg's standard-normal wind error from its own deviate and the flight's shared one. */
export function legWindError(own: number, shared: number, s: SharedWindError): number {
  return s.sharedWeight * shared + s.ownWeight * own;
}
