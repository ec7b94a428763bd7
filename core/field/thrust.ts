/**
 * Thrust during the take-off run as a function of true airspeed.
 *
 * Jet: T = T_max(ρ), the density-lapsed maximum thrust (core/propulsion/jet.ts), held constant
 * along the run. The fall of turbofan thrust with speed is ignored (common practice for a
 * first estimate; it makes the roll a little short for high-bypass engines).
 *
 * Propeller and electric: T = min(η·P/V, T_static) (common practice). η·P/V is the cruise
 * relation with constant propeller efficiency; it grows without bound as V → 0, so it is
 * capped by the static thrust. The static thrust is given, or estimated by actuator-disk
 * momentum theory with a figure of merit FM: ideal static power P = T^1.5/√(2ρA), so
 * T_static = (2ρA)^(1/3)·(FM·P)^(2/3), A = πD²/4 (McCormick, Aerodynamics, Aeronautics and
 * Flight Mechanics, ch. 6, from memory). FM ≈ 0.5–0.8 for propellers; the default 0.6 suits
 * a fixed-pitch propeller that cannot reach full power static (common practice, from memory).
 *
 * A powerplant with a `propeller` efficiency curve (core/propulsion/propellerCurve.ts) uses
 * that curve here too — one propeller model for take-off and climb: with momentum theory the
 * thrust T(V) = η_p·P/u(V) of core/propulsion/momentum.ts at every speed, the static value
 * included (the static estimate above with FM = the calibrated profile factor); with a table,
 * η(V)·P/V capped by its static thrust.
 */
import type { AtmosphereState } from '../atmosphere.ts';
import { InputError, requireFinite, requirePositive } from '../errors.ts';
import type { Powerplant } from '../plan/schema.ts';
import { maxShaftPower_W, maxThrust_N, propellerCurve } from '../propulsion/index.ts';
import {
  curveThrust_N,
  type CurveAircraft,
  type PropellerCurve,
} from '../propulsion/propellerCurve.ts';

export const DEFAULT_FIGURE_OF_MERIT = 0.6;

export type ThrustModel =
  | { kind: 'constant'; thrust_N: number }
  | { kind: 'shaftPower'; shaftPower_W: number; propEfficiency: number; staticThrust_N: number }
  | { kind: 'curve'; curve: PropellerCurve; shaftPower_W: number; rho_kg_m3: number };

export interface StaticThrustInput {
  shaftPower_W: number;
  rho_kg_m3: number;
  propDiameter_m: number;
  figureOfMerit?: number;
}

/** T_static = (2ρA)^(1/3)·(FM·P)^(2/3) (actuator-disk momentum theory). */
export function staticThrustMomentum(input: StaticThrustInput): number {
  const P = requirePositive('shaftPower_W', input.shaftPower_W, 'W');
  const rho = requirePositive('rho_kg_m3', input.rho_kg_m3, 'kg/m³');
  const D = requireFinite('propDiameter_m', input.propDiameter_m, 0.01, 10, 'm');
  const FM = requireFinite(
    'figureOfMerit',
    input.figureOfMerit ?? DEFAULT_FIGURE_OF_MERIT,
    0.05,
    1,
  );
  const A = (Math.PI * D * D) / 4;
  return Math.cbrt(2 * rho * A) * Math.pow(FM * P, 2 / 3);
}

/** Checks a thrust model; returns it unchanged. */
export function checkThrustModel(model: ThrustModel, field = 'thrust'): ThrustModel {
  if (model.kind === 'constant') {
    requirePositive(`${field}.thrust_N`, model.thrust_N, 'N');
    return model;
  }
  if (model.kind === 'curve') {
    requirePositive(`${field}.shaftPower_W`, model.shaftPower_W, 'W');
    requirePositive(`${field}.rho_kg_m3`, model.rho_kg_m3, 'kg/m³');
    if (curveThrust_N(model.curve, model.shaftPower_W, 0, model.rho_kg_m3) === null)
      throw new InputError(`${field}.curve`, model.curve.kind, 'a curve with a static thrust');
    return model;
  }
  if (model.kind !== 'shaftPower')
    throw new InputError(
      `${field}.kind`,
      (model as { kind: unknown }).kind,
      "'constant', 'shaftPower' or 'curve'",
    );
  requirePositive(`${field}.shaftPower_W`, model.shaftPower_W, 'W');
  requireFinite(`${field}.propEfficiency`, model.propEfficiency, 0.05, 1);
  requirePositive(`${field}.staticThrust_N`, model.staticThrust_N, 'N');
  return model;
}

