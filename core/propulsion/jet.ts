/**
 * Turbojet/turbofan model: maximum thrust lapse with altitude (and, by engine class, with
 * Mach), fuel flow TSFC × thrust with TSFC rising with Mach and temperature.
 *
 * Density lapse (the simple model, `thrustLapse` absent): T_max = T_SL·σ^n (common practice,
 * n ≈ 0.7–1.5; Anderson, Aircraft Performance and Design, ch. 3, from memory). No Mach effect.
 *
 * Engine-class lapse (`thrustLapse` given): the installed-thrust lapse α = T_max/T_SL,static of
 * Mattingly, Aircraft Engine Design (2nd ed.), ch. 2 (from memory), written with the total
 * (stagnation) ratios θ₀ = θ·(1 + 0.2M²), δ₀ = δ·(1 + 0.2M²)^3.5 (γ = 1.4) and the throttle
 * ratio TR (θ₀ at the throttle break; above it the engine is held at its turbine-inlet
 * limit and thrust falls faster), x = max(0, θ₀ − TR):
 *   high-bypass turbofan  α = δ₀·(1 − a·√M − b·x/(1.5 + M)),        a 0.49, b 3
 *   low-bypass turbofan   α = δ₀·(1 − a·√M − b·x/θ₀),               a 0,    b 3.8
 *   turbojet              α = δ₀·(1 − a·√M − b·x/((9 + M)·θ₀)),     a 0.16, b 24
 * The low-bypass and turbojet forms are Mattingly's military (dry, no afterburner) forms
 * divided by their sea-level static value (0.6·δ₀ and 0.8·δ₀), so T_SL is the dry static
 * thrust the plan gives. a and b may be overridden. α is floored at 0 (no negative thrust).
 * The corner of max(0, θ₀ − TR) is replaced by the parabola (θ₀ − TR + w)²/(4w) for
 * |θ₀ − TR| < w = 0.004 (exact outside that band, continuous slope across it): a best-rate
 * climb flies at the break over a band of altitudes, and its speed must stay a smooth function
 * of altitude for the integrator (core/solver/slope.ts differentiates it). With TR = 1 the
 * sea-level static thrust is therefore 0.2 % below T_SL; TR ≥ 1.004 keeps it exact.
 *
 * Idle (descent, glide): idleFuelFraction × TSFC × the idle reference thrust — T_max for the
 * density lapse; T_SL·δ for the class lapse (idle thrust taken to scale with the ambient
 * pressure, common practice, from memory), which keeps the idle flow a smooth function of
 * altitude where a descent crosses the throttle break.
 *
 * TSFC (`tsfcMachFactor` given): TSFC = (c₁ + c₂·M)·√θ (Mattingly, ch. 2, from memory;
 * high-bypass c₁ 0.45, c₂ 0.54 lb/(lbf·h)), here c₁ = tsfc_kg_Ns and c₂ = c₁·tsfcMachFactor,
 * θ = T/T_SL. Absent: TSFC = tsfc_kg_Ns at every Mach and temperature.
 * The weight-specific c_t = TSFC·g0 (1/s) is the consumption of the Breguet forms (Anderson,
 * Introduction to Flight, ch. 6).
 *
 * Left out: afterburning, installation losses beyond what the lapse forms carry, Reynolds
 * effects at high altitude, part-throttle TSFC changes (TSFC depends on M and θ only).
 */
import type { AtmosphereState } from '../atmosphere.ts';
import { InputError, requireFinite, requirePositive } from '../errors.ts';
import type { JetPowerplant } from '../plan/schema.ts';
import { G0 } from '../units.ts';

export type EngineClass = 'highBypass' | 'lowBypass' | 'turbojet';

/** Class coefficients a (of √M) and b (of the term above the throttle break); Mattingly, from memory. */
export const ENGINE_CLASS_COEFFICIENTS: Readonly<Record<EngineClass, { a: number; b: number }>> =
  Object.freeze({
    highBypass: { a: 0.49, b: 3 },
    lowBypass: { a: 0, b: 3.8 },
    turbojet: { a: 0.16, b: 24 },
  });

/** Mattingly's TSFC c₂/c₁ by class (0.54/0.45, 0.30/0.90, 0.30/1.10; military power; from memory). */
export const TSFC_MACH_FACTOR: Readonly<Record<EngineClass, number>> = Object.freeze({
  highBypass: 0.54 / 0.45,
  lowBypass: 0.3 / 0.9,
  turbojet: 0.3 / 1.1,
});

/** Total temperature and pressure ratios θ₀, δ₀ at flight Mach M (isentropic, γ = 1.4). */
export function totalRatios(
  atm: AtmosphereState,
  mach: number,
): { theta0: number; delta0: number } {
  const f = 1 + 0.2 * mach * mach;
  return { theta0: atm.theta * f, delta0: atm.delta * Math.pow(f, 3.5) };
}

/** The constants of the engine-class lapse, checked; null for the density model. */
export interface ClassLapse {
  engineClass: EngineClass;
  throttleRatio: number;
  a: number;
  b: number;
}

