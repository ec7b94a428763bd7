/**
 * The stages of one Dormand–Prince 5(4) step (tableau: Dormand & Prince, J. Comput. Appl.
 * Math. 6(1), 1980; Hairer, Nørsett & Wanner, Solving Ordinary Differential Equations I,
 * Table II.5.2), and the state where an event function crosses zero, by steps of their own.
 */
import type { OdeRhs } from './ode.ts';
import type { OdeWorkspace } from './odeSupport.ts';

const C2 = 1 / 5;
const C3 = 3 / 10;
const C4 = 4 / 5;
const C5 = 8 / 9;
const A21 = 1 / 5;
const A31 = 3 / 40;
const A32 = 9 / 40;
const A41 = 44 / 45;
const A42 = -56 / 15;
const A43 = 32 / 9;
const A51 = 19372 / 6561;
const A52 = -25360 / 2187;
const A53 = 64448 / 6561;
const A54 = -212 / 729;
const A61 = 9017 / 3168;
const A62 = -355 / 33;
const A63 = 46732 / 5247;
const A64 = 49 / 176;
const A65 = -5103 / 18656;
const A71 = 35 / 384;
const A73 = 500 / 1113;
const A74 = 125 / 192;
const A75 = -2187 / 6784;
const A76 = 11 / 84;
/**
 * One Dormand–Prince step of size h from (x, y) with k1 = f(x, y) given: the stages k2..k6
 * into the workspace, the 5th-order solution into yOut and f(xEnd, yOut) into kEnd (FSAL).
 */
export function dopriStages(
  f: OdeRhs,
  x: number,
  h: number,
  xEnd: number,
  y: Float64Array,
  ka: Float64Array,
  ws: OdeWorkspace,
  yOut: Float64Array,
  kEnd: Float64Array,
): void {
  const { n, k2, k3, k4, k5, k6, yt } = ws;
  for (let i = 0; i < n; i++) yt[i] = y[i]! + h * A21 * ka[i]!;
  f(x + C2 * h, yt, k2);
  for (let i = 0; i < n; i++) yt[i] = y[i]! + h * (A31 * ka[i]! + A32 * k2[i]!);
  f(x + C3 * h, yt, k3);
  for (let i = 0; i < n; i++) yt[i] = y[i]! + h * (A41 * ka[i]! + A42 * k2[i]! + A43 * k3[i]!);
  f(x + C4 * h, yt, k4);
  for (let i = 0; i < n; i++) {
    yt[i] = y[i]! + h * (A51 * ka[i]! + A52 * k2[i]! + A53 * k3[i]! + A54 * k4[i]!);
  }
  f(x + C5 * h, yt, k5);
  for (let i = 0; i < n; i++) {
    yt[i] = y[i]! + h * (A61 * ka[i]! + A62 * k2[i]! + A63 * k3[i]! + A64 * k4[i]! + A65 * k5[i]!);
  }
  f(xEnd, yt, k6);
  for (let i = 0; i < n; i++) {
    yOut[i] =
      y[i]! + h * (A71 * ka[i]! + A73 * k3[i]! + A74 * k4[i]! + A75 * k5[i]! + A76 * k6[i]!);
  }
  f(xEnd, yOut, kEnd);
}

/**
 * The state at an event located on a step's interpolant, from a step of its own from
 * (x, y): regula falsi on such steps (3 at most) until the event function is not negative
 * there, as the integrator promises. x: null when that does not happen (the caller keeps
 * the interpolated state). The state is left in ws.ye.
 */
export function settleOnEvent(
  f: OdeRhs,
  event: (x: number, y: Float64Array) => number,
  x: number,
  xEvent: number,
  y: Float64Array,
  ka: Float64Array,
  ws: OdeWorkspace,
): { x: number | null; evaluations: number } {
  const g0 = event(x, y);
  let xe = xEvent;
  let evaluations = 0;
  for (let it = 0; it < 3 && xe !== x; it++) {
    dopriStages(f, x, xe - x, xe, y, ka, ws, ws.ye, ws.ke);
    evaluations += 6;
    const g = event(xe, ws.ye);
    if (g >= 0) return { x: xe, evaluations };
    if (!(g0 > g) || !Number.isFinite(g)) break;
    // Where the line through (x, g0) and (xe, g) crosses zero, a hair on the near side.
    const r = x + ((xe - x) * g0) / (g0 - g);
    xe = r - 1e-9 * (r - x);
  }
  return { x: null, evaluations };
}
