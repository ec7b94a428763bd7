/**
 * `legwise solve --monte-carlo`: the reserve Monte Carlo (core/uncertainty) after the solve —
 * percentiles of the landing margin over the reserve, how often the reserve is kept in plain
 * words, and the inputs that matter most. Spreads, samples and random seed come from the
 * plan's `uncertainty` block, or the defaults of core/uncertainty/spreads.ts.
 */
import { formatQuantity } from '../core/format.ts';
import type { Plan } from '../core/plan/schema.ts';
import {
  createReserveRun,
  type ReserveMonteCarloResult,
} from '../core/uncertainty/reserveMonteCarlo.ts';
import { monteCarloSetup } from '../core/uncertainty/spreads.ts';
import type { UnitSystemId } from '../core/units.ts';

/** Samples solved between two progress reports. */
const STEP = 50;

/** The reserve Monte Carlo, in steps so a long run can report how far it is. */
export function runMonteCarlo(
  plan: Plan,
  progress?: (done: number, total: number, what: string) => void,
): ReserveMonteCarloResult {
  const { spreads, samples, seed } = monteCarloSetup(plan);
  const run = createReserveRun(plan, spreads, { samples, seed });
  while (!run.step(STEP)) progress?.(run.done, run.total, 'simulated flights');
  return run.result();
}

/**
 * "In N of 100 simulated flights the reserve is kept." N is rounded down, so a reserve
 * missed in even one sample never reads as 100 of 100.
 */
export function keptSentence(mc: ReserveMonteCarloResult): string {
  const kept = 1 - mc.probabilityReserveNotKept;
  const n = kept >= 1 ? 100 : Math.floor(100 * kept);
  return `In ${n} of 100 simulated flights the reserve is kept.`;
}

export function renderMonteCarloText(mc: ReserveMonteCarloResult, units: UnitSystemId): string {
  const q = mc.consumable === 'fuel' ? 'fuelMass' : 'energy';
  const f = (v: number) => formatQuantity(v, q, units);
  const lines = [
    `Reserve Monte Carlo: ${mc.samples} simulated flights (random seed ${mc.seed})`,
    `  ${keptSentence(mc)}`,
  ];
  if (mc.failedFraction > 0) {
    const failed = Math.round(mc.failedFraction * mc.samples);
    lines.push(
      `  ${failed} of the ${mc.samples} simulated flights ${failed === 1 ? 'has' : 'have'} a leg that cannot be flown.`,
    );
  }
  const d = mc.margin;
  if (d === null) {
    lines.push('  No simulated flight completed the mission.');
  } else {
    lines.push(`  Landing margin over the reserve (${mc.completedSamples} completed flights):`);
    lines.push(`    p5 ${f(d.p5)} · p50 ${f(d.p50)} · p95 ${f(d.p95)} (lowest ${f(d.min)})`);
  }
  const top = mc.importance.filter((i) => Math.abs(i.rho) >= 0.1).slice(0, 3);
  if (top.length > 0) {
    const words = top.map(
      (i) => `${i.input} (${i.rho >= 0 ? '+' : '−'}${Math.abs(i.rho).toFixed(2)})`,
    );
    lines.push(`  Inputs that matter most (rank correlation with the margin): ${words.join(', ')}`);
  }
  return `${lines.join('\n')}\n`;
}
