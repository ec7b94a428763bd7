/**
 * One engine inoperative (core/solver/oneEngineOut.ts): a twin's one-engine best rate of
 * climb against the closed form for a constant-efficiency propeller, and the check it adds.
 */
import { describe, expect, it } from 'vitest';
import { buildModel } from '../../../core/solver/model.ts';
import { solvePlan } from '../../../core/solver/solve.ts';
import { oeiBestClimb, oneEngineOut } from '../../../core/solver/oneEngineOut.ts';
import { atmosphereAt } from '../../../core/atmosphere.ts';
import { G0 } from '../../../core/units.ts';
import { ANDERSON_PROP, climb, cruise, makePlan, rel } from './fixtures.ts';

// The Anderson light airplane (REFERENCES.md) made a twin of the same total power.
const twin = (over: { oeiDragIncrement?: number } = {}) =>
  makePlan(
    'propeller',
    [climb({ toAltitude_m: 1500 }), cruise({ end: { by: 'distance', distance_m: 50_000 } })],
    {
      aircraft: (a) => ({ ...a, engineCount: 2, ...over }),
    },
  );

describe('one engine inoperative', () => {
  it('best rate of climb matches ROCmax = η·P/W − V_mp·(2/√3)/(L/D)max (REFERENCES.md "Climb")', () => {
    // Constant η, no drag increment, sea level: half the power of the 230 hp engine pair.
    const plan = twin({ oeiDragIncrement: 0 });
    const model = buildModel(plan);
    const m = model.takeoffMass_kg;
    const W = m * G0;
    const k = 1 / (Math.PI * ANDERSON_PROP.e * (ANDERSON_PROP.span ** 2 / ANDERSON_PROP.S));
    const LDmax = 1 / (2 * Math.sqrt(k * ANDERSON_PROP.CD0));
    const rho = atmosphereAt(0).rho_kg_m3;
    const CLmp = Math.sqrt((3 * ANDERSON_PROP.CD0) / k);
    const Vmp = Math.sqrt((2 * W) / (rho * ANDERSON_PROP.S * CLmp));
    // Anderson, Introduction to Flight, ch. 6 (REFERENCES.md): constant-η maximum climb rate.
    const expected =
      (ANDERSON_PROP.eta * 0.5 * ANDERSON_PROP.maxPower_W) / W - (Vmp * (2 / Math.sqrt(3))) / LDmax;
    const r = oeiBestClimb(model, 2, 0, 0, m);
    // The optimum lies at V_mp unless the stall margin is above it (CLmax 2: 1.2·V_s < V_mp here).
    expect(rel(r.climb_m_s, expected)).toBeLessThan(1e-6);
  });

  it('adds a check with the one-engine service ceiling, and the drag increment lowers it', () => {
    const r = solvePlan(twin());
    const c = r.checks.find((x) => x.id === 'oneEngineOut');
    expect(c).toBeDefined();
    expect(c!.detail).toMatch(/Estimate with 1 of 2 engines inoperative/);
    expect(Number.isFinite(c!.value)).toBe(true);
    const model = buildModel(twin());
    const clean = oneEngineOut(model, twin({ oeiDragIncrement: 0 }), 1500)!;
    const dirty = oneEngineOut(model, twin({ oeiDragIncrement: 0.01 }), 1500)!;
    expect(dirty.serviceCeiling_m!).toBeLessThan(clean.serviceCeiling_m!);
    // At the service ceiling the one-engine rate is 0.25 m/s (its definition, common practice).
    const at = oeiBestClimb(
      model,
      2,
      0.003,
      oneEngineOut(model, twin(), 1500)!.serviceCeiling_m!,
      model.takeoffMass_kg,
    );
    expect(Math.abs(at.climb_m_s - 0.25)).toBeLessThan(1e-3);
  });

  it('a single-engine aircraft gets no such check', () => {
    const r = solvePlan(makePlan('propeller', [climb({ toAltitude_m: 1500 })]));
    expect(r.checks.some((x) => x.id === 'oneEngineOut')).toBe(false);
  });
});
