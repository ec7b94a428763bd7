/**
 * Correlated wind errors along a route (core/uncertainty/windErrors.ts, spreads.ts) and the
 * failed flights counted by cause (failureCauses.ts), checked statistically with seeded runs:
 * sample correlations against the set correlation within a few standard errors of Pearson's r
 * (SE ≈ (1 − ρ²)/√N for N pairs; Fisher 1915, any statistics text), and a failure count
 * against the normal tail probability P(Z ≥ 1) = 1 − Φ(1) = 0.158655 (standard normal table)
 * within four binomial standard deviations √(N·p·(1 − p)).
 */
import { describe, expect, it } from 'vitest';
import type { Plan } from '../../../core/plan/schema.ts';
import { solvePlan } from '../../../core/solver/solve.ts';
import { failureSentence } from '../../../core/uncertainty/failureCauses.ts';
import { normalSource } from '../../../core/uncertainty/random.ts';
import { reserveMonteCarlo } from '../../../core/uncertainty/reserveMonteCarlo.ts';
import { perturbPlan, type ReserveSpreads } from '../../../core/uncertainty/spreads.ts';
import { pearson } from '../../../core/uncertainty/stats.ts';
import { cruise, loiter, makePlan, rel } from '../solver/fixtures.ts';
import { ZERO_SPREADS } from './fixtures.ts';

const zero = ZERO_SPREADS;

/** Three cruise legs in a 30 m/s wind (far from the censoring at 0 with σ 3 m/s). */
function threeLegs(): Plan {
  const leg = (course_deg: number) =>
    cruise({
      course_deg,
      wind: { speed_m_s: 30, from_deg: 180 },
      speed: { kind: 'tas', speed_m_s: 70 },
      end: { by: 'distance', distance_m: 20_000 },
    });
  return makePlan('propeller', [leg(0), leg(60), leg(120)]);
}

/** The drawn wind errors (speed m/s, direction deg in (−180, 180]) of each leg, per sample. */
function windErrors(plan: Plan, spreads: ReserveSpreads, samples: number, seed: number) {
  const rng = normalSource(seed);
  const speed: number[][] = plan.legs.map(() => []);
  const direction: number[][] = plan.legs.map(() => []);
  for (let n = 0; n < samples; n++) {
    const p = perturbPlan(plan, spreads, rng).plan;
    p.legs.forEach((leg, i) => {
      const nominal = plan.legs[i]!;
      if (!('wind' in leg) || !('wind' in nominal)) return;
      speed[i]!.push(leg.wind.speed_m_s - nominal.wind.speed_m_s);
      const d = (((leg.wind.from_deg - nominal.wind.from_deg) % 360) + 540) % 360;
      direction[i]!.push(d - 180);
    });
  }
  return { speed, direction };
}

const SPREADS = { ...zero, windSpeed_m_s: 3, windDirection_deg: 10 };
const N = 4000;

