/**
 * Strict loading: what the loader refuses that JSON.parse would let through, each with its
 * message. Sources: IETF RFC 8259 (section 4: object names SHOULD be unique; section 8.1:
 * JSON text exchanged between systems SHALL be UTF-8, a parser MAY ignore a byte-order
 * mark); the Unicode Standard 15.0, section 3.9 table 3-7 (well-formed UTF-8 byte sequences)
 * and section 23.8 (byte-order marks: EF BB BF, FE FF, FF FE, 00 00 FE FF, FF FE 00 00).
 */
import { describe, expect, it } from 'vitest';
import { decodePlanBytes } from '../../../core/plan/decode.ts';
import { duplicateKey, excerptAt } from '../../../core/plan/jsonError.ts';
import { parsePlanBytes, parsePlanText } from '../../../core/plan/load.ts';
import type { LoadResult } from '../../../core/plan/load.ts';
import { demoJson, demoText, setAt } from './demoPlans.ts';

const TEXT = demoText('piston-tourer.json');
const utf8 = (s: string) => new TextEncoder().encode(s);

function messages(r: LoadResult): string[] {
  if (r.ok) throw new Error('expected a refusal');
  return r.issues.map((i) => i.message);
}

function utf16(s: string, bigEndian: boolean, bom: boolean): Uint8Array {
  const out = new Uint8Array((s.length + (bom ? 1 : 0)) * 2);
  let k = 0;
  const put = (u: number) => {
    out[k++] = bigEndian ? u >> 8 : u & 0xff;
    out[k++] = bigEndian ? u & 0xff : u >> 8;
  };
  if (bom) put(0xfeff);
  for (let i = 0; i < s.length; i++) put(s.charCodeAt(i));
  return out;
}

describe('duplicate keys (RFC 8259 section 4)', () => {
  it('names the member, both places, and why', () => {
    const text = TEXT.replace('"CD0": ', '"CD0": 0.5,\n      "CD0": ');
    expect(messages(parsePlanText(text))).toEqual([
      expect.stringMatching(
        /^aircraft\.polar\.CD0: given twice \(line \d+, column \d+ and line \d+, column \d+\) — each key may appear once, so it is clear which value counts$/,
      ),
    ]);
  });

  it('compares keys after unescaping, inside arrays too', () => {
    expect(duplicateKey('{"legs":[{"id":"a"},{"id":"b","\\u0069d":"c"}]}')).toMatchObject({
      path: 'legs.1.id',
    });
    expect(duplicateKey('[{},"",{"a":1},{"a":2}]')).toBeUndefined();
    expect(duplicateKey('{"a":{"a":{"a":1}},"b":[1,2,{"a":0}]}')).toBeUndefined();
    expect(duplicateKey('{"a\\"b":1,"a\\"b":2}')).toMatchObject({
      path: 'a"b',
      first: 1,
      again: 10,
    });
  });
});

describe('encodings (RFC 8259 section 8.1, Unicode section 3.9 and 23.8)', () => {
  it('UTF-8 with or without a byte-order mark loads', () => {
    expect(parsePlanBytes(utf8(TEXT)).ok).toBe(true);
    const bom = new Uint8Array([0xef, 0xbb, 0xbf, ...utf8(TEXT)]);
    expect(parsePlanBytes(bom).ok).toBe(true);
    // Non-ASCII text decodes to the same characters (é U+00E9, 😀 U+1F600, ‰ U+2030).
    const r = decodePlanBytes(utf8('{"name": "é 😀 ‰"}'));
    expect(r).toEqual({ ok: true, text: '{"name": "é 😀 ‰"}' });
  });

  it.each([
    [true, true, 'UTF-16 (big-endian)'],
    [false, true, 'UTF-16 (little-endian)'],
    [true, false, 'UTF-16 (big-endian, no byte-order mark)'],
    [false, false, 'UTF-16 (little-endian, no byte-order mark)'],
  ])('UTF-16 (big-endian %s, mark %s) is refused as %s', (be, bom, name) => {
    expect(messages(parsePlanBytes(utf16(TEXT, be, bom)))).toEqual([
      `file: the file is ${name} text; plan files are UTF-8 (RFC 8259) — save it as UTF-8 and open it again`,
    ]);
  });

  it('UTF-32 marks are refused by name', () => {
    const be = new Uint8Array([0, 0, 0xfe, 0xff, 0, 0, 0, 0x7b]);
    const le = new Uint8Array([0xff, 0xfe, 0, 0, 0x7b, 0, 0, 0]);
    expect(messages(parsePlanBytes(be))[0]).toContain('UTF-32 (big-endian)');
    expect(messages(parsePlanBytes(le))[0]).toContain('UTF-32 (little-endian)');
  });

  it.each([
    ['a Latin-1 é (0xE9 then a space)', [0xe9, 0x20], '0xE9'],
    ['a lone continuation byte', [0x80], '0x80'],
    ['an overlong "/" (C0 AF)', [0xc0, 0xaf], '0xC0'],
    ['an encoded surrogate (ED A0 80)', [0xed, 0xa0, 0x80], '0xED'],
    ['a code point above U+10FFFF (F4 90 80 80)', [0xf4, 0x90, 0x80, 0x80], '0xF4'],
    ['a sequence cut short at the end', [0xe2, 0x82], '0xE2'],
  ])('%s is refused with line and column, never turned into U+FFFD', (_, bad, hex) => {
    const head = utf8('{\n  "name": "ab');
    const bytes = new Uint8Array([...head, ...bad, ...utf8('"}')]);
    expect(messages(parsePlanBytes(bytes))).toEqual([
      `file: byte ${hex} at line 2, column 14 is not UTF-8 text; plan files are UTF-8 (RFC 8259) — save it as UTF-8 and open it again`,
    ]);
  });
});

