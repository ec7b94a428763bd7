/**
 * The mission solver: flies the plan's legs in order from the departure elevation with the
 * take-off mass and the full consumable, then works out the reserve required on landing and
 * the feasibility checks (with the airfield's take-off, launch and landing checks when the
 * plan has an airfield, fieldChecks.ts). With a plan route, legs that name a waypoint take
 * their course (and a cruise its distance) from the route (routeTrack.ts), and the legs that
 * reach waypoints say so (routeProgress.ts turns that into per-waypoint estimates). Legs set
 * to the winds-aloft table get its wind and temperature at every altitude (model.ts, point.ts).
 * A leg that cannot be flown stops the mission there
 * (the result keeps everything up to that point; later legs are 'notReached'). Never throws
 * for a plan that passed PlanSchema; every number in the result is finite (guard.ts).
 */
import { InputError } from '../errors.ts';
import type { Leg, LoiterLeg, Plan } from '../plan/schema.ts';
import { missionChecks, verdictOf, type CheckInput } from './checks.ts';
import { fieldChecks } from './fieldChecks.ts';
import { oneEngineOutCheck } from './oneEngineOut.ts';
import { crashedResult } from './crashed.ts';
import { guardResult } from './guard.ts';
import { baseResult, legName, refusedLeg, type LegContext } from './legs/common.ts';
import { flyLeg, type LegOutcome } from './legs/index.ts';
import { searchLoiterConsumption } from './loiterReserve.ts';
import { withMissionWind } from './missionWind.ts';
import { reynoldsWarnings } from './reynolds.ts';
import { buildModel, RELATIVE_TOLERANCE, type FlightModel, type SolveTolerance } from './model.ts';
import { requiredReserves } from './reserves.ts';
import { shapeChecks } from './shapeChecks.ts';
import {
  alongAfter,
  annotateLeg,
  flyRouteCruise,
  routeTrack,
  type RouteTrack,
} from './routeTrack.ts';
import type { MissionState } from './segment.ts';
import type { LegResult, PlanResult } from './types.ts';

export type { SolveTolerance } from './model.ts';

export interface SolveOptions {
  /** Chart samples per flight leg (default 24, at least 2). */
  samplesPerLeg?: number;
  /**
   * Integration accuracy: 'precise' (default; relative tolerance 1e-9) or 'fast' (1e-6, for
   * Monte Carlo samples and sweeps; agrees with 'precise' to about 1e-6 relative).
   */
  tolerance?: SolveTolerance;
}

export const DEFAULT_SAMPLES_PER_LEG = 24;

/** Largest samplesPerLeg accepted (a chart needs far fewer; this bounds the result's size). */
export const MAX_SAMPLES_PER_LEG = 10_000;

/**
 * Solves the plan. Throws InputError only for bad `options`; for any plan that passed
 * PlanSchema it returns a result (infeasible legs come back as failures).
 */
export function solvePlan(plan: Plan, options: SolveOptions = {}): PlanResult {
  const samples = options.samplesPerLeg ?? DEFAULT_SAMPLES_PER_LEG;
  if (!Number.isInteger(samples) || samples < 2 || samples > MAX_SAMPLES_PER_LEG) {
    throw new InputError('samplesPerLeg', samples, `an integer from 2 to ${MAX_SAMPLES_PER_LEG}`);
  }
  const tolerance = options.tolerance ?? 'precise';
  if (!Object.hasOwn(RELATIVE_TOLERANCE, tolerance)) {
    throw new InputError('tolerance', tolerance, "'precise' or 'fast'");
  }
  try {
    return guardResult(solveMission(withMissionWind(plan), samples, tolerance));
  } catch (e) {
    return guardResult(crashedResult(plan, e));
  }
}

interface Flown {
  outcomes: LegOutcome[];
  end: MissionState;
  failedAt: number | null;
  warnings: string[];
  /** Consumption of the take-off and landing allowance legs (those before `from` included). */
  allowances: number;
}

function isAllowance(leg: Leg): boolean {
  return leg.kind === 'takeoff' || leg.kind === 'landing';
}

