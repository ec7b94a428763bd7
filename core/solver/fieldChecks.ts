/**
 * Go/no-go at the airfields: the plan's departure and arrival (plan.airfield) as feasibility
 * checks beside the mission's own.
 *
 *  - Departure runway: take-off distance to the 15 m (50 ft) screen at the take-off mass
 *    (core/field/takeoff.ts: integrated ground roll, transition and climb), with the flaps
 *    CLmax (polar.CLmaxFlaps, else CLmax), the ground-run CL of aircraft.field (0.3 if absent,
 *    common practice), the air at the field elevation with QNH and the runway's outside air
 *    temperature or the plan's ISA offset (core/field/air.ts), the headwind component of the
 *    surface wind along the runway heading, the slope and the surface. Propeller and electric
 *    thrust need the propeller diameter (static thrust by momentum theory, core/field/thrust.ts);
 *    without it the check is left out with a warning rather than guessed.
 *    × airfield.takeoffFactor must fit the runway available.
 *  - Launch: release airspeed / stall speed at least airfield.launchFactor (core/field/launch.ts).
 *  - Arrival runway: landing distance from 15 m at the landing mass (core/field/landing.ts)
 *    × airfield.landingFactor must fit the runway available.
 * A run that cannot be completed (the aircraft cannot accelerate to lift-off, or cannot stop)
 * fails its check with the reason.
 */
import { InputError } from '../errors.ts';
import { fieldAir, type FieldAir } from '../field/air.ts';
import type { GroundAircraft } from '../field/groundRun.ts';
import { DEFAULT_CL_GROUND } from '../field/groundRun.ts';
import { landingDistance, type LandingResult } from '../field/landing.ts';
import { launchCheck } from '../field/launch.ts';
import { takeoffDistance, type TakeoffResult } from '../field/takeoff.ts';
import { fieldThrustModel } from '../field/thrust.ts';
import type { Launch, Plan, Runway } from '../plan/schema.ts';
import type { CheckInput } from './checks.ts';
import type { FlightModel } from './model.ts';
import { fmt } from './point.ts';
import { windComponents } from './wind.ts';

export interface FieldChecks {
  inputs: CheckInput[];
  warnings: string[];
}

/** The air at a field: the runway's outside air temperature if given, else the plan's ISA day. */
function airAt(plan: Plan, elevation_m: number, runway: Runway | null, field: string): FieldAir {
  const env = plan.environment;
  const T = runway?.temperature_K;
  return fieldAir(
    {
      elevation_m,
      qnh_Pa: env.qnh_Pa,
      ...(T !== undefined ? { temperature_K: T } : { isaOffset_K: env.isaOffset_K }),
    },
    field,
  );
}

function groundAircraft(model: FlightModel, plan: Plan, mass_kg: number): GroundAircraft {
  return {
    mass_kg,
    wingArea_m2: model.S_m2,
    CD0: model.polar.CD0,
    k: model.polar.k,
    CLmax: model.CLmaxFlaps,
    CL_ground: plan.aircraft.field?.CLground ?? DEFAULT_CL_GROUND,
  };
}

/** What could not be computed, as a warning; anything else is a bug and propagates. */
function inputProblem(e: unknown, what: string, out: string[]): void {
  if (!(e instanceof InputError)) throw e;
  out.push(`${what} not computed: ${e.message}.`);
}

export function fieldChecks(model: FlightModel, plan: Plan, landingMass_kg: number): FieldChecks {
  const out: FieldChecks = { inputs: [], warnings: [] };
  const airfield = plan.airfield;
  if (airfield === undefined) return out;
  const env = plan.environment;
  const dep = airfield.departure;
  if (dep.by === 'runway') takeoffCheck(model, plan, dep, airfield.takeoffFactor, out);
  else if (dep.by === 'launch') launch(model, plan, dep, airfield.launchFactor, out);
  const arr = airfield.arrival;
  if (arr.by === 'runway') {
    try {
      const air = airAt(plan, env.arrivalElevation_m, arr, 'airfield.arrival');
      const wind = windComponents(arr.heading_deg, arr.surfaceWind);
      const r = landingDistance({
        ...groundAircraft(model, plan, landingMass_kg),
        rho_kg_m3: air.atm.rho_kg_m3,
        headwind_m_s: wind.headwind_m_s,
        slope: arr.slope,
        surface: arr.surface,
      });
      out.inputs.push(
        runwayInput('landingRun', 'Landing distance', r, arr, airfield.landingFactor),
      );
    } catch (e) {
      inputProblem(e, 'Landing distance', out.warnings);
    }
  }
  return out;
}

