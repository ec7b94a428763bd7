/**
 * A user's propeller efficiency table, η against airspeed V or advance ratio J = V/(n·D),
 * interpolated with the monotone piecewise cubic of Fritsch & Carlson ("Monotone Piecewise
 * Cubic Interpolation", SIAM J. Numer. Anal. 17(2), 1980): smooth (C¹), through every point,
 * and never overshooting between points, so a measured curve keeps its shape.
 *
 * The abscissas must increase strictly (a table that is not increasing in J or V is refused,
 * naming the point). Below the first point the efficiency falls linearly to 0 at x = 0 (a
 * propeller at rest delivers no thrust power); above the last point it is held at the last
 * value — the table says nothing there, and the README says so.
 */
import { InputError, requireFinite } from '../errors.ts';

export interface TablePoint {
  x: number;
  efficiency: number;
}

/** Knots and Fritsch–Carlson slopes, prepared once. */
export interface EfficiencyTable {
  readonly x: readonly number[];
  readonly y: readonly number[];
  readonly m: readonly number[];
}

/** Checks the points (field names `${field}.i.x`, `${field}.i.efficiency`) and prepares the slopes. */
export function efficiencyTable(points: readonly TablePoint[], field: string): EfficiencyTable {
  if (points.length < 2) throw new InputError(field, points.length, 'at least 2 points');
  const x: number[] = [];
  const y: number[] = [];
  points.forEach((p, i) => {
    const xi = requireFinite(`${field}.${i}.x`, p.x, 0, Infinity);
    const prev = x[i - 1];
    if (prev !== undefined && !(xi > prev)) {
      throw new InputError(
        `${field}.${i}.x`,
        xi,
        `above the previous point's ${prev} (increasing)`,
      );
    }
    const e = requireFinite(`${field}.${i}.efficiency`, p.efficiency, 0, 1);
    if (!(e > 0 && e < 1)) throw new InputError(`${field}.${i}.efficiency`, e, 'above 0, below 1');
    x.push(xi);
    y.push(e);
  });
  if (!(x[0]! > 0)) throw new InputError(`${field}.0.x`, x[0], 'above 0');
  return { x, y, m: fritschCarlsonSlopes(x, y) };
}

function fritschCarlsonSlopes(x: readonly number[], y: readonly number[]): number[] {
  const n = x.length;
  const d: number[] = [];
  for (let i = 0; i < n - 1; i++) d.push((y[i + 1]! - y[i]!) / (x[i + 1]! - x[i]!));
  const m: number[] = [d[0]!];
  for (let i = 1; i < n - 1; i++) {
    const a = d[i - 1]!;
    const b = d[i]!;
    m.push(a * b <= 0 ? 0 : (a + b) / 2);
  }
  m.push(d[n - 2]!);
  for (let i = 0; i < n - 1; i++) {
    const di = d[i]!;
    if (di === 0) {
      m[i] = 0;
      m[i + 1] = 0;
      continue;
    }
    const a = m[i]! / di;
    const b = m[i + 1]! / di;
    const s = a * a + b * b;
    if (s > 9) {
      const t = 3 / Math.sqrt(s);
      m[i] = t * a * di;
      m[i + 1] = t * b * di;
    }
  }
  return m;
}

/** η at x ≥ 0 (see the header for x outside the table). Unchecked: the ODE calls it. */
export function tableEfficiency(t: EfficiencyTable, xq: number): number {
  const { x, y, m } = t;
  const n = x.length;
  const x0 = x[0]!;
  if (xq <= x0) return xq > 0 ? (y[0]! * xq) / x0 : 0;
  if (xq >= x[n - 1]!) return y[n - 1]!;
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (x[mid]! <= xq) lo = mid;
    else hi = mid;
  }
  const h = x[hi]! - x[lo]!;
  const s = (xq - x[lo]!) / h;
  const s2 = s * s;
  const s3 = s2 * s;
  return (
    (2 * s3 - 3 * s2 + 1) * y[lo]! +
    (s3 - 2 * s2 + s) * h * m[lo]! +
    (-2 * s3 + 3 * s2) * y[hi]! +
    (s3 - s2) * h * m[hi]!
  );
}
