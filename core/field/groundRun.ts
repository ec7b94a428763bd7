/**
 * The ground run shared by take-off and landing: forces on the rolling aircraft and their
 * integration from one airspeed to another.
 *
 * Equation of motion along the runway (Anderson, Introduction to Flight, ch. 6; Raymer,
 * Aircraft Design, ch. 17; from memory):  m·dV/dt = T − D − μ·(W·cosθ − L) − W·sinθ,
 * with L = ½ρV²·S·CL_g, D = ½ρV²·S·(CD0 + φ·k·CL_g²), θ the runway slope (+ uphill). The
 * normal force cos θ is kept exact; the usual small-slope form drops it. In a steady wind
 * the airspeed V and the ground speed V − V_w change at the same rate, so with V as the
 * variable of integration the run is two quadratures:
 *     s = ∫ (V − V_w)/a(V) dV,   t = ∫ dV/a(V),   a = dV/dt,
 * evaluated here by composite Gauss–Legendre quadrature (nodes by Newton iteration on the
 * Legendre polynomial, Press et al., Numerical Recipes, §4.5), refined until the distance
 * settles to 1e-13 relative. The pieces are split at the kinks of the force law.
 *
 * Ground effect on induced drag: φ = (16h/b)²/(1 + (16h/b)²), h wing height above the
 * ground, b span (McCormick, as quoted by Anderson, Introduction to Flight, ch. 6; from memory).
 */
import { requireFinite, requirePositive, InputError } from '../errors.ts';
import { G0 } from '../units.ts';

/** Ground-run lift coefficient when none is given: tricycle gear at the ground attitude with
 * take-off or landing flaps (common practice, from memory; typical 0.1–0.6). */
export const DEFAULT_CL_GROUND = 0.3;

export interface GroundAircraft {
  mass_kg: number;
  wingArea_m2: number;
  /** Zero-lift drag coefficient with gear and flaps at the setting in use. */
  CD0: number;
  /** Induced-drag factor k of CD = CD0 + k·CL². */
  k: number;
  /** Maximum lift coefficient with flaps at the setting in use. */
  CLmax: number;
  /** Lift coefficient during the ground run (attitude-limited); DEFAULT_CL_GROUND if omitted. */
  CL_ground?: number;
  /** Ground-effect factor φ on induced drag, 0 < φ ≤ 1; 1 (none) if omitted. */
  groundEffect?: number;
}

export interface RunwayConditions {
  rho_kg_m3: number;
  /** Wind component along the runway: + headwind, − tailwind. */
  headwind_m_s?: number;
  /** Runway gradient, rise over run in the direction of the roll: + uphill. */
  slope?: number;
}

/** Checked, resolved inputs of the ground run (SI, weight in N). */
export interface GroundRunParams {
  mass_kg: number;
  weight_N: number;
  S: number;
  CD0: number;
  k: number;
  CLmax: number;
  CL_ground: number;
  phi: number;
  rho: number;
  headwind: number;
  sinSlope: number;
  cosSlope: number;
}

export function groundEffectFactor(wingHeight_m: number, span_m: number): number {
  const h = requirePositive('wingHeight_m', wingHeight_m, 'm');
  const b = requirePositive('span_m', span_m, 'm');
  const r = (16 * h) / b;
  return (r * r) / (1 + r * r);
}

export function groundRunParams(a: GroundAircraft, c: RunwayConditions): GroundRunParams {
  const mass_kg = requireFinite('mass_kg', a.mass_kg, 1e-3, 1e6, 'kg');
  const slope = requireFinite('slope', c.slope ?? 0, -0.2, 0.2);
  const phi = requireFinite('groundEffect', a.groundEffect ?? 1, 0, 1);
  if (phi <= 0) throw new InputError('groundEffect', phi, 'above 0 and at most 1');
  return {
    mass_kg,
    weight_N: mass_kg * G0,
    S: requireFinite('wingArea_m2', a.wingArea_m2, 1e-3, 2000, 'm²'),
    CD0: requireFinite('CD0', a.CD0, 0, 1),
    k: requireFinite('k', a.k, 0, 1),
    CLmax: requireFinite('CLmax', a.CLmax, 0.1, 6),
    CL_ground: requireFinite('CL_ground', a.CL_ground ?? DEFAULT_CL_GROUND, 0, 3),
    phi,
    rho: requireFinite('rho_kg_m3', c.rho_kg_m3, 0.05, 1.6, 'kg/m³'),
    headwind: requireFinite('headwind_m_s', c.headwind_m_s ?? 0, -100, 100, 'm/s'),
    sinSlope: slope / Math.sqrt(1 + slope * slope),
    cosSlope: 1 / Math.sqrt(1 + slope * slope),
  };
}

/** V_s = √(2W/(ρ·S·CLmax)). */
export function groundStallSpeed(p: GroundRunParams): number {
  return Math.sqrt((2 * p.weight_N) / (p.rho * p.S * p.CLmax));
}

