/**
 * What a segment remembers of its flight for the leg result and the checks: spans of CL and
 * L/D, the least stall margin, the largest and the tightest power, the least rate of climb,
 * the highest altitude (and pressure altitude), where a best-speed schedule had to leave its
 * optimum, the point where a descent is steepest beyond an idle glide, and where an orbit is
 * nearest to drifting with the wind.
 */
import type { Point } from './point.ts';

export interface SegmentStats {
  CLmin: number;
  CLmax: number;
  LDmin: number;
  LDmax: number;
  minStallRatio: number;
  /** Largest power required and the power available at that point. */
  maxPowerRequired_W: number;
  powerAvailableAtMax_W: number;
  /** Point of least relative power margin. */
  worstPowerMargin: number;
  worstPowerRequired_W: number;
  worstPowerAvailable_W: number;
  /** TAS at the point of least power margin (a jet's thrust is power / TAS). */
  worstPowerTas_m_s: number;
  minClimb_m_s: number;
  maxAltitude_m: number;
  maxPressureAltitude_m: number;
  /**
   * A descent steeper than an idle glide (thrust power required below 0) at its worst point:
   * the descent rate, the idle-glide sink at that speed, the speed, altitude and the power
   * the drag devices would have to dissipate.
   */
  steepDescent: {
    rate_m_s: number;
    idleSink_m_s: number;
    tas_m_s: number;
    h_m: number;
    dissipate_W: number;
  } | null;
  startTas_m_s: number;
  /**
   * Holding station in an orbit (point.ts): the least (horizontal airspeed − wind speed)/TAS
   * and the wind speed and horizontal airspeed there.
   */
  stationMargin: number;
  stationWind_m_s: number;
  stationAirspeed_m_s: number;
  /** First point where a best-speed schedule was moved off its optimum, and why. */
  limitedSpeed: { tas_m_s: number; by: 'stall' | 'power' | 'mach' } | null;
  climbCapped: boolean;
}

export function emptyStats(): SegmentStats {
  return {
    CLmin: Infinity,
    CLmax: -Infinity,
    LDmin: Infinity,
    LDmax: -Infinity,
    minStallRatio: Infinity,
    maxPowerRequired_W: -Infinity,
    powerAvailableAtMax_W: 0,
    worstPowerMargin: Infinity,
    worstPowerRequired_W: 0,
    worstPowerAvailable_W: 0,
    worstPowerTas_m_s: 0,
    minClimb_m_s: Infinity,
    maxAltitude_m: -Infinity,
    maxPressureAltitude_m: -Infinity,
    steepDescent: null,
    startTas_m_s: 0,
    stationMargin: Infinity,
    stationWind_m_s: 0,
    stationAirspeed_m_s: 0,
    limitedSpeed: null,
    climbCapped: false,
  };
}

export function record(stats: SegmentStats, p: Point): void {
  const LD = p.CL / p.CD;
  stats.CLmin = Math.min(stats.CLmin, p.CL);
  stats.CLmax = Math.max(stats.CLmax, p.CL);
  stats.LDmin = Math.min(stats.LDmin, LD);
  stats.LDmax = Math.max(stats.LDmax, LD);
  stats.minStallRatio = Math.min(stats.minStallRatio, p.stallRatio);
  if (p.powerRequired_W > stats.maxPowerRequired_W) {
    stats.maxPowerRequired_W = p.powerRequired_W;
    stats.powerAvailableAtMax_W = p.powerAvailable_W;
  }
  const margin = powerMargin(p);
  if (margin < stats.worstPowerMargin) {
    stats.worstPowerMargin = margin;
    stats.worstPowerRequired_W = p.powerRequired_W;
    stats.worstPowerAvailable_W = p.powerAvailable_W;
    stats.worstPowerTas_m_s = p.tas_m_s;
  }
  stats.minClimb_m_s = Math.min(stats.minClimb_m_s, p.climb_m_s);
  stats.maxAltitude_m = Math.max(stats.maxAltitude_m, p.h_m);
  stats.maxPressureAltitude_m = Math.max(stats.maxPressureAltitude_m, p.amb.pressureAltitude_m);
  if (
    p.idleSink_m_s > 0 &&
    p.thrustPower_W < 0 &&
    (stats.steepDescent === null || -p.thrustPower_W > stats.steepDescent.dissipate_W)
  ) {
    stats.steepDescent = {
      rate_m_s: -p.climb_m_s,
      idleSink_m_s: p.idleSink_m_s,
      tas_m_s: p.tas_m_s,
      h_m: p.h_m,
      dissipate_W: -p.thrustPower_W,
    };
  }
  if (stats.limitedSpeed === null && p.speedLimitedBy !== null) {
    stats.limitedSpeed = { tas_m_s: p.tas_m_s, by: p.speedLimitedBy };
  }
  if (p.climbCapped) stats.climbCapped = true;
  const wind = Math.hypot(p.headwind_m_s, p.crosswind_m_s);
  const station = (p.horizontal_m_s - wind) / p.tas_m_s;
  if (station < stats.stationMargin) {
    stats.stationMargin = station;
    stats.stationWind_m_s = wind;
    stats.stationAirspeed_m_s = p.horizontal_m_s;
  }
}

/** (available − required)/available; with nothing available, −1 if anything is required. */
export function powerMargin(p: Point): number {
  if (p.powerAvailable_W > 0) return (p.powerAvailable_W - p.powerRequired_W) / p.powerAvailable_W;
  return p.powerRequired_W > 0 ? -1 : 0;
}