function takeoffCheck(
  model: FlightModel,
  plan: Plan,
  rw: Runway,
  factor: number,
  out: FieldChecks,
): void {
  const pp = plan.aircraft.powerplant;
  const diameter = plan.aircraft.field?.propDiameter_m;
  if (pp.type !== 'jet' && pp.propeller === undefined && diameter === undefined) {
    out.warnings.push(
      'Take-off distance not computed: the propeller diameter (aircraft.field.propDiameter_m) is needed for the static thrust.',
    );
    return;
  }
  try {
    const air = airAt(plan, plan.environment.departureElevation_m, rw, 'airfield.departure');
    const thrust = fieldThrustModel(
      pp,
      air.atm,
      air.pressureAltitude_m,
      diameter === undefined ? {} : { propDiameter_m: diameter },
      plan.aircraft,
    );
    const wind = windComponents(rw.heading_deg, rw.surfaceWind);
    const r = takeoffDistance({
      ...groundAircraft(model, plan, model.takeoffMass_kg),
      rho_kg_m3: air.atm.rho_kg_m3,
      headwind_m_s: wind.headwind_m_s,
      slope: rw.slope,
      surface: rw.surface,
      thrust,
    });
    out.inputs.push(runwayInput('takeoffRun', 'Take-off distance', r, rw, factor));
  } catch (e) {
    inputProblem(e, 'Take-off distance', out.warnings);
  }
}

function runwayInput(
  id: 'takeoffRun' | 'landingRun',
  label: string,
  r: TakeoffResult | LandingResult,
  rw: Runway,
  factor: number,
): CheckInput {
  const available = rw.available_m;
  const base = {
    id,
    label,
    legIndex: null,
    limit: available,
    quantity: 'distance' as const,
    bound: 'max' as const,
    reference: available,
    factor,
  };
  const what = id === 'takeoffRun' ? 'Take-off distance to 15 m' : 'Landing distance from 15 m';
  if (!r.ok) {
    return {
      ...base,
      value: 0,
      margin: -1,
      fails: true,
      reason: r.reason,
      detail: `${label}: ${r.reason}.`,
    };
  }
  const value = factor * r.totalDistance_m;
  return {
    ...base,
    value,
    detail: `${what} ${fmt(r.totalDistance_m)} m × ${factor} = ${fmt(value)} m against ${fmt(available)} m of runway.`,
  };
}

function launch(model: FlightModel, plan: Plan, l: Launch, factor: number, out: FieldChecks): void {
  try {
    const air = airAt(plan, plan.environment.departureElevation_m, null, 'airfield.departure');
    const r = launchCheck({
      mass_kg: model.takeoffMass_kg,
      wingArea_m2: model.S_m2,
      CLmax: model.CLmaxFlaps,
      rho_kg_m3: air.atm.rho_kg_m3,
      launchSpeed_m_s: l.releaseSpeed_m_s,
      headwind_m_s: l.headwind_m_s,
      factor,
      tightMargin: plan.settings.tightMargin,
    });
    const ratio = r.releaseAirspeed_m_s / r.stallSpeed_m_s;
    out.inputs.push({
      id: 'launch',
      label: 'Launch speed',
      legIndex: null,
      value: ratio,
      limit: factor,
      quantity: 'ratio',
      bound: 'min',
      reference: 1,
      detail: `Release airspeed ${fmt(r.releaseAirspeed_m_s)} m/s = ${fmt(ratio)} × stall speed (${fmt(r.stallSpeed_m_s)} m/s) against ${factor}.`,
    });
  } catch (e) {
    inputProblem(e, 'Launch check', out.warnings);
  }
}
