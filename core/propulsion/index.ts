/**
 * One interface over the three powerplants for the mission solver: what thrust power is
 * available, and what a given thrust power costs (fuel mass flow, or battery drain with the
 * Peukert effect). Models and sources are in jet.ts, propeller.ts, electric.ts and, for the
 * propeller's efficiency with airspeed, propellerCurve.ts.
 *
 * Below the idle setting the idle consumption applies (the engine keeps running in a descent
 * or glide): jet idleFuelFraction·TSFC·(T_max, or T_SL·δ with a class lapse; jet.ts); propeller BSFC·idlePowerFraction·P_max;
 * electric 0 (a windmilling or stopped propeller draws nothing; common practice).
 */
import type { AtmosphereState } from '../atmosphere.ts';
import { requireFinite, requirePositive } from '../errors.ts';
import type { Fuel, Powerplant } from '../plan/schema.ts';
import { FUEL_DENSITY_KG_L } from '../units.ts';
import { peukertDrainRate_W } from './electric.ts';
import {
  curveEfficiency,
  curveShaftPower,
  propellerCurve,
  type PropellerCurve,
} from './propellerCurve.ts';
import { idleReferenceThrust_N, jetFuelFlow_kg_s, maxThrust_N } from './jet.ts';
import { maxShaftPower_W, propFuelFlow_kg_s } from './propeller.ts';

export {
  maxThrust_N,
  jetFuelFlow_kg_s,
  weightSpecificTsfc_1_s,
  tsfcAt_kg_Ns,
  classLapse,
  totalRatios,
} from './jet.ts';
export {
  maxShaftPower_W,
  propFuelFlow_kg_s,
  powerLapse,
  weightSpecificBsfc_1_m,
  GAGG_FERRAR_ZERO_SIGMA,
} from './propeller.ts';
export { chainEfficiency, batteryPower_W, usableEnergy_J, peukertDrainRate_W } from './electric.ts';
export { propellerCurve, type PropellerCurve } from './propellerCurve.ts';

function propEfficiency(eta: number): number {
  requireFinite('propEfficiency', eta, 0, 1);
  return requirePositive('propEfficiency', eta);
}

/** Flight Mach number V/a (the jet models ask for it). */
function machOf(atm: AtmosphereState, V_m_s: number): number {
  return V_m_s / requirePositive('atm.a_m_s', atm.a_m_s, 'm/s');
}

export function consumableOf(pp: Powerplant): 'fuel' | 'battery' {
  return pp.type === 'electric' ? 'battery' : 'fuel';
}

/** Fuel density: the plan's override, else the typical density of the fuel kind. */
export function fuelDensity_kg_L(fuel: Fuel): number {
  if (fuel.density_kg_L !== undefined)
    return requirePositive('fuel.density_kg_L', fuel.density_kg_L, 'kg/L');
  return FUEL_DENSITY_KG_L[fuel.kind];
}

/**
 * Maximum thrust power T·V available at this state and true airspeed V. `curve` is the
 * propeller's efficiency curve (propellerCurve(pp, aircraft)); without it, it is prepared
 * from the powerplant alone.
 */
export function availableThrustPower_W(
  pp: Powerplant,
  atm: AtmosphereState,
  pressureAltitude_m: number,
  V_m_s: number,
  curve?: PropellerCurve,
): number {
  requirePositive('V_m_s', V_m_s, 'm/s');
  if (pp.type === 'jet') return maxThrust_N(pp, atm, machOf(atm, V_m_s)) * V_m_s;
  propEfficiency(pp.propEfficiency);
  // Electric motors do not lapse with density (ElectricSchema).
  const P =
    pp.type === 'propeller'
      ? maxShaftPower_W(pp, atm, pressureAltitude_m)
      : requirePositive('maxShaftPower_W', pp.maxShaftPower_W, 'W');
  const c = curve ?? propellerCurve(pp);
  return curveEfficiency(c, P, V_m_s, requirePositive('atm.rho_kg_m3', atm.rho_kg_m3)) * P;
}

/**
 * Consumption for a thrust power T·V (which may be negative or zero in a descent: then the
 * idle consumption applies): fuel kg/s for fuel burners, battery drain W (Peukert applied)
 * for electric. Whether the thrust power is available is for the caller to check.
 */
export function consumptionRate(
  pp: Powerplant,
  thrustPower_W: number,
  V_m_s: number,
  atm: AtmosphereState,
  pressureAltitude_m: number,
  curve?: PropellerCurve,
): number {
  requireFinite('thrustPower_W', thrustPower_W, -Infinity, Infinity, 'W');
  requirePositive('V_m_s', V_m_s, 'm/s');
  const demand_W = Math.max(0, thrustPower_W);
  switch (pp.type) {
    case 'jet': {
      const idle = requireFinite('idleFuelFraction', pp.idleFuelFraction, 0, 1);
      const M = machOf(atm, V_m_s);
      const idle_N = idle * idleReferenceThrust_N(pp, atm, M);
      return jetFuelFlow_kg_s(pp, Math.max(demand_W / V_m_s, idle_N), atm, M);
    }
    case 'propeller': {
      const idle = requireFinite('idlePowerFraction', pp.idlePowerFraction, 0, 1);
      const idle_W = idle * maxShaftPower_W(pp, atm, pressureAltitude_m);
      const shaft = shaftPower(pp, demand_W, V_m_s, atm, curve);
      return propFuelFlow_kg_s(pp, Math.max(shaft, idle_W));
    }
    case 'electric': {
      const drive =
        fraction01('motorEfficiency', pp.motorEfficiency) *
        fraction01('controllerEfficiency', pp.controllerEfficiency);
      const shaft = shaftPower(pp, demand_W, V_m_s, atm, curve);
      return peukertDrainRate_W(pp.battery, shaft / drive);
    }
  }
}

function fraction01(field: string, v: number): number {
  requireFinite(field, v, 0, 1);
  return requirePositive(field, v);
}

/** Shaft power for a thrust power ≥ 0 at V through the propeller's efficiency curve. */
function shaftPower(
  pp: Exclude<Powerplant, { type: 'jet' }>,
  thrustPower_W: number,
  V_m_s: number,
  atm: AtmosphereState,
  curve: PropellerCurve | undefined,
): number {
  const eta = propEfficiency(pp.propEfficiency);
  const c = curve ?? propellerCurve(pp);
  if (c.kind === 'constant') return thrustPower_W / eta;
  return curveShaftPower(c, thrustPower_W, V_m_s, requirePositive('atm.rho_kg_m3', atm.rho_kg_m3));
}
