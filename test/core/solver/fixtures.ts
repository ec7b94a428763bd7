/**
 * Plans for the solver tests, built in TypeScript and validated with PlanSchema.parse.
 *
 * Aircraft: the light single-engine propeller airplane and the small business jet of
 * Anderson, Introduction to Flight, ch. 6 (inputs as listed in shared/REFERENCES.md), and the
 * small battery-electric UAV of Traub, J. Aircraft 48(2), 2011 (REFERENCES.md computed
 * example). Reserves are zero and the wind calm unless a test says otherwise.
 */
import { createRequire } from 'node:module';
import {
  PLAN_SCHEMA_VERSION,
  PlanSchema,
  type ClimbLeg,
  type CruiseLeg,
  type DescentLeg,
  type LandingLeg,
  type Leg,
  type LoiterLeg,
  type Plan,
  type Powerplant,
  type TakeoffLeg,
} from '../../../core/plan/schema.ts';
import { G0, HP, LB, WH } from '../../../core/units.ts';

export const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);

/** odex (CommonJS) through require, typed by the small surface used (as in breguet.test.ts). */
interface OdexSolver {
  absoluteTolerance: number;
  relativeTolerance: number;
  solve(
    f: (x: number, y: number[]) => number[],
    x0: number,
    y0: number[],
    x1: number,
  ): { y: number[] };
}
export const odex = createRequire(import.meta.url)('odex') as {
  Solver: new (n: number) => OdexSolver;
};

/** Integrates with odex to 1e-12 and returns the end state. */
export function odexSolve(
  f: (x: number, y: number[]) => number[],
  x0: number,
  y0: number[],
  x1: number,
): number[] {
  const s = new odex.Solver(y0.length);
  s.absoluteTolerance = 1e-12;
  s.relativeTolerance = 1e-12;
  return s.solve(f, x0, y0, x1).y;
}

// Anderson, Introduction to Flight, ch. 6: light single-engine propeller airplane.
export const ANDERSON_PROP = {
  W0_N: 13127.5,
  fuel_N: 1632.5,
  S: 16.165,
  span: 10.912,
  CD0: 0.025,
  e: 0.8,
  eta: 0.8,
  /** 0.45 lb/(hp·h) in kg/J. */
  bsfc_kg_J: (0.45 * LB) / (HP * 3600),
  maxPower_W: 230 * HP,
};

// Anderson, Introduction to Flight, ch. 6: small business jet (c_t = 0.6 1/h).
export const ANDERSON_JET = {
  W0_N: 88176.75,
  fuel_N: 33211.9,
  S: 29.54,
  span: 16.25,
  CD0: 0.02,
  e: 0.81,
  ct_1_s: 0.6 / 3600,
  rho: 0.6107,
};

// Traub 2011 computed example (REFERENCES.md): 2.5 kg, S 0.55 m², AR 9, e 0.85, CD0 0.03,
// 14.8 V · 5 Ah, Rt = 1 h, η = 0.6.
export const TRAUB_UAV = {
  m: 2.5,
  S: 0.55,
  AR: 9,
  e: 0.85,
  CD0: 0.03,
  energy_J: 14.8 * 5 * WH,
  eta: 0.6,
};

export function propPowerplant(
  over: Partial<Extract<Powerplant, { type: 'propeller' }>> = {},
): Powerplant {
  return {
    type: 'propeller',
    engine: 'piston',
    maxPowerSL_W: ANDERSON_PROP.maxPower_W,
    lapse: { model: 'gaggFerrar' },
    criticalAltitude_m: 0,
    propEfficiency: ANDERSON_PROP.eta,
    bsfc_kg_J: ANDERSON_PROP.bsfc_kg_J,
    idlePowerFraction: 0,
    fuel: { kind: 'avgas', load_kg: ANDERSON_PROP.fuel_N / G0, tankCapacity_L: 300 },
    ...over,
  };
}

export function jetPowerplant(
  over: Partial<Extract<Powerplant, { type: 'jet' }>> = {},
): Powerplant {
  return {
    type: 'jet',
    maxThrustSL_N: 40_000,
    thrustLapseExponent: 0.8,
    tsfc_kg_Ns: ANDERSON_JET.ct_1_s / G0,
    idleFuelFraction: 0,
    fuel: { kind: 'jetA', load_kg: ANDERSON_JET.fuel_N / G0, tankCapacity_L: 6000 },
    ...over,
  };
}

export function electricPowerplant(
  over: Partial<Extract<Powerplant, { type: 'electric' }>> = {},
  battery: Partial<Extract<Powerplant, { type: 'electric' }>['battery']> = {},
): Powerplant {
  return {
    type: 'electric',
    maxShaftPower_W: 300,
    motorEfficiency: 0.8,
    controllerEfficiency: 0.9375,
    propEfficiency: 0.8,
    battery: {
      energy_J: TRAUB_UAV.energy_J,
      mass_kg: 0.5,
      usableFraction: 1,
      peukertExponent: 1,
      ratedDischargeTime_s: 3600,
      ...battery,
    },
    ...over,
  };
}

export type Kind = 'jet' | 'propeller' | 'electric';

