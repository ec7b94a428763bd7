/**
 * The points of a GPX 1.1 file (topografix.com/GPX/1/1) gathered in one scan (xmlScan.ts):
 * the first route's `rtept`s, the `wpt`s and the first track's `trkpt`s, each set in typed
 * arrays (latitude, longitude, elevation, magnetic variation) with names and our extension
 * ids kept only where a point has them. Each point is checked as it closes — `lat` in
 * [−90, 90], `lon` in [−180, 180], `ele` in [−1000, 30000] m, `magvar` in [0, 360] (GPX's
 * ranges; ele is our limit), numbers written as xsd:decimal (an exponent is tolerated) —
 * and its problems kept with the element's path and line. Waypoint objects are made only
 * for the points asked for.
 */
import { LEGWISE_GPX_NS } from './gpxWrite.ts';
import type { Waypoint } from './waypoints.ts';
import { decodeXmlText } from './xmlText.ts';
import { scanXml, type XmlAttributes, type XmlHandler } from './xmlScan.ts';

export interface GpxIssue {
  /** Element path, e.g. `gpx > rte[0] > rtept[3]`. */
  path: string;
  /** 1-based line of the element or error, where known. */
  line?: number;
  /** Names the path, the line, the value and the limit. */
  message: string;
}

const MAX_NAME_LENGTH = 120;
const MAX_ID_LENGTH = 64;
// xsd:decimal, plus an optional exponent (lenient); unambiguous, so it runs in linear time.
const DECIMAL = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
// The longest exact decimal of a double (a subnormal) has about 330 characters.
const MAX_NUMBER_LENGTH = 400;

/** `base`, or `base.2`, `base.3` … — the first not yet taken; amortised O(1) per id. */
export function uniqueIds(): (base: string) => string {
  const taken = new Set<string>();
  const next = new Map<string, number>();
  return (base) => {
    let id = base;
    if (taken.has(id)) {
      let k = next.get(base) ?? 2;
      do id = `${base}.${k++}`;
      while (taken.has(id));
      next.set(base, k);
    }
    taken.add(id);
    return id;
  };
}

/** One kind of point (rtept, wpt or trkpt) in column arrays. */
export class PointSet {
  count = 0;
  lat = new Float64Array(256);
  lon = new Float64Array(256);
  ele = new Float64Array(256);
  magvar = new Float64Array(256);
  /** Bit 1: has ele; bit 2: has magvar. */
  flags = new Uint8Array(256);
  names = new Map<number, string>();
  ids = new Map<number, string>();
  issues: GpxIssue[] = [];
  issueCount = 0;

  constructor(
    /** Points beyond this are counted, not stored (the caller refuses the set). */
    readonly cap: number,
    private readonly maxIssues: number,
  ) {}

  stores(): boolean {
    return this.count < this.cap;
  }

  grow(): void {
    if (this.count < this.lat.length) return;
    const size = Math.min(Math.max(this.cap, 1), this.lat.length * 2);
    const more = <T extends Float64Array | Uint8Array>(a: T, make: (n: number) => T): T => {
      const b = make(size);
      b.set(a);
      return b;
    };
    this.lat = more(this.lat, (n) => new Float64Array(n));
    this.lon = more(this.lon, (n) => new Float64Array(n));
    this.ele = more(this.ele, (n) => new Float64Array(n));
    this.magvar = more(this.magvar, (n) => new Float64Array(n));
    this.flags = more(this.flags, (n) => new Uint8Array(n));
  }

  addIssue(i: GpxIssue): void {
    this.issueCount += 1;
    if (this.issues.length < this.maxIssues + 1) this.issues.push(i);
  }

  /** Waypoints for the given point indices (all by default), ids made unique in order. */
  waypoints(indices?: readonly number[]): Waypoint[] {
    const unique = uniqueIds();
    const n = indices?.length ?? this.count;
    const out: Waypoint[] = new Array(n);
    for (let k = 0; k < n; k++) {
      const i = indices === undefined ? k : (indices[k] as number);
      const w: Waypoint = {
        id: unique((this.ids.get(i) || `wp${i + 1}`).slice(0, MAX_ID_LENGTH)),
        name: (this.names.get(i) || `WP${i + 1}`).slice(0, MAX_NAME_LENGTH),
        lat_deg: this.lat[i] as number,
        lon_deg: this.lon[i] as number,
      };
      const f = this.flags[i] as number;
      if (f & 1) w.altitude_m = this.ele[i] as number;
      if (f & 2) {
        const mv = this.magvar[i] as number;
        w.magneticVariation_deg = mv > 180 ? mv - 360 : mv;
      }
      out[k] = w;
    }
    return out;
  }
}

