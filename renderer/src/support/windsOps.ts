/**
 * Editing the winds-aloft table (environment.windsAloft). The plan keeps the table only
 * while it has a level (the schema asks for at least one); levels keep the order they were
 * entered in — the core sorts them by altitude when it interpolates (core/weather/windsAloft.ts).
 */
import type { Plan, WindLevelData } from '../../../core/plan/schema.ts';
import { FT } from '../../../core/units.ts';
import type { UnitSystem } from '../../../core/units.ts';

export function withWindLevels(plan: Plan, levels: readonly WindLevelData[]): Plan {
  const { windsAloft: _old, ...env } = plan.environment;
  return {
    ...plan,
    environment: levels.length > 0 ? { ...env, windsAloft: levels.slice() } : env,
  };
}

/**
 * A new level above the highest one: 1000 m higher in SI, 3000 ft in aviation units (round
 * numbers in the unit the person reads), with the wind of the level below.
 */
export function addWindLevel(
  levels: readonly WindLevelData[],
  system: UnitSystem,
): WindLevelData[] {
  const step = system === 'aviation' ? 3000 * FT : 1000;
  const top = levels.reduce<WindLevelData | undefined>(
    (a, l) => (a === undefined || l.altitude_m > a.altitude_m ? l : a),
    undefined,
  );
  const altitude_m = Math.min(30_000, top ? top.altitude_m + step : 0);
  const level: WindLevelData = top
    ? { altitude_m, from_deg: top.from_deg, speed_m_s: top.speed_m_s }
    : { altitude_m, from_deg: 360, speed_m_s: 0 };
  return [...levels, level];
}

export function deleteWindLevel(levels: readonly WindLevelData[], index: number): WindLevelData[] {
  return levels.filter((_, i) => i !== index);
}
