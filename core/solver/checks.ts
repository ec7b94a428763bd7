/**
 * Feasibility checks with margins (DESIGN.md §3, common practice): take-off mass ≤ MTOW,
 * fuel volume ≤ tank, reserve kept on landing, per leg speed ≥ stallFactor × V_stall, power
 * required ≤ available (for a jet also as thrust), rate of climb ≥ the service-ceiling rate;
 * for the plan, the highest pressure altitude ≤ ceiling (an aircraft's ceiling is a pressure
 * altitude: what the engine and wing see) and the battery never below its floor (airfield
 * checks: fieldChecks.ts). A per-leg check names its leg in its label; its sentence does not
 * repeat it.
 * Margin: (limit − value)/limit for upper limits, (value − limit)/limit for lower ones;
 * fails below 0, tight below settings.tightMargin.
 */
import type { Leg, Plan } from '../plan/schema.ts';
import { fuelDensity_kg_L } from '../propulsion/index.ts';
import type { LegOutcome } from './legs/index.ts';
import { legName } from './legs/common.ts';
import type { FlightModel } from './model.ts';
import { fmt } from './point.ts';
import { LIMIT_TOLERANCE } from './segment.ts';
import type { Check, CheckState, FinalReserveSummary, ReserveProblem } from './types.ts';

export interface CheckInput {
  id: string;
  label: string;
  legIndex: number | null;
  value: number;
  limit: number;
  quantity: Check['quantity'];
  /** 'max': value must not exceed limit; 'min': value must not fall below it. */
  bound: 'max' | 'min';
  /** Scale of the margin when the limit is (near) 0. */
  reference: number;
  detail: string;
  /** Fails whatever the numbers say (the reserve of a mission that was not completed). */
  fails?: boolean;
  /** Replaces the computed margin (a check whose numbers could not be worked out). */
  margin?: number;
  subject?: string;
  factor?: number;
  reason?: string;
  incomplete?: boolean;
  thrustRequired_N?: number;
  thrustAvailable_N?: number;
  reserveProblems?: ReserveProblem[];
  reserveTime?: Check['reserveTime'];
  chosenSpeed?: Check['chosenSpeed'];
  legIndices?: number[];
  orderProblems?: Check['orderProblems'];
}

export function makeCheck(c: CheckInput, tight: number): Check {
  // A limit at or near 0 makes a relative margin meaningless: measure against the scale.
  const scale = c.reference > 1e-9 ? c.reference : 1;
  const ref = Math.max(Math.abs(c.limit), 1e-6 * scale);
  const margin = c.margin ?? (c.bound === 'max' ? c.limit - c.value : c.value - c.limit) / ref;
  // A speed the planner chose keeps the stall margin by construction: information only.
  const state: CheckState = c.chosenSpeed
    ? 'ok'
    : c.fails || margin < -LIMIT_TOLERANCE
      ? 'fails'
      : margin < tight
        ? 'tight'
        : 'ok';
  // Built field by field: a rest-spread copy is several times slower in V8 and leaves an
  // object shape that later walks (guard.ts) are slow on.
  const check: Check = {
    id: c.id,
    label: c.label,
    legIndex: c.legIndex,
    value: c.value,
    limit: c.limit,
    quantity: c.quantity,
    margin,
    state,
    detail: c.detail,
  };
  if (c.subject !== undefined) check.subject = c.subject;
  if (c.factor !== undefined) check.factor = c.factor;
  if (c.reason !== undefined) check.reason = c.reason;
  if (c.incomplete) check.incomplete = true;
  if (c.thrustRequired_N !== undefined) check.thrustRequired_N = c.thrustRequired_N;
  if (c.thrustAvailable_N !== undefined) check.thrustAvailable_N = c.thrustAvailable_N;
  if (c.reserveProblems !== undefined) check.reserveProblems = c.reserveProblems;
  if (c.reserveTime !== undefined) check.reserveTime = c.reserveTime;
  if (c.chosenSpeed !== undefined) check.chosenSpeed = c.chosenSpeed;
  if (c.legIndices !== undefined) check.legIndices = c.legIndices;
  if (c.orderProblems !== undefined) check.orderProblems = c.orderProblems;
  return check;
}

export interface MissionSummary {
  completed: boolean;
  remaining: number;
  requiredReserve: number;
  /** Why the reserve cannot be computed or flown (the reserve check then fails). */
  problems: readonly ReserveProblem[];
  final: FinalReserveSummary;
  /** Required and remaining as time at the final reserve's rate (0: not known). */
  requiredTime_s: number;
  remainingTime_s: number;
}

