/**
 * Propeller efficiency as a function of airspeed, for the piston/turboprop and the electric
 * powerplant alike: what the plan's `propeller` block says, prepared once.
 *
 * - constant: η = propEfficiency at every speed (plans without a `propeller` block).
 * - momentum: actuator-disk momentum theory times a profile factor (momentum.ts; McCormick,
 *   Aerodynamics, Aeronautics and Flight Mechanics, ch. 6). The profile factor is calibrated
 *   so that η = propEfficiency at the cruise point: cruisePowerFraction of the maximum shaft
 *   power at cruiseAltitude_m on an ISA day, at cruiseSpeed_m_s — or, when no speed is given,
 *   at the fast-side level-flight speed at MTOW where D·V = propEfficiency × that power.
 * - table: the user's η(V) or η(J) (propellerTable.ts, monotone cubic), J = V/(n·D).
 *
 * Thrust power available is η(V, P)·P; the shaft power that gives a thrust power is its
 * inverse (closed form for momentum theory, P_t/η(V) for the others).
 */
import { standardAtmosphere } from '../atmosphere.ts';
import { InputError, requirePositive } from '../errors.ts';
import { polarCoefficients, powerRequired_W, minPowerSpeed } from '../polar.ts';
import type { Aircraft, ElectricPowerplant, PropellerPowerplant } from '../plan/schema.ts';
import { G0 } from '../units.ts';
import {
  calibrateProfileFactor,
  diskArea_m2,
  momentumEfficiency,
  momentumThrust_N,
  shaftPowerForThrustPower,
} from './momentum.ts';
import { maxShaftPower_W } from './propeller.ts';
import { efficiencyTable, tableEfficiency, type EfficiencyTable } from './propellerTable.ts';

export type PropellerCurve =
  | { kind: 'constant'; efficiency: number }
  | {
      kind: 'momentum';
      area_m2: number;
      profileFactor: number;
      /** The calibration point, for reports and tests. */
      cruiseSpeed_m_s: number;
      cruiseShaftPower_W: number;
      cruiseRho_kg_m3: number;
    }
  | {
      kind: 'table';
      table: EfficiencyTable;
      /** x = V·xPerSpeed (1 for an airspeed table, 1/(n·D) for advance ratio). */
      xPerSpeed: number;
      staticThrust_N: number | null;
    };

type PropPowerplant = PropellerPowerplant | ElectricPowerplant;

/** The aircraft data a momentum curve without a cruise speed needs. */
export type CurveAircraft = Pick<Aircraft, 'wingArea_m2' | 'polar' | 'mass' | 'engineCount'>;

/** Maximum shaft power at a pressure altitude on an ISA day. */
function isaMaxShaftPower_W(pp: PropPowerplant, Hp: number): number {
  if (pp.type === 'electric') return requirePositive('maxShaftPower_W', pp.maxShaftPower_W, 'W');
  return maxShaftPower_W(pp, standardAtmosphere(Hp, 'propeller.cruiseAltitude_m'), Hp);
}

export function propellerCurve(
  pp: PropPowerplant,
  aircraft?: CurveAircraft,
  at = 'aircraft.powerplant',
): PropellerCurve {
  const eta = pp.propEfficiency;
  if (!(eta > 0 && eta < 1)) throw new InputError(`${at}.propEfficiency`, eta, 'above 0, below 1');
  const spec = pp.propeller;
  if (spec === undefined) return { kind: 'constant', efficiency: eta };
  const count = aircraft?.engineCount ?? 1;
  if (spec.model === 'table') {
    const table = efficiencyTable(spec.points, `${at}.propeller.points`);
    let xPerSpeed = 1;
    if (spec.by === 'advanceRatio') {
      const rpm = requirePositive(`${at}.propeller.rpm`, spec.rpm ?? NaN, 'rpm');
      const D = requirePositive(`${at}.propeller.diameter_m`, spec.diameter_m ?? NaN, 'm');
      xPerSpeed = 1 / ((rpm / 60) * D);
    }
    return { kind: 'table', table, xPerSpeed, staticThrust_N: spec.staticThrust_N ?? null };
  }
  const area = diskArea_m2(
    requirePositive(`${at}.propeller.diameter_m`, spec.diameter_m, 'm'),
    count,
  );
  const Hp = spec.cruiseAltitude_m;
  const rho = standardAtmosphere(Hp, `${at}.propeller.cruiseAltitude_m`).rho_kg_m3;
  const P = spec.cruisePowerFraction * isaMaxShaftPower_W(pp, Hp);
  if (!(P > 0)) {
    throw new InputError(
      `${at}.propeller.cruiseAltitude_m`,
      Hp,
      'an altitude where the engine gives power',
    );
  }
  const V = spec.cruiseSpeed_m_s ?? levelSpeedAt(aircraft, rho, eta * P, at);
  const profile = calibrateProfileFactor(eta, V, rho, P, area, `${at}.propEfficiency`);
  return {
    kind: 'momentum',
    area_m2: area,
    profileFactor: profile,
    cruiseSpeed_m_s: V,
    cruiseShaftPower_W: P,
    cruiseRho_kg_m3: rho,
  };
}

