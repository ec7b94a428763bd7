import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseGpx, writeGpx, type GpxParseResult } from '../../../core/route/gpx.ts';
import { routeLegs, type Waypoint } from '../../../core/route/waypoints.ts';

function fixture(name: string): string {
  return readFileSync(new URL(`../../fixtures/gpx/${name}`, import.meta.url), 'utf8');
}

function ok(r: GpxParseResult) {
  if (!r.ok) throw new Error(`expected a route, got ${JSON.stringify(r.issues)}`);
  return r;
}

function issues(r: GpxParseResult) {
  if (r.ok) throw new Error('expected issues, got a route');
  return r.issues;
}

describe('parseGpx, GPX 1.1 reading (topografix.com/GPX/1/1)', () => {
  it('reads the first rte: lat/lon, name, ele, magvar, entities and character references', () => {
    const r = ok(parseGpx(fixture('route.gpx')));
    expect(r.route.name).toBe('Coast & Hills');
    expect(r.route.waypoints).toEqual([
      {
        id: 'wp1',
        name: 'Start <field>',
        lat_deg: 47.25,
        lon_deg: 8.5,
        altitude_m: 420,
        magneticVariation_deg: 3.5,
      },
      { id: 'wp2', name: 'Ridge → north', lat_deg: 47.4, lon_deg: 8.9, altitude_m: 610.5 },
      // magvar 357 read as 3° west (GPX gives 0 ≤ magvar < 360; above 180 is west, our convention)
      { id: 'wp3', name: 'Lake', lat_deg: 47.1, lon_deg: 9.2, magneticVariation_deg: -3 },
    ]);
    expect(r.warnings.join('\n')).toMatch(/2 routes; only the first is read/);
  });

  it('falls back to the wpt list in file order, naming unnamed points', () => {
    const r = ok(parseGpx(fixture('waypoints.gpx')));
    expect(r.route.name).toBe('Survey points'); // from metadata/name
    expect(r.route.waypoints.map((w) => w.name)).toEqual(['Alpha', 'Bravo', 'WP3']);
    expect(r.route.waypoints[2]).toMatchObject({ lat_deg: -34, lon_deg: 151.15 });
    expect(r.warnings).toEqual([]);
  });

  it('uses a track as a route: repeats dropped, thinned evenly to 100 points with a warning', () => {
    const r = ok(parseGpx(fixture('track.gpx')));
    const w = r.route.waypoints;
    expect(r.route.name).toBe('Recorded flight');
    expect(w.length).toBeLessThanOrEqual(100);
    expect(w.length).toBeGreaterThanOrEqual(90);
    expect(w[0]).toMatchObject({ lat_deg: 60, lon_deg: 10, altitude_m: 100 });
    expect(w[w.length - 1]).toMatchObject({ lat_deg: 60.15, lon_deg: 10.3 });
    expect(r.warnings.join('\n')).toMatch(/303 track points are used as a route, thinned to \d+/);
    // Even spacing: no leg longer than the target spacing plus one track step (~111 m here;
    // 0.001° of latitude ≈ 111 m, common knowledge of the ellipsoid).
    const legs = routeLegs(w);
    const total = legs.reduce((s, l) => s + l.distance_m, 0);
    for (const leg of legs) expect(leg.distance_m).toBeLessThan(total / 99 + 120);
  });

  it('keeps every distinct track point when the track is short enough', () => {
    const r = ok(parseGpx(fixture('track.gpx'), { trackRoutePoints: 1000 }));
    expect(r.route.waypoints).toHaveLength(301); // 303 minus the 2 repeats of the first point
    expect(r.warnings.join('\n')).toMatch(/303 track points are used as a route, 301 points/);
  });

  it('reads our own extension id back, whatever prefix the file binds to our namespace', () => {
    const text = `<gpx version="1.1" xmlns:q="https://legwise.invalid/gpx/1"><rte>
      <rtept lat="1" lon="2"><extensions><q:id>north-gate</q:id></extensions></rtept>
      <rtept lat="1.5" lon="2"><extensions><other:id xmlns:other="x">nope</other:id></extensions></rtept>
    </rte></gpx>`;
    expect(ok(parseGpx(text)).route.waypoints.map((w) => w.id)).toEqual(['north-gate', 'wp2']);
  });
});

