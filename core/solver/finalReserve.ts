/**
 * The final reserve as operators state it: a time flown at normal cruise — the plan's own
 * cruise speed schedule (that of its last cruise leg) and the power level flight at that
 * speed needs — or, when the policy says so, at best endurance (common practice of fuel
 * planning; e.g. 14 CFR 91.151(a) and 91.167(a)(3) state the light-aircraft reserve as a time
 * "at normal cruising speed"; local regulations decide which rule applies).
 *
 * It is flown at the hold altitude of the policy (default) or at the altitude where the last
 * cruise leg starts, from the landing mass, after a climb from the arrival field at full
 * throttle and best rate of climb (as alternateReserve.ts climbs): the climb is counted on top
 * of the time. A plan without a cruise leg flies it at best range (still air). The hold and
 * the alternate altitudes must lie at least the policy's minimum height above the arrival
 * field (300 m, about 1000 ft, common practice) and not above the ceiling (a pressure
 * altitude); otherwise, or when the profile cannot be flown (rate of climb, power), the
 * reserve is not computed and a ReserveProblem says why.
 */
import type { FixedSpeed, Plan } from '../plan/schema.ts';
import { reservePath } from './alternateReserve.ts';
import type { FlightModel } from './model.ts';
import type { SpeedSchedule } from './point.ts';
import { reserveAltitudeProblem, segmentProblem } from './reserveProblems.ts';
import { flySegment, type LimitKind, type MissionState } from './segment.ts';
import type { FinalReserveSummary, ReserveProblem } from './types.ts';

/** The plan's normal cruise: the last cruise leg's speed schedule and the altitude it starts at. */
export interface NormalCruise {
  speed: SpeedSchedule;
  altitude_m: number;
  legIndex: number;
}

/**
 * The last cruise leg of the plan, with the altitude it starts at, followed from the
 * departure elevation through the climbs' and descents' target altitudes (a cruise flies at
 * the altitude it finds).
 */
export function normalCruiseOf(plan: Plan): NormalCruise | null {
  let h = plan.environment.departureElevation_m;
  let found: NormalCruise | null = null;
  plan.legs.forEach((leg, i) => {
    if (leg.kind === 'climb' || leg.kind === 'descent') h = leg.toAltitude_m;
    else if (leg.kind === 'cruise') {
      const speed: SpeedSchedule =
        leg.speed.kind === 'bestRange'
          ? { kind: 'bestRange' }
          : { kind: 'fixed', speed: leg.speed as FixedSpeed };
      found = { speed, altitude_m: h, legIndex: i };
    }
  });
  return found;
}

export interface FinalReserveOutcome {
  summary: FinalReserveSummary;
  /** Consumption of climb + timed part: fuel kg or usable energy J. */
  amount: number;
  problem: ReserveProblem | null;
}

/** Flies the final reserve from the landing state (see the header). */
export function finalReserve(
  model: FlightModel,
  plan: Plan,
  landing: MissionState,
): FinalReserveOutcome {
  const policy = plan.reserves;
  const rule = policy.finalReserveSpeed ?? 'normalCruise';
  const cruise = normalCruiseOf(plan);
  const level =
    policy.finalReserveLevel === 'lastCruise' && cruise !== null ? 'lastCruise' : 'holdAltitude';
  const h_m = level === 'lastCruise' && cruise !== null ? cruise.altitude_m : policy.holdAltitude_m;
  const summary: FinalReserveSummary = {
    rule,
    level,
    altitude_m: h_m,
    time_s: policy.holdTime_s,
    cruiseLegIndex: rule === 'normalCruise' && cruise !== null ? cruise.legIndex : -1,
    climb: 0,
    timed: 0,
    rate: 0,
    tas_m_s: 0,
  };
  const out: FinalReserveOutcome = { summary, amount: 0, problem: null };
  if (!(policy.holdTime_s > 0)) return out;
  out.problem = reserveAltitudeProblem(model, plan, 'hold', h_m);
  if (out.problem !== null) return out;
  const start: MissionState = { ...landing, t_s: 0, x_m: 0, air_m: 0, path_m: 0 };
  let top: MissionState;
  if (h_m - start.h_m >= 1) {
    const floor = model.settings.minClimbRate_m_s;
    const climb = flySegment(
      model,
      {
        path: reservePath(
          model,
          'hold',
          { kind: 'bestClimb' },
          { kind: 'climb', throttle: 1 },
          false,
        ),
        indep: 'h',
        to: h_m,
        limits: ['climb'],
        minClimbRate_m_s: floor,
        samples: 0,
      },
      start,
    );
    out.problem = segmentProblem('hold', climb, Math.max(floor, 0.01));
    if (out.problem !== null) return out;
    top = { ...climb.end, t_s: 0, x_m: 0, air_m: 0, path_m: 0 };
    summary.climb = start.left - climb.end.left;
  } else top = { ...start, h_m };
  const speed: SpeedSchedule =
    rule === 'bestEndurance' ? { kind: 'bestEndurance' } : (cruise?.speed ?? { kind: 'bestRange' });
  const limits: LimitKind[] = ['power'];
  if (speed.kind === 'fixed') limits.push('stall');
  const seg = flySegment(
    model,
    {
      path: reservePath(model, 'hold', speed, { kind: 'level' }, false),
      indep: 't',
      to: policy.holdTime_s,
      limits,
      samples: 0,
    },
    top,
  );
  out.problem = segmentProblem('hold', seg, 0);
  if (out.problem !== null) return out;
  summary.timed = top.left - seg.end.left;
  summary.rate = summary.timed / policy.holdTime_s;
  summary.tas_m_s = (seg.end.path_m ?? 0) / policy.holdTime_s;
  out.amount = summary.climb + summary.timed;
  return out;
}
