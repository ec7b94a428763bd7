/**
 * One-dimensional searches used by the optimizers: golden-section maximisation of a
 * unimodal function, bisection for the edge of a feasible interval, and a bracketed root
 * (Illinois variant of regula falsi). Sources: Press et al., Numerical Recipes, §10.2
 * (golden section), §9.1–9.2 (bisection, false position); Dowell & Jarratt 1971 (Illinois
 * modification) — all from memory. A function value of `null` means "infeasible here" and
 * ranks below every number, so no NaN or Infinity ever leaves these routines.
 */

/** A point and the value of the objective there. */
export interface SearchPoint {
  x: number;
  value: number;
}

const INV_PHI = (Math.sqrt(5) - 1) / 2; // 0.618…

function better(a: SearchPoint | null, b: SearchPoint | null): SearchPoint | null {
  if (a === null) return b;
  if (b === null) return a;
  return b.value > a.value ? b : a;
}

/**
 * Maximise `f` on [a, b] by golden section until the bracket is narrower than `tol_x`.
 * `start` (e.g. the best point of a preceding grid) is kept if nothing better is found,
 * so the answer is never worse than the grid. Returns null only if every evaluation was
 * infeasible and no start point was given.
 */
export function goldenSectionMax(
  f: (x: number) => number | null,
  a: number,
  b: number,
  tol_x: number,
  start: SearchPoint | null = null,
  maxEvaluations = 80,
): SearchPoint | null {
  let lo = Math.min(a, b);
  let hi = Math.max(a, b);
  let best = start;
  const evalAt = (x: number): SearchPoint | null => {
    const v = f(x);
    return v === null || !Number.isFinite(v) ? null : { x, value: v };
  };
  const rank = (p: SearchPoint | null) => (p === null ? -Infinity : p.value);
  let x1 = hi - INV_PHI * (hi - lo);
  let x2 = lo + INV_PHI * (hi - lo);
  let p1 = evalAt(x1);
  let p2 = evalAt(x2);
  best = better(better(best, p1), p2);
  for (let n = 2; n < maxEvaluations && hi - lo > tol_x; n++) {
    if (rank(p1) >= rank(p2)) {
      hi = x2;
      x2 = x1;
      p2 = p1;
      x1 = hi - INV_PHI * (hi - lo);
      p1 = evalAt(x1);
      best = better(best, p1);
    } else {
      lo = x1;
      x1 = x2;
      p1 = p2;
      x2 = lo + INV_PHI * (hi - lo);
      p2 = evalAt(x2);
      best = better(best, p2);
    }
  }
  return best;
}

/**
 * The edge of a feasible interval: `ok(good)` holds and `ok(bad)` does not (either order);
 * bisects until |good − bad| ≤ tol_x and returns the last point where `ok` held.
 */
export function bisectEdge(
  ok: (x: number) => boolean,
  good: number,
  bad: number,
  tol_x: number,
  maxEvaluations = 100,
): number {
  let g = good;
  let b = bad;
  for (let n = 0; n < maxEvaluations && Math.abs(b - g) > tol_x; n++) {
    const mid = 0.5 * (g + b);
    if (ok(mid)) g = mid;
    else b = mid;
  }
  return g;
}

/**
 * A root of the continuous `f` in [a, b] with f(a)·f(b) ≤ 0, by regula falsi with the
 * Illinois modification (superlinear and safe: the bracket always holds the root).
 * Stops when the bracket is narrower than tol_x or |f| ≤ tol_f.
 */
export function bracketedRoot(
  f: (x: number) => number,
  a: number,
  b: number,
  tol_x: number,
  tol_f = 0,
  maxEvaluations = 100,
): number {
  let xa = a;
  let xb = b;
  let fa = f(xa);
  let fb = f(xb);
  if (Math.abs(fa) <= tol_f) return xa;
  if (Math.abs(fb) <= tol_f) return xb;
  let side = 0;
  for (let n = 2; n < maxEvaluations && Math.abs(xb - xa) > tol_x; n++) {
    let x = (xa * fb - xb * fa) / (fb - fa);
    // Guard against a degenerate secant (equal values) by falling back to bisection.
    if (!Number.isFinite(x) || x <= Math.min(xa, xb) || x >= Math.max(xa, xb)) x = 0.5 * (xa + xb);
    const fx = f(x);
    if (Math.abs(fx) <= tol_f) return x;
    if (fx * fb > 0) {
      xb = x;
      fb = fx;
      if (side === -1) fa /= 2;
      side = -1;
    } else {
      xa = x;
      fa = fx;
      if (side === 1) fb /= 2;
      side = 1;
    }
  }
  return Math.abs(fa) < Math.abs(fb) ? xa : xb;
}
