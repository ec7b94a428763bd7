/**
 * The powerplant as the integrator's right-hand side sees it: the models of
 * core/propulsion/index.ts (jet T_max = T_SL·σ^n or the engine-class lapse with Mach, and
 * TSFC·T with TSFC = c₁(1 + f·M)√θ; propeller Gagg–Ferrar or σ^n
 * lapse and BSFC·P; electric drivetrain efficiency and Traub's 2011 Peukert drain; for both
 * propeller powerplants the efficiency curve η(V, P) of core/propulsion/propellerCurve.ts —
 * constant, momentum theory or a table), evaluated
 * without re-validating the plan's constants on every call.
 *
 * Why: the propulsion functions check every argument (InputError), which is right at an API
 * boundary but costs more than the physics inside an ODE right-hand side evaluated thousands
 * of times per solve. Here the constants are validated once, when the model is built
 * (`powerConstants` calls the propulsion functions themselves), and the altitude-dependent
 * maximum (T_max or P_max) once per altitude (`engineMaximum`, cached with the ambient).
 * test/core/solver/power.test.ts checks that both paths give the same numbers.
 */
import type { AtmosphereState } from '../atmosphere.ts';
import type { Aircraft, Powerplant } from '../plan/schema.ts';
import {
  curveEfficiency,
  curveShaftPower,
  propellerCurve,
  type PropellerCurve,
} from '../propulsion/propellerCurve.ts';
import { classLapse, classLapseOf, type ClassLapse } from '../propulsion/jet.ts';
import {
  availableThrustPower_W,
  chainEfficiency,
  consumptionRate,
  maxShaftPower_W,
  maxThrust_N,
} from '../propulsion/index.ts';

/** Plan constants of the powerplant, validated once. */
export interface PowerConstants {
  type: Powerplant['type'];
  /** Jet: TSFC kg/(N·s); propeller: BSFC kg/J; electric: 0. */
  sfc: number;
  /** Jet: idle fraction of T_max; propeller: idle fraction of P_max; electric: 0. */
  idleFraction: number;
  /** Propeller and electric: propeller efficiency at the cruise point; jet: 1. */
  propEfficiency: number;
  /** Propeller and electric: η(V, P) of the propeller; jet: constant 1 (unused). */
  prop: PropellerCurve;
  /** Electric: motor × controller × propeller efficiency (at the cruise point); others 1. */
  chainEfficiency: number;
  /** Electric: motor × controller efficiency (battery to shaft); others 1. */
  driveEfficiency: number;
  /** Electric: Peukert exponent n and Rt/E_nominal (s/J); others 1 and 0. */
  peukertExponent: number;
  ratedTimeOverEnergy_s_J: number;
  /** Jet: the engine-class lapse (null: density lapse, already in engineMax). */
  lapse: ClassLapse | null;
  /** Jet: sea-level static thrust (N); others 0. */
  thrustSL_N: number;
  /** Jet: f of TSFC = c₁(1 + f·M)√θ, or null for a constant TSFC. */
  tsfcMachFactor: number | null;
}

/** What the powerplant needs to know about the air: the state and the cached engine maximum. */
export interface EngineAir {
  atm: AtmosphereState;
  engineMax: number;
}

const NOT_JET = { lapse: null, thrustSL_N: 0, tsfcMachFactor: null } as const;

/** Validates the powerplant through core/propulsion (throws InputError) and keeps its constants. */
export function powerConstants(
  pp: Powerplant,
  seaLevel: AtmosphereState,
  aircraft?: Pick<Aircraft, 'wingArea_m2' | 'polar' | 'mass' | 'engineCount'>,
): PowerConstants {
  const prop: PropellerCurve =
    pp.type === 'jet' ? { kind: 'constant', efficiency: 1 } : propellerCurve(pp, aircraft);
  // One call of each propulsion function checks every constant they use.
  availableThrustPower_W(pp, seaLevel, 0, 1, prop);
  consumptionRate(pp, 1, 1, seaLevel, 0, prop);
  switch (pp.type) {
    case 'jet':
      return {
        type: 'jet',
        sfc: pp.tsfc_kg_Ns,
        idleFraction: pp.idleFuelFraction,
        propEfficiency: 1,
        prop,
        chainEfficiency: 1,
        driveEfficiency: 1,
        peukertExponent: 1,
        ratedTimeOverEnergy_s_J: 0,
        lapse: classLapseOf(pp),
        thrustSL_N: pp.maxThrustSL_N,
        tsfcMachFactor: pp.tsfcMachFactor ?? null,
      };
    case 'propeller':
      return {
        type: 'propeller',
        sfc: pp.bsfc_kg_J,
        idleFraction: pp.idlePowerFraction,
        propEfficiency: pp.propEfficiency,
        prop,
        chainEfficiency: 1,
        driveEfficiency: 1,
        peukertExponent: 1,
        ratedTimeOverEnergy_s_J: 0,
        ...NOT_JET,
      };
    case 'electric':
      return {
        type: 'electric',
        sfc: 0,
        idleFraction: 0,
        propEfficiency: pp.propEfficiency,
        prop,
        chainEfficiency: chainEfficiency(pp),
        driveEfficiency: pp.motorEfficiency * pp.controllerEfficiency,
        peukertExponent: pp.battery.peukertExponent,
        ratedTimeOverEnergy_s_J: pp.battery.ratedDischargeTime_s / pp.battery.energy_J,
        ...NOT_JET,
      };
  }
}

