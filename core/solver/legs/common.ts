/**
 * What every leg shares: turning a flown segment into a LegResult, the words of a failure,
 * and the data the feasibility checks need. No physics here; see point.ts and segment.ts.
 */
import type { Leg } from '../../plan/schema.ts';
import type { FlightModel } from '../model.ts';
import { fmt, type AloftPath, type FlightPath } from '../point.ts';
import {
  climbFloor,
  flySegment,
  type Independent,
  type LimitKind,
  type MissionState,
  type SegmentOutcome,
  type SegmentSpec,
} from '../segment.ts';
import type { FlightState, LegResult, LegSeries } from '../types.ts';
import { normalizeDegrees, type WindComponents } from '../wind.ts';
import { reportedWind, type LegWind } from './weather.ts';

export { legWind, type LegWind } from './weather.ts';

export interface LegContext {
  model: FlightModel;
  index: number;
  /** Chart samples per leg (0: none, for trial solutions). */
  samples: number;
}

/** Per-leg data for the feasibility checks. */
export interface LegCheckData {
  /** Minimum V/V_stall where the leg holds a given speed (null: not applicable). */
  minStallRatio: number | null;
  /**
   * Least power margin: required and available there, and the TAS there (a jet's thrust is
   * power / TAS). Null: not applicable, or a descent that never needs power (its power to
   * dissipate is a warning instead).
   */
  power: { required_W: number; available_W: number; tas_m_s?: number } | null;
  /** Least rate of climb and the floor (climb legs). */
  climb: { min_m_s: number; floor_m_s: number } | null;
  maxAltitude_m: number | null;
  /** Highest pressure altitude of the leg (what a ceiling limits). */
  maxPressureAltitude_m?: number | null;
  /**
   * An orbit (loiter) in wind: the wind speed and the airspeed where the airspeed is least
   * above the wind, and whether the leg stopped because it could not hold station.
   */
  station?: { wind_m_s: number; airspeed_m_s: number; failed: boolean } | null;
}

export interface LegOutcome {
  result: LegResult;
  end: MissionState;
  failed: boolean;
  warnings: string[];
  checks: LegCheckData;
}

export function legName(index: number, leg: Leg): string {
  const label = leg.label ? ` “${leg.label}”` : '';
  return `Leg ${index + 1}${label} (${leg.kind})`;
}

export function consumableWord(model: FlightModel): string {
  return model.consumable === 'fuel' ? 'fuel' : 'usable battery energy';
}

export function flightState(model: FlightModel, s: MissionState): FlightState {
  const fuel = model.consumable === 'fuel';
  return {
    t_s: s.t_s,
    x_m: s.x_m,
    h_m: s.h_m,
    mass_kg: s.mass_kg,
    fuel_kg: fuel ? s.left : 0,
    energy_J: fuel ? 0 : s.left,
  };
}

export function emptySeries(): LegSeries {
  return { t_s: [], x_m: [], h_m: [], mass_kg: [], fuel_kg: [], energy_J: [], tas_m_s: [] };
}

/** A leg result with the motion fields filled from start and end; flight fields zero. */
export function baseResult(
  ctx: LegContext,
  leg: Leg,
  start: MissionState,
  end: MissionState,
  status: LegResult['status'],
  error: string | null,
): LegResult {
  const model = ctx.model;
  const used = start.left - end.left;
  const time = end.t_s - start.t_s;
  // Mean TAS along the flight path: ∫V dt over the time (the horizontal air distance over
  // the time would understate the airspeed of a steep climb or descent).
  const path = (end.path_m ?? 0) - (start.path_m ?? 0);
  return {
    index: ctx.index,
    id: leg.id,
    kind: leg.kind,
    label: leg.label,
    status,
    error,
    start: flightState(model, start),
    end: flightState(model, end),
    time_s: time,
    groundDistance_m: end.x_m - start.x_m,
    airDistance_m: end.air_m - start.air_m,
    fuelUsed_kg: model.consumable === 'fuel' ? used : 0,
    energyUsed_J: model.consumable === 'fuel' ? 0 : used,
    meanTas_m_s: time > 0 ? path / time : 0,
    meanGroundSpeed_m_s: time > 0 ? (end.x_m - start.x_m) / time : 0,
    ...noFlightFigures(),
  };
}