/**
 * Acceleration along the runway at airspeed V for a thrust and a friction coefficient.
 * Reverse flow (V < 0, a tailwind start) makes no lift and pushes the aircraft forward.
 */
export function runwayAcceleration(
  p: GroundRunParams,
  V: number,
  thrust_N: number,
  mu: number,
): number {
  const qS = 0.5 * p.rho * p.S * V * Math.abs(V);
  const lift = V > 0 ? qS * p.CL_ground : 0;
  const drag = qS * (p.CD0 + p.phi * p.k * p.CL_ground * p.CL_ground);
  const normal = Math.max(0, p.weight_N * p.cosSlope - lift);
  return (thrust_N - drag - mu * normal - p.weight_N * p.sinSlope) / p.mass_kg;
}

export type RunResult =
  | { ok: true; distance_m: number; time_s: number }
  /** The acceleration vanishes or turns against the run at `stuckAt_m_s` airspeed. */
  | { ok: false; stuckAt_m_s: number };

const SCAN_POINTS = 400;

/**
 * Integrates the run from airspeed V0 to V1 (either direction) in a steady headwind V_w;
 * `breaks` are airspeeds where the force law has a kink. a(V) must keep the sign of V1 − V0
 * on the whole interval; where it does not, the run never reaches V1 (ok: false).
 */
export function integrateRun(
  accel: (V: number) => number,
  V0: number,
  V1: number,
  headwind_m_s: number,
  breaks: readonly number[] = [],
): RunResult {
  const dir = Math.sign(V1 - V0);
  if (dir === 0) return { ok: true, distance_m: 0, time_s: 0 };
  for (let i = 0; i <= SCAN_POINTS; i++) {
    const V = V0 + ((V1 - V0) * i) / SCAN_POINTS;
    if (!(accel(V) * dir > 0)) return { ok: false, stuckAt_m_s: V };
  }
  const inside = breaks.filter((b) => (b - V0) * dir > 0 && (V1 - b) * dir > 0);
  const cuts = [V0, ...inside.sort((x, y) => (x - y) * dir), V1];
  let distance_m = 0;
  let time_s = 0;
  for (let i = 0; i + 1 < cuts.length; i++) {
    const a = cuts[i] as number;
    const b = cuts[i + 1] as number;
    const piece = refine(
      (V) => {
        const acc = accel(V);
        return [(V - headwind_m_s) / acc, 1 / acc];
      },
      a,
      b,
    );
    distance_m += piece[0];
    time_s += piece[1];
  }
  if (!Number.isFinite(distance_m) || !Number.isFinite(time_s))
    return { ok: false, stuckAt_m_s: V1 };
  return { ok: true, distance_m, time_s };
}

const GL_ORDER = 8;
const GL = gaussLegendre(GL_ORDER);

/** Composite Gauss–Legendre on [a, b] with doubling panel counts until the first component settles. */
function refine(f: (V: number) => [number, number], a: number, b: number): [number, number] {
  let previous = composite(f, a, b, 4);
  for (let panels = 8; panels <= 4096; panels *= 2) {
    const next = composite(f, a, b, panels);
    const scale = Math.max(Math.abs(next[0]), 1e-12);
    if (Math.abs(next[0] - previous[0]) <= 1e-13 * scale) return next;
    previous = next;
  }
  return previous;
}

function composite(
  f: (V: number) => [number, number],
  a: number,
  b: number,
  panels: number,
): [number, number] {
  const h = (b - a) / panels;
  let s0 = 0;
  let s1 = 0;
  for (let p = 0; p < panels; p++) {
    const mid = a + (p + 0.5) * h;
    for (let i = 0; i < GL_ORDER; i++) {
      const [y0, y1] = f(mid + 0.5 * h * (GL.x[i] as number));
      const w = GL.w[i] as number;
      s0 += w * y0;
      s1 += w * y1;
    }
  }
  return [0.5 * h * s0, 0.5 * h * s1];
}

/** Nodes and weights of n-point Gauss–Legendre quadrature on [−1, 1] (Numerical Recipes, gauleg). */
export function gaussLegendre(n: number): { x: number[]; w: number[] } {
  const x = new Array<number>(n).fill(0);
  const w = new Array<number>(n).fill(0);
  for (let i = 0; i < Math.ceil(n / 2); i++) {
    let z = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let dp = 1;
    for (let iter = 0; iter < 100; iter++) {
      let p1 = 1;
      let p2 = 0;
      for (let j = 1; j <= n; j++) {
        const p3 = p2;
        p2 = p1;
        p1 = ((2 * j - 1) * z * p2 - (j - 1) * p3) / j;
      }
      dp = (n * (z * p1 - p2)) / (z * z - 1);
      const dz = p1 / dp;
      z -= dz;
      if (Math.abs(dz) < 1e-16) break;
    }
    x[i] = -z;
    x[n - 1 - i] = z;
    w[i] = w[n - 1 - i] = 2 / ((1 - z * z) * dp * dp);
  }
  return { x, w };
}
