/**
 * Why a reserve cannot be computed or flown (finalReserve.ts, alternateReserve.ts): a hold or
 * alternate altitude below the arrival field + the policy's minimum height (300 m, about
 * 1000 ft, common practice) or above the ceiling (a pressure altitude, as checks.ts compares
 * it), a climb that cannot reach its altitude, a cruise the power cannot hold. Each is a
 * ReserveProblem with its numbers (so a screen can word it in any units) and an SI sentence.
 */
import { DEFAULT_MIN_HEIGHT_ABOVE_FIELD_M, type Plan, type ReservePolicy } from '../plan/schema.ts';
import type { FlightModel } from './model.ts';
import { fmt } from './point.ts';
import type { SegmentOutcome } from './segment.ts';
import type { ReserveProblem } from './types.ts';

export { DEFAULT_MIN_HEIGHT_ABOVE_FIELD_M };

export function minHeightAboveField(policy: ReservePolicy): number {
  return policy.minHeightAboveField_m ?? DEFAULT_MIN_HEIGHT_ABOVE_FIELD_M;
}

/**
 * A reserve altitude outside [arrival field + minimum height, ceiling]: the problem, or null.
 * `part` names the hold or the alternate.
 */
export function reserveAltitudeProblem(
  model: FlightModel,
  plan: Plan,
  part: ReserveProblem['part'],
  h_m: number,
): ReserveProblem | null {
  const what = part === 'hold' ? 'final reserve' : 'alternate';
  const field = plan.environment.arrivalElevation_m;
  const minH = minHeightAboveField(plan.reserves);
  const floor = field + minH;
  if (h_m < floor - 1e-9) {
    return problem(
      part,
      'belowField',
      h_m,
      floor,
      `the ${what} altitude ${fmt(h_m)} m is below the arrival field (${fmt(field)} m) + ${fmt(minH)} m minimum height`,
    );
  }
  const Hp = h_m + model.pressureAltitudeOffset_m;
  const ceiling = plan.aircraft.ceiling_m;
  if (Hp > ceiling + 1e-9) {
    return problem(
      part,
      'aboveCeiling',
      h_m,
      ceiling,
      `the ${what} altitude ${fmt(h_m)} m (pressure altitude ${fmt(Hp)} m) is above the ceiling ${fmt(ceiling)} m`,
    );
  }
  return null;
}

export function problem(
  part: ReserveProblem['part'],
  why: ReserveProblem['why'],
  altitude_m: number,
  limit: number,
  message: string,
  required_W = 0,
  available_W = 0,
): ReserveProblem {
  return { part, why, altitude_m, limit, required_W, available_W, message };
}

/** A segment that stopped, as a problem (rate of climb or power), or null when it was flown. */
export function segmentProblem(
  part: ReserveProblem['part'],
  seg: SegmentOutcome,
  floor_m_s: number,
): ReserveProblem | null {
  if (seg.stoppedBy === null) return null;
  const p = seg.endPoint;
  const what = part === 'hold' ? 'final reserve' : 'alternate';
  if (seg.stoppedBy === 'climb') {
    return problem(
      part,
      'cannotClimb',
      p.h_m,
      floor_m_s,
      `the ${what} climb cannot go above ${fmt(p.h_m)} m: the rate of climb falls below ${fmt(floor_m_s)} m/s`,
    );
  }
  if (seg.stoppedBy === 'power') {
    return problem(
      part,
      'powerShort',
      p.h_m,
      p.powerAvailable_W,
      `the ${what} needs ${fmt(p.powerRequired_W)} W of thrust power at ${fmt(p.h_m)} m and ${fmt(p.tas_m_s)} m/s, more than the ${fmt(p.powerAvailable_W)} W available`,
      p.powerRequired_W,
      p.powerAvailable_W,
    );
  }
  if (seg.stoppedBy === 'stall') {
    return problem(
      part,
      'notFlown',
      p.h_m,
      0,
      `the ${what} speed ${fmt(p.tas_m_s)} m/s is below the stall margin at ${fmt(p.h_m)} m`,
    );
  }
  return problem(part, 'notFlown', p.h_m, 0, `the ${what} could not be flown (${seg.message})`);
}
