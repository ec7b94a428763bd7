/**
 * Adaptive explicit Runge–Kutta integrator: Dormand–Prince 5(4) with FSAL, the 5th-order
 * solution propagated and the embedded 4th-order one used for the error estimate, and
 * Hairer's 4th-order dense output (Dormand & Prince, J. Comput. Appl. Math. 6(1), 1980;
 * Hairer, Nørsett & Wanner, Solving Ordinary Differential Equations I, 2nd ed., §II.4–II.6,
 * including the starting-step heuristic and the step-size control without PI feedback).
 *
 * Written here rather than taken from a package because it runs in the browser bundle,
 * reports every accepted step with its dense interpolant (chart series, events) and
 * allocates only its work arrays once per call. The independent variable may decrease.
 */

import { dopriStages, settleOnEvent } from './odeStages.ts';
import {
  acquireWorkspace,
  initialStep,
  locateEvent,
  releaseWorkspace,
  type OdeWorkspace,
} from './odeSupport.ts';

export type OdeRhs = (x: number, y: Float64Array, dydx: Float64Array) => void;

/** An accepted step, handed to `onStep`; the object and its arrays are reused between calls. */
export interface OdeStep {
  x0: number;
  x1: number;
  y0: Float64Array;
  y1: Float64Array;
  /** Dense output: writes y(x) for x between x0 and x1 into `out`. */
  interpolate(x: number, out: Float64Array): void;
}

export interface OdeOptions {
  /** Relative tolerance per component (default 1e-9). */
  rtol?: number;
  /** Absolute tolerance per component (default 1e-12). */
  atol?: number;
  /** First trial step size (absolute value); chosen automatically when omitted. */
  initialStep?: number;
  /** Largest step size (absolute value); default the whole interval. */
  maxStep?: number;
  /** Accepted steps allowed before giving up (default 100 000). */
  maxSteps?: number;
  onStep?: (step: OdeStep) => void;
  /**
   * Stops the integration where this function first becomes negative; the crossing is located
   * on the dense output and the returned state is on its non-negative side.
   */
  event?: (x: number, y: Float64Array) => number;
}

export interface OdeResult {
  x: number;
  y: Float64Array;
  steps: number;
  rejected: number;
  evaluations: number;
  /** True when `event` stopped the integration before x1. */
  stoppedByEvent: boolean;
}

/** The integration could not be completed (too many steps, step size underflow, bad input). */
export class OdeError extends Error {
  override readonly name = 'OdeError';
}

// Dormand–Prince 5(4) tableau: stages and weights in odeStages.ts.
// Error coefficients: 5th-order weights minus 4th-order weights.
const E1 = 71 / 57600;
const E3 = -71 / 16695;
const E4 = 71 / 1920;
const E5 = -17253 / 339200;
const E6 = 22 / 525;
const E7 = -1 / 40;
// Dense output (Hairer's DOPRI5 code, CONTD5).
const D1 = -12715105075 / 11282082432;
const D3 = 87487479700 / 32700410799;
const D4 = -10690763975 / 1880347072;
const D5 = 701980252875 / 199316789632;
const D6 = -1453857185 / 822651844;
const D7 = 69997945 / 29380423;

const SAFETY = 0.9;
const FAC_MIN = 0.2;
const FAC_MAX = 10;

/** Integrates y' = f(x, y) from (x0, y0) to x1 (x1 may be below x0). */
export function integrate(
  f: OdeRhs,
  x0: number,
  y0: ArrayLike<number>,
  x1: number,
  options: OdeOptions = {},
): OdeResult {
  const n = y0.length;
  const rtol = options.rtol ?? 1e-9;
  const atol = options.atol ?? 1e-12;
  const maxSteps = options.maxSteps ?? 100_000;
  if (!Number.isFinite(x0) || !Number.isFinite(x1)) {
    throw new OdeError(`integration interval must be finite (from ${x0} to ${x1})`);
  }
  if (!(rtol > 0) || !(atol >= 0)) throw new OdeError('tolerances must be positive');
  const y = Float64Array.from(y0);
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(y[i] as number)) throw new OdeError(`initial state y[${i}] is not finite`);
  }
  const result: OdeResult = {
    x: x0,
    y,
    steps: 0,
    rejected: 0,
    evaluations: 0,
    stoppedByEvent: false,
  };
  const event = options.event;
  if (event && event(x0, y) < 0) {
    result.stoppedByEvent = true;
    return result;
  }
  if (x1 === x0) return result;

  const dir = x1 > x0 ? 1 : -1;
  const span = Math.abs(x1 - x0);
  const hMax = Math.min(options.maxStep ?? span, span);
  const ws = acquireWorkspace(n);
  try {
    return steps(f, x0, x1, options, result, ws, dir, hMax, rtol, atol, maxSteps);
  } finally {
    releaseWorkspace(ws);
  }
}

