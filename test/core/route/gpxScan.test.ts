/**
 * The one-pass GPX reader's own parts: well-formedness refusals named after XML 1.0
 * (W3C, 5th ed.: WFC "Element Type Match", "Unique Att Spec", production [10] AttValue,
 * [67] Reference, one root element, section 2.1), the quick decimal reader against
 * ECMAScript's Number() (correctly rounded by the language definition, ECMA-262
 * section 7.1.4.1.1), the O(n) id maker against the per-id search it replaces, and the
 * limits counted in points.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseGpx } from '../../../core/route/gpx.ts';
import { simpleDecimal, uniqueIds } from '../../../core/route/gpxPoints.ts';
import { uniqueId } from '../../../core/route/waypoints.ts';
import { loggerTrackGpx } from '../../support/gpxSynth.ts';

function firstIssue(text: string, limits = {}): string {
  const r = parseGpx(text, limits);
  if (r.ok) throw new Error('expected a refusal');
  return r.issues[0]?.message ?? '';
}

const rte = (inner: string) =>
  `<gpx version="1.1">\n<rte>\n<rtept lat="1" lon="1"/>\n${inner}\n</rte>\n</gpx>`;

describe('well-formed XML or a message with line and column', () => {
  it.each([
    [
      rte('<rtept lat="2" lon="2"><name>B</rtept>'),
      /line 4, column \d+\) .*end tag 'rtept' does not match the open element 'name' \(opened at line 4, column 24\)/,
    ],
    [
      rte('<rtept lat="2" lat="3" lon="2"/>'),
      /line 4, column 15\) .*attribute 'lat' is given twice/,
    ],
    [rte('<rtept lat=2 lon="2"/>'), /line 4, column 12\) .*value of 'lat' must be quoted/],
    [rte('<rtept lat="2" lon="<2"/>'), /line 4, column 21\) .*value of 'lon' contains '<'/],
    [
      rte('<rtept lat="2" lon="2"><name>A & B</name></rtept>'),
      /line 4, column 32\) .*'&' must start a reference/,
    ],
    ['<gpx version="1.1"/>\n<gpx/>', /line 2, column 1\) .*second root element/],
    ['junk <gpx/>', /line 1, column 1\) .*text outside the root element/],
    ['<gpx><rte>', /line 1, column 6\) .*element 'rte' is never closed/],
    ['<gpx><!-- open', /comment <!-- … is never closed/],
    ['', /no root element/],
  ])('%#: refused', (text, message) => {
    expect(firstIssue(text)).toMatch(/^gpx \(line \d+, column \d+\) is not well-formed XML: /);
    expect(firstIssue(text)).toMatch(message);
  });

  it('comments, CDATA, processing instructions and references are read', () => {
    const text =
      '<?xml version="1.0"?><!-- c --><gpx version="1.1"><wpt lat="1" lon="1"><name><![CDATA[A<B]]></name></wpt>' +
      '<wpt lat="&#50;" lon="2"><name>x &amp; y<!-- no -->z</name></wpt></gpx>';
    const r = parseGpx(text);
    expect(r.ok && r.route.waypoints.map((w) => [w.name, w.lat_deg])).toEqual([
      ['A<B', 1],
      ['x & yz', 2],
    ]);
  });
});

describe('parts', () => {
  it('simpleDecimal equals Number() to the last bit, or declines (NaN) (property)', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.nat(17), (x, d) => {
        const s = x.toFixed(Math.min(d, 20));
        const v = simpleDecimal(` ${s} `, 0, s.length + 2);
        if (!Number.isNaN(v)) expect(Object.is(v, Number(s))).toBe(true);
      }),
      { numRuns: 3000 },
    );
    expect(simpleDecimal('47.1234567', 0, 10)).toBe(47.1234567);
    expect(Number.isNaN(simpleDecimal('1e5', 0, 3))).toBe(true); // exponent: general path
    expect(Number.isNaN(simpleDecimal('1.2.3', 0, 5))).toBe(true);
  });

  it('uniqueIds gives what the repeated search gives (property)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.constantFrom('a', 'a.2', 'a.3', 'b', 'b.2', 'a.2.2'), { maxLength: 60 }),
        (bases) => {
          const taken = new Set<string>();
          const next = uniqueIds();
          for (const b of bases) expect(next(b)).toBe(uniqueId(b, taken));
        },
      ),
    );
  });
});

describe('limits in points, progress', () => {
  it('a 190 000-point logger file (19 MB, over the old 10 M-character cap) is read', () => {
    const text = loggerTrackGpx(190_000, 5, { climbBias: 0.5, stepScale: 0.2 });
    expect(text.length).toBeGreaterThan(10_000_000);
    const fractions: number[] = [];
    const r = parseGpx(text, { onProgress: (f) => fractions.push(f) });
    if (!r.ok) throw new Error(r.issues[0]?.message);
    expect(r.route.waypoints.length).toBeLessThanOrEqual(100);
    expect(r.warnings.join('\n')).toMatch(/the 190000 track points are used as a route/);
    expect(fractions.length).toBeGreaterThan(10);
    expect(
      fractions.every((f, i) => f > 0 && f < 1 && (i === 0 || f > (fractions[i - 1] as number))),
    ).toBe(true);
  });

  it('more track points than the limit are refused by count', () => {
    expect(firstIssue(loggerTrackGpx(1200), { maxTrackPoints: 1000 })).toBe(
      'gpx > trk[0] has 1200 points; at most 1000 are read',
    );
  });
});
