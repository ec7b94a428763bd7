/**
 * The aircraft and the day as the mission solver sees them: polar coefficients, wing area,
 * powerplant, the consumable (fuel kg or usable battery energy J) and the air at an altitude.
 *
 * Altitudes in a plan are above mean sea level on an altimeter set to QNH; the pressure
 * altitude is then Hp = h + Hp(QNH) (common practice; the relation of core/atmosphere.ts
 * `pressureAltitudeFromQnh`), and the air is the ISA+ΔT day at Hp (core/atmosphere.ts).
 *
 * Legs whose weather comes from the winds-aloft table (windSource 'aloft') see the table's
 * air instead: the wind at Hp (the table is indexed by pressure altitude, as forecasts give
 * it) and the temperature too — the table's ISA offset, interpolated linearly between the
 * levels that give one, replaces environment.isaOffset_K (which stays only when no level
 * gives a temperature). Interpolation and extrapolation as core/weather/windsAloft.ts.
 */
import { atmosphereAt, densityAltitude, LAYERS, type AtmosphereState } from '../atmosphere.ts';
import { toTas } from '../airspeed.ts';
import { InputError } from '../errors.ts';
import { polarCoefficients, type PolarCoefficients } from '../polar.ts';
import type { FixedSpeed, Plan, Powerplant, Settings } from '../plan/schema.ts';
import { pressureAltitudeFromPressure } from '../atmosphere.ts';
import { consumableOf, usableEnergy_J } from '../propulsion/index.ts';
import { G0 } from '../units.ts';
import { optimumCL, type OptimumCL } from './optimumCL.ts';
import { engineMaximum, powerConstants, type PowerConstants } from './power.ts';
import type { Consumable } from './types.ts';
import { windProfile, type WindProfile } from '../weather/windsAloft.ts';
import { aloftIsaOffset, aloftWind } from './aloft.ts';

export interface Ambient {
  h_m: number;
  pressureAltitude_m: number;
  atm: AtmosphereState;
  /** Jet T_max (N), propeller shaft P_max (W) or electric motor shaft power (W) here. */
  engineMax: number;
  /** True for the winds-aloft table's air (see the header). */
  aloft: boolean;
  /** The table's wind here, east and north components of the air's motion (0 otherwise). */
  windEast_m_s: number;
  windNorth_m_s: number;
}

/**
 * Integration accuracy: 'precise' (relative tolerance 1e-9, the default; the accuracy bar of
 * DESIGN.md §6) or 'fast' (1e-6, for Monte Carlo samples and sweeps, where the inputs are
 * far less certain than that).
 */
export type SolveTolerance = 'precise' | 'fast';

export const RELATIVE_TOLERANCE: Readonly<Record<SolveTolerance, number>> = Object.freeze({
  precise: 1e-9,
  fast: 1e-6,
});

export interface FlightModel {
  readonly S_m2: number;
  readonly polar: PolarCoefficients;
  readonly pp: Powerplant;
  /** The powerplant's constants, validated once (power.ts). */
  readonly power: PowerConstants;
  /** Lift coefficients of the still-air best-range and best-endurance speeds. */
  readonly optimumCL: OptimumCL;
  /** Relative tolerance of the integrator. */
  readonly rtol: number;
  readonly consumable: Consumable;
  readonly isaOffset_K: number;
  /** Hp − h for the plan's QNH. */
  readonly pressureAltitudeOffset_m: number;
  readonly settings: Settings;
  /** CL used for the take-off/landing allowance speed: CLmaxFlaps when given. */
  readonly CLmaxFlaps: number;
  /** Fuel load (kg) or usable battery energy (J) at the start of the mission. */
  readonly consumableStart: number;
  /** Battery usable energy (J), 0 for fuel burners. */
  readonly usableEnergy_J: number;
  readonly takeoffMass_kg: number;
  /** The winds-aloft table, prepared once (null when the plan has none). */
  readonly aloft: WindProfile | null;
  /** Some leg takes its weather from the table: the reserves are flown in its air too. */
  readonly aloftReserves: boolean;
  /**
   * Altitudes (above MSL, ascending) where the air or the engine changes its gradient with
   * height: the standard atmosphere's layer bases, a propeller's critical altitude, and (in
   * `aloftBreaks_m`, for the table's air) the levels that carry a temperature. A speed
   * schedule's dV/dh jumps there, so climbs and descents restart at them (slope.ts,
   * segment.ts).
   */
  readonly breaks_m: readonly number[];
  readonly aloftBreaks_m: readonly number[];
  /** Last ambient evaluated (legs at one altitude ask for the same air many times). */
  cache: Ambient | null;
  /** The same for the table's air. */
  aloftCache: Ambient | null;
  /** Last answer of altitudeForDensity, the warm start of the next (cruise-climb). */
  densityCache: { rho_kg_m3: number; Hp_m: number; slope: number; aloft: boolean } | null;
}

