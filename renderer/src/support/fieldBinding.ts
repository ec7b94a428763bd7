/**
 * Between what a person types in a number box and the SI value in the plan.
 * The plan holds the value in its stored unit (the unit named in its key); the box shows
 * it in the display unit of the chosen unit system, with the decimal mark of the person's
 * locale. Text that does not parse is kept in the box and becomes NaN in the plan, so the
 * plan check names the field and the result goes stale instead of the keystroke being
 * thrown away.
 */
import {
  formatNumber,
  formatQuantity,
  formatSignificant,
  significantDecimals,
} from '../../../core/format.ts';
import { convert, FT, toSI, type Quantity, type UnitId } from '../../../core/units.ts';
import {
  altitudeOfPressureAltitude,
  flightLevelOf,
  flightLevelText,
  type FlightLevelRule,
} from '../../../core/levels.ts';
import { localNumber, PLAIN_STYLE, readNumber, type NumberStyle } from './numberText.ts';

export type FieldParse =
  { ok: true; value: number; note?: string; unit?: 'm' } | { ok: false; message: string };

/** How a box reads text: the locale's marks, and flight levels where the field allows them. */
export interface TextReading {
  readonly style: NumberStyle;
  /** Altitude fields accept "FL350" above the transition altitude of this rule. */
  readonly flightLevels?: FlightLevelRule;
}

export const PLAIN_READING: TextReading = { style: PLAIN_STYLE };

/**
 * Reads a typed number by the rule of `reading` (renderer/src/support/numberText.ts). A
 * flight level becomes the altitude above MSL whose pressure altitude it is with the plan's
 * QNH (core/levels.ts, the rule the screen shows levels by), in metres, and is accepted only
 * above the transition altitude.
 */
export function parseNumberText(text: string, reading: TextReading = PLAIN_READING): FieldParse {
  const rule = reading.flightLevels;
  const r = readNumber(text, reading.style, { flightLevels: rule !== undefined });
  if (!r.ok) return r;
  if (r.unit !== 'FL')
    return r.note === undefined
      ? { ok: true, value: r.value }
      : { ok: true, value: r.value, note: r.note };
  if (!rule) return { ok: false, message: 'flight levels are not used here' };
  const level = `FL${String(r.value).padStart(3, '0')}`;
  let altitude_m: number;
  try {
    altitude_m = altitudeOfPressureAltitude(r.value * 100 * FT, rule.qnh_Pa);
  } catch {
    return { ok: false, message: `${level} needs a valid QNH` };
  }
  if (!(altitude_m > rule.transitionAltitude_m)) {
    const ta = plainNumber(rule.transitionAltitude_m / FT, 6);
    return {
      ok: false,
      message: `${level} is not above the transition altitude (${ta} ft): enter an altitude`,
    };
  }
  return { ok: true, value: altitude_m, unit: 'm' };
}

/**
 * Typed text in `displayUnit` → value in `storedUnit` at full precision (exact factors,
 * core/units.ts); NaN when the text is not a number. A flight level is feet, whatever the
 * box shows. A box showing heights above a reference (the departure field,
 * heightReference.ts) adds `offset_m` to what is typed; a flight level is never shifted.
 */
export function storedFromText(
  text: string,
  displayUnit: UnitId,
  storedUnit: UnitId,
  reading: TextReading = PLAIN_READING,
  offset_m = 0,
): number {
  const parsed = parseNumberText(text, reading);
  if (!parsed.ok) return Number.NaN;
  if (offset_m === 0 || parsed.unit !== undefined) {
    return convert(parsed.value, parsed.unit ?? displayUnit, storedUnit);
  }
  const shown_m = convert(parsed.value, displayUnit, 'm');
  return convert(shown_m + offset_m, 'm', storedUnit);
}

/**
 * "FL270" for a stored altitude that is exactly a flight level above the transition altitude
 * (what "FL270" typed into the box stores, core/levels.ts); otherwise null.
 */
export function flightLevelBoxText(
  stored: number,
  storedUnit: UnitId,
  rule: FlightLevelRule,
): string | null {
  if (!Number.isFinite(stored)) return null;
  const m = convert(stored, storedUnit, 'm');
  const level = flightLevelOf(m, rule);
  if (level === null) return null;
  const back = altitudeOfPressureAltitude(level * 100 * FT, rule.qnh_Pa);
  return Math.abs(back - m) <= 1e-9 * Math.max(1, Math.abs(m)) ? flightLevelText(level) : null;
}