/** The aircraft of each kind, with a CLmax that keeps the tests' speeds above 1.2·V_stall. */
function aircraftFor(kind: Kind, pp?: Powerplant): Plan['aircraft'] {
  if (kind === 'jet') {
    const p = pp ?? jetPowerplant();
    const fuel = p.type === 'electric' ? 0 : p.fuel.load_kg;
    return {
      name: 'Anderson business jet',
      wingArea_m2: ANDERSON_JET.S,
      polar: {
        CD0: ANDERSON_JET.CD0,
        induced: { by: 'geometry', e: ANDERSON_JET.e, AR: ANDERSON_JET.span ** 2 / ANDERSON_JET.S },
        CLminD: 0,
        CLmax: 1.6,
      },
      mass: { empty_kg: ANDERSON_JET.W0_N / G0 - fuel, payload_kg: 0, mtow_kg: 12_000 },
      ceiling_m: 15_000,
      powerplant: p,
    };
  }
  if (kind === 'propeller') {
    const p = pp ?? propPowerplant();
    const fuel = p.type === 'electric' ? 0 : p.fuel.load_kg;
    return {
      name: 'Anderson light airplane',
      wingArea_m2: ANDERSON_PROP.S,
      polar: {
        CD0: ANDERSON_PROP.CD0,
        induced: {
          by: 'geometry',
          e: ANDERSON_PROP.e,
          AR: ANDERSON_PROP.span ** 2 / ANDERSON_PROP.S,
        },
        CLminD: 0,
        CLmax: 2,
      },
      mass: { empty_kg: ANDERSON_PROP.W0_N / G0 - fuel, payload_kg: 0, mtow_kg: 1500 },
      ceiling_m: 5000,
      powerplant: p,
    };
  }
  const p = pp ?? electricPowerplant();
  const battery = p.type === 'electric' ? p.battery.mass_kg : 0;
  return {
    name: 'Traub UAV',
    wingArea_m2: TRAUB_UAV.S,
    polar: {
      CD0: TRAUB_UAV.CD0,
      induced: { by: 'geometry', e: TRAUB_UAV.e, AR: TRAUB_UAV.AR },
      CLminD: 0,
      CLmax: 1.5,
    },
    mass: { empty_kg: TRAUB_UAV.m - battery, payload_kg: 0, mtow_kg: 3 },
    ceiling_m: 3000,
    powerplant: p,
  };
}

export interface PlanOptions {
  powerplant?: Powerplant;
  departure_m?: number;
  arrival_m?: number;
  reserves?: Partial<Plan['reserves']>;
  settings?: Partial<Plan['settings']>;
  environment?: Partial<Plan['environment']>;
  aircraft?: (a: Plan['aircraft']) => Plan['aircraft'];
  route?: Plan['route'];
}

/** A valid plan (checked by PlanSchema.parse) for the aircraft of `kind` flying `legs`. */
export function makePlan(kind: Kind, legs: Leg[], o: PlanOptions = {}): Plan {
  const aircraft = aircraftFor(kind, o.powerplant);
  const departure = o.departure_m ?? 0;
  return PlanSchema.parse({
    format: 'legwise-plan',
    schemaVersion: PLAN_SCHEMA_VERSION,
    name: `test ${kind}`,
    notes: '',
    aircraft: o.aircraft ? o.aircraft(aircraft) : aircraft,
    environment: {
      isaOffset_K: 0,
      qnh_Pa: 101325,
      departureElevation_m: departure,
      arrivalElevation_m: o.arrival_m ?? departure,
      ...o.environment,
    },
    reserves: {
      holdTime_s: 0,
      holdAltitude_m: 0,
      contingencyFraction: 0,
      alternateDistance_m: 0,
      alternateAltitude_m: 0,
      socFloor: 0,
      // These plans fly at the field's elevation and compare reserves with closed forms at
      // one altitude: no minimum height above the field (the rule: test/core/solver/verdicts.test.ts).
      minHeightAboveField_m: 0,
      ...o.reserves,
    },
    settings: { stallFactor: 1.2, tightMargin: 0.1, minClimbRate_m_s: 0.5, ...o.settings },
    legs,
    ...(o.route ? { route: o.route } : {}),
  });
}

const calm = { speed_m_s: 0, from_deg: 0 };
let counter = 0;
const id = () => `leg-${++counter}`;

export function cruise(over: Partial<CruiseLeg> = {}): CruiseLeg {
  return {
    kind: 'cruise',
    id: id(),
    label: '',
    course_deg: 0,
    wind: calm,
    end: { by: 'distance', distance_m: 100_000 },
    speed: { kind: 'bestRange' },
    program: 'constantAltitude',
    ...over,
  };
}

export function loiter(over: Partial<LoiterLeg> = {}): LoiterLeg {
  return {
    kind: 'loiter',
    id: id(),
    label: '',
    course_deg: 0,
    wind: calm,
    end: { by: 'time', time_s: 600 },
    speed: { kind: 'bestEndurance' },
    ...over,
  };
}

export function climb(over: Partial<ClimbLeg> = {}): ClimbLeg {
  return {
    kind: 'climb',
    id: id(),
    label: '',
    course_deg: 0,
    wind: calm,
    toAltitude_m: 1000,
    speed: { kind: 'bestRate' },
    throttle: 1,
    ...over,
  };
}

export function descent(over: Partial<DescentLeg> = {}): DescentLeg {
  return {
    kind: 'descent',
    id: id(),
    label: '',
    course_deg: 0,
    wind: calm,
    toAltitude_m: 0,
    mode: { by: 'glide' },
    ...over,
  };
}

export function takeoff(allowance: TakeoffLeg['allowance']): TakeoffLeg {
  return { kind: 'takeoff', id: id(), label: '', allowance };
}

export function landing(allowance: LandingLeg['allowance']): LandingLeg {
  return { kind: 'landing', id: id(), label: '', allowance };
}

/** Every number in a value, with its path (for the "no NaN/Infinity" checks). */
export function numbersIn(
  value: unknown,
  path = '',
  out: [string, number][] = [],
): [string, number][] {
  if (typeof value === 'number') out.push([path, value]);
  else if (Array.isArray(value)) value.forEach((v, i) => numbersIn(v, `${path}[${i}]`, out));
  else if (value !== null && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) numbersIn(v, path ? `${path}.${k}` : k, out);
  }
  return out;
}
