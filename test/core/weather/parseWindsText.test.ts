import { describe, expect, it } from 'vitest';
import { FT, KT } from '../../../core/units.ts';
import { parseWindsText } from '../../../core/weather/parseWindsText.ts';

function rel(x: number, ref: number): number {
  return Math.abs(x / ref - 1);
}

describe('parseWindsText', () => {
  it('reads `ft deg kt C`, turning temperatures into ISA offsets (1976 standard lapse −6.5 K/km)', () => {
    const r = parseWindsText(
      ['# winds aloft, pasted', 'ft deg kt C', '3000 360 20 8   # top', '1000 270 20 12', ''].join(
        '\n',
      ),
    );
    expect(r.ok).toBe(true);
    expect(r.issues).toEqual([]);
    const [low, high] = r.levels; // sorted by altitude
    expect(rel(low!.altitude_m, 1000 * FT)).toBeLessThan(1e-15); // ft = 0.3048 m exact (NIST SP 811)
    expect(low!.from_deg).toBe(270);
    expect(rel(low!.speed_m_s, 20 * KT)).toBeLessThan(1e-15); // kt = 1852/3600 m/s exact
    // ISA at 304.8 m: 288.15 − 0.0065·304.8 = 286.1688 K = 13.0188 °C; 12 °C is ISA − 1.0188 K
    expect(low!.isaOffset_K).toBeCloseTo(-1.0188, 9);
    // ISA at 914.4 m: 288.15 − 0.0065·914.4 = 282.2064 K = 9.0564 °C; 8 °C is ISA − 1.0564 K
    expect(high!.isaOffset_K).toBeCloseTo(-1.0564, 9);
  });

  it('reads `m deg m/s K` and named columns in any order (`dir spd_kt alt_ft temp_C`)', () => {
    const si = parseWindsText('m deg m/s K\n1000 180 5 290\n0 90 10 288.15');
    expect(si.ok).toBe(true);
    expect(si.levels[0]).toEqual({ altitude_m: 0, from_deg: 90, speed_m_s: 10, isaOffset_K: 0 });
    // 1976 standard Table I: 281.650 K at 1000 m, so 290 K is ISA + 8.35 K
    expect(si.levels[1]!.isaOffset_K).toBeCloseTo(8.35, 9);
    const named = parseWindsText('dir, spd_kt, alt_ft, temp_C\n250, 35, 9000, -3');
    expect(named.ok).toBe(true);
    expect(named.levels[0]!.from_deg).toBe(250);
    expect(rel(named.levels[0]!.altitude_m, 9000 * FT)).toBeLessThan(1e-15);
    const fl = parseWindsText('FL deg km/h\n100 200 54');
    expect(rel(fl.levels[0]!.altitude_m, 10000 * FT)).toBeLessThan(1e-15); // FL100 = 10 000 ft
    expect(rel(fl.levels[0]!.speed_m_s, 15)).toBeLessThan(1e-15); // 54 km/h = 15 m/s exact
  });

  it('lets a level leave out a last temperature (forecasts omit it near the ground)', () => {
    const r = parseWindsText('ft deg kt C\n3000 250 10\n6000 260 20 5');
    expect(r.ok).toBe(true);
    expect(r.levels[0]!.isaOffset_K).toBeUndefined();
    expect(r.levels[1]!.isaOffset_K).toBeDefined();
  });

  it('names the line, the column and the limit for each bad line, keeping the good ones', () => {
    const r = parseWindsText(
      [
        'alt_ft dir spd_kt temp_C',
        '1000 270 20 12',
        '2000 280 25', // ok: temperature is last
        '3000 290',
        'abc 300 10 5',
        '5000 400 10 0',
        '6000 300 500 0',
        '7000 300 10 -99',
        '1000 100 5 10',
      ].join('\n'),
    );
    expect(r.ok).toBe(false);
    expect(r.levels).toHaveLength(2);
    expect(r.issues.map((i) => i.line)).toEqual([4, 5, 6, 7, 8, 9]);
    const m = r.issues.map((i) => i.message);
    expect(m[0]).toBe('line 4: expected 4 values (alt_ft dir spd_kt temp_C), found 2');
    expect(m[1]).toBe("line 5, column 1 (altitude, ft): 'abc' is not a number");
    expect(m[2]).toBe(
      'line 6, column 2 (direction, deg): 400 is out of range; must be between 0 and 360 deg',
    );
    // 150 m/s limit in knots: 150/(1852/3600) = 291.58 kt (exact kt, NIST SP 811)
    expect(m[3]).toBe(
      'line 7, column 3 (speed, kt): 500 is out of range; must be between 0 and 291.58 kt',
    );
    // −99 °C = 174.15 K at 7000 ft, where ISA is 288.15 − 0.0065·2133.6 = 274.2816 K: offset −100.13 K
    expect(m[4]).toMatch(
      /^line 8, column 4 \(temperature, °C\): ISA-100\.1 K is out of range; .*between -80 and 60 K$/,
    );
    expect(m[5]).toBe('line 9: the altitude repeats line 2');
  });

  it('requires a header naming the units, and refuses unknown or mismatched units', () => {
    expect(parseWindsText('1000 270 20').issues[0]!.message).toMatch(/^line 1: expected a header/);
    expect(parseWindsText('# only\n\nalt dir spd').issues[0]!.message).toBe(
      "line 3, column 1: 'alt' needs a unit, e.g. 'alt_ft'",
    );
    expect(parseWindsText('alt_ft dir_kt spd').issues[0]!.message).toBe(
      "line 1, column 2: 'dir_kt': kt is not a unit of direction",
    );
    expect(parseWindsText('ft deg furlong').issues[0]!.message).toMatch(
      /column 3: 'furlong' names no known unit/,
    );
    expect(parseWindsText('ft deg').issues[0]!.message).toBe(
      'line 1: the header has no speed column',
    );
    expect(parseWindsText('ft m deg kt').issues[0]!.message).toMatch(/a second altitude column/);
    const empty = parseWindsText('# nothing here\n');
    expect(empty.ok).toBe(false);
    expect(empty.issues[0]!.message).toMatch(/no header/);
    expect(parseWindsText('ft deg kt').ok).toBe(false); // a header but no level
  });
});
