/**
 * Starting points for editing: a new plan (a small battery-electric UAV, values invented for
 * demonstration within the common-practice ranges of REFERENCES.md) and a valid default for
 * each leg kind. Every value here passes PlanSchema; the tests check that.
 */
import { WH } from '../units.ts';
import { PLAN_FORMAT, PLAN_SCHEMA_VERSION } from './schema.ts';
import type { Leg, LegKind, Plan } from './schema.ts';

const calm = () => ({ speed_m_s: 0, from_deg: 0 });

/** A valid leg of the given kind with neutral values (no wind, course north). */
export function defaultLeg(kind: LegKind, id: string): Leg {
  const base = { id, label: '' };
  switch (kind) {
    case 'takeoff':
      return { kind, ...base, allowance: { by: 'time', time_s: 60 } };
    case 'landing':
      return { kind, ...base, allowance: { by: 'time', time_s: 60 } };
    case 'climb':
      return {
        kind,
        ...base,
        course_deg: 0,
        wind: calm(),
        toAltitude_m: 300,
        speed: { kind: 'bestRate' },
        throttle: 1,
      };
    case 'cruise':
      return {
        kind,
        ...base,
        course_deg: 0,
        wind: calm(),
        end: { by: 'distance', distance_m: 10_000 },
        speed: { kind: 'bestRange' },
        program: 'constantAltitude',
      };
    case 'loiter':
      return {
        kind,
        ...base,
        course_deg: 0,
        wind: calm(),
        end: { by: 'time', time_s: 1800 },
        speed: { kind: 'bestEndurance' },
      };
    case 'descent':
      return {
        kind,
        ...base,
        course_deg: 0,
        wind: calm(),
        toAltitude_m: 50,
        mode: { by: 'glide' },
      };
  }
}

/** `leg-N` with N one above the highest number in use (and not colliding with any id). */
export function nextLegId(plan: Pick<Plan, 'legs'>): string {
  const used = new Set(plan.legs.map((l) => l.id));
  let n = plan.legs.length + 1;
  for (const id of used) {
    const m = /^leg-(\d+)$/.exec(id);
    if (m) n = Math.max(n, Number(m[1]) + 1);
  }
  while (used.has(`leg-${n}`)) n += 1;
  return `leg-${n}`;
}

/** A new, valid plan: a 3 m span battery-electric UAV flying out, loitering and back. */
export function newPlan(): Plan {
  const legs: Leg[] = (
    ['takeoff', 'climb', 'cruise', 'loiter', 'cruise', 'descent', 'landing'] as const
  ).map((kind, i) => defaultLeg(kind, `leg-${i + 1}`));
  // The last descent reaches the arrival field (0 m), so the mission ends where it lands.
  for (const leg of legs) if (leg.kind === 'descent') leg.toAltitude_m = 0;
  return {
    format: PLAN_FORMAT,
    schemaVersion: PLAN_SCHEMA_VERSION,
    name: 'New plan',
    // A new plan starts without notes; the demo plans in examples/ carry their own.
    notes: '',
    aircraft: {
      name: 'Small electric UAV (example)',
      wingArea_m2: 0.9,
      polar: { CD0: 0.032, induced: { by: 'geometry', e: 0.8, AR: 10 }, CLminD: 0.05, CLmax: 1.3 },
      mass: { empty_kg: 7, payload_kg: 1, mtow_kg: 13 },
      ceiling_m: 3000,
      powerplant: {
        type: 'electric',
        maxShaftPower_W: 1500,
        motorEfficiency: 0.88,
        controllerEfficiency: 0.96,
        propEfficiency: 0.72,
        battery: {
          energy_J: 540 * WH,
          mass_kg: 3,
          usableFraction: 0.9,
          peukertExponent: 1.05,
          ratedDischargeTime_s: 3600,
        },
      },
    },
    environment: {
      isaOffset_K: 0,
      qnh_Pa: 101_325,
      departureElevation_m: 0,
      arrivalElevation_m: 0,
    },
    reserves: {
      holdTime_s: 600,
      holdAltitude_m: 150,
      // A small UAV holds low: 100 m above the field rather than the 300 m default of
      // manned aircraft (common practice).
      minHeightAboveField_m: 100,
      contingencyFraction: 0.1,
      alternateDistance_m: 0,
      alternateAltitude_m: 150,
      socFloor: 0.2,
    },
    settings: { stallFactor: 1.2, tightMargin: 0.1, minClimbRate_m_s: 0.5 },
    legs,
  };
}
