/**
 * Migration part (1 → 2): the final reserve as operators state it. Version 1 flew the reserve
 * hold at best-endurance speed; version 2 flies it at normal cruise, the plan's own cruise
 * speed schedule (common practice; e.g. 14 CFR 91.151(a), 91.167(a)(3) state the reserve as a
 * time at normal cruising speed), at the hold altitude, after a climb from the arrival field
 * that is now counted (core/solver/finalReserve.ts). The part writes that rule into the file
 * (reserves.finalReserveSpeed = 'normalCruise', reserves.finalReserveLevel = 'holdAltitude')
 * so the file says what it means, and notes the change.
 *
 * Version 2 also asks the hold and the alternate to lie at least a minimum height above the
 * arrival field (300 m default). A version-1 file whose hold and alternate lie above the field
 * but lower than that (a small UAV holding at 150 m) keeps working: the minimum height is set
 * to the lowest of their heights, with a note. A hold or alternate at or below the field is
 * not carried over: it now fails the reserve check, as it should.
 */
import type { RawPlan } from '../migrate.ts';
import { DEFAULT_MIN_HEIGHT_ABOVE_FIELD_M } from '../schema.ts';

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function num(v: unknown): number | null {
  return typeof v === 'number' && Number.isFinite(v) ? v : null;
}

/** Heights above the arrival field of the hold and (when it is flown) the alternate. */
function reserveHeights(reserves: Record<string, unknown>, arrival: number): number[] {
  const out: number[] = [];
  const hold = num(reserves.holdAltitude_m);
  if (hold !== null && (num(reserves.holdTime_s) ?? 0) > 0) out.push(hold - arrival);
  const alt = num(reserves.alternateAltitude_m);
  if (alt !== null && (num(reserves.alternateDistance_m) ?? 0) > 0) out.push(alt - arrival);
  return out;
}

export function finalReserveAtCruise(raw: RawPlan, notes: string[]): RawPlan {
  const reserves = raw.reserves;
  if (!isObject(reserves)) return raw;
  const next: Record<string, unknown> = { ...reserves };
  if (next.finalReserveSpeed === undefined) {
    next.finalReserveSpeed = 'normalCruise';
    next.finalReserveLevel ??= 'holdAltitude';
    const minutes = num(reserves.holdTime_s);
    const time = minutes !== null && minutes > 0 ? `${Math.round(minutes / 60)}-minute ` : '';
    notes.push(
      `The ${time}final reserve is now flown at normal cruise (the speed of the plan's last cruise leg) at the hold altitude, counting the climb to it from the arrival field, as operators commonly state it; version 1 flew it at best-endurance speed. Set the final reserve speed to best endurance for the old rule.`,
    );
  }
  const env = raw.environment;
  const arrival = isObject(env) ? num(env.arrivalElevation_m) : null;
  if (next.minHeightAboveField_m === undefined && arrival !== null) {
    const heights = reserveHeights(reserves, arrival);
    const lowest = Math.min(...heights);
    if (heights.length > 0 && lowest > 0 && lowest < DEFAULT_MIN_HEIGHT_ABOVE_FIELD_M) {
      // Rounded down to the metre so the hold itself still meets it.
      next.minHeightAboveField_m = Math.floor(lowest);
      notes.push(
        `Reserve altitudes must now lie a minimum height above the arrival field (${DEFAULT_MIN_HEIGHT_ABOVE_FIELD_M} m by default); this plan's hold or alternate is ${Math.floor(lowest)} m above it, so the minimum height is set to that.`,
      );
    }
  }
  return { ...raw, reserves: next };
}
