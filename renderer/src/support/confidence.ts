/**
 * The reserve Monte Carlo as the Confidence panel runs it: core's steppable run
 * (core/uncertainty/reserveRun.ts), under the names the panel uses.
 */
export {
  createReserveRun as createConfidenceRun,
  type BandPoint,
  type ReserveRun as ConfidenceRun,
  type ReserveRunResult as ConfidenceResult,
} from '../../../core/uncertainty/reserveRun.ts';
