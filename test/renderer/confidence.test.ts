import { describe, expect, it } from 'vitest';
import { reserveMonteCarlo } from '../../core/uncertainty/reserveMonteCarlo.ts';
import { spreadsFromDefaults } from '../../core/uncertainty/spreads.ts';
import {
  createConfidenceRun,
  type ConfidenceResult,
} from '../../renderer/src/support/confidence.ts';
import {
  correlationLine,
  failureLines,
  keptSentence,
  importanceRows,
} from '../../renderer/src/support/confidenceText.ts';
import { failureSentence } from '../../core/uncertainty/failureCauses.ts';
import { formatQuantity } from '../../core/format.ts';
import {
  defaultUncertainty,
  spreadsOf,
  uncertaintyOf,
} from '../../renderer/src/support/confidenceFields.ts';
import { profileChart } from '../../renderer/src/support/chartData.ts';
import { solvePlan } from '../../core/solver/solve.ts';
import { createPlanStore } from '../../renderer/src/composables/usePlan.ts';
import { createConfidence } from '../../renderer/src/composables/useConfidence.ts';
import { uncertaintyFields } from '../../renderer/src/support/confidenceFields.ts';
import { examplePlan } from './fixtures.ts';

function run(name: string, samples: number, seed: number): ConfidenceResult {
  const plan = examplePlan(name);
  const r = createConfidenceRun(plan, spreadsFromDefaults(plan), { samples, seed });
  while (!r.step(7));
  return r.result();
}

