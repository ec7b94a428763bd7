/**
 * The route drawn to scale without map tiles: a local equirectangular projection around the
 * route's centre (x = R·Δλ·cos φ0, y = R·Δφ, R the IUGG mean Earth radius, geodesic.ts),
 * true north up, good to a fraction of a percent over the few hundred kilometres of a
 * mission. Each run of legs that flies to a waypoint (core/route/resolveRoute.ts) is drawn
 * with its margin state from the result (the worst of its legs' checks, or failed / not
 * reached); states differ in dash and width too and carry their mark (✓ ! ✗) in the text,
 * so colour is never the only cue.
 */
import type { Plan, WaypointData } from '../../../core/plan/schema.ts';
import type { CheckState, PlanResult } from '../../../core/solver/types.ts';
import type { LegRouteTarget } from '../../../core/route/resolveRoute.ts';
import type { RouteLeg } from '../../../core/route/waypoints.ts';
import { MEAN_EARTH_RADIUS_M } from '../../../core/route/geodesic.ts';
import { fromSI, toSI, UNITS, unitMap, type UnitSystem } from '../../../core/units.ts';

export type SegmentState = CheckState | 'notReached';

export interface ViewPoint {
  id: string;
  label: string;
  x: number;
  y: number;
}

export interface ViewSegment {
  /** The legs of the run, in plan order. */
  legIndices: number[];
  /** The route leg (geodesic) the run flies. */
  geodesic: RouteLeg;
  x1: number;
  y1: number;
  x2: number;
  y2: number;
  state: SegmentState;
}

export interface RouteView {
  width: number;
  height: number;
  points: ViewPoint[];
  /** The route itself, waypoint to waypoint (drawn thin, under the legs). */
  path: string;
  segments: ViewSegment[];
  scaleBar: { length_px: number; label: string };
  /** Metres on the ground per drawing unit. */
  metresPerUnit: number;
}

const DEG = Math.PI / 180;
/** Smallest extent drawn, so that a very short route is not blown up to the frame. */
const MIN_EXTENT_M = 2000;

const wrap180 = (d: number) => ((((d + 180) % 360) + 360) % 360) - 180;

/** Local east/north metres of each waypoint around the route's centre. */
export function projectRoute(waypoints: readonly WaypointData[]): { x: number; y: number }[] {
  const lon0 = waypoints[0]?.lon_deg ?? 0;
  const dl = waypoints.map((w) => wrap180(w.lon_deg - lon0));
  const lats = waypoints.map((w) => w.lat_deg);
  const midLat = (Math.min(...lats) + Math.max(...lats)) / 2;
  const midLon = (Math.min(...dl) + Math.max(...dl)) / 2;
  const k = Math.cos(midLat * DEG);
  return waypoints.map((w, i) => ({
    x: MEAN_EARTH_RADIUS_M * ((dl[i] ?? 0) - midLon) * DEG * k,
    y: MEAN_EARTH_RADIUS_M * (w.lat_deg - midLat) * DEG,
  }));
}

/** The largest 1, 2 or 5 × 10ⁿ not above `v`. */
export function niceLength(v: number): number {
  if (!(v > 0)) return 0;
  const p = 10 ** Math.floor(Math.log10(v));
  const m = v / p;
  return (m >= 5 ? 5 : m >= 2 ? 2 : 1) * p;
}

export function legState(result: PlanResult | null, legIndex: number): SegmentState {
  const leg = result?.legs[legIndex];
  if (!result || !leg || leg.status === 'notReached') return 'notReached';
  if (leg.status === 'failed') return 'fails';
  const states = result.checks.filter((c) => c.legIndex === legIndex).map((c) => c.state);
  return states.includes('fails') ? 'fails' : states.includes('tight') ? 'tight' : 'ok';
}

const RANK: Record<SegmentState, number> = { fails: 3, tight: 2, ok: 1, notReached: 0 };

/** The worst state among a run's legs; not reached only when none of them was flown. */
export function runState(result: PlanResult | null, legIndices: readonly number[]): SegmentState {
  return legIndices
    .map((i) => legState(result, i))
    .reduce<SegmentState>((a, b) => (RANK[b] > RANK[a] ? b : a), 'notReached');
}

export function routeView(
  plan: Plan,
  targets: readonly (LegRouteTarget | undefined)[],
  result: PlanResult | null,
  system: UnitSystem,
  size: { width: number; height: number; pad: number },
): RouteView | null {
  const waypoints = plan.route?.waypoints ?? [];
  if (waypoints.length < 2) return null;
  const xy = projectRoute(waypoints);
  const xs = xy.map((p) => p.x);
  const ys = xy.map((p) => p.y);
  const spanX = Math.max(Math.max(...xs) - Math.min(...xs), MIN_EXTENT_M);
  const spanY = Math.max(Math.max(...ys) - Math.min(...ys), MIN_EXTENT_M);
  const scale = Math.min((size.width - 2 * size.pad) / spanX, (size.height - 2 * size.pad) / spanY);
  const cx = size.width / 2;
  const cy = size.height / 2;
  const at = (p: { x: number; y: number }) => ({ x: cx + p.x * scale, y: cy - p.y * scale });
  const points = waypoints.map((w, i) => {
    const p = at(xy[i] ?? { x: 0, y: 0 });
    return { id: w.id, label: `${i + 1} ${w.name.trim() || w.id}`, x: p.x, y: p.y };
  });
  const byId = new Map(points.map((p) => [p.id, p]));
  const runs = new Map<number, { target: LegRouteTarget; legIndices: number[] }>();
  targets.forEach((t, i) => {
    if (!t) return;
    const run = runs.get(t.run) ?? { target: t, legIndices: [] };
    run.legIndices.push(i);
    runs.set(t.run, run);
  });
  const segments = [...runs.values()].flatMap(({ target, legIndices }) => {
    const a = byId.get(target.leg.from.id);
    const b = byId.get(target.leg.to.id);
    if (!a || !b) return [];
    const state = runState(result, legIndices);
    return [{ legIndices, geodesic: target.leg, x1: a.x, y1: a.y, x2: b.x, y2: b.y, state }];
  });
  const unit = unitMap(system).distance;
  const nice = niceLength(fromSI((0.25 * size.width) / scale, unit));
  return {
    width: size.width,
    height: size.height,
    points,
    path: points.map((p, i) => `${i ? 'L' : 'M'}${p.x.toFixed(1)} ${p.y.toFixed(1)}`).join(' '),
    segments,
    scaleBar: { length_px: toSI(nice, unit) * scale, label: `${nice} ${UNITS[unit].label}` },
    metresPerUnit: 1 / scale,
  };
}
