/**
 * Parabolic drag polar CD = CD0 + k·(CL − CLminD)², k = 1/(π·e·AR), and its optimum points.
 *
 * Source: Anderson, Introduction to Flight, ch. 6 (symmetric polar: (L/D)max, minimum power,
 * jet best range, V_minpower = 3^(−1/4)·V_mindrag). With a minimum-drag offset CLminD the
 * optima follow from the same stationarity condition d/dCL[CL^m/CD] = 0, which for a
 * parabolic polar is a quadratic in CL with exactly one positive root (derived here; the
 * REFERENCES.md offset case checks it). CD0 here is the minimum drag coefficient, reached
 * at CL = CLminD. The optimum points are those of the polar alone: they are not limited by
 * CLmax, so callers compare them with the stall limit themselves.
 */
import { InputError, requireFinite, requirePositive } from './errors.ts';
import type { Polar } from './plan/schema.ts';

export interface PolarCoefficients {
  CD0: number;
  k: number;
  CLminD: number;
  CLmax: number;
  /** Drag rise near the stall: ΔCD = riseK·(CL − riseCL)² above riseCL (absent: none). */
  riseCL?: number;
  riseK?: number;
}

/** An optimum point of the polar: the CL, its CD and the value of the maximised ratio. */
export interface PolarPoint {
  CL: number;
  CD: number;
  value: number;
}

/** k = 1/(π·e·AR) from geometry, or the given factor (Anderson, Introduction to Flight, ch. 6). */
export function inducedDragFactor(polar: Polar): number {
  if (polar.induced.by === 'factor') return requirePositive('polar.induced.k', polar.induced.k);
  const e = requireFinite('polar.induced.e', polar.induced.e, 0, 1);
  if (e <= 0) throw new InputError('polar.induced.e', e, 'above 0 and at most 1');
  const AR = requirePositive('polar.induced.AR', polar.induced.AR);
  return 1 / (Math.PI * e * AR);
}

export function polarCoefficients(polar: Polar): PolarCoefficients {
  const c: PolarCoefficients = {
    CD0: polar.CD0,
    k: inducedDragFactor(polar),
    CLminD: polar.CLminD,
    CLmax: polar.CLmax,
  };
  const rise = polar.stallDragRise;
  if (rise !== undefined && rise.atCLmax > 0) {
    const onset = requireFinite(
      'polar.stallDragRise.onsetCL',
      rise.onsetCL,
      Math.max(polar.CLminD, 0),
      Infinity,
    );
    if (!(onset < polar.CLmax)) {
      throw new InputError('polar.stallDragRise.onsetCL', onset, `below CLmax (${polar.CLmax})`);
    }
    const span = polar.CLmax - onset;
    c.riseCL = onset;
    c.riseK = requireFinite('polar.stallDragRise.atCLmax', rise.atCLmax, 0, 1) / (span * span);
  }
  return checkCoefficients(c);
}

/**
 * The drag rise near the stall (0 below its onset). Form: a quadratic onset, smooth (C¹) at
 * CL_onset, reaching the given ΔCD at CLmax — our own simple form for the separation that
 * the parabola leaves out (from memory: measured polars of light aircraft and UAVs bend away
 * from the parabola over the last 15–25 % of CL before CLmax).
 */
export function stallDragRise(c: PolarCoefficients, CL: number): number {
  const r = c.riseCL;
  if (r === undefined || !(CL > r)) return 0;
  const d = CL - r;
  return (c.riseK ?? 0) * d * d;
}

function checkCoefficients(c: PolarCoefficients): PolarCoefficients {
  requirePositive('CD0', c.CD0);
  requirePositive('k', c.k);
  requireFinite('CLminD', c.CLminD);
  requirePositive('CLmax', c.CLmax);
  return c;
}

function checkCL(CL: number, field = 'CL'): number {
  return requireFinite(field, CL);
}

export function dragCoefficient(c: PolarCoefficients, CL: number): number {
  checkCoefficients(c);
  const d = checkCL(CL) - c.CLminD;
  return c.CD0 + c.k * d * d + stallDragRise(c, CL);
}

export function liftToDrag(c: PolarCoefficients, CL: number): number {
  return CL / dragCoefficient(c, CL);
}

/**
 * (L/D)max: CL* = √(CLminD² + CD0/k), L/D = 1/(2k(CL* − CLminD)); with CLminD = 0 this is
 * CL* = √(CD0/k), CD = 2·CD0, (L/D)max = 1/(2√(k·CD0)) (Anderson, Introduction to Flight, ch. 6).
 */
export function maxLiftToDrag(c: PolarCoefficients): { CL: number; CD: number; LD: number } {
  checkCoefficients(c);
  const CL = Math.sqrt(c.CLminD * c.CLminD + c.CD0 / c.k);
  const CD = dragCoefficient(c, CL);
  return { CL, CD, LD: 1 / (2 * c.k * (CL - c.CLminD)) };
}

