/**
 * Closed-form (Breguet-type) range and endurance for jet and propeller aircraft in level,
 * quasi-steady flight with a parabolic polar, for the classic flight programs.
 *
 * Sources: Anderson, Introduction to Flight, ch. 6 (the Breguet range and endurance forms);
 * Anderson, Aircraft Performance and Design, ch. 5 (the flight programs: cruise-climb,
 * constant altitude + constant CL, constant altitude + constant speed). Constant altitude +
 * constant speed integrates dW/D(W) with D = q·S·CD0 + k·W²/(q·S), which gives an arctangent.
 *
 * Consumptions are weight-specific: c_t (1/s) = TSFC·g0 for jets, c_p (1/m) = BSFC·g0 for
 * propellers. Weights W0 (start) > W1 (end) in N; all SI. Differences such as ln(W0/W1) and
 * √W0 − √W1 are written so that a small fuel burn keeps its digits.
 */
import { InputError, requireFinite, requirePositive } from './errors.ts';

/** Start and end weight, N (W0 > W1 > 0). */
export interface WeightSpan {
  W0: number;
  W1: number;
}
/** Lift and drag coefficient held along the flight. */
export interface ConstantCL extends WeightSpan {
  CL: number;
  CD: number;
}
/** Constant altitude and speed: the polar's CD0 and k at dynamic pressure ½ρV². */
export interface ConstantAltitudeSpeed extends WeightSpan {
  V: number;
  rho: number;
  S: number;
  CD0: number;
  k: number;
}
/** Jet: weight-specific thrust fuel consumption c_t, 1/s. */
export interface JetConsumption {
  ct: number;
}
/** Propeller: efficiency η and weight-specific power fuel consumption c_p, 1/m. */
export interface PropConsumption {
  eta: number;
  cp: number;
}

function positive(field: string, v: number): number {
  return requirePositive(field, v);
}

/**
 * Extreme but finite inputs (e.g. a consumption of 1e-320) can overflow; the result is refused
 * rather than returned as Infinity or NaN, naming the consumption that scales it.
 */
function finiteResult(value: number, field: string, input: number): number {
  if (!Number.isFinite(value)) throw new InputError(field, input, 'a value giving a finite result');
  return value;
}

function efficiency(eta: number): number {
  requireFinite('eta', eta, 0, 1);
  return positive('eta', eta);
}

/** Validates W0 > W1 > 0 and returns W0 − W1. */
function burn(W0: number, W1: number): number {
  positive('W0', W0);
  positive('W1', W1);
  if (!(W1 < W0)) throw new InputError('W1', W1, `below the start weight W0 = ${W0} N`);
  return W0 - W1;
}

/** ln(W0/W1), accurate for small burns. */
function logRatio(W0: number, W1: number): number {
  return Math.log1p(burn(W0, W1) / W1);
}

/** √W0 − √W1, accurate for small burns. */
function sqrtDifference(W0: number, W1: number): number {
  return burn(W0, W1) / (Math.sqrt(W0) + Math.sqrt(W1));
}

/**
 * ∫_{W1}^{W0} dW / D(W) with D = q·S·CD0 + k·W²/(q·S) (level flight at constant q):
 * [atan(W0·g) − atan(W1·g)]/√(CD0·k) with g = √(k/CD0)/(q·S); the difference of arctangents
 * is taken as one arctangent, atan((x0 − x1)/(1 + x0·x1)), valid for x0, x1 > 0.
 */
function inverseDragIntegral(
  V: number,
  rho: number,
  S: number,
  CD0: number,
  k: number,
  W0: number,
  W1: number,
): number {
  positive('V', V);
  positive('rho', rho);
  positive('S', S);
  positive('CD0', CD0);
  positive('k', k);
  const dW = burn(W0, W1);
  const g = Math.sqrt(k / CD0) / (0.5 * rho * V * V * S);
  return Math.atan((dW * g) / (1 + W0 * W1 * g * g)) / Math.sqrt(CD0 * k);
}

// --- Jet -----------------------------------------------------------------------------------

/** Cruise-climb (constant CL and V): R = (V/c_t)(CL/CD)·ln(W0/W1). Anderson, Intro. to Flight, ch. 6. */
export function rangeJetCruiseClimb(a: JetConsumption & ConstantCL & { V: number }): number {
  const LD = positive('CL', a.CL) / positive('CD', a.CD);
  return finiteResult(
    (positive('V', a.V) / positive('ct', a.ct)) * LD * logRatio(a.W0, a.W1),
    'ct',
    a.ct,
  );
}

/**
 * Constant altitude and CL (speed falls as weight falls):
 * R = (2/c_t)·√(2/(ρS))·(CL^½/CD)·(√W0 − √W1). Anderson, Introduction to Flight, ch. 6.
 */
export function rangeJetConstantAltitudeCL(
  a: JetConsumption & ConstantCL & { rho: number; S: number },
): number {
  const factor = Math.sqrt(2 / (positive('rho', a.rho) * positive('S', a.S)));
  const ratio = Math.sqrt(positive('CL', a.CL)) / positive('CD', a.CD);
  return finiteResult(
    (2 / positive('ct', a.ct)) * factor * ratio * sqrtDifference(a.W0, a.W1),
    'ct',
    a.ct,
  );
}

