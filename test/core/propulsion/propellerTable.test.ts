/**
 * The propeller efficiency table (core/propulsion/propellerTable.ts): monotone piecewise
 * cubic of Fritsch & Carlson (SIAM J. Numer. Anal. 17(2), 1980) — through every point, no
 * overshoot between points — and the refusal of tables that do not increase in J or V.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/errors.ts';
import { PropellerCurveSchema } from '../../../core/plan/schema.ts';
import { efficiencyTable, tableEfficiency } from '../../../core/propulsion/propellerTable.ts';

// An invented η(J) curve of the usual shape (common practice: rises to a peak, falls after).
const POINTS = [
  { x: 0.2, efficiency: 0.35 },
  { x: 0.4, efficiency: 0.6 },
  { x: 0.6, efficiency: 0.76 },
  { x: 0.8, efficiency: 0.83 },
  { x: 0.9, efficiency: 0.8 },
  { x: 1.0, efficiency: 0.65 },
];

describe('propeller efficiency table', () => {
  const t = efficiencyTable(POINTS, 'p.points');

  it('round trip: every table point comes back (an interpolant passes through its knots)', () => {
    for (const p of POINTS)
      expect(Math.abs(tableEfficiency(t, p.x) - p.efficiency)).toBeLessThan(1e-15);
  });

  it('no overshoot: between two points the value stays between them (Fritsch–Carlson 1980)', () => {
    for (let i = 0; i + 1 < POINTS.length; i++) {
      const a = POINTS[i]!;
      const b = POINTS[i + 1]!;
      const lo = Math.min(a.efficiency, b.efficiency);
      const hi = Math.max(a.efficiency, b.efficiency);
      for (let s = 0; s <= 1; s += 0.05) {
        const v = tableEfficiency(t, a.x + s * (b.x - a.x));
        expect(v).toBeGreaterThanOrEqual(lo - 1e-12);
        expect(v).toBeLessThanOrEqual(hi + 1e-12);
      }
    }
  });

  it('smooth: the slope is continuous at an inner point (C¹, central differences)', () => {
    const h = 1e-6;
    const left = (tableEfficiency(t, 0.6) - tableEfficiency(t, 0.6 - h)) / h;
    const right = (tableEfficiency(t, 0.6 + h) - tableEfficiency(t, 0.6)) / h;
    expect(Math.abs(left - right)).toBeLessThan(1e-3 * Math.abs(left));
  });

  it('refuses a table not increasing in J, naming the point', () => {
    const bad = [POINTS[0]!, POINTS[2]!, POINTS[1]!];
    expect(() => efficiencyTable(bad, 'p.points')).toThrow(InputError);
    try {
      efficiencyTable(bad, 'p.points');
    } catch (e) {
      expect((e as InputError).field).toBe('p.points.2.x');
    }
    const r = PropellerCurveSchema.safeParse({
      model: 'table',
      by: 'advanceRatio',
      rpm: 2400,
      diameter_m: 1.8,
      points: bad,
    });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]?.path).toEqual(['points', 2, 'x']);
    expect(r.error?.issues[0]?.message).toMatch(/must increase in x/);
  });

  it('refuses an advance-ratio table without rpm, naming rpm', () => {
    const r = PropellerCurveSchema.safeParse({
      model: 'table',
      by: 'advanceRatio',
      points: POINTS,
    });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]?.path).toEqual(['rpm']);
  });

  it('efficiency in (0, 1) and no NaN anywhere for any increasing table (fast-check)', () => {
    const table = fc
      .array(
        fc.record({
          dx: fc.double({ min: 0.01, max: 50, noNaN: true }),
          efficiency: fc.double({ min: 0.01, max: 0.99, noNaN: true }),
        }),
        { minLength: 2, maxLength: 12 },
      )
      .map((pts) => {
        let x = 0;
        return pts.map((p) => ({ x: (x += p.dx), efficiency: p.efficiency }));
      });
    fc.assert(
      fc.property(table, fc.double({ min: 0, max: 1000, noNaN: true }), (pts, xq) => {
        const v = tableEfficiency(efficiencyTable(pts, 'p'), xq);
        expect(Number.isFinite(v)).toBe(true);
        expect(v).toBeGreaterThanOrEqual(0);
        expect(v).toBeLessThan(1);
        if (xq > 1e-9) expect(v).toBeGreaterThan(0); // (denormal x underflows to 0)
      }),
    );
  });
});
