/**
 * Reads a route from GPX 1.1, the open GPS exchange format (TopoGrafix, "GPX 1.1 Schema
 * Documentation", topografix.com/GPX/1/1): the first `rte` with its `rtept`s, else the
 * `wpt` list in file order, else the points of the first `trk` (all its `trkseg`s), thinned.
 * From each point: `lat`/`lon` attributes (degrees, WGS-84), `name`, `ele` (m) and `magvar`
 * (GPX: 0 ≤ magvar < 360; values above 180 are read as west, i.e. magvar − 360).
 *
 * One pass over the text (xmlScan.ts, no document tree): point coordinates go straight into
 * typed arrays (gpxPoints.ts), a track is thinned on those arrays, and only the points kept
 * become waypoint objects, with ids made unique in O(n). Limits are counted in points.
 *
 * Untrusted input: any DOCTYPE/ENTITY declaration is refused (no entity expansion, so no
 * "billion laughs"), only the five predefined XML entities and numeric character references
 * are decoded, and every failure — malformed XML, a missing or out-of-range coordinate, too
 * many points — comes back as an issue naming the element (and its line). parseGpx never
 * throws.
 */
import { PointSet, readGpxDocument } from './gpxPoints.ts';
import type { GpxIssue } from './gpxPoints.ts';
import { thinTrackIndices } from './trackThin.ts';
import { lineColumnAt, XmlSyntaxError } from './xmlScan.ts';
import type { Waypoint } from './waypoints.ts';

export { writeGpx, LEGWISE_GPX_NS, type WaypointEstimate, type GpxMeta } from './gpxWrite.ts';
export type { GpxIssue } from './gpxPoints.ts';

export interface GpxRoute {
  name: string;
  waypoints: Waypoint[];
}
export type GpxParseResult =
  { ok: true; route: GpxRoute; warnings: string[] } | { ok: false; issues: GpxIssue[] };

export interface GpxLimits {
  /** Longest text read, characters (default 400 000 000: the points limits decide first). */
  maxChars?: number;
  /** Most route points or waypoints (default 5 000). */
  maxPoints?: number;
  /** Most track points read before thinning (default 200 000). */
  maxTrackPoints?: number;
  /** A track is thinned to this many points (default 100). */
  trackRoutePoints?: number;
  /** Called with the fraction of the text read, about every megabyte. */
  onProgress?: (fraction: number) => void;
}

const DEFAULTS = {
  maxChars: 400_000_000,
  maxPoints: 5000,
  maxTrackPoints: 200_000,
  trackRoutePoints: 100,
};
const MAX_ISSUES = 20;

class GpxError extends Error {
  constructor(readonly issues: GpxIssue[]) {
    super(issues[0]?.message ?? 'GPX error');
  }
}

export function parseGpx(text: string, limits: GpxLimits = {}): GpxParseResult {
  try {
    return readGpx(text, { ...DEFAULTS, ...limits });
  } catch (e) {
    if (e instanceof GpxError) return { ok: false, issues: e.issues };
    const detail = e instanceof Error ? e.message : String(e);
    return { ok: false, issues: [issue('gpx', `could not be read as GPX (${clip(detail)})`)] };
  }
}