describe('reserve confidence', () => {
  it('gives the landing figures of core reserveMonteCarlo for the same random seed', () => {
    const plan = examplePlan('survey-uav-electric');
    const mine = run('survey-uav-electric', 150, 42);
    // The core's own Monte Carlo, same draws (normalSource from the random seed, perturbPlan per sample).
    const core = reserveMonteCarlo(plan, spreadsFromDefaults(plan), { samples: 150, seed: 42 });
    expect(mine.probabilityReserveNotKept).toBe(core.probabilityReserveNotKept);
    expect(mine.completedSamples).toBe(core.completedSamples);
    expect(mine.remaining?.p5).toBeCloseTo(core.remaining?.p5 ?? Number.NaN, 9);
    expect(mine.margin?.p50).toBeCloseTo(core.margin?.p50 ?? Number.NaN, 9);
    expect(mine.importance.map((e) => e.input)).toEqual(core.importance.map((e) => e.input));
  });

  it('is deterministic in the random seed and orders the band percentiles', () => {
    const a = run('twelve-legs', 120, 7);
    const b = run('twelve-legs', 120, 7);
    expect(b).toEqual(a);
    const plan = examplePlan('twelve-legs');
    const nominal = solvePlan(plan, { samplesPerLeg: 2 });
    // The band: the mission start, then the end of every leg the nominal plan flies.
    expect(a.band).toHaveLength(1 + nominal.legs.filter((l) => l.status === 'flown').length);
    // Percentiles are ordered (Hyndman–Fan definition 7 is monotone in p).
    for (const p of a.band) {
      expect(p.p5).toBeLessThanOrEqual(p.p50);
      expect(p.p50).toBeLessThanOrEqual(p.p95);
    }
    // Fuel is not a drawn input: every simulated flight starts with the plan's fuel load.
    const start = a.band[0];
    const fuel =
      plan.aircraft.powerplant.type === 'electric' ? 0 : plan.aircraft.powerplant.fuel.load_kg;
    expect(start?.p5).toBeCloseTo(fuel, 9);
    expect(start?.p95).toBeCloseTo(fuel, 9);
    // Drawn inputs with a spread above 0 spread the fuel left at the end.
    expect(a.band.at(-1)?.p95).toBeGreaterThan(a.band.at(-1)?.p5 ?? Infinity);
  });

  it('draws the band on the profile chart, on the fuel axis', () => {
    const result = solvePlan(examplePlan('twelve-legs'), { samplesPerLeg: 4 });
    const r = run('twelve-legs', 100, 3);
    const spec = profileChart(result, 'distance', 'si', r.band);
    const roles = spec.series.map((s) => s.role);
    expect(roles).toContain('bandLow');
    expect(roles.indexOf('bandHigh')).toBe(roles.indexOf('bandLow') + 1);
    expect(spec.series.find((s) => s.role === 'bandHigh')?.axis).toBe('y2');
  });

  it('says in plain words how often the reserve is kept', () => {
    const base = run('twelve-legs', 100, 1);
    // 3 % not kept of 1000 = 30 flights, so 970 kept, 97 of 100 (arithmetic).
    expect(keptSentence({ ...base, samples: 1000, probabilityReserveNotKept: 0.03 })).toBe(
      'In 97 of 100 simulated flights the reserve is kept (970 of 1000).',
    );
    // 189 of 200 kept = 94.5 of 100: rounded down, never up.
    expect(keptSentence({ ...base, samples: 200, probabilityReserveNotKept: 0.055 })).toBe(
      'In 94 of 100 simulated flights the reserve is kept (189 of 200).',
    );
    expect(keptSentence({ ...base, samples: 1000, probabilityReserveNotKept: 0 })).toBe(
      'In all 1000 simulated flights the reserve is kept.',
    );
    // A rare shortfall is never rounded away: 998 of 1000 is 99 of 100, not 100.
    expect(keptSentence({ ...base, samples: 1000, probabilityReserveNotKept: 0.002 })).toBe(
      'In 99 of 100 simulated flights the reserve is kept (998 of 1000).',
    );
    const rows = importanceRows(base, examplePlan('twelve-legs'));
    expect(rows.length).toBeGreaterThan(0);
    expect(rows.every((r) => !r.label.includes('.'))).toBe(true);
  });

  it('spreads default to the core values until edited, then are saved with the plan', () => {
    const plan = examplePlan('twelve-legs');
    expect(plan.uncertainty).toBeUndefined();
    // The core defaults (spreadsFromDefaults, common practice) within the plan schema's limits.
    expect(spreadsOf(uncertaintyOf(plan))).toEqual(spreadsFromDefaults(plan));
    const store = createPlanStore(plan);
    const cd0 = uncertaintyFields(plan).find((f) => f.path === 'uncertainty.cd0');
    if (cd0?.type !== 'number') throw new Error('cd0 field');
    store.setValue(cd0.path, 0.1, cd0.path, cd0.block);
    expect(store.draft.value.uncertainty).toEqual({ ...defaultUncertainty(plan), cd0: 0.1 });
    expect(store.valid.value).toBe(true);
  });

  it('runs on the page in slices where no worker can start, with the same answer', async () => {
    const plan = { ...examplePlan('piston-tourer'), uncertainty: undefined };
    const u = { ...spreadsFromDefaults(plan), samples: 100, seed: 5 };
    const store = createPlanStore({ ...plan, uncertainty: u });
    const c = createConfidence(store);
    expect(typeof Worker).toBe('undefined');
    c.run();
    for (let i = 0; i < 400 && c.state.value.kind !== 'done'; i++)
      await new Promise((r) => setTimeout(r, 5));
    const direct = createConfidenceRun(store.lastValid.value, spreadsFromDefaults(plan), {
      samples: 100,
      seed: 5,
    });
    while (!direct.step(25));
    expect(c.current.value).toEqual(direct.result());
  });

  it('lists the failed flights by leg and cause, and the wind correlation used', () => {
    // The survey loiter (19 m/s TAS) in a 17 m/s wind, σ 3 m/s: some flights cannot hold
    // station. The panel's lines are core's sentences in the chosen units.
    const demo = examplePlan('survey-uav-electric');
    const legs = demo.legs.map((l, i) =>
      i === 3 && l.kind === 'loiter' ? { ...l, wind: { speed_m_s: 17, from_deg: 40 } } : l,
    );
    const plan = { ...demo, legs };
    const spreads = { ...spreadsFromDefaults(plan), windSpeed_m_s: 3 };
    const r = createConfidenceRun(plan, spreads, { samples: 150, seed: 5 });
    while (!r.step(50));
    const result = r.result();
    expect(result.failures.length).toBeGreaterThan(0);
    const units = {
      format: (v: number, q: Parameters<typeof formatQuantity>[1]) =>
        formatQuantity(v, q, 'aviation'),
    };
    const lines = failureLines(result, plan, units);
    expect(lines[0]).toBe(
      failureSentence(result.failures[0]!, 150, plan, result.consumable, units.format),
    );
    expect(lines[0]).toMatch(
      /^In \d+ of 150 simulated flights leg 4 “Survey lines” \(loiter\) could not hold station in a wind of .* kt\.$/,
    );
    // No uncertainty block: the default correlation, said to be common practice.
    expect(correlationLine(result, plan)).toBe(
      'Wind errors of the legs of one flight correlated 0.8 (default, common practice).',
    );
  });
});
