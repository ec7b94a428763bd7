/**
 * The aircraft sheet's propeller-curve, stall-drag-rise and engine-count fields
 * (renderer/src/support/propellerFields.ts): switching the choices adds or drops the blocks
 * and the plan stays valid (PlanSchema) and solvable.
 */
import { describe, expect, it } from 'vitest';
import { parsePlan } from '../../core/plan/load.ts';
import { solvePlan } from '../../core/solver/solve.ts';
import { createPlanStore } from '../../renderer/src/composables/usePlan.ts';
import { aircraftSections } from '../../renderer/src/support/aircraftFields.ts';
import type { ChoiceFieldDef, FieldDef } from '../../renderer/src/support/fieldTypes.ts';
import { examplePlan } from './fixtures.ts';

const fieldAt = (fields: FieldDef[], path: string) => fields.find((f) => f.path === path);
const all = (store: ReturnType<typeof createPlanStore>) =>
  aircraftSections(store.draft.value).flatMap((s) => s.fields);

describe('propeller efficiency fields', () => {
  it('constant drops the curve, momentum adds one with defaults; both stay valid', () => {
    const store = createPlanStore(examplePlan('piston-tourer'));
    const pick = fieldAt(all(store), 'aircraft.powerplant.propeller.model') as ChoiceFieldDef;
    expect(fieldAt(all(store), 'aircraft.powerplant.propeller.diameter_m')).toBeDefined();
    store.setChoice(pick, 'constant');
    const pp = store.draft.value.aircraft.powerplant;
    expect(pp.type === 'propeller' && pp.propeller === undefined).toBe(true);
    expect(fieldAt(all(store), 'aircraft.powerplant.propeller.diameter_m')).toBeUndefined();
    expect(parsePlan(store.draft.value).ok).toBe(true);
    store.setChoice(pick, 'momentum');
    const again = store.draft.value.aircraft.powerplant;
    expect(again.type === 'propeller' && again.propeller?.model).toBe('momentum');
    expect(parsePlan(store.draft.value).ok).toBe(true);
    expect(solvePlan(store.draft.value).legs.every((l) => l.status === 'flown')).toBe(true);
  });

  it('the electric sheet has the same choice', () => {
    const store = createPlanStore(examplePlan('survey-uav-electric'));
    expect(fieldAt(all(store), 'aircraft.powerplant.propeller.model')).toBeDefined();
  });
});

describe('stall drag rise and engine count', () => {
  it('parabola drops the rise, rise adds 0.8·CLmax and CD0 (the migration default)', () => {
    const store = createPlanStore(examplePlan('piston-tourer'));
    // The sheet is rebuilt from the plan after every edit, so the choice is looked up again.
    const pick = () => fieldAt(all(store), 'aircraft.polar.stallDragRise.kind') as ChoiceFieldDef;
    store.setChoice(pick(), 'parabola');
    expect(store.draft.value.aircraft.polar.stallDragRise).toBeUndefined();
    store.setChoice(pick(), 'rise');
    const { CLmax, CD0, stallDragRise } = store.draft.value.aircraft.polar;
    expect(stallDragRise).toEqual({ onsetCL: Number((0.8 * CLmax).toPrecision(3)), atCLmax: CD0 });
    expect(parsePlan(store.draft.value).ok).toBe(true);
  });

  it('a twin shows the one-engine-out drag field, a single does not', () => {
    const store = createPlanStore(examplePlan('piston-tourer'));
    expect(fieldAt(all(store), 'aircraft.oeiDragIncrement')).toBeUndefined();
    store.setValue('aircraft.engineCount', 2);
    expect(fieldAt(all(store), 'aircraft.oeiDragIncrement')).toBeDefined();
    const r = solvePlan(store.draft.value);
    expect(r.checks.some((c) => c.id === 'oneEngineOut')).toBe(true);
  });
});
