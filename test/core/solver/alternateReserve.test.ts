/**
 * The alternate reserve as a climb, a cruise and a glide (core/solver/alternateReserve.ts),
 * checked against the same profile flown as an ordinary plan from the landing state, and the
 * cruise alone against Breguet's jet range (Anderson, Introduction to Flight, ch. 6).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { atmosphereAt } from '../../../core/atmosphere.ts';
import { rangeJetConstantAltitudeCL } from '../../../core/breguet.ts';
import { parsePlanText } from '../../../core/plan/load.ts';
import type { Leg, Plan } from '../../../core/plan/schema.ts';
import { alternateReserve } from '../../../core/solver/alternateReserve.ts';
import { buildModel } from '../../../core/solver/model.ts';
import { solvePlan } from '../../../core/solver/solve.ts';
import { G0 } from '../../../core/units.ts';
import { climb, cruise, descent, makePlan, rel } from './fixtures.ts';

function lightJet(): Plan {
  const r = parsePlanText(
    readFileSync(new URL('../../../examples/light-jet.json', import.meta.url), 'utf8'),
  );
  if (!r.ok) throw new Error('light-jet.json does not load');
  // The Breguet comparison below needs the constant TSFC and the density lapse (version 1's
  // jet model, still a choice in version 2): T_SL·σ^0.8, TSFC 1.93e-5 kg/(N·s).
  const pp = r.plan.aircraft.powerplant;
  if (pp.type !== 'jet') throw new Error('light-jet.json is a jet');
  const { thrustLapse: _l, tsfcMachFactor: _f, ...rest } = pp;
  const powerplant = { ...rest, thrustLapseExponent: 0.8, tsfc_kg_Ns: 1.93e-5 };
  // An alternate 200 NM away, so a cruise remains between the climb to FL250 and the idle
  // glide (with the idle thrust the glide alone covers more than 100 NM).
  const reserves = { ...r.plan.reserves, alternateDistance_m: 200 * 1852 };
  return { ...r.plan, reserves, aircraft: { ...r.plan.aircraft, powerplant } };
}

/** The plan's aircraft and day, starting from its landing state (fuel left, at `h0`). */
function fromLanding(plan: Plan, fuel_kg: number, h0: number, legs: Leg[]): Plan {
  const pp = plan.aircraft.powerplant;
  if (pp.type === 'electric') throw new Error('fuel burners only');
  return {
    ...plan,
    aircraft: { ...plan.aircraft, powerplant: { ...pp, fuel: { ...pp.fuel, load_kg: fuel_kg } } },
    environment: { ...plan.environment, departureElevation_m: h0, arrivalElevation_m: h0 },
    reserves: { ...plan.reserves, holdTime_s: 0, alternateDistance_m: 0, contingencyFraction: 0 },
    legs,
  };
}

/**
 * The profile as a plan: climb at best rate, full throttle, to `top`; cruise at best range for
 * what the climb and a glide from the top of climb leave of `distance`; glide back down.
 */
function profileAsPlan(plan: Plan, fuel: number, h0: number, top: number, distance: number) {
  const up = climb({ toAltitude_m: top, speed: { kind: 'bestRate' }, throttle: 1 });
  const down = descent({ toAltitude_m: h0, mode: { by: 'glide' } });
  const probe = solvePlan(fromLanding(plan, fuel, h0, [up, down]));
  let left = distance - probe.totals.groundDistance_m;
  if (!(left > 0)) return { probe, flown: solvePlan(fromLanding(plan, fuel, h0, [up, down])) };
  // The glide after the cruise reaches a little farther than the probe's (lighter, idle
  // thrust): shorten the cruise until the whole profile covers `distance` (fixed point).
  let flown = probe;
  for (let pass = 0; pass < 4; pass++) {
    const legs = [up, cruise({ end: { by: 'distance', distance_m: left } }), down];
    flown = solvePlan(fromLanding(plan, fuel, h0, legs));
    left -= flown.totals.groundDistance_m - distance;
  }
  return { probe, flown };
}