describe('syntax messages quote a short excerpt, never raw newlines', () => {
  it('a broken file: line, column, reason and at most 32 characters of that line', () => {
    const broken = TEXT.replace('"payload_kg": 270', '"payload_kg": 270 270');
    const [m] = messages(parsePlanText(broken));
    // The line that holds payload_kg in the example (counted, so edits to the example keep it).
    const line = TEXT.slice(0, TEXT.indexOf('"payload_kg"')).split('\n').length;
    expect(m).toMatch(
      new RegExp(`^file: not valid JSON at line ${line}, column \\d+ \\(.+\\) near: …?.{1,32}…?$`),
    );
    expect(m).not.toMatch(/[\n\r]/);
    expect(m).toContain('270 270');
  });

  it('control characters are shown as escapes', () => {
    const [m] = messages(parsePlanText('{"name": "a\u0001b"}'));
    expect([...(m ?? '')].every((ch) => ch.charCodeAt(0) >= 0x20)).toBe(true);
    expect(m).toContain('\\u0001');
    expect(excerptAt('x\r\ny', 0)).toBe('x');
    expect(excerptAt('a'.repeat(100), 50)).toBe(`…${'a'.repeat(32)}…`);
  });
});

describe('bounds the physics needs, with the reason in the message', () => {
  // Each value used to pass the schema and break the solver (an infinite induced-drag
  // factor, a mass that became NaN); k = 1/(π·e·AR) is the definition of the induced-drag
  // factor (Anderson, Introduction to Flight, ch. 6), 20 ft/min = 0.1016 m/s (exact ft).
  const refused = (path: string, value: unknown) => {
    const data = demoJson('piston-tourer.json');
    setAt(data, path, value);
    return messages(parsePlanText(JSON.stringify(data)));
  };

  it('Oswald efficiency 5e-324', () => {
    expect(refused('aircraft.polar.induced.e', 5e-324)).toEqual([
      'aircraft.polar.induced.e: 5e-324 — must be from 0.3 to 1 — an Oswald efficiency below 0.3 describes no real wing and makes the induced drag k = 1/(π·e·AR) grow without bound',
    ]);
  });

  it('an induced-drag factor below what e ≤ 1 and AR ≤ 60 allow', () => {
    expect(refused('aircraft.polar.induced', { by: 'factor', k: 1e-6 })).toEqual([
      'aircraft.polar.induced.k: 0.000001 — must be from 0.005 to 1 — k = 1/(π·e·AR) is at least 0.0053 for e ≤ 1 and AR ≤ 60; a smaller k means a wing with almost no induced drag',
    ]);
    // 1/(π·1·60) = 0.00530…: the lowest k the geometry form can give is accepted as a factor.
    const data = demoJson('piston-tourer.json');
    setAt(data, 'aircraft.polar.induced', { by: 'factor', k: 1 / (Math.PI * 60) });
    expect(parsePlanText(JSON.stringify(data)).ok).toBe(true);
  });

  it('a descent rate of 1e-300 m/s', () => {
    const data = demoJson('piston-tourer.json');
    const legs = data.legs as { kind: string; mode?: { by: string } }[];
    const i = legs.findIndex((l) => l.kind === 'descent' && l.mode?.by === 'rate');
    expect(i).toBeGreaterThan(0);
    expect(refused(`legs.${i}.mode.rate_m_s`, 1e-300)).toEqual([
      `legs.${i}.mode.rate_m_s: 1e-300 — must be from 0.1 to 50 m/s — a slower descent (under 20 ft/min) takes hours per 1000 m and is not a descent the mission can be planned with`,
    ]);
  });
});
