import { describe, expect, it } from 'vitest';
import { formatQuantity } from '../../core/format.ts';
import { createUnits } from '../../renderer/src/composables/useUnits.ts';
import { createPlanStore } from '../../renderer/src/composables/usePlan.ts';
import {
  editableText,
  storedFromText,
  textShowsValue,
} from '../../renderer/src/support/fieldBinding.ts';
import { examplePlan } from './fixtures.ts';

describe('useUnits', () => {
  it('converts with the exact factors of the chosen system', () => {
    const u = createUnits('aviation');
    // 3048 m = 10 000 ft exactly (NIST SP 811 appendix B: ft = 0.3048 m).
    expect(u.toDisplay(3048, 'm', 'altitude')).toBeCloseTo(10_000, 9);
    // 1852 m = 1 NM exactly (NIST SP 811: nautical mile = 1852 m).
    expect(u.toDisplay(1852, 'm', 'distance')).toBeCloseTo(1, 12);
    // 0.45359237 kg = 1 lb exactly (international yard and pound agreement, 1959).
    expect(u.fromDisplay(1, 'kg', 'mass')).toBeCloseTo(0.45359237, 15);
    expect(u.unitLabel('airspeed')).toBe('kt');
    u.setSystem('si');
    expect(u.unitLabel('airspeed')).toBe('m/s');
  });

  it('formats through core/format.ts in the current system', () => {
    const u = createUnits('si');
    const si = u.format(3048, 'altitude');
    u.setSystem('aviation');
    // Same function the CLI and report use (core/format.ts formatQuantity), not a copy.
    expect(u.format(3048, 'altitude')).toBe(formatQuantity(3048, 'altitude', 'aviation'));
    u.setSystem('si');
    expect(u.format(3048, 'altitude')).toBe(si);
  });

  it('switching to aviation and back leaves the plan unchanged', () => {
    const plan = examplePlan('twelve-legs');
    const store = createPlanStore(plan);
    const u = createUnits('si');
    const before = store.draft.value;
    const siText = editableText(before.aircraft.ceiling_m, 'm', u.unitFor('altitude'));
    u.setSystem('aviation');
    const aviationText = editableText(
      store.draft.value.aircraft.ceiling_m,
      'm',
      u.unitFor('altitude'),
    );
    expect(aviationText).not.toBe(siText);
    // Shown in ft, the box still stands for the stored metres (5 significant digits shown, 1e-4 relative).
    const shownBack = storedFromText(aviationText, 'ft', 'm');
    expect(Math.abs(shownBack - plan.aircraft.ceiling_m) / plan.aircraft.ceiling_m).toBeLessThan(
      1e-4,
    );
    u.setSystem('si');
    expect(editableText(store.draft.value.aircraft.ceiling_m, 'm', u.unitFor('altitude'))).toBe(
      siText,
    );
    // Nothing was written: the very same plan object, the stored value untouched.
    expect(store.draft.value).toBe(before);
    expect(store.draft.value.aircraft.ceiling_m).toBe(plan.aircraft.ceiling_m);
    expect(store.history.canUndo.value).toBe(false);
  });

  it('a box keeps its typed text while it stands for the stored value', () => {
    // 10 000 ft typed; stored as 3048 m (NIST SP 811: ft = 0.3048 m exactly).
    const stored = storedFromText('10000', 'ft', 'm');
    expect(stored).toBeCloseTo(3048, 9);
    expect(textShowsValue('10000', stored, 'm', 'ft')).toBe(true);
    expect(textShowsValue('10,000', stored, 'm', 'ft')).toBe(false);
    // After a unit switch the same text no longer stands for the value and gets refreshed.
    expect(textShowsValue('10000', stored, 'm', 'm')).toBe(false);
    expect(editableText(stored, 'm', 'm')).toBe('3048');
  });
});
