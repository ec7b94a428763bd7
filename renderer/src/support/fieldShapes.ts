/**
 * Field lists depend only on a plan's "shape" (powerplant kind, how induced drag is given,
 * a leg's kind and how it ends…), not on its numbers. Keeping the same list objects while the
 * shape is unchanged lets Vue skip re-rendering every field on every keystroke.
 */
import type { Leg, Plan, WaypointData } from '../../../core/plan/schema.ts';
import { aircraftSections, missionSections } from './aircraftFields.ts';
import { airfieldSections, fieldDataSection } from './airfieldFields.ts';
import type { FieldDef, FieldSection } from './fieldTypes.ts';
import { legFields } from './legFields.ts';

/** Remembers the last result per key (one slot: the screen shows one plan at a time). */
export function lastKeyMemo<A extends unknown[], R>(
  key: (...a: A) => string,
  build: (...a: A) => R,
): (...a: A) => R {
  let lastKey: string | null = null;
  let last: R;
  return (...a: A) => {
    const k = key(...a);
    if (k !== lastKey) {
      last = build(...a);
      lastKey = k;
    }
    return last;
  };
}

export function aircraftShape(plan: Plan): string {
  const pp = plan.aircraft.powerplant;
  return [
    pp.type,
    plan.aircraft.polar.induced.by,
    pp.type === 'propeller' ? pp.lapse.model : '',
  ].join('|');
}

export function airfieldShape(plan: Plan): string {
  const a = plan.airfield;
  if (!a) return '';
  const own = (end: NonNullable<Plan['airfield']>['departure']) =>
    end.by === 'runway'
      ? (end.surfaceWindSource ?? '')
      : end.by === 'launch'
        ? (end.headwindSource ?? '')
        : '';
  const mission = plan.environment.missionWind?.by ?? '';
  return `${a.departure.by}|${a.arrival.by}|${mission}|${own(a.departure)}|${own(a.arrival)}`;
}

/** The mission sections change with the consumable and the kind of mission wind. */
export function missionShape(plan: Plan): string {
  return `${isElectric(plan)}|${plan.environment.missionWind?.by ?? ''}`;
}

export function legShape(
  leg: Leg,
  index: number,
  electric: boolean,
  waypoints: readonly WaypointData[] = [],
  routeDistance = false,
  missionWind = false,
): string {
  const parts: unknown[] = [index, electric, leg.kind, routeDistance];
  if ('wind' in leg) {
    parts.push(leg.windSource ?? '', missionWind, leg.toWaypoint ? 'to' : '');
    parts.push(waypoints.map((w) => `${w.id}:${w.name}`).join(','));
  }
  if (leg.kind === 'takeoff' || leg.kind === 'landing') parts.push(leg.allowance.by);
  if (leg.kind === 'cruise' || leg.kind === 'loiter') parts.push(leg.end.by);
  if (leg.kind === 'climb' || leg.kind === 'cruise' || leg.kind === 'loiter')
    parts.push(leg.speed.kind);
  if (leg.kind === 'descent')
    parts.push(leg.mode.by, leg.mode.by === 'rate' ? leg.mode.speed.kind : '');
  return parts.join('|');
}

export const isElectric = (plan: Plan) => plan.aircraft.powerplant.type === 'electric';

export function createFieldMemos(): {
  aircraft: (plan: Plan) => FieldSection[];
  mission: (plan: Plan) => FieldSection[];
  airfield: (plan: Plan) => FieldSection[];
  leg: (
    leg: Leg,
    index: number,
    electric: boolean,
    waypoints?: readonly WaypointData[],
    routeDistance?: boolean,
    missionWind?: boolean,
  ) => FieldDef[];
} {
  return {
    aircraft: lastKeyMemo(aircraftShape, aircraftSections),
    mission: lastKeyMemo(missionShape, missionSections),
    airfield: lastKeyMemo(
      (p: Plan) => `${airfieldShape(p)}|${p.aircraft.powerplant.type === 'jet'}`,
      (p: Plan) => [...airfieldSections(p), fieldDataSection(p)],
    ),
    leg: lastKeyMemo(legShape, legFields),
  };
}
