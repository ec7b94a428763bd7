/** Messages between the Confidence panel and its worker (workers/monteCarlo.ts). */
import type { Plan } from '../../../core/plan/schema.ts';
import type { ReserveSpreads } from '../../../core/uncertainty/spreads.ts';
import type { ConfidenceResult } from './confidence.ts';

export interface ConfidenceRequest {
  plan: Plan;
  spreads: ReserveSpreads;
  samples: number;
  seed: number;
}

export type ConfidenceMessage =
  | { type: 'progress'; done: number; total: number }
  | { type: 'done'; result: ConfidenceResult }
  | { type: 'error'; message: string };