/** Line numbers for increasing offsets, counted forward from the last one asked. */
class Lines {
  private at = 0;
  private line = 1;
  constructor(private readonly text: string) {}
  of(offset: number): number {
    if (offset < this.at) {
      this.at = 0;
      this.line = 1;
    }
    for (let i = this.text.indexOf('\n', this.at); i !== -1 && i < offset;) {
      this.line += 1;
      this.at = i + 1;
      i = this.text.indexOf('\n', this.at);
    }
    return this.line;
  }
}

/** Bits of `seen` for a point's children read once: the first of each counts. */
const CHILD_BITS: Readonly<Record<string, number>> = { name: 1, ele: 2, magvar: 4, extensions: 8 };

type Field = 'name' | 'ele' | 'magvar' | 'id' | 'metadataName' | 'routeName' | 'trackName';

export interface GpxDocument {
  root: string | undefined;
  version: string | undefined;
  metadataName: string | undefined;
  routes: number;
  routeName: string | undefined;
  tracks: number;
  trackName: string | undefined;
  rtept: PointSet;
  wpt: PointSet;
  trkpt: PointSet;
}

export interface ReadLimits {
  routePoints: number;
  trackPoints: number;
  issues: number;
  onProgress?: (fraction: number) => void;
}

/** Scans the text once; throws XmlSyntaxError when it is not well-formed. */
export function readGpxDocument(text: string, limits: ReadLimits): GpxDocument {
  const doc: GpxDocument = {
    root: undefined,
    version: undefined,
    metadataName: undefined,
    routes: 0,
    routeName: undefined,
    tracks: 0,
    trackName: undefined,
    rtept: new PointSet(limits.routePoints + 1, limits.issues),
    wpt: new PointSet(limits.routePoints + 1, limits.issues),
    trkpt: new PointSet(limits.trackPoints + 1, limits.issues),
  };
  const lines = new Lines(text);
  let prefixId: string | undefined;
  // Context at depth 2 and 3: which element, and whether it is the first of its kind.
  let top = '';
  let firstTop = false;
  let metadataSeen = false;
  let segment = -1;
  let inSegment = false;
  let segmentIndex = 0;
  // The point being read.
  let set: PointSet | null = null;
  let pointDepth = -1;
  // The path is written out only for a point with a problem.
  let pointKind: 'wpt' | 'rtept' | 'trkpt' = 'wpt';
  let pointSegment = 0;
  let pointIndex = 0;
  let pointLine = 0;
  // Offsets of the lat/lon values in the text (−1: absent).
  let latStart = -1;
  let latEnd = -1;
  let lonStart = -1;
  let lonEnd = -1;
  // The ele text as one piece of the text, kept as offsets.
  let elePiece = false;
  let eleStart = 0;
  let eleEnd = 0;
  let seen = 0; // bits: name, ele, magvar, extensions, id
  let extDepth = -1;
  const values: Partial<Record<Field, string>> = {};
  // Text being gathered.
  let capture: Field | null = null;
  let captureDepth = -1;
  // One piece of text is kept as offsets; a second one (around a comment …) joins a buffer.
  let pieceStart = -1;
  let pieceEnd = -1;
  let buffer: string | null = null;

  const startCapture = (field: Field, depth: number) => {
    capture = field;
    captureDepth = depth;
    pieceStart = -1;
    buffer = null;
  };
  const captured = (): string => {
    if (buffer !== null) return buffer;
    return pieceStart < 0 ? '' : text.slice(pieceStart, pieceEnd);
  };
  const beginPoint = (
    s: PointSet,
    depth: number,
    kind: typeof pointKind,
    index: number,
    offset: number,
    attrs: XmlAttributes,
  ) => {
    set = s;
    pointDepth = depth;
    pointKind = kind;
    pointSegment = segment;
    pointIndex = index;
    pointLine = offset;
    const la = attrs.find('lat');
    const lo = attrs.find('lon');
    latStart = la < 0 ? -1 : (attrs.starts[la] as number);
    latEnd = la < 0 ? -1 : (attrs.ends[la] as number);
    lonStart = lo < 0 ? -1 : (attrs.starts[lo] as number);
    lonEnd = lo < 0 ? -1 : (attrs.ends[lo] as number);
    elePiece = false;
    seen = 0;
    values.name = values.ele = values.magvar = values.id = undefined;
  };

  const handler: XmlHandler = {
    open(name, attrs, depth, offset) {
      if (depth === 1) {
        doc.root ??= name;
        if (name !== 'gpx') return;
        const v = attrs.get('version');
        doc.version = v === undefined ? undefined : decodeXmlText(v);
        for (let k = 0; k < attrs.count; k++) {
          if (
            (attrs.names[k] as string).startsWith('xmlns:') &&
            attrs.value(k) === LEGWISE_GPX_NS
          ) {
            prefixId = `${(attrs.names[k] as string).slice(6)}:id`;
            break;
          }
        }
        return;
      }
      if (doc.root !== 'gpx') return;
      if (set !== null) {
        if (depth === pointDepth + 1) {
          const bit = CHILD_BITS[name];
          if (bit === undefined || seen & bit) return;
          seen |= bit;
          if (bit === 8) extDepth = depth;
          else startCapture(name as Field, depth);
        } else if (depth === extDepth + 1 && name === prefixId && !(seen & 16)) {
          seen |= 16;
          startCapture('id', depth);
        }
        return;
      }
      if (depth === 2) {
        top = name;
        if (name === 'rte') firstTop = ++doc.routes === 1;
        else if (name === 'trk') {
          firstTop = ++doc.tracks === 1;
          segment = -1;
        } else if (name === 'metadata') {
          firstTop = !metadataSeen;
          metadataSeen = true;
        } else if (name === 'wpt') {
          beginPoint(doc.wpt, depth, 'wpt', doc.wpt.count, offset, attrs);
        }
        return;
      }
      if (!firstTop) return;
      if (depth === 3) {
        if (name === 'name') {
          if (top === 'metadata' && doc.metadataName === undefined)
            startCapture('metadataName', depth);
          if (top === 'rte' && doc.routeName === undefined) startCapture('routeName', depth);
          if (top === 'trk' && doc.trackName === undefined) startCapture('trackName', depth);
        } else if (top === 'rte' && name === 'rtept') {
          beginPoint(doc.rtept, depth, 'rtept', doc.rtept.count, offset, attrs);
        } else if (top === 'trk' && name === 'trkseg') {
          segment += 1;
          inSegment = true;
          segmentIndex = 0;
        }
        return;
      }
      if (depth === 4 && inSegment && name === 'trkpt') {
        beginPoint(doc.trkpt, depth, 'trkpt', segmentIndex, offset, attrs);
        segmentIndex += 1;
      }
    },
    text(start, end, depth) {
      if (capture === null || depth !== captureDepth) return;
      if (pieceStart < 0 && buffer === null) {
        pieceStart = start;
        pieceEnd = end;
      } else buffer = captured() + text.slice(start, end);
    },
    close(_name, depth) {
      if (capture !== null && depth === captureDepth) {
        if (capture === 'ele' && buffer === null && pieceStart >= 0) {
          elePiece = true;
          eleStart = pieceStart;
          eleEnd = pieceEnd;
        }
        const v = capture === 'ele' && elePiece ? '' : decodeXmlText(captured().trim()).trim();
        if (capture === 'metadataName') doc.metadataName = v;
        else if (capture === 'routeName') doc.routeName = v;
        else if (capture === 'trackName') doc.trackName = v;
        else values[capture] = v;
        capture = null;
        captureDepth = -1;
      }
      if (depth === extDepth) extDepth = -1;
      if (set !== null && depth === pointDepth) {
        finishPoint(set);
        set = null;
        pointDepth = -1;
        return;
      }
      if (depth === 3) inSegment = false;
      if (depth === 2) firstTop = false;
    },
  };

  const pathOfPoint = () =>
    pointKind === 'wpt'
      ? `gpx > wpt[${pointIndex}]`
      : pointKind === 'rtept'
        ? `gpx > rte[0] > rtept[${pointIndex}]`
        : `gpx > trk[0] > trkseg[${pointSegment}] > trkpt[${pointIndex}]`;
  let problems = 0;
  let current: PointSet = doc.wpt;
  const report = (what: string) => {
    problems += 1;
    const line = lines.of(pointLine);
    const path = pathOfPoint();
    current.addIssue({ path, line, message: `${path} (line ${line}) ${what}` });
  };

  /** A number written in the text at [start, end): the quick path, else number(). */
  const numberAt = (
    start: number,
    end: number,
    name: string,
    min: number,
    max: number,
    optional: boolean,
  ): number | undefined | null => {
    if (start >= 0) {
      const v = simpleDecimal(text, start, end);
      if (v >= min && v <= max) return v;
    }
    const raw = start < 0 ? undefined : decodeXmlText(text.slice(start, end));
    return number(raw, name, min, max, report, optional);
  };

  const finishPoint = (s: PointSet) => {
    if (!s.stores()) {
      s.count += 1;
      return;
    }
    current = s;
    problems = 0;
    const lat = numberAt(latStart, latEnd, 'lat', -90, 90, false);
    const lon = numberAt(lonStart, lonEnd, 'lon', -180, 180, false);
    const ele = elePiece
      ? numberAt(eleStart, eleEnd, 'ele', -1000, 30000, true)
      : number(values.ele, 'ele', -1000, 30000, report, true);
    const magvar = number(values.magvar, 'magvar', 0, 360, report, true);
    const i = s.count;
    s.grow();
    s.count += 1;
    if (problems > 0) return;
    s.lat[i] = lat as number;
    s.lon[i] = lon as number;
    let f = 0;
    if (ele !== undefined && ele !== null) {
      s.ele[i] = ele;
      f |= 1;
    }
    if (magvar !== undefined && magvar !== null) {
      s.magvar[i] = magvar;
      f |= 2;
    }
    s.flags[i] = f;
    if (values.name) s.names.set(i, values.name);
    if (values.id) s.ids.set(i, values.id);
  };

  scanXml(text, handler, limits.onProgress);
  return doc;
}

