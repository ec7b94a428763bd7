/**
 * Monte Carlo of the landing reserve: how sure is it that the plan lands with its reserve?
 *
 * Each sample perturbs the plan (spreads.ts) with an xoroshiro128+ stream from a random seed
 * (random.ts), solves it with the mission solver (core/solver/solve.ts, 'fast' tolerance
 * unless asked) and records the landing margin = amount left on landing − reserve required
 * (kg of fuel, or J of usable battery energy). A sample whose plan fails (a leg cannot be
 * flown) counts as a reserve not kept, as does one the solver reports as not keeping it
 * (`reserve.kept`). Percentiles and the mean are over the completed samples (Hyndman–Fan
 * definition 7, stats.ts); the probability of not keeping the reserve is over all samples.
 * Input importance is Spearman's rank correlation between each drawn input and the margin,
 * failed samples ranked below every completed one (tied) — a monotone, scale-free measure;
 * it understates inputs whose effect is not monotone (a wind direction swinging from head-
 * to tailwind).
 */
import { InputError, requireFinite } from '../errors.ts';
import type { Plan } from '../plan/schema.ts';
import { solvePlan, type SolveTolerance } from '../solver/solve.ts';
import type { Consumable, PlanResult } from '../solver/types.ts';
import { normalSource } from './random.ts';
import { checkSpreads, perturbPlan, type ReserveSpreads } from './spreads.ts';
import { mean, percentileSorted, spearman } from './stats.ts';

export interface MonteCarloOptions {
  /** Number of samples, 1 to 100 000; 2000 if omitted. */
  samples?: number;
  /** Random seed (integer); 1 if omitted. */
  seed?: number;
  /** Passed to solvePlan; chart series are not needed here, so 2 if omitted. */
  samplesPerLeg?: number;
  /**
   * Passed to solvePlan; 'fast' (relative tolerance 1e-6) if omitted: the spreads of the
   * inputs are orders of magnitude larger than that.
   */
  tolerance?: SolveTolerance;
}

export interface Distribution {
  mean: number;
  min: number;
  p1: number;
  p5: number;
  p10: number;
  p50: number;
  p90: number;
  p95: number;
  p99: number;
  max: number;
}

export interface InputImportance {
  /** Plan path of the input, e.g. `legs.3.wind.speed_m_s`, `aircraft.polar.CD0`. */
  input: string;
  /** Spearman rank correlation with the landing margin (+: more of the input, more margin). */
  rho: number;
}

export interface ReserveMonteCarloResult {
  seed: number;
  samples: number;
  consumable: Consumable;
  /** The unperturbed plan, solved with the same options. */
  nominal: { completed: boolean; remaining: number; margin: number };
  completedSamples: number;
  /** Landing margin (remaining − reserve required) over completed samples; null if none completed. */
  margin: Distribution | null;
  /** Amount left on landing over completed samples. */
  remaining: Distribution | null;
  /** Fraction of samples that failed outright or landed below the reserve. */
  probabilityReserveNotKept: number;
  /** Fraction of samples in which a leg could not be flown. */
  failedFraction: number;
  /** Sorted by |rho|, largest first. */
  importance: InputImportance[];
}

const marginOf = (r: PlanResult): number => r.landing.remaining - r.reserve.required.total;

function distribution(values: number[]): Distribution | null {
  if (values.length === 0) return null;
  const s = [...values].sort((a, b) => a - b);
  const q = (p: number) => percentileSorted(s, p);
  return {
    mean: mean(s),
    min: s[0] as number,
    p1: q(0.01),
    p5: q(0.05),
    p10: q(0.1),
    p50: q(0.5),
    p90: q(0.9),
    p95: q(0.95),
    p99: q(0.99),
    max: s[s.length - 1] as number,
  };
}

export function reserveMonteCarlo(
  plan: Plan,
  spreads: ReserveSpreads,
  options: MonteCarloOptions = {},
): ReserveMonteCarloResult {
  checkSpreads(spreads);
  const samples = requireFinite('samples', options.samples ?? 2000, 1, 100_000);
  if (!Number.isInteger(samples)) throw new InputError('samples', samples, 'a whole number');
  const seed = options.seed ?? 1;
  const solveOptions = {
    samplesPerLeg: options.samplesPerLeg ?? 2,
    tolerance: options.tolerance ?? 'fast',
  };
  const rng = normalSource(seed);

  const nominalResult = solvePlan(plan, solveOptions);
  const margins: number[] = [];
  const remaining: number[] = [];
  const completed: boolean[] = [];
  const inputs = new Map<string, number[]>();
  let notKept = 0;
  let failed = 0;
  for (let i = 0; i < samples; i++) {
    const { plan: perturbed, draws } = perturbPlan(plan, spreads, rng);
    for (const d of draws) {
      const column = inputs.get(d.path) ?? [];
      column.push(d.value);
      inputs.set(d.path, column);
    }
    const r = solvePlan(perturbed, solveOptions);
    completed.push(r.completed);
    if (!r.completed) {
      failed++;
      notKept++;
      margins.push(0);
      continue;
    }
    const m = marginOf(r);
    margins.push(m);
    remaining.push(r.landing.remaining);
    // The solver's own verdict: also not kept when a reserve part could not be computed.
    if (!r.reserve.kept) notKept++;
  }
  const done = margins.filter((_, i) => completed[i]);
  // Failed samples rank below every completed one, all tied.
  const lowest = done.reduce((a, b) => Math.min(a, b), 0);
  const floor = lowest - 1 - Math.abs(lowest);
  const score = margins.map((m, i) => (completed[i] ? m : floor));
  const importance = [...inputs.entries()]
    .map(([input, values]) => ({ input, rho: spearman(values, score) }))
    .sort((a, b) => Math.abs(b.rho) - Math.abs(a.rho) || a.input.localeCompare(b.input));

  return {
    seed,
    samples,
    consumable: nominalResult.consumable,
    nominal: {
      completed: nominalResult.completed,
      remaining: nominalResult.landing.remaining,
      margin: marginOf(nominalResult),
    },
    completedSamples: done.length,
    margin: distribution(done),
    remaining: distribution(remaining),
    probabilityReserveNotKept: notKept / samples,
    failedFraction: failed / samples,
    importance,
  };
}
