/**
 * Between what a person types in a number box and the SI value in the plan.
 * The plan holds the value in its stored unit (the unit named in its key); the box shows
 * it in the display unit of the chosen unit system. Text that does not parse is kept in
 * the box and becomes NaN in the plan, so the plan check names the field and the result
 * goes stale instead of the keystroke being thrown away.
 */
import {
  formatNumber,
  formatQuantity,
  formatSignificant,
  significantDecimals,
} from '../../../core/format.ts';
import { convert, toSI, type Quantity, type UnitId } from '../../../core/units.ts';

export type FieldParse = { ok: true; value: number } | { ok: false; message: string };

const NUMBER_TEXT = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/**
 * Reads a typed number: spaces and thin spaces are ignored, a lone comma counts as the
 * decimal point (common in much of Europe), anything else must be a plain decimal number.
 */
export function parseNumberText(text: string): FieldParse {
  let t = text.replace(/[\s\u202f\u00a0]/g, '');
  if (t === '') return { ok: false, message: 'enter a number' };
  if (!t.includes('.') && /^[+-]?\d*,\d+$/.test(t)) t = t.replace(',', '.');
  if (!NUMBER_TEXT.test(t)) return { ok: false, message: `"${text.trim()}" is not a number` };
  const value = Number(t);
  if (!Number.isFinite(value)) return { ok: false, message: 'number too large' };
  return { ok: true, value };
}

/** Typed text in `displayUnit` → value in `storedUnit`; NaN when the text is not a number. */
export function storedFromText(text: string, displayUnit: UnitId, storedUnit: UnitId): number {
  const parsed = parseNumberText(text);
  if (!parsed.ok) return Number.NaN;
  return convert(parsed.value, displayUnit, storedUnit);
}

/**
 * The text an input box shows for a stored value. A value the box can show exactly in at
 * most 6 significant digits (4500 m, 1013.25 hPa, 80 %) is shown exactly. Anything else is a
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
): string {
  if (!Number.isFinite(stored)) return '';
  const shown = convert(stored, storedUnit, displayUnit);
  const exact = exactText(shown, 6);
  if (exact !== null) return exact;
  if (typeof quantityOrSignificant === 'number') return plainNumber(shown, quantityOrSignificant);
  if (quantityOrSignificant === null) return plainNumber(shown, 5);
  // At least 3 significant digits, but at most one place finer than the results show.
  const display = displayDecimals(stored, storedUnit, displayUnit, quantityOrSignificant);
  const decimals = Math.min(Math.max(display, significantDecimals(shown, 3)), display + 1);
  return trimZeros(formatNumber(shown, decimals));
}

/** The shortest text of at most `maxSignificant` digits that stands for `value` exactly, or null. */
function exactText(value: number, maxSignificant: number): string | null {
  for (let sig = 1; sig <= maxSignificant; sig++) {
    const text = plainNumber(value, sig);
    const back = Number(text);
    const scale = Math.max(Math.abs(value), Number.MIN_VALUE);
    if (Math.abs(back - value) / scale < 1e-9) return text;
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
): boolean {
  const fromText = storedFromText(text, displayUnit, storedUnit);
  if (Number.isNaN(fromText) || Number.isNaN(stored))
    return Number.isNaN(fromText) && Number.isNaN(stored);
  const scale = Math.max(Math.abs(stored), Math.abs(fromText), Number.MIN_VALUE);
  return Math.abs(fromText - stored) / scale < 1e-9;
}
