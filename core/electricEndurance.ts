/**
 * Closed-form range and endurance of battery-electric aircraft.
 *
 * Hepperle, "Electric Flight – Potential and Limitations", NATO STO-MP-AVT-209 (2012):
 * R = E*·η·(1/g)·(L/D)·(m_batt/m), constant mass, no Peukert loss.
 * Traub, "Range and Endurance Estimates for Battery-Powered Aircraft", J. Aircraft 48(2),
 * 2011: with Peukert's law the pack lasts t = Rt^(1−n)·(η·E/P_req)^n at a constant power
 * required P_req (energy form of t = Rt^(1−n)·(C/i)^n, i = P_req/(η·V_batt)); = η·E/P_req at
 * n = 1. Range at constant speed is V·t. With P_req = ½ρV³S·CD0 + 2W²k/(ρVS), maximising
 * V·P_req^(−n) gives the best-range speed V = √(2W/(ρS))·[k(n+1)/(CD0(3n−1))]^¼ (derived
 * here from d ln(V·P^−n)/dV = 0; equal to the minimum-drag speed at n = 1).
 */
import { InputError, requireFinite, requirePositive } from './errors.ts';
import { G0 } from './units.ts';

/** Peukert exponents outside [1, 2] are not batteries (n < 1 is invalid; Traub 2011). */
const MAX_PEUKERT = 2;

function efficiency(eta: number): number {
  requireFinite('eta', eta, 0, 1);
  return requirePositive('eta', eta);
}

function finite(value: number, field: string, input: number): number {
  if (!Number.isFinite(value)) throw new InputError(field, input, 'a value giving a finite result');
  return value;
}

/** Hepperle (2012): R = E*·η·(L/D)·(m_batt/m)/g0, in m. */
export function rangeElectricHepperle(a: {
  specificEnergy_J_kg: number;
  eta: number;
  LD: number;
  batteryMassFraction: number;
}): number {
  const Estar = requirePositive('specificEnergy_J_kg', a.specificEnergy_J_kg, 'J/kg');
  const LD = requirePositive('LD', a.LD);
  const f = requireFinite('batteryMassFraction', a.batteryMassFraction, 0, 1);
  if (!(f > 0 && f < 1)) throw new InputError('batteryMassFraction', f, 'above 0 and below 1');
  return finite((Estar * efficiency(a.eta) * LD * f) / G0, 'specificEnergy_J_kg', Estar);
}

export interface TraubEnduranceArgs {
  /** Nominal pack energy V·C, J. */
  energy_J: number;
  /** Drivetrain efficiency from battery to thrust power. */
  eta: number;
  /** Thrust power required, W. */
  powerRequired_W: number;
  /** Peukert exponent n ≥ 1. */
  peukertExponent: number;
  /** Discharge time at which the capacity is rated (Rt), s. */
  ratedTime_s: number;
}

/** Traub (2011): t = Rt^(1−n)·(η·E/P)^n, in s; = η·E/P at n = 1. */
export function enduranceElectricTraub(a: TraubEnduranceArgs): number {
  const E = requirePositive('energy_J', a.energy_J, 'J');
  const P = requirePositive('powerRequired_W', a.powerRequired_W, 'W');
  const n = requireFinite('peukertExponent', a.peukertExponent, 1, MAX_PEUKERT);
  const Rt = requirePositive('ratedTime_s', a.ratedTime_s, 's');
  // Rt·(η·E/(P·Rt))^n keeps the power's argument near 1 for ordinary packs.
  const t = Rt * Math.pow((efficiency(a.eta) * E) / (P * Rt), n);
  return finite(t, 'energy_J', E);
}

/** Traub (2011) at constant speed: R = V·t, in m. */
export function rangeElectricTraub(a: TraubEnduranceArgs & { V: number }): number {
  const V = requirePositive('V', a.V, 'm/s');
  return finite(V * enduranceElectricTraub(a), 'V', V);
}

/** Best-range speed with the Peukert effect (Traub 2011, derived form above), m/s. */
export function electricBestRangeSpeedTraub(a: {
  W: number;
  rho: number;
  S: number;
  CD0: number;
  k: number;
  n: number;
}): number {
  const W = requirePositive('W', a.W, 'N');
  const rho = requirePositive('rho', a.rho, 'kg/m³');
  const S = requirePositive('S', a.S, 'm²');
  const CD0 = requirePositive('CD0', a.CD0);
  const k = requirePositive('k', a.k);
  const n = requireFinite('n', a.n, 1, MAX_PEUKERT);
  const V = Math.sqrt((2 * W) / (rho * S)) * Math.pow((k * (n + 1)) / (CD0 * (3 * n - 1)), 0.25);
  return finite(V, 'W', W);
}
