/**
 * One engine inoperative, en route (multi-engine aircraft): the best rate of climb with one
 * of N engines stopped, and the one-engine-inoperative service ceiling, as a feasibility
 * estimate against the highest altitude of the mission (common practice of en-route
 * planning: the aircraft should hold its cruise altitude, or the plan needs a drift-down).
 *
 * Model (an estimate): the remaining engines give (N − 1)/N of the maximum power or thrust at
 * each altitude (a propeller: (N − 1)/N of the disk area with the same profile factor,
 * core/propulsion/momentum.ts); the dead engine's stopped or feathered propeller and the
 * trim against the asymmetric thrust add aircraft.oeiDragIncrement to the drag coefficient
 * (default 0.003, from memory for a light twin with a feathered propeller). Quasi-steady
 * climb at the take-off mass (the heaviest, conservative), ROC = (P_avail − D·V)/W maximised
 * over [stallFactor·V_s, Mach 0.9] (Anderson, Introduction to Flight, ch. 6). The service
 * ceiling is where that best rate falls to 0.25 m/s (50 ft/min, the usual one-engine service
 * ceiling, common practice). Left out: V_MC (minimum control speed), the climb lost while
 * the engine fails and the propeller is feathered, windmilling drag of an unfeathered
 * propeller beyond the increment given.
 */
import type { Plan } from '../plan/schema.ts';
import { G0 } from '../units.ts';
import type { CheckInput } from './checks.ts';
import type { LegOutcome } from './legs/index.ts';
import { ambientFresh, type FlightModel } from './model.ts';
import { maximizeBounded } from './optimize1d.ts';
import { fmt } from './point.ts';
import { availablePower_W, type PowerConstants } from './power.ts';
import { MACH_CAP, dragCoefficientOf } from './speeds.ts';

/** Drag coefficient added with one engine out when the plan gives none (from memory). */
export const DEFAULT_OEI_DRAG_INCREMENT = 0.003;
/** Best rate of climb that defines the one-engine service ceiling: 50 ft/min (common practice). */
export const OEI_SERVICE_CLIMB_M_S = 0.25;
const TOP_M = 20_000;

export interface OneEngineOut {
  engines: number;
  /** Best one-engine-out rate of climb at `altitude_m`, and its TAS. */
  climb_m_s: number;
  tas_m_s: number;
  altitude_m: number;
  /** One-engine service ceiling (above MSL); −Infinity is never returned: null when below −400 m. */
  serviceCeiling_m: number | null;
}

/** The powerplant constants with one of N engines out (propeller disk area scaled). */
function remainingEngines(c: PowerConstants, n: number): PowerConstants {
  const share = (n - 1) / n;
  if (c.prop.kind !== 'momentum') return c;
  return { ...c, prop: { ...c.prop, area_m2: c.prop.area_m2 * share } };
}

/** Best one-engine-out rate of climb at altitude h and mass m. */
export function oeiBestClimb(
  model: FlightModel,
  engines: number,
  dragIncrement: number,
  h_m: number,
  mass_kg: number,
): { climb_m_s: number; tas_m_s: number } {
  const amb = ambientFresh(model, h_m);
  const rho = amb.atm.rho_kg_m3;
  const W = mass_kg * G0;
  const S = model.S_m2;
  const c = remainingEngines(model.power, engines);
  const share = (engines - 1) / engines;
  // A jet: the share of the thrust its lapse gives; a propeller: the share of the shaft power
  // through the remaining disks.
  const air = c.type === 'jet' ? amb : { atm: amb.atm, engineMax: share * amb.engineMax };
  const scale = c.type === 'jet' ? share : 1;
  const excess = (V: number) => {
    const q = 0.5 * rho * V * V;
    const CD = dragCoefficientOf(model.polar, W / (q * S)) + dragIncrement;
    return (scale * availablePower_W(c, air, V, rho) - q * S * CD * V) / W;
  };
  const Vs = Math.sqrt((2 * W) / (rho * S * model.polar.CLmax));
  const lo = model.settings.stallFactor * Vs;
  const hi = MACH_CAP * amb.atm.a_m_s;
  const best = maximizeBounded(excess, lo, hi);
  return { climb_m_s: excess(best.x), tas_m_s: best.x };
}

/** The one-engine-out figures for the plan, or null for a single-engine aircraft. */
export function oneEngineOut(
  model: FlightModel,
  plan: Plan,
  highest_m: number,
): OneEngineOut | null {
  const n = plan.aircraft.engineCount ?? 1;
  if (n < 2) return null;
  const dCD = plan.aircraft.oeiDragIncrement ?? DEFAULT_OEI_DRAG_INCREMENT;
  const m = model.takeoffMass_kg;
  const at = oeiBestClimb(model, n, dCD, highest_m, m);
  const g = (h: number) => oeiBestClimb(model, n, dCD, h, m).climb_m_s - OEI_SERVICE_CLIMB_M_S;
  let ceiling: number | null;
  let lo = -400;
  let hi = TOP_M;
  if (g(lo) < 0) ceiling = null;
  else if (g(hi) >= 0) ceiling = hi;
  else {
    for (let i = 0; i < 60 && hi - lo > 0.5; i++) {
      const mid = 0.5 * (lo + hi);
      if (g(mid) >= 0) lo = mid;
      else hi = mid;
    }
    ceiling = 0.5 * (lo + hi);
  }
  return { engines: n, ...at, altitude_m: highest_m, serviceCeiling_m: ceiling };
}

/** The check input: one-engine service ceiling against the highest altitude flown. */
export function oneEngineOutCheck(
  model: FlightModel,
  plan: Plan,
  legs: readonly LegOutcome[],
): CheckInput | null {
  if ((plan.aircraft.engineCount ?? 1) < 2) return null;
  let highest = -Infinity;
  for (const o of legs) {
    const h = o.checks.maxAltitude_m;
    if (h !== null && h > highest) highest = h;
  }
  if (!(highest > -Infinity)) return null;
  const r = oneEngineOut(model, plan, highest);
  if (r === null) return null;
  const ceiling = r.serviceCeiling_m ?? -400;
  return {
    id: 'oneEngineOut',
    label: 'One engine inoperative (estimate)',
    legIndex: null,
    value: ceiling,
    limit: highest,
    quantity: 'altitude',
    bound: 'min',
    reference: 1000,
    detail:
      `Estimate with 1 of ${r.engines} engines inoperative at take-off mass: best rate of climb ${fmt(r.climb_m_s)} m/s at ${fmt(r.tas_m_s)} m/s TAS at ${fmt(highest)} m, the highest altitude of the mission; ` +
      (r.serviceCeiling_m === null
        ? `no altitude above −400 m gives ${OEI_SERVICE_CLIMB_M_S} m/s.`
        : `one-engine service ceiling (${OEI_SERVICE_CLIMB_M_S} m/s) ${fmt(ceiling)} m.`),
  };
}
