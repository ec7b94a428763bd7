/**
 * The alternate reserve flown as a profile from the landing state (a missed approach at the
 * destination, common practice of fuel planning): a climb at full throttle and best rate of
 * climb from the landing altitude to the alternate altitude, a cruise at best range there, and
 * an idle glide at the best-glide speed back down to the landing altitude (the alternate
 * aerodrome is taken to lie at the destination's elevation, which the plan does not give).
 * The glide is the descent that needs no speed or rate from the user and works for every
 * powerplant (an idle descent, as jets plan it); it burns idle fuel only.
 *
 * The cruise covers the alternate distance left after the climb and the glide; the glide's
 * ground distance is first measured from the top of climb, then the cruise is shortened by
 * what the lighter glide after it reaches farther (idle thrust makes a glide's length depend
 * on the mass), so the profile's ground distance matches the policy's. When the alternate is too short for the climb and the glide,
 * the top is lowered in proportion, h_top = h0 + (h_top − h0)·D/(d_climb + d_glide), and tried
 * again (at most MAX_TOP_TRIALS times; climb and glide distance grow at least in proportion to
 * the height, so one try normally fits); whatever distance is left is cruised at that top. An
 * alternate altitude no higher than the landing altitude is flown level at that altitude, as
 * a cruise over the whole distance.
 *
 * With the winds-aloft table the profile flies in the table's air with the table's whole wind
 * speed at each altitude as a headwind (the direction to the alternate is not in the plan).
 */
import type { ReservePolicy } from '../plan/schema.ts';
import { segmentProblem } from './reserveProblems.ts';
import type { FlightModel } from './model.ts';
import type { FlightPath, SpeedSchedule } from './point.ts';
import { flySegment, type MissionState, type SegmentOutcome, type SegmentSpec } from './segment.ts';
import type { ReserveProblem } from './types.ts';

/** Tries of the proportional rule for an alternate too short to reach its altitude. */
const MAX_TOP_TRIALS = 4;
/** Passes that shorten the cruise for the lighter glide after it (each cuts the mismatch about a thousandfold). */
const GLIDE_REFINE_PASSES = 3;
/** A top less than this above the landing altitude is flown level. */
const MIN_CLIMB_M = 1;

export interface AlternateOutcome {
  /** Consumption of the whole profile: fuel kg or usable battery energy J. */
  amount: number;
  /** False when a part could not be flown (`problem` says why). */
  computed: boolean;
  problem: ReserveProblem | null;
  /** The top of the profile and the consumption of each part (for reports and tests). */
  top_m: number;
  climb: number;
  cruise: number;
  descent: number;
}

/** Still air on the plan's day, or the table's air with its whole wind speed as a headwind. */
export function reservePath(
  model: FlightModel,
  what: string,
  speed: SpeedSchedule,
  vertical: FlightPath['vertical'],
  headwind: boolean,
): FlightPath {
  const path: FlightPath = {
    speed,
    vertical,
    headwind_m_s: 0,
    crosswind_m_s: 0,
    field: `reserves.${what}`,
  };
  if (model.aloftReserves) {
    path.aloft = { wind: false, sinCourse: 0, cosCourse: 1, allHeadwind: headwind };
  }
  return path;
}

export function alternateReserve(
  model: FlightModel,
  policy: ReservePolicy,
  landing: MissionState,
): AlternateOutcome {
  const D = policy.alternateDistance_m;
  const h0 = landing.h_m;
  const start: MissionState = { ...landing, t_s: 0, x_m: 0, air_m: 0, path_m: 0 };
  const out: AlternateOutcome = {
    amount: 0,
    computed: true,
    problem: null,
    top_m: policy.alternateAltitude_m,
    climb: 0,
    cruise: 0,
    descent: 0,
  };
  if (!(D > 0)) return out;
  const fly = (spec: Omit<SegmentSpec, 'samples'>, from: MissionState): SegmentOutcome | null => {
    const seg = flySegment(model, { ...spec, samples: 0 }, from);
    if (seg.stoppedBy === null) return seg;
    out.computed = false;
    out.problem = segmentProblem('alternate', seg, Math.max(spec.minClimbRate_m_s ?? 0, 0.01));
    return null;
  };
  const used = (a: MissionState, b: MissionState) => a.left - b.left;
  // Power is watched: a cruise that cannot be flown level is a reserve that cannot be flown.
  const cruiseAt = (h_m: number, from: MissionState, distance_m: number) =>
    fly(
      {
        path: reservePath(model, 'alternate', { kind: 'bestRange' }, { kind: 'level' }, true),
        indep: 'x',
        to: from.x_m + distance_m,
        limits: ['power'],
      },
      { ...from, h_m },
    );
  const glideFrom = (from: MissionState) =>
    fly(
      {
        path: reservePath(model, 'alternate', { kind: 'bestGlide' }, { kind: 'glide' }, true),
        indep: 'h',
        to: h0,
        limits: [],
      },
      from,
    );

  let top = policy.alternateAltitude_m;
  if (!(top - h0 >= MIN_CLIMB_M)) {
    const seg = cruiseAt(top, start, D);
    if (seg !== null) out.cruise = out.amount = used(start, seg.end);
    return out;
  }
  let climb: SegmentOutcome | null = null;
  let glide: SegmentOutcome | null = null;
  for (let trial = 0; trial <= MAX_TOP_TRIALS; trial++) {
    climb = fly(
      {
        path: reservePath(
          model,
          'alternate',
          { kind: 'bestClimb' },
          { kind: 'climb', throttle: 1 },
          true,
        ),
        indep: 'h',
        to: top,
        limits: ['climb'],
        minClimbRate_m_s: model.settings.minClimbRate_m_s,
      },
      start,
    );
    if (climb === null) return out;
    glide = glideFrom(climb.end);
    if (glide === null) return out;
    const dcd = glide.end.x_m;
    if (dcd <= D || trial === MAX_TOP_TRIALS) break;
    const next = h0 + ((top - h0) * D) / dcd;
    if (!(next - h0 >= MIN_CLIMB_M)) {
      // Too short for any climb: the whole alternate is flown level at the landing altitude.
      const seg = cruiseAt(h0, start, D);
      out.top_m = h0;
      if (seg !== null) out.cruise = out.amount = used(start, seg.end);
      return out;
    }
    top = next;
  }
  if (climb === null || glide === null) return out;
  out.top_m = top;
  out.climb = used(start, climb.end);
  let left = D - glide.end.x_m;
  if (left > 0) {
    // The glide after the cruise starts lighter and (with idle thrust) reaches a little
    // farther than the one measured from the top of climb: shorten the cruise by the
    // difference and fly it again, so the profile's ground distance matches the policy's.
    for (let pass = 0; ; pass++) {
      const cruise = cruiseAt(top, climb.end, left);
      if (cruise === null) return out;
      const after = glideFrom(cruise.end);
      if (after === null) return out;
      const over = after.end.x_m - D;
      if (pass < GLIDE_REFINE_PASSES && Math.abs(over) > 1e-10 * D && left - over > 0) {
        left -= over;
        continue;
      }
      out.cruise = used(climb.end, cruise.end);
      out.descent = used(cruise.end, after.end);
      break;
    }
  } else out.descent = used(climb.end, glide.end);
  out.amount = out.climb + out.cruise + out.descent;
  return out;
}
