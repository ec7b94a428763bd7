/**
 * One interface over the three powerplants for the mission solver: what thrust power is
 * available, and what a given thrust power costs (fuel mass flow, or battery drain with the
 * Peukert effect). Models and sources are in jet.ts, propeller.ts and electric.ts.
 *
 * Below the idle setting the idle consumption applies (the engine keeps running in a descent
 * or glide): jet idleFuelFraction·TSFC·T_max; propeller BSFC·idlePowerFraction·P_max;
 * electric 0 (a windmilling or stopped propeller draws nothing; common practice).
 */
import type { AtmosphereState } from '../atmosphere.ts';
import { requireFinite, requirePositive } from '../errors.ts';
import type { Fuel, Powerplant } from '../plan/schema.ts';
import { FUEL_DENSITY_KG_L } from '../units.ts';
import { batteryPower_W, peukertDrainRate_W } from './electric.ts';
import { jetFuelFlow_kg_s, maxThrust_N } from './jet.ts';
import { maxShaftPower_W, propFuelFlow_kg_s } from './propeller.ts';

export { maxThrust_N, jetFuelFlow_kg_s, weightSpecificTsfc_1_s } from './jet.ts';
export {
  maxShaftPower_W,
  propFuelFlow_kg_s,
  powerLapse,
  weightSpecificBsfc_1_m,
  GAGG_FERRAR_ZERO_SIGMA,
} from './propeller.ts';
export { chainEfficiency, batteryPower_W, usableEnergy_J, peukertDrainRate_W } from './electric.ts';

function propEfficiency(eta: number): number {
  requireFinite('propEfficiency', eta, 0, 1);
  return requirePositive('propEfficiency', eta);
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

/** Maximum thrust power T·V available at this state and true airspeed V. */
export function availableThrustPower_W(
  pp: Powerplant,
  atm: AtmosphereState,
  pressureAltitude_m: number,
  V_m_s: number,
): number {
  requirePositive('V_m_s', V_m_s, 'm/s');
  switch (pp.type) {
    case 'jet':
      return maxThrust_N(pp, atm) * V_m_s;
    case 'propeller':
      return propEfficiency(pp.propEfficiency) * maxShaftPower_W(pp, atm, pressureAltitude_m);
    case 'electric':
      // Electric motors do not lapse with density (ElectricSchema).
      return (
        propEfficiency(pp.propEfficiency) *
        requirePositive('maxShaftPower_W', pp.maxShaftPower_W, 'W')
      );
  }
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
): number {
  requireFinite('thrustPower_W', thrustPower_W, -Infinity, Infinity, 'W');
  requirePositive('V_m_s', V_m_s, 'm/s');
  const demand_W = Math.max(0, thrustPower_W);
  switch (pp.type) {
    case 'jet': {
      const idle = requireFinite('idleFuelFraction', pp.idleFuelFraction, 0, 1);
      const idle_N = idle * maxThrust_N(pp, atm);
      return jetFuelFlow_kg_s(pp, Math.max(demand_W / V_m_s, idle_N));
    }
    case 'propeller': {
      const idle = requireFinite('idlePowerFraction', pp.idlePowerFraction, 0, 1);
      const idle_W = idle * maxShaftPower_W(pp, atm, pressureAltitude_m);
      return propFuelFlow_kg_s(pp, Math.max(demand_W / propEfficiency(pp.propEfficiency), idle_W));
    }
    case 'electric':
      return peukertDrainRate_W(pp.battery, batteryPower_W(pp, demand_W));
  }
}