/** Thrust at true airspeed V (V ≤ 0, a tailwind start, gets the static thrust). */
export function thrustAt(model: ThrustModel, V_m_s: number): number {
  if (model.kind === 'constant') return model.thrust_N;
  if (model.kind === 'curve') {
    return curveThrust_N(model.curve, model.shaftPower_W, Math.max(V_m_s, 0), model.rho_kg_m3) ?? 0;
  }
  if (V_m_s <= 0) return model.staticThrust_N;
  return Math.min((model.propEfficiency * model.shaftPower_W) / V_m_s, model.staticThrust_N);
}

/** Speed where η·P/V meets the static cap: the kink of the propeller model (0 for a jet). */
export function thrustBreakSpeed(model: ThrustModel): number {
  if (model.kind === 'constant') return 0;
  if (model.kind === 'curve') {
    // Momentum theory is smooth; a table's cap meets η·P/V near its first point.
    const c = model.curve;
    if (c.kind !== 'table') return 0;
    const T0 = curveThrust_N(c, model.shaftPower_W, 0, model.rho_kg_m3) ?? 1;
    return Math.min(c.table.x[0]! / c.xPerSpeed, (c.table.y[0]! * model.shaftPower_W) / T0);
  }
  return (model.propEfficiency * model.shaftPower_W) / model.staticThrust_N;
}

export interface PropellerStaticOptions {
  /** Static thrust, when known (measured or from the propeller maker). */
  staticThrust_N?: number;
  /** Propeller diameter, for the momentum-theory estimate. */
  propDiameter_m?: number;
  figureOfMerit?: number;
}

/**
 * The take-off thrust model of a plan powerplant at the field's air state: jet maximum
 * thrust; propeller maximum shaft power with its lapse; electric maximum shaft power.
 */
export function fieldThrustModel(
  pp: Powerplant,
  atm: AtmosphereState,
  pressureAltitude_m: number,
  options: PropellerStaticOptions = {},
  aircraft?: CurveAircraft,
): ThrustModel {
  if (pp.type === 'jet') return { kind: 'constant', thrust_N: maxThrust_N(pp, atm) };
  const shaftPower_W =
    pp.type === 'propeller' ? maxShaftPower_W(pp, atm, pressureAltitude_m) : pp.maxShaftPower_W;
  if (pp.propeller !== undefined) {
    const curve = propellerCurve(pp, aircraft);
    return checkThrustModel({ kind: 'curve', curve, shaftPower_W, rho_kg_m3: atm.rho_kg_m3 });
  }
  let staticThrust_N: number;
  if (options.staticThrust_N !== undefined) {
    staticThrust_N = requirePositive('staticThrust_N', options.staticThrust_N, 'N');
  } else if (options.propDiameter_m !== undefined) {
    staticThrust_N = staticThrustMomentum({
      shaftPower_W,
      rho_kg_m3: atm.rho_kg_m3,
      propDiameter_m: options.propDiameter_m,
      ...(options.figureOfMerit !== undefined ? { figureOfMerit: options.figureOfMerit } : {}),
    });
  } else {
    throw new InputError(
      'propDiameter_m',
      undefined,
      'given (or staticThrust_N given) for a propeller take-off',
    );
  }
  return checkThrustModel({
    kind: 'shaftPower',
    shaftPower_W,
    propEfficiency: pp.propEfficiency,
    staticThrust_N,
  });
}