export function buildModel(plan: Plan, tolerance: SolveTolerance = 'precise'): FlightModel {
  if (!Object.hasOwn(RELATIVE_TOLERANCE, tolerance)) {
    throw new InputError('tolerance', tolerance, "'precise' or 'fast'");
  }
  const ac = plan.aircraft;
  const pp = ac.powerplant;
  const consumable = consumableOf(pp);
  const polar = polarCoefficients(ac.polar);
  const power = powerConstants(pp, atmosphereAt(0), ac);
  const usable = pp.type === 'electric' ? usableEnergy_J(pp.battery) : 0;
  const start = pp.type === 'electric' ? usable : pp.fuel.load_kg;
  const carried = pp.type === 'electric' ? pp.battery.mass_kg : pp.fuel.load_kg;
  const levels = plan.environment.windsAloft;
  const aloft = levels ? windProfile(levels, 'environment.windsAloft') : null;
  const offset = pressureAltitudeFromPressure(plan.environment.qnh_Pa, 'environment.qnh_Pa');
  const breaks = gradientBreaks(pp, aloft, offset);
  return {
    S_m2: ac.wingArea_m2,
    polar,
    pp,
    power,
    optimumCL: optimumCL(polar, power),
    rtol: RELATIVE_TOLERANCE[tolerance],
    consumable,
    isaOffset_K: plan.environment.isaOffset_K,
    pressureAltitudeOffset_m: offset,
    settings: plan.settings,
    CLmaxFlaps: ac.polar.CLmaxFlaps ?? ac.polar.CLmax,
    consumableStart: start,
    usableEnergy_J: usable,
    takeoffMass_kg: ac.mass.empty_kg + ac.mass.payload_kg + carried,
    aloft,
    aloftReserves:
      aloft !== null && plan.legs.some((l) => 'windSource' in l && l.windSource === 'aloft'),
    breaks_m: breaks.breaks_m,
    aloftBreaks_m: breaks.aloftBreaks_m,
    cache: null,
    aloftCache: null,
    densityCache: null,
  };
}

/** The `breaks_m` and `aloftBreaks_m` of a model (see FlightModel). */
function gradientBreaks(
  pp: Powerplant,
  table: WindProfile | null,
  offset_m: number,
): { breaks_m: number[]; aloftBreaks_m: number[] } {
  const Hp: number[] = [];
  for (let i = 1; i < LAYERS.length; i++) Hp.push(LAYERS[i]!.H_m);
  if (pp.type === 'propeller' && pp.criticalAltitude_m > 0) Hp.push(pp.criticalAltitude_m);
  const breaks_m = toAltitudes(Hp, offset_m);
  if (table === null || table.isaAltitude_m.length < 2)
    return { breaks_m, aloftBreaks_m: breaks_m };
  return { breaks_m, aloftBreaks_m: toAltitudes([...Hp, ...table.isaAltitude_m], offset_m) };
}

/** Pressure altitudes as altitudes above MSL, ascending, without repeats. */
function toAltitudes(Hp: number[], offset_m: number): number[] {
  const sorted = Hp.slice().sort((a, b) => a - b);
  const out: number[] = [];
  for (const v of sorted) {
    const h = v - offset_m;
    if (out.length === 0 || h !== out[out.length - 1]) out.push(h);
  }
  return out;
}

/**
 * The air at altitude h above mean sea level (cached for repeated altitudes): the plan's
 * ISA+ΔT day, or with `aloft` the winds-aloft table's (wind and temperature; see the header).
 */
export function ambientAt(model: FlightModel, h_m: number, aloft = false): Ambient {
  const table = aloft ? model.aloft : null;
  const c = table ? model.aloftCache : model.cache;
  if (c !== null && c.h_m === h_m) return c;
  const amb = ambientFresh(model, h_m, aloft);
  if (table) model.aloftCache = amb;
  else model.cache = amb;
  return amb;
}

/** The atmosphere alone at altitude h (no engine, no wind, not cached): for nearby probes. */
export function airFresh(model: FlightModel, h_m: number, aloft = false): AtmosphereState {
  const table = aloft ? model.aloft : null;
  const Hp = h_m + model.pressureAltitudeOffset_m;
  const dT = table ? aloftIsaOffset(table, Hp, model.isaOffset_K) : model.isaOffset_K;
  return atmosphereAt(Hp, dT);
}

