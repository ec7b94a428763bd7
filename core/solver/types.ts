/**
 * What the mission solver returns: plain data for screens, files and the CLI.
 * All quantities SI. Nothing here is ever NaN or Infinity; a leg that cannot be
 * flown carries `error` and the legs after it are reported as not reached.
 */
import type { LegKind } from '../plan/schema.ts';

export type CheckState = 'ok' | 'tight' | 'fails';

/**
 * What stopped a failed leg: a flight limit (stall margin, power, rate of climb, the
 * consumable, no ground speed in the wind, no holding station in an orbit), a leg refused
 * before it started (its setup cannot be flown), or another limit of the point model.
 */
export type StopCause =
  'stall' | 'power' | 'climb' | 'consumable' | 'wind' | 'station' | 'refused' | 'other';
export type Consumable = 'fuel' | 'battery';

/** The aircraft's state at a point along the mission. */
export interface FlightState {
  t_s: number;
  /** Ground distance from the start of the mission. */
  x_m: number;
  /** Altitude above mean sea level. */
  h_m: number;
  mass_kg: number;
  /** Fuel on board (0 for electric). */
  fuel_kg: number;
  /** Usable battery energy left (0 for fuel burners). */
  energy_J: number;
}

/** Samples along a leg for charts; arrays of equal length, first = leg start, last = leg end. */
export interface LegSeries {
  t_s: number[];
  x_m: number[];
  h_m: number[];
  mass_kg: number[];
  fuel_kg: number[];
  energy_J: number[];
  tas_m_s: number[];
}

export interface Span {
  min: number;
  max: number;
}

export interface LegResult {
  index: number;
  id: string;
  kind: LegKind;
  label: string;
  /** 'flown' = completed; 'failed' = could not be completed (see error); 'notReached' = after a failure. */
  status: 'flown' | 'failed' | 'notReached';
  /** Why the leg failed, naming the field and limit where there is one. */
  error: string | null;
  /** For a failed leg: the limit that stopped it (the Monte Carlo counts failures by it). */
  stopCause?: StopCause;
  start: FlightState;
  end: FlightState;
  time_s: number;
  groundDistance_m: number;
  airDistance_m: number;
  fuelUsed_kg: number;
  energyUsed_J: number;
  /** Mean true airspeed along the flight path: ∫V dt / time (airDistance_m is horizontal). */
  meanTas_m_s: number;
  meanGroundSpeed_m_s: number;
  /** Lift coefficient and lift-to-drag ratio over the leg (0..0 for allowance legs). */
  CL: Span;
  LD: Span;
  /** Smallest airspeed / stall speed ratio over the leg (0 for allowance legs). */
  minStallRatio: number;
  /** Largest power (or thrust power) required, and the power available at that point, W. */
  powerRequired_W: number;
  powerAvailable_W: number;
  /** Wind components against the course: + headwind, + crosswind from the right. */
  headwind_m_s: number;
  crosswind_m_s: number;
  /** Heading flown (degrees true) to hold the course in the wind. */
  heading_deg: number;
  /** Accepted integrator steps. */
  steps: number;
  series: LegSeries;
  /**
   * With a plan route, for a leg that names a waypoint: the waypoint it flies to and the
   * true course it takes from the route (the initial course of the geodesic).
   */
  toWaypoint?: string;
  course_deg?: number;
  /** The waypoint reached at the end of this leg (index in plan.route.waypoints). */
  waypointReached?: { id: string; name: string; index: number };
}

