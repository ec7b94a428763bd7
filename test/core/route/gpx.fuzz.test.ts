import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseGpx, writeGpx, type GpxParseResult } from '../../../core/route/gpx.ts';

/**
 * Robustness (DESIGN.md section 6: thousands of random and mutated files never crash the
 * loader): random text and mutated GPX always give a result object — a route whose points
 * are all in range, or issues with messages — and never throw.
 */
function fixture(name: string): string {
  return readFileSync(new URL(`../../fixtures/gpx/${name}`, import.meta.url), 'utf8');
}

const written = writeGpx(
  {
    name: 'Fuzz & base',
    waypoints: [
      { id: 'a', name: 'A', lat_deg: 10, lon_deg: 20, altitude_m: 100, magneticVariation_deg: -3 },
      { id: 'b', name: 'B <b>', lat_deg: 10.5, lon_deg: 20.5 },
      { id: 'c', name: 'C', lat_deg: 11, lon_deg: 21 },
    ],
  },
  [
    { eta_s: 0, remaining: 40, remainingUnit: 'kg' },
    { eta_s: 900, remaining: 35, remainingUnit: 'kg' },
    { eta_s: 1800, remaining: 30, remainingUnit: 'kg' },
  ],
);
const bases = [
  written,
  fixture('route.gpx'),
  fixture('waypoints.gpx'),
  fixture('missing-lon.gpx'),
  fixture('track.gpx').slice(0, 4000) + '</trkseg></trk></gpx>',
];

// Pieces that tend to break XML readers: markup, entities, numbers at the edges, odd chars.
const nasty = fc.constantFrom(
  '<',
  '>',
  '&',
  '"',
  "'",
  '/>',
  '</rte>',
  '</gpx>',
  '<rte>',
  '<rtept lat="1" lon="2">',
  '<wpt lat="-90" lon="180"/>',
  '<trk><trkseg><trkpt lat="0" lon="0"/>',
  '<!DOCTYPE gpx>',
  '<!ENTITY x "y">',
  '<![CDATA[',
  ']]>',
  '<!--',
  '-->',
  '<?xml version="1.0"?>',
  '&amp;',
  '&#0;',
  '&#x110000;',
  '&#65;',
  '&lt;',
  '&undefined;',
  'lat="1e400"',
  'lon="-0"',
  'lat="NaN"',
  '<ele>1e9</ele>',
  '<magvar>360</magvar>',
  '\u0000',
  '\ud800',
  '\ufeff',
  '\r\n',
  ' xmlns:lw="https://legwise.invalid/gpx/1"',
  '<__proto__/>',
  '<constructor>',
  '<a:b:c/>',
);

const mutation = fc.oneof(
  fc.record({
    op: fc.constant('delete' as const),
    at: fc.double({ min: 0, max: 1, noNaN: true }),
    len: fc.nat(40),
  }),
  fc.record({
    op: fc.constant('insert' as const),
    at: fc.double({ min: 0, max: 1, noNaN: true }),
    text: fc.oneof(
      nasty,
      fc.string({ maxLength: 12 }),
      fc.string({ unit: 'binary', maxLength: 6 }),
    ),
  }),
  fc.record({
    op: fc.constant('duplicate' as const),
    at: fc.double({ min: 0, max: 1, noNaN: true }),
    len: fc.nat(200),
  }),
  fc.record({
    op: fc.constant('truncate' as const),
    at: fc.double({ min: 0, max: 1, noNaN: true }),
  }),
);
type Mutation = typeof mutation extends fc.Arbitrary<infer M> ? M : never;

function mutate(text: string, m: Mutation): string {
  const i = Math.floor(m.at * text.length);
  switch (m.op) {
    case 'delete':
      return text.slice(0, i) + text.slice(i + m.len);
    case 'insert':
      return text.slice(0, i) + m.text + text.slice(i);
    case 'duplicate':
      return text.slice(0, i + m.len) + text.slice(i, i + m.len) + text.slice(i + m.len);
    case 'truncate':
      return text.slice(0, i);
  }
}

const mutated = fc
  .tuple(fc.constantFrom(...bases), fc.array(mutation, { minLength: 1, maxLength: 6 }))
  .map(([base, ms]) => ms.reduce(mutate, base));
const randomText = fc.oneof(
  fc.string({ maxLength: 300 }),
  fc.string({ unit: 'binary', maxLength: 300 }),
  fc.array(fc.oneof(nasty, fc.string({ maxLength: 5 })), { maxLength: 60 }).map((a) => a.join('')),
);

function checkResult(r: GpxParseResult): void {
  expect(typeof r).toBe('object');
  if (r.ok) {
    expect(r.route.waypoints.length).toBeGreaterThanOrEqual(2);
    expect(typeof r.route.name).toBe('string');
    const ids = new Set(r.route.waypoints.map((w) => w.id));
    expect(ids.size).toBe(r.route.waypoints.length);
    for (const w of r.route.waypoints) {
      expect(w.lat_deg).toBeGreaterThanOrEqual(-90); // also false for NaN
      expect(w.lat_deg).toBeLessThanOrEqual(90);
      expect(w.lon_deg).toBeGreaterThanOrEqual(-180);
      expect(w.lon_deg).toBeLessThanOrEqual(180);
      if (w.altitude_m !== undefined) expect(Number.isFinite(w.altitude_m)).toBe(true);
      if (w.magneticVariation_deg !== undefined)
        expect(Math.abs(w.magneticVariation_deg)).toBeLessThanOrEqual(180);
    }
    for (const warning of r.warnings) expect(typeof warning).toBe('string');
  } else {
    expect(r.issues.length).toBeGreaterThan(0);
    for (const i of r.issues) {
      expect(i.message.length).toBeGreaterThan(0);
      expect(i.message.startsWith(i.path)).toBe(true);
      if (i.line !== undefined) expect(Number.isInteger(i.line) && i.line >= 1).toBe(true);
    }
  }
}

describe('parseGpx fuzz (fast-check, 2 000 cases each)', () => {
  it('mutated GPX files always give a result object, never a crash', () => {
    fc.assert(
      fc.property(mutated, (text) => checkResult(parseGpx(text))),
      { numRuns: 2000 },
    );
  });

  it('random text always gives a result object, never a crash', () => {
    fc.assert(
      fc.property(randomText, (text) => checkResult(parseGpx(text))),
      { numRuns: 2000 },
    );
  });
});
