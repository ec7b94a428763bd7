import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/errors.ts';
import { windComponents } from '../../../core/solver/wind.ts';
import { FT, KT } from '../../../core/units.ts';
import {
  headTailCross,
  windAt,
  windProfile,
  type WindLevel,
} from '../../../core/weather/windsAloft.ts';

function angleDiff(a: number, b: number): number {
  const d = Math.abs(a - b) % 360;
  return Math.min(d, 360 - d);
}

function rel(x: number, ref: number): number {
  return Math.abs(x / ref - 1);
}

const level = (alt_ft: number, from_deg: number, kt: number, isaOffset_K?: number): WindLevel =>
  isaOffset_K === undefined
    ? { altitude_m: alt_ft * FT, from_deg, speed_m_s: kt * KT }
    : { altitude_m: alt_ft * FT, from_deg, speed_m_s: kt * KT, isaOffset_K };

describe('windAt, vector interpolation', () => {
  it('across a veering layer the vector mean gives 315°/14.14 kt, not 315°/20 kt (computed)', () => {
    // 270°/20 kt: the air moves toward 090 → (east, north) = (+20, 0) kt.
    // 360°/20 kt: the air moves toward 180 → (0, −20) kt.
    // Halfway, at 2000 ft: (10, −10) kt, moving toward 135 → from 315,
    // speed √(10² + 10²) = 20·cos 45° = 14.142 kt.
    const w = windAt([level(1000, 270, 20), level(3000, 360, 20)], 2000 * FT);
    expect(angleDiff(w.from_deg, 315)).toBeLessThan(1e-9);
    expect(rel(w.speed_m_s, 20 * Math.cos(Math.PI / 4) * KT)).toBeLessThan(1e-12);
    expect(rel(w.east_m_s, 10 * KT)).toBeLessThan(1e-12);
    expect(rel(w.north_m_s, -10 * KT)).toBeLessThan(1e-12);
    expect(w.extrapolated).toBe(false);
  });

  it('wraps across 360/0: 350° and 010° average to 000°, speed 20·cos 10° (computed)', () => {
    const w = windAt([level(0, 350, 20), level(2000, 10, 20)], 1000 * FT);
    expect(angleDiff(w.from_deg, 0)).toBeLessThan(1e-9); // an average of angles would give 180
    expect(rel(w.speed_m_s, 20 * Math.cos((10 * Math.PI) / 180) * KT)).toBeLessThan(1e-12);
  });

  it('calm layers: half of 20 kt over a calm level, and calm itself reported as 000° (common practice)', () => {
    const w = windAt([level(1000, 0, 0), level(3000, 90, 20)], 2000 * FT);
    expect(angleDiff(w.from_deg, 90)).toBeLessThan(1e-9);
    expect(rel(w.speed_m_s, 10 * KT)).toBeLessThan(1e-12); // linear: (0 + 20)/2
    const calm = windAt([level(1000, 0, 0), level(3000, 0, 0)], 2000 * FT);
    expect(calm).toMatchObject({ from_deg: 0, speed_m_s: 0 });
    // Opposite winds of equal strength cancel at mid-layer (vector arithmetic).
    const opposed = windAt([level(0, 90, 20), level(2000, 270, 20)], 1000 * FT);
    expect(opposed.speed_m_s).toBeLessThan(1e-12);
    expect(opposed.from_deg).toBe(0);
  });

  it('holds the nearest level outside the table and says so (extrapolated flag)', () => {
    const levels = [level(1000, 270, 20, 5), level(3000, 360, 30, -5)];
    const below = windAt(levels, 0);
    expect(below).toMatchObject({ from_deg: 270, extrapolated: true, isaOffset_K: 5 });
    expect(rel(below.speed_m_s, 20 * KT)).toBeLessThan(1e-12);
    const above = windAt(levels, 10000 * FT);
    expect(above).toMatchObject({ extrapolated: true, isaOffset_K: -5 });
    expect(angleDiff(above.from_deg, 360)).toBeLessThan(1e-9);
    expect(windAt(levels, 1000 * FT).extrapolated).toBe(false); // on a level is inside
    expect(windAt(levels, 3000 * FT).extrapolated).toBe(false);
  });

  it('interpolates the ISA offset linearly, over the levels that carry one (computed)', () => {
    const levels = [level(0, 90, 10, 10), level(4000, 90, 10), level(10000, 90, 10, -2)];
    // 0 ft +10 K to 10 000 ft −2 K: at 2500 ft, 10 − 12·0.25 = +7 K
    expect(windAt(levels, 2500 * FT).isaOffset_K).toBeCloseTo(7, 12);
    expect(windAt([level(0, 90, 10)], 0).isaOffset_K).toBeUndefined();
  });

  it('sorts the table and names a repeated altitude or a bad value (InputError)', () => {
    const unsorted = [level(3000, 360, 20), level(1000, 270, 20)];
    expect(angleDiff(windAt(unsorted, 2000 * FT).from_deg, 315)).toBeLessThan(1e-9);
    expect(() => windProfile([level(1000, 0, 5), level(2000, 0, 5), level(1000, 90, 5)])).toThrow(
      /environment\.windsAloft\.2\.altitude_m: 304\.8 .*\(level 0 has the same altitude\)/,
    );
    expect(() => windProfile([{ altitude_m: 0, from_deg: 361, speed_m_s: 1 }])).toThrow(
      /environment\.windsAloft\.0\.from_deg: 361 .*between 0 and 360/,
    );
    expect(() => windProfile([{ altitude_m: 0, from_deg: 1, speed_m_s: -1 }])).toThrow(InputError);
    expect(() =>
      windProfile([{ altitude_m: 0, from_deg: 1, speed_m_s: 1, isaOffset_K: 99 }]),
    ).toThrow(/isaOffset_K/);
    expect(() => windProfile([])).toThrow(/between 1 and 100/);
    expect(() => windAt([level(0, 0, 1)], NaN)).toThrow(/altitude_m/);
  });

  it('never leaves the bracketing speeds above, and returns each level on it (property)', () => {
    const lv = fc.record({
      altitude_m: fc.integer({ min: -1000, max: 30000 }),
      from_deg: fc.double({ min: 0, max: 360, noNaN: true }),
      speed_m_s: fc.double({ min: 0, max: 150, noNaN: true }),
    });
    const table = fc.uniqueArray(lv, { minLength: 2, maxLength: 8, selector: (l) => l.altitude_m });
    fc.assert(
      fc.property(table, fc.double({ min: -1000, max: 30000, noNaN: true }), (levels, h) => {
        const profile = windProfile(levels);
        const w = windAt(profile, h);
        // |(1−t)·u + t·v| ≤ (1−t)|u| + t|v| ≤ max(|u|, |v|) (triangle inequality)
        expect(w.speed_m_s).toBeLessThanOrEqual(
          Math.max(...levels.map((l) => l.speed_m_s)) * (1 + 1e-12),
        );
        for (const l of levels) {
          const at = windAt(profile, l.altitude_m);
          expect(Math.abs(at.speed_m_s - l.speed_m_s)).toBeLessThan(1e-9);
          if (l.speed_m_s > 1e-6) expect(angleDiff(at.from_deg, l.from_deg)).toBeLessThan(1e-6);
        }
      }),
      { numRuns: 500 },
    );
  });
});

