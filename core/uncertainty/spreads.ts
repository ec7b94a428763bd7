/**
 * Spreads (standard deviations) of the uncertain plan inputs, their defaults, and how one
 * random draw turns a plan into a perturbed copy.
 *
 * Each input is normal around the plan's value: wind speed and direction per leg, and per
 * level of the winds-aloft table when the plan has one (the same spreads), in absolute terms; CD0, propeller/drivetrain efficiency, TSFC/BSFC and battery capacity relative to the
 * plan's value, payload in kg. A draw that falls outside the plan schema's range (negative wind
 * or payload, efficiency above its bound, ...) is censored at the bound, so the perturbed plan
 * is still a valid plan; the wind direction wraps round the compass.
 *
 * The wind errors of the legs of one flight are correlated (windErrors.ts): one shared
 * error per flight plus each leg's own, with the plan's correlation.
 *
 * Defaults are common practice for a pre-flight estimate (from memory, not a published
 * standard): forecast wind error about 5 kt and 15° per leg, correlated 0.8 between the
 * legs of a flight; CD0 known to 5 %; propeller or
 * drivetrain efficiency to 3 %; specific fuel consumption to 3 %; battery capacity to 5 %
 * (state of health); take-off loading to 1 % of MTOW.
 */
import { withMissionWind } from '../solver/missionWind.ts';
import { requireFinite } from '../errors.ts';
import type { Leg, Plan, Powerplant } from '../plan/schema.ts';
import { KT } from '../units.ts';
import type { NormalSource } from './random.ts';
import {
  checkWindCorrelation,
  DEFAULT_WIND_CORRELATION,
  drawSharedWindError,
  legWindError,
  type SharedWindError,
} from './windErrors.ts';

export interface ReserveSpreads {
  /** σ of each leg's wind speed, m/s. */
  windSpeed_m_s: number;
  /** σ of each leg's wind direction, degrees. */
  windDirection_deg: number;
  /** Relative σ of CD0. */
  cd0: number;
  /** Relative σ of propeller efficiency (propeller and electric powerplants). */
  efficiency: number;
  /** Relative σ of TSFC (jet) or BSFC (propeller). */
  fuelConsumption: number;
  /** Relative σ of battery capacity (electric). */
  batteryCapacity: number;
  /** σ of the payload mass, kg. */
  payload_kg: number;
  /**
   * Correlation of the wind errors of two legs (and winds-aloft levels) of one flight, 0–1;
   * DEFAULT_WIND_CORRELATION if omitted (windErrors.ts).
   */
  windCorrelation?: number;
}

export function checkSpreads(s: ReserveSpreads, field = 'spreads'): ReserveSpreads {
  requireFinite(`${field}.windSpeed_m_s`, s.windSpeed_m_s, 0, 30, 'm/s');
  requireFinite(`${field}.windDirection_deg`, s.windDirection_deg, 0, 180, 'deg');
  requireFinite(`${field}.cd0`, s.cd0, 0, 0.5);
  requireFinite(`${field}.efficiency`, s.efficiency, 0, 0.5);
  requireFinite(`${field}.fuelConsumption`, s.fuelConsumption, 0, 0.5);
  requireFinite(`${field}.batteryCapacity`, s.batteryCapacity, 0, 0.5);
  requireFinite(`${field}.payload_kg`, s.payload_kg, 0, 100_000, 'kg');
  if (s.windCorrelation !== undefined) {
    checkWindCorrelation(s.windCorrelation, `${field}.windCorrelation`);
  }
  return s;
}

/** Default spreads for this plan; inputs that do not apply to its powerplant get 0. */
export function spreadsFromDefaults(plan: Plan): ReserveSpreads {
  const pp = plan.aircraft.powerplant;
  return {
    windSpeed_m_s: 5 * KT,
    windDirection_deg: 15,
    cd0: 0.05,
    efficiency: pp.type === 'jet' ? 0 : 0.03,
    fuelConsumption: pp.type === 'electric' ? 0 : 0.03,
    batteryCapacity: pp.type === 'electric' ? 0.05 : 0,
    payload_kg: 0.01 * plan.aircraft.mass.mtow_kg,
    windCorrelation: DEFAULT_WIND_CORRELATION,
  };
}

