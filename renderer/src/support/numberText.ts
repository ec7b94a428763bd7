/**
 * Numbers as a person types them, in their locale — never guessed.
 *
 * The decimal mark and the thousands separator come from Intl (ECMA-402
 * NumberFormat.formatToParts) for the locale the person chose (or the browser's). A mark the
 * locale does not use is refused with a message naming the locale's marks; a grouping that
 * is not the locale's (en "1,5") is refused the same way. Text that a reader from another
 * locale would read differently ("1,500" or "1.500": one mark, then exactly three digits) is
 * read by the locale's rule and comes with a note saying how it was read, so it is never
 * silently 1.5 where 1500 was meant, nor the other way round.
 *
 * Flight levels ("FL350" = 35 000 ft pressure altitude, ICAO Annex 2 / Doc 8168; common
 * practice) are read where the caller allows them; the caller turns the level into an
 * altitude with the plan's QNH and accepts it only above the transition altitude
 * (renderer/src/support/fieldBinding.ts, core/levels.ts).
 *
 * Files and the CLI never come here: they are locale-free JSON numbers.
 */
export interface NumberStyle {
  /** BCP 47 tag the marks come from. */
  readonly locale: string;
  /** Locale's name for messages ("German (Germany)"). */
  readonly name: string;
  readonly decimal: string;
  /** Thousands separator; '' when the style has none. */
  readonly group: string;
}

/** Locale-free: '.' decimal mark, no thousands separator (pasted tables, files). */
export const PLAIN_STYLE: NumberStyle = { locale: 'und', name: 'plain', decimal: '.', group: '' };

const SPACES = /[\s\u00a0\u202f\u2009]/g;

/** The decimal mark and thousands separator of `locale` (Intl); the plain style if unknown. */
export function numberStyle(locale: string): NumberStyle {
  try {
    const parts = new Intl.NumberFormat(locale).formatToParts(1234567.5);
    const decimal = parts.find((p) => p.type === 'decimal')?.value ?? '.';
    const group = parts.find((p) => p.type === 'group')?.value ?? '';
    const tag = Intl.NumberFormat.supportedLocalesOf([locale])[0] ?? locale;
    let name = tag;
    try {
      name = new Intl.DisplayNames(['en'], { type: 'language' }).of(tag) ?? tag;
    } catch {
      // A runtime without display names: the tag itself names the locale.
    }
    return { locale: tag, name, decimal, group: group.replace(SPACES, ' ') };
  } catch {
    return PLAIN_STYLE;
  }
}

export type NumberReading =
  | {
      ok: true;
      value: number;
      /** How ambiguous text was read, to show beside the field. */
      note?: string;
      /** Set when the text carried its own unit: a flight level (hundreds of feet of pressure altitude). */
      unit?: 'FL';
    }
  | { ok: false; message: string };

export interface ReadOptions {
  /** Accept "FL350" (the caller turns the level into an altitude and checks the transition). */
  flightLevels?: boolean;
}

const q = (s: string) => `"${s === ' ' ? 'space' : s}"`;

/** How the marks of a style read in words, for messages. */
export function marksInWords(style: NumberStyle): string {
  const group = style.group === '' ? '' : ` and ${q(style.group)} separates thousands`;
  return `in ${style.name} numbers the decimal mark is ${q(style.decimal)}${group}`;
}

/** A number in the style's decimal mark, no grouping (what an input box shows). */
export function localNumber(text: string, style: NumberStyle): string {
  return style.decimal === '.' ? text : text.replace('.', style.decimal);
}

function readFlightLevel(t: string, allowed: boolean): NumberReading | null {
  const m = /^FL(\d*)$/i.exec(t);
  if (!m) return null;
  if (!allowed) return { ok: false, message: 'flight levels are not used here' };
  const digits = m[1] ?? '';
  if (!/^\d{1,3}$/.test(digits)) {
    return { ok: false, message: 'a flight level is FL and up to 3 digits, as FL350' };
  }
  return { ok: true, value: Number(digits), unit: 'FL' };
}

/** Whether `intPart` is grouped the way the locale groups (Intl), or in plain threes. */
function groupedLikeLocale(intPart: string, style: NumberStyle): boolean {
  const g = style.group.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
  if (new RegExp(`^\\d{1,3}(${g}\\d{3})+$`).test(intPart)) return true;
  try {
    const digits = intPart.split(style.group).join('');
    const f = new Intl.NumberFormat(style.locale, { maximumFractionDigits: 0 });
    return f.format(BigInt(digits)).replace(SPACES, ' ') === intPart;
  } catch {
    return false;
  }
}

/** Reads typed text by the rule of `style`; refuses what that rule does not allow. */
export function readNumber(
  text: string,
  style: NumberStyle,
  options: ReadOptions = {},
): NumberReading {
  const shown = text.trim();
  if (shown === '') return { ok: false, message: 'enter a number' };
  const compact = shown.replace(SPACES, '');
  const fl = readFlightLevel(compact, options.flightLevels === true);
  if (fl) return fl;
  // Spaces group digits in many locales and are never a decimal mark: they are skipped.
  const group = style.group === ' ' ? '' : style.group;
  const t = compact.replace(/\u2212/g, '-');
  const notNumber = { ok: false as const, message: `"${shown}" is not a number` };
  const m = /^([+-]?)([^eE]*)(?:[eE]([+-]?\d+))?$/.exec(t);
  if (!m) return notNumber;
  const [, sign = '', mantissa = '', exponent] = m;
  for (const ch of mantissa) {
    if (/\d/.test(ch) || ch === style.decimal || ch === group) continue;
    if (/[.,'’٫]/.test(ch)) return { ok: false, message: `"${shown}": ${marksInWords(style)}` };
    return notNumber;
  }
  const pieces = mantissa.split(style.decimal);
  if (pieces.length > 2) return { ok: false, message: `"${shown}": ${marksInWords(style)}` };
  const [intPart = '', fracPart = ''] = pieces;
  const hasDecimal = pieces.length === 2;
  if (group !== '' && fracPart.includes(group)) {
    return { ok: false, message: `"${shown}": ${marksInWords(style)}` };
  }
  const grouped = group !== '' && intPart.includes(group);
  if (grouped && (intPart.startsWith('0') || !groupedLikeLocale(intPart, style))) {
    return { ok: false, message: `"${shown}": ${marksInWords(style)}` };
  }
  const digits = grouped ? intPart.split(group).join('') : intPart;
  if (digits === '' && fracPart === '') return notNumber;
  const plain = `${sign}${digits === '' ? '0' : digits}${hasDecimal ? `.${fracPart || '0'}` : ''}`;
  const value = Number(exponent === undefined ? plain : `${plain}e${exponent}`);
  if (!Number.isFinite(value)) return { ok: false, message: 'number too large' };
  // One mark followed by exactly three digits reads differently in other locales: say how.
  let note: string | undefined;
  const groups = grouped ? intPart.split(group) : [];
  if (grouped && groups.length === 2 && !hasDecimal && exponent === undefined) {
    note = `read as ${sign}${digits} (${q(group)} separates thousands in ${style.name} numbers)`;
  } else if (
    !grouped &&
    hasDecimal &&
    fracPart.length === 3 &&
    /^[1-9]\d{0,2}$/.test(intPart) &&
    exponent === undefined
  ) {
    const read = localNumber(String(value), style);
    note = `read as ${read} (${q(style.decimal)} is the decimal mark in ${style.name} numbers)`;
  }
  return note === undefined ? { ok: true, value } : { ok: true, value, note };
}
