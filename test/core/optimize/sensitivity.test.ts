import { describe, expect, it } from 'vitest';
import { reserveSensitivity } from '../../../core/optimize/sensitivity.ts';
import type { SensitivityEntry } from '../../../core/optimize/sensitivity.ts';
import { mission } from './fixtures.ts';

function entry(list: SensitivityEntry[], input: string): SensitivityEntry {
  const e = list.find((x) => x.input === input);
  if (e === undefined) throw new Error(`no entry ${input}`);
  return e;
}

function expectSorted(list: SensitivityEntry[]): void {
  const size = list.map((e) => Math.max(Math.abs(e.minus), Math.abs(e.plus)));
  for (let i = 1; i < size.length; i++) expect(size[i]!).toBeLessThanOrEqual(size[i - 1]!);
}

describe('reserveSensitivity', () => {
  it('piston: more drag → less reserve, more fuel → more reserve, ranked by effect', () => {
    const plan = mission('prop', 500_000);
    plan.legs[2] = {
      ...plan.legs[2]!,
      wind: { speed_m_s: 8, from_deg: 90 },
    } as (typeof plan.legs)[2];
    const list = reserveSensitivity(plan);
    // Signs: drag costs fuel (Breguet, Anderson, Introduction to Flight, ch. 6: range ∝ L/D);
    // fuel on board is what the reserve is made of; a headwind costs fuel (common practice).
    expect(entry(list, 'aircraft.polar.CD0').plus).toBeLessThan(0);
    expect(entry(list, 'aircraft.polar.CD0').minus).toBeGreaterThan(0);
    expect(entry(list, 'aircraft.powerplant.fuel.load_kg').plus).toBeGreaterThan(0);
    expect(entry(list, 'aircraft.powerplant.bsfc_kg_J').plus).toBeLessThan(0);
    expect(entry(list, 'aircraft.powerplant.propEfficiency').plus).toBeGreaterThan(0);
    expect(entry(list, 'aircraft.mass.empty_kg').plus).toBeLessThan(0);
    expect(entry(list, 'legs.*.wind.speed_m_s').plus).toBeLessThan(0);
    expectSorted(list);
    for (const e of list) {
      expect(Number.isFinite(e.minus) && Number.isFinite(e.plus)).toBe(true);
      expect(e.label.length).toBeGreaterThan(0);
    }
  });

  it('jet and electric: TSFC and battery energy act with the expected signs', () => {
    const jet = reserveSensitivity(mission('jet', 1_500_000));
    expect(entry(jet, 'aircraft.powerplant.tsfc_kg_Ns').plus).toBeLessThan(0);
    expect(entry(jet, 'aircraft.polar.CD0').plus).toBeLessThan(0);
    expectSorted(jet);
    const electric = reserveSensitivity(mission('electric', 20_000));
    expect(entry(electric, 'aircraft.powerplant.battery.energy_J').plus).toBeGreaterThan(0);
    expect(entry(electric, 'aircraft.powerplant.motorEfficiency').plus).toBeGreaterThan(0);
    expectSorted(electric);
  });

  it('leaves out an input whose ±5 % would leave the schema limits, and never changes the plan', () => {
    const plan = mission('prop', 500_000);
    if (plan.aircraft.powerplant.type === 'propeller')
      plan.aircraft.powerplant.propEfficiency = 0.93;
    const before = JSON.stringify(plan);
    const list = reserveSensitivity(plan);
    // Schema: propeller efficiency at most 0.95, so +5 % of 0.93 is refused.
    expect(list.some((e) => e.input === 'aircraft.powerplant.propEfficiency')).toBe(false);
    expect(JSON.stringify(plan)).toBe(before);
  });
});
