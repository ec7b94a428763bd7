/**
 * Deterministic synthetic GPX 1.1 files for the parser's golden comparison
 * (test/core/route/gpxGolden.test.ts): a logger-style track (every point with `ele` and
 * `time`, stationary stretches that repeat a point, two segments) and a route whose points
 * carry Legwise extension ids with repeats. Coordinates come from a fixed linear congruential
 * sequence (Numerical Recipes' constants), so the same n always gives the same text.
 */
import { LEGWISE_GPX_NS } from '../../core/route/gpxWrite.ts';

function lcg(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 2 ** 32;
  };
}

/** A track of n points from (47, 8) heading north-east, about 30 m apart, 5 % repeats. */
/**
 * Options for very long tracks: `climbBias` 0.5 makes the elevation a walk without drift,
 * `stepScale` shortens the steps so the track stays on the globe.
 */
export function loggerTrackGpx(
  n: number,
  seed = 1,
  { climbBias = 0.45, stepScale = 1 }: { climbBias?: number; stepScale?: number } = {},
): string {
  const rnd = lcg(seed);
  const parts = [
    '<?xml version="1.0" encoding="UTF-8"?>',
    '<gpx version="1.1" creator="synthetic logger" xmlns="http://www.topografix.com/GPX/1/1">',
    `<metadata><name>Logger ${n}</name></metadata>`,
    '<trk><name>Synthetic flight &amp; return</name><trkseg>',
  ];
  let lat = 47;
  let lon = 8;
  let ele = 400;
  const t0 = Date.UTC(2026, 5, 1, 8, 0, 0);
  for (let i = 0; i < n; i++) {
    if (i === Math.floor(n / 2)) parts.push('</trkseg><trkseg>');
    if (i > 0 && rnd() >= 0.05) {
      lat += stepScale * (0.0002 + 0.0001 * rnd());
      lon += stepScale * (0.0001 + 0.0002 * (rnd() - 0.3));
      ele += 4 * (rnd() - climbBias);
    }
    const time = new Date(t0 + i * 1000).toISOString().replace('.000', '');
    parts.push(
      `<trkpt lat="${lat.toFixed(7)}" lon="${lon.toFixed(7)}"><ele>${ele.toFixed(1)}</ele><time>${time}</time></trkpt>`,
    );
  }
  parts.push('</trkseg></trk>', '</gpx>', '');
  return parts.join('\n');
}

/** A route of n points with our extension ids, 1 in 7 repeating an earlier id. */
export function routeWithIdsGpx(n: number, seed = 2): string {
  const rnd = lcg(seed);
  const parts = [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<gpx version="1.1" creator="synthetic" xmlns="http://www.topografix.com/GPX/1/1" xmlns:q="${LEGWISE_GPX_NS}">`,
    '<rte><name>Survey &lt;grid&gt;</name>',
  ];
  for (let i = 0; i < n; i++) {
    const lat = -30 + 10 * rnd();
    const lon = 140 + 10 * rnd();
    const id = i % 7 === 3 ? `p${Math.floor(i / 14)}` : `p${i}`;
    const magvar = i % 5 === 0 ? `<magvar>${(360 * rnd()).toFixed(2)}</magvar>` : '';
    const name = i % 3 === 0 ? '' : `<name>Point ${i} &#8594; next</name>`;
    parts.push(
      `<rtept lat="${lat.toFixed(6)}" lon="${lon.toFixed(6)}">${name}<ele>${(1000 * rnd()).toFixed(0)}</ele>${magvar}<extensions><q:id>${id}</q:id></extensions></rtept>`,
    );
  }
  parts.push('</rte>', '</gpx>', '');
  return parts.join('\n');
}

export const GOLDEN_CASES: readonly { name: string; text: () => string }[] = [
  { name: 'track-1k', text: () => loggerTrackGpx(1000) },
  { name: 'track-10k', text: () => loggerTrackGpx(10_000) },
  { name: 'track-100k', text: () => loggerTrackGpx(100_000) },
  { name: 'route-1k', text: () => routeWithIdsGpx(1000) },
];
