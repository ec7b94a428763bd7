import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/errors.ts';
import { parsePlanText } from '../../../core/plan/load.ts';
import type { Plan } from '../../../core/plan/schema.ts';
import { solvePlan } from '../../../core/solver/solve.ts';
import { reserveMonteCarlo } from '../../../core/uncertainty/reserveMonteCarlo.ts';
import { normalSource } from '../../../core/uncertainty/random.ts';
import { perturbPlan, spreadsFromDefaults } from '../../../core/uncertainty/spreads.ts';
import { ZERO_SPREADS } from './fixtures.ts';

function example(name: string): Plan {
  const r = parsePlanText(
    readFileSync(new URL(`../../../examples/${name}.json`, import.meta.url), 'utf8'),
  );
  if (!r.ok) throw new Error(`example ${name} does not load`);
  return r.plan;
}

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);
const zero = ZERO_SPREADS;

describe('reserveMonteCarlo', () => {
  const uav = example('survey-uav-electric');
  const piston = example('twelve-legs');

  it('is reproducible with the same random seed and differs with another', () => {
    const spreads = spreadsFromDefaults(piston);
    const a = reserveMonteCarlo(piston, spreads, { samples: 60, seed: 11 });
    const b = reserveMonteCarlo(piston, spreads, { samples: 60, seed: 11 });
    const c = reserveMonteCarlo(piston, spreads, { samples: 60, seed: 12 });
    expect(a).toEqual(b);
    expect(c.margin?.p50).not.toBe(a.margin?.p50);
    expect(a.seed).toBe(11);
    expect(a.samples).toBe(60);
  });

  it("solves with the 'fast' tolerance unless asked, within 1e-5 of 'precise'", () => {
    const spreads = spreadsFromDefaults(piston);
    const fast = reserveMonteCarlo(piston, spreads, { samples: 40, seed: 5 });
    const precise = reserveMonteCarlo(piston, spreads, {
      samples: 40,
      seed: 5,
      tolerance: 'precise',
    });
    // Same random draws; the precise solutions (relative tolerance 1e-9) as reference.
    const f = fast.remaining!;
    const p = precise.remaining!;
    for (const k of ['min', 'p5', 'p50', 'p95', 'max'] as const) {
      expect(rel(f[k], p[k])).toBeLessThan(1e-5);
    }
    expect(fast.probabilityReserveNotKept).toBe(precise.probabilityReserveNotKept);
    const explicit = reserveMonteCarlo(piston, spreads, {
      samples: 40,
      seed: 5,
      tolerance: 'fast',
    });
    expect(explicit).toEqual(fast);
  });

  it("converges to solvePlan's landing margin as the spreads go to 0", () => {
    for (const plan of [piston, uav]) {
      const det = solvePlan(plan);
      const margin = det.landing.remaining - det.reserve.required.total;
      const mc = reserveMonteCarlo(plan, zero, { samples: 40, seed: 3 });
      const d = mc.margin;
      if (!d) throw new Error('no completed sample');
      for (const v of [d.mean, d.min, d.p1, d.p5, d.p10, d.p50, d.p90, d.p95, d.p99, d.max]) {
        expect(rel(v, margin)).toBeLessThan(1e-9);
      }
      expect(rel(mc.remaining?.p50 ?? Number.NaN, det.landing.remaining)).toBeLessThan(1e-9);
      expect(mc.probabilityReserveNotKept).toBe(det.reserve.kept ? 0 : 1);
      expect(mc.importance).toEqual([]);
      // Tiny spreads: every percentile within a small band around the deterministic margin.
      const tiny = reserveMonteCarlo(
        plan,
        { ...zero, cd0: 1e-9, windSpeed_m_s: 1e-9 },
        { samples: 40 },
      );
      expect(rel(tiny.margin?.p1 ?? Number.NaN, margin)).toBeLessThan(1e-6);
      expect(rel(tiny.margin?.p99 ?? Number.NaN, margin)).toBeLessThan(1e-6);
    }
  });

  it('keeps the reserve less often as the hold time grows (same random seed)', () => {
    const spreads = { ...spreadsFromDefaults(uav), batteryCapacity: 0.1 };
    let previous = -1;
    const seen: number[] = [];
    for (const holdTime_s of [0, 300, 600, 900, 1200, 1800]) {
      const plan = { ...uav, reserves: { ...uav.reserves, holdTime_s } };
      const p = reserveMonteCarlo(plan, spreads, {
        samples: 120,
        seed: 5,
      }).probabilityReserveNotKept;
      expect(p).toBeGreaterThanOrEqual(previous);
      previous = p;
      seen.push(p);
    }
    // The sweep is not flat: the longest hold loses the reserve in more samples than none.
    expect(seen[seen.length - 1]).toBeGreaterThan(seen[0] as number);
  });

  it('orders its percentiles and ranks inputs by |Spearman ρ|', () => {
    const spreads = { ...spreadsFromDefaults(uav), batteryCapacity: 0.1 };
    const mc = reserveMonteCarlo(uav, spreads, { samples: 150, seed: 9 });
    for (const d of [mc.margin, mc.remaining]) {
      if (!d) throw new Error('no completed sample');
      const seq = [d.min, d.p1, d.p5, d.p10, d.p50, d.p90, d.p95, d.p99, d.max];
      for (let i = 1; i < seq.length; i++)
        expect(seq[i]).toBeGreaterThanOrEqual(seq[i - 1] as number);
    }
    const mags = mc.importance.map((x) => Math.abs(x.rho));
    for (let i = 1; i < mags.length; i++)
      expect(mags[i]).toBeLessThanOrEqual(mags[i - 1] as number);
    // Physics, not a number: more battery capacity can only add margin, so ρ > 0 (and it is large
    // with a 10 % spread, the dominant input here).
    const battery = mc.importance.find((x) => x.input === 'aircraft.powerplant.battery.energy_J');
    expect(battery?.rho).toBeGreaterThan(0.3);
    expect(mc.probabilityReserveNotKept).toBeGreaterThanOrEqual(mc.failedFraction);
    expect(mc.completedSamples).toBe(Math.round(mc.samples * (1 - mc.failedFraction)));
  });

  it('refuses bad spreads and options, naming the field', () => {
    expect(() => reserveMonteCarlo(uav, { ...zero, cd0: -0.1 })).toThrow(/spreads\.cd0/);
    expect(() => reserveMonteCarlo(uav, zero, { samples: 0 })).toThrow(InputError);
    expect(() => reserveMonteCarlo(uav, zero, { samples: 10.5 })).toThrow(/samples/);
    expect(() => reserveMonteCarlo(uav, zero, { samples: 5, seed: 0.5 })).toThrow(/seed/);
  });
});

