/**
 * The solver with a propeller whose efficiency varies with airspeed (momentum theory,
 * core/propulsion/propellerCurve.ts): best-rate climb leaves the stall floor, a climb agrees
 * with an independent odex integration of the same equations, the old constant becomes the
 * cruise-point efficiency, and take-off sees the same propeller.
 */
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { atmosphereAt } from '../../../core/atmosphere.ts';
import { staticThrustMomentum, fieldThrustModel, thrustAt } from '../../../core/field/thrust.ts';
import { parsePlanText } from '../../../core/plan/load.ts';
import type { Plan } from '../../../core/plan/schema.ts';
import { diskArea_m2, momentumEfficiency } from '../../../core/propulsion/momentum.ts';
import { ambientAt, buildModel } from '../../../core/solver/model.ts';
import { solvePlan } from '../../../core/solver/solve.ts';
import { bestClimbTas, bestEnduranceTas, stallMarginTas } from '../../../core/solver/speeds.ts';
import { G0 } from '../../../core/units.ts';
import { energyReference } from './energyReference.ts';
import { ANDERSON_PROP, climb, makePlan, propPowerplant, rel } from './fixtures.ts';

const loaded = (path: string): Plan => {
  const r = parsePlanText(readFileSync(new URL(path, import.meta.url), 'utf8'));
  if (!r.ok) throw new Error(`${path} does not load`);
  return r.plan;
};

function climbCtx(plan: Plan, h = 0) {
  const model = buildModel(plan);
  const amb = ambientAt(model, h);
  return { model, amb, mass_kg: model.takeoffMass_kg, headwind_m_s: 0, crosswind_m_s: 0 };
}

describe('best-rate climb off the stall floor (demo aircraft, examples/piston-tourer.json)', () => {
  const plan = loaded('../../../examples/piston-tourer.json');

  it('momentum theory puts Vy well above the 1.2·V_s floor; the flat constant η put it on it', () => {
    const ctx = climbCtx(plan);
    const floor = stallMarginTas(ctx);
    const Vs = floor / plan.settings.stallFactor;
    const vy = bestClimbTas(ctx, 1);
    // Power available rising with V moves the optimum of η(V)·P − D·V off the lowest speed
    // (McCormick ch. 6; the hand estimate was ~1.46 V_s).
    expect(vy.limitedBy).toBeNull();
    expect(vy.tas_m_s / Vs).toBeGreaterThan(1.3);
    expect(vy.tas_m_s / Vs).toBeLessThan(1.7);
    // With constant η the excess power D·V falls monotonically... the old model sat on the floor.
    const pp = plan.aircraft.powerplant;
    if (pp.type !== 'propeller') throw new Error('propeller example');
    const { propeller: _curve, ...flat } = pp;
    const old = climbCtx({ ...plan, aircraft: { ...plan.aircraft, powerplant: flat } });
    expect(bestClimbTas(old, 1).limitedBy).toBe('stall');
  });

  it('best endurance moves faster than the constant-η CL^1.5/CD speed (η rises with V)', () => {
    const ctx = climbCtx(plan, 2440);
    const e = bestEnduranceTas(ctx);
    const pp = plan.aircraft.powerplant;
    if (pp.type !== 'propeller') throw new Error('propeller example');
    const { propeller: _curve, ...flat } = pp;
    const old = bestEnduranceTas(
      climbCtx({ ...plan, aircraft: { ...plan.aircraft, powerplant: flat } }, 2440),
    );
    expect(e.tas_m_s).toBeGreaterThan(old.tas_m_s);
  });
});

