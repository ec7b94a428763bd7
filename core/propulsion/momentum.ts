/**
 * Actuator-disk momentum theory of a propeller, with a profile factor for the losses it
 * leaves out (McCormick, Aerodynamics, Aeronautics and Flight Mechanics, ch. 6).
 *
 * A disk of area A = πD²/4 (times the number of propellers) adds the induced velocity w at
 * the disk to the flight speed V: T = 2ρA(V + w)·w, and the ideal power is T(V + w). So the
 * ideal efficiency is η_i = V/(V + w) = 2/(1 + √(1 + 2T/(ρV²A))), and the ideal static thrust
 * for a shaft power P is T₀ = (2ρA·P²)^(1/3).
 *
 * The real propeller is taken as the ideal disk fed with η_p·P, η_p a constant profile
 * factor (blade drag, swirl, tip losses; ≈ 0.85 common practice, from memory):
 * T·(V + w) = η_p·P. With u = V + w this is the cubic 2ρA·u²(u − V) = η_p·P, which has
 * exactly one root u > V (solved in closed form below, Cardano; no cancellation). Then
 * T = η_p·P/u and the efficiency is η = T·V/P = η_p·V/u, which rises from 0 at V = 0 towards
 * η_p at high advance ratio. At V = 0 the thrust is (2ρA)^(1/3)·(η_p·P)^(2/3): the static
 * thrust of the same disk with figure of merit η_p (core/field/thrust.ts uses this very
 * function, so climb and take-off see one propeller).
 *
 * Left out: blade stall at low advance ratio and compressibility at the tips (the efficiency
 * of a real propeller falls again at high advance ratio), and rpm and pitch (the disk always
 * absorbs the power it is given, as a constant-speed propeller does).
 */
import { InputError, requireFinite, requirePositive } from '../errors.ts';

/** Disk area of `count` propellers of diameter D. */
export function diskArea_m2(diameter_m: number, count = 1): number {
  requirePositive('diameter_m', diameter_m, 'm');
  return (count * Math.PI * diameter_m * diameter_m) / 4;
}

/** Ideal efficiency for thrust T at speed V: 2/(1 + √(1 + 2T/(ρV²A))) (McCormick, ch. 6). */
export function idealEfficiency(
  thrust_N: number,
  V_m_s: number,
  rho_kg_m3: number,
  area_m2: number,
): number {
  const T = requireFinite('thrust_N', thrust_N, 0, Infinity, 'N');
  const V = requirePositive('V_m_s', V_m_s, 'm/s');
  const rho = requirePositive('rho_kg_m3', rho_kg_m3, 'kg/m³');
  const A = requirePositive('area_m2', area_m2, 'm²');
  return 2 / (1 + Math.sqrt(1 + (2 * T) / (rho * V * V * A)));
}

/** Ideal static thrust T₀ = (2ρA·P²)^(1/3) (McCormick, ch. 6). */
export function idealStaticThrust(
  shaftPower_W: number,
  rho_kg_m3: number,
  area_m2: number,
): number {
  const P = requireFinite('shaftPower_W', shaftPower_W, 0, Infinity, 'W');
  const rho = requirePositive('rho_kg_m3', rho_kg_m3, 'kg/m³');
  const A = requirePositive('area_m2', area_m2, 'm²');
  return Math.cbrt(2 * rho * A * P * P);
}

/**
 * Velocity through the disk u = V + w for a power η_p·P: the root u > V of
 * u³ − V·u² − K = 0, K = η_p·P/(2ρA). Depressed with u = t + V/3, the discriminant is
 * positive, and t = C + V²/(9C) with C = ∛(V³/27 + K/2 + √(K²/4 + K·V³/27)).
 * Unchecked (the ODE right-hand side calls it); V ≥ 0, K ≥ 0.
 */
export function diskVelocity(V_m_s: number, K: number): number {
  const V = V_m_s;
  if (!(K > 0)) return V;
  const V3 = V * V * V;
  const C = Math.cbrt(V3 / 27 + K / 2 + Math.sqrt((K * K) / 4 + (K * V3) / 27));
  return V / 3 + C + (V * V) / (9 * C);
}

/** Thrust and efficiency of the disk at speed V for shaft power P (unchecked; see the header). */
export function momentumThrust_N(
  shaftPower_W: number,
  V_m_s: number,
  rho_kg_m3: number,
  area_m2: number,
  profileFactor: number,
): number {
  const Pp = profileFactor * shaftPower_W;
  if (!(Pp > 0)) return 0;
  return Pp / diskVelocity(V_m_s, Pp / (2 * rho_kg_m3 * area_m2));
}

/** Efficiency η = T·V/P = η_p·V/u at speed V > 0 for shaft power P (unchecked). */
export function momentumEfficiency(
  shaftPower_W: number,
  V_m_s: number,
  rho_kg_m3: number,
  area_m2: number,
  profileFactor: number,
): number {
  const Pp = profileFactor * shaftPower_W;
  if (!(Pp > 0)) return profileFactor;
  return (profileFactor * V_m_s) / diskVelocity(V_m_s, Pp / (2 * rho_kg_m3 * area_m2));
}

/**
 * Shaft power that delivers thrust power T·V at V > 0: P = T(V + w)/η_p with the induced
 * velocity w = (√(V² + 2T/(ρA)) − V)/2 from T = 2ρA(V + w)w (unchecked).
 */
export function shaftPowerForThrustPower(
  thrustPower_W: number,
  V_m_s: number,
  rho_kg_m3: number,
  area_m2: number,
  profileFactor: number,
): number {
  if (!(thrustPower_W > 0)) return 0;
  const T = thrustPower_W / V_m_s;
  const u = (V_m_s + Math.sqrt(V_m_s * V_m_s + (2 * T) / (rho_kg_m3 * area_m2))) / 2;
  return (T * u) / profileFactor;
}

/**
 * The profile factor that makes the efficiency η_c at speed V for shaft power P. With
 * u = η_p·V/η_c the cubic becomes η_p² − η_c·η_p − c = 0, c = P·η_c³/(2ρA·V³), so
 * η_p = (η_c + √(η_c² + 4c))/2. A factor above 1 would mean the disk loading allows no such
 * efficiency: refused, naming `field`.
 */
export function calibrateProfileFactor(
  efficiency: number,
  V_m_s: number,
  rho_kg_m3: number,
  shaftPower_W: number,
  area_m2: number,
  field = 'propEfficiency',
): number {
  const eta = requireFinite(field, efficiency, 0, 1);
  if (!(eta > 0)) throw new InputError(field, eta, 'above 0 and at most 1');
  const V = requirePositive('cruiseSpeed_m_s', V_m_s, 'm/s');
  const rho = requirePositive('rho_kg_m3', rho_kg_m3, 'kg/m³');
  const P = requirePositive('shaftPower_W', shaftPower_W, 'W');
  const A = requirePositive('area_m2', area_m2, 'm²');
  const c = (P * eta * eta * eta) / (2 * rho * A * V * V * V);
  const profile = (eta + Math.sqrt(eta * eta + 4 * c)) / 2;
  if (!(profile <= 1)) {
    // The most this disk can give at the cruise point (η_p = 1): η = V/u with u³ − V·u² = K.
    const best = V / diskVelocity(V, P / (2 * rho * A));
    throw new InputError(
      field,
      eta,
      `at most ${best.toPrecision(3)} for this propeller diameter at the cruise point (momentum theory: a larger diameter or a lower cruise power allows more)`,
    );
  }
  return profile;
}