/** The flight figures of a leg that was not integrated (allowance, not reached, crashed). */
export function noFlightFigures(): Pick<
  LegResult,
  | 'CL'
  | 'LD'
  | 'minStallRatio'
  | 'powerRequired_W'
  | 'powerAvailable_W'
  | 'headwind_m_s'
  | 'crosswind_m_s'
  | 'heading_deg'
  | 'steps'
  | 'series'
> {
  return {
    CL: { min: 0, max: 0 },
    LD: { min: 0, max: 0 },
    minStallRatio: 0,
    powerRequired_W: 0,
    powerAvailable_W: 0,
    headwind_m_s: 0,
    crosswind_m_s: 0,
    heading_deg: 0,
    steps: 0,
    series: emptySeries(),
  };
}

function finiteOr(v: number, fallback: number): number {
  return Number.isFinite(v) ? v : fallback;
}

/** Words for the limit that stopped a segment, naming the speed, power or altitude. */
export function stopMessage(
  ctx: LegContext,
  leg: Leg,
  spec: SegmentSpec,
  seg: SegmentOutcome,
  start: MissionState,
): string {
  const name = legName(ctx.index, leg);
  const p = seg.endPoint;
  const sf = ctx.model.settings.stallFactor;
  switch (seg.stoppedBy as LimitKind | 'error') {
    case 'stall':
      return `${name}: airspeed ${fmt(p.tas_m_s)} m/s is below ${sf} × stall speed (${fmt((sf * p.tas_m_s) / p.stallRatio)} m/s) at ${fmt(p.h_m)} m and ${fmt(seg.end.mass_kg)} kg`;
    case 'power':
      return `${name}: needs ${fmt(p.powerRequired_W)} W of thrust power but only ${fmt(p.powerAvailable_W)} W is available at ${fmt(p.h_m)} m and ${fmt(p.tas_m_s)} m/s`;
    case 'climb':
      return `${name}: cannot climb above ${fmt(p.h_m)} m: rate of climb falls below ${fmt(climbFloor(spec))} m/s`;
    case 'consumable':
      return `${name}: ${consumableWord(ctx.model)} exhausted ${progress(spec.indep, spec.to, start, seg.end)}`;
    case 'wind':
      return `${name}: the wind (${fmt(Math.hypot(p.headwind_m_s, p.crosswind_m_s))} m/s) leaves no ground speed along the course at ${fmt(p.tas_m_s)} m/s true airspeed`;
    case 'station':
      return `${name}: cannot hold station: the wind of ${fmt(Math.hypot(p.headwind_m_s, p.crosswind_m_s))} m/s at ${fmt(p.h_m)} m is at least the loiter airspeed of ${fmt(p.horizontal_m_s)} m/s TAS, so the aircraft drifts downwind ${progress(spec.indep, spec.to, start, seg.end)}`;
    default:
      return `${name}: ${seg.message}`;
  }
}

function progress(indep: Independent, to: number, start: MissionState, end: MissionState): string {
  if (indep === 'x') return `after ${fmt(end.x_m - start.x_m)} m of ${fmt(to - start.x_m)} m`;
  if (indep === 't') return `after ${fmt(end.t_s - start.t_s)} s of ${fmt(to - start.t_s)} s`;
  return `at ${fmt(end.h_m)} m, ${fmt(end.t_s - start.t_s)} s into the leg`;
}

