/**
 * Maximum payload for the mission as planned: the largest payload for which the solver's
 * verdict is not 'fails', by bisection between zero and the payload that brings the
 * take-off mass to MTOW with the planned fuel (or battery). The verdict only worsens as
 * payload grows (more weight: more stall speed, more power and fuel needed), so the
 * feasible payloads form one interval from zero (Press et al., Numerical Recipes, §9.1).
 */
import type { Plan } from '../plan/schema.ts';
import type { PlanResult } from '../solver/types.ts';
import { clonePlan, solveForSearch } from './planTools.ts';
import { bisectEdge } from './search1d.ts';

/** Payload schema limit, kg. */
const MAX_PAYLOAD_KG = 200_000;

export interface MaxPayloadResult {
  payload_kg: number;
  /** Id of the check that stops a larger payload (`mtow`, `reserve`, `power:3` …) or `leg:i`. */
  limitingCheck: string;
  /** Its label for display. */
  limitingLabel: string;
  /** False when the plan fails even with no payload. */
  feasible: boolean;
}

function limitingOf(result: PlanResult): { id: string; label: string } {
  const check = result.checks.find((c) => c.state === 'fails');
  if (check !== undefined) return { id: check.id, label: check.label };
  const i = result.failure?.legIndex ?? -1;
  return { id: `leg:${i}`, label: result.failure?.message ?? 'a leg cannot be flown' };
}

export function maxPayload(plan: Plan): MaxPayloadResult {
  const { mtow_kg, empty_kg } = plan.aircraft.mass;
  const pp = plan.aircraft.powerplant;
  const onBoard_kg = pp.type === 'electric' ? pp.battery.mass_kg : pp.fuel.load_kg;
  const upper = Math.min(MAX_PAYLOAD_KG, Math.max(0, mtow_kg - empty_kg - onBoard_kg));

  const work = clonePlan(plan);
  const solveWith = (payload_kg: number): PlanResult => {
    work.aircraft.mass.payload_kg = payload_kg;
    return solveForSearch(work);
  };
  const passes = (payload_kg: number) => solveWith(payload_kg).verdict !== 'fails';

  const atZero = solveWith(0);
  if (atZero.verdict === 'fails') {
    const lim = limitingOf(atZero);
    return { payload_kg: 0, limitingCheck: lim.id, limitingLabel: lim.label, feasible: false };
  }
  const atUpper = solveWith(upper);
  if (atUpper.verdict !== 'fails') {
    // Any more payload takes the take-off mass above MTOW (or the schema's payload limit).
    const byMtow = upper < MAX_PAYLOAD_KG;
    return {
      payload_kg: upper,
      limitingCheck: byMtow ? 'mtow' : 'aircraft.mass.payload_kg',
      limitingLabel: byMtow ? 'Take-off mass within MTOW' : 'Payload schema limit',
      feasible: true,
    };
  }
  const best = bisectEdge(passes, 0, upper, 1e-7 * Math.max(upper, 1e-3));
  // Name the check that fails just above the answer.
  const above = solveWith(Math.min(upper, best + 2e-7 * Math.max(upper, 1e-3)));
  const lim = limitingOf(above);
  return { payload_kg: best, limitingCheck: lim.id, limitingLabel: lim.label, feasible: true };
}
