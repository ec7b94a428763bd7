/**
 * One-dimensional searches for the speed schedules: a bracketed maximum (golden section to
 * locate it, then Newton on a central-difference derivative to polish it) and a bracketed
 * root (Illinois regula falsi). Sources: Press et al., Numerical Recipes, 3rd ed., §9.2 and
 * §10.2 (golden section), §9.2 (false position and its Illinois modification), from memory.
 *
 * Why the Newton polish: a speed chosen inside an ODE right-hand side must be a smooth
 * function of the state, or the step-size control sees its search noise as error. A
 * golden-section answer is only good to about √ε and jumps with the iteration pattern; the
 * root of the central-difference derivative is smooth and converged to ~1e-12 relative.
 */

const GOLD = (Math.sqrt(5) - 1) / 2;
/** Relative step of the central differences (truncation bias ~1e-8, rounding ~1e-12). */
const REL_STEP = 1e-4;
/** Newton steps below this (relative) leave an error of its square: converged. */
const NEWTON_DONE = 1e-6;

export interface BoundedMaximum {
  x: number;
  /** Which end of the interval the maximum lies at, if it is not interior. */
  atBound: 'lo' | 'hi' | null;
}

/**
 * The maximum of a unimodal f on [lo, hi] (0 < lo). `guess` (for instance the answer at a
 * neighbouring state) lets the search start with Newton directly; `boundHint` (the answer at
 * a neighbouring state lay at that end) lets it confirm that end with two evaluations: for a
 * unimodal f, f(lo) ≥ f(lo + δ) puts the maximum within δ of lo, where the full search
 * would also snap to lo (boundOrInterior).
 */
export function maximizeBounded(
  f: (x: number) => number,
  lo: number,
  hi: number,
  guess?: number,
  boundHint?: 'lo' | 'hi',
): BoundedMaximum {
  if (!(hi > lo)) return { x: lo, atBound: 'lo' };
  if (boundHint === 'lo') {
    const d = Math.min(REL_STEP * lo, 0.5 * (hi - lo));
    if (f(lo) >= f(lo + d)) return { x: lo, atBound: 'lo' };
  } else if (boundHint === 'hi') {
    const d = Math.min(REL_STEP * hi, 0.5 * (hi - lo));
    if (f(hi) >= f(hi - d)) return { x: hi, atBound: 'hi' };
  }
  if (guess !== undefined && guess > lo && guess < hi) {
    const polished = newtonPolish(f, guess, lo, hi);
    if (polished) return polished;
  }
  const start = goldenSection(f, lo, hi, REL_STEP * lo);
  return newtonPolish(f, start, lo, hi) ?? boundOrInterior(start, lo, hi);
}

function boundOrInterior(x: number, lo: number, hi: number): BoundedMaximum {
  const tol = 2 * REL_STEP * x;
  if (x - lo <= tol) return { x: lo, atBound: 'lo' };
  if (hi - x <= tol) return { x: hi, atBound: 'hi' };
  return { x, atBound: null };
}

/** Golden-section search for the maximum of f on [a, b] to an interval of width `tol`. */
export function goldenSection(f: (x: number) => number, a: number, b: number, tol: number): number {
  let x1 = b - GOLD * (b - a);
  let x2 = a + GOLD * (b - a);
  let f1 = f(x1);
  let f2 = f(x2);
  for (let it = 0; it < 200 && b - a > tol; it++) {
    if (f1 >= f2 || !Number.isFinite(f2)) {
      b = x2;
      x2 = x1;
      f2 = f1;
      x1 = b - GOLD * (b - a);
      f1 = f(x1);
    } else {
      a = x1;
      x1 = x2;
      f1 = f2;
      x2 = a + GOLD * (b - a);
      f2 = f(x2);
    }
  }
  return 0.5 * (a + b);
}

/**
 * Newton iteration on the central-difference derivative from x; null when the function is
 * not concave there or the iteration wanders (the caller then falls back to bracketing).
 */
function newtonPolish(
  f: (x: number) => number,
  x: number,
  lo: number,
  hi: number,
): BoundedMaximum | null {
  for (let it = 0; it < 8; it++) {
    const d = REL_STEP * x;
    const fp = f(x + d);
    const f0 = f(x);
    const fm = f(x - d);
    const d1 = (fp - fm) / (2 * d);
    const d2 = (fp - 2 * f0 + fm) / (d * d);
    if (!(d2 < 0) || !Number.isFinite(d1)) return null;
    const step = -d1 / d2;
    if (!(Math.abs(step) <= 0.5 * x)) return null;
    const next = x + step;
    if (next <= lo) return { x: lo, atBound: 'lo' };
    if (next >= hi) return { x: hi, atBound: 'hi' };
    if (Math.abs(step) <= NEWTON_DONE * x) return { x: next, atBound: null };
    x = next;
  }
  return null;
}

/**
 * A root of g between a and b where g(a) and g(b) differ in sign, to `relTol` of |b|;
 * the Illinois variant of false position (Numerical Recipes §9.2), bisection as a fallback.
 */
export function rootBracketed(
  g: (x: number) => number,
  a: number,
  b: number,
  relTol = 1e-13,
): number {
  let ga = g(a);
  let gb = g(b);
  if (ga === 0) return a;
  if (gb === 0) return b;
  if (ga * gb > 0 || !Number.isFinite(ga) || !Number.isFinite(gb))
    return Math.abs(ga) < Math.abs(gb) ? a : b;
  for (let it = 0; it < 200; it++) {
    let c = a + (ga * (b - a)) / (ga - gb);
    if (!(Math.min(a, b) < c && c < Math.max(a, b))) c = 0.5 * (a + b);
    const gc = g(c);
    if (gc === 0) return c;
    // Illinois: keep the bracket; halve the value at an end that is retained.
    if (gc * gb < 0) {
      a = b;
      ga = gb;
    } else {
      ga *= 0.5;
    }
    b = c;
    gb = gc;
    if (Math.abs(b - a) <= relTol * Math.max(Math.abs(a), Math.abs(b))) return b;
  }
  return 0.5 * (a + b);
}