/** Fast-side level-flight speed at MTOW where D·V equals the thrust power (bisection). */
function levelSpeedAt(
  aircraft: CurveAircraft | undefined,
  rho: number,
  thrustPower_W: number,
  at: string,
): number {
  if (aircraft === undefined) {
    throw new InputError(
      `${at}.propeller.cruiseSpeed_m_s`,
      undefined,
      'given (or the aircraft known)',
    );
  }
  const c = polarCoefficients(aircraft.polar);
  const W = aircraft.mass.mtow_kg * G0;
  const S = aircraft.wingArea_m2;
  const excess = (V: number) => thrustPower_W - powerRequired_W(c, W, rho, S, V);
  let lo = minPowerSpeed(c, W, rho, S);
  if (!(excess(lo) > 0)) {
    throw new InputError(
      `${at}.propeller.cruisePowerFraction`,
      thrustPower_W,
      'enough power for level flight at MTOW at the cruise altitude (or give cruiseSpeed_m_s)',
    );
  }
  let hi = 2 * lo;
  while (excess(hi) > 0) hi *= 2;
  for (let i = 0; i < 200 && hi - lo > 1e-12 * hi; i++) {
    const mid = 0.5 * (lo + hi);
    if (excess(mid) > 0) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/** Efficiency at TAS V > 0 with shaft power P (unchecked; the ODE right-hand side calls it). */
export function curveEfficiency(
  curve: PropellerCurve,
  shaftPower_W: number,
  V_m_s: number,
  rho_kg_m3: number,
): number {
  switch (curve.kind) {
    case 'constant':
      return curve.efficiency;
    case 'momentum':
      return momentumEfficiency(shaftPower_W, V_m_s, rho_kg_m3, curve.area_m2, curve.profileFactor);
    case 'table':
      return tableEfficiency(curve.table, V_m_s * curve.xPerSpeed);
  }
}

/** Shaft power that gives thrust power P_t ≥ 0 at TAS V > 0 (unchecked). */
export function curveShaftPower(
  curve: PropellerCurve,
  thrustPower_W: number,
  V_m_s: number,
  rho_kg_m3: number,
): number {
  if (curve.kind === 'momentum') {
    return shaftPowerForThrustPower(
      thrustPower_W,
      V_m_s,
      rho_kg_m3,
      curve.area_m2,
      curve.profileFactor,
    );
  }
  return thrustPower_W / curveEfficiency(curve, 0, V_m_s, rho_kg_m3);
}

/**
 * Thrust at TAS V ≥ 0 with shaft power P: momentum theory at any V (its static value at
 * V = 0); a table's η·P/V, capped by its static thrust (or, without one, by the thrust of
 * its first point carried to V = 0); the constant efficiency's η·P/V has no static value
 * (null at V = 0: core/field/thrust.ts then needs a diameter).
 */
export function curveThrust_N(
  curve: PropellerCurve,
  shaftPower_W: number,
  V_m_s: number,
  rho_kg_m3: number,
): number | null {
  if (curve.kind === 'momentum') {
    return momentumThrust_N(shaftPower_W, V_m_s, rho_kg_m3, curve.area_m2, curve.profileFactor);
  }
  if (curve.kind === 'constant') {
    return V_m_s > 0 ? (curve.efficiency * shaftPower_W) / V_m_s : null;
  }
  const t = curve.table;
  const slope0 = (t.y[0]! / t.x[0]!) * curve.xPerSpeed;
  const cap = curve.staticThrust_N ?? slope0 * shaftPower_W;
  if (!(V_m_s > 0)) return cap;
  return Math.min(cap, (tableEfficiency(t, V_m_s * curve.xPerSpeed) * shaftPower_W) / V_m_s);
}
