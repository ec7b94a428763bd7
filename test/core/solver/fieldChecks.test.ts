/**
 * Airfield checks in the solver's verdict (core/solver/fieldChecks.ts): the distances must be
 * exactly what core/field computes for the same inputs, the factors applied, and the margins
 * in the solver's ok / tight / fails semantics.
 */
import { describe, expect, it } from 'vitest';
import {
  atmosphereAt,
  densityAltitude,
  R_AIR,
  standardAtmosphere,
} from '../../../core/atmosphere.ts';
import { landingDistance } from '../../../core/field/landing.ts';
import { takeoffDistance, type TakeoffInput } from '../../../core/field/takeoff.ts';
import { PlanSchema, type Airfield, type Plan, type Runway } from '../../../core/plan/schema.ts';
import { polarCoefficients } from '../../../core/polar.ts';
import { solvePlan } from '../../../core/solver/solve.ts';
import type { PlanResult } from '../../../core/solver/types.ts';
import {
  ANDERSON_JET,
  cruise,
  electricPowerplant,
  jetPowerplant,
  makePlan,
  rel,
  TRAUB_UAV,
  type Kind,
  type PlanOptions,
} from './fixtures.ts';
import { G0 } from '../../../core/units.ts';

const check = (r: PlanResult, id: string) => r.checks.find((c) => c.id === id);
/** Sea-level density of the 1976 U.S. Standard Atmosphere (1.225 kg/m³). */
const RHO0 = atmosphereAt(0).rho_kg_m3;

function runway(available_m: number, over: Partial<Runway> = {}): Runway {
  return {
    by: 'runway',
    available_m,
    surface: 'dryHard',
    slope: 0,
    heading_deg: 90,
    surfaceWind: { speed_m_s: 0, from_deg: 0 },
    ...over,
  };
}

function withAirfield(
  kind: Kind,
  airfield: Partial<Airfield>,
  o: PlanOptions = {},
  aircraftField?: Plan['aircraft']['field'],
): Plan {
  const plan = makePlan(kind, [cruise({ end: { by: 'distance', distance_m: 20_000 } })], {
    ...o,
    aircraft: (a) => ({ ...a, ...(aircraftField ? { field: aircraftField } : {}) }),
  });
  return PlanSchema.parse({
    ...plan,
    airfield: {
      departure: { by: 'none' },
      arrival: { by: 'none' },
      takeoffFactor: 1.15,
      landingFactor: 1.43,
      launchFactor: 1.15,
      ...airfield,
    },
  });
}

/** The business jet's take-off at sea level, ISA, with core/field called directly. */
function jetTakeoffInput(plan: Plan, rho: number, headwind: number): TakeoffInput {
  const c = polarCoefficients(plan.aircraft.polar);
  return {
    mass_kg: ANDERSON_JET.W0_N / G0, // take-off mass of the fixture
    wingArea_m2: ANDERSON_JET.S,
    CD0: c.CD0,
    k: c.k,
    CLmax: plan.aircraft.polar.CLmax, // no CLmaxFlaps in the fixture
    CL_ground: 0.3,
    rho_kg_m3: rho,
    headwind_m_s: headwind,
    slope: 0,
    surface: 'dryHard',
    // The fixture's T_SL·σ^0.8 (core/propulsion/jet.ts model).
    thrust: { kind: 'constant', thrust_N: 40_000 * Math.pow(rho / RHO0, 0.8) },
  };
}

