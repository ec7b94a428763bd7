/**
 * Reads a route from GPX 1.1, the open GPS exchange format (TopoGrafix, "GPX 1.1 Schema
 * Documentation", topografix.com/GPX/1/1): the first `rte` with its `rtept`s, else the
 * `wpt` list in file order, else the points of the first `trk` (all its `trkseg`s), thinned.
 * From each point: `lat`/`lon` attributes (degrees, WGS-84), `name`, `ele` (m) and `magvar`
 * (GPX: 0 ≤ magvar < 360; values above 180 are read as west, i.e. magvar − 360).
 *
 * Untrusted input: the text is size-limited, any DOCTYPE/ENTITY declaration is refused (no
 * entity expansion, so no "billion laughs"), only the five predefined XML entities and
 * numeric character references are decoded, and every failure — malformed XML, a missing
 * or out-of-range coordinate, too many points — comes back as an issue naming the element
 * (and its line where the parser reports one). parseGpx never throws.
 */
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { thinTrack } from './trackThin.ts';
import { decodeXmlText, lineOf, lineStarts } from './xmlText.ts';
import { uniqueId, type Waypoint } from './waypoints.ts';

export { writeGpx, LEGWISE_GPX_NS, type WaypointEstimate, type GpxMeta } from './gpxWrite.ts';
import { LEGWISE_GPX_NS } from './gpxWrite.ts';

export interface GpxRoute {
  name: string;
  waypoints: Waypoint[];
}
export interface GpxIssue {
  /** Element path, e.g. `gpx > rte[0] > rtept[3]`. */
  path: string;
  /** 1-based line of the element or error, where known. */
  line?: number;
  /** Names the path, the line, the value and the limit. */
  message: string;
}
export type GpxParseResult =
  { ok: true; route: GpxRoute; warnings: string[] } | { ok: false; issues: GpxIssue[] };

export interface GpxLimits {
  /** Longest text read, characters (default 10 000 000, about 10 MB). */
  maxChars?: number;
  /** Most route points or waypoints (default 5 000). */
  maxPoints?: number;
  /** Most track points read before thinning (default 200 000). */
  maxTrackPoints?: number;
  /** A track is thinned to this many points (default 100). */
  trackRoutePoints?: number;
}

const DEFAULTS: Required<GpxLimits> = {
  maxChars: 10_000_000,
  maxPoints: 5000,
  maxTrackPoints: 200_000,
  trackRoutePoints: 100,
};
const MAX_ISSUES = 20;
const MAX_NAME_LENGTH = 120;
const MAX_ID_LENGTH = 64;
const POINT_TAGS = new Set(['rte', 'rtept', 'wpt', 'trk', 'trkseg', 'trkpt']);
const META = XMLParser.getMetaDataSymbol() as symbol;
// xsd:decimal, plus an optional exponent (lenient); unambiguous, so it runs in linear time.
const DECIMAL = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
// The longest exact decimal of a double (a subnormal) has about 330 characters.
const MAX_NUMBER_LENGTH = 400;

type XmlNode = Record<string | symbol, unknown>;
interface RawPoint {
  node: unknown;
  path: string;
}

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

