import { describe, expect, it } from 'vitest';
import { parsePlan } from '../../core/plan/load.ts';
import { solvePlan } from '../../core/solver/solve.ts';
import { parseWindsText } from '../../core/weather/parseWindsText.ts';
import { createPlanStore } from '../../renderer/src/composables/usePlan.ts';
import {
  airfieldSections,
  fieldDataSection,
  FIELD_FACTORS,
  withAirfieldEnd,
} from '../../renderer/src/support/airfieldFields.ts';
import {
  addWindLevel,
  deleteWindLevel,
  withWindLevels,
} from '../../renderer/src/support/windsOps.ts';
import { editableText } from '../../renderer/src/support/fieldBinding.ts';
import { legFields } from '../../renderer/src/support/legFields.ts';
import type { ChoiceFieldDef } from '../../renderer/src/support/fieldTypes.ts';
import { examplePlan } from './fixtures.ts';

describe('converted values in the boxes', () => {
  it('are rounded to the display resolution of their quantity, exact values stay exact', () => {
    // 95 kg = 209.4357 lb (lb = 0.45359237 kg exactly, 1959 agreement): masses to 1 lb.
    expect(editableText(95, 'kg', 'lb', 'mass')).toBe('209');
    // 120 m/s = 233.261 kt (kt = 1852/3600 m/s exactly, NIST SP 811): airspeeds to 1 kt.
    expect(editableText(120, 'm_s', 'kt', 'airspeed')).toBe('233');
    // 8 m/s = 15.5508 kt: one more place where the display would leave fewer than 3 digits.
    expect(editableText(8, 'm_s', 'kt', 'airspeed')).toBe('15.6');
    // 75 km = 40.4968 NM (NM = 1852 m exactly): distances to 0.1 NM.
    expect(editableText(75_000, 'm', 'nmi', 'distance')).toBe('40.5');
    // 2.8 m² = 30.1390 ft² (ft = 0.3048 m exactly): areas ≥ 10 to 0.1.
    expect(editableText(2.8, 'm2', 'ft2', 'area')).toBe('30.1');
    // Exact conversions keep every digit: 101 325 Pa = 1013.25 hPa (hPa = 100 Pa).
    expect(editableText(101_325, 'Pa', 'hPa', 'pressure')).toBe('1013.25');
    // 4500 m = 14 763.78 ft: altitudes to 1 ft in a box (not the 10 ft steps of the results).
    expect(editableText(4500, 'm', 'ft', 'altitude')).toBe('14764');
  });

  it('switching units leaves the plan untouched; only typing writes', () => {
    const plan = examplePlan('twelve-legs');
    const store = createPlanStore(plan);
    const shown = editableText(plan.aircraft.mass.empty_kg, 'kg', 'lb', 'mass');
    expect(store.draft.value).toBe(plan);
    expect(store.history.canUndo.value).toBe(false);
    expect(Number(shown)).not.toBe(plan.aircraft.mass.empty_kg);
  });
});