/** The same air as `ambientAt`, worked out afresh and not cached (for nearby probes). */
export function ambientFresh(model: FlightModel, h_m: number, aloft = false): Ambient {
  const table = aloft ? model.aloft : null;
  const Hp = h_m + model.pressureAltitudeOffset_m;
  const dT = table ? aloftIsaOffset(table, Hp, model.isaOffset_K) : model.isaOffset_K;
  const atm = atmosphereAt(Hp, dT, {
    altitude: 'pressureAltitude_m',
    isaOffset: table ? 'environment.windsAloft.isaOffset_K' : 'environment.isaOffset_K',
  });
  const amb: Ambient = {
    h_m,
    pressureAltitude_m: Hp,
    atm,
    engineMax: engineMaximum(model.pp, atm, Hp),
    aloft: table !== null,
    windEast_m_s: 0,
    windNorth_m_s: 0,
  };
  if (table) aloftWind(table, Hp, amb);
  return amb;
}

/**
 * The altitude (above MSL) where the density is rho on the plan's day (or in the winds-aloft
 * table's air): exact density altitude on a standard day, Newton on the pressure altitude
 * otherwise (density falls monotonically with height in every layer for any ISA offset the
 * plan allows; with the table's offsets it is piecewise smooth, kinked at the levels).
 */
export function altitudeForDensity(model: FlightModel, rho_kg_m3: number, aloft = false): number {
  const off = model.pressureAltitudeOffset_m;
  const table = aloft ? model.aloft : null;
  if (table === null && model.isaOffset_K === 0) {
    return densityAltitude(rho_kg_m3, 'cruiseClimb.density_kg_m3') - off;
  }
  // Along a cruise-climb the density changes little from one call to the next: start from
  // the last answer and reuse its slope (chord iterations, one atmosphere each).
  const warm = warmDensityAltitude(model, rho_kg_m3, table);
  if (warm !== null) return warm - off;
  let Hp = densityAltitude(rho_kg_m3, 'cruiseClimb.density_kg_m3');
  let slope = NaN;
  for (let it = 0; it < 30; it++) {
    const d = 0.5;
    const r0 = densityAt(model, table, Hp);
    slope = (densityAt(model, table, Hp + d) - r0) / d;
    const step = (rho_kg_m3 - r0) / slope;
    if (!Number.isFinite(step)) {
      throw new InputError(
        'cruiseClimb.density_kg_m3',
        rho_kg_m3,
        'a density found in the atmosphere',
      );
    }
    Hp += step;
    if (Math.abs(step) < 1e-9) break;
  }
  model.densityCache = { rho_kg_m3, Hp_m: Hp, slope, aloft: table !== null };
  return Hp - off;
}

/** Chord iterations from the last answer; null when they do not settle (then start afresh). */
function warmDensityAltitude(
  model: FlightModel,
  rho_kg_m3: number,
  table: WindProfile | null,
): number | null {
  const aloft = table !== null;
  const c = model.densityCache;
  if (c === null || c.aloft !== aloft) return null;
  let Hp = c.Hp_m + (rho_kg_m3 - c.rho_kg_m3) / c.slope;
  try {
    for (let it = 0; it < 8 && Number.isFinite(Hp); it++) {
      const step = (rho_kg_m3 - densityAt(model, table, Hp)) / c.slope;
      Hp += step;
      if (Math.abs(step) < 1e-9) {
        model.densityCache = { rho_kg_m3, Hp_m: Hp, slope: c.slope, aloft };
        return Hp;
      }
    }
  } catch (e) {
    if (!(e instanceof InputError)) throw e;
  }
  return null;
}

function densityAt(model: FlightModel, table: WindProfile | null, Hp: number): number {
  const dT = table ? aloftIsaOffset(table, Hp, model.isaOffset_K) : model.isaOffset_K;
  return atmosphereAt(Hp, dT).rho_kg_m3;
}

/** TAS of a fixed airspeed (TAS, EAS, CAS or Mach) in this air. */
export function fixedSpeedTas(speed: FixedSpeed, atm: AtmosphereState, field: string): number {
  return speed.kind === 'mach'
    ? toTas('mach', speed.mach, atm, field)
    : toTas(speed.kind, speed.speed_m_s, atm, field);
}

/** Stall speed at this weight and air, with the clean CLmax (Anderson, Introduction to Flight, ch. 5). */
export function stallTas(
  model: FlightModel,
  mass_kg: number,
  atm: AtmosphereState,
  CLmax = model.polar.CLmax,
): number {
  return Math.sqrt((2 * mass_kg * G0) / (atm.rho_kg_m3 * model.S_m2 * CLmax));
}
