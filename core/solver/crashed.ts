/**
 * The result for a plan the solver could not even start on (an internal error): every leg
 * not flown, the first one failed with the reason, no number but zeros (solve.ts).
 */
import type { Plan } from '../plan/schema.ts';
import { consumableOf } from '../propulsion/index.ts';
import { noFlightFigures } from './legs/common.ts';
import type { LegResult, PlanResult } from './types.ts';

/** A result for a plan the solver could not even start on (an internal error). */
export function crashedResult(plan: Plan, e: unknown): PlanResult {
  const message = `internal: the solver stopped (${e instanceof Error ? e.message : String(e)})`;
  let consumable: PlanResult['consumable'] = 'fuel';
  try {
    consumable = consumableOf(plan.aircraft.powerplant);
  } catch {
    // keep 'fuel'
  }
  const zero = { t_s: 0, x_m: 0, h_m: 0, mass_kg: 0, fuel_kg: 0, energy_J: 0 };
  const legs: LegResult[] = (plan.legs ?? []).map((leg, index) => ({
    index,
    id: leg.id,
    kind: leg.kind,
    label: leg.label ?? '',
    status: index === 0 ? 'failed' : 'notReached',
    error: index === 0 ? message : null,
    start: { ...zero },
    end: { ...zero },
    time_s: 0,
    groundDistance_m: 0,
    airDistance_m: 0,
    fuelUsed_kg: 0,
    energyUsed_J: 0,
    meanTas_m_s: 0,
    meanGroundSpeed_m_s: 0,
    ...noFlightFigures(),
  }));
  return {
    consumable,
    legs,
    completed: false,
    failure: { legIndex: 0, message },
    takeoffMass_kg: 0,
    totals: { time_s: 0, groundDistance_m: 0, airDistance_m: 0, fuelUsed_kg: 0, energyUsed_J: 0 },
    landing: { remaining: 0, fractionOfStart: 0, soc: 0 },
    reserve: {
      required: { contingency: 0, alternate: 0, hold: 0, floor: 0, total: 0 },
      kept: false,
      margin: 0,
      final: {
        rule: 'normalCruise',
        level: 'holdAltitude',
        altitude_m: 0,
        time_s: 0,
        cruiseLegIndex: -1,
        climb: 0,
        timed: 0,
        rate: 0,
        tas_m_s: 0,
      },
      problems: [],
      requiredTime_s: 0,
      remainingTime_s: 0,
    },
    checks: [],
    verdict: 'fails',
    warnings: [],
  };
}
