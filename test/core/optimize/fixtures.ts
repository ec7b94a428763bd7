/**
 * Plans for the optimizer tests. The aircraft are the worked examples of REFERENCES.md:
 * Anderson, Introduction to Flight, ch. 6 (light single-engine propeller airplane and small
 * business jet, inputs as published) and the small electric UAV computed after Traub 2011.
 * Quantities the examples do not give (CLmax, maximum thrust, masses split, tank size) are
 * invented, chosen inside the common-practice ranges.
 */
import { PLAN_SCHEMA_VERSION, PlanSchema } from '../../../core/plan/schema.ts';
import type { Leg, Plan } from '../../../core/plan/schema.ts';
import { G0, HP, LB } from '../../../core/units.ts';

const noReserves = {
  holdTime_s: 0,
  holdAltitude_m: 500,
  contingencyFraction: 0,
  alternateDistance_m: 0,
  alternateAltitude_m: 500,
  socFloor: 0,
};

const calm = { speed_m_s: 0, from_deg: 0 };

function plan(name: string, aircraft: Plan['aircraft'], legs: Leg[], reserves = noReserves): Plan {
  return PlanSchema.parse({
    format: 'legwise-plan',
    schemaVersion: PLAN_SCHEMA_VERSION,
    name,
    notes: '',
    aircraft,
    environment: {
      isaOffset_K: 0,
      qnh_Pa: 101325,
      departureElevation_m: 0,
      arrivalElevation_m: 0,
    },
    reserves,
    settings: { stallFactor: 1.2, tightMargin: 0.1, minClimbRate_m_s: 0.5 },
    legs,
  });
}

/** Anderson, Introduction to Flight, ch. 6: W0 = 13 127.5 N, fuel 1 632.5 N, S = 16.165 m², b = 10.912 m. */
export function andersonProp(): Plan['aircraft'] {
  const m0 = 13127.5 / G0;
  const fuel = 1632.5 / G0;
  return {
    name: 'Anderson light single (textbook example)',
    wingArea_m2: 16.165,
    polar: {
      CD0: 0.025,
      induced: { by: 'geometry', e: 0.8, AR: (10.912 * 10.912) / 16.165 },
      CLminD: 0,
      CLmax: 1.6, // invented (common practice for a clean light single)
    },
    mass: { empty_kg: m0 - fuel - 150, payload_kg: 150, mtow_kg: 1400 },
    ceiling_m: 5000,
    powerplant: {
      type: 'propeller',
      engine: 'piston',
      maxPowerSL_W: 230 * HP,
      lapse: { model: 'gaggFerrar' },
      criticalAltitude_m: 0,
      propEfficiency: 0.8,
      bsfc_kg_J: (0.45 * LB) / (HP * 3600), // 0.45 lb/(hp·h)
      idlePowerFraction: 0.1,
      fuel: { kind: 'avgas', load_kg: fuel, tankCapacity_L: 300 },
    },
  };
}

/** Anderson, Introduction to Flight, ch. 6: W0 = 88 176.75 N, fuel 33 211.9 N, S = 29.54 m², b = 16.25 m. */
export function andersonJet(): Plan['aircraft'] {
  const m0 = 88176.75 / G0;
  const fuel = 33211.9 / G0;
  return {
    name: 'Anderson business jet (textbook example)',
    wingArea_m2: 29.54,
    polar: {
      CD0: 0.02,
      induced: { by: 'geometry', e: 0.81, AR: (16.25 * 16.25) / 29.54 },
      CLminD: 0,
      CLmax: 1.5, // invented (common practice, clean wing)
    },
    mass: { empty_kg: m0 - fuel - 400, payload_kg: 400, mtow_kg: 9500 },
    ceiling_m: 13000,
    powerplant: {
      type: 'jet',
      maxThrustSL_N: 30000, // invented
      thrustLapseExponent: 0.8,
      tsfc_kg_Ns: 0.6 / 3600 / G0, // c_t = 0.6 1/h
      idleFuelFraction: 0.05,
      fuel: { kind: 'jetA1', load_kg: fuel, tankCapacity_L: 5000 },
    },
  };
}

