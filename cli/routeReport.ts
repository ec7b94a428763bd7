/**
 * `legwise solve` for a plan with a route: the per-waypoint table (ETA from the start of the
 * mission, ground distance, fuel or battery energy left; core/solver/routeProgress.ts) and
 * the GPX 1.1 export of `--gpx` (core/route/gpxWrite.ts, estimates in our own namespace).
 */
import { formatQuantity, NO_VALUE } from '../core/format.ts';
import type { Plan } from '../core/plan/schema.ts';
import { writeGpx, type WaypointEstimate } from '../core/route/gpxWrite.ts';
import { routeProgress, type WaypointProgress } from '../core/solver/routeProgress.ts';
import type { PlanResult } from '../core/solver/types.ts';
import type { UnitSystemId } from '../core/units.ts';
import { CAUTION } from './common.ts';
import { clip, renderTable, type Column } from './table.ts';

/** The "Route" section of the text output ('' for a plan without a route). */
export function renderRouteText(plan: Plan, result: PlanResult, units: UnitSystemId): string {
  const progress = routeProgress(plan, result);
  if (progress.length === 0) return '';
  const q = result.consumable === 'fuel' ? 'fuelMass' : 'energy';
  const what = result.consumable === 'fuel' ? 'Fuel left' : 'Energy left';
  const columns: Column[] = [
    { header: '#', align: 'right' },
    { header: 'Waypoint', align: 'left' },
    { header: 'ETA', align: 'right' },
    { header: 'Distance', align: 'right' },
    { header: what, align: 'right' },
  ];
  const rows = progress.map((w) => {
    const name = clip(w.name.trim() === '' ? w.id : `${w.name} (${w.id})`, 36);
    const head = [String(w.index + 1), name];
    if (!w.reached) return [...head, 'not reached', NO_VALUE, NO_VALUE];
    return [
      ...head,
      formatQuantity(w.eta_s ?? 0, 'time', units),
      formatQuantity(w.x_m ?? 0, 'distance', units),
      formatQuantity(w.remaining ?? 0, q, units),
    ];
  });
  const lines = [
    'Route (ETA from the start of the mission; the first waypoint after the take-off allowance)',
    ...renderTable(columns, rows).map((l) => `  ${l}`),
  ];
  return `${lines.join('\n')}\n`;
}

/** One estimate per waypoint, or null when some waypoint is not reached. */
export function gpxEstimates(progress: readonly WaypointProgress[]): WaypointEstimate[] | null {
  const out: WaypointEstimate[] = [];
  for (const w of progress) {
    if (!w.reached || w.eta_s === null || w.remaining === null) return null;
    out.push({ eta_s: w.eta_s, remaining: w.remaining, remainingUnit: w.remainingUnit });
  }
  return out;
}

/**
 * GPX text of the plan's route with the per-waypoint estimates, or the route alone when the
 * mission does not reach every waypoint (`withEstimates` false). The plan must have a route.
 */
export function routeGpx(plan: Plan, result: PlanResult): { text: string; withEstimates: boolean } {
  const route = plan.route;
  if (route === undefined) throw new Error('the plan has no route');
  const estimates = gpxEstimates(routeProgress(plan, result));
  const text = writeGpx({ name: plan.name, waypoints: route.waypoints }, estimates ?? [], {
    creator: 'Legwise',
    description: `${plan.name}. ${CAUTION}`,
  });
  return { text, withEstimates: estimates !== null };
}