function readGpx(input: string, limits: Required<GpxLimits>): GpxParseResult {
  if (typeof input !== 'string') throw new GpxError([issue('gpx', 'is not text')]);
  if (input.length > limits.maxChars) {
    throw new GpxError([
      issue('gpx', `is ${input.length} characters long; at most ${limits.maxChars} are read`),
    ]);
  }
  const text = input.charCodeAt(0) === 0xfeff ? input.slice(1) : input;
  const lines = lineStarts(text);
  const doctype = /<!(DOCTYPE|ENTITY)/i.exec(text);
  if (doctype) {
    const line = lineOf(lines, doctype.index);
    throw new GpxError([
      issue(
        'gpx',
        `has a <!${doctype[1]} declaration; GPX needs none and entity declarations are refused`,
        line,
      ),
    ]);
  }
  const valid = XMLValidator.validate(text);
  if (valid !== true) {
    const { line, col, msg } = valid.err;
    const where = Number.isFinite(col) ? `line ${line}, column ${col}` : `line ${line}`;
    const message = `gpx (${where}) is not well-formed XML: ${clip(msg)}`;
    throw new GpxError([
      Number.isFinite(line) ? { path: 'gpx', line, message } : { path: 'gpx', message },
    ]);
  }
  const parser = new XMLParser({
    ignoreAttributes: false,
    attributeNamePrefix: '@',
    parseTagValue: false,
    parseAttributeValue: false,
    processEntities: false,
    htmlEntities: false,
    captureMetaData: true,
    isArray: (tag) => POINT_TAGS.has(tag),
  });
  const doc: unknown = parser.parse(text);
  const root = isNode(doc) ? doc['gpx'] : undefined;
  if (!isNode(root) && typeof root !== 'string') {
    throw new GpxError([issue('gpx', 'must have a single <gpx> root element')]);
  }
  const gpx: XmlNode = isNode(root) ? root : {};
  const warnings: string[] = [];
  const version = attr(gpx, 'version');
  if (version !== '1.1') warnings.push(`gpx: version ${version ?? 'missing'} read as GPX 1.1`);
  const found = choosePoints(gpx, limits, warnings);
  const prefix = extensionPrefix(gpx);
  const waypoints: Waypoint[] = [];
  const issues: GpxIssue[] = [];
  const ids = new Set<string>();
  found.points.forEach((p, i) => {
    const w = readPoint(p, i, prefix, lines, issues);
    if (w) waypoints.push({ ...w, id: uniqueId(w.id, ids) });
  });
  if (issues.length > 0) {
    const more = issues.length - MAX_ISSUES;
    const shown = issues.slice(0, MAX_ISSUES);
    if (more > 0) shown.push(issue('gpx', `and ${more} more points with problems`));
    return { ok: false, issues: shown };
  }
  const route = { name: found.name ?? text1(gpx['metadata'], 'name') ?? 'GPX route', waypoints };
  if (found.thinTo !== undefined) return trackRoute(route, found.thinTo, warnings);
  return { ok: true, route, warnings };
}

function choosePoints(gpx: XmlNode, limits: Required<GpxLimits>, warnings: string[]) {
  const routes = asArray(gpx['rte']);
  const first = routes[0];
  const rtepts = asArray(isNode(first) ? first['rtept'] : undefined);
  const wpts = asArray(gpx['wpt']);
  let found: { points: RawPoint[]; name?: string; thinTo?: number };
  if (rtepts.length > 0) {
    if (routes.length > 1) warnings.push(`gpx: ${routes.length} routes; only the first is read`);
    found = {
      points: rtepts.map((node, i) => ({ node, path: `gpx > rte[0] > rtept[${i}]` })),
      name: text1(first, 'name'),
    };
  } else if (wpts.length > 0) {
    found = { points: wpts.map((node, i) => ({ node, path: `gpx > wpt[${i}]` })) };
  } else {
    found = trackPoints(gpx, limits, warnings);
  }
  if (found.points.length > limits.maxPoints && found.thinTo === undefined) {
    const where = found.points[0]?.path.replace(/\[0\]$/, '') ?? 'gpx';
    throw new GpxError([
      issue(where, `has ${found.points.length} points; at most ${limits.maxPoints} are read`),
    ]);
  }
  if (found.points.length < 2) {
    throw new GpxError([
      issue('gpx', `needs a route, waypoints or a track with at least 2 points`),
    ]);
  }
  return found;
}

function trackPoints(gpx: XmlNode, limits: Required<GpxLimits>, warnings: string[]) {
  const tracks = asArray(gpx['trk']);
  const trk = tracks[0];
  const points: RawPoint[] = [];
  asArray(isNode(trk) ? trk['trkseg'] : undefined).forEach((seg, s) => {
    asArray(isNode(seg) ? seg['trkpt'] : undefined).forEach((node, i) => {
      points.push({ node, path: `gpx > trk[0] > trkseg[${s}] > trkpt[${i}]` });
    });
  });
  if (points.length > limits.maxTrackPoints) {
    throw new GpxError([
      issue(
        'gpx > trk[0]',
        `has ${points.length} points; at most ${limits.maxTrackPoints} are read`,
      ),
    ]);
  }
  if (tracks.length > 1) warnings.push(`gpx: ${tracks.length} tracks; only the first is read`);
  const thinTo = Math.max(2, Math.floor(limits.trackRoutePoints));
  return { points, name: text1(trk, 'name'), thinTo };
}