function readGpx(input: string, limits: GpxLimits & typeof DEFAULTS): GpxParseResult {
  if (typeof input !== 'string') throw new GpxError([issue('gpx', 'is not text')]);
  if (input.length > limits.maxChars) {
    throw new GpxError([
      issue('gpx', `is ${input.length} characters long; at most ${limits.maxChars} are read`),
    ]);
  }
  const text = input.charCodeAt(0) === 0xfeff ? input.slice(1) : input;
  const doctype = declaration(text);
  if (doctype) {
    const { line } = lineColumnAt(text, doctype.at);
    throw new GpxError([
      issue(
        'gpx',
        `has a <!${doctype.word} declaration; GPX needs none and entity declarations are refused`,
        line,
      ),
    ]);
  }
  let doc;
  try {
    doc = readGpxDocument(text, {
      routePoints: limits.maxPoints,
      trackPoints: limits.maxTrackPoints,
      issues: MAX_ISSUES,
      ...(limits.onProgress ? { onProgress: limits.onProgress } : {}),
    });
  } catch (e) {
    if (!(e instanceof XmlSyntaxError)) throw e;
    const { line, column } = lineColumnAt(text, e.offset);
    const message = `gpx (line ${line}, column ${column}) is not well-formed XML: ${clip(e.message)}`;
    throw new GpxError([{ path: 'gpx', line, message }]);
  }
  if (doc.root !== 'gpx')
    throw new GpxError([issue('gpx', 'must have a single <gpx> root element')]);
  const warnings: string[] = [];
  if (doc.version !== '1.1')
    warnings.push(`gpx: version ${doc.version ?? 'missing'} read as GPX 1.1`);
  const { set, name, track } = choosePoints(doc, limits, warnings);
  if (set.issues.length > 0) {
    const more = set.issueCount - MAX_ISSUES;
    const shown = set.issues.slice(0, MAX_ISSUES);
    if (more > 0) shown.push(issue('gpx', `and ${more} more points with problems`));
    return { ok: false, issues: shown };
  }
  const routeName = name ?? doc.metadataName ?? 'GPX route';
  if (!track) return { ok: true, route: { name: routeName, waypoints: set.waypoints() }, warnings };
  const n = Math.max(2, Math.floor(limits.trackRoutePoints));
  const keep = thinTrackIndices(set.lat, set.lon, set.count, n);
  if (keep === undefined) {
    return { ok: false, issues: [issue('gpx > trk[0]', 'has no length (its points coincide)')] };
  }
  const how =
    set.count > n ? `thinned to ${keep.length} evenly spaced points` : `${keep.length} points`;
  warnings.push(
    `gpx: no route or waypoints; the ${set.count} track points are used as a route, ${how}`,
  );
  return { ok: true, route: { name: routeName, waypoints: set.waypoints(keep) }, warnings };
}

/** The first `<!DOCTYPE` or `<!ENTITY` (any letter case); a scan for `<!`, not a regex. */
function declaration(text: string): { at: number; word: string } | undefined {
  for (let i = text.indexOf('<!'); i !== -1; i = text.indexOf('<!', i + 2)) {
    const next = text.slice(i + 2, i + 9).toUpperCase();
    if (next.startsWith('DOCTYPE')) return { at: i, word: text.slice(i + 2, i + 9) };
    if (next.startsWith('ENTITY')) return { at: i, word: text.slice(i + 2, i + 8) };
  }
  return undefined;
}

function choosePoints(
  doc: ReturnType<typeof readGpxDocument>,
  limits: typeof DEFAULTS,
  warnings: string[],
): { set: PointSet; name: string | undefined; track: boolean } {
  let chosen: { set: PointSet; name: string | undefined; track: boolean; where: string };
  if (doc.rtept.count > 0) {
    if (doc.routes > 1) warnings.push(`gpx: ${doc.routes} routes; only the first is read`);
    chosen = { set: doc.rtept, name: doc.routeName, track: false, where: 'gpx > rte[0] > rtept' };
  } else if (doc.wpt.count > 0) {
    chosen = { set: doc.wpt, name: undefined, track: false, where: 'gpx > wpt' };
  } else {
    if (doc.trkpt.count > limits.maxTrackPoints) {
      throw new GpxError([
        issue(
          'gpx > trk[0]',
          `has ${doc.trkpt.count} points; at most ${limits.maxTrackPoints} are read`,
        ),
      ]);
    }
    if (doc.tracks > 1) warnings.push(`gpx: ${doc.tracks} tracks; only the first is read`);
    chosen = { set: doc.trkpt, name: doc.trackName, track: true, where: 'gpx' };
  }
  if (!chosen.track && chosen.set.count > limits.maxPoints) {
    throw new GpxError([
      issue(chosen.where, `has ${chosen.set.count} points; at most ${limits.maxPoints} are read`),
    ]);
  }
  if (chosen.set.count < 2) {
    throw new GpxError([
      issue('gpx', `needs a route, waypoints or a track with at least 2 points`),
    ]);
  }
  return chosen;
}

function issue(path: string, what: string, line?: number): GpxIssue {
  const where = line === undefined ? path : `${path} (line ${line})`;
  return line === undefined
    ? { path, message: `${where} ${what}` }
    : { path, line, message: `${where} ${what}` };
}

/** Parser messages may quote the offending text; keep them short. */
function clip(s: string, max = 200): string {
  return s.length > max ? `${s.slice(0, max)}…` : s;
}