export function missionChecks(
  model: FlightModel,
  plan: Plan,
  legs: readonly LegOutcome[],
  mission: MissionSummary,
  extra: readonly CheckInput[] = [],
): Check[] {
  const tight = plan.settings.tightMargin;
  const inputs: CheckInput[] = [];
  const ac = plan.aircraft;
  const tom = model.takeoffMass_kg;
  inputs.push({
    id: 'mtow',
    label: 'Take-off mass',
    legIndex: null,
    value: tom,
    limit: ac.mass.mtow_kg,
    quantity: 'mass',
    bound: 'max',
    reference: 1,
    detail: `Take-off mass ${fmt(tom)} kg against a maximum of ${fmt(ac.mass.mtow_kg)} kg.`,
  });
  const pp = ac.powerplant;
  if (pp.type !== 'electric') {
    const volume_L = pp.fuel.load_kg / fuelDensity_kg_L(pp.fuel);
    inputs.push({
      id: 'tank',
      label: 'Fuel in the tanks',
      legIndex: null,
      value: volume_L * 1e-3,
      limit: pp.fuel.tankCapacity_L * 1e-3,
      quantity: 'volume',
      bound: 'max',
      reference: 1,
      detail: `Fuel load ${fmt(volume_L)} L against a tank capacity of ${fmt(pp.fuel.tankCapacity_L)} L.`,
    });
  }
  const fuel = model.consumable === 'fuel';
  const unit = fuel ? 'kg' : 'J';
  inputs.push({
    id: 'reserve',
    label: 'Reserve on landing',
    legIndex: null,
    value: mission.remaining,
    limit: mission.requiredReserve,
    quantity: fuel ? 'fuelMass' : 'energy',
    bound: 'min',
    reference: model.consumableStart,
    fails: !mission.completed || mission.problems.length > 0,
    incomplete: !mission.completed,
    reserveProblems: [...mission.problems],
    reserveTime: {
      final_s: mission.final.time_s,
      rule: mission.final.rule,
      required_s: mission.requiredTime_s,
      remaining_s: mission.remainingTime_s,
    },
    detail: reserveDetail(mission, unit),
  });
  legs.forEach((o, i) => legChecks(inputs, plan, o, i));
  ceilingCheck(inputs, plan, legs);
  if (!fuel) {
    const soc = model.usableEnergy_J > 0 ? mission.remaining / model.usableEnergy_J : 0;
    const floor = plan.reserves.socFloor;
    inputs.push({
      id: 'socFloor',
      label: 'Battery floor',
      legIndex: null,
      value: soc,
      limit: floor,
      quantity: 'ratio',
      bound: 'min',
      reference: 1,
      detail: `Lowest charge ${fmt(100 * soc)} % of usable energy against a floor of ${fmt(100 * floor)} %.`,
    });
  }
  inputs.push(...extra);
  return inputs.map((c) => makeCheck(c, tight));
}

function reserveDetail(mission: MissionSummary, unit: string): string {
  const f = mission.final;
  const rule = f.rule === 'normalCruise' ? 'normal cruise' : 'best endurance';
  const final =
    f.time_s > 0
      ? ` (final reserve ${fmt(f.time_s / 60)} min at ${rule}, ${fmt(f.altitude_m)} m)`
      : '';
  if (!mission.completed) {
    return `The mission is not completed; ${fmt(mission.remaining)} ${unit} left where it stops, ${fmt(mission.requiredReserve)} ${unit} of reserve required.`;
  }
  if (mission.problems.length > 0) {
    return `The reserve cannot be flown: ${mission.problems.map((p) => p.message).join('; ')}.`;
  }
  const minutes = (t: number) => (t > 0 ? ` (${fmt(t / 60)} min)` : '');
  return `On landing ${fmt(mission.remaining)} ${unit}${minutes(mission.remainingTime_s)} left against ${fmt(mission.requiredReserve)} ${unit}${minutes(mission.requiredTime_s)} of reserve required${final}.`;
}

/** The leg flies a speed the planner chooses (best range, endurance, rate of climb, glide). */
export function speedChosenByPlanner(leg: Leg): boolean {
  switch (leg.kind) {
    case 'climb':
      return leg.speed.kind === 'bestRate';
    case 'cruise':
      return leg.speed.kind === 'bestRange';
    case 'loiter':
      return leg.speed.kind === 'bestEndurance';
    case 'descent':
      return leg.mode.by === 'glide';
    default:
      return false;
  }
}