/**
 * Samples and random seed when the plan does not say: 2000 samples put a probability near 5 %
 * within about ±0.5 % (binomial standard error √(p(1 − p)/N)).
 */
export const DEFAULT_SAMPLES = 2000;
export const DEFAULT_RANDOM_SEED = 1;

/** The plan's own spreads, samples and random seed (plan.uncertainty), else the defaults. */
export function monteCarloSetup(plan: Plan): {
  spreads: ReserveSpreads;
  samples: number;
  seed: number;
} {
  const u = plan.uncertainty;
  if (u === undefined) {
    return {
      spreads: spreadsFromDefaults(plan),
      samples: DEFAULT_SAMPLES,
      seed: DEFAULT_RANDOM_SEED,
    };
  }
  const { samples, seed, ...spreads } = u;
  return { spreads: checkSpreads(spreads, 'uncertainty'), samples, seed };
}

/** One perturbed input: its plan path and the value drawn for it. */
export interface Draw {
  path: string;
  value: number;
}

const censor = (v: number, lo: number, hi: number): number => Math.min(hi, Math.max(lo, v));
// Schema bounds (core/plan/schema.ts); an open lower bound is approached by a tiny step.
const BOUNDS = {
  windSpeed: [0, 100],
  CD0: [0.003 * (1 + 1e-9), 0.3],
  propEfficiency: [0.2, 0.95],
  tsfc: [1e-12, 1e-3],
  bsfc: [1e-15, 1e-6],
  energy: [1, 1e11],
} as const;

function wrapDegrees(d: number): number {
  if (d >= 0 && d <= 360) return d;
  return ((d % 360) + 360) % 360;
}

/**
 * Number of normal deviates one sample uses: two for the flight's shared wind error (speed,
 * direction), two per leg (its own; drawn for every leg so the stream stays aligned between
 * plans with the same legs), five for the aircraft, then two per level of the winds-aloft
 * table.
 */
export function drawsPerSample(plan: Plan): number {
  return 2 + 2 * plan.legs.length + 5 + 2 * (plan.environment.windsAloft?.length ?? 0);
}

/** Schema bound of a winds-aloft level's speed (core/plan/schema.ts). */
const ALOFT_SPEED_MAX_M_S = 150;

/** The winds-aloft table with each level's speed and direction drawn (same spreads as legs). */
function perturbAloft(
  plan: Plan,
  s: ReserveSpreads,
  rng: NormalSource,
  shared: SharedWindError,
  draws: Draw[],
): Plan {
  const levels = plan.environment.windsAloft;
  if (levels === undefined) return plan;
  const windsAloft = levels.map((level, j) => {
    const zSpeed = legWindError(rng.normal(), shared.speed, shared);
    const zDir = legWindError(rng.normal(), shared.direction, shared);
    const out = { ...level };
    if (s.windSpeed_m_s > 0) {
      out.speed_m_s = censor(level.speed_m_s + s.windSpeed_m_s * zSpeed, 0, ALOFT_SPEED_MAX_M_S);
      draws.push({ path: `environment.windsAloft.${j}.speed_m_s`, value: out.speed_m_s });
    }
    if (s.windDirection_deg > 0) {
      out.from_deg = wrapDegrees(level.from_deg + s.windDirection_deg * zDir);
      draws.push({ path: `environment.windsAloft.${j}.from_deg`, value: out.from_deg });
    }
    return out;
  });
  return { ...plan, environment: { ...plan.environment, windsAloft } };
}

/**
 * A perturbed copy of the plan (the original is not touched; untouched parts are shared) and
 * the drawn value of every input whose spread is above 0.
 */
