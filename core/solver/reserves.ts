/**
 * Reserves required on landing, from the plan's reserve policy (common practice of fuel
 * planning): contingency = fraction × trip consumption, where the trip excludes the take-off
 * and landing allowance legs (the contingency covers what can vary in flight: wind, routing,
 * performance; an allowance is already a planned, fixed amount); alternate = the profile of
 * alternateReserve.ts (climb, cruise at best range at the alternate altitude, glide); final
 * reserve = the hold time at normal cruise or best endurance, with the climb to it
 * (finalReserve.ts); electric floor = socFloor × usable energy. Alternate and final reserve
 * are each flown from the landing mass with the same integrator as the legs (each starting at
 * the landing mass is slightly conservative for the hold, which in practice follows the
 * alternate).
 *
 * When some leg takes its weather from the winds-aloft table, so do the reserves: both are
 * flown in the table's air (its temperature at their altitude), and the alternate with the
 * table's whole wind speed at each altitude as a headwind — the direction to the alternate is
 * not part of the plan, and a headwind is the conservative assumption. The hold needs no
 * wind: its consumption over a time does not depend on it.
 *
 * A reserve that cannot be computed or flown (reserveProblems.ts) is not a smaller reserve:
 * `computed` is false, the problems say why, and the reserve check fails (checks.ts).
 */
import type { Plan } from '../plan/schema.ts';
import { alternateReserve } from './alternateReserve.ts';
import { finalReserve } from './finalReserve.ts';
import type { FlightModel } from './model.ts';
import { reserveAltitudeProblem } from './reserveProblems.ts';
import type { MissionState } from './segment.ts';
import type { FinalReserveSummary, ReserveBreakdown, ReserveProblem } from './types.ts';

export interface ReserveOutcome {
  required: ReserveBreakdown;
  /** False when a part could not be computed or flown (`problems` says why). */
  computed: boolean;
  problems: ReserveProblem[];
  final: FinalReserveSummary;
}

/**
 * `tripConsumption`: what the contingency applies to, the trip's consumption without the
 * take-off and landing allowances (solve.ts).
 */
export function requiredReserves(
  model: FlightModel,
  plan: Plan,
  landing: MissionState,
  tripConsumption: number,
): ReserveOutcome {
  const policy = plan.reserves;
  const problems: ReserveProblem[] = [];
  let alternate = 0;
  if (policy.alternateDistance_m > 0) {
    const refused = reserveAltitudeProblem(model, plan, 'alternate', policy.alternateAltitude_m);
    if (refused !== null) problems.push(refused);
    else {
      const alt = alternateReserve(model, policy, landing);
      if (alt.problem !== null) problems.push(alt.problem);
      alternate = alt.amount;
    }
  }
  const fin = finalReserve(model, plan, landing);
  if (fin.problem !== null) problems.push(fin.problem);
  const hold = fin.amount;
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
    computed: problems.length === 0,
    problems,
    final: fin.summary,
  };
}
