/**
 * Mission-shape checks: whether the legs describe a flight that can be flown at all, before
 * any margin means something. Every plan starts at the departure elevation (solve.ts); these
 * checks ask that
 * - the legs come in a flyable order: no landing before the take-off, no flight leg after a
 *   landing, no descent below the lower of the two fields (`shape:order`, naming the legs);
 * - the last leg ends at the arrival elevation within settings.arrivalTolerance_m (default
 *   30 m, about 100 ft; `shape:arrival`);
 * - there is flight at all: at least one flight leg and more than zero time in flight legs
 *   (`shape:flight`, listed only when it fails).
 * Common practice of flight planning; the tolerances are the plan's settings.
 */
import type { Leg, Plan } from '../plan/schema.ts';
import type { CheckInput } from './checks.ts';
import type { LegOutcome } from './legs/index.ts';
import { legName } from './legs/common.ts';
import { fmt } from './point.ts';
import type { Check } from './types.ts';

/** Default of settings.arrivalTolerance_m (about 100 ft, common practice). */
export const DEFAULT_ARRIVAL_TOLERANCE_M = 30;

const FLIGHT_KINDS: ReadonlySet<Leg['kind']> = new Set(['climb', 'cruise', 'loiter', 'descent']);

type OrderProblem = NonNullable<Check['orderProblems']>[number];

function orderText(o: OrderProblem): string {
  if (o.why === 'belowField') {
    return `${o.leg} descends to ${fmt(o.altitude_m)} m, below the field (${fmt(o.field_m)} m)`;
  }
  return o.why === 'takeoffAfterLanding'
    ? `${o.leg} comes after the landing ${o.other}`
    : `${o.leg} is a flight leg after the landing ${o.other}`;
}

/** Leg-order problems, each naming its leg (and the leg it conflicts with). */
export function legOrderProblems(plan: Plan): OrderProblem[] {
  const out: OrderProblem[] = [];
  const env = plan.environment;
  const lowestField = Math.min(env.departureElevation_m, env.arrivalElevation_m);
  const tol = plan.settings.arrivalTolerance_m ?? DEFAULT_ARRIVAL_TOLERANCE_M;
  let firstLanding = -1;
  plan.legs.forEach((leg, i) => {
    const base = { legIndex: i, leg: legName(i, leg), altitude_m: 0, field_m: lowestField };
    const other = firstLanding >= 0 ? legName(firstLanding, plan.legs[firstLanding]!) : '';
    if (leg.kind === 'takeoff' && firstLanding >= 0) {
      out.push({ ...base, why: 'takeoffAfterLanding', other });
    } else if (FLIGHT_KINDS.has(leg.kind) && firstLanding >= 0) {
      out.push({ ...base, why: 'flightAfterLanding', other });
    }
    if (leg.kind === 'descent' && leg.toAltitude_m < lowestField - tol) {
      out.push({ ...base, why: 'belowField', other: '', altitude_m: leg.toAltitude_m });
    }
    if (leg.kind === 'landing' && firstLanding < 0) firstLanding = i;
  });
  return out;
}

/** The shape checks of a plan as flown (`legs`: the outcomes; `end_h_m`: where it ended). */
export function shapeChecks(
  plan: Plan,
  legs: readonly LegOutcome[],
  completed: boolean,
  end_h_m: number,
): CheckInput[] {
  const inputs: CheckInput[] = [];
  const order = legOrderProblems(plan);
  inputs.push({
    id: 'shape:order',
    label: 'Leg order',
    legIndex: null,
    value: order.length,
    limit: 0,
    quantity: 'count',
    bound: 'max',
    reference: 1,
    fails: order.length > 0,
    margin: order.length > 0 ? -1 : 1,
    legIndices: order.map((o) => o.legIndex),
    orderProblems: order,
    detail:
      order.length > 0
        ? `The legs cannot be flown in this order: ${order.map(orderText).join('; ')}.`
        : 'The legs come in a flyable order.',
  });
  const flightLegs = plan.legs.filter((l) => FLIGHT_KINDS.has(l.kind)).length;
  const flightTime = legs
    .filter((o, i) => FLIGHT_KINDS.has(plan.legs[i]?.kind ?? 'takeoff'))
    .reduce((t, o) => t + o.result.time_s, 0);
  if (flightLegs === 0 || !(flightTime > 0)) {
    inputs.push({
      id: 'shape:flight',
      label: 'Flight',
      legIndex: null,
      value: flightTime,
      limit: 0,
      quantity: 'time',
      bound: 'min',
      reference: 1,
      fails: true,
      margin: -1,
      detail:
        flightLegs === 0
          ? 'The plan has no flight leg (climb, cruise, loiter or descent).'
          : 'The flight legs take no time: nothing is flown.',
    });
  }
  if (completed) {
    const arrival = plan.environment.arrivalElevation_m;
    const tol = plan.settings.arrivalTolerance_m ?? DEFAULT_ARRIVAL_TOLERANCE_M;
    const off = Math.abs(end_h_m - arrival);
    const last = plan.legs.length - 1;
    inputs.push({
      id: 'shape:arrival',
      label: 'Arrival elevation',
      legIndex: null,
      value: end_h_m,
      limit: arrival,
      quantity: 'altitude',
      bound: 'max',
      reference: 1000,
      fails: off > tol + 1e-9,
      // The margin is what is left of the tolerance (the tolerance is the limit here).
      margin: tol > 0 ? (tol - off) / tol : off > 1e-9 ? -1 : 1,
      subject: last >= 0 ? legName(last, plan.legs[last]!) : undefined,
      detail: `The last leg ends at ${fmt(end_h_m)} m; the arrival elevation is ${fmt(arrival)} m (tolerance ${fmt(tol)} m).`,
    });
  }
  return inputs;
}