function legChecks(inputs: CheckInput[], plan: Plan, o: LegOutcome, i: number): void {
  const leg = plan.legs[i];
  if (!leg) return;
  const name = legName(i, leg);
  const c = o.checks;
  const sf = plan.settings.stallFactor;
  if (c.minStallRatio !== null) {
    const chosen = speedChosenByPlanner(leg);
    const atFloor = chosen && c.minStallRatio < sf * (1 + plan.settings.tightMargin);
    inputs.push({
      id: `stall:${i}`,
      label: `${name}: stall margin`,
      legIndex: i,
      value: c.minStallRatio,
      limit: sf,
      quantity: 'ratio',
      bound: 'min',
      reference: 1,
      subject: name,
      ...(chosen ? { chosenSpeed: { atStallMargin: atFloor } } : {}),
      detail: chosen
        ? atFloor
          ? `Speed chosen by the planner, limited by the stall margin: ${fmt(c.minStallRatio)} × stall speed (${sf} set).`
          : `Speed chosen by the planner: lowest ${fmt(c.minStallRatio)} × stall speed (at least ${sf} by construction).`
        : `Lowest airspeed ${fmt(c.minStallRatio)} × stall speed against ${sf}.`,
    });
  }
  if (c.power !== null) {
    const p = c.power;
    const input: CheckInput = {
      id: `power:${i}`,
      label: `${name}: power`,
      legIndex: i,
      value: p.required_W,
      limit: p.available_W,
      quantity: 'power',
      bound: 'max',
      reference: Math.max(Math.abs(p.required_W), 1),
      subject: name,
      detail: `Needs ${fmt(p.required_W)} W of thrust power where ${fmt(p.available_W)} W is available.`,
    };
    const V = p.tas_m_s ?? 0;
    if (plan.aircraft.powerplant.type === 'jet' && V > 0) {
      input.thrustRequired_N = p.required_W / V;
      input.thrustAvailable_N = p.available_W / V;
      input.detail = `Needs ${fmt(input.thrustRequired_N)} N of thrust where ${fmt(input.thrustAvailable_N)} N is available.`;
    }
    inputs.push(input);
  }
  if (c.station != null) {
    const st = c.station;
    inputs.push({
      id: `station:${i}`,
      label: `${name}: holding station`,
      legIndex: i,
      value: st.wind_m_s,
      limit: st.airspeed_m_s,
      quantity: 'airspeed',
      bound: 'max',
      reference: Math.max(st.airspeed_m_s, 1),
      subject: name,
      fails: st.failed,
      detail: st.failed
        ? `Cannot hold station: the wind of ${fmt(st.wind_m_s)} m/s is at least the loiter airspeed of ${fmt(st.airspeed_m_s)} m/s.`
        : `Wind ${fmt(st.wind_m_s)} m/s against the loiter airspeed ${fmt(st.airspeed_m_s)} m/s.`,
    });
  }
  if (c.climb !== null) {
    inputs.push({
      id: `climb:${i}`,
      label: `${name}: rate of climb`,
      legIndex: i,
      value: c.climb.min_m_s,
      limit: c.climb.floor_m_s,
      quantity: 'verticalSpeed',
      bound: 'min',
      reference: 1,
      subject: name,
      detail: `Least rate of climb ${fmt(c.climb.min_m_s)} m/s against ${fmt(c.climb.floor_m_s)} m/s.`,
    });
  }
}

/**
 * One plan-level check: the highest pressure altitude of the mission against the aircraft's
 * ceiling (altitudes above mean sea level differ from it by the QNH offset).
 */
function ceilingCheck(inputs: CheckInput[], plan: Plan, legs: readonly LegOutcome[]): void {
  let highest = -Infinity;
  let at = -1;
  // The first leg to reach the top names it (a level leg there ties within rounding).
  legs.forEach((o, i) => {
    const h = o.checks.maxPressureAltitude_m ?? o.checks.maxAltitude_m;
    if (h !== null && h > highest + 1e-6) {
      highest = h;
      at = i;
    }
  });
  const leg = plan.legs[at];
  if (leg === undefined) return;
  const name = legName(at, leg);
  const ceiling = plan.aircraft.ceiling_m;
  inputs.push({
    id: 'ceiling',
    label: 'Ceiling',
    legIndex: null,
    value: highest,
    limit: ceiling,
    quantity: 'altitude',
    bound: 'max',
    reference: 1000,
    subject: name,
    detail: `Highest pressure altitude ${fmt(highest)} m (${name}) against a ceiling of ${fmt(ceiling)} m.`,
  });
}

/** Worst state among the checks; 'fails' when any leg failed. */
export function verdictOf(checks: readonly Check[], anyLegFailed: boolean): CheckState {
  if (anyLegFailed || checks.some((c) => c.state === 'fails')) return 'fails';
  return checks.some((c) => c.state === 'tight') ? 'tight' : 'ok';
}
