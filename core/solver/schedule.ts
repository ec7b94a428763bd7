/**
 * Speed schedules of a flight path: the true airspeed a schedule asks for at a state (fixed
 * TAS/EAS/CAS/Mach, constant CL or TAS, or one of the best-speed searches of speeds.ts). How
 * that TAS changes with altitude (the acceleration factor of climbs and descents) is in
 * slope.ts.
 */
import type { FixedSpeed } from '../plan/schema.ts';
import { G0 } from '../units.ts';
import { fixedSpeedTas, type Ambient, type FlightModel } from './model.ts';
import type { FlightPath } from './point.ts';
import {
  bestClimbTas,
  bestEnduranceTas,
  bestGlideTas,
  bestRangeTas,
  type SpeedChoice,
  type SpeedContext,
} from './speeds.ts';

export type SpeedSchedule =
  | { kind: 'fixed'; speed: FixedSpeed }
  | { kind: 'constantCL'; CL: number }
  | { kind: 'constantTas'; tas_m_s: number }
  | { kind: 'bestRange' }
  | { kind: 'bestEndurance' }
  | { kind: 'bestClimb' }
  | { kind: 'bestGlide' };

/**
 * What a segment remembers between evaluations of its speed schedule: the last answer and
 * the state it was for (an electric aircraft at one altitude keeps its mass, so its best
 * speed is one number for the whole leg), and the warm start of the next search. `up` and
 * `down` are the memos of the nearer and farther probes of dV/dh (slope.ts).
 */
export interface ScheduleMemo {
  guess_m_s?: number;
  boundHint?: 'lo' | 'hi';
  amb?: Ambient;
  mass_kg?: number;
  tas_m_s?: number;
  limitedBy?: SpeedChoice['limitedBy'];
  up?: ScheduleMemo;
  down?: ScheduleMemo;
  /** The altitude where the piece of a climb or descent being flown ends (segment.ts). */
  pieceEnd_m?: number;
}

/** The wind the schedule sees (in) and why its speed was moved off the optimum (out). */
export interface ScheduleIo {
  headwind_m_s: number;
  crosswind_m_s: number;
  speedLimitedBy: SpeedChoice['limitedBy'];
}

/** The schedule's TAS at (mass, air); `io` carries the wind in and the speed limit out. */
export function scheduleTas(
  model: FlightModel,
  path: FlightPath,
  mass_kg: number,
  amb: Ambient,
  memo: ScheduleMemo,
  io: ScheduleIo,
): number {
  const s = path.speed;
  io.speedLimitedBy = null;
  switch (s.kind) {
    case 'fixed':
      // Depends on the air only.
      if (memo.amb !== amb || memo.tas_m_s === undefined) {
        memo.tas_m_s = fixedSpeedTas(s.speed, amb.atm, path.field);
        memo.amb = amb;
      }
      return memo.tas_m_s;
    case 'constantTas':
      return s.tas_m_s;
    case 'constantCL':
      return Math.sqrt((2 * mass_kg * G0) / (amb.atm.rho_kg_m3 * model.S_m2 * s.CL));
  }
  if (memo.amb === amb && memo.mass_kg === mass_kg && memo.tas_m_s !== undefined) {
    io.speedLimitedBy = memo.limitedBy ?? null;
    return memo.tas_m_s;
  }
  const ctx: SpeedContext = {
    model,
    mass_kg,
    amb,
    headwind_m_s: io.headwind_m_s,
    crosswind_m_s: io.crosswind_m_s,
    guess_m_s: memo.guess_m_s,
    boundHint: memo.boundHint,
  };
  let choice: SpeedChoice;
  if (s.kind === 'bestRange') choice = bestRangeTas(ctx);
  else if (s.kind === 'bestEndurance') choice = bestEnduranceTas(ctx);
  else if (s.kind === 'bestGlide') choice = bestGlideTas(ctx);
  else choice = bestClimbTas(ctx, path.vertical.kind === 'climb' ? path.vertical.throttle : 1);
  const at = choice.optimumAt ?? null;
  if (at === null) {
    memo.guess_m_s = choice.optimum_m_s;
    memo.boundHint = undefined;
  } else memo.boundHint = at;
  memo.amb = amb;
  memo.mass_kg = mass_kg;
  memo.tas_m_s = choice.tas_m_s;
  memo.limitedBy = choice.limitedBy;
  io.speedLimitedBy = choice.limitedBy;
  return choice.tas_m_s;
}
