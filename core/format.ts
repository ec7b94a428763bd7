/**
 * Numbers for people: one place that turns an SI value into text in the chosen unit system
 * (core/units.ts) with a resolution per quantity a pilot would accept (common practice of
 * navigation logs): altitude to 1 m, or in feet exactly as entered (a whole number of feet)
 * and otherwise to 10 ft; distance to 0.1 km or 0.1 NM; fuel to 0.1 lb / 0.1 L (1 lb from
 * 100 lb on); energy in whole Wh from 10 Wh on and never as "0.00"; ISA deviation signed;
 * durations in one format, h:mm (m:ss under an hour where seconds matter). Used by the CLI,
 * reports and UI. A value that is not finite prints as "—", never as NaN or Infinity.
 */
import { flightLevelOf, flightLevelText, type FlightLevelRule } from './levels.ts';
import { fromSI, unitMap, UNITS } from './units.ts';
import type { Quantity, UnitId, UnitSystem } from './units.ts';

/** Printed in place of a value that is missing or not a finite number. */
export const NO_VALUE = '—';

export interface FormatOptions {
  /** Use this unit instead of the unit system's choice for the quantity. */
  unit?: UnitId;
  /** Append the unit label (default true). */
  withUnit?: boolean;
  /** Fixed number of decimals instead of the per-quantity resolution. */
  decimals?: number;
  /** Put a "+" in front of positive values (changes, margins). */
  signed?: boolean;
  /** Durations: m:ss under an hour (where seconds matter) instead of h:mm. */
  seconds?: boolean;
  /** Altitudes: above the transition altitude read as flight levels ("FL350"). */
  flightLevels?: FlightLevelRule;
}

/** Resolution of a displayed value: round to a multiple of `step`, show `decimals` places. */
interface Resolution {
  step?: number;
  decimals: number;
}

/** Decimals that leave `sig` significant digits (at most 6). */
export function significantDecimals(value: number, sig: number): number {
  const a = Math.abs(value);
  if (!(a > 0) || !Number.isFinite(a)) return 0;
  return Math.min(6, Math.max(0, sig - 1 - Math.floor(Math.log10(a))));
}

/** Common-practice display resolution for a quantity shown in `unit`. */
function resolution(quantity: Quantity, unit: UnitId, value: number): Resolution {
  const a = Math.abs(value);
  switch (quantity) {
    case 'altitude':
      // A whole number of feet is what was entered (8000 ft = 2438.4 m exactly): shown as is.
      if (unit === 'ft') return isWhole(value) ? { decimals: 0 } : { step: 10, decimals: 0 };
      return { decimals: unit === 'm' ? 0 : 1 };
    case 'distance':
      // 0.1 km or NM; whole ones from 1000 on (a sector of 1872 km needs no tenths).
      return { decimals: unit === 'm' || unit === 'ft' || a >= 999.95 ? 0 : 1 };
    case 'shortDistance':
    case 'thrust':
    case 'angle':
      return { decimals: unit === 'kN' ? 1 : 0 };
    case 'airspeed':
    case 'groundSpeed':
    case 'windSpeed':
      return { decimals: unit === 'm_s' ? 1 : 0 };
    case 'verticalSpeed':
      return unit === 'ft_min' ? { step: 10, decimals: 0 } : { decimals: 1 };
    case 'mass':
      return { decimals: a < 10 ? 2 : a < 100 ? 1 : 0 };
    case 'fuelMass':
      // 0.1 lb, and 1 lb from 100 lb on; kilograms a step finer below 10 kg (small engines).
      if (unit === 'lb') return { decimals: a < 100 ? 1 : 0 };
      return { decimals: a < 10 ? 2 : a < 100 ? 1 : 0 };
    case 'energy':
      if (unit === 'J') return { decimals: 0 };
      if (unit === 'Wh') return { decimals: a < 10 ? 1 : 0 };
      return { decimals: a < 10 ? 2 : a < 100 ? 1 : 0 };
    case 'power':
      return { decimals: unit === 'W' ? 0 : a < 10 ? 2 : a < 100 ? 1 : 0 };
    case 'fuelVolume':
      return { decimals: a < 1000 ? 1 : 0 };
    case 'temperatureDelta':
      return { decimals: isWhole(value) ? 0 : 1 };
    case 'temperature':
    case 'ratio':
      return { decimals: 1 };
    case 'pressure':
      return { decimals: unit === 'inHg' ? 2 : unit === 'hPa' && a < 100 ? 1 : 0 };
    case 'area':
      return { decimals: a < 10 ? 2 : 1 };
    case 'time':
      return { decimals: unit === 'h' ? 2 : unit === 'min' ? 1 : 0 };
    default:
      return { decimals: significantDecimals(value, 3) };
  }
}

/** Within rounding noise of a whole number (values typed as whole units, converted exactly). */
function isWhole(value: number): boolean {
  return Math.abs(value - Math.round(value)) < 1e-6;
}

