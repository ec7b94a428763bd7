/**
 * The low-Reynolds warning (core/solver/reynolds.ts): Re = ρ·V·c/μ with c = S/b, checked
 * against a hand evaluation with the 1976 standard's sea-level density and viscosity
 * (ρ 1.22500 kg/m³, μ 1.7894e-5 Pa·s, shared/REFERENCES.md).
 */
import { describe, expect, it } from 'vitest';
import { buildModel } from '../../../core/solver/model.ts';
import { legReynolds, LOW_REYNOLDS, meanChord_m } from '../../../core/solver/reynolds.ts';
import { solvePlan } from '../../../core/solver/solve.ts';
import { ANDERSON_PROP, cruise, loiter, makePlan, rel, TRAUB_UAV } from './fixtures.ts';

// 1976 U.S. Standard Atmosphere, sea level (shared/REFERENCES.md).
const RHO0 = 1.225;
const MU0 = 1.7894e-5;

describe('chord Reynolds number warning', () => {
  it('warns for the small UAV of Traub (2011) loitering at 10 m/s', () => {
    const plan = makePlan('electric', [
      loiter({ speed: { kind: 'tas', speed_m_s: 10 }, end: { by: 'time', time_s: 600 } }),
    ]);
    // Mean chord S/b = √(S/AR) = √(0.55/9) = 0.24721 m (definition, Traub's inputs).
    const chord = Math.sqrt(TRAUB_UAV.S / TRAUB_UAV.AR);
    expect(rel(meanChord_m(plan.aircraft)!, chord)).toBeLessThan(1e-12);
    // By hand: Re = 1.225 · 10 · 0.24721 / 1.7894e-5 = 1.6924e5.
    const hand = (RHO0 * 10 * chord) / MU0;
    expect(rel(hand, 1.6924e5)).toBeLessThan(1e-4);
    const r = solvePlan(plan);
    expect(r.legs[0]!.status).toBe('flown');
    const [leg] = legReynolds(buildModel(plan), plan, r.legs);
    // μ table value has 5 digits: agree to 1e-4.
    expect(rel(leg!.reynolds, hand)).toBeLessThan(1e-4);
    expect(leg!.reynolds).toBeLessThan(LOW_REYNOLDS);
    const w = r.warnings.find((s) => s.includes('Reynolds'));
    expect(w).toBeDefined();
    expect(w).toContain('Leg 1 (loiter)');
    expect(w).toContain('1.69×10⁵');
    expect(w).toContain('unreliable');
    expect(w).toContain('optimistic');
  });

  it('does not warn for the light airplane of Anderson cruising at 60 m/s', () => {
    const plan = makePlan('propeller', [
      cruise({
        speed: { kind: 'tas', speed_m_s: 60 },
        end: { by: 'distance', distance_m: 50_000 },
      }),
    ]);
    // c = S/b = 16.165/10.912 = 1.4814 m; Re = 1.225 · 60 · 1.4814 / 1.7894e-5 = 6.085e6.
    const chord = ANDERSON_PROP.S / ANDERSON_PROP.span;
    const hand = (RHO0 * 60 * chord) / MU0;
    expect(rel(hand, 6.085e6)).toBeLessThan(1e-3);
    const r = solvePlan(plan);
    const [leg] = legReynolds(buildModel(plan), plan, r.legs);
    expect(rel(leg!.reynolds, hand)).toBeLessThan(1e-4);
    expect(r.warnings.some((s) => s.includes('Reynolds'))).toBe(false);
  });

  it('a given span sets the chord: S/b', () => {
    const plan = makePlan('electric', [loiter()], {
      aircraft: (a) => ({ ...a, span_m: 2.2 }),
    });
    // 0.55 m² / 2.2 m = 0.25 m (definition).
    expect(rel(meanChord_m(plan.aircraft)!, 0.25)).toBeLessThan(1e-12);
  });

  it('an induced factor without a span gives no chord and no warning', () => {
    const plan = makePlan('electric', [loiter()], {
      aircraft: (a) => ({ ...a, polar: { ...a.polar, induced: { by: 'factor', k: 0.04 } } }),
    });
    expect(meanChord_m(plan.aircraft)).toBeNull();
    expect(solvePlan(plan).warnings.some((s) => s.includes('Reynolds'))).toBe(false);
  });
});