/** What every flight of the legs shares: the model, the plan and the legs as flown. */
interface Mission {
  model: FlightModel;
  plan: Plan;
  /** plan.legs, with the route's course where a leg names a waypoint. */
  legs: readonly Leg[];
  route: RouteTrack | null;
}

function isUntilReserve(leg: Leg): leg is LoiterLeg {
  return leg.kind === 'loiter' && leg.end.by === 'reserve';
}

/** Flies one leg (route-aware): `along_m` of the way to the next waypoint already flown. */
function flyOne(
  m: Mission,
  ctx: LegContext,
  state: MissionState,
  consume: number,
  along_m: number,
): LegOutcome {
  const i = ctx.index;
  const leg = m.legs[i]!;
  const route = m.route;
  if (route === null) return flyLeg(ctx, leg, state, consume);
  if (route.failure !== null && route.failure.legIndex === i) {
    return refusedLeg(ctx, leg, state, route.failure.message);
  }
  const routed = route.routed[i];
  const o = routed?.stretch
    ? flyRouteCruise(ctx, m.legs, routed, state, along_m)
    : flyLeg(ctx, leg, state, consume);
  if (routed !== undefined) annotateLeg(m.plan, routed, o);
  return o;
}

/**
 * Flies legs[from..] from `state`. In a trial (samples 0) every "until reserve" loiter is
 * flown for nothing: the loiter being searched for takes all the spare. `allowances`: what
 * the allowance legs before `from` used.
 */
function flyLegs(
  m: Mission,
  from: number,
  state: MissionState,
  samples: number,
  along_m: number,
  allowances = 0,
): Flown {
  const outcomes: LegOutcome[] = [];
  const warnings: string[] = [];
  let s = state;
  let along = along_m;
  let fixed = allowances;
  for (let i = from; i < m.legs.length; i++) {
    const leg = m.legs[i]!;
    const ctx: LegContext = { model: m.model, index: i, samples };
    let consume = 0;
    if (isUntilReserve(leg) && samples > 0) {
      const found = searchUntilReserve(m, i, s, along, fixed);
      consume = found.consume;
      if (found.status === 'none') {
        warnings.push(
          `${legName(i, leg)}: no loiter is possible: the rest of the plan and the reserve already need more than is on board.`,
        );
      }
    }
    const o = flyOne(m, ctx, s, consume, along);
    outcomes.push(o);
    warnings.push(...o.warnings);
    if (m.route !== null) along = alongAfter(m.route, i, along, o.result.groundDistance_m);
    if (isAllowance(leg)) fixed += s.left - o.end.left;
    s = o.end;
    if (o.failed) return { outcomes, end: s, failedAt: i, warnings, allowances: fixed };
  }
  return { outcomes, end: s, failedAt: null, warnings, allowances: fixed };
}

/** Consumption the contingency applies to: the trip without its allowance legs. */
function contingencyBase(model: FlightModel, flown: Flown): number {
  return model.consumableStart - flown.end.left - flown.allowances;
}

function searchUntilReserve(
  m: Mission,
  index: number,
  start: MissionState,
  along_m: number,
  allowances: number,
) {
  const { model, plan } = m;
  const surplus = (c: number): number | null => {
    const loiter = flyOne(m, { model, index, samples: 0 }, start, c, along_m);
    if (loiter.failed) return null;
    const along = m.route ? alongAfter(m.route, index, along_m, loiter.result.groundDistance_m) : 0;
    const rest = flyLegs(m, index + 1, loiter.end, 0, along, allowances);
    if (rest.failedAt !== null) return null;
    const trip = contingencyBase(model, rest);
    return rest.end.left - requiredReserves(model, plan, rest.end, trip).required.total;
  };
  const scale = Math.max(model.consumableStart, 1e-300);
  return searchLoiterConsumption(
    surplus,
    Math.max(start.left, 0),
    1 + plan.reserves.contingencyFraction,
    // The surplus is known to about the integrator's tolerance; ask no more of the search.
    0.1 * model.rtol * scale,
  );
}

