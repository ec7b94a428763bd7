/**
 * Reserves required on landing, from the plan's reserve policy (common practice of fuel
 * planning): contingency = fraction × trip consumption, where the trip excludes the take-off
 * and landing allowance legs (the contingency covers what can vary in flight: wind, routing,
 * performance; an allowance is already a planned, fixed amount); alternate = the profile of
 * alternateReserve.ts (climb, cruise at best range at the alternate altitude, glide); hold =
 * consumption for the hold time at best endurance at the hold altitude; electric floor =
 * socFloor × usable energy. Alternate and hold are each flown from the landing mass with the
 * same integrator as the legs (each starting at the landing mass is slightly conservative for
 * the hold, which in practice follows the alternate).
 *
 * When some leg takes its weather from the winds-aloft table, so do the reserves: both are
 * flown in the table's air (its temperature at their altitude), and the alternate with the
 * table's whole wind speed at each altitude as a headwind — the direction to the alternate is
 * not part of the plan, and a headwind is the conservative assumption. The hold needs no
 * wind: its consumption over a time does not depend on it.
 */
import type { ReservePolicy } from '../plan/schema.ts';
import { alternateReserve, reservePath } from './alternateReserve.ts';
import type { FlightModel } from './model.ts';
import { fmt } from './point.ts';
import { flySegment, type MissionState } from './segment.ts';
import type { ReserveBreakdown } from './types.ts';

export interface ReserveOutcome {
  required: ReserveBreakdown;
  /** False when a part could not be computed (its warning says why). */
  computed: boolean;
  warnings: string[];
}

/**
 * `tripConsumption`: what the contingency applies to, the trip's consumption without the
 * take-off and landing allowances (solve.ts).
 */
export function requiredReserves(
  model: FlightModel,
  policy: ReservePolicy,
  landing: MissionState,
  tripConsumption: number,
): ReserveOutcome {
  const alt = alternateReserve(model, policy, landing);
  const warnings: string[] = [...alt.warnings];
  let computed = alt.computed;
  let hold = 0;
  if (policy.holdTime_s > 0) {
    const h_m = policy.holdAltitude_m;
    const start: MissionState = { ...landing, t_s: 0, x_m: 0, air_m: 0, path_m: 0, h_m };
    const seg = flySegment(
      model,
      {
        path: reservePath(model, 'hold', { kind: 'bestEndurance' }, { kind: 'level' }, false),
        indep: 't',
        to: policy.holdTime_s,
        limits: [],
        samples: 0,
      },
      start,
    );
    if (seg.stoppedBy !== null) {
      computed = false;
      warnings.push(`Reserve hold: could not be computed (${seg.message}).`);
    } else if (seg.stats.worstPowerMargin < 0) {
      warnings.push(
        `Reserve hold: needs ${fmt(seg.stats.worstPowerRequired_W)} W of thrust power at ${fmt(h_m)} m, more than the ${fmt(seg.stats.worstPowerAvailable_W)} W available.`,
      );
    }
    hold = start.left - seg.end.left;
  }
  const alternate = alt.amount;
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
