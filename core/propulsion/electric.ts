/**
 * Battery-electric drivetrain: efficiency chain, usable pack energy and the Peukert effect.
 *
 * Peukert after Traub, "Range and Endurance Estimates for Battery-Powered Aircraft",
 * J. Aircraft 48(2), 2011: discharge time t = Rt^(1−n)·(C/i)^n. In energy form (E = V·C,
 * P = V·i) the nominal energy lasts t = Rt^(1−n)·(E/P)^n, i.e. the pack drains as if at the
 * rate E/t = P·(P·Rt/E)^(n−1) — equal to P at n = 1 and larger than P when the pack is
 * discharged faster than its rated time.
 *
 * Applied only at or above the rated discharge power E/Rt: below it the same formula would
 * credit more than the rated energy (a drain below P), which the rated capacity does not
 * support — Traub fits the correction to discharges at and above the rated current (from
 * memory). So the drain is P for P·Rt/E < 1 (conservative; continuous at P = E/Rt).
 */
import { requireFinite, requirePositive } from '../errors.ts';
import type { Battery, ElectricPowerplant } from '../plan/schema.ts';

function fraction(field: string, v: number): number {
  requireFinite(field, v, 0, 1);
  return requirePositive(field, v);
}

/** η_motor·η_controller·η_prop: thrust power delivered per unit of battery power. */
export function chainEfficiency(el: ElectricPowerplant): number {
  return (
    fraction('motorEfficiency', el.motorEfficiency) *
    fraction('controllerEfficiency', el.controllerEfficiency) *
    fraction('propEfficiency', el.propEfficiency)
  );
}

/** Battery terminal power needed for a thrust power T·V ≥ 0. */
export function batteryPower_W(el: ElectricPowerplant, thrustPower_W: number): number {
  requireFinite('thrustPower_W', thrustPower_W, 0, Infinity, 'W');
  return thrustPower_W / chainEfficiency(el);
}

/** Energy that may be drawn: nominal energy × usable fraction. */
export function usableEnergy_J(battery: Battery): number {
  return (
    requirePositive('energy_J', battery.energy_J, 'J') *
    fraction('usableFraction', battery.usableFraction)
  );
}

/**
 * Rate at which the nominal energy is used up: P·(P·Rt/E_nominal)^(n−1) at or above the rated
 * discharge power E_nominal/Rt (Traub 2011), P below it.
 */
export function peukertDrainRate_W(battery: Battery, batteryPower_W: number): number {
  const P = requireFinite('batteryPower_W', batteryPower_W, 0, Infinity, 'W');
  const E = requirePositive('energy_J', battery.energy_J, 'J');
  const n = requireFinite('peukertExponent', battery.peukertExponent, 1, Infinity);
  const Rt = requirePositive('ratedDischargeTime_s', battery.ratedDischargeTime_s, 's');
  const x = (P * Rt) / E;
  if (!(x > 1)) return P;
  return P * Math.pow(x, n - 1);
}
