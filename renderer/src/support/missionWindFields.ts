/**
 * The mission wind as fields: none (every leg its own), one steady wind, or the winds-aloft
 * table. Every leg with a course and the field winds follow it unless they override it
 * (core/solver/missionWind.ts). A steady wind starts from the first leg's own wind, so
 * switching it on changes nothing until it is edited.
 */
import type { MissionWind, Plan } from '../../../core/plan/schema.ts';
import { choice, num, type FieldDef } from './fieldTypes.ts';
import { setAtPath } from './paths.ts';

const P = 'environment.missionWind';

function seed(plan: Plan, by: string): MissionWind | undefined {
  if (by === 'aloft') return { by: 'aloft' };
  if (by !== 'steady') return undefined;
  const first = plan.legs.find((l) => 'wind' in l);
  const w = first && 'wind' in first ? first.wind : { speed_m_s: 0, from_deg: 360 };
  return { by: 'steady', speed_m_s: w.speed_m_s, from_deg: w.from_deg };
}

/** Legs and fields that set their own wind keep it; the others take the mission wind. */
export function withMissionWindKind(plan: Plan, by: string): Plan {
  return setAtPath(plan, P, seed(plan, by));
}

export function missionWindFields(plan: Plan): FieldDef[] {
  const pick: FieldDef = {
    ...choice(`${P}.by`, 'Wind for the mission', [
      { value: 'none', label: 'None: each leg its own' },
      { value: 'steady', label: 'One wind for every leg' },
      { value: 'aloft', label: 'Winds-aloft table' },
    ]),
    fallback: 'none',
    apply: withMissionWindKind,
  };
  if (plan.environment.missionWind?.by !== 'steady') return [pick];
  return [
    pick,
    num(`${P}.speed_m_s`, 'Mission wind speed', 'windSpeed', 'm_s', {
      hint: 'legs follow unless set to their own',
    }),
    num(`${P}.from_deg`, 'Mission wind from (° true)', 'angle', 'deg'),
  ];
}