describe('climb with a momentum-theory propeller against odex (energyReference.ts)', () => {
  const D = 1.9;
  const pp = propPowerplant({
    propeller: {
      model: 'momentum',
      diameter_m: D,
      cruiseAltitude_m: 2000,
      cruisePowerFraction: 0.75,
      cruiseSpeed_m_s: 60,
    },
  });
  const eas = 38;
  const plan = makePlan(
    'propeller',
    [climb({ toAltitude_m: 3000, speed: { kind: 'eas', speed_m_s: eas } })],
    {
      powerplant: pp,
    },
  );

  it('time, distance and fuel to climb at full throttle agree to 1e-6', () => {
    const model = buildModel(plan);
    if (model.power.prop.kind !== 'momentum') throw new Error('momentum curve');
    const profile = model.power.prop.profileFactor;
    const A = diskArea_m2(D);
    const k = 1 / (Math.PI * ANDERSON_PROP.e * (ANDERSON_PROP.span ** 2 / ANDERSON_PROP.S));
    // Gagg & Ferrar lapse written out again (Gudmundsson ch. 7, from memory): 1.132σ − 0.132.
    const Pmax = (h: number) => ANDERSON_PROP.maxPower_W * (1.132 * atmosphereAt(h).sigma - 0.132);
    const ref = energyReference(
      {
        tas: (h) => eas / Math.sqrt(atmosphereAt(h).sigma),
        thrustPower: (h, V) =>
          momentumEfficiency(Pmax(h), V, atmosphereAt(h).rho_kg_m3, A, profile) * Pmax(h),
        drag: (h, V, m) => {
          const rho = atmosphereAt(h).rho_kg_m3;
          const q = 0.5 * rho * V * V;
          const CL = (m * G0) / (q * ANDERSON_PROP.S);
          return q * ANDERSON_PROP.S * (ANDERSON_PROP.CD0 + k * CL * CL);
        },
        // Full throttle: the engine gives all its shaft power, BSFC·P_max.
        consumption: (h) => ANDERSON_PROP.bsfc_kg_J * Pmax(h),
        burnsMass: true,
      },
      0,
      3000,
      model.takeoffMass_kg,
    );
    const leg = solvePlan(plan).legs[0]!;
    expect(leg.status).toBe('flown');
    expect(rel(leg.time_s, ref.time_s)).toBeLessThan(1e-6); // odex, same equations
    expect(rel(leg.groundDistance_m, ref.groundDistance_m)).toBeLessThan(1e-6);
    expect(rel(leg.fuelUsed_kg, ref.used)).toBeLessThan(1e-6);
  });

  it('the climb takes longer than with the flat constant η (lower efficiency at climb speed)', () => {
    const { propeller: _c, ...flat } = pp as Extract<typeof pp, { type: 'propeller' }>;
    const old = makePlan(
      'propeller',
      [climb({ toAltitude_m: 3000, speed: { kind: 'eas', speed_m_s: eas } })],
      {
        powerplant: flat,
      },
    );
    expect(solvePlan(plan).legs[0]!.time_s).toBeGreaterThan(solvePlan(old).legs[0]!.time_s);
  });
});

describe('version-1 plans migrate to the momentum propeller (test/fixtures/plans-v1)', () => {
  for (const name of ['piston-tourer', 'route-survey', 'survey-uav-electric', 'twelve-legs']) {
    it(`${name}: note given, old constant η is the efficiency at the cruise point`, () => {
      const text = readFileSync(
        new URL(`../../fixtures/plans-v1/${name}.json`, import.meta.url),
        'utf8',
      );
      const old = JSON.parse(text) as { aircraft: { powerplant: { propEfficiency: number } } };
      const r = parsePlanText(text);
      expect(r.ok).toBe(true);
      if (!r.ok) return;
      expect(
        r.changes.some((c) => /old constant [0-9.]+ is the efficiency at the cruise point/.test(c)),
      ).toBe(true);
      const pp = r.plan.aircraft.powerplant;
      if (pp.type === 'jet' || pp.propeller?.model !== 'momentum')
        throw new Error('momentum curve');
      const curve = buildModel(r.plan).power.prop;
      if (curve.kind !== 'momentum') throw new Error('momentum curve');
      const eta = momentumEfficiency(
        curve.cruiseShaftPower_W,
        curve.cruiseSpeed_m_s,
        curve.cruiseRho_kg_m3,
        curve.area_m2,
        curve.profileFactor,
      );
      expect(rel(eta, old.aircraft.powerplant.propEfficiency)).toBeLessThan(1e-9); // definition
      const res = solvePlan(r.plan);
      expect(res.legs.every((l) => l.status === 'flown')).toBe(true);
    });
  }
});