describe('airfield', () => {
  it('a first check adds the block with common-practice factors; no check left removes it', () => {
    const plan = examplePlan('twelve-legs');
    const one = withAirfieldEnd(plan, 'departure', 'runway');
    // Factors: take-off 1.15, landing 1.43 = 1/0.7, launch 1.15 (common practice).
    expect(one.airfield).toMatchObject({
      takeoffFactor: 1.15,
      landingFactor: 1.43,
      launchFactor: 1.15,
    });
    expect(FIELD_FACTORS.landingFactor).toBeCloseTo(1 / 0.7, 2);
    expect(one.airfield?.arrival.by).toBe('none');
    expect(parsePlan(one).ok).toBe(true);
    const launch = withAirfieldEnd(one, 'departure', 'launch');
    expect(launch.airfield?.departure.by).toBe('launch');
    expect(parsePlan(launch).ok).toBe(true);
    expect(withAirfieldEnd(launch, 'departure', 'none').airfield).toBeUndefined();
  });

  it('the choice of check goes through the plan store as one undoable edit', () => {
    const plan = examplePlan('twelve-legs');
    const store = createPlanStore(plan);
    const pick = airfieldSections(plan)[0]?.fields[0] as ChoiceFieldDef;
    expect(pick.fallback).toBe('none');
    store.setChoice(pick, 'runway');
    expect(store.draft.value.airfield?.departure.by).toBe('runway');
    const names = airfieldSections(store.draft.value).flatMap((s) => s.fields.map((f) => f.path));
    expect(names).toContain('airfield.departure.available_m');
    expect(names).toContain('airfield.takeoffFactor');
    store.undo();
    expect(store.draft.value).toBe(plan);
  });

  it('field data: shown at the core default until edited, then written as a block', () => {
    const plan = examplePlan('twelve-legs');
    const store = createPlanStore(plan);
    const dia = fieldDataSection(plan).fields.find((f) => f.path.endsWith('propDiameter_m'));
    if (dia?.type !== 'number') throw new Error('propeller diameter field');
    store.setValue(dia.path, 1.2, dia.path, dia.block);
    // CLground 0.3 during the ground run (common practice, core/field/groundRun.ts).
    expect(store.draft.value.aircraft.field).toEqual({ CLground: 0.3, propDiameter_m: 1.2 });
    expect(store.valid.value).toBe(true);
  });

  it('a runway far too short makes the take-off check fail', () => {
    let plan = withAirfieldEnd(examplePlan('twelve-legs'), 'departure', 'runway');
    plan = {
      ...plan,
      aircraft: { ...plan.aircraft, field: { CLground: 0.3, propDiameter_m: 1.2 } },
    };
    const short = {
      ...plan,
      airfield: plan.airfield && {
        ...plan.airfield,
        departure: { ...plan.airfield.departure, available_m: 20 },
      },
    };
    const check = solvePlan(short as typeof plan).checks.find((c) => c.id === 'takeoffRun');
    // 20 m of runway: far below any take-off distance to 15 m of a 150 kg aircraft (from memory).
    expect(check?.state).toBe('fails');
  });
});

describe('winds aloft', () => {
  it('adds levels a round step above the highest, drops the table when it is emptied', () => {
    const plan = examplePlan('twelve-legs');
    const one = addWindLevel([], 'si');
    const two = addWindLevel(one, 'aviation');
    // 3000 ft = 914.4 m (ft = 0.3048 m exactly, NIST SP 811).
    expect(two[1]?.altitude_m).toBeCloseTo(914.4, 9);
    const withTable = withWindLevels(plan, two);
    expect(parsePlan(withTable).ok).toBe(true);
    expect(
      withWindLevels(withTable, deleteWindLevel(deleteWindLevel(two, 0), 0)).environment.windsAloft,
    ).toBeUndefined();
  });

  it('pasted levels go into the table as the parser read them', () => {
    const read = parseWindsText('ft deg kt C\n3000 270 15 9\n6000 280 22 3\n');
    const plan = withWindLevels(examplePlan('twelve-legs'), read.levels);
    // 15 kt = 7.7167 m/s (kt = 1852/3600 m/s exactly).
    expect(plan.environment.windsAloft?.[0]?.speed_m_s).toBeCloseTo((15 * 1852) / 3600, 9);
    expect(parsePlan(plan).ok).toBe(true);
  });

  it('a leg can take its wind from the table; the own wind fields then go away', () => {
    const plan = examplePlan('twelve-legs');
    const i = plan.legs.findIndex((l) => l.kind === 'cruise');
    const leg = plan.legs[i];
    if (!leg) throw new Error('a cruise leg');
    const store = createPlanStore(plan);
    const pick = legFields(leg, i).find((f) => f.path === `legs.${i}.windSource`) as ChoiceFieldDef;
    store.setChoice(pick, 'aloft');
    const now = store.draft.value.legs[i];
    expect(now && 'windSource' in now && now.windSource).toBe('aloft');
    const paths = legFields(now ?? leg, i).map((f) => f.path);
    expect(paths).not.toContain(`legs.${i}.wind.speed_m_s`);
    store.setChoice(pick, 'leg');
    // The default is stored as an absent key.
    expect('windSource' in (store.draft.value.legs[i] ?? {})).toBe(false);
  });
});
