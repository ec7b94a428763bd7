/**
 * The solved plan, recomputed on every change of the last valid plan. A 12-leg plan
 * solves in about a millisecond, so this runs synchronously in a computed; the optimizers
 * cost hundreds of solves and run only when asked (see useTune).
 */
import { computed, inject, type ComputedRef, type InjectionKey, type Ref } from 'vue';
import type { Plan } from '../../../core/plan/schema.ts';
import type { PlanResult } from '../../../core/solver/types.ts';
import { solvePlan } from '../../../core/solver/solve.ts';

export type SolveOutcome =
  { ok: true; result: PlanResult; solve_ms: number } | { ok: false; message: string };

export interface ResultStore {
  readonly outcome: ComputedRef<SolveOutcome>;
  /** The last result, or null when the solver refused the plan. */
  readonly result: ComputedRef<PlanResult | null>;
  /** The plan being edited does not pass its check: the result shown belongs to an earlier plan. */
  readonly stale: ComputedRef<boolean>;
}

/** Samples per leg for the profile chart: enough for a smooth curve, cheap to draw. */
export const SAMPLES_PER_LEG = 16;

export function solveOutcome(plan: Plan): SolveOutcome {
  const t0 = performance.now();
  try {
    const result = solvePlan(plan, { samplesPerLeg: SAMPLES_PER_LEG });
    return { ok: true, result, solve_ms: performance.now() - t0 };
  } catch (err) {
    // solvePlan promises not to throw for a checked plan; if it does, say so instead of going blank.
    return { ok: false, message: err instanceof Error ? err.message : String(err) };
  }
}

export function createResultStore(
  lastValid: Readonly<Ref<Plan>>,
  valid: Readonly<Ref<boolean>>,
): ResultStore {
  const outcome = computed(() => solveOutcome(lastValid.value));
  return {
    outcome,
    result: computed(() => (outcome.value.ok ? outcome.value.result : null)),
    stale: computed(() => !valid.value),
  };
}

export const RESULT_KEY: InjectionKey<ResultStore> = Symbol('result');

export function useResult(): ResultStore {
  const store = inject(RESULT_KEY);
  if (!store) throw new Error('useResult() needs the result store provided by the app');
  return store;
}
