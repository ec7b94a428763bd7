/**
 * One wind for the mission (environment.missionWind): a steady wind or the winds-aloft
 * table that every leg with a course flies unless it overrides it, and that the runway
 * surface winds and the launch headwind follow unless set to their own.
 *
 * The rule, in one place: a leg's windSource 'leg' or 'aloft' is its own choice; 'mission',
 * or no windSource in a plan that has a mission wind, takes the mission wind. Plans without
 * a mission wind (all version 1 files) fly exactly as before. A hand or catapult launch is
 * made into the wind (common practice), so a launch that follows the mission wind takes its
 * whole speed as headwind; with the table as mission wind, the field's wind is the table's
 * at the field elevation (vector interpolation, core/weather/windsAloft.ts).
 *
 * `withMissionWind` turns the plan into the same plan with every choice explicit, so the
 * solver, the optimizers and the Monte Carlo see ordinary per-leg winds.
 */
import type { Airfield, Leg, MissionWind, Plan, Wind } from '../plan/schema.ts';
import { windAt } from '../weather/windsAloft.ts';

export type LegWindSource = 'leg' | 'aloft' | 'mission';

/** Where a leg's wind comes from, once the default is applied. */
export function legWindSource(plan: Pick<Plan, 'environment'>, leg: Leg): LegWindSource | null {
  if (!('wind' in leg)) return null;
  if (leg.windSource === 'leg' || leg.windSource === 'aloft') return leg.windSource;
  if (leg.windSource === 'mission') return 'mission';
  return plan.environment.missionWind ? 'mission' : 'leg';
}

/** The steady wind at a field of this elevation from the mission wind, or null for none. */
export function missionWindAt(plan: Pick<Plan, 'environment'>, elevation_m: number): Wind | null {
  const mw: MissionWind | undefined = plan.environment.missionWind;
  if (mw === undefined) return null;
  if (mw.by === 'steady') return { speed_m_s: mw.speed_m_s, from_deg: mw.from_deg };
  const table = plan.environment.windsAloft;
  if (table === undefined) return null;
  const w = windAt(table, elevation_m, 'environment.departureElevation_m');
  return { speed_m_s: w.speed_m_s, from_deg: w.from_deg };
}

function resolveLeg(plan: Plan, leg: Leg): Leg {
  if (!('wind' in leg)) return leg;
  const source = legWindSource(plan, leg);
  if (source !== 'mission') return leg;
  const mw = plan.environment.missionWind;
  // 'mission' without a mission wind: the leg's own wind (sanity.ts says so).
  if (mw === undefined) return { ...leg, windSource: 'leg' };
  if (mw.by === 'aloft') return { ...leg, windSource: 'aloft' };
  return { ...leg, windSource: 'leg', wind: { speed_m_s: mw.speed_m_s, from_deg: mw.from_deg } };
}

function resolveAirfield(plan: Plan, a: Airfield): Airfield {
  const env = plan.environment;
  let departure = a.departure;
  let arrival = a.arrival;
  if (departure.by === 'runway' && departure.surfaceWindSource !== 'own') {
    const w = missionWindAt(plan, env.departureElevation_m);
    if (w) departure = { ...departure, surfaceWind: w, surfaceWindSource: 'own' };
  }
  if (departure.by === 'launch' && departure.headwindSource !== 'own') {
    const w = missionWindAt(plan, env.departureElevation_m);
    // The schema bounds a launch headwind to 30 m/s; a stronger mission wind is no launch day.
    if (w) departure = { ...departure, headwind_m_s: w.speed_m_s, headwindSource: 'own' };
  }
  if (arrival.by === 'runway' && arrival.surfaceWindSource !== 'own') {
    const w = missionWindAt(plan, env.arrivalElevation_m);
    if (w) arrival = { ...arrival, surfaceWind: w, surfaceWindSource: 'own' };
  }
  return departure === a.departure && arrival === a.arrival ? a : { ...a, departure, arrival };
}

/** The plan with every wind explicit; the same object when the plan has no mission wind. */
export function withMissionWind(plan: Plan): Plan {
  if (plan.environment.missionWind === undefined) {
    return plan.legs.some((l) => 'wind' in l && l.windSource === 'mission')
      ? { ...plan, legs: plan.legs.map((l) => resolveLeg(plan, l)) }
      : plan;
  }
  return {
    ...plan,
    legs: plan.legs.map((l) => resolveLeg(plan, l)),
    ...(plan.airfield ? { airfield: resolveAirfield(plan, plan.airfield) } : {}),
  };
}