export interface Check {
  /**
   * Stable id: `mtow`, `tank`, `reserve`, `socFloor`, `ceiling` (plan-level: the highest
   * altitude of the mission), per leg `stall:3`, `power:3`, `climb:3`,
   * `station:3` (a loiter in wind), with an airfield `takeoffRun`, `launch`, `landingRun`,
   * and the mission shape `shape:order`, `shape:arrival`, `shape:flight` (shapeChecks.ts).
   */
  id: string;
  label: string;
  legIndex: number | null;
  /** The value compared and its limit, SI; `quantity` tells how to format them. */
  value: number;
  limit: number;
  quantity:
    | 'mass'
    | 'fuelMass'
    | 'energy'
    | 'ratio'
    | 'power'
    | 'altitude'
    | 'verticalSpeed'
    | 'airspeed'
    | 'volume'
    | 'distance'
    | 'time'
    /** A number of things (legs out of order): a plain count. */
    | 'count';
  /** Relative margin: (limit − value)/limit for upper limits, (value − limit)/limit for lower ones. */
  margin: number;
  state: CheckState;
  /** One plain sentence for the verdict list, in SI (describe.ts words it in any unit system). */
  detail: string;
  /** The leg the sentence names: the leg checked, or for `ceiling` the leg that goes highest. */
  subject?: string;
  /** Safety factor already applied to `value` (runway checks: value = factor × distance). */
  factor?: number;
  /** Why the numbers could not be worked out (e.g. the take-off run cannot reach lift-off); the check fails. */
  reason?: string;
  /** The reserve check of a mission that was not completed: it fails whatever the numbers say. */
  incomplete?: boolean;
  /** The reserve check when the reserve cannot be computed or flown: why (the check fails). */
  reserveProblems?: ReserveProblem[];
  /** The reserve check: the final reserve's time and rule, and the times on landing (s). */
  reserveTime?: {
    final_s: number;
    rule: FinalReserveSummary['rule'];
    required_s: number;
    remaining_s: number;
  };
  /**
   * A stall check on a leg whose speed the planner chose (best range, endurance, rate of
   * climb, glide): the speed keeps the stall margin by construction, so the check is
   * information ("limited by the stall margin" when it sits there), never tight or failing.
   */
  chosenSpeed?: { atStallMargin: boolean };
  /** Mission-shape checks: the legs named (0-based). */
  legIndices?: number[];
  /** `shape:order`: each leg that cannot be flown where it stands, and why. */
  orderProblems?: {
    legIndex: number;
    /** The leg's name, and the landing it follows ('' for a descent below the field). */
    leg: string;
    other: string;
    why: 'takeoffAfterLanding' | 'flightAfterLanding' | 'belowField';
    /** belowField: the descent's target altitude and the lower field's elevation (m). */
    altitude_m: number;
    field_m: number;
  }[];
  /**
   * Jet power checks: the same point as thrust (N), required and available (value and limit
   * stay thrust power, W); a jet's thrust is what its pilot and engineer read.
   */
  thrustRequired_N?: number;
  thrustAvailable_N?: number;
}

export interface ReserveBreakdown {
  /** Amounts in kg of fuel (fuel burners) or J of usable energy (electric). */
  contingency: number;
  alternate: number;
  hold: number;
  /** Battery floor (electric only). */
  floor: number;
  total: number;
}

/** How the final reserve (the timed hold) was flown. */
export interface FinalReserveSummary {
  /** 'normalCruise': the plan's cruise speed schedule; 'bestEndurance': least consumption per time. */
  rule: 'normalCruise' | 'bestEndurance';
  /** 'holdAltitude': the policy's hold altitude; 'lastCruise': where the last cruise leg starts. */
  level: 'holdAltitude' | 'lastCruise';
  altitude_m: number;
  time_s: number;
  /** The cruise leg whose speed schedule was flown (−1: best endurance, or no cruise leg: best range). */
  cruiseLegIndex: number;
  /** Consumption of the climb from the arrival field and of the timed part (kg or J). */
  climb: number;
  timed: number;
  /** Mean consumption of the timed part per second: kg/s of fuel or W of battery energy. */
  rate: number;
  /** Mean true airspeed of the timed part. */
  tas_m_s: number;
}

/** Why a reserve could not be computed or flown: the reserve check fails with it. */
export interface ReserveProblem {
  part: 'hold' | 'alternate';
  why: 'belowField' | 'aboveCeiling' | 'powerShort' | 'cannotClimb' | 'notFlown';
  /** The altitude concerned (MSL). */
  altitude_m: number;
  /**
   * The limit broken: the lowest allowed altitude (belowField), the ceiling (aboveCeiling,
   * pressure altitude), the rate-of-climb floor (cannotClimb), the power available (W).
   */
  limit: number;
  /** powerShort: thrust power required and available, W (0 otherwise). */
  required_W: number;
  available_W: number;
  /** The same in words, SI. */
  message: string;
}

export interface PlanResult {
  consumable: Consumable;
  legs: LegResult[];
  /** True when every leg was flown. */
  completed: boolean;
  /** First leg that could not be flown, with the reason. */
  failure: { legIndex: number; message: string } | null;
  takeoffMass_kg: number;
  totals: {
    time_s: number;
    groundDistance_m: number;
    airDistance_m: number;
    fuelUsed_kg: number;
    energyUsed_J: number;
  };
  /** What is left on landing (fuel kg or usable energy J) and as a fraction of the start amount. */
  landing: { remaining: number; fractionOfStart: number; soc: number };
  reserve: {
    required: ReserveBreakdown;
    /** Landed with at least the required reserve, and the reserve could be computed and flown. */
    kept: boolean;
    margin: number;
    /** How the final reserve was flown (finalReserve.ts). */
    final: FinalReserveSummary;
    /** Why the reserve could not be computed or flown (empty when it was). */
    problems: ReserveProblem[];
    /**
     * The required reserve and what is left on landing as time at the final reserve's mean
     * consumption rate (0 when no final reserve is set or it could not be flown).
     */
    requiredTime_s: number;
    remainingTime_s: number;
  };
  checks: Check[];
  /** Worst state among the checks; 'fails' when any leg failed. */
  verdict: CheckState;
  /** Non-fatal remarks: inputs outside common practice, clipped speeds, etc. */
  warnings: string[];
}