/**
 * The text an input box shows for a stored value. A value the box can show exactly in at
 * most 9 significant digits (8000 ft from 2438.4 m, 1013.25 hPa, 80 %) is shown exactly. Anything else is a
 * conversion that does not come out round (95 kg = 209.4357 lb): it is shown rounded to the
 * display resolution of its quantity (core/format.ts, the same as the results), with up to
 * one more place where that leaves fewer than 3 significant digits — or, without a quantity,
 * to `significant` digits. Only the box text
 * is rounded: the plan keeps its value until the person types in the box.
 */
export function editableText(
  stored: number,
  storedUnit: UnitId,
  displayUnit: UnitId,
  quantityOrSignificant: Quantity | null | number = null,
  style: NumberStyle = PLAIN_STYLE,
): string {
  if (!Number.isFinite(stored)) return '';
  const shown = convert(stored, storedUnit, displayUnit);
  return localNumber(
    plainEditable(shown, stored, storedUnit, displayUnit, quantityOrSignificant),
    style,
  );
}

function plainEditable(
  shown: number,
  stored: number,
  storedUnit: UnitId,
  displayUnit: UnitId,
  quantityOrSignificant: Quantity | null | number,
): string {
  const exact = exactText(
    shown,
    9,
    (text) => convert(Number(text), displayUnit, storedUnit),
    stored,
  );
  if (exact !== null) return exact;
  if (typeof quantityOrSignificant === 'number') return plainNumber(shown, quantityOrSignificant);
  if (quantityOrSignificant === null) return plainNumber(shown, 5);
  // At least 3 significant digits, but at most one place finer than the results show.
  const display = displayDecimals(stored, storedUnit, displayUnit, quantityOrSignificant);
  const decimals = Math.min(Math.max(display, significantDecimals(shown, 3)), display + 1);
  return trimZeros(formatNumber(shown, decimals));
}

/**
 * The shortest text of at most `maxSignificant` digits that stands for the stored value
 * exactly (read back and converted, it matches to the rounding noise of an exact-factor
 * conversion, 1e-12 relative to the stored value — so °F near 0 compares in kelvin), or
 * null. 8000 ft stored as 2438.4 m shows as 8000 ft again; 95 kg (209.43570… lb) is not
 * exact and is rounded.
 */
function exactText(
  shown: number,
  maxSignificant: number,
  back: (text: string) => number,
  stored: number,
): string | null {
  if (shown === 0) return '0';
  for (let sig = 1; sig <= maxSignificant; sig++) {
    const text = plainNumber(shown, sig);
    if (text === '') return null;
    const error =
      stored !== 0
        ? Math.abs(back(text) - stored) / Math.abs(stored)
        : Math.abs(Number(text) - shown) / Math.abs(shown);
    if (error < 1e-12) return text;
  }
  return null;
}

/** Decimals the results show for this quantity in this unit (core/format.ts formatQuantity). */
function displayDecimals(
  stored: number,
  storedUnit: UnitId,
  displayUnit: UnitId,
  quantity: Quantity,
): number {
  const text = formatQuantity(toSI(stored, storedUnit), quantity, 'si', {
    unit: displayUnit,
    withUnit: false,
  });
  const dot = text.indexOf('.');
  return dot < 0 ? 0 : text.length - dot - 1;
}

/** A number for a box or a message: `significant` digits (core/format.ts), trailing zeros dropped. */
export function plainNumber(value: number, significant = 6): string {
  if (!Number.isFinite(value)) return '';
  return trimZeros(formatSignificant(value, significant));
}

function trimZeros(s: string): string {
  return s.includes('.') ? s.replace(/\.?0+$/, '') : s;
}

/**
 * Whether the box text still stands for the stored value. When it does, the box keeps what
 * the person typed (their digits, their comma); when the plan changed underneath it (undo,
 * unit switch, a suggestion applied) the box is refreshed.
 */
export function textShowsValue(
  text: string,
  stored: number,
  storedUnit: UnitId,
  displayUnit: UnitId,
  reading: TextReading = PLAIN_READING,
  offset_m = 0,
): boolean {
  const fromText = storedFromText(text, displayUnit, storedUnit, reading, offset_m);
  if (Number.isNaN(fromText) || Number.isNaN(stored))
    return Number.isNaN(fromText) && Number.isNaN(stored);
  const scale = Math.max(Math.abs(stored), Math.abs(fromText), Number.MIN_VALUE);
  return Math.abs(fromText - stored) / scale < 1e-9;
}
