/**
 * Wires the shared state of the planner screen: the plan with its history, the unit
 * system, the live result, the optimizers and the reserve Monte Carlo run on demand. Created once by App.vue and provided to every component.
 */
import { provide } from 'vue';
import type { Plan } from '../../../core/plan/schema.ts';
import type { UnitSystemId } from '../../../core/units.ts';
import { createPlanStore, PLAN_KEY, type PlanStore } from './usePlan.ts';
import { createResultStore, RESULT_KEY, type ResultStore } from './useResult.ts';
import { createUnits, UNITS_KEY, type Units, type UnitSettings } from './useUnits.ts';
import { createTune, TUNE_KEY, type Tune } from './useTune.ts';
import { CONFIDENCE_KEY, createConfidence, type Confidence } from './useConfidence.ts';

export interface Planner {
  plan: PlanStore;
  result: ResultStore;
  units: Units;
  tune: Tune;
  confidence: Confidence;
}

export function createPlanner(initial: Plan, system: UnitSystemId | UnitSettings = 'si'): Planner {
  const plan = createPlanStore(initial);
  const units = createUnits(system);
  return {
    plan,
    result: createResultStore(plan.lastValid, plan.valid),
    units,
    tune: createTune(plan, () =>
      units.unitFor('altitude') === 'ft' ? { step: 'ft500' } : { step: 'm100' },
    ),
    confidence: createConfidence(plan),
  };
}

/** Makes the planner available to `usePlan()`, `useResult()` and `useUnits()` below. */
export function providePlanner(planner: Planner): void {
  provide(PLAN_KEY, planner.plan);
  provide(RESULT_KEY, planner.result);
  provide(UNITS_KEY, planner.units);
  provide(TUNE_KEY, planner.tune);
  provide(CONFIDENCE_KEY, planner.confidence);
}
