/**
 * Least-squares fit of a parabolic drag polar to measured (CL, CD) pairs.
 *
 * Model: CD = a + b·CL + c·CL² (with a minimum-drag offset) or CD = a + c·CL² (symmetric).
 * Then k = c, CLminD = −b/(2c), CD0 = a − c·CLminD², so CD = CD0 + k·(CL − CLminD)²
 * (the parabolic polar of Anderson, Introduction to Flight, ch. 6). The linear problem is
 * solved by Householder QR of the design matrix (Golub & Van Loan, Matrix Computations,
 * §§5.2–5.3, from memory), which avoids squaring the condition number as the normal
 * equations do.
 */
import { InputError } from './errors.ts';

export interface PolarFitPoint {
  CL: number;
  CD: number;
}

export interface PolarFitOptions {
  /** Fit CLminD as well (3 coefficients); default false: symmetric polar, CLminD = 0. */
  withOffset?: boolean;
}

export interface PolarFit {
  CD0: number;
  k: number;
  CLminD: number;
  /** Coefficient of determination 1 − SS_res/SS_tot. */
  rSquared: number;
  /** Root-mean-square residual in CD. */
  rmse: number;
  /** Measured minus fitted CD, in the order of the points. */
  residuals: number[];
}

const FIELD = 'points';

/**
 * Least-squares solution of A·x ≈ y by Householder QR. A is given by its n columns, each of
 * length m ≥ n. Returns null when the columns are (numerically) linearly dependent.
 */
function solveLeastSquares(columns: readonly number[][], y: readonly number[]): number[] | null {
  const cols = columns.map((c) => c.slice());
  const z = y.slice();
  const m = z.length;
  const n = cols.length;
  const scale = Math.max(...cols.map((c) => Math.max(...c.map(Math.abs))));
  // Applies the reflection I − 2vvᵀ/(vᵀv) (v non-zero from row j on) to a vector in place.
  const reflect = (v: readonly number[], vv: number, j: number, u: number[]): void => {
    let dot = 0;
    for (let i = j; i < m; i++) dot += (v[i] ?? 0) * (u[i] ?? 0);
    const f = (2 * dot) / vv;
    for (let i = j; i < m; i++) u[i] = (u[i] ?? 0) - f * (v[i] ?? 0);
  };
  for (let j = 0; j < n; j++) {
    const col = cols[j] ?? [];
    let norm = 0;
    for (let i = j; i < m; i++) norm = Math.hypot(norm, col[i] ?? 0);
    if (!(norm > 1e-12 * scale * Math.sqrt(m))) return null;
    const alpha = (col[j] ?? 0) > 0 ? -norm : norm;
    const v = col.map((x, i) => (i < j ? 0 : i === j ? x - alpha : x));
    const vv = v.reduce((s, x) => s + x * x, 0);
    for (let l = j; l < n; l++) reflect(v, vv, j, cols[l] ?? []);
    reflect(v, vv, j, z);
  }
  // Back substitution on the upper-triangular R (R[i][l] = cols[l][i]).
  const x = new Array<number>(n).fill(0);
  for (let j = n - 1; j >= 0; j--) {
    let s = z[j] ?? 0;
    for (let l = j + 1; l < n; l++) s -= (cols[l]?.[j] ?? 0) * (x[l] ?? 0);
    x[j] = s / (cols[j]?.[j] ?? 1);
  }
  return x;
}

export function fitPolar(
  points: readonly PolarFitPoint[],
  options: PolarFitOptions = {},
): PolarFit {
  const withOffset = options.withOffset ?? false;
  const needed = withOffset ? 3 : 2;
  if (!Array.isArray(points) || points.length < needed) {
    const count = Array.isArray(points) ? points.length : points;
    throw new InputError(FIELD, count, `at least ${needed} (CL, CD) points`);
  }
  points.forEach((p, i) => {
    if (!Number.isFinite(p?.CL) || !Number.isFinite(p?.CD)) {
      throw new InputError(FIELD, p, `finite CL and CD at every point (point ${i} is not)`);
    }
  });

  const ones = points.map(() => 1);
  const CL = points.map((p) => p.CL);
  const CL2 = points.map((p) => p.CL * p.CL);
  const y = points.map((p) => p.CD);
  const x = solveLeastSquares(withOffset ? [ones, CL, CL2] : [ones, CL2], y);
  if (!x) {
    const distinct = withOffset ? 'distinct CL values' : 'distinct CL² values';
    throw new InputError(FIELD, points.length, `points at ${needed} or more ${distinct}`);
  }
  const a = x[0] ?? 0;
  const b = withOffset ? (x[1] ?? 0) : 0;
  const c = x[withOffset ? 2 : 1] ?? 0;
  if (!(c > 0)) {
    throw new InputError(FIELD, c, 'data whose fitted induced-drag factor k is above 0');
  }
  const CLminD = withOffset ? -b / (2 * c) : 0;
  const CD0 = a - c * CLminD * CLminD;
  if (!(CD0 > 0)) {
    throw new InputError(FIELD, CD0, 'data whose fitted minimum drag coefficient CD0 is above 0');
  }

  const residuals = points.map((p) => p.CD - (a + b * p.CL + c * p.CL * p.CL));
  const meanCD = y.reduce((s, v) => s + v, 0) / y.length;
  const ssRes = residuals.reduce((s, r) => s + r * r, 0);
  const ssTot = y.reduce((s, v) => s + (v - meanCD) ** 2, 0);
  // ssTot = 0 with c > 0 cannot occur (constant CD fits with c = 0); guard anyway.
  const rSquared = ssTot > 0 ? 1 - ssRes / ssTot : 1;
  return { CD0, k: c, CLminD, rSquared, rmse: Math.sqrt(ssRes / points.length), residuals };
}