/** Fixed-point text without "-0" or exponent noise; "—" when not finite. */
export function formatNumber(value: number, decimals: number, signed = false): string {
  if (!Number.isFinite(value)) return NO_VALUE;
  let text = value.toFixed(Math.max(0, Math.min(20, Math.round(decimals))));
  if (/^-0(\.0*)?$/.test(text)) text = text.slice(1);
  return signed && value > 0 && !/^0(\.0*)?$/.test(text) ? `+${text}` : text;
}

/** A plain number (CL, L/D, ratios) with `sig` significant digits; "—" when not finite. */
export function formatSignificant(value: number, sig = 3): string {
  return formatNumber(value, significantDecimals(value, sig));
}

/** The unit a quantity is shown in. */
export function displayUnitOf(quantity: Quantity, system: UnitSystem, unit?: UnitId): UnitId {
  return unit ?? unitMap(system)[quantity];
}

/** The unit's label as printed, e.g. `NM`, `kt`, `m²`. */
export function unitLabel(quantity: Quantity, system: UnitSystem, unit?: UnitId): string {
  return UNITS[displayUnitOf(quantity, system, unit)].label;
}

/** The value in its display unit, rounded to the display resolution, with its decimals. */
function rounded(value_si: number, quantity: Quantity, system: UnitSystem, opts: FormatOptions) {
  const unit = displayUnitOf(quantity, system, opts.unit);
  const v = fromSI(value_si, unit);
  const res = resolution(quantity, unit, v);
  const decimals = Math.max(0, Math.min(20, Math.round(opts.decimals ?? res.decimals)));
  const stepped =
    opts.decimals === undefined && res.step !== undefined ? Math.round(v / res.step) * res.step : v;
  return { unit, value: stepped, decimals };
}

/** SI value → number in the display unit at the display resolution (CSV); NaN if not finite. */
export function displayValue(
  value_si: number,
  quantity: Quantity,
  system: UnitSystem,
  opts: FormatOptions = {},
): number {
  if (!Number.isFinite(value_si)) return Number.NaN;
  const r = rounded(value_si, quantity, system, opts);
  return Number(r.value.toFixed(r.decimals));
}

/** SI value → text in the unit system, e.g. 3048 m as altitude, aviation → "10000 ft". */
export function formatQuantity(
  value_si: number,
  quantity: Quantity,
  system: UnitSystem,
  opts: FormatOptions = {},
): string {
  if (!Number.isFinite(value_si)) return NO_VALUE;
  if (quantity === 'time' && opts.unit === undefined && opts.decimals === undefined) {
    return formatDuration(value_si, opts);
  }
  if (quantity === 'altitude' && opts.flightLevels && opts.unit === undefined) {
    const level = flightLevelOf(value_si, opts.flightLevels);
    if (level !== null) return flightLevelText(level);
  }
  const r = rounded(value_si, quantity, system, opts);
  let text = formatNumber(r.value, r.decimals, opts.signed ?? quantity === 'temperatureDelta');
  // Nothing used reads "0", not "0.00" (a take-off leg of an electric aircraft, say).
  if (/^0\.0+$/.test(text)) text = '0';
  // An ISA deviation is always written with its sign, zero too ("ISA +0 °C").
  if (quantity === 'temperatureDelta' && opts.signed === undefined && /^0(\.0+)?$/.test(text)) {
    text = `+${text}`;
  }
  if (opts.withUnit === false) return text;
  const label = UNITS[r.unit].label;
  if (label === '') return text;
  return label === '°' ? `${text}°` : `${text} ${label}`;
}

function pad2(n: number): string {
  return n < 10 ? `0${n}` : String(n);
}

/**
 * A duration in the one format of the planner: h:mm ("0:19 h", "1:20 h"), rounded to the
 * minute; with `seconds`, m:ss under an hour ("4:05 min") for the places where seconds
 * matter (take-off and landing allowances, short holds). `withUnit: false` leaves the
 * suffix off for a column whose header names the format. "—" when not finite.
 */
export function formatDuration(
  seconds: number,
  opts: { seconds?: boolean; withUnit?: boolean } = {},
): string {
  if (!Number.isFinite(seconds)) return NO_VALUE;
  if (seconds < 0) {
    const text = formatDuration(-seconds, opts);
    return /^0:00\b/.test(text) ? text : `-${text}`;
  }
  const unit = (u: string) => (opts.withUnit === false ? '' : ` ${u}`);
  const whole = Math.round(seconds);
  if (opts.seconds && whole < 3600) {
    return `${Math.floor(whole / 60)}:${pad2(whole % 60)}${unit('min')}`;
  }
  const minutes = Math.round(seconds / 60);
  return `${Math.floor(minutes / 60)}:${pad2(minutes % 60)}${unit('h')}`;
}

/** ISA deviation as pilots write it: "ISA +5 °C", "ISA -10 °C", "ISA +0 °C". */
export function formatIsaDeviation(delta_K: number, system: UnitSystem, unit?: UnitId): string {
  if (!Number.isFinite(delta_K)) return `ISA ${NO_VALUE}`;
  return `ISA ${formatQuantity(delta_K, 'temperatureDelta', system, unit ? { unit } : {})}`;
}