describe('correlated wind errors', () => {
  it('correlation 1: every leg of a flight has the same wind error', () => {
    const e = windErrors(threeLegs(), { ...SPREADS, windCorrelation: 1 }, 500, 21);
    for (let n = 0; n < 500; n++) {
      for (const i of [1, 2]) {
        // Identical up to rounding of the sum 30 + error (the definition of ρ = 1).
        expect(Math.abs(e.speed[i]![n]! - e.speed[0]![n]!)).toBeLessThan(1e-12);
        expect(Math.abs(e.direction[i]![n]! - e.direction[0]![n]!)).toBeLessThan(1e-9);
      }
    }
    // ... and still spread with σ 3 m/s (sample SD within 10 % at N = 500).
    const s = e.speed[0]!;
    const sd = Math.sqrt(s.reduce((a, v) => a + v * v, 0) / s.length);
    expect(rel(sd, 3)).toBeLessThan(0.1);
  });

  it('correlation 0: the legs are independent (sample correlation ≈ 0)', () => {
    const e = windErrors(threeLegs(), { ...SPREADS, windCorrelation: 0 }, N, 22);
    const limit = 4 / Math.sqrt(N); // four standard errors of r at ρ = 0
    for (const [a, b] of [
      [0, 1],
      [0, 2],
      [1, 2],
    ] as const) {
      expect(Math.abs(pearson(e.speed[a]!, e.speed[b]!))).toBeLessThan(limit);
      expect(Math.abs(pearson(e.direction[a]!, e.direction[b]!))).toBeLessThan(limit);
    }
  });

  it('correlation 0.5 and the default 0.8 give that sample correlation', () => {
    for (const [rho, spreads] of [
      [0.5, { ...SPREADS, windCorrelation: 0.5 }],
      [0.8, SPREADS], // no windCorrelation: the default 0.8 (common practice, windErrors.ts)
    ] as const) {
      const e = windErrors(threeLegs(), spreads, N, 23);
      const limit = (4 * (1 - rho * rho)) / Math.sqrt(N);
      expect(Math.abs(pearson(e.speed[0]!, e.speed[2]!) - rho)).toBeLessThan(limit);
      expect(Math.abs(pearson(e.direction[1]!, e.direction[2]!) - rho)).toBeLessThan(limit);
    }
  });

  it('spreads going to 0 converge to the deterministic answer at any correlation', () => {
    const plan = threeLegs();
    const det = solvePlan(plan);
    const margin = det.landing.remaining - det.reserve.required.total;
    for (const windCorrelation of [0, 0.8, 1]) {
      for (const scale of [1e-3, 1e-6]) {
        const mc = reserveMonteCarlo(
          plan,
          { ...zero, windSpeed_m_s: 3 * scale, windDirection_deg: 10 * scale, windCorrelation },
          { samples: 30, seed: 4 },
        );
        // The spread of the margin shrinks with the spreads of the inputs (smooth response).
        const d = mc.margin!;
        expect(rel(d.p1, margin)).toBeLessThan(50 * scale);
        expect(rel(d.p99, margin)).toBeLessThan(50 * scale);
      }
    }
  });

  it('refuses a correlation outside 0–1, naming the field', () => {
    expect(() =>
      reserveMonteCarlo(threeLegs(), { ...SPREADS, windCorrelation: 1.5 }, { samples: 5 }),
    ).toThrow(/spreads\.windCorrelation/);
  });
});

describe('failed flights counted by cause', () => {
  // A 45 m/s loiter in a 40 m/s wind with σ 5 m/s: the flight cannot hold station where the
  // drawn wind reaches 45 m/s, i.e. z ≥ 1: P = 0.158655 (standard normal table).
  const plan = makePlan('propeller', [
    loiter({
      wind: { speed_m_s: 40, from_deg: 270 },
      speed: { kind: 'tas', speed_m_s: 45 },
      end: { by: 'time', time_s: 1200 },
    }),
  ]);
  const samples = 1000;
  const mc = reserveMonteCarlo(
    plan,
    { ...zero, windSpeed_m_s: 5, windCorrelation: 1 },
    {
      samples,
      seed: 8,
    },
  );

  it('counts every failed flight under its leg and cause', () => {
    expect(mc.failures).toHaveLength(1);
    const f = mc.failures[0]!;
    expect(f.legIndex).toBe(0);
    expect(f.cause).toBe('station');
    expect(f.count).toBe(Math.round(mc.failedFraction * samples));
    const p = 0.158655;
    const sd = Math.sqrt(samples * p * (1 - p));
    expect(Math.abs(f.count - samples * p)).toBeLessThan(4 * sd);
    // Only winds at or above the 45 m/s airspeed fail (the orbit's station limit).
    expect(f.windSpeed_m_s.min).toBeGreaterThanOrEqual(45 - 1e-6);
    expect(f.example).toContain('cannot hold station');
  });

  it('says it in one sentence', () => {
    const f = mc.failures[0]!;
    const s = failureSentence(f, samples, plan, 'fuel', (v) => `${v.toFixed(0)} m/s`);
    expect(s).toBe(
      `In ${f.count} of ${samples} simulated flights leg 1 (loiter) could not hold station in a wind of ` +
        `${f.windSpeed_m_s.min.toFixed(0)} m/s – ${f.windSpeed_m_s.max.toFixed(0)} m/s.`,
    );
  });
});
