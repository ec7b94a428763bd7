/**
 * Version-1 jets migrate to the high-bypass lapse and the Mach-and-θ TSFC
 * (core/plan/migrations/jetMachLapse.ts), tested against the version-1 copy of the light-jet
 * example (test/fixtures/plans-v1/, not edited). Lapse and TSFC forms: Mattingly, Aircraft
 * Engine Design, ch. 2 (from memory); α at 35 000 ft, M 0.72 from REFERENCES.md (computed).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { atmosphereAt } from '../../../../core/atmosphere.ts';
import { parsePlanText } from '../../../../core/plan/load.ts';
import type { Plan } from '../../../../core/plan/schema.ts';
import { maxThrust_N, tsfcAt_kg_Ns } from '../../../../core/propulsion/jet.ts';
import { solvePlan } from '../../../../core/solver/solve.ts';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
const V1 = new URL('../../../fixtures/plans-v1/light-jet.json', import.meta.url);

function loadV1() {
  const r = parsePlanText(readFileSync(V1, 'utf8'));
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  return r;
}

function jetOf(plan: Plan) {
  const pp = plan.aircraft.powerplant;
  if (pp.type !== 'jet') throw new Error('light-jet is a jet');
  return pp;
}

describe('version-1 jet → engine-class lapse and Mach TSFC', () => {
  it('keeps the sea-level static thrust and the old TSFC at the old design point, with a note', () => {
    const { plan, changes } = loadV1();
    const pp = jetOf(plan);
    expect(pp.thrustLapse).toEqual({ engineClass: 'highBypass', throttleRatio: 1.05 });
    expect(pp.thrustLapseExponent).toBeUndefined();
    // The version-1 file: 28 000 N static, TSFC 1.93e-5 kg/(N·s), cruise M 0.72 at 10 670 m.
    expect(rel(maxThrust_N(pp, atmosphereAt(0), 0), 28_000)).toBeLessThan(1e-12);
    // c₁ is stored to 6 significant digits.
    expect(rel(tsfcAt_kg_Ns(pp, atmosphereAt(10_670), 0.72), 1.93e-5)).toBeLessThan(1e-5);
    const note = changes.find((c) => c.startsWith('aircraft.powerplant:'));
    expect(note).toContain('high-bypass');
    expect(note).toContain('M 0.72 at 10670 m');
  });

  it('the old configuration now fails honestly: FL350 at M 0.72 needs more thrust than there is', () => {
    const { plan } = loadV1();
    const r = solvePlan(plan);
    expect(r.completed).toBe(false);
    // The climb to FL350 stops where its rate falls below the plan's 1.5 m/s.
    expect(r.failure?.legIndex).toBe(1);
    expect(r.failure?.message).toMatch(/Climb to FL350.*cannot climb above \d+ m/);
    // Thrust required there, from the version-1 model that flew the cruise (density lapse):
    const old = structuredClone(plan);
    const { thrustLapse: _l, tsfcMachFactor: _f, ...rest } = jetOf(old);
    old.aircraft.powerplant = { ...rest, thrustLapseExponent: 0.8, tsfc_kg_Ns: 1.93e-5 };
    const flown = solvePlan(old);
    const cruise = flown.checks.find((c) => c.id === 'power:2');
    const required = cruise?.thrustRequired_N ?? NaN;
    // Issue 12: ~6.2 kN required, ~11.0 kN under σ^0.8, ~5.4 kN with the high-bypass lapse.
    expect(rel(required, 6200)).toBeLessThan(0.02);
    expect(rel(cruise?.thrustAvailable_N ?? NaN, 11_000)).toBeLessThan(0.02);
    const available = maxThrust_N(jetOf(plan), atmosphereAt(10_670 + 0), 0.72);
    expect(rel(available, 28_000 * 0.19416)).toBeLessThan(2e-3); // REFERENCES.md α at 10 668 m
    expect(available).toBeLessThan(required);
  });

  it('the version-2 example flies a level its engines can hold (FL270, M 0.66) with margin', () => {
    const text = readFileSync(
      new URL('../../../../examples/light-jet.json', import.meta.url),
      'utf8',
    );
    const r = parsePlanText(text);
    if (!r.ok) throw new Error('example');
    expect(r.changes).toEqual([]);
    const res = solvePlan(r.plan);
    expect(res.completed).toBe(true);
    const cruise = res.checks.find((c) => c.id === 'power:2');
    expect(cruise?.state).toBe('ok');
    expect(cruise!.margin).toBeGreaterThan(0.05);
  });
});
