import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/errors.ts';
import { windTriangle } from '../../../core/solver/wind.ts';

const DEG = Math.PI / 180;

/**
 * Independent check by vectors (east, north): air vector along the heading plus the wind
 * vector (blowing toward from + 180°) must give a ground vector along the course with the
 * triangle's ground speed (plain vector addition, common practice of air navigation).
 */
function groundVector(tas: number, heading_deg: number, windSpeed: number, windFrom_deg: number) {
  const e = tas * Math.sin(heading_deg * DEG) - windSpeed * Math.sin(windFrom_deg * DEG);
  const n = tas * Math.cos(heading_deg * DEG) - windSpeed * Math.cos(windFrom_deg * DEG);
  return { speed: Math.hypot(e, n), track_deg: (((Math.atan2(e, n) / DEG) % 360) + 360) % 360 };
}

function angleDiff(a: number, b: number): number {
  const d = Math.abs(a - b) % 360;
  return Math.min(d, 360 - d);
}

describe('windTriangle', () => {
  it('pure headwind: ground speed = TAS − wind, heading = course (vector check)', () => {
    const w = windTriangle(50, 90, { speed_m_s: 10, from_deg: 90 });
    expect(w.groundSpeed_m_s).toBeCloseTo(40, 12); // 50 − 10, exact
    expect(w.headwind_m_s).toBeCloseTo(10, 12);
    expect(w.crosswind_m_s).toBeCloseTo(0, 12);
    expect(angleDiff(w.heading_deg, 90)).toBeLessThan(1e-9);
    const g = groundVector(50, w.heading_deg, 10, 90);
    expect(Math.abs(g.speed - w.groundSpeed_m_s)).toBeLessThan(1e-9);
  });

  it('pure tailwind: ground speed = TAS + wind (vector check)', () => {
    const w = windTriangle(50, 90, { speed_m_s: 10, from_deg: 270 });
    expect(w.groundSpeed_m_s).toBeCloseTo(60, 12); // 50 + 10, exact
    expect(w.headwind_m_s).toBeCloseTo(-10, 12);
  });

  it('pure crosswind from the right: heading right of course, GS = √(TAS² − Vw²) (vector check)', () => {
    const w = windTriangle(50, 0, { speed_m_s: 30, from_deg: 90 });
    expect(w.crosswind_m_s).toBeCloseTo(30, 12);
    expect(w.groundSpeed_m_s).toBeCloseTo(40, 12); // 3-4-5 triangle, exact
    expect(w.heading_deg).toBeCloseTo(Math.asin(30 / 50) / DEG, 10);
    const g = groundVector(50, w.heading_deg, 30, 90);
    expect(Math.abs(g.speed - 40)).toBeLessThan(1e-9);
    expect(angleDiff(g.track_deg, 0)).toBeLessThan(1e-9);
  });

  it('random winds: the ground vector lies on the course with the triangle ground speed (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 10, max: 300, noNaN: true }),
        fc.double({ min: 0, max: 360, noNaN: true }),
        fc.double({ min: 0, max: 0.9, noNaN: true }),
        fc.double({ min: 0, max: 360, noNaN: true }),
        (tas, course, windFraction, from) => {
          const speed = windFraction * tas;
          const w = windTriangle(tas, course, { speed_m_s: speed, from_deg: from });
          const g = groundVector(tas, w.heading_deg, speed, from);
          expect(Math.abs(g.speed - w.groundSpeed_m_s)).toBeLessThan(1e-9 * tas);
          expect(angleDiff(g.track_deg, course)).toBeLessThan(1e-7);
          expect(w.heading_deg).toBeGreaterThanOrEqual(0);
          expect(w.heading_deg).toBeLessThan(360);
        },
      ),
      { numRuns: 500 },
    );
  });

  it('crosswind stronger than the airspeed throws InputError naming wind speed and airspeed', () => {
    const call = () => windTriangle(20, 0, { speed_m_s: 25, from_deg: 90 });
    expect(call).toThrow(InputError);
    expect(call).toThrow(/wind\.speed_m_s: 25 .*true airspeed 20 m\/s/);
  });

  it('a headwind that leaves no ground speed throws instead of returning a negative speed', () => {
    expect(() => windTriangle(20, 0, { speed_m_s: 20, from_deg: 0 })).toThrow(InputError);
  });
});