/** Traub 2011 example as computed in REFERENCES.md: 2.5 kg, S 0.55 m², AR 9, e 0.85, CD0 0.03, 74 Wh. */
export function traubUav(): Plan['aircraft'] {
  return {
    name: 'Small electric UAV (Traub 2011 example)',
    wingArea_m2: 0.55,
    polar: { CD0: 0.03, induced: { by: 'geometry', e: 0.85, AR: 9 }, CLminD: 0, CLmax: 1.3 },
    mass: { empty_kg: 1.8, payload_kg: 0.25, mtow_kg: 3 },
    ceiling_m: 3000,
    powerplant: {
      type: 'electric',
      maxShaftPower_W: 150,
      motorEfficiency: 0.8,
      controllerEfficiency: 0.95,
      propEfficiency: 0.79,
      battery: {
        energy_J: 14.8 * 5 * 3600,
        mass_kg: 0.45,
        usableFraction: 0.9,
        peukertExponent: 1.05,
        ratedDischargeTime_s: 3600,
      },
    },
  };
}

export const takeoff = (): Leg => ({
  kind: 'takeoff',
  id: 'to',
  label: '',
  allowance: { by: 'time', time_s: 120 },
});
export const landing = (): Leg => ({
  kind: 'landing',
  id: 'ldg',
  label: '',
  allowance: { by: 'time', time_s: 60 },
});
export const climb = (toAltitude_m: number): Leg => ({
  kind: 'climb',
  id: 'climb',
  label: '',
  course_deg: 90,
  wind: calm,
  toAltitude_m,
  speed: { kind: 'bestRate' },
  throttle: 1,
});
export const descent = (toAltitude_m = 0): Leg => ({
  kind: 'descent',
  id: 'desc',
  label: '',
  course_deg: 90,
  wind: calm,
  toAltitude_m,
  mode: { by: 'glide' },
});
export function cruise(end: Extract<Leg, { kind: 'cruise' }>['end'], windFromAhead_m_s = 0): Leg {
  return {
    kind: 'cruise',
    id: 'cruise',
    label: '',
    course_deg: 90,
    // Wind from the course direction is a pure headwind (meteorological convention).
    wind: { speed_m_s: windFromAhead_m_s, from_deg: 90 },
    end,
    speed: { kind: 'bestRange' },
    program: 'constantAltitude',
  };
}

/** A single cruise leg at sea level, burning `fuel_kg` (no climb: the cruise starts at 0 m). */
export function propCruiseByFuel(fuel_kg: number, headwind_m_s = 0): Plan {
  return plan('prop cruise by fuel', andersonProp(), [
    cruise({ by: 'fuel', fuel_kg }, headwind_m_s),
  ]);
}

/** Climb to `altitude_m`, then a cruise leg burning `fuel_kg`. */
export function jetCruiseByFuel(fuel_kg: number, altitude_m: number): Plan {
  return plan('jet cruise by fuel', andersonJet(), [
    climb(altitude_m),
    cruise({ by: 'fuel', fuel_kg }),
  ]);
}

/** A whole mission: take-off, climb, cruise by distance, descent, landing, with reserves. */
export function mission(kind: 'prop' | 'jet' | 'electric', distance_m: number): Plan {
  const aircraft = kind === 'prop' ? andersonProp() : kind === 'jet' ? andersonJet() : traubUav();
  const altitude = kind === 'prop' ? 1500 : kind === 'jet' ? 6000 : 300;
  const reserves = {
    holdTime_s: kind === 'electric' ? 300 : 1800,
    holdAltitude_m: kind === 'electric' ? 100 : 500,
    contingencyFraction: 0.05,
    alternateDistance_m: 0,
    alternateAltitude_m: 500,
    socFloor: kind === 'electric' ? 0.1 : 0,
    // A small UAV holds 100 m above the field (the 300 m default suits manned aircraft).
    ...(kind === 'electric' ? { minHeightAboveField_m: 100 } : {}),
  };
  return plan(
    `${kind} mission`,
    aircraft,
    [takeoff(), climb(altitude), cruise({ by: 'distance', distance_m }), descent(0), landing()],
    reserves,
  );
}