describe('spreads', () => {
  it('defaults apply only to inputs the powerplant has (common practice)', () => {
    const uav = example('survey-uav-electric');
    const s = spreadsFromDefaults(uav);
    expect(s.fuelConsumption).toBe(0);
    expect(s.batteryCapacity).toBeGreaterThan(0);
    expect(s.payload_kg).toBeCloseTo(0.01 * uav.aircraft.mass.mtow_kg, 12);
    const jet = spreadsFromDefaults(example('light-jet'));
    expect(jet.efficiency).toBe(0);
    expect(jet.batteryCapacity).toBe(0);
  });

  it('perturbs a copy, leaves the plan untouched and keeps drawn values inside the schema', () => {
    const plan = example('twelve-legs');
    const before = JSON.stringify(plan);
    const rng = normalSource(1);
    const big = {
      ...spreadsFromDefaults(plan),
      windSpeed_m_s: 30,
      efficiency: 0.5,
      payload_kg: 500,
      windDirection_deg: 180,
    };
    for (let i = 0; i < 200; i++) {
      const { plan: p, draws } = perturbPlan(plan, big, rng);
      for (const leg of p.legs) {
        if (!('wind' in leg)) continue;
        expect(leg.wind.speed_m_s).toBeGreaterThanOrEqual(0);
        expect(leg.wind.from_deg).toBeGreaterThanOrEqual(0);
        expect(leg.wind.from_deg).toBeLessThanOrEqual(360);
      }
      expect(p.aircraft.mass.payload_kg).toBeGreaterThanOrEqual(0);
      if (p.aircraft.powerplant.type === 'propeller')
        expect(p.aircraft.powerplant.propEfficiency).toBeLessThanOrEqual(0.95);
      expect(draws.every((d) => Number.isFinite(d.value))).toBe(true);
    }
    expect(JSON.stringify(plan)).toBe(before);
  });

  it('perturbs the winds-aloft table too (same spreads), and legs flying it feel the draws', () => {
    // The twelve-leg plan with a two-level table that every leg with a course flies.
    const base = example('twelve-legs');
    const plan: Plan = {
      ...base,
      environment: {
        ...base.environment,
        windsAloft: [
          { altitude_m: 0, from_deg: 200, speed_m_s: 6 },
          { altitude_m: 3000, from_deg: 240, speed_m_s: 14, isaOffset_K: -2 },
        ],
      },
      legs: base.legs.map((l) => ('wind' in l ? { ...l, windSource: 'aloft' as const } : l)),
    };
    const before = JSON.stringify(plan);
    const rng = normalSource(4);
    const spreads = { ...zero, windSpeed_m_s: 3, windDirection_deg: 20 };
    const speeds: number[] = [];
    for (let i = 0; i < 100; i++) {
      const { plan: p, draws } = perturbPlan(plan, spreads, rng);
      const levels = p.environment.windsAloft!;
      expect(levels).toHaveLength(2);
      expect(levels[1]!.isaOffset_K).toBe(-2);
      expect(levels[1]!.altitude_m).toBe(3000);
      for (const l of levels) {
        expect(l.speed_m_s).toBeGreaterThanOrEqual(0);
        expect(l.from_deg).toBeGreaterThanOrEqual(0);
        expect(l.from_deg).toBeLessThanOrEqual(360);
      }
      const d = draws.find((x) => x.path === 'environment.windsAloft.1.speed_m_s');
      expect(d?.value).toBe(levels[1]!.speed_m_s);
      expect(draws.some((x) => x.path === 'environment.windsAloft.0.from_deg')).toBe(true);
      speeds.push(levels[1]!.speed_m_s);
    }
    expect(JSON.stringify(plan)).toBe(before);
    // Normal draws around 14 m/s with σ = 3 m/s: the sample mean and spread (100 draws; the
    // standard error of the mean is 0.3 m/s, common statistics).
    const m = speeds.reduce((a, b) => a + b, 0) / speeds.length;
    const sd = Math.sqrt(speeds.reduce((a, b) => a + (b - m) ** 2, 0) / (speeds.length - 1));
    expect(Math.abs(m - 14)).toBeLessThan(1.2);
    expect(sd).toBeGreaterThan(2);
    expect(sd).toBeLessThan(4);
    // The table's wind enters the solution: the margin spreads, and the table inputs are ranked.
    const mc = reserveMonteCarlo(plan, spreads, { samples: 60, seed: 2 });
    expect(mc.margin!.max).toBeGreaterThan(mc.margin!.min);
    expect(mc.importance.some((x) => x.input.startsWith('environment.windsAloft.'))).toBe(true);
    // The table's draws come after the others: with the same random seed, the legs and the
    // aircraft draw the same values with or without a table.
    const tabled = { ...base, environment: plan.environment };
    const a = perturbPlan(base, spreads, normalSource(8)).draws;
    const b = perturbPlan(tabled, spreads, normalSource(8)).draws;
    expect(a.some((x) => x.path.startsWith('environment'))).toBe(false);
    expect(b.filter((x) => !x.path.startsWith('environment'))).toEqual(a);
    expect(b.length).toBe(a.length + 4);
  });
});