describe('take-off distance against the runway', () => {
  it('a runway too short fails takeoffRun with the margin core/field gives', () => {
    // Wind from 120° on runway 090: headwind 10·cos 30° (computed here).
    const wind = { speed_m_s: 10, from_deg: 120 };
    const probe = withAirfield('jet', { departure: runway(3000, { surfaceWind: wind }) });
    const direct = takeoffDistance(jetTakeoffInput(probe, RHO0, 10 * Math.cos(Math.PI / 6)));
    if (!direct.ok) throw new Error(direct.reason);
    const available = 0.9 * 1.15 * direct.totalDistance_m;
    const r = solvePlan(
      withAirfield('jet', { departure: runway(available, { surfaceWind: wind }) }),
    );
    const c = check(r, 'takeoffRun')!;
    expect(c.state).toBe('fails');
    expect(c.quantity).toBe('distance');
    expect(c.factor).toBe(1.15);
    expect(rel(c.value, 1.15 * direct.totalDistance_m)).toBeLessThan(1e-9);
    expect(c.limit).toBe(available);
    // margin = (available − 1.15·d)/available = 1 − 1/0.9 (by construction).
    expect(rel(c.margin, 1 - 1 / 0.9)).toBeLessThan(1e-9);
    expect(r.verdict).toBe('fails');
    // The same plan on the 3000 m runway passes.
    expect(check(solvePlan(probe), 'takeoffRun')!.state).toBe('ok');
  });

  it('a hot-and-high departure takes a longer run (density altitude)', () => {
    const coolPlan = withAirfield('jet', { departure: runway(3000) });
    const cool = solvePlan(coolPlan);
    const hotHigh = solvePlan(
      withAirfield(
        'jet',
        { departure: runway(3000, { temperature_K: 308.15 }) },
        { departure_m: 1500, arrival_m: 1500 },
      ),
    );
    const d0 = check(cool, 'takeoffRun')!.value;
    const d1 = check(hotHigh, 'takeoffRun')!.value;
    expect(d1).toBeGreaterThan(1.3 * d0);
    // Density at 1500 m and 35 °C from the standard pressure there and the gas law.
    const p = standardAtmosphere(1500).p_Pa;
    const rho = p / (R_AIR * 308.15);
    // Common practice (rule of thumb): about 120 ft of density altitude per °C above ISA.
    const isaAt1500 = standardAtmosphere(1500).T_K;
    const thumb = 1500 + 120 * 0.3048 * (308.15 - isaAt1500);
    expect(rel(densityAltitude(rho), thumb)).toBeLessThan(0.05);
    const direct = takeoffDistance(jetTakeoffInput(coolPlan, rho, 0));
    if (!direct.ok) throw new Error(direct.reason);
    expect(rel(d1, 1.15 * direct.totalDistance_m)).toBeLessThan(1e-9);
  });

  it('a run that cannot reach lift-off fails with the reason', () => {
    // 3 kN of thrust against 0.12 × 86 kN of rolling friction on soft ground.
    const r = solvePlan(
      withAirfield(
        'jet',
        { departure: runway(3000, { surface: 'softGround' }) },
        { powerplant: jetPowerplant({ maxThrustSL_N: 3000 }) },
      ),
    );
    const c = check(r, 'takeoffRun')!;
    expect(c.state).toBe('fails');
    expect(c.margin).toBeLessThan(0);
    expect(c.reason).toMatch(/thrust no longer exceeds drag/);
    expect(c.detail).toMatch(/thrust no longer exceeds drag/);
  });

  it('a propeller aircraft without a propeller diameter gets a warning, not a guess', () => {
    const without = solvePlan(withAirfield('propeller', { departure: runway(800) }));
    expect(check(without, 'takeoffRun')).toBeUndefined();
    expect(without.warnings.join(' ')).toMatch(/propDiameter_m/);
    const withDiameter = solvePlan(
      withAirfield(
        'propeller',
        { departure: runway(800) },
        {},
        { CLground: 0.3, propDiameter_m: 1.9 },
      ),
    );
    expect(check(withDiameter, 'takeoffRun')).toBeDefined();
  });
});

describe('launch and landing', () => {
  // Traub's UAV (REFERENCES.md): 2.5 kg, S 0.55 m², CLmax 1.5 in the fixture, sea level ISA.
  const Vs = Math.sqrt((2 * TRAUB_UAV.m * G0) / (RHO0 * TRAUB_UAV.S * 1.5));

  it('a release speed below launchFactor × stall speed fails the launch check', () => {
    const launch = (releaseSpeed_m_s: number) =>
      solvePlan(
        withAirfield('electric', {
          departure: { by: 'launch', releaseSpeed_m_s, headwind_m_s: 0 },
        }),
      );
    const slow = check(launch(1.1 * Vs), 'launch')!;
    expect(slow.state).toBe('fails');
    expect(rel(slow.value, 1.1)).toBeLessThan(1e-9); // release / V_stall, computed here
    expect(rel(slow.margin, (1.1 - 1.15) / 1.15)).toBeLessThan(1e-9);
    expect(check(launch(1.4 * Vs), 'launch')!.state).toBe('ok');
  });

  it('landing distance at the landing mass × landingFactor against the arrival runway', () => {
    const coeff = polarCoefficients(withAirfield('electric', {}).aircraft.polar);
    // The electric UAV keeps its mass: it lands at Traub's 2.5 kg.
    const direct = landingDistance({
      mass_kg: TRAUB_UAV.m,
      wingArea_m2: TRAUB_UAV.S,
      CD0: coeff.CD0,
      k: coeff.k,
      CLmax: 1.5,
      CL_ground: 0.3,
      rho_kg_m3: RHO0,
      headwind_m_s: 0,
      slope: 0,
      surface: 'dryHard',
    });
    if (!direct.ok) throw new Error(direct.reason);
    const factored = 1.43 * direct.totalDistance_m;
    const landing = (available: number) => {
      const r = solvePlan(
        withAirfield(
          'electric',
          { arrival: runway(available) },
          { powerplant: electricPowerplant() },
        ),
      );
      expect(r.legs[r.legs.length - 1]!.end.mass_kg).toBeCloseTo(TRAUB_UAV.m, 12);
      return check(r, 'landingRun')!;
    };
    const long = landing(2 * factored);
    expect(rel(long.value, factored)).toBeLessThan(1e-9);
    expect(long.state).toBe('ok');
    expect(rel(long.margin, 0.5)).toBeLessThan(1e-9); // (2f − f)/2f
    expect(landing(0.9 * factored).state).toBe('fails');
  });
});