describe('parseGpx, refusals name the element and line', () => {
  it('malformed XML: an unclosed tag, with line and column from the validator', () => {
    const [i] = issues(parseGpx(fixture('unclosed-tag.gpx')));
    expect(i!.line).toBe(5);
    expect(i!.message).toMatch(/^gpx \(line 5, column \d+\) is not well-formed XML: .*'name'/);
  });

  it('a latitude out of range: the element index, its line and the value', () => {
    const [i] = issues(parseGpx(fixture('bad-lat.gpx')));
    expect(i).toMatchObject({ path: 'gpx > rte[0] > rtept[3]', line: 7 });
    expect(i!.message).toBe(
      'gpx > rte[0] > rtept[3] (line 7) lat "97.3" is out of range; must be between -90 and 90 deg',
    );
  });

  it('a missing longitude and a value that is not a number', () => {
    const [i] = issues(parseGpx(fixture('missing-lon.gpx')));
    expect(i).toMatchObject({ path: 'gpx > wpt[1]', line: 4 });
    expect(i!.message).toMatch(/has no lon; must be between -180 and 180/);
    const bad = issues(
      parseGpx('<gpx><wpt lat="1" lon="east"/><wpt lat="NaN" lon="1e999"/></gpx>'),
    );
    expect(bad.map((x) => x.message)).toEqual([
      'gpx > wpt[0] (line 1) lon "east" is not a decimal number; must be between -180 and 180 deg',
      'gpx > wpt[1] (line 1) lat "NaN" is not a decimal number; must be between -90 and 90 deg',
      'gpx > wpt[1] (line 1) lon "1e999" is out of range; must be between -180 and 180 deg',
    ]);
  });

  it('a DOCTYPE with nested entities ("billion laughs") is refused before any expansion', () => {
    const [i] = issues(parseGpx(fixture('entity-expansion.gpx')));
    expect(i).toMatchObject({ path: 'gpx', line: 2 });
    expect(i!.message).toMatch(/<!DOCTYPE declaration; .*refused/);
  });

  it('6 000 route points exceed the 5 000-point limit', () => {
    const pts = Array.from(
      { length: 6000 },
      (_, k) => `<rtept lat="${(k % 800) / 10}" lon="${k / 100}"/>`,
    );
    const [i] = issues(parseGpx(`<gpx version="1.1"><rte>${pts.join('\n')}</rte></gpx>`));
    expect(i!.message).toBe('gpx > rte[0] > rtept has 6000 points; at most 5000 are read');
  });

  it('oversized text, a foreign root, fewer than 2 points, empty and non-text input', () => {
    expect(issues(parseGpx('<gpx/>'.padEnd(101, ' '), { maxChars: 100 }))[0]!.message).toMatch(
      /101 characters long; at most 100/,
    );
    expect(issues(parseGpx('<kml><wpt lat="1" lon="1"/></kml>'))[0]!.message).toMatch(/<gpx> root/);
    expect(issues(parseGpx('<gpx><wpt lat="1" lon="1"/></gpx>'))[0]!.message).toMatch(
      /at least 2 points/,
    );
    expect(issues(parseGpx(''))[0]!.message).toMatch(/not well-formed/);
    expect(issues(parseGpx(42 as unknown as string))[0]!.message).toBe('gpx is not text');
  });
});

// Printable names without leading/trailing white space (GPX readers trim element text).
const name = fc
  .string({ unit: 'grapheme', minLength: 1, maxLength: 24 })
  .map((s) => s.replace(/[\p{Cc}\ufffe\uffff]/gu, 'x').trim())
  .filter((s) => s.length > 0);
const waypointArb = fc.record(
  {
    name,
    lat_deg: fc.double({ min: -90, max: 90, noNaN: true }),
    lon_deg: fc.double({ min: -180, max: 180, noNaN: true }),
    altitude_m: fc.double({ min: -1000, max: 30000, noNaN: true }),
    magneticVariation_deg: fc.double({ min: -179.999, max: 180, noNaN: true }),
  },
  { requiredKeys: ['name', 'lat_deg', 'lon_deg'] },
);

