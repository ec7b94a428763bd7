/**
 * Payload–range diagram (the classic corner points; Raymer, Aircraft Design, ch. 17 and
 * Torenbeek, Synthesis of Subsonic Airplane Design, ch. 11 — from memory). Each range comes
 * from the real solver flying a simple mission built from the user's plan: its take-off,
 * climb, descent and landing legs are kept, the cruise legs become one "cruise until the
 * fuel is spent" leg at the first cruise leg's speed, altitude, course and wind, loiters are
 * dropped, and the reserve policy stays. The cruise fuel (or energy) is the amount that
 * lands with exactly the required reserve, found by a bracketed root search.
 */
import type { CruiseLeg, Leg, Plan } from '../plan/schema.ts';
import type { PlanResult } from '../solver/types.ts';
import { InputError, requireFinite } from '../errors.ts';
import {
  clonePlan,
  countOption,
  firstLegIndex,
  reserveMargin,
  solveForSearch,
  tankCapacity_kg,
} from './planTools.ts';
import { bracketedRoot } from './search1d.ts';

export interface PayloadRangePoint {
  payload_kg: number;
  /** Ground distance of the whole simple mission (climb and descent included). */
  range_m: number;
  /** Fuel on board at take-off (0 for electric). */
  fuel_kg: number;
  /** Nominal pack energy (0 for fuel burners). */
  energy_J: number;
  takeoffMass_kg: number;
  /** Fuel (kg) or usable battery energy (J) the cruise leg uses: the rest covers the other legs and the reserve. */
  cruiseAmount: number;
  /** False when the load cannot even cover the climb, descent and reserve (range 0). */
  feasible: boolean;
}

export interface PayloadRangeOptions {
  /** Largest payload (default: the plan's payload; the schema has no separate structural limit). */
  maxPayload_kg?: number;
  /** Electric only: points from maximum to zero payload (default 5, at least 2). */
  points?: number;
}

/** The simple mission: non-cruise legs kept around one cruise leg that ends by consumable. */
export function rangeMission(plan: Plan): { plan: Plan; cruiseIndex: number } {
  const first = firstLegIndex(plan, 'cruise');
  if (first < 0) throw new InputError('legs', 'no cruise leg', 'a plan with a cruise leg');
  let last = first;
  plan.legs.forEach((l, i) => {
    if (l.kind === 'cruise') last = i;
  });
  const keep = (l: Leg) => l.kind !== 'loiter' && l.kind !== 'cruise';
  const copy = clonePlan(plan);
  const before = copy.legs.slice(0, first).filter(keep);
  const after = copy.legs.slice(last + 1).filter(keep);
  const firstCruise = copy.legs[first] as CruiseLeg;
  const electric = plan.aircraft.powerplant.type === 'electric';
  const cruise: CruiseLeg = {
    ...firstCruise,
    id: `${firstCruise.id}-range`,
    label: 'Cruise until the fuel or energy is spent',
    // Placeholder amount; rangeAt sets the real one.
    end: electric ? { by: 'energy', energy_J: 1 } : { by: 'fuel', fuel_kg: 1 },
  };
  copy.legs = [...before, cruise, ...after];
  return { plan: copy, cruiseIndex: before.length };
}

/** Sets the mission's cruise amount (kg or J). */
export function setCruiseAmount(mission: Plan, cruiseIndex: number, amount: number): void {
  const leg = mission.legs[cruiseIndex] as CruiseLeg;
  leg.end =
    leg.end.by === 'energy' ? { by: 'energy', energy_J: amount } : { by: 'fuel', fuel_kg: amount };
}

/**
 * Range of the simple mission at a given payload and fuel (or the plan's battery): the
 * cruise amount X solves reserveMargin(X) = 0; the margin falls as X grows.
 */