describe('version-1 plans get the stall drag rise (core/plan/migrations/stallDragRise.ts)', () => {
  for (const name of [
    'light-jet',
    'piston-tourer',
    'route-survey',
    'survey-uav-electric',
    'twelve-legs',
  ]) {
    it(`${name}: onset 0.8·CLmax, ΔCD = CD0 at CLmax, with a note`, () => {
      const text = readFileSync(
        new URL(`../../fixtures/plans-v1/${name}.json`, import.meta.url),
        'utf8',
      );
      const old = JSON.parse(text) as { aircraft: { polar: { CLmax: number; CD0: number } } };
      const r = parsePlanText(text);
      expect(r.ok).toBe(true);
      if (!r.ok) return;
      expect(r.changes.some((c) => /drag polar now rises above the parabola/.test(c))).toBe(true);
      const rise = r.plan.aircraft.polar.stallDragRise!;
      expect(rel(rise.onsetCL, 0.8 * old.aircraft.polar.CLmax)).toBeLessThan(5e-3); // 3 digits
      expect(rise.atCLmax).toBe(old.aircraft.polar.CD0);
    });
  }
});

describe('one propeller for take-off and climb', () => {
  it('the take-off thrust at rest is the momentum static thrust with FM = the profile factor', () => {
    const plan = loaded('../../../examples/piston-tourer.json');
    const pp = plan.aircraft.powerplant;
    if (pp.type !== 'propeller' || pp.propeller?.model !== 'momentum') throw new Error('momentum');
    const curve = buildModel(plan).power.prop;
    if (curve.kind !== 'momentum') throw new Error('momentum curve');
    const atm = atmosphereAt(0);
    const model = fieldThrustModel(pp, atm, 0, {}, plan.aircraft);
    // McCormick ch. 6 static thrust with a figure of merit (core/field/thrust.ts estimate).
    const T0 = staticThrustMomentum({
      shaftPower_W: pp.maxPowerSL_W,
      rho_kg_m3: atm.rho_kg_m3,
      propDiameter_m: pp.propeller.diameter_m,
      figureOfMerit: curve.profileFactor,
    });
    expect(rel(thrustAt(model, 0), T0)).toBeLessThan(1e-12);
    // And at climb speed the same thrust the solver's power available implies: η·P/V.
    const V = 40;
    const eta = momentumEfficiency(
      pp.maxPowerSL_W,
      V,
      atm.rho_kg_m3,
      curve.area_m2,
      curve.profileFactor,
    );
    expect(rel(thrustAt(model, V), (eta * pp.maxPowerSL_W) / V)).toBeLessThan(1e-12);
  });
});

describe('no NaN for any valid propeller (fast-check over diameter and cruise point)', () => {
  it('solves the demo tourer with finite numbers or refuses naming a propeller field', () => {
    const base = loaded('../../../examples/piston-tourer.json');
    fc.assert(
      fc.property(
        fc.double({ min: 1.2, max: 3, noNaN: true }),
        fc.double({ min: 0.4, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 4000, noNaN: true }),
        (D, f, h) => {
          const pp = base.aircraft.powerplant;
          if (pp.type !== 'propeller') throw new Error('propeller');
          const plan: Plan = {
            ...base,
            aircraft: {
              ...base.aircraft,
              powerplant: {
                ...pp,
                propeller: {
                  model: 'momentum',
                  diameter_m: D,
                  cruiseAltitude_m: h,
                  cruisePowerFraction: f,
                },
              },
            },
          };
          const r = solvePlan(plan);
          const text = JSON.stringify(r);
          expect(text).not.toMatch(/NaN|Infinity/);
          if (r.failure) expect(r.failure.message).toMatch(/propEfficiency|propeller/);
        },
      ),
      { numRuns: 25 },
    );
  });
});