const POW10 = Array.from({ length: 23 }, (_, k) => 10 ** k);

/**
 * The value of a plain decimal (optional sign, digits, optional fraction; no exponent,
 * blanks around allowed) with at most 15 significant digits, read straight from the text;
 * NaN for anything else, which then takes the general path. m / 10^k with both exact is
 * the correctly rounded value (IEEE 754 division; Clinger, "How to read floating point
 * numbers accurately", PLDI 1990), so this agrees with Number() to the last bit.
 */
export function simpleDecimal(text: string, start: number, end: number): number {
  let i = start;
  while (i < end && text.charCodeAt(i) <= 0x20) i += 1;
  let e = end;
  while (e > i && text.charCodeAt(e - 1) <= 0x20) e -= 1;
  let negative = false;
  const c0 = text.charCodeAt(i);
  if (c0 === 0x2d || c0 === 0x2b) {
    negative = c0 === 0x2d;
    i += 1;
  }
  let m = 0;
  let digits = 0;
  let fraction = -1;
  for (; i < e; i++) {
    const c = text.charCodeAt(i);
    if (c >= 0x30 && c <= 0x39) {
      m = m * 10 + (c - 0x30);
      digits += 1;
      if (fraction >= 0) fraction += 1;
    } else if (c === 0x2e && fraction < 0) fraction = 0;
    else return NaN;
  }
  if (digits === 0 || digits > 15) return NaN;
  const v = fraction > 0 ? m / (POW10[fraction] as number) : m;
  return negative ? -v : v;
}

/**
 * A number from an attribute or element text within [min, max]; `undefined` when absent
 * (an issue unless `optional`), `null` after reporting a bad value.
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
    const shown = JSON.stringify(t.length > 40 ? `${t.slice(0, 40)}…` : t);
    bad(`${name} ${shown} ${what}; must be between ${min} and ${max} ${unit}`);
    return null;
  }
  return v;
}