/**
 * The CL that maximises CL^m/CD for 0 < m < 2. Stationarity m·CD = CL·dCD/dCL gives
 * k(2 − m)·CL² + 2k·CLminD·(m − 1)·CL − m(CD0 + k·CLminD²) = 0. The leading coefficient is
 * positive and the constant negative, so exactly one root is positive; CL^m/CD → 0 at both
 * ends of (0, ∞), so that root is the maximum. Solved without cancellation
 * (Press et al., Numerical Recipes, §5.6, from memory).
 */
function optimumOfPower(c: PolarCoefficients, m: number): PolarPoint {
  checkCoefficients(c);
  const a = c.k * (2 - m);
  const b = 2 * c.k * c.CLminD * (m - 1);
  const cc = -m * (c.CD0 + c.k * c.CLminD * c.CLminD);
  const root = Math.sqrt(b * b - 4 * a * cc);
  const q = b >= 0 ? -0.5 * (b + root) : 0.5 * (root - b);
  const CL = b >= 0 ? cc / q : q / a;
  const CD = dragCoefficient(c, CL);
  return { CL, CD, value: Math.pow(CL, m) / CD };
}

/**
 * Minimum power required: max CL^1.5/CD (propeller endurance). Symmetric polar:
 * CL = √(3·CD0/k), CD = 4·CD0 (Anderson, Introduction to Flight, ch. 6).
 */
export function minPowerPoint(c: PolarCoefficients): PolarPoint {
  return optimumOfPower(c, 1.5);
}

/**
 * Jet best range at constant altitude: max CL^0.5/CD. Symmetric polar:
 * CL = √(CD0/(3k)), CD = 4/3·CD0 (Anderson, Introduction to Flight, ch. 6).
 */
export function jetBestRangePoint(c: PolarCoefficients): PolarPoint {
  return optimumOfPower(c, 0.5);
}

function checkFlight(weight_N: number, rho: number, S: number): void {
  requirePositive('weight_N', weight_N, 'N');
  requirePositive('rho', rho, 'kg/m³');
  requirePositive('S', S, 'm²');
}

/** Level flight L = W: CL = 2W/(ρ·S·V²). */
export function liftCoefficient(weight_N: number, rho: number, S: number, V: number): number {
  checkFlight(weight_N, rho, S);
  requirePositive('V', V, 'm/s');
  return (2 * weight_N) / (rho * S * V * V);
}

/** Level flight: V = √(2W/(ρ·S·CL)), defined for CL > 0. */
export function speedForLiftCoefficient(
  weight_N: number,
  rho: number,
  S: number,
  CL: number,
): number {
  checkFlight(weight_N, rho, S);
  requirePositive('CL', CL);
  return Math.sqrt((2 * weight_N) / (rho * S * CL));
}

/** V_stall = √(2W/(ρ·S·CLmax)) (Anderson, Introduction to Flight, ch. 5). */
export function stallSpeed(weight_N: number, rho: number, S: number, CLmax: number): number {
  checkFlight(weight_N, rho, S);
  requirePositive('CLmax', CLmax);
  return Math.sqrt((2 * weight_N) / (rho * S * CLmax));
}

/** Speed of minimum drag ((L/D)max) in level flight. */
export function minDragSpeed(
  c: PolarCoefficients,
  weight_N: number,
  rho: number,
  S: number,
): number {
  return speedForLiftCoefficient(weight_N, rho, S, maxLiftToDrag(c).CL);
}

/** Speed of minimum power required (max CL^1.5/CD) in level flight. */
export function minPowerSpeed(
  c: PolarCoefficients,
  weight_N: number,
  rho: number,
  S: number,
): number {
  return speedForLiftCoefficient(weight_N, rho, S, minPowerPoint(c).CL);
}

/** Speed of jet best range at constant altitude (max CL^0.5/CD) in level flight. */
export function jetBestRangeSpeed(
  c: PolarCoefficients,
  weight_N: number,
  rho: number,
  S: number,
): number {
  return speedForLiftCoefficient(weight_N, rho, S, jetBestRangePoint(c).CL);
}

/** Drag in level flight: D = ½ρV²·S·CD(CL), CL = 2W/(ρSV²). */
export function dragForce(
  c: PolarCoefficients,
  weight_N: number,
  rho: number,
  S: number,
  V: number,
): number {
  const CL = liftCoefficient(weight_N, rho, S, V);
  return 0.5 * rho * V * V * S * dragCoefficient(c, CL);
}

/** Power required in level flight: P = D·V. */
export function powerRequired_W(
  c: PolarCoefficients,
  weight_N: number,
  rho: number,
  S: number,
  V: number,
): number {
  return dragForce(c, weight_N, rho, S, V) * V;
}
