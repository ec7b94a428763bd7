import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  MAX_GEOPOTENTIAL_M,
  MAX_ISA_OFFSET_K,
  MIN_GEOPOTENTIAL_M,
  MIN_ISA_OFFSET_K,
  atmosphereAt,
  densityAltitude,
  geometricFromGeopotential,
  geopotentialFromGeometric,
  pressureAltitudeFromPressure,
  standardAtmosphere,
} from '../../core/atmosphere.ts';

const height = fc.double({ min: MIN_GEOPOTENTIAL_M, max: MAX_GEOPOTENTIAL_M, noNaN: true });
const offset = fc.double({ min: MIN_ISA_OFFSET_K, max: MAX_ISA_OFFSET_K, noNaN: true });
// Two heights at least 1 mm apart (pressure changes by > 1e-7 relative per mm everywhere).
const orderedPair = fc
  .tuple(height, height)
  .map(([a, b]): [number, number] => (a < b ? [a, b] : [b, a]))
  .filter(([a, b]) => b - a > 1e-3);

describe('standard atmosphere invariants (property)', () => {
  it('pressure and density strictly decrease with height over the whole range', () => {
    // hydrostatic equation, dp/dH = −ρ·g0 < 0; and dρ/dH < 0 since g0/R exceeds every lapse rate
    fc.assert(
      fc.property(orderedPair, ([lo, hi]) => {
        const a = standardAtmosphere(lo);
        const b = standardAtmosphere(hi);
        expect(b.p_Pa).toBeLessThan(a.p_Pa);
        expect(b.rho_kg_m3).toBeLessThan(a.rho_kg_m3);
      }),
      { numRuns: 2000 },
    );
  });

  it('never yields NaN, infinities or non-positive values on any ISA+ΔT day', () => {
    fc.assert(
      fc.property(height, offset, (H, dT) => {
        const s = atmosphereAt(H, dT);
        for (const v of Object.values(s)) {
          expect(Number.isFinite(v)).toBe(true);
          expect(v).toBeGreaterThan(0);
        }
      }),
      { numRuns: 2000 },
    );
  });

  it('inverts pressure exactly: pressureAltitudeFromPressure(p(H)) = H', () => {
    fc.assert(
      fc.property(height, (H) => {
        const back = pressureAltitudeFromPressure(standardAtmosphere(H).p_Pa);
        // closed-form inverse of the 1976 standard's pressure law: rounding only
        expect(Math.abs(back - H)).toBeLessThanOrEqual(1e-9 * Math.max(1000, Math.abs(H)));
      }),
      { numRuns: 2000 },
    );
  });

  it('inverts density exactly: densityAltitude(ρ(H)) = H', () => {
    fc.assert(
      fc.property(height, (H) => {
        const back = densityAltitude(standardAtmosphere(H).rho_kg_m3);
        // closed-form inverse per layer: rounding only
        expect(Math.abs(back - H)).toBeLessThanOrEqual(1e-9 * Math.max(1000, Math.abs(H)));
      }),
      { numRuns: 2000 },
    );
  });

  it('raises density altitude on a warmer day at the same pressure altitude', () => {
    // ρ = p/(R·T) falls as T rises at fixed p; density altitude is monotone in ρ (common practice)
    const hp = fc.double({ min: 0, max: 15000, noNaN: true });
    const warmer = fc
      .tuple(fc.double({ min: -40, max: 40, noNaN: true }), fc.double({ min: 0.01, max: 10 }))
      .filter(([, d]) => Number.isFinite(d));
    fc.assert(
      fc.property(hp, warmer, (H, [dT, step]) => {
        const cold = densityAltitude(atmosphereAt(H, dT).rho_kg_m3);
        const warm = densityAltitude(atmosphereAt(H, dT + step).rho_kg_m3);
        expect(warm).toBeGreaterThan(cold);
      }),
    );
  });

  it('round-trips geometric and geopotential height', () => {
    const z = fc.double({ min: -5000, max: 86000, noNaN: true });
    fc.assert(
      fc.property(z, (zm) => {
        const back = geometricFromGeopotential(geopotentialFromGeometric(zm));
        // exact algebraic inverse (1976 standard eq. 18): rounding only
        expect(Math.abs(back - zm)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(zm)));
      }),
    );
  });
});
