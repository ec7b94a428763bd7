/**
 * Monte Carlo of the landing reserve, run to the end in one call: how sure is it that the
 * plan lands with its reserve? The method and its sources are in reserveRun.ts.
 */
import type { Plan } from '../plan/schema.ts';
import { createReserveRun, type MonteCarloOptions, type ReserveRunResult } from './reserveRun.ts';
import type { ReserveSpreads } from './spreads.ts';

export type {
  BandPoint,
  Distribution,
  InputImportance,
  MonteCarloOptions,
  ReserveRun,
  ReserveRunResult,
} from './reserveRun.ts';
export { createReserveRun } from './reserveRun.ts';

export type ReserveMonteCarloResult = ReserveRunResult;

export function reserveMonteCarlo(
  plan: Plan,
  spreads: ReserveSpreads,
  options: MonteCarloOptions = {},
): ReserveMonteCarloResult {
  const run = createReserveRun(plan, spreads, options);
  run.step(run.total);
  return run.result();
}
