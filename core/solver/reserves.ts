/**
 * Reserves required on landing, from the plan's reserve policy (common practice of fuel
 * planning): contingency = fraction × trip consumption; alternate = consumption to fly the
 * alternate distance at best range (no wind) at the alternate altitude; hold = consumption
 * for the hold time at best endurance at the hold altitude; electric floor = socFloor ×
 * usable energy. Alternate and hold are each flown from the landing mass with the same
 * integrator as the legs (each starting at the landing mass is slightly conservative for
 * the hold, which in practice follows the alternate).
 *
 * When some leg takes its weather from the winds-aloft table, so do the reserves: both are
 * flown in the table's air (its temperature at their altitude), and the alternate with the
 * table's whole wind speed at its altitude as a headwind — the direction to the alternate is
 * not part of the plan, and a headwind is the conservative assumption. The hold needs no
 * wind: its consumption over a time does not depend on it.
 */
import type { ReservePolicy } from '../plan/schema.ts';
import { ambientAt, type FlightModel } from './model.ts';
import { fmt, type FlightPath, type SpeedSchedule } from './point.ts';
import { flySegment, type Independent, type MissionState } from './segment.ts';
import type { ReserveBreakdown } from './types.ts';

export interface ReserveOutcome {
  required: ReserveBreakdown;
  /** False when a part could not be computed (its warning says why). */
  computed: boolean;
  warnings: string[];
}

export function requiredReserves(
  model: FlightModel,
  policy: ReservePolicy,
  landing: MissionState,
  tripConsumption: number,
): ReserveOutcome {
  const warnings: string[] = [];
  let computed = true;
  const part = (
    what: string,
    speed: SpeedSchedule,
    h_m: number,
    indep: Independent,
    amount: number,
  ): number => {
    if (amount <= 0) return 0;
    const start: MissionState = { ...landing, t_s: 0, x_m: 0, air_m: 0, h_m };
    let path: FlightPath;
    try {
      path = reservePath(model, what, speed, h_m);
    } catch (e) {
      computed = false;
      warnings.push(`Reserve ${what}: could not be computed (${(e as Error).message}).`);
      return 0;
    }
    const seg = flySegment(
      model,
      {
        path,
        indep,
        to: amount,
        limits: [],
        samples: 0,
      },
      start,
    );
    if (seg.stoppedBy !== null) {
      computed = false;
      warnings.push(`Reserve ${what}: could not be computed (${seg.message}).`);
    } else if (seg.stats.worstPowerMargin < 0) {
      warnings.push(
        `Reserve ${what}: needs ${fmt(seg.stats.worstPowerRequired_W)} W of thrust power at ${fmt(h_m)} m, more than the ${fmt(seg.stats.worstPowerAvailable_W)} W available.`,
      );
    }
    return start.left - seg.end.left;
  };
  const alternate = part(
    'alternate',
    { kind: 'bestRange' },
    policy.alternateAltitude_m,
    'x',
    policy.alternateDistance_m,
  );
  const hold = part(
    'hold',
    { kind: 'bestEndurance' },
    policy.holdAltitude_m,
    't',
    policy.holdTime_s,
  );
  const contingency = policy.contingencyFraction * Math.max(tripConsumption, 0);
  const floor = model.consumable === 'battery' ? policy.socFloor * model.usableEnergy_J : 0;
  return {
    required: {
      contingency,
      alternate,
      hold,
      floor,
      total: contingency + alternate + hold + floor,
    },
    computed,
    warnings,
  };
}

/** Still air on the plan's day, or the table's air with its wind speed as a headwind. */
function reservePath(
  model: FlightModel,
  what: string,
  speed: SpeedSchedule,
  h_m: number,
): FlightPath {
  const path: FlightPath = {
    speed,
    vertical: { kind: 'level' },
    headwind_m_s: 0,
    crosswind_m_s: 0,
    field: `reserves.${what}`,
  };
  if (!model.aloftReserves) return path;
  path.aloft = { wind: false, sinCourse: 0, cosCourse: 1 };
  if (what === 'alternate') {
    const amb = ambientAt(model, h_m, true);
    path.headwind_m_s = Math.hypot(amb.windEast_m_s, amb.windNorth_m_s);
  }
  return path;
}