describe('writeGpx', () => {
  it('round trip: parseGpx(writeGpx(route)) gives the same waypoints to 1e-9 deg (property)', () => {
    fc.assert(
      fc.property(
        name,
        fc.array(waypointArb, { minLength: 2, maxLength: 12 }),
        (routeName, raw) => {
          const waypoints: Waypoint[] = raw.map((w, i) => ({ ...w, id: `id-${i}&<"'>` }));
          const estimates = waypoints.map((_, i) => ({
            eta_s: i * 600,
            remaining: 50 - i,
            remainingUnit: 'kg' as const,
          }));
          const r = ok(parseGpx(writeGpx({ name: routeName, waypoints }, estimates)));
          expect(r.route.name).toBe(routeName);
          expect(r.warnings).toEqual([]);
          expect(r.route.waypoints).toHaveLength(waypoints.length);
          r.route.waypoints.forEach((got, i) => {
            const want = waypoints[i]!;
            expect(got.id).toBe(want.id);
            expect(got.name).toBe(want.name);
            expect(Math.abs(got.lat_deg - want.lat_deg)).toBeLessThanOrEqual(1e-9);
            expect(Math.abs(got.lon_deg - want.lon_deg)).toBeLessThanOrEqual(1e-9);
            if (want.altitude_m === undefined) expect(got.altitude_m).toBeUndefined();
            else expect(Math.abs(got.altitude_m! - want.altitude_m)).toBeLessThanOrEqual(1e-9);
            if (want.magneticVariation_deg === undefined)
              expect(got.magneticVariation_deg).toBeUndefined();
            else
              expect(
                Math.abs(got.magneticVariation_deg! - want.magneticVariation_deg),
              ).toBeLessThan(1e-9);
          });
        },
      ),
      { numRuns: 300 },
    );
  });

  it('writes GPX 1.1 with rte/rtept, escaped names and the estimates in our namespace', () => {
    const text = writeGpx(
      {
        name: 'A & B <test>',
        waypoints: [
          { id: 'a', name: 'Fuel "stop"', lat_deg: 1e-7, lon_deg: -2.5 },
          {
            id: 'b',
            name: "O'Hare",
            lat_deg: 3,
            lon_deg: 4,
            altitude_m: 200,
            magneticVariation_deg: -4,
          },
        ],
      },
      [
        { eta_s: 0, remaining: 3.6e6, remainingUnit: 'J' },
        { eta_s: 1800.5, remaining: 1.2e6, remainingUnit: 'J' },
      ],
      { creator: 'Legwise test', description: 'Estimates for planning only' },
    );
    expect(text).toMatch(
      /^<\?xml version="1.0" encoding="UTF-8"\?>\n<gpx version="1.1" creator="Legwise test" xmlns="http:\/\/www.topografix.com\/GPX\/1\/1" xmlns:lw="https:\/\/legwise.invalid\/gpx\/1">/,
    );
    expect(text).toContain('<name>A &amp; B &lt;test&gt;</name>');
    expect(text).toContain('<name>Fuel &quot;stop&quot;</name>');
    expect(text).toContain('<name>O&apos;Hare</name>');
    expect(text).toContain('<rtept lat="0.0000001" lon="-2.5">'); // xsd:decimal has no exponent
    expect(text).toContain('<magvar>356</magvar>'); // 4° W as 0 ≤ v < 360
    expect(text).toContain('<lw:eta_s>1800.5</lw:eta_s>');
    expect(text).toContain('<lw:energy_J>1200000</lw:energy_J>');
    expect(text).toContain('<desc>Estimates for planning only</desc>');
    // GPX 1.1 wptType order: ele, magvar, name, extensions
    const b = text.slice(text.indexOf('lat="3"'));
    expect(b.indexOf('<ele>')).toBeLessThan(b.indexOf('<magvar>'));
    expect(b.indexOf('<magvar>')).toBeLessThan(b.indexOf('<name>'));
    expect(b.indexOf('<name>')).toBeLessThan(b.indexOf('<extensions>'));
  });

  it('refuses mismatched or non-finite estimates and bad waypoints (InputError)', () => {
    const waypoints = [
      { id: 'a', name: 'A', lat_deg: 0, lon_deg: 0 },
      { id: 'b', name: 'B', lat_deg: 0, lon_deg: 1 },
    ];
    const est = { eta_s: 0, remaining: 1, remainingUnit: 'kg' as const };
    expect(() => writeGpx({ name: 'r', waypoints }, [est])).toThrow(
      /one per waypoint \(2\) or none/,
    );
    expect(() => writeGpx({ name: 'r', waypoints }, [est, { ...est, eta_s: NaN }])).toThrow(
      /perWaypoint\.1\.eta_s/,
    );
    expect(() =>
      writeGpx({ name: 'r', waypoints: [{ ...waypoints[0]!, lon_deg: 181 }] }, []),
    ).toThrow(/route\.waypoints\.0\.lon_deg/);
    expect(writeGpx({ name: 'r', waypoints }, [])).not.toContain('lw:eta_s'); // route alone
  });
});
