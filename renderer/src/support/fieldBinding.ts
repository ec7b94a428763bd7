/**
 * Between what a person types in a number box and the SI value in the plan.
 * The plan holds the value in its stored unit (the unit named in its key); the box shows
 * it in the display unit of the chosen unit system. Text that does not parse is kept in
 * the box and becomes NaN in the plan, so the plan check names the field and the result
 * goes stale instead of the keystroke being thrown away.
 */
import { formatSignificant } from '../../../core/format.ts';
import { convert, type UnitId } from '../../../core/units.ts';

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
 * The text an input box shows for a stored value: up to `significant` digits (5 keeps a
 * converted value like 4500 m = 14764 ft readable), no grouping, no trailing zeros, never
 * exponent notation for the magnitudes a plan holds. Typed values are stored exactly.
 */
export function editableText(
  stored: number,
  storedUnit: UnitId,
  displayUnit: UnitId,
  significant = 5,
): string {
  if (!Number.isFinite(stored)) return '';
  const shown = convert(stored, storedUnit, displayUnit);
  return plainNumber(shown, significant);
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
