/**
 * Levels: flight levels are pressure altitude in hundreds of feet at 1013.25 hPa and the
 * semicircular rule is ICAO Annex 2, Appendix 3 (common practice); ft = 0.3048 m exactly.
 * The pressure altitude of a QNH is checked against the ICAO standard atmosphere table
 * value 1000 hPa ≈ 110.9 m (ICAO Doc 7488, from memory: 111 m).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  altitudeOfPressureAltitude,
  flightLevelOf,
  flightLevelText,
  levelsBetween,
  nearestLevel,
  pressureAltitudeOf,
} from '../../core/levels.ts';
import { InputError } from '../../core/errors.ts';

const FT = 0.3048;
const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(1, Math.abs(b));

describe('flight levels', () => {
  it('pressure altitude adds the QNH offset (1000 hPa ≈ 111 m, ICAO standard atmosphere)', () => {
    expect(rel(pressureAltitudeOf(0, 101_325), 0)).toBeLessThan(1e-9);
    expect(Math.abs(pressureAltitudeOf(1000, 100_000) - 1110.9)).toBeLessThan(1);
    expect(
      rel(altitudeOfPressureAltitude(pressureAltitudeOf(2500, 99_000), 99_000), 2500),
    ).toBeLessThan(1e-12);
  });

  it('FL350 above the transition, null at or below it', () => {
    const rule = { transitionAltitude_m: 18000 * FT, qnh_Pa: 101_325 };
    expect(flightLevelOf(35000 * FT, rule)).toBe(350);
    expect(flightLevelOf(18000 * FT, rule)).toBeNull();
    expect(flightLevelText(350)).toBe('FL350');
    expect(flightLevelText(55)).toBe('FL055');
  });
});

describe('levels people fly', () => {
  it('snaps to 500 ft and to 100 m', () => {
    // 6170 ft (the kind of raw optimum the sweep returns) → 6000 ft; 1881 m → 1900 m.
    expect(rel(nearestLevel(6170 * FT, { step: 'ft500' }), 6000 * FT)).toBeLessThan(1e-12);
    expect(rel(nearestLevel(6300 * FT, { step: 'ft500' }), 6500 * FT)).toBeLessThan(1e-12);
    expect(nearestLevel(1881, { step: 'm100' })).toBe(1900);
  });

  it('semicircular rule: eastbound odd, westbound even thousands; VFR + 500 ft', () => {
    const at = (ft: number, track: number, rules: 'ifr' | 'vfr') =>
      Math.round(
        nearestLevel(ft * FT, {
          step: 'ft500',
          semicircular: { track_deg: track, flightRules: rules },
        }) / FT,
      );
    expect(at(6170, 90, 'ifr')).toBe(7000); // 000–179°: odd thousands
    expect(at(6170, 270, 'ifr')).toBe(6000); // 180–359°: even thousands
    expect(at(6170, 90, 'vfr')).toBe(5500); // odd + 500
    expect(at(6170, 270, 'vfr')).toBe(6500); // even + 500
    expect(at(6170, 179.9, 'ifr')).toBe(7000);
    expect(at(6170, 180, 'ifr')).toBe(6000);
  });

  it('lists the levels between two altitudes, both ends included', () => {
    const ft = levelsBetween(1000 * FT, 3000 * FT, { step: 'ft500' }).map((m) =>
      Math.round(m / FT),
    );
    expect(ft).toEqual([1000, 1500, 2000, 2500, 3000]);
    expect(levelsBetween(250, 560, { step: 'm100' })).toEqual([300, 400, 500]);
    expect(levelsBetween(500, 400, { step: 'm100' })).toEqual([]);
  });

  it('property: the nearest level is on the grid and within half a step', () => {
    fc.assert(
      fc.property(fc.double({ min: -300, max: 15_000, noNaN: true }), (h) => {
        const l = nearestLevel(h, { step: 'ft500' });
        expect(Math.abs(l - h)).toBeLessThanOrEqual(250 * FT + 1e-9);
        expect(Math.abs(l / FT / 500 - Math.round(l / FT / 500))).toBeLessThan(1e-9);
      }),
      { seed: 11, numRuns: 300 },
    );
  });

  it('refuses bad input by name', () => {
    expect(() => nearestLevel(Number.NaN, { step: 'm100' })).toThrow(InputError);
    expect(() =>
      nearestLevel(100, { step: 'm100', semicircular: { track_deg: 10, flightRules: 'ifr' } }),
    ).toThrow(/semicircular/);
    expect(() =>
      nearestLevel(100, { step: 'ft500', semicircular: { track_deg: 400, flightRules: 'ifr' } }),
    ).toThrow(/track_deg/);
  });
});
