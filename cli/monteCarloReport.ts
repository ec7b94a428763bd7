/**
 * `legwise solve --monte-carlo`: the reserve Monte Carlo (core/uncertainty) after the solve —
 * percentiles of the landing margin over the reserve, how often the reserve is kept in plain
 * words, the failed flights counted by leg and cause, and the inputs that matter most. Spreads, samples and random seed come from the
 * plan's `uncertainty` block, or the defaults of core/uncertainty/spreads.ts.
 */
import { formatQuantity } from '../core/format.ts';
import { failureSentence } from '../core/uncertainty/failureCauses.ts';
import type { Plan } from '../core/plan/schema.ts';
import {
  createReserveRun,
  type ReserveMonteCarloResult,
} from '../core/uncertainty/reserveMonteCarlo.ts';
import { monteCarloSetup } from '../core/uncertainty/spreads.ts';
import type { Quantity, UnitSystemId } from '../core/units.ts';

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

/** Failure causes listed; the rest are summed in one line. */
const CAUSES_SHOWN = 5;

export function renderMonteCarloText(
  mc: ReserveMonteCarloResult,
  units: UnitSystemId,
  plan: Plan,
): string {
  const q = mc.consumable === 'fuel' ? 'fuelMass' : 'energy';
  const f = (v: number) => formatQuantity(v, q, units);
  const lines = [
    `Reserve Monte Carlo: ${mc.samples} simulated flights (random seed ${mc.seed})`,
    `  ${keptSentence(mc)}`,
    `  Wind errors of the legs of one flight correlated ${String(Number(mc.windCorrelation.toFixed(2)))} (${plan.uncertainty?.windCorrelation === undefined ? 'default, common practice' : 'set in the plan'}).`,
  ];
  if (mc.failedFraction > 0) {
    const failed = Math.round(mc.failedFraction * mc.samples);
    lines.push(
      `  ${failed} of the ${mc.samples} simulated flights ${failed === 1 ? 'has' : 'have'} a leg that cannot be flown:`,
    );
    const speed = (v: number, quantity: Quantity) => formatQuantity(v, quantity, units);
    for (const cause of mc.failures.slice(0, CAUSES_SHOWN)) {
      lines.push(`    ${failureSentence(cause, mc.samples, plan, mc.consumable, speed)}`);
    }
    const rest = mc.failures.slice(CAUSES_SHOWN).reduce((n, c) => n + c.count, 0);
    if (rest > 0) lines.push(`    ${rest} more for other legs or causes.`);
  }
  if (mc.reserveShortCount > 0) {
    lines.push(
      `  ${mc.reserveShortCount} of the ${mc.samples} simulated flights complete the mission but land with less than the reserve.`,
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
