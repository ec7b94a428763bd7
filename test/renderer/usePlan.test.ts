import { describe, expect, it } from 'vitest';
import { newPlan } from '../../core/plan/defaults.ts';
import { createPlanStore } from '../../renderer/src/composables/usePlan.ts';
import { createResultStore } from '../../renderer/src/composables/useResult.ts';
import { aircraftSections } from '../../renderer/src/support/aircraftFields.ts';
import { examplePlan } from './fixtures.ts';

const ids = (legs: readonly { id: string }[]) => legs.map((l) => l.id);

describe('usePlan leg editing', () => {
  it('adds a leg after the selected one with a fresh id and selects it', () => {
    const store = createPlanStore(newPlan());
    const before = ids(store.draft.value.legs);
    store.addLeg('loiter', 2);
    const after = ids(store.draft.value.legs);
    expect(after).toHaveLength(before.length + 1);
    expect(new Set(after).size).toBe(after.length);
    expect(store.draft.value.legs[2]?.kind).toBe('loiter');
    expect(store.selectedLegId.value).toBe(after[2]);
    expect(store.valid.value).toBe(true);
  });

  it('duplicates a leg right after itself with a fresh id and the same content', () => {
    const store = createPlanStore(examplePlan('twelve-legs'));
    const source = store.draft.value.legs[2];
    store.duplicateLeg(2);
    const copy = store.draft.value.legs[3];
    expect(copy?.id).not.toBe(source?.id);
    expect({ ...copy, id: 'x' }).toEqual({ ...source, id: 'x' });
    const all = ids(store.draft.value.legs);
    expect(new Set(all).size).toBe(all.length);
    expect(store.valid.value).toBe(true);
  });

  it('moves a leg and undo puts it back', () => {
    const store = createPlanStore(examplePlan('twelve-legs'));
    const before = ids(store.draft.value.legs);
    store.moveLeg(4, 3);
    const after = ids(store.draft.value.legs);
    expect(after[3]).toBe(before[4]);
    expect(after[4]).toBe(before[3]);
    expect([...after].sort()).toEqual([...before].sort());
    store.undo();
    expect(ids(store.draft.value.legs)).toEqual(before);
    store.redo();
    expect(ids(store.draft.value.legs)).toEqual(after);
  });

  it('moving past either end stops at the end; a no-op makes no history step', () => {
    const store = createPlanStore(newPlan());
    store.moveLeg(0, -1);
    expect(store.history.canUndo.value).toBe(false);
    const n = store.draft.value.legs.length;
    store.moveLeg(0, n + 5);
    expect(ids(store.draft.value.legs)[n - 1]).toBe(newPlan().legs[0]?.id);
  });

  it('deletes a leg, keeps at least one, and moves the selection to a neighbour', () => {
    const store = createPlanStore(newPlan());
    const first = store.draft.value.legs[1]?.id ?? null;
    store.selectedLegId.value = first;
    store.deleteLeg(1);
    expect(ids(store.draft.value.legs)).not.toContain(first);
    expect(store.selectedLegIndex.value).toBe(1);
    while (store.draft.value.legs.length > 1) store.deleteLeg(0);
    store.deleteLeg(0);
    expect(store.draft.value.legs).toHaveLength(1);
  });

  it('an invalid value names the field and keeps the last valid plan and result', () => {
    const store = createPlanStore(examplePlan('twelve-legs'));
    const result = createResultStore(store.lastValid, store.valid);
    const good = result.result.value;
    store.setValue('aircraft.mass.empty_kg', -5, 'aircraft.mass.empty_kg');
    expect(store.valid.value).toBe(false);
    expect(result.stale.value).toBe(true);
    const message = store.fieldIssues.value.byField.get('aircraft.mass.empty_kg');
    // The limit comes from PlanSchema (empty_kg: bounded(0.01, 500_000, 'kg')).
    expect(message).toMatch(/0\.01/);
    expect(result.result.value).toBe(good);
    store.undo();
    expect(store.valid.value).toBe(true);
    expect(result.stale.value).toBe(false);
  });

  it('text that is not a number becomes NaN in the draft and an issue at the field', () => {
    const store = createPlanStore(newPlan());
    store.setValue('aircraft.wingArea_m2', Number.NaN, 'aircraft.wingArea_m2');
    expect(store.fieldIssues.value.byField.has('aircraft.wingArea_m2')).toBe(true);
  });

  it('switching the powerplant to electric replaces fuel allowances so the plan stays valid', () => {
    const store = createPlanStore(examplePlan('twelve-legs'));
    const def = aircraftSections(store.draft.value)
      .flatMap((section) => section.fields)
      .find((f) => f.path === 'aircraft.powerplant.type');
    if (def?.type !== 'choice') throw new Error('the powerplant kind is a choice field');
    store.setChoice(def, 'electric');
    expect(store.draft.value.aircraft.powerplant.type).toBe('electric');
    expect(store.issues.value.filter((i) => i.path.startsWith('legs'))).toEqual([]);
  });
});