function rangeAt(
  mission: Plan,
  cruiseIndex: number,
): { range_m: number; cruiseAmount: number; feasible: boolean } {
  const solveWith = (x: number): PlanResult => {
    setCruiseAmount(mission, cruiseIndex, x);
    return solveForSearch(mission);
  };
  const pp = mission.aircraft.powerplant;
  // Total consumable on board: fuel kg, or usable pack energy J.
  const onBoard =
    pp.type === 'electric' ? pp.battery.energy_J * pp.battery.usableFraction : pp.fuel.load_kg;
  if (!(onBoard > 0)) return { range_m: 0, cruiseAmount: 0, feasible: false };
  const xMin = 1e-9 * onBoard;
  const r0 = solveWith(xMin);
  const m0 = reserveMargin(r0);
  if (!r0.completed || !(m0 > 0)) return { range_m: 0, cruiseAmount: 0, feasible: false };
  // The root lies near the margin itself (less what the contingency takes); widen if needed.
  let xHi = Math.min(m0, onBoard);
  for (let n = 0; n < 60 && xHi < onBoard && reserveMargin(solveWith(xHi)) > 0; n++) {
    xHi = Math.min(onBoard, xHi * 1.05 + 1e-6 * onBoard);
  }
  const x = bracketedRoot(
    (v) => reserveMargin(solveWith(v)),
    xMin,
    xHi,
    1e-10 * onBoard,
    1e-9 * onBoard,
  );
  // Report the side of the root that keeps the reserve.
  let cruiseAmount = x;
  let r = solveWith(x);
  if (reserveMargin(r) < 0 || !r.completed) {
    cruiseAmount = Math.max(xMin, x * (1 - 1e-9));
    r = solveWith(cruiseAmount);
  }
  return r.completed
    ? { range_m: r.totals.groundDistance_m, cruiseAmount, feasible: true }
    : { range_m: 0, cruiseAmount: 0, feasible: false };
}

function point(plan: Plan, payload_kg: number, fuel_kg: number): PayloadRangePoint {
  const { plan: mission, cruiseIndex } = rangeMission(plan);
  mission.aircraft.mass.payload_kg = payload_kg;
  const pp = mission.aircraft.powerplant;
  if (pp.type !== 'electric') pp.fuel.load_kg = fuel_kg;
  const { range_m, cruiseAmount, feasible } = rangeAt(mission, cruiseIndex);
  const energy_J = pp.type === 'electric' ? pp.battery.energy_J : 0;
  const pack_kg = pp.type === 'electric' ? pp.battery.mass_kg : 0;
  return {
    payload_kg,
    range_m,
    fuel_kg: pp.type === 'electric' ? 0 : fuel_kg,
    energy_J,
    takeoffMass_kg: mission.aircraft.mass.empty_kg + payload_kg + fuel_kg + pack_kg,
    cruiseAmount,
    feasible,
  };
}

/**
 * Corner points, in order of falling payload and rising range. Fuel burners: (max payload,
 * fuel to MTOW or a full tank), (full tank, payload to MTOW), (full tank, zero payload).
 * Electric: the pack is fixed, so range is swept from the largest payload MTOW allows to
 * zero payload.
 */
export function payloadRange(
  plan: Plan,
  options: PayloadRangeOptions = {},
): { points: PayloadRangePoint[] } {
  const { mtow_kg, empty_kg } = plan.aircraft.mass;
  const pp = plan.aircraft.powerplant;
  const room = mtow_kg - empty_kg - (pp.type === 'electric' ? pp.battery.mass_kg : 0);
  if (!(room > 0)) {
    throw new InputError('aircraft.mass.mtow_kg', mtow_kg, 'above the empty mass (and battery)');
  }
  const asked = options.maxPayload_kg ?? plan.aircraft.mass.payload_kg;
  const maxPayload = Math.min(
    requireFinite('options.maxPayload_kg', asked, 0, 200_000, 'kg'),
    room,
  );
  if (pp.type === 'electric') {
    const n = countOption('options.points', options.points, 5, 2);
    const points: PayloadRangePoint[] = [];
    for (let j = 0; j < n; j++) points.push(point(plan, (maxPayload * (n - 1 - j)) / (n - 1), 0));
    return { points };
  }
  const tank = Math.min(tankCapacity_kg(pp.fuel), room);
  const fuelA = Math.min(room - maxPayload, tank);
  const points = [point(plan, maxPayload, fuelA)];
  if (fuelA < tank) points.push(point(plan, room - tank, tank));
  if (points[points.length - 1]?.payload_kg !== 0) points.push(point(plan, 0, tank));
  return { points };
}