describe('alternate reserve: climb, cruise at best range, glide', () => {
  it('light jet: equals the same profile flown as a plan, and costs more than the cruise alone', () => {
    const plan = lightJet();
    const r = solvePlan(plan);
    expect(r.completed).toBe(true);
    const { alternateDistance_m: D, alternateAltitude_m: hA } = plan.reserves;
    const h0 = plan.environment.arrivalElevation_m;
    const { probe, flown } = profileAsPlan(plan, r.landing.remaining, h0, hA, D);
    expect(probe.totals.groundDistance_m).toBeLessThan(D); // room for a cruise (definition of the profile)
    expect(flown.completed).toBe(true);
    expect(rel(flown.totals.fuelUsed_kg, r.reserve.required.alternate)).toBeLessThan(1e-8); // same profile flown as a plan (solver consistency)
    // Ground distance: the policy's, to the (small) effect of the mass on the glide.
    expect(rel(flown.totals.groundDistance_m, D)).toBeLessThan(1e-4); // glide distance measured at the top-of-climb mass (documented)

    // The cruise alone (the old rule): Breguet at constant altitude and the best-range CL
    // √(CD0/(3k)) from the landing mass, fuel found by bisection on R(W1) = D.
    const ac = plan.aircraft;
    const k = 1 / (Math.PI * 0.81 * 8.9); // polar of light-jet.json, by geometry
    const CL = Math.sqrt(ac.polar.CD0 / (3 * k));
    const W0 = r.legs[r.legs.length - 1]!.end.mass_kg * G0;
    const model = buildModel(plan);
    const rho = atmosphereAt(hA + model.pressureAltitudeOffset_m).rho_kg_m3;
    const range = (W1: number) =>
      rangeJetConstantAltitudeCL({
        ct: 1.93e-5 * G0,
        rho,
        S: ac.wingArea_m2,
        CL,
        CD: ac.polar.CD0 + k * CL * CL,
        W0,
        W1,
      });
    let lo = 0.5 * W0;
    let hi = W0;
    for (let i = 0; i < 200; i++) {
      const mid = 0.5 * (lo + hi);
      if (range(mid) > D) lo = mid;
      else hi = mid;
    }
    const cruiseAlone = (W0 - lo) / G0;
    expect(r.reserve.required.alternate).toBeGreaterThan(cruiseAlone); // Breguet cruise alone (Anderson, ch. 6)
    expect(
      rel(
        r.reserve.required.total,
        r.reserve.required.contingency + r.reserve.required.alternate + r.reserve.required.hold,
      ),
    ).toBeLessThan(1e-14); // definition of the total
  });

  it('too short for the climb and the glide: the top is lowered and the parts add up', () => {
    const plan = makePlan('jet', [cruise({ end: { by: 'distance', distance_m: 100_000 } })], {
      reserves: { alternateDistance_m: 40_000, alternateAltitude_m: 4500 },
    });
    const r = solvePlan(plan);
    const model = buildModel(plan);
    const landingLeg = r.legs[0]!;
    const landing = {
      t_s: 0,
      x_m: 0,
      air_m: 0,
      h_m: landingLeg.end.h_m,
      mass_kg: landingLeg.end.mass_kg,
      left: r.landing.remaining,
    };
    const alt = alternateReserve(model, plan.reserves, landing);
    expect(alt.computed).toBe(true);
    expect(alt.top_m).toBeLessThan(4500); // lowered top (proportional rule)
    expect(alt.top_m).toBeGreaterThan(1000); // lowered in proportion, not to the ground
    expect(rel(alt.amount, alt.climb + alt.cruise + alt.descent)).toBeLessThan(1e-14); // definition of the parts
    expect(rel(alt.amount, r.reserve.required.alternate)).toBeLessThan(1e-12); // same function inside the solver
    const { probe, flown } = profileAsPlan(plan, r.landing.remaining, 0, alt.top_m, 40_000);
    // The climb and the glide to the lowered top fit in the distance (proportional rule).
    expect(probe.totals.groundDistance_m).toBeLessThanOrEqual(40_000); // proportional rule (documented)
    expect(rel(flown.totals.fuelUsed_kg, alt.amount)).toBeLessThan(1e-8); // same profile flown as a plan (solver consistency)
    expect(rel(flown.totals.groundDistance_m, 40_000)).toBeLessThan(1e-4); // glide distance measured at the top-of-climb mass (documented)
  });

  it('an alternate altitude the aircraft cannot climb to is reported, and the reserve not kept', () => {
    const r = solvePlan(
      makePlan('propeller', [cruise({ end: { by: 'distance', distance_m: 100_000 } })], {
        reserves: { alternateDistance_m: 100_000, alternateAltitude_m: 12_000 },
      }),
    );
    // The aircraft cannot climb there: the reserve cannot be flown, and the check says why
    // (reserveProblems.ts) instead of passing a reserve that was never computed.
    const p = r.reserve.problems[0];
    expect(p?.part).toBe('alternate');
    expect(['cannotClimb', 'aboveCeiling']).toContain(p?.why);
    const check = r.checks.find((c) => c.id === 'reserve');
    expect(check?.state).toBe('fails');
    expect(check?.detail).toMatch(/^The reserve cannot be flown: the alternate /);
    expect(r.reserve.kept).toBe(false);
    expect(r.verdict).toBe('fails');
  });
});
