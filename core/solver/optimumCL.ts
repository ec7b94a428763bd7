/**
 * Lift coefficients of the still-air speed optima at constant weight, so the best-range and
 * best-endurance schedules need no search when the air is calm (the speed then follows from
 * V = √(2W/(ρ·S·CL)); Anderson, Introduction to Flight, ch. 6).
 *
 * With P = D·V = W·V·CD/CL and V ∝ CL^(−1/2):
 *  - best endurance: least fuel flow or battery drain. Every powerplant model here consumes a
 *    monotone function of its demand (jet: thrust, so the (L/D)max CL; propeller and electric:
 *    power, so the max CL^1.5/CD CL), also with the idle floor.
 *  - best range: most distance per unit consumed. Jet V/T: max CL^0.5/CD; propeller V/P: (L/D)max;
 *    electric with Peukert exponent n the drain grows as P^n (Traub, J. Aircraft 48(2), 2011),
 *    V/P^n ∝ (CL^m/CD)^n with m = (3n − 1)/(2n), which is (L/D)max at n = 1 and Traub's
 *    best-range speed for a symmetric polar. With an idle floor (fuel burners) the range optimum
 *    holds only where the demand is above idle, and the electric one only where the battery
 *    power is at least the rated discharge power (Peukert applies only there); the caller
 *    (speeds.ts) checks.
 * The maximum of CL^m/CD (0 < m < 2) for CD = CD0 + k(CL − CLminD)² is the positive root of
 * k(2 − m)·CL² + 2k·CLminD·(m − 1)·CL − m(CD0 + k·CLminD²) = 0 (stationarity:
 * m·CD = CL·dCD/dCL).
 */
import type { PolarCoefficients } from '../polar.ts';
import type { PowerConstants } from './power.ts';
import { maximizeBounded } from './optimize1d.ts';
import { dragCoefficientOf } from './speeds.ts';

/** The CL maximising CL^m/CD, 0 < m < 2 (root taken without cancellation). */
export function clMaximizing(c: PolarCoefficients, m: number): number {
  const a = c.k * (2 - m);
  const b = 2 * c.k * c.CLminD * (m - 1);
  const cc = -m * (c.CD0 + c.k * c.CLminD * c.CLminD);
  const root = Math.sqrt(b * b - 4 * a * cc);
  return b >= 0 ? (2 * cc) / -(b + root) : (root - b) / (2 * a);
}

export interface OptimumCL {
  /** Best range in still air (subject to the idle check for fuel burners). */
  range: number;
  /** Best endurance (any wind). */
  endurance: number;
  /** Best glide: (L/D)max. */
  glide: number;
}

/**
 * With a stall drag rise (core/polar.ts) the parabola's optimum holds when it lies below the
 * onset (the rise only lowers CL^m/CD above it); otherwise the optimum lies between the onset
 * and the parabola's optimum (above that, both factors fall) and is searched there.
 */
function optimumWithRise(c: PolarCoefficients, m: number): number {
  const CL = clMaximizing(c, m);
  const r = c.riseCL;
  if (r === undefined || !(CL > r)) return CL;
  return maximizeBounded((x) => Math.pow(x, m) / dragCoefficientOf(c, x), r, CL).x;
}

export function optimumCL(c: PolarCoefficients, power: PowerConstants): OptimumCL {
  if (c.riseCL !== undefined) {
    const glide = optimumWithRise(c, 1);
    switch (power.type) {
      case 'jet':
        return { range: optimumWithRise(c, 0.5), endurance: glide, glide };
      case 'propeller':
        return { range: glide, endurance: optimumWithRise(c, 1.5), glide };
      case 'electric': {
        const n = power.peukertExponent;
        return {
          range: optimumWithRise(c, (3 * n - 1) / (2 * n)),
          endurance: optimumWithRise(c, 1.5),
          glide,
        };
      }
    }
  }
  const glide = clMaximizing(c, 1);
  switch (power.type) {
    case 'jet':
      return { range: clMaximizing(c, 0.5), endurance: glide, glide };
    case 'propeller':
      return { range: glide, endurance: clMaximizing(c, 1.5), glide };
    case 'electric': {
      const n = power.peukertExponent;
      const range = clMaximizing(c, (3 * n - 1) / (2 * n));
      return { range, endurance: clMaximizing(c, 1.5), glide };
    }
  }
}