export function classLapseOf(jet: JetPowerplant): ClassLapse | null {
  const l = jet.thrustLapse;
  if (l === undefined) return null;
  const base = ENGINE_CLASS_COEFFICIENTS[l.engineClass];
  if (base === undefined) {
    throw new InputError(
      'thrustLapse.engineClass',
      l.engineClass,
      'highBypass, lowBypass or turbojet',
    );
  }
  return {
    engineClass: l.engineClass,
    throttleRatio: requirePositive('thrustLapse.throttleRatio', l.throttleRatio),
    a: requireFinite('thrustLapse.machCoefficient', l.machCoefficient ?? base.a, 0),
    b: requireFinite('thrustLapse.breakCoefficient', l.breakCoefficient ?? base.b, 0),
  };
}

/** Half-width (in θ₀) over which the throttle break is rounded (header). */
export const BREAK_ROUNDING = 0.004;

/** max(0, u) with its corner replaced by a parabola over |u| < w: exact outside, C¹ across. */
function roundedBreak(u: number): number {
  const w = BREAK_ROUNDING;
  if (u <= -w) return 0;
  if (u >= w) return u;
  return ((u + w) * (u + w)) / (4 * w);
}

/** α = T_max/T_SL of the engine-class forms (header) at the air state and Mach M. */
export function classLapse(c: ClassLapse, atm: AtmosphereState, mach: number): number {
  const { theta0, delta0 } = totalRatios(atm, mach);
  const x = roundedBreak(theta0 - c.throttleRatio);
  const rootM = Math.sqrt(mach);
  let breakTerm: number;
  if (c.engineClass === 'highBypass') breakTerm = (c.b * x) / (1.5 + mach);
  else if (c.engineClass === 'lowBypass') breakTerm = (c.b * x) / theta0;
  else breakTerm = (c.b * x) / ((9 + mach) * theta0);
  return Math.max(0, delta0 * (1 - c.a * rootM - breakTerm));
}

/** Maximum thrust at the air state and flight Mach (0 = static), N. */
export function maxThrust_N(jet: JetPowerplant, atm: AtmosphereState, mach = 0): number {
  const T_SL = requirePositive('maxThrustSL_N', jet.maxThrustSL_N, 'N');
  requireFinite('mach', mach, 0);
  const lapse = classLapseOf(jet);
  if (lapse !== null) {
    requirePositive('atm.delta', atm.delta);
    requirePositive('atm.theta', atm.theta);
    return T_SL * classLapse(lapse, atm, mach);
  }
  const n = jet.thrustLapseExponent;
  if (n === undefined) {
    throw new InputError('thrustLapseExponent', n, 'given when no thrustLapse class is set');
  }
  requireFinite('thrustLapseExponent', n, 0);
  const sigma = requirePositive('atm.sigma', atm.sigma);
  return T_SL * Math.pow(sigma, n);
}

/** The thrust the idle fraction applies to (header): T_max, or T_SL·δ for the class lapse. */
export function idleReferenceThrust_N(jet: JetPowerplant, atm: AtmosphereState, mach = 0): number {
  if (jet.thrustLapse === undefined) return maxThrust_N(jet, atm, mach);
  const T_SL = requirePositive('maxThrustSL_N', jet.maxThrustSL_N, 'N');
  return T_SL * requirePositive('atm.delta', atm.delta);
}

/** TSFC at the air state and Mach, kg/(N·s): (c₁ + c₂·M)·√θ or the constant tsfc_kg_Ns. */
export function tsfcAt_kg_Ns(jet: JetPowerplant, atm: AtmosphereState, mach: number): number {
  const c1 = requirePositive('tsfc_kg_Ns', jet.tsfc_kg_Ns, 'kg/(N·s)');
  if (jet.tsfcMachFactor === undefined) return c1;
  const f = requireFinite('tsfcMachFactor', jet.tsfcMachFactor, 0);
  requireFinite('mach', mach, 0);
  return c1 * (1 + f * mach) * Math.sqrt(requirePositive('atm.theta', atm.theta));
}

/** Fuel mass flow TSFC·T for a thrust T ≥ 0 at the air state and Mach. */
export function jetFuelFlow_kg_s(
  jet: JetPowerplant,
  thrust_N: number,
  atm?: AtmosphereState,
  mach = 0,
): number {
  const T = requireFinite('thrust_N', thrust_N, 0, Infinity, 'N');
  if (atm === undefined) return requirePositive('tsfc_kg_Ns', jet.tsfc_kg_Ns, 'kg/(N·s)') * T;
  return tsfcAt_kg_Ns(jet, atm, mach) * T;
}

/** Weight-specific thrust fuel consumption c_t = TSFC·g0, 1/s (at the state, if given). */
export function weightSpecificTsfc_1_s(
  jet: JetPowerplant,
  atm?: AtmosphereState,
  mach = 0,
): number {
  if (atm === undefined) return requirePositive('tsfc_kg_Ns', jet.tsfc_kg_Ns, 'kg/(N·s)') * G0;
  return tsfcAt_kg_Ns(jet, atm, mach) * G0;
}
