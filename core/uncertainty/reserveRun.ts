/**
 * The reserve Monte Carlo as a run that can be advanced in slices (a worker reports progress;
 * a page without workers runs it between frames); `reserveMonteCarlo` runs it to the end.
 *
 * Each sample perturbs the plan (spreads.ts) with an xoroshiro128+ stream from a random seed
 * (random.ts), solves it with the mission solver ('fast' tolerance unless asked) and records
 * the landing margin = amount left on landing − reserve required (kg of fuel, or J of usable
 * battery energy), plus what is on board at the start and at the end of every leg the
 * nominal plan flies (a p5–p95 band for the profile chart). A sample whose plan fails counts
 * as a reserve not kept, as does one the solver reports as not keeping it (`reserve.kept`);
 * failed samples are also counted by the leg that failed and why (failureCauses.ts).
 * Percentiles and the mean are over the completed samples (Hyndman–Fan definition 7,
 * stats.ts); the probability of not keeping the reserve is over all samples. Input importance
 * is Spearman's rank correlation between each drawn input and the margin, failed samples
 * ranked below every completed one (tied) — monotone and scale-free; it understates inputs
 * whose effect is not monotone (a wind direction swinging from head- to tailwind).
 */
import { InputError, requireFinite } from '../errors.ts';
import type { Plan } from '../plan/schema.ts';
import { solvePlan, type SolveTolerance } from '../solver/solve.ts';
import type { Consumable, PlanResult } from '../solver/types.ts';
import { failureTally, type FailureCause } from './failureCauses.ts';
import { normalSource } from './random.ts';
import { checkSpreads, perturbPlan, type ReserveSpreads } from './spreads.ts';
import { DEFAULT_WIND_CORRELATION } from './windErrors.ts';
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

const marginOf = (r: PlanResult) => r.landing.remaining - r.reserve.required.total;
const onBoard = (r: PlanResult, s: { fuel_kg: number; energy_J: number }) =>
  r.consumable === 'battery' ? s.energy_J : s.fuel_kg;

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

export interface BandPoint {
  /** Where along the nominal mission: ground distance and time from the start. */
  x_m: number;
  t_s: number;
  /** Fuel (kg) or usable energy (J) on board, percentiles over the samples that got there. */
  p5: number;
  p50: number;
  p95: number;
  count: number;
}

export interface ReserveRunResult {
  seed: number;
  samples: number;
  consumable: Consumable;
  nominal: { completed: boolean; remaining: number; margin: number };
  completedSamples: number;
  remaining: Distribution | null;
  margin: Distribution | null;
  probabilityReserveNotKept: number;
  failedFraction: number;
  /** The failed flights counted by the leg that failed and why, most frequent first. */
  failures: FailureCause[];
  /** Completed flights that landed with less than the reserve. */
  reserveShortCount: number;
  /** The correlation of the legs' wind errors the run used (windErrors.ts). */
  windCorrelation: number;
  importance: InputImportance[];
  /** The start of the mission, then the end of every leg the nominal plan flies. */
  band: BandPoint[];
}

export interface ReserveRun {
  readonly total: number;
  readonly done: number;
  /** Solves up to `count` more samples; true when all are done. */
  step(count: number): boolean;
  result(): ReserveRunResult;
}

export function createReserveRun(
  plan: Plan,
  spreads: ReserveSpreads,
  options: MonteCarloOptions = {},
): ReserveRun {
  checkSpreads(spreads);
  const total = requireFinite('samples', options.samples ?? 2000, 1, 100_000);
  if (!Number.isInteger(total)) throw new InputError('samples', total, 'a whole number');
  const seed = options.seed ?? 1;
  const SOLVE = {
    samplesPerLeg: options.samplesPerLeg ?? 2,
    tolerance: options.tolerance ?? 'fast',
  };
  const rng = normalSource(seed);
  const nominal = solvePlan(plan, SOLVE);
  // Band points: start of leg 0, then the end of each leg the nominal plan completes.
  const flown = nominal.legs.filter((l) => l.status === 'flown');
  const points = [nominal.legs[0]?.start, ...flown.map((l) => l.end)].filter(
    (s): s is NonNullable<typeof s> => s !== undefined,
  );
  const atPoint: number[][] = points.map(() => []);
  const margins: number[] = [];
  const remaining: number[] = [];
  const completed: boolean[] = [];
  const inputs = new Map<string, number[]>();
  let notKept = 0;
  let failed = 0;
  let short = 0;
  const tally = failureTally();
  let done = 0;

  function solveOne(): void {
    const { plan: perturbed, draws } = perturbPlan(plan, spreads, rng);
    for (const d of draws) {
      const column = inputs.get(d.path) ?? [];
      column.push(d.value);
      inputs.set(d.path, column);
    }
    const r = solvePlan(perturbed, SOLVE);
    const first = r.legs[0];
    if (first) atPoint[0]?.push(onBoard(r, first.start));
    flown.forEach((nominalLeg, k) => {
      const leg = r.legs[nominalLeg.index];
      if (leg?.status === 'flown') atPoint[k + 1]?.push(onBoard(r, leg.end));
    });
    completed.push(r.completed);
    if (!r.completed) {
      tally.add(perturbed, r);
      failed++;
      notKept++;
      margins.push(0);
      return;
    }
    margins.push(marginOf(r));
    remaining.push(r.landing.remaining);
    if (!r.reserve.kept) {
      notKept++;
      short++;
    }
  }

  function result(): ReserveRunResult {
    const n = Math.max(1, done);
    const finished = margins.filter((_, i) => completed[i]);
    // Failed samples rank below every completed one, all tied (as reserveMonteCarlo does).
    const lowest = finished.reduce((a, b) => Math.min(a, b), 0);
    const floor = lowest - 1 - Math.abs(lowest);
    const score = margins.map((m, i) => (completed[i] ? m : floor));
    const importance = [...inputs.entries()]
      .map(([input, values]) => ({ input, rho: done > 1 ? spearman(values, score) : 0 }))
      .sort((a, b) => Math.abs(b.rho) - Math.abs(a.rho) || a.input.localeCompare(b.input));
    const band = points.flatMap((state, k) => {
      const d = distribution(atPoint[k] ?? []);
      return d
        ? [
            {
              x_m: state.x_m,
              t_s: state.t_s,
              p5: d.p5,
              p50: d.p50,
              p95: d.p95,
              count: atPoint[k]?.length ?? 0,
            },
          ]
        : [];
    });
    return {
      seed,
      samples: done,
      consumable: nominal.consumable,
      nominal: {
        completed: nominal.completed,
        remaining: nominal.landing.remaining,
        margin: marginOf(nominal),
      },
      completedSamples: finished.length,
      remaining: distribution(remaining),
      margin: distribution(finished),
      probabilityReserveNotKept: notKept / n,
      failedFraction: failed / n,
      failures: tally.list(),
      reserveShortCount: short,
      windCorrelation: spreads.windCorrelation ?? DEFAULT_WIND_CORRELATION,
      importance,
      band,
    };
  }

  return {
    total,
    get done() {
      return done;
    },
    step(count: number): boolean {
      const end = Math.min(total, done + Math.max(1, Math.floor(count)));
      while (done < end) {
        solveOne();
        done++;
      }
      return done >= total;
    },
    result,
  };
}