/**
 * The altitude-dependent maximum of the engine: T_max (N) for a jet (static, M = 0, for the
 * engine-class lapse; `jetThrustMax_N` adds the Mach effect), shaft P_max (W) for a
 * propeller engine (with its lapse and critical altitude), the motor's shaft power (W) for
 * electric (no lapse).
 */
export function engineMaximum(
  pp: Powerplant,
  atm: AtmosphereState,
  pressureAltitude_m: number,
): number {
  switch (pp.type) {
    case 'jet':
      return maxThrust_N(pp, atm);
    case 'propeller':
      return maxShaftPower_W(pp, atm, pressureAltitude_m);
    case 'electric':
      return pp.maxShaftPower_W;
  }
}

/** Jet maximum thrust at TAS V: the cached density lapse, or the class lapse at M = V/a. */
export function jetThrustMax_N(c: PowerConstants, air: EngineAir, V_m_s: number): number {
  if (c.lapse === null) return air.engineMax;
  return c.thrustSL_N * classLapse(c.lapse, air.atm, V_m_s / air.atm.a_m_s);
}

/** Jet thrust the idle fraction applies to (core/propulsion/jet.ts): T_max, or T_SL·δ. */
export function jetIdleReference_N(c: PowerConstants, air: EngineAir): number {
  return c.lapse === null ? air.engineMax : c.thrustSL_N * air.atm.delta;
}

/** Jet TSFC at TAS V: c₁(1 + f·M)√θ, or the constant. */
function jetTsfc(c: PowerConstants, atm: AtmosphereState, V_m_s: number): number {
  const f = c.tsfcMachFactor;
  if (f === null) return c.sfc;
  return c.sfc * (1 + (f * V_m_s) / atm.a_m_s) * Math.sqrt(atm.theta);
}

/** Maximum thrust power at TAS V: jet T_max(M)·V, otherwise η(V, P_max)·P_max. */
export function availablePower_W(
  c: PowerConstants,
  air: EngineAir,
  V_m_s: number,
  rho_kg_m3: number,
): number {
  if (c.type === 'jet') return jetThrustMax_N(c, air, V_m_s) * V_m_s;
  return curveEfficiency(c.prop, air.engineMax, V_m_s, rho_kg_m3) * air.engineMax;
}

/** Shaft power for a thrust power ≥ 0 at TAS V (propeller and electric; jet: unused). */
export function shaftPowerFor(
  c: PowerConstants,
  thrustPower_W: number,
  V_m_s: number,
  rho_kg_m3: number,
): number {
  if (c.prop.kind === 'constant') return thrustPower_W / c.propEfficiency;
  return curveShaftPower(c.prop, thrustPower_W, V_m_s, rho_kg_m3);
}

/**
 * Consumption for a thrust power (≤ 0 means idle): fuel kg/s (jet TSFC(M,θ)·max(T, idle·T_ref);
 * propeller BSFC·max(P_shaft, idle·P_max)) or battery drain W (electric P_shaft/(η_m·η_c),
 * Peukert applied at or above the rated discharge power).
 */
export function consumption(
  c: PowerConstants,
  air: EngineAir,
  thrustPower_W: number,
  V_m_s: number,
  rho_kg_m3: number,
): number {
  const demand = thrustPower_W > 0 ? thrustPower_W : 0;
  switch (c.type) {
    case 'jet': {
      const idle_N = c.idleFraction * jetIdleReference_N(c, air);
      return jetTsfc(c, air.atm, V_m_s) * Math.max(demand / V_m_s, idle_N);
    }
    case 'propeller':
      return (
        c.sfc * Math.max(shaftPowerFor(c, demand, V_m_s, rho_kg_m3), c.idleFraction * air.engineMax)
      );
    case 'electric': {
      // Peukert only at or above the rated discharge power (core/propulsion/electric.ts).
      const P = shaftPowerFor(c, demand, V_m_s, rho_kg_m3) / c.driveEfficiency;
      if (c.peukertExponent === 1) return P;
      const x = P * c.ratedTimeOverEnergy_s_J;
      return x > 1 ? P * Math.pow(x, c.peukertExponent - 1) : P;
    }
  }
}

/**
 * How far the demand is above the idle floor, as a fraction of the maximum: jet
 * (P/V − idle·T_ref)/T_ref with T_ref the idle reference thrust (T_max or T_SL·δ), propeller
 * (P_shaft − idle·P_max)/P_max, electric P_shaft/P_max (its floor is at zero thrust power).
 * The consumption has a kink where this crosses 0; the integrator restarts there instead of
 * stepping across it (segment.ts).
 */
export function idleExcess(
  c: PowerConstants,
  air: EngineAir,
  thrustPower_W: number,
  V_m_s: number,
  rho_kg_m3: number,
): number {
  switch (c.type) {
    case 'jet': {
      const T = jetIdleReference_N(c, air);
      return thrustPower_W / V_m_s / T - c.idleFraction;
    }
    case 'propeller':
      return signedShaft(c, thrustPower_W, V_m_s, rho_kg_m3) / air.engineMax - c.idleFraction;
    case 'electric':
      return signedShaft(c, thrustPower_W, V_m_s, rho_kg_m3) / air.engineMax;
  }
}

/** Shaft power with the sign of the thrust power (a negative demand mirrored, for the kink test). */
function signedShaft(c: PowerConstants, thrustPower_W: number, V: number, rho: number): number {
  return thrustPower_W >= 0
    ? shaftPowerFor(c, thrustPower_W, V, rho)
    : -shaftPowerFor(c, -thrustPower_W, V, rho);
}