function readPoint(
  p: RawPoint,
  i: number,
  prefix: string | undefined,
  lines: number[],
  issues: GpxIssue[],
): Waypoint | undefined {
  const node: XmlNode = isNode(p.node) ? p.node : {};
  const meta = node[META] as { startIndex?: number } | undefined;
  const line = meta?.startIndex === undefined ? undefined : lineOf(lines, meta.startIndex);
  const bad = (what: string) => issues.push(issue(p.path, what, line));
  const lat = number(attr(node, 'lat'), 'lat', -90, 90, bad);
  const lon = number(attr(node, 'lon'), 'lon', -180, 180, bad);
  const ele = number(text1(node, 'ele'), 'ele', -1000, 30000, bad, true);
  const magvar = number(text1(node, 'magvar'), 'magvar', 0, 360, bad, true);
  if (typeof lat !== 'number' || typeof lon !== 'number') return undefined;
  if (ele === null || magvar === null) return undefined;
  const ownId = prefix === undefined ? undefined : text1(node['extensions'], `${prefix}:id`);
  const w: Waypoint = {
    id: (ownId || `wp${i + 1}`).slice(0, MAX_ID_LENGTH),
    name: (text1(node, 'name') || `WP${i + 1}`).slice(0, MAX_NAME_LENGTH),
    lat_deg: lat,
    lon_deg: lon,
  };
  if (ele !== undefined) w.altitude_m = ele;
  if (magvar !== undefined) w.magneticVariation_deg = magvar > 180 ? magvar - 360 : magvar;
  return w;
}

/**
 * A number from an attribute or element text within [min, max]; `undefined` when absent
 * (an issue unless `optional`), `null` after reporting a bad value (optional values).
 */
function number(
  raw: string | undefined,
  name: string,
  min: number,
  max: number,
  bad: (what: string) => void,
  optional = false,
): number | undefined | null {
  if (raw === undefined) {
    if (!optional) bad(`has no ${name}; must be between ${min} and ${max} deg`);
    return undefined;
  }
  const t = raw.trim();
  const decimal = t.length <= MAX_NUMBER_LENGTH && DECIMAL.test(t);
  const v = decimal ? Number(t) : NaN;
  const unit = name === 'ele' ? 'm' : 'deg';
  if (!Number.isFinite(v) || v < min || v > max) {
    const what = decimal ? 'is out of range' : 'is not a decimal number';
    const shown = JSON.stringify(clip(t, 40));
    bad(`${name} ${shown} ${what}; must be between ${min} and ${max} ${unit}`);
    return optional ? null : undefined;
  }
  return v;
}

function trackRoute(route: GpxRoute, n: number, warnings: string[]): GpxParseResult {
  const count = route.waypoints.length;
  const thinned = thinTrack(route.waypoints, n);
  if (!thinned) {
    return { ok: false, issues: [issue('gpx > trk[0]', 'has no length (its points coincide)')] };
  }
  const m = thinned.length;
  const how = count > n ? `thinned to ${m} evenly spaced points` : `${m} points`;
  warnings.push(
    `gpx: no route or waypoints; the ${count} track points are used as a route, ${how}`,
  );
  return { ok: true, route: { ...route, waypoints: thinned }, warnings };
}

/** The prefix the file binds to our extension namespace, if any. */
function extensionPrefix(gpx: XmlNode): string | undefined {
  for (const key of Object.keys(gpx)) {
    if (key.startsWith('@xmlns:') && gpx[key] === LEGWISE_GPX_NS) return key.slice(7);
  }
  return undefined;
}

function isNode(v: unknown): v is XmlNode {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function asArray(v: unknown): unknown[] {
  if (v === undefined) return [];
  return Array.isArray(v) ? v : [v];
}

function attr(node: XmlNode, name: string): string | undefined {
  const v = node[`@${name}`];
  return typeof v === 'string' ? decodeXmlText(v) : undefined;
}

/** Text of the first child element `name` (also when it carries attributes). */
function text1(parent: unknown, name: string): string | undefined {
  if (!isNode(parent)) return undefined;
  const child = asArray(parent[name])[0];
  const raw = isNode(child) ? child['#text'] : child;
  if (typeof raw === 'string') return decodeXmlText(raw).trim();
  return undefined;
}

function issue(path: string, what: string, line?: number): GpxIssue {
  const where = line === undefined ? path : `${path} (line ${line})`;
  return line === undefined
    ? { path, message: `${where} ${what}` }
    : { path, line, message: `${where} ${what}` };
}

/** Parser messages quote the offending text, which can be megabytes long. */
function clip(s: string, max = 200): string {
  return s.length > max ? `${s.slice(0, max)}…` : s;
}
