import odex from 'odex';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/errors.ts';
import { landingDistance, type LandingInput } from '../../../core/field/landing.ts';
import { SURFACES } from '../../../core/field/surfaces.ts';
import { G0 } from '../../../core/units.ts';

/** odex's dense-output interpolator (passed to the observer when denseOutput is set). */
type Dense = (component: number, x: number) => number;

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);

function ok(input: LandingInput) {
  const r = landingDistance(input);
  if (!r.ok) throw new Error(r.reason);
  return r;
}

// Piston tourer, values invented for the test inside the common-practice ranges of REFERENCES.md.
const base: LandingInput = {
  mass_kg: 1150,
  wingArea_m2: 16.2,
  CD0: 0.045,
  k: 1 / (Math.PI * 0.78 * 7.4),
  CLmax: 2.0,
  CL_ground: 0.3,
  rho_kg_m3: 1.2,
  surface: 'dryHard',
};

/** Braking roll written out again and integrated in time with odex until the ground speed is 0. */
function odexBrakingRoll(input: LandingInput, Vtd: number, mu: number): number {
  const m = input.mass_kg;
  const W = m * G0;
  const { rho_kg_m3: rho, wingArea_m2: S } = input;
  const CLg = input.CL_ground ?? 0.3;
  const CD = input.CD0 + input.k * CLg * CLg;
  const Vw = input.headwind_m_s ?? 0;
  const th = Math.atan(input.slope ?? 0);
  const f = (_t: number, y: number[]): number[] => {
    const V = y[0] as number;
    const q = 0.5 * rho * V * Math.abs(V);
    const L = V > 0 ? q * S * CLg : 0;
    return [(-q * S * CD - mu * Math.max(0, W * Math.cos(th) - L) - W * Math.sin(th)) / m, V - Vw];
  };
  const solver = new odex.Solver(2);
  solver.absoluteTolerance = solver.relativeTolerance = 1e-12;
  solver.denseOutput = true;
  let s: number | null = null;
  solver.solve(
    f,
    0,
    [Vtd, 0],
    600,
    (_nr: number, xold: number, x: number, y: number[], dense?: Dense): boolean | void => {
      if (s !== null || !dense || (y[0] as number) > Vw) return;
      let lo = xold;
      let hi = x;
      for (let i = 0; i < 200 && hi - lo > 1e-13 * hi; i++) {
        const mid = 0.5 * (lo + hi);
        if (dense(0, mid) > Vw) lo = mid;
        else hi = mid;
      }
      s = dense(1, hi);
      return false;
    },
  );
  if (s === null) throw new Error('odex reference did not stop');
  return s;
}

describe('landing distance', () => {
  it('braking roll agrees with a time integration by odex to 1e-6', () => {
    for (const extra of [
      {},
      { headwind_m_s: 7, slope: -0.015 },
      { headwind_m_s: -3, slope: 0.01, surface: 'wetHard' as const },
    ]) {
      const input = { ...base, ...extra };
      const r = ok(input);
      const mu = SURFACES[input.surface as 'dryHard' | 'wetHard'].muBrake;
      const ref = odexBrakingRoll(input, r.touchdownSpeed_m_s, mu); // odex, independent library
      expect(rel(r.brakingRoll_m, ref)).toBeLessThan(1e-6);
    }
  });

  it('reduces to V²/(2μg) with no aerodynamic force (elementary mechanics)', () => {
    const r = ok({
      ...base,
      CD0: 0,
      k: 0,
      CL_ground: 0,
      surface: { muRoll: 0.02, muBrake: 0.35 },
      headwind_m_s: 5,
    });
    const Vg = r.touchdownSpeed_m_s - 5;
    expect(rel(r.brakingRoll_m, (Vg * Vg) / (2 * 0.35 * G0))).toBeLessThan(1e-9);
    expect(rel(r.brakingTime_s, Vg / (0.35 * G0))).toBeLessThan(1e-9);
  });

  it('uses the approach, flare and touchdown speeds and geometry of Raymer ch. 17 (from memory)', () => {
    const r = ok(base);
    const Vs = Math.sqrt(
      (2 * base.mass_kg * G0) / (base.rho_kg_m3 * base.wingArea_m2 * base.CLmax),
    );
    expect(rel(r.stallSpeed_m_s, Vs)).toBeLessThan(1e-12);
    expect(rel(r.approachSpeed_m_s, 1.3 * Vs)).toBeLessThan(1e-12); // 1.3·V_s, common practice
    expect(rel(r.touchdownSpeed_m_s, 1.15 * Vs)).toBeLessThan(1e-12);
    const R = (1.23 * Vs) ** 2 / (0.2 * G0);
    const th = (3 * Math.PI) / 180;
    const hf = R * (1 - Math.cos(th));
    expect(rel(r.airDistance_m, (15.24 - hf) / Math.tan(th) + R * Math.sin(th))).toBeLessThan(
      1e-12,
    );
    // Free roll 3 s at touchdown speed (common practice).
    expect(rel(r.freeRoll_m, 3 * 1.15 * Vs)).toBeLessThan(1e-12);
    expect(r.totalDistance_m).toBeCloseTo(r.airDistance_m + r.freeRoll_m + r.brakingRoll_m, 9);
  });

  it('is longer on a wet or grass surface than on dry concrete (surface table, common practice)', () => {
    const dry = ok(base).totalDistance_m;
    expect(ok({ ...base, surface: 'wetHard' }).totalDistance_m).toBeGreaterThan(dry);
    expect(ok({ ...base, surface: 'longGrass' }).totalDistance_m).toBeGreaterThan(dry);
  });

  it('fails, not NaN, when a downhill slope beats the brakes', () => {
    const r = landingDistance({ ...base, slope: -0.15, surface: { muRoll: 0.02, muBrake: 0.05 } });
    expect(r.ok).toBe(false);
  });

  it.each([
    ['approachAngle_deg', { approachAngle_deg: 0 }],
    ['freeRoll_s', { freeRoll_s: -1 }],
    ['CL_ground', { CL_ground: 1.8 }],
    ['headwind_m_s', { headwind_m_s: 45 }],
    ['wingArea_m2', { wingArea_m2: Number.POSITIVE_INFINITY }],
  ] as const)('throws InputError naming %s', (field, bad) => {
    const call = () => landingDistance({ ...base, ...bad });
    expect(call).toThrow(InputError);
    try {
      call();
    } catch (e) {
      expect((e as InputError).field).toBe(field);
    }
  });
});
