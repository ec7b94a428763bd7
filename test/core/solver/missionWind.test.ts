/**
 * One wind for the mission. Every check compares against an independent vector sum (east,
 * north): the air vector of the true airspeed, turned into the crosswind, plus the wind
 * vector blowing toward from + 180° must lie along the course; its length is the ground
 * speed (plain vector addition, common practice of air navigation). A cruise at a fixed
 * TAS and constant altitude then takes distance / ground speed (exact kinematics).
 */
import { describe, expect, it } from 'vitest';
import { PlanSchema, type Plan } from '../../../core/plan/schema.ts';
import { planWarnings } from '../../../core/plan/sanity.ts';
import { legWindSource, withMissionWind } from '../../../core/solver/missionWind.ts';
import { solvePlan } from '../../../core/solver/solve.ts';
import { cruise, makePlan, rel } from './fixtures.ts';

const DEG = Math.PI / 180;
const KT = 1852 / 3600; // m/s, exact

/** Ground speed along `course` for `tas` in a wind from `from` at `speed`, by vectors. */
function groundSpeedByVectors(tas: number, course_deg: number, speed: number, from_deg: number) {
  const c = { e: Math.sin(course_deg * DEG), n: Math.cos(course_deg * DEG) };
  const w = { e: -speed * Math.sin(from_deg * DEG), n: -speed * Math.cos(from_deg * DEG) };
  const wAlong = w.e * c.e + w.n * c.n;
  const wAcross = w.e * c.n - w.n * c.e; // across the course
  const airAlong = Math.sqrt(tas * tas - wAcross * wAcross); // air cancels the crosswind
  return airAlong + wAlong;
}

const TAS = 55; // m/s
const D = 60_000; // m
const level = (over: Parameters<typeof cruise>[0]) =>
  cruise({
    speed: { kind: 'tas', speed_m_s: TAS },
    end: { by: 'distance', distance_m: D },
    ...over,
  });

function planWith(missionWind: Plan['environment']['missionWind'], legs = defaultLegs()): Plan {
  return makePlan('propeller', legs, missionWind ? { environment: { missionWind } } : {});
}

function defaultLegs() {
  return [
    level({ course_deg: 30, wind: { speed_m_s: 3, from_deg: 200 } }),
    level({ course_deg: 250, wind: { speed_m_s: 7, from_deg: 10 }, windSource: 'leg' }),
    level({ course_deg: 120, wind: { speed_m_s: 0, from_deg: 0 }, windSource: 'mission' }),
  ];
}

const timeOf = (plan: Plan, i: number) => solvePlan(plan).legs[i]!.time_s;

describe('mission wind', () => {
  const mission = { by: 'steady' as const, speed_m_s: 25 * KT, from_deg: 290 };

  it('a leg without its own wind source takes the mission wind', () => {
    const plan = planWith(mission);
    const gs = groundSpeedByVectors(TAS, 30, mission.speed_m_s, 290);
    expect(rel(timeOf(plan, 0), D / gs)).toBeLessThan(1e-6);
    const gs2 = groundSpeedByVectors(TAS, 120, mission.speed_m_s, 290);
    expect(rel(timeOf(plan, 2), D / gs2)).toBeLessThan(1e-6); // windSource 'mission' too
  });

  it('an override (windSource "leg") wins over the mission wind', () => {
    const plan = planWith(mission);
    const gs = groundSpeedByVectors(TAS, 250, 7, 10);
    expect(rel(timeOf(plan, 1), D / gs)).toBeLessThan(1e-6);
  });

  it('without a mission wind every leg keeps its own (version 1 files fly as before)', () => {
    const plan = planWith(undefined);
    expect(rel(timeOf(plan, 0), D / groundSpeedByVectors(TAS, 30, 3, 200))).toBeLessThan(1e-6);
    expect(rel(timeOf(plan, 1), D / groundSpeedByVectors(TAS, 250, 7, 10))).toBeLessThan(1e-6);
    // 'mission' without a mission wind: own (calm) wind, and a warning says so.
    expect(rel(timeOf(plan, 2), D / TAS)).toBeLessThan(1e-6);
    expect(planWarnings(plan).some((w) => w.startsWith('legs.2.windSource'))).toBe(true);
  });

  it('changing the one mission wind changes every following leg (one edit, not one per leg)', () => {
    const calmer = planWith({ ...mission, speed_m_s: 5 * KT, from_deg: 90 });
    for (const [i, course] of [
      [0, 30],
      [2, 120],
    ] as const) {
      const gs = groundSpeedByVectors(TAS, course, 5 * KT, 90);
      expect(rel(timeOf(calmer, i), D / gs)).toBeLessThan(1e-6);
    }
  });

  it('the winds-aloft table as mission wind sets the following legs to the table', () => {
    const table = [{ altitude_m: 0, from_deg: 180, speed_m_s: 10 }];
    const plan = makePlan('propeller', defaultLegs(), {
      environment: { missionWind: { by: 'aloft' }, windsAloft: table },
    });
    const resolved = withMissionWind(plan);
    expect(resolved.legs.map((l) => ('windSource' in l ? l.windSource : null))).toEqual([
      'aloft',
      'leg',
      'aloft',
    ]);
    // One table level: the same wind at every altitude (vector interpolation is constant).
    const gs = groundSpeedByVectors(TAS, 30, 10, 180);
    expect(rel(timeOf(plan, 0), D / gs)).toBeLessThan(1e-6);
  });

  it('runway surface winds and the launch headwind follow it unless set', () => {
    const runway = {
      by: 'runway' as const,
      available_m: 800,
      surface: 'dryHard' as const,
      slope: 0,
      heading_deg: 270,
      surfaceWind: { speed_m_s: 2, from_deg: 0 },
    };
    const base = planWith(mission);
    const plan = PlanSchema.parse({
      ...base,
      airfield: {
        departure: runway,
        arrival: { ...runway, surfaceWindSource: 'own' },
        takeoffFactor: 1.15,
        landingFactor: 1.43,
        launchFactor: 1.15,
      },
    });
    const r = withMissionWind(plan).airfield!;
    expect(r.departure.by === 'runway' && r.departure.surfaceWind).toEqual({
      speed_m_s: mission.speed_m_s,
      from_deg: 290,
    });
    expect(r.arrival.by === 'runway' && r.arrival.surfaceWind).toEqual({
      speed_m_s: 2,
      from_deg: 0,
    });
    const launch = PlanSchema.parse({
      ...plan,
      airfield: {
        ...plan.airfield,
        departure: { by: 'launch', releaseSpeed_m_s: 15, headwind_m_s: 1 },
      },
    });
    const l = withMissionWind(launch).airfield!.departure;
    // Launched into the wind (common practice): the whole wind speed is headwind.
    expect(l.by === 'launch' && rel(l.headwind_m_s, mission.speed_m_s)).toBeLessThan(1e-12);
  });

  it('names each leg’s source and leaves a plan without mission wind untouched', () => {
    const plan = planWith(mission);
    expect(plan.legs.map((l) => legWindSource(plan, l))).toEqual(['mission', 'leg', 'mission']);
    const own = planWith(undefined, defaultLegs().slice(0, 2));
    expect(withMissionWind(own)).toBe(own);
  });
});