/**
 * Constant altitude and speed (CL falls as weight falls): dx/dW = −V/(c_t·D(W)), so
 * R = (V/c_t)·∫dW/D. Anderson, Aircraft Performance and Design, ch. 5.
 */
export function rangeJetConstantAltitudeSpeed(a: JetConsumption & ConstantAltitudeSpeed): number {
  const integral = inverseDragIntegral(a.V, a.rho, a.S, a.CD0, a.k, a.W0, a.W1);
  return finiteResult((a.V / positive('ct', a.ct)) * integral, 'ct', a.ct);
}

/**
 * Constant CL (any altitude program): E = (1/c_t)(CL/CD)·ln(W0/W1).
 * Anderson, Introduction to Flight, ch. 6.
 */
export function enduranceJetConstantCL(a: JetConsumption & ConstantCL): number {
  const LD = positive('CL', a.CL) / positive('CD', a.CD);
  return finiteResult((LD / positive('ct', a.ct)) * logRatio(a.W0, a.W1), 'ct', a.ct);
}

/** Constant altitude and speed: E = (1/c_t)·∫dW/D. Anderson, Aircraft Performance and Design, ch. 5. */
export function enduranceJetConstantAltitudeSpeed(
  a: JetConsumption & ConstantAltitudeSpeed,
): number {
  const integral = inverseDragIntegral(a.V, a.rho, a.S, a.CD0, a.k, a.W0, a.W1);
  return finiteResult(integral / positive('ct', a.ct), 'ct', a.ct);
}

// --- Propeller -----------------------------------------------------------------------------

/**
 * Constant CL (any altitude program): R = (η/c_p)(CL/CD)·ln(W0/W1).
 * Anderson, Introduction to Flight, ch. 6.
 */
export function rangePropConstantCL(a: PropConsumption & ConstantCL): number {
  const LD = positive('CL', a.CL) / positive('CD', a.CD);
  return finiteResult(
    (efficiency(a.eta) / positive('cp', a.cp)) * LD * logRatio(a.W0, a.W1),
    'cp',
    a.cp,
  );
}

/**
 * Constant altitude and speed: dx/dW = −η/(c_p·D(W)), R = (η/c_p)·∫dW/D.
 * Anderson, Aircraft Performance and Design, ch. 5.
 */
export function rangePropConstantAltitudeSpeed(a: PropConsumption & ConstantAltitudeSpeed): number {
  const integral = inverseDragIntegral(a.V, a.rho, a.S, a.CD0, a.k, a.W0, a.W1);
  return finiteResult((efficiency(a.eta) / positive('cp', a.cp)) * integral, 'cp', a.cp);
}

/**
 * Constant altitude and CL: E = (η/c_p)(CL^1.5/CD)·√(2ρS)·(W1^−½ − W0^−½).
 * Anderson, Introduction to Flight, ch. 6.
 */
export function endurancePropConstantAltitudeCL(
  a: PropConsumption & ConstantCL & { rho: number; S: number },
): number {
  const ratio = Math.pow(positive('CL', a.CL), 1.5) / positive('CD', a.CD);
  const factor = Math.sqrt(2 * positive('rho', a.rho) * positive('S', a.S));
  // W1^−½ − W0^−½ = (√W0 − √W1)/√(W0·W1)
  const inverseRootDifference = sqrtDifference(a.W0, a.W1) / Math.sqrt(a.W0 * a.W1);
  return finiteResult(
    (efficiency(a.eta) / positive('cp', a.cp)) * ratio * factor * inverseRootDifference,
    'cp',
    a.cp,
  );
}

/**
 * Cruise-climb (constant CL and V): dt/dW = −η/(c_p·V·D), D = W·CD/CL, so
 * E = (η/(c_p·V))(CL/CD)·ln(W0/W1). Anderson, Aircraft Performance and Design, ch. 5.
 */
export function endurancePropCruiseClimb(a: PropConsumption & ConstantCL & { V: number }): number {
  const LD = positive('CL', a.CL) / positive('CD', a.CD);
  const coefficient = efficiency(a.eta) / (positive('cp', a.cp) * positive('V', a.V));
  return finiteResult(coefficient * LD * logRatio(a.W0, a.W1), 'cp', a.cp);
}

/**
 * Constant altitude and speed: dt/dW = −η/(c_p·V·D(W)), E = (η/(c_p·V))·∫dW/D.
 * Anderson, Aircraft Performance and Design, ch. 5.
 */
export function endurancePropConstantAltitudeSpeed(
  a: PropConsumption & ConstantAltitudeSpeed,
): number {
  const integral = inverseDragIntegral(a.V, a.rho, a.S, a.CD0, a.k, a.W0, a.W1);
  return finiteResult((efficiency(a.eta) / (positive('cp', a.cp) * a.V)) * integral, 'cp', a.cp);
}
