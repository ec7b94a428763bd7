import { describe, expect, it } from 'vitest';
import { numberStyle, PLAIN_STYLE, readNumber } from '../../renderer/src/support/numberText.ts';
import { parseNumberText, storedFromText } from '../../renderer/src/support/fieldBinding.ts';
import { altitudeOfPressureAltitude, flightLevelOf } from '../../core/levels.ts';

// Decimal marks and thousands separators per locale come from the Unicode CLDR data behind
// Intl (ECMA-402): en-US "." and ",", de-DE "," and ".", fr-FR "," and a narrow space.
const en = numberStyle('en-US');
const de = numberStyle('de-DE');
const fr = numberStyle('fr-FR');
const ch = numberStyle('de-CH');

describe('locale marks (Intl, CLDR)', () => {
  it('come from Intl for the locale', () => {
    expect([en.decimal, en.group]).toEqual(['.', ',']);
    expect([de.decimal, de.group]).toEqual([',', '.']);
    expect(fr.decimal).toBe(',');
    expect(fr.group).toBe(' ');
    expect([ch.decimal, ch.group]).toEqual(['.', "'"]);
  });
});

describe('"1,500" and "1.500" in an English and a German locale', () => {
  it('English: "1,500" is read as 1500 by the locale rule, with a note saying so', () => {
    const r = readNumber('1,500', en);
    expect(r).toMatchObject({ ok: true, value: 1500 });
    expect(r.ok && r.note).toMatch(/read as 1500/);
  });

  it('English: "1.500" is one and a half by the locale rule, with a note saying so', () => {
    const r = readNumber('1.500', en);
    expect(r).toMatchObject({ ok: true, value: 1.5 });
    expect(r.ok && r.note).toMatch(/read as 1\.5 /);
  });

  it('German: "1,500" is one and a half by the locale rule, with a note saying so', () => {
    const r = readNumber('1,500', de);
    expect(r).toMatchObject({ ok: true, value: 1.5 });
    expect(r.ok && r.note).toMatch(/read as 1,5 /);
  });

  it('German: "1.500" is read as 1500 by the locale rule, with a note saying so', () => {
    const r = readNumber('1.500', de);
    expect(r).toMatchObject({ ok: true, value: 1500 });
    expect(r.ok && r.note).toMatch(/read as 1500/);
  });

  it('a mark that cannot be the locale reading is refused with the rule, never guessed', () => {
    // en: "," groups thousands, so "1,5" and "12,50" are no number; de: the same for ".".
    for (const [text, style] of [
      ['1,5', en],
      ['12,50', en],
      ['1.5', de],
      ['0.028', de],
      ['1.5', fr],
      ['0,500', en],
      ['1,500.25.1', en],
      ['1.000,5,5', de],
    ] as const) {
      const r = readNumber(text, style);
      expect(r.ok, `${text} in ${style.locale}`).toBe(false);
      if (!r.ok) expect(r.message).toMatch(/decimal mark is/);
    }
    const r = readNumber('1,5', en);
    expect(!r.ok && r.message).toBe(
      '"1,5": in American English numbers the decimal mark is "." and "," separates thousands',
    );
  });

  it('reads full groupings, spaces and the locale decimal mark without notes', () => {
    expect(readNumber('12,000', en)).toMatchObject({ ok: true, value: 12000 });
    expect(readNumber('1,234,567.25', en)).toEqual({ ok: true, value: 1234567.25 });
    expect(readNumber('1.234.567,25', de)).toEqual({ ok: true, value: 1234567.25 });
    expect(readNumber('29,92', de)).toEqual({ ok: true, value: 29.92 });
    expect(readNumber('0.028', en)).toEqual({ ok: true, value: 0.028 });
    expect(readNumber('0,028', de)).toEqual({ ok: true, value: 0.028 });
    expect(readNumber('12 000,5', fr)).toEqual({ ok: true, value: 12000.5 });
    expect(readNumber("12'000.5", ch)).toEqual({ ok: true, value: 12000.5 });
    expect(readNumber('−5', en)).toEqual({ ok: true, value: -5 });
    expect(readNumber('2,5e3', de)).toEqual({ ok: true, value: 2500 });
    // Indian grouping (lakh) as Intl writes it for en-IN.
    expect(readNumber('12,34,567', numberStyle('en-IN'))).toMatchObject({
      ok: true,
      value: 1234567,
    });
  });

  it('refuses half-typed and foreign text with a message, never NaN', () => {
    for (const t of ['', ' ', '-', '.', '1e', 'abc', '12a', '1,,000']) {
      const r = readNumber(t, en);
      expect(r.ok, t).toBe(false);
      if (!r.ok) expect(r.message.length).toBeGreaterThan(0);
    }
    expect(Number.isNaN(storedFromText('1,5', 'm', 'm', { style: en }))).toBe(true);
  });

  it('without a locale (files, pasted tables) only "." is a decimal mark', () => {
    expect(readNumber('1.5', PLAIN_STYLE)).toEqual({ ok: true, value: 1.5 });
    expect(readNumber('1,5', PLAIN_STYLE).ok).toBe(false);
    expect(readNumber('1,500', PLAIN_STYLE).ok).toBe(false);
  });
});

describe('flight levels in altitude boxes', () => {
  // FL350 = 35 000 ft pressure altitude (ICAO Annex 2 and Doc 8168, common practice);
  // 35 000 ft = 10 668 m exactly (NIST SP 811: ft = 0.3048 m). With the standard setting
  // (1013.25 hPa, ICAO) the altitude above MSL is the pressure altitude itself.
  const standard = { transitionAltitude_m: 18_000 * 0.3048, qnh_Pa: 101_325 };
  const altitude = { style: en, flightLevels: standard };

  it('accepts "FL350" above the transition altitude as 35 000 ft pressure altitude', () => {
    const r = parseNumberText('FL350', altitude);
    expect(r.ok && r.unit).toBe('m');
    expect(r.ok && r.value).toBeCloseTo(10_668, 6);
    expect(parseNumberText('fl 350', altitude).ok).toBe(true);
    expect(storedFromText('FL350', 'ft', 'm', altitude)).toBeCloseTo(10_668, 6);
  });

  it('with another QNH the altitude is the one the screen shows as that level (core/levels.ts)', () => {
    // core/levels.ts is checked against ICAO pressure altitude in test/core/levels.test.ts.
    const rule = { transitionAltitude_m: 5000 * 0.3048, qnh_Pa: 103_000 };
    const stored = storedFromText('FL120', 'm', 'm', { style: en, flightLevels: rule });
    expect(flightLevelOf(stored, rule)).toBe(120);
    expect(stored).toBeCloseTo(altitudeOfPressureAltitude(12_000 * 0.3048, 103_000), 9);
  });

  it('refuses a level at or below the transition altitude, and levels in other boxes', () => {
    const low = parseNumberText('FL180', altitude);
    expect(low.ok).toBe(false);
    if (!low.ok) expect(low.message).toMatch(/transition altitude \(18000 ft\)/);
    // A European transition altitude of 5000 ft (common practice) allows FL60.
    const europe = {
      style: en,
      flightLevels: { ...standard, transitionAltitude_m: 5000 * 0.3048 },
    };
    expect(parseNumberText('FL60', europe)).toMatchObject({ ok: true });
    expect(parseNumberText('FL350', { style: en }).ok).toBe(false);
    expect(parseNumberText('FL3500', altitude).ok).toBe(false);
    expect(parseNumberText('FL', altitude).ok).toBe(false);
  });
});