function solveMission(plan: Plan, samples: number, tolerance: SolveTolerance): PlanResult {
  const model = buildModel(plan, tolerance);
  const route = routeTrack(plan);
  const mission: Mission = { model, plan, legs: route ? route.legs : plan.legs, route };
  const env = plan.environment;
  const start: MissionState = {
    t_s: 0,
    x_m: 0,
    air_m: 0,
    path_m: 0,
    h_m: env.departureElevation_m,
    mass_kg: model.takeoffMass_kg,
    left: model.consumableStart,
  };
  const flown = flyLegs(mission, 0, start, samples, 0);
  const end = flown.end;
  const completed = flown.failedAt === null;
  const legs: LegResult[] = flown.outcomes.map((o) => o.result);
  for (let i = legs.length; i < plan.legs.length; i++) {
    legs.push(
      baseResult({ model, index: i, samples }, plan.legs[i]!, end, end, 'notReached', null),
    );
  }
  const trip = model.consumableStart - end.left;
  const reserve = requiredReserves(model, plan, end, contingencyBase(model, flown));
  const total = reserve.required.total;
  const warnings = [...(route?.warnings ?? []), ...flown.warnings];
  const field = fieldChecks(model, plan, end.mass_kg);
  warnings.push(...field.warnings);
  warnings.push(...reynoldsWarnings(model, plan, legs));
  const rate = reserve.computed ? reserve.final.rate : 0;
  const requiredTime_s = rate > 0 ? total / rate : 0;
  const remainingTime_s = rate > 0 ? Math.max(end.left, 0) / rate : 0;
  const checks = missionChecks(
    model,
    plan,
    flown.outcomes,
    {
      completed,
      remaining: end.left,
      requiredReserve: total,
      problems: reserve.problems,
      final: reserve.final,
      requiredTime_s,
      remainingTime_s,
    },
    [
      ...shapeChecks(plan, flown.outcomes, completed, end.h_m),
      ...field.inputs,
      ...oneEngineOutInputs(model, plan, flown.outcomes, warnings),
    ],
  );
  const fuel = model.consumable === 'fuel';
  const startAmount = model.consumableStart;
  const fraction = startAmount > 0 ? end.left / startAmount : 0;
  const reserveRef = Math.max(total, 1e-6 * (startAmount > 1e-9 ? startAmount : 1));
  const failedLeg = flown.failedAt === null ? null : flown.outcomes[flown.failedAt];
  return {
    consumable: model.consumable,
    legs,
    completed,
    failure:
      flown.failedAt === null
        ? null
        : { legIndex: flown.failedAt, message: failedLeg?.result.error ?? 'leg failed' },
    takeoffMass_kg: model.takeoffMass_kg,
    totals: {
      time_s: end.t_s,
      groundDistance_m: end.x_m,
      airDistance_m: end.air_m,
      fuelUsed_kg: fuel ? trip : 0,
      energyUsed_J: fuel ? 0 : trip,
    },
    landing: {
      remaining: end.left,
      fractionOfStart: fraction,
      soc: !fuel && model.usableEnergy_J > 0 ? end.left / model.usableEnergy_J : fraction,
    },
    reserve: {
      required: reserve.required,
      kept: completed && reserve.computed && end.left >= total,
      margin: (end.left - total) / reserveRef,
      final: reserve.final,
      problems: reserve.problems,
      requiredTime_s,
      remainingTime_s,
    },
    checks,
    verdict: verdictOf(checks, !completed),
    warnings,
  };
}

/** The one-engine-out estimate of a multi-engine aircraft (oneEngineOut.ts), or a warning. */
function oneEngineOutInputs(
  model: FlightModel,
  plan: Plan,
  outcomes: readonly LegOutcome[],
  warnings: string[],
): CheckInput[] {
  try {
    const c = oneEngineOutCheck(model, plan, outcomes);
    return c === null ? [] : [c];
  } catch (e) {
    warnings.push(
      `One-engine-inoperative estimate not computed: ${e instanceof Error ? e.message : String(e)}`,
    );
    return [];
  }
}