describe('headTailCross', () => {
  it('a wind on the nose is all headwind, one from the right all crosswind (definition)', () => {
    const head = headTailCross({ from_deg: 90, speed_m_s: 10 }, 90);
    expect(head.headwind_m_s).toBeCloseTo(10, 12);
    expect(head.crosswind_m_s).toBeCloseTo(0, 12);
    const right = headTailCross({ from_deg: 180, speed_m_s: 10 }, 90);
    expect(right.crosswind_m_s).toBeCloseTo(10, 12);
    const tail = headTailCross({ from_deg: 270, speed_m_s: 10 }, 90);
    expect(tail.headwind_m_s).toBeCloseTo(-10, 12);
  });

  it('matches the solver wind triangle components, also for a table at an altitude', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 360, noNaN: true }),
        fc.double({ min: 0, max: 100, noNaN: true }),
        fc.double({ min: 0, max: 360, noNaN: true }),
        (from_deg, speed_m_s, course) => {
          const a = headTailCross({ from_deg, speed_m_s }, course);
          const b = windComponents(course, { from_deg, speed_m_s });
          expect(Math.abs(a.headwind_m_s - b.headwind_m_s)).toBeLessThan(1e-9);
          expect(Math.abs(a.crosswind_m_s - b.crosswind_m_s)).toBeLessThan(1e-9);
        },
      ),
      { numRuns: 300 },
    );
    const levels = [level(1000, 270, 20), level(3000, 360, 20)];
    const fromTable = headTailCross(levels, 315, 2000 * FT); // straight into the 315° mean wind
    expect(rel(fromTable.headwind_m_s, 20 * Math.cos(Math.PI / 4) * KT)).toBeLessThan(1e-12);
    expect(() => headTailCross(levels, 315)).toThrow(/altitude_m/);
  });
});