export function perturbPlan(
  asGiven: Plan,
  s: ReserveSpreads,
  rng: NormalSource,
): { plan: Plan; draws: Draw[] } {
  // Legs and fields that follow the mission wind get its drawn value through their own.
  const plan = withMissionWind(asGiven);
  const draws: Draw[] = [];
  const shared = drawSharedWindError(rng, s.windCorrelation ?? DEFAULT_WIND_CORRELATION);
  const legs = plan.legs.map((leg, i): Leg => {
    const zSpeed = legWindError(rng.normal(), shared.speed, shared);
    const zDir = legWindError(rng.normal(), shared.direction, shared);
    if (!('wind' in leg)) return leg;
    const wind = { ...leg.wind };
    if (s.windSpeed_m_s > 0) {
      wind.speed_m_s = censor(
        wind.speed_m_s + s.windSpeed_m_s * zSpeed,
        BOUNDS.windSpeed[0],
        BOUNDS.windSpeed[1],
      );
      draws.push({ path: `legs.${i}.wind.speed_m_s`, value: wind.speed_m_s });
    }
    if (s.windDirection_deg > 0) {
      wind.from_deg = wrapDegrees(wind.from_deg + s.windDirection_deg * zDir);
      draws.push({ path: `legs.${i}.wind.from_deg`, value: wind.from_deg });
    }
    return { ...leg, wind };
  });
  const [zCd0, zEff, zSfc, zBatt, zPayload] = [
    rng.normal(),
    rng.normal(),
    rng.normal(),
    rng.normal(),
    rng.normal(),
  ];
  const ac = plan.aircraft;
  const polar = { ...ac.polar };
  if (s.cd0 > 0) {
    polar.CD0 = censor(polar.CD0 * (1 + s.cd0 * zCd0), BOUNDS.CD0[0], BOUNDS.CD0[1]);
    draws.push({ path: 'aircraft.polar.CD0', value: polar.CD0 });
  }
  const mass = { ...ac.mass };
  if (s.payload_kg > 0) {
    mass.payload_kg = Math.max(0, mass.payload_kg + s.payload_kg * zPayload);
    draws.push({ path: 'aircraft.mass.payload_kg', value: mass.payload_kg });
  }
  const powerplant = perturbPowerplant(ac.powerplant, s, { zEff, zSfc, zBatt }, draws);
  const perturbed = perturbAloft(plan, s, rng, shared, draws);
  return { plan: { ...perturbed, aircraft: { ...ac, polar, mass, powerplant }, legs }, draws };
}

function perturbPowerplant(
  pp: Powerplant,
  s: ReserveSpreads,
  z: { zEff: number; zSfc: number; zBatt: number },
  draws: Draw[],
): Powerplant {
  const path = 'aircraft.powerplant';
  switch (pp.type) {
    case 'jet': {
      if (s.fuelConsumption === 0) return pp;
      const tsfc_kg_Ns = censor(
        pp.tsfc_kg_Ns * (1 + s.fuelConsumption * z.zSfc),
        BOUNDS.tsfc[0],
        BOUNDS.tsfc[1],
      );
      draws.push({ path: `${path}.tsfc_kg_Ns`, value: tsfc_kg_Ns });
      return { ...pp, tsfc_kg_Ns };
    }
    case 'propeller': {
      const out = { ...pp };
      if (s.efficiency > 0) {
        out.propEfficiency = censor(
          pp.propEfficiency * (1 + s.efficiency * z.zEff),
          ...BOUNDS.propEfficiency,
        );
        draws.push({ path: `${path}.propEfficiency`, value: out.propEfficiency });
      }
      if (s.fuelConsumption > 0) {
        out.bsfc_kg_J = censor(pp.bsfc_kg_J * (1 + s.fuelConsumption * z.zSfc), ...BOUNDS.bsfc);
        draws.push({ path: `${path}.bsfc_kg_J`, value: out.bsfc_kg_J });
      }
      return out;
    }
    case 'electric': {
      const out = { ...pp, battery: { ...pp.battery } };
      if (s.efficiency > 0) {
        out.propEfficiency = censor(
          pp.propEfficiency * (1 + s.efficiency * z.zEff),
          ...BOUNDS.propEfficiency,
        );
        draws.push({ path: `${path}.propEfficiency`, value: out.propEfficiency });
      }
      if (s.batteryCapacity > 0) {
        out.battery.energy_J = censor(
          pp.battery.energy_J * (1 + s.batteryCapacity * z.zBatt),
          ...BOUNDS.energy,
        );
        draws.push({ path: `${path}.battery.energy_J`, value: out.battery.energy_J });
      }
      return out;
    }
  }
}
