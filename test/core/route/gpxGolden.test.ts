/**
 * The one-pass GPX reader against the results of the reader it replaced (fast-xml-parser
 * building the whole document tree, then thinning), recorded in test/fixtures/gpx-golden/
 * from the same synthetic files before the switch: logger tracks of 1 000, 10 000 and
 * 100 000 points (with elevation, time, repeats and two segments) and a 1 000-point route
 * with repeated extension ids. Same waypoints, same names and ids, same warnings.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseGpx } from '../../../core/route/gpx.ts';
import { GOLDEN_CASES } from '../../support/gpxSynth.ts';

describe('GPX reading matches the recorded results of the previous reader', () => {
  it.each(GOLDEN_CASES.map((c) => [c.name, c.text] as const))('%s', (name, text) => {
    const golden = JSON.parse(
      readFileSync(new URL(`../../fixtures/gpx-golden/${name}.json`, import.meta.url), 'utf8'),
    ) as unknown;
    expect(parseGpx(text())).toEqual(golden);
  });
});