/** Flies a segment for a flight leg and assembles its result, failure and check data. */
export function flyFlightLeg(
  ctx: LegContext,
  leg: Leg,
  start: MissionState,
  spec: SegmentSpec,
  wind: LegWind,
  checks: { stall: boolean; power: boolean; climb: boolean },
): LegOutcome {
  const seg = flySegment(ctx.model, spec, start);
  const failed = seg.stoppedBy !== null;
  const error = failed ? stopMessage(ctx, leg, spec, seg, start) : null;
  const r = baseResult(ctx, leg, start, seg.end, failed ? 'failed' : 'flown', error);
  if (seg.stoppedBy !== null) r.stopCause = seg.stoppedBy === 'error' ? 'other' : seg.stoppedBy;
  const s = seg.stats;
  r.CL = { min: finiteOr(s.CLmin, 0), max: finiteOr(s.CLmax, 0) };
  r.LD = { min: finiteOr(s.LDmin, 0), max: finiteOr(s.LDmax, 0) };
  r.minStallRatio = finiteOr(s.minStallRatio, 0);
  r.powerRequired_W = finiteOr(s.maxPowerRequired_W, 0);
  r.powerAvailable_W = finiteOr(s.powerAvailableAtMax_W, 0);
  const shown = reportedWind(ctx.model, wind, start.h_m, seg.end.h_m);
  r.headwind_m_s = shown.headwind_m_s;
  r.crosswind_m_s = shown.crosswind_m_s;
  const tas = r.meanTas_m_s > 0 ? r.meanTas_m_s : s.startTas_m_s;
  const ratio = tas > 0 ? shown.crosswind_m_s / tas : 0;
  const wca = Math.abs(ratio) < 1 ? (Math.asin(ratio) * 180) / Math.PI : 0;
  r.heading_deg = normalizeDegrees(wind.course_deg + wca);
  r.steps = seg.steps;
  r.series = seg.series;
  const warnings: string[] = [];
  const name = legName(ctx.index, leg);
  if (s.limitedSpeed) {
    const why = {
      stall: `below ${ctx.model.settings.stallFactor} × stall speed; the stall-margin speed is flown`,
      power:
        'beyond the power available; the speed where the power required meets the power available is flown',
      mach: 'above Mach 0.9; the speed is capped there',
    }[s.limitedSpeed.by];
    warnings.push(
      `${name}: the optimum speed lies ${why} (${fmt(s.limitedSpeed.tas_m_s)} m/s at first).`,
    );
  }
  if (s.climbCapped) {
    warnings.push(
      `${name}: the climb is limited to a 30° flight path; less than the set throttle is used.`,
    );
  }
  const steep = s.steepDescent;
  if (steep !== null) {
    warnings.push(
      `${name}: a descent at ${fmt(steep.rate_m_s)} m/s is steeper than an idle glide at ${fmt(steep.tas_m_s)} m/s (idle-glide sink ${fmt(steep.idleSink_m_s)} m/s at ${fmt(steep.h_m)} m); it needs drag devices (about ${fmt(steep.dissipate_W)} W to dissipate) or a lower rate.`,
    );
  }
  const seen = Number.isFinite(s.CLmin);
  // A power check only where power is needed: a descent steeper than an idle glide needs none
  // (the warning above says what it needs instead).
  const needsPower = s.worstPowerRequired_W > 0;
  return {
    result: r,
    end: seg.end,
    failed,
    warnings,
    checks: {
      minStallRatio: checks.stall && seen ? s.minStallRatio : null,
      power:
        checks.power && seen && needsPower
          ? {
              required_W: s.worstPowerRequired_W,
              available_W: s.worstPowerAvailable_W,
              tas_m_s: s.worstPowerTas_m_s,
            }
          : null,
      climb: checks.climb && seen ? { min_m_s: s.minClimb_m_s, floor_m_s: climbFloor(spec) } : null,
      maxAltitude_m: seen ? s.maxAltitude_m : null,
      maxPressureAltitude_m: seen ? s.maxPressureAltitude_m : null,
      station:
        spec.path.orbit === true && Number.isFinite(s.stationMargin) && s.stationWind_m_s > 0
          ? {
              wind_m_s: s.stationWind_m_s,
              airspeed_m_s: s.stationAirspeed_m_s,
              failed: seg.stoppedBy === 'station',
            }
          : null,
    },
  };
}

/** A path for a leg with a course and wind (the table's air and wind with `wind.aloft`). */
export function pathFor(
  field: string,
  speed: FlightPath['speed'],
  vertical: FlightPath['vertical'],
  wind: WindComponents & { aloft?: AloftPath },
): FlightPath {
  const path: FlightPath = {
    speed,
    vertical,
    headwind_m_s: wind.headwind_m_s,
    crosswind_m_s: wind.crosswind_m_s,
    field,
  };
  if (wind.aloft !== undefined) path.aloft = wind.aloft;
  return path;
}

/** The outcome of a leg refused before it starts (e.g. a climb to a lower altitude). */
export function refusedLeg(
  ctx: LegContext,
  leg: Leg,
  start: MissionState,
  why: string,
): LegOutcome {
  const r = baseResult(ctx, leg, start, start, 'failed', `${legName(ctx.index, leg)}: ${why}`);
  r.stopCause = 'refused';
  const st = flightState(ctx.model, start);
  r.series = {
    t_s: [st.t_s],
    x_m: [st.x_m],
    h_m: [st.h_m],
    mass_kg: [st.mass_kg],
    fuel_kg: [st.fuel_kg],
    energy_J: [st.energy_J],
    tas_m_s: [0],
  };
  return {
    result: r,
    end: start,
    failed: true,
    warnings: [],
    checks: { minStallRatio: null, power: null, climb: null, maxAltitude_m: null },
  };
}
