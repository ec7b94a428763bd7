/**
 * Parts of the Dormand–Prince integrator (ode.ts) kept apart for size: the starting step
 * size (Hairer, Nørsett & Wanner, Solving Ordinary Differential Equations I, §II.4) and the
 * location of an event on a step's dense output (Illinois regula falsi; Dowell & Jarratt,
 * BIT 11, 1971, from memory), and the pool of work arrays.
 */
import type { OdeRhs, OdeStep } from './ode.ts';

/**
 * Where between xa (event ≥ 0) and xb (event < 0) the event function crosses zero, found on
 * the dense output by the Illinois variant of regula falsi; returns the non-negative side.
 */
export function locateEvent(
  event: (x: number, y: Float64Array) => number,
  xa: number,
  xb: number,
  step: OdeStep,
  scratch: Float64Array,
): number {
  step.interpolate(xa, scratch);
  let ga = event(xa, scratch);
  step.interpolate(xb, scratch);
  let gb = event(xb, scratch);
  let a = xa;
  let b = xb;
  let side = 0;
  const tol = 1e-13 * Math.abs(xb - xa) + 4 * Number.EPSILON * Math.abs(xb);
  for (let it = 0; it < 200 && Math.abs(b - a) > tol; it++) {
    let c =
      ga - gb !== 0 && Number.isFinite(ga) && Number.isFinite(gb)
        ? a + (ga * (b - a)) / (ga - gb)
        : 0.5 * (a + b);
    if (!(Math.abs(c - a) > 0 && Math.abs(b - c) > 0)) c = 0.5 * (a + b);
    step.interpolate(c, scratch);
    const gc = event(c, scratch);
    if (gc >= 0) {
      a = c;
      ga = gc;
      if (side === 1) gb *= 0.5;
      side = 1;
    } else {
      b = c;
      gb = gc;
      if (side === -1) ga *= 0.5;
      side = -1;
    }
  }
  return a;
}

/** Starting step size (Hairer, Nørsett & Wanner, §II.4, algorithm for the initial step). */
export function initialStep(
  f: OdeRhs,
  x0: number,
  y0: Float64Array,
  f0: Float64Array,
  dir: number,
  hMax: number,
  rtol: number,
  atol: number,
  y1: Float64Array,
  f1: Float64Array,
): number {
  const n = y0.length;
  let d0 = 0;
  let d1 = 0;
  for (let i = 0; i < n; i++) {
    const sk = atol + rtol * Math.abs(y0[i]!);
    d0 += (y0[i]! / sk) ** 2;
    d1 += (f0[i]! / sk) ** 2;
  }
  d0 = Math.sqrt(d0 / n);
  d1 = Math.sqrt(d1 / n);
  let h0 = d0 < 1e-10 || d1 < 1e-10 ? 1e-6 : 0.01 * (d0 / d1);
  h0 = Math.min(h0, hMax);
  for (let i = 0; i < n; i++) y1[i] = y0[i]! + dir * h0 * f0[i]!;
  f(x0 + dir * h0, y1, f1);
  let d2 = 0;
  for (let i = 0; i < n; i++) {
    const sk = atol + rtol * Math.abs(y0[i]!);
    d2 += ((f1[i]! - f0[i]!) / sk) ** 2;
  }
  d2 = Math.sqrt(d2 / n) / h0;
  const dm = Math.max(d1, d2);
  const h1 = dm <= 1e-15 ? Math.max(1e-6, h0 * 1e-3) : Math.pow(0.01 / dm, 0.2);
  const h = Math.min(100 * h0, h1, hMax);
  return Number.isFinite(h) && h > 0 ? h : hMax;
}

/** The work arrays of one integration: stages, trial state, dense-output coefficients. */
export interface OdeWorkspace {
  n: number;
  k1: Float64Array;
  k2: Float64Array;
  k3: Float64Array;
  k4: Float64Array;
  k5: Float64Array;
  k6: Float64Array;
  k7: Float64Array;
  yt: Float64Array;
  yNew: Float64Array;
  yOld: Float64Array;
  /** The state at an event and f there. */
  ye: Float64Array;
  ke: Float64Array;
  r: readonly [Float64Array, Float64Array, Float64Array, Float64Array, Float64Array];
}

// Sweeps and Monte Carlo runs integrate tens of thousands of short legs; reusing the work
// arrays spares the garbage collector. Each running integration holds its own workspace, so
// an integration started from inside another (a right-hand side that integrates) is safe.
const pool: OdeWorkspace[] = [];
const POOL_SIZE = 8;

export function acquireWorkspace(n: number): OdeWorkspace {
  for (let i = pool.length - 1; i >= 0; i--) {
    const ws = pool[i]!;
    if (ws.n === n) {
      pool[i] = pool[pool.length - 1]!;
      pool.pop();
      return ws;
    }
  }
  const a = () => new Float64Array(n);
  return {
    n,
    k1: a(),
    k2: a(),
    k3: a(),
    k4: a(),
    k5: a(),
    k6: a(),
    k7: a(),
    yt: a(),
    yNew: a(),
    yOld: a(),
    ye: a(),
    ke: a(),
    r: [a(), a(), a(), a(), a()],
  };
}

export function releaseWorkspace(ws: OdeWorkspace): void {
  if (pool.length < POOL_SIZE) pool.push(ws);
}
