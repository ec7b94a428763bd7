/**
 * Levels people fly: flight levels above a transition altitude and the grid of cruising
 * levels an altitude suggestion snaps to.
 *
 * A flight level is the pressure altitude in hundreds of feet, the altimeter set to the
 * standard 1013.25 hPa (ICAO Annex 2 and Doc 8168, common practice). Plan altitudes are
 * altitudes above mean sea level with the plan's QNH (core/plan/schema.ts), so the level is
 * the altitude plus the pressure altitude of the QNH — the same rule as an aerodrome's
 * pressure altitude in core/atmosphere.ts. Above the transition altitude (a national
 * setting: 3000 ft in parts of Europe, 18 000 ft in the United States, common practice)
 * altitudes read "FL350"; below it they stay altitudes.
 *
 * Cruising levels: 500 ft steps (or 100 m where metres are flown), optionally the
 * semicircular rule of ICAO Annex 2, Appendix 3 (common practice): magnetic track 000–179°
 * odd thousands of feet, 180–359° even thousands; VFR adds 500 ft.
 */
import { pressureAltitudeFromPressure } from './atmosphere.ts';
import { InputError } from './errors.ts';
import { FT } from './units.ts';

/** Standard pressure the altimeter is set to above the transition altitude (ICAO). */
export const STANDARD_SETTING_PA = 101_325;

/** Pressure altitude of an altitude above MSL flown with the altimeter at `qnh_Pa`. */
export function pressureAltitudeOf(altitude_m: number, qnh_Pa: number): number {
  if (!Number.isFinite(altitude_m))
    throw new InputError('altitude_m', altitude_m, 'a finite number');
  return altitude_m + pressureAltitudeFromPressure(qnh_Pa, 'qnh_Pa');
}

/** The altitude above MSL (with QNH) that is a given pressure altitude; inverse of the above. */
export function altitudeOfPressureAltitude(pressureAltitude_m: number, qnh_Pa: number): number {
  if (!Number.isFinite(pressureAltitude_m)) {
    throw new InputError('pressureAltitude_m', pressureAltitude_m, 'a finite number');
  }
  return pressureAltitude_m - pressureAltitudeFromPressure(qnh_Pa, 'qnh_Pa');
}

export interface FlightLevelRule {
  /** Altitudes above this (MSL) read as flight levels. */
  transitionAltitude_m: number;
  /** The plan's altimeter setting. */
  qnh_Pa: number;
}

/** The flight level (hundreds of feet of pressure altitude), or null at or below the transition. */
export function flightLevelOf(altitude_m: number, rule: FlightLevelRule): number | null {
  if (!(altitude_m > rule.transitionAltitude_m)) return null;
  return Math.round(pressureAltitudeOf(altitude_m, rule.qnh_Pa) / (100 * FT));
}

/** "FL350" — three digits, as written in a flight plan. */
export function flightLevelText(level: number): string {
  return `FL${String(level).padStart(3, '0')}`;
}

export interface LevelGrid {
  /** Spacing of the levels: 500 ft, or 100 m where metres are flown (common practice). */
  step: 'ft500' | 'm100';
  /**
   * Semicircular rule by the magnetic track of the cruise (feet only): IFR odd/even
   * thousands, VFR the same plus 500 ft.
   */
  semicircular?: { track_deg: number; flightRules: 'ifr' | 'vfr' };
}

/** Levels of the grid, in metres above MSL, from `lo_m` to `hi_m` (both inclusive). */
export function levelsBetween(lo_m: number, hi_m: number, grid: LevelGrid): number[] {
  if (!Number.isFinite(lo_m) || !Number.isFinite(hi_m)) {
    throw new InputError('levels', `${lo_m}..${hi_m}`, 'finite altitude bounds');
  }
  const { unit, spacing, offset } = gridSpacing(grid);
  const out: number[] = [];
  const first = Math.ceil((lo_m / unit - offset) / spacing - 1e-9);
  for (let n = first; (n * spacing + offset) * unit <= hi_m + 1e-9; n++) {
    out.push((n * spacing + offset) * unit);
    if (out.length > 10_000) break;
  }
  return out;
}

/** The level of the grid nearest to an altitude (metres above MSL). */
export function nearestLevel(altitude_m: number, grid: LevelGrid): number {
  if (!Number.isFinite(altitude_m)) {
    throw new InputError('altitude_m', altitude_m, 'a finite number');
  }
  const { unit, spacing, offset } = gridSpacing(grid);
  return (Math.round((altitude_m / unit - offset) / spacing) * spacing + offset) * unit;
}

/** Grid in its own unit: level = (n·spacing + offset)·unit metres. */
function gridSpacing(grid: LevelGrid): { unit: number; spacing: number; offset: number } {
  if (grid.step === 'm100') {
    if (grid.semicircular) {
      throw new InputError('levels.semicircular', 'm100', 'a grid in feet (500 ft steps)');
    }
    return { unit: 1, spacing: 100, offset: 0 };
  }
  if (!grid.semicircular) return { unit: FT, spacing: 500, offset: 0 };
  const t = grid.semicircular.track_deg;
  if (!Number.isFinite(t) || t < 0 || t > 360) {
    throw new InputError('levels.semicircular.track_deg', t, 'from 0 to 360 deg');
  }
  const east = t % 360 < 180;
  const vfr = grid.semicircular.flightRules === 'vfr' ? 500 : 0;
  // Odd thousands eastbound: 1000, 3000, 5000 … = 2000·n + 1000; even westbound: 2000·n.
  return { unit: FT, spacing: 2000, offset: (east ? 1000 : 0) + vfr };
}