/** The step loop of `integrate`, on pooled work arrays. */
function steps(
  f: OdeRhs,
  x0: number,
  x1: number,
  options: OdeOptions,
  result: OdeResult,
  ws: OdeWorkspace,
  dir: number,
  hMax: number,
  rtol: number,
  atol: number,
  maxSteps: number,
): OdeResult {
  const { n, k2, k3, k4, k5, k6, yt, r, yOld } = ws;
  const event = options.event;
  const y = result.y;
  let k7 = ws.k7;
  let kFirst = ws.k1;
  let yNew = ws.yNew;
  let yCur = y;
  let stepH = 0;
  let stepX0 = x0;
  const wantDense = options.onStep !== undefined || event !== undefined;
  const stepView: OdeStep = {
    x0,
    x1: x0,
    y0: yOld,
    y1: yNew,
    interpolate(x: number, out: Float64Array): void {
      const s = (x - stepX0) / stepH;
      const s1 = 1 - s;
      for (let i = 0; i < n; i++) {
        out[i] = r[0][i]! + s * (r[1][i]! + s1 * (r[2][i]! + s * (r[3][i]! + s1 * r[4][i]!)));
      }
    },
  };

  f(x0, yCur, kFirst);
  result.evaluations++;
  let h = options.initialStep ?? initialStep(f, x0, yCur, kFirst, dir, hMax, rtol, atol, yt, k2);
  if (options.initialStep === undefined) result.evaluations++;
  h = dir * Math.min(Math.abs(h), hMax);
  let x = x0;
  let lastRejected = false;

  for (;;) {
    if (result.steps >= maxSteps) {
      throw new OdeError(
        `integration needed more than ${maxSteps} steps (stopped at ${x} on the way from ${x0} to ${x1})`,
      );
    }
    let last = false;
    if (dir * (x + 1.01 * h - x1) >= 0) {
      h = x1 - x;
      last = true;
    }
    if (h === 0 || Math.abs(h) < 16 * Number.EPSILON * Math.abs(x)) {
      throw new OdeError(`step size became too small at ${x} (from ${x0} to ${x1})`);
    }
    const ka = kFirst;
    const xNew = last ? x1 : x + h;
    dopriStages(f, x, h, xNew, yCur, ka, ws, yNew, k7);
    result.evaluations += 6;

    let sum = 0;
    for (let i = 0; i < n; i++) {
      const e =
        h * (E1 * ka[i]! + E3 * k3[i]! + E4 * k4[i]! + E5 * k5[i]! + E6 * k6[i]! + E7 * k7[i]!);
      const sc = atol + rtol * Math.max(Math.abs(yCur[i]!), Math.abs(yNew[i]!));
      sum += (e / sc) * (e / sc);
    }
    const err = Math.sqrt(sum / n);

    if (!(err <= 1)) {
      // Rejected (a non-finite error counts as a large one): shrink, never grow.
      result.rejected++;
      const fac = Number.isFinite(err) ? Math.max(FAC_MIN, SAFETY * Math.pow(err, -0.2)) : FAC_MIN;
      h *= Math.min(1, fac);
      lastRejected = true;
      continue;
    }

    result.steps++;
    if (wantDense) {
      for (let i = 0; i < n; i++) {
        const yd = yNew[i]! - yCur[i]!;
        const bspl = h * ka[i]! - yd;
        yOld[i] = yCur[i]!;
        r[0][i] = yCur[i]!;
        r[1][i] = yd;
        r[2][i] = bspl;
        r[3][i] = yd - h * k7[i]! - bspl;
        r[4][i] =
          h * (D1 * ka[i]! + D3 * k3[i]! + D4 * k4[i]! + D5 * k5[i]! + D6 * k6[i]! + D7 * k7[i]!);
      }
      stepX0 = x;
      stepH = h;
    }

    let stopAt = xNew;
    if (event && event(xNew, yNew) < 0) {
      stopAt = locateEvent(event, x, xNew, stepView, yt);
      // The state there from a Runge–Kutta step of its own rather than the interpolant, which
      // is less accurate, and much less where the crossing is a kink in f.
      const settled = settleOnEvent(f, event, x, stopAt, yCur, ka, ws);
      result.evaluations += settled.evaluations;
      if (settled.x !== null) {
        stopAt = settled.x;
        yNew.set(ws.ye);
      } else stepView.interpolate(stopAt, yNew);
      result.stoppedByEvent = true;
    }
    if (options.onStep) {
      stepView.x0 = x;
      stepView.x1 = stopAt;
      stepView.y1 = yNew;
      options.onStep(stepView);
    }

    // Accept: the new state becomes current, and k7 = f(xNew, yNew) is the next k1 (FSAL).
    const ySwap = yCur;
    yCur = yNew;
    yNew = ySwap;
    const kSwap = kFirst;
    kFirst = k7;
    k7 = kSwap;
    x = stopAt;
    if (result.stoppedByEvent || last) break;

    const fac =
      err === 0 ? FAC_MAX : Math.min(FAC_MAX, Math.max(FAC_MIN, SAFETY * Math.pow(err, -0.2)));
    h *= lastRejected ? Math.min(1, fac) : fac;
    h = dir * Math.min(Math.abs(h), hMax);
    lastRejected = false;
  }

  result.x = x;
  if (yCur !== y) y.set(yCur);
  return result;
}
