/**
 * The Legwise plan: aircraft + environment + reserve policy + ordered legs.
 * This zod schema is the single source of the plan's TypeScript types and of the
 * plan-file format (format tag `legwise-plan`, integer schema version). Every
 * quantity carries its unit in its key (`_m`, `_kg`, `_m_s`, `_J` ...), always SI.
 * Limits here refuse only the impossible or the outside of the models; values that
 * are merely unusual get warnings from `sanity.ts`.
 */
import { z } from 'zod';

export const PLAN_FORMAT = 'legwise-plan';
export const PLAN_SCHEMA_VERSION = 2;

/** A finite number in [min, max] (or (min, max] with `openMin`), unit named in the message. */
function bounded(min: number, max: number, unit = '', openMin = false) {
  const u = unit ? ` ${unit}` : '';
  const range = openMin ? `above ${min} and at most ${max}${u}` : `from ${min} to ${max}${u}`;
  const error = `must be ${range}`;
  // Built-in bounds (not a refine) so the generated JSON Schema carries them too.
  const number = z.number({ error: `must be a finite number${u}` });
  return (openMin ? number.gt(min, { error }) : number.gte(min, { error })).lte(max, { error });
}

/**
 * bounded() for a limit the physics needs, not just a plausible range: the message also
 * says why, so a refusal explains itself.
 */
function boundedBecause(min: number, max: number, unit: string, why: string) {
  const u = unit ? ` ${unit}` : '';
  const error = `must be from ${min} to ${max}${u} — ${why}`;
  return z
    .number({ error: `must be a finite number${u}` })
    .gte(min, { error })
    .lte(max, { error });
}

const fraction = (min = 0, max = 1, openMin = false) => bounded(min, max, '', openMin);
const angle_deg = () => bounded(0, 360, 'deg');

export const WindSchema = z.object({
  speed_m_s: bounded(0, 100, 'm/s'),
  /** Direction the wind blows FROM, degrees true (meteorological convention, common practice). */
  from_deg: angle_deg(),
});

export const PolarSchema = z.object({
  CD0: bounded(0.003, 0.3, '', true),
  /** Induced-drag factor k either from Oswald efficiency and aspect ratio (k = 1/(π·e·AR)) or given. */
  induced: z.discriminatedUnion('by', [
    z.object({
      by: z.literal('geometry'),
      /** Oswald efficiency; real wings about 0.6–0.95 (Raymer, Aircraft Design, ch. 12). */
      e: boundedBecause(
        0.3,
        1,
        '',
        'an Oswald efficiency below 0.3 describes no real wing and makes the induced drag k = 1/(π·e·AR) grow without bound',
      ),
      AR: bounded(1, 60),
    }),
    z.object({
      by: z.literal('factor'),
      k: boundedBecause(
        0.005,
        1,
        '',
        'k = 1/(π·e·AR) is at least 0.0053 for e ≤ 1 and AR ≤ 60; a smaller k means a wing with almost no induced drag',
      ),
    }),
  ]),
  /** Lift coefficient of minimum drag (0 for a symmetric polar). */
  CLminD: bounded(-0.5, 1),
  CLmax: bounded(0.3, 4),
  CLmaxFlaps: bounded(0.3, 5).optional(),
  /**
   * Drag rise approaching the stall (core/polar.ts): above onsetCL the parabola gets
   * ΔCD = atCLmax·((CL − onsetCL)/(CLmax − onsetCL))²; onsetCL must be below CLmax.
   * Absent: the parabola holds up to CLmax.
   */
  stallDragRise: z.object({ onsetCL: bounded(0.1, 4), atCLmax: bounded(0, 1) }).optional(),
});

export const FuelKindSchema = z.enum(['avgas', 'mogas', 'jetA', 'jetA1', 'diesel']);

export const FuelSchema = z.object({
  kind: FuelKindSchema,
  /** Overrides the typical density of the fuel kind. */
  density_kg_L: bounded(0.5, 1.1, 'kg/L').optional(),
  load_kg: bounded(0, 200_000, 'kg'),
  tankCapacity_L: bounded(0, 300_000, 'L', true),
});

/** Installed thrust lapse of an engine class (Mattingly, Aircraft Engine Design, ch. 2). */
export const JetLapseSchema = z.object({
  engineClass: z.enum(['highBypass', 'lowBypass', 'turbojet']),
  /** θ₀ at the throttle break (1.0–1.1 common practice; 1 = break at sea-level static). */
  throttleRatio: bounded(0.8, 1.3),
  /** Overrides the class's coefficient of √M (0.49 high-bypass, 0 low-bypass, 0.16 turbojet). */
  machCoefficient: bounded(0, 1.5).optional(),
  /** Overrides the class's coefficient above the throttle break (3, 3.8, 24). */
  breakCoefficient: bounded(0, 50).optional(),
});

export const JetSchema = z.object({
  type: z.literal('jet'),
  /** Total maximum thrust at sea level, ISA. */
  maxThrustSL_N: bounded(0, 2_000_000, 'N', true),
  /** Density lapse T_max = T_SL · σ^n (common practice); used when `thrustLapse` is absent. */
  thrustLapseExponent: bounded(0, 2).optional(),
  /** Lapse with Mach and altitude by engine class (core/propulsion/jet.ts; Mattingly). */
  thrustLapse: JetLapseSchema.optional(),
  /**
   * Thrust-specific fuel consumption, kg/(N·s): the value at every condition, or with
   * `tsfcMachFactor` the sea-level static c₁ of TSFC = c₁·(1 + f·M)·√θ.
   */
  tsfc_kg_Ns: bounded(0, 1e-3, 'kg/(N·s)', true),
  /** f = c₂/c₁ of TSFC = (c₁ + c₂·M)·√θ (high-bypass 1.2, Mattingly, from memory). */
  tsfcMachFactor: bounded(0, 5).optional(),
  /** Fuel flow at idle as a fraction of the flow at maximum thrust (descent, glide). */
  idleFuelFraction: fraction(0, 0.5),
  fuel: FuelSchema,
});

/** One point of a propeller efficiency table: x is TAS (m/s) or advance ratio J = V/(n·D). */
export const PropellerTablePointSchema = z.object({
  x: bounded(0, 400, '', true),
  efficiency: fraction(0, 1, true).refine((v) => v < 1, { error: 'must be below 1' }),
});

/**
 * Propeller efficiency as a function of airspeed (core/propulsion/propellerCurve.ts). Absent:
 * the constant propEfficiency of earlier versions. `momentum`: actuator-disk momentum theory
 * times a profile factor, calibrated so that propEfficiency holds at the cruise point
 * (cruisePowerFraction of the maximum shaft power at cruiseAltitude_m, ISA, at
 * cruiseSpeed_m_s TAS — or, without it, at the level-flight speed that power gives at MTOW).
 * `table`: the user's η(V) or η(J), J = V/(n·D) with n = rpm/60; the x values must increase.
 */
export const PropellerCurveSchema = z.discriminatedUnion('model', [
  z.object({
    model: z.literal('momentum'),
    /** Diameter of one propeller (the aircraft's engineCount propellers share the power). */
    diameter_m: bounded(0.05, 6, 'm'),
    /** Pressure altitude of the cruise point (ISA day). */
    cruiseAltitude_m: bounded(-400, 15_000, 'm'),
    /** Shaft power at the cruise point, as a fraction of the maximum there. */
    cruisePowerFraction: fraction(0.1, 1),
    /** TAS of the cruise point; absent: the level-flight speed at MTOW with that power. */
    cruiseSpeed_m_s: bounded(0, 300, 'm/s', true).optional(),
  }),
  z
    .object({
      model: z.literal('table'),
      by: z.enum(['airspeed', 'advanceRatio']),
      points: z
        .array(PropellerTablePointSchema)
        .min(2)
        .max(100)
        .superRefine((pts, ctx) => {
          for (let i = 1; i < pts.length; i++) {
            if (!(pts[i]!.x > pts[i - 1]!.x))
              ctx.addIssue({
                code: 'custom',
                path: [i, 'x'],
                message: `must be above the previous point's x (${pts[i - 1]!.x}): the table must increase in x`,
              });
          }
        }),
      /** Propeller speed for J = V/(n·D) (constant-speed propeller). */
      rpm: bounded(100, 60_000, 'rpm').optional(),
      diameter_m: bounded(0.05, 6, 'm').optional(),
      /** Total static thrust (take-off run); absent: the table's first point carried to V = 0. */
      staticThrust_N: bounded(0, 1_000_000, 'N', true).optional(),
    })
    .refine((t) => t.by === 'airspeed' || (t.rpm !== undefined && t.diameter_m !== undefined), {
      error: 'an advance-ratio table needs rpm and diameter_m',
      path: ['rpm'],
    }),
]);

export const PropellerSchema = z.object({
  type: z.literal('propeller'),
  engine: z.enum(['piston', 'turboprop']),
  /** Total maximum shaft power at sea level, ISA. */
  maxPowerSL_W: bounded(0, 20_000_000, 'W', true),
  /** Power lapse with density: Gagg–Ferrar (normally aspirated piston) or σ^n. */
  lapse: z.discriminatedUnion('model', [
    z.object({ model: z.literal('gaggFerrar') }),
    z.object({ model: z.literal('densityPower'), exponent: bounded(0, 2) }),
  ]),
  /** Full power is held up to this pressure altitude (turbo/supercharged); 0 for none. */
  criticalAltitude_m: bounded(0, 15_000, 'm'),
  /** Propeller efficiency; with `propeller`, the efficiency at its cruise point. */
  propEfficiency: fraction(0.2, 0.95),
  propeller: PropellerCurveSchema.optional(),
  /** Brake-specific fuel consumption, kg/J. */
  bsfc_kg_J: bounded(0, 1e-6, 'kg/J', true),
  /** Shaft power at idle as a fraction of maximum (descent, glide). */
  idlePowerFraction: fraction(0, 0.5),
  fuel: FuelSchema,
});

export const BatterySchema = z.object({
  /** Nominal pack energy. */
  energy_J: bounded(0, 1e11, 'J', true),
  mass_kg: bounded(0, 50_000, 'kg', true),
  /** Fraction of the nominal energy that may be drawn (the rest protects the cells). */
  usableFraction: fraction(0.3, 1),
  /** Peukert exponent n ≥ 1 (1 = ideal); Traub 2011. */
  peukertExponent: bounded(1, 1.6),
  /** Discharge time at which the rated capacity is specified (Rt in Traub 2011). */
  ratedDischargeTime_s: bounded(60, 100 * 3600, 's'),
});

export const ElectricSchema = z.object({
  type: z.literal('electric'),
  /** Maximum continuous motor shaft power (no density lapse). */
  maxShaftPower_W: bounded(0, 10_000_000, 'W', true),
  motorEfficiency: fraction(0.3, 1),
  controllerEfficiency: fraction(0.3, 1),
  /** Propeller efficiency; with `propeller`, the efficiency at its cruise point. */
  propEfficiency: fraction(0.2, 0.95),
  propeller: PropellerCurveSchema.optional(),
  battery: BatterySchema,
});

export const PowerplantSchema = z.discriminatedUnion('type', [
  JetSchema,
  PropellerSchema,
  ElectricSchema,
]);

/** Aircraft data for field performance. */
export const FieldDataSchema = z.object({
  /** Lift coefficient during the ground run (attitude on the wheels; 0.3 common practice). */
  CLground: bounded(0, 1.5),
  /** Propeller diameter for the static-thrust estimate (propeller and electric aircraft). */
  propDiameter_m: bounded(0.05, 6, 'm').optional(),
});

export const AircraftSchema = z.object({
  name: z.string().min(1).max(120),
  wingArea_m2: bounded(0.01, 1000, 'm²'),
  /** Wing span; gives the mean chord S/b for the Reynolds-number warning (else from the AR). */
  span_m: bounded(0.1, 120, 'm').optional(),
  polar: PolarSchema,
  mass: z.object({
    /** Empty mass: everything but payload, fuel and (electric) battery pack. */
    empty_kg: bounded(0.01, 500_000, 'kg'),
    payload_kg: bounded(0, 200_000, 'kg'),
    mtow_kg: bounded(0.01, 600_000, 'kg'),
  }),
  /** Absolute operating ceiling the operator may not exceed (approved or chosen limit). */
  ceiling_m: bounded(0, 20_000, 'm'),
  powerplant: PowerplantSchema,
  /** Number of engines sharing the powerplant's totals (absent: 1). */
  engineCount: z.number().int().min(1).max(8).optional(),
  /**
   * Multi-engine: drag coefficient added with one engine inoperative (stopped or feathered
   * propeller, trim); absent: 0.003 (from memory, light twin with a feathered propeller).
   */
  oeiDragIncrement: bounded(0, 0.05).optional(),
  /** Optional: needed only for take-off and landing distances. */
  field: FieldDataSchema.optional(),
});

/** One level of a winds-aloft forecast; values between levels are interpolated as vectors. */
export const WindLevelSchema = z.object({
  altitude_m: bounded(-1000, 30_000, 'm'),
  from_deg: angle_deg(),
  speed_m_s: bounded(0, 150, 'm/s'),
  /** Temperature at this level as an offset from ISA; if absent, environment.isaOffset_K. */
  isaOffset_K: bounded(-80, 60, 'K').optional(),
});

export const WaypointSchema = z.object({
  id: z.string().min(1).max(64),
  name: z.string().max(120).default(''),
  lat_deg: bounded(-90, 90, 'deg'),
  lon_deg: bounded(-180, 180, 'deg'),
  altitude_m: bounded(-1000, 30_000, 'm').optional(),
  /** East positive; overrides the route's variation at this waypoint. */
  magneticVariation_deg: bounded(-180, 180, 'deg').optional(),
});

export const RouteSchema = z.object({
  waypoints: z
    .array(WaypointSchema)
    .min(2)
    .max(5000)
    .refine((w) => new Set(w.map((p) => p.id)).size === w.length, {
      error: 'waypoint ids must be unique',
    }),
  /** East positive (common practice: magnetic = true − east variation). */
  magneticVariation_deg: bounded(-180, 180, 'deg'),
});

/**
 * One wind for the whole mission: a steady wind, or the winds-aloft table. Every leg with a
 * course uses it unless the leg overrides it (windSource 'leg' or 'aloft'); the runway
 * surface winds and the launch headwind follow it unless set to their own.
 */
export const MissionWindSchema = z.discriminatedUnion('by', [
  z.object({ by: z.literal('steady'), ...WindSchema.shape }),
  z.object({ by: z.literal('aloft') }),
]);

export const EnvironmentSchema = z.object({
  /** Temperature offset from ISA, applied at every pressure altitude. */
  isaOffset_K: bounded(-60, 50, 'K'),
  /** Altimeter setting; leg altitudes are altitudes above mean sea level with this QNH. */
  qnh_Pa: bounded(87_000, 108_500, 'Pa'),
  departureElevation_m: bounded(-400, 5_000, 'm'),
  arrivalElevation_m: bounded(-400, 5_000, 'm'),
  /** Optional winds-aloft table used by legs whose windSource is 'aloft'. */
  windsAloft: z
    .array(WindLevelSchema)
    .min(1)
    .max(100)
    .refine((l) => new Set(l.map((x) => x.altitude_m)).size === l.length, {
      error: 'wind levels must have distinct altitudes',
    })
    .optional(),
  /** Optional mission wind (absent in version 1 files: every leg keeps its own wind). */
  missionWind: MissionWindSchema.optional(),
});

/** Least height of the reserve hold and alternate above the arrival field when a plan sets none (about 1000 ft, common practice). */
export const DEFAULT_MIN_HEIGHT_ABOVE_FIELD_M = 300;

export const ReservePolicySchema = z.object({
  /**
   * Final reserve: a time flown at the speed of `finalReserveSpeed`, at the altitude of
   * `finalReserveLevel` (core/solver/finalReserve.ts).
   */
  holdTime_s: bounded(0, 6 * 3600, 's'),
  holdAltitude_m: bounded(-400, 15_000, 'm'),
  /**
   * 'normalCruise' (default when absent): the plan's cruise speed schedule (that of its last
   * cruise leg), as operators state a final reserve (common practice, e.g. 14 CFR 91.151(a));
   * 'bestEndurance': the speed of least consumption per unit time.
   */
  finalReserveSpeed: z.enum(['normalCruise', 'bestEndurance']).optional(),
  /** 'holdAltitude' (default when absent): at holdAltitude_m; 'lastCruise': where the last cruise leg starts. */
  finalReserveLevel: z.enum(['holdAltitude', 'lastCruise']).optional(),
  /**
   * Least height of the hold and of the alternate above the arrival field (default 300 m,
   * about 1000 ft, common practice); lower ones fail the reserve check.
   */
  minHeightAboveField_m: bounded(0, 3000, 'm').optional(),
  /** Contingency as a fraction of trip fuel or energy. */
  contingencyFraction: fraction(0, 0.5),
  /** Distance to an alternate, flown at best range at the alternate altitude. */
  alternateDistance_m: bounded(0, 5_000_000, 'm'),
  alternateAltitude_m: bounded(-400, 15_000, 'm'),
  /** Electric: state of charge (of usable energy) never to be crossed in flight. */
  socFloor: fraction(0, 0.9),
});

export const SettingsSchema = z.object({
  /** Minimum ratio of airspeed to stall speed (1.2 common practice). */
  stallFactor: bounded(1, 2),
  /** A check whose relative margin is below this is reported as tight. */
  tightMargin: fraction(0, 0.5),
  /** Rate of climb that defines the service ceiling (0.5 m/s common practice). */
  minClimbRate_m_s: bounded(0, 10, 'm/s'),
  /**
   * How far the end of the last leg may lie from the arrival elevation (default 30 m, about
   * 100 ft, when absent) before the mission-shape check fails.
   */
  arrivalTolerance_m: bounded(0, 1000, 'm').optional(),
});

/** Runway surface; friction coefficients in core/field/surfaces.ts (common practice). */
export const SurfaceSchema = z.enum([
  'dryHard',
  'wetHard',
  'shortDryGrass',
  'longGrass',
  'softGround',
]);

/** A runway at the departure or arrival field. Elevation comes from `environment`. */
export const RunwaySchema = z.object({
  by: z.literal('runway'),
  available_m: bounded(1, 10_000, 'm'),
  surface: SurfaceSchema,
  /** Rise over run in the direction of the roll; + uphill. */
  slope: bounded(-0.1, 0.1),
  /** Magnetic or true runway direction in degrees, the same reference as the surface wind. */
  heading_deg: angle_deg(),
  surfaceWind: WindSchema,
  /** 'own': surfaceWind; 'mission' (the default when the plan has a mission wind): that wind. */
  surfaceWindSource: z.enum(['own', 'mission']).optional(),
  /** Outside air temperature at the field; if absent, ISA + environment.isaOffset_K. */
  temperature_K: bounded(200, 340, 'K').optional(),
});

/** Hand or catapult launch of a UAV: a speed check instead of a ground roll. */
export const LaunchSchema = z.object({
  by: z.literal('launch'),
  /** Ground speed at release (hand throw, or the catapult's end speed). */
  releaseSpeed_m_s: bounded(0, 80, 'm/s', true),
  /** Headwind at the launch point. */
  headwind_m_s: bounded(-20, 30, 'm/s'),
  /**
   * 'own': headwind_m_s; 'mission' (the default when the plan has a mission wind): launched
   * into the mission wind, so its whole speed is headwind (common practice).
   */
  headwindSource: z.enum(['own', 'mission']).optional(),
  catapultStroke_m: bounded(0, 50, 'm').optional(),
});

/** Recovery without a runway (net, parachute, belly landing on a field): no distance check. */
export const NoRunwaySchema = z.object({ by: z.literal('none') });

export const AirfieldSchema = z.object({
  departure: z.discriminatedUnion('by', [RunwaySchema, LaunchSchema, NoRunwaySchema]),
  arrival: z.discriminatedUnion('by', [RunwaySchema, NoRunwaySchema]),
  /** Take-off distance to 15 m × factor must fit the runway (1.15 common practice). */
  takeoffFactor: bounded(1, 2),
  /** Landing distance from 15 m × factor must fit the runway (1.43 = 1/0.7, common practice). */
  landingFactor: bounded(1, 2.5),
  /** Release airspeed must be at least this × stall speed (1.15 common practice). */
  launchFactor: bounded(1, 1.5),
});

/** Spreads (one standard deviation) of the uncertain inputs for the reserve Monte Carlo. */
export const UncertaintySchema = z.object({
  windSpeed_m_s: bounded(0, 20, 'm/s'),
  windDirection_deg: bounded(0, 90, 'deg'),
  /** Relative spreads (0.05 = 5 %). */
  cd0: fraction(0, 0.5),
  efficiency: fraction(0, 0.3),
  fuelConsumption: fraction(0, 0.3),
  batteryCapacity: fraction(0, 0.5),
  payload_kg: bounded(0, 10_000, 'kg'),
  /**
   * Correlation of the wind errors of two legs of one flight (0 independent, 1 the same
   * error on every leg); 0.8 if absent (common practice, core/uncertainty/windErrors.ts).
   */
  windCorrelation: fraction(0, 1).optional(),
  samples: z.number().int().min(100).max(20_000),
  seed: z
    .number()
    .int()
    .min(0)
    .max(2 ** 31 - 1),
});

/** A fixed airspeed: TAS, EAS or CAS in m/s, or a Mach number. */
const FixedSpeed = [
  z.object({ kind: z.literal('tas'), speed_m_s: bounded(0, 400, 'm/s', true) }),
  z.object({ kind: z.literal('eas'), speed_m_s: bounded(0, 400, 'm/s', true) }),
  z.object({ kind: z.literal('cas'), speed_m_s: bounded(0, 400, 'm/s', true) }),
  z.object({ kind: z.literal('mach'), mach: bounded(0, 0.95, '', true) }),
] as const;
export const FixedSpeedSchema = z.discriminatedUnion('kind', [...FixedSpeed]);

const Allowance = z.discriminatedUnion('by', [
  z.object({ by: z.literal('fuel'), fuel_kg: bounded(0, 10_000, 'kg') }),
  z.object({ by: z.literal('energy'), energy_J: bounded(0, 1e10, 'J') }),
  z.object({ by: z.literal('massFraction'), fraction: fraction(0, 0.2) }),
  z.object({ by: z.literal('time'), time_s: bounded(0, 3600, 's') }),
]);

const legBase = {
  /** Stable identity for editing and reordering; not used by the physics. */
  id: z.string().min(1).max(64),
  label: z.string().max(120).default(''),
};
const track = {
  course_deg: angle_deg(),
  wind: WindSchema,
  /**
   * 'leg': the leg's own wind; 'aloft': the winds-aloft table at each altitude flown;
   * 'mission': environment.missionWind. Absent: 'mission' when the plan has a mission wind,
   * otherwise 'leg' (core/solver/missionWind.ts).
   */
  windSource: z.enum(['leg', 'aloft', 'mission']).optional(),
  /** With a plan route: the waypoint this leg flies to; course and distance come from the route. */
  toWaypoint: z.string().min(1).max(64).optional(),
};

export const TakeoffLegSchema = z.object({
  kind: z.literal('takeoff'),
  ...legBase,
  allowance: Allowance,
});
export const LandingLegSchema = z.object({
  kind: z.literal('landing'),
  ...legBase,
  allowance: Allowance,
});

export const ClimbLegSchema = z.object({
  kind: z.literal('climb'),
  ...legBase,
  ...track,
  toAltitude_m: bounded(-400, 20_000, 'm'),
  speed: z.discriminatedUnion('kind', [z.object({ kind: z.literal('bestRate') }), ...FixedSpeed]),
  /** Fraction of maximum power or thrust used in the climb. */
  throttle: fraction(0.05, 1, false),
});

export const CruiseLegSchema = z.object({
  kind: z.literal('cruise'),
  ...legBase,
  ...track,
  end: z.discriminatedUnion('by', [
    z.object({ by: z.literal('distance'), distance_m: bounded(0, 20_000_000, 'm', true) }),
    z.object({ by: z.literal('fuel'), fuel_kg: bounded(0, 200_000, 'kg', true) }),
    z.object({ by: z.literal('energy'), energy_J: bounded(0, 1e11, 'J', true) }),
  ]),
  /** Fixed airspeed, or best range in this leg's wind. */
  speed: z.discriminatedUnion('kind', [z.object({ kind: z.literal('bestRange') }), ...FixedSpeed]),
  /** Constant altitude, or cruise-climb (constant CL and TAS, altitude rises as weight falls). */
  program: z.enum(['constantAltitude', 'cruiseClimb']),
});

export const LoiterLegSchema = z.object({
  kind: z.literal('loiter'),
  ...legBase,
  ...track,
  /** An orbit over a point needs no course (legs/loiter.ts); kept as the heading shown. */
  course_deg: angle_deg().default(0),
  end: z.discriminatedUnion('by', [
    z.object({ by: z.literal('time'), time_s: bounded(0, 200 * 3600, 's', true) }),
    /** As long as the rest of the plan and the reserve policy still allow. */
    z.object({ by: z.literal('reserve') }),
  ]),
  speed: z.discriminatedUnion('kind', [
    z.object({ kind: z.literal('bestEndurance') }),
    ...FixedSpeed,
  ]),
});

export const DescentLegSchema = z.object({
  kind: z.literal('descent'),
  ...legBase,
  ...track,
  toAltitude_m: bounded(-400, 20_000, 'm'),
  mode: z.discriminatedUnion('by', [
    z.object({
      by: z.literal('rate'),
      rate_m_s: boundedBecause(
        0.1,
        50,
        'm/s',
        'a slower descent (under 20 ft/min) takes hours per 1000 m and is not a descent the mission can be planned with',
      ),
      speed: FixedSpeedSchema,
    }),
    /** Power at idle, best-glide speed ((L/D)max). */
    z.object({ by: z.literal('glide') }),
  ]),
});

export const LegSchema = z.discriminatedUnion('kind', [
  TakeoffLegSchema,
  ClimbLegSchema,
  CruiseLegSchema,
  LoiterLegSchema,
  DescentLegSchema,
  LandingLegSchema,
]);

export const PlanSchema = z.object({
  /**
   * Optional: where an editor finds the JSON Schema of this format (schemas/plan.schema.json),
   * so it can validate and complete the file. Kept as written; Legwise itself ignores it.
   */
  $schema: z.string().min(1).max(2048).optional(),
  format: z.literal(PLAN_FORMAT),
  schemaVersion: z.literal(PLAN_SCHEMA_VERSION),
  name: z.string().min(1).max(120),
  notes: z.string().max(20_000).default(''),
  aircraft: AircraftSchema,
  environment: EnvironmentSchema,
  reserves: ReservePolicySchema,
  settings: SettingsSchema,
  legs: z.array(LegSchema).min(1).max(200),
  /** Optional: the route as waypoints; legs with `toWaypoint` take course and distance from it. */
  route: RouteSchema.optional(),
  /** Optional: runway or launch checks at departure and arrival. */
  airfield: AirfieldSchema.optional(),
  /** Optional: spreads for the reserve Monte Carlo (defaults from common practice if absent). */
  uncertainty: UncertaintySchema.optional(),
});

export type Plan = z.infer<typeof PlanSchema>;
export type Aircraft = z.infer<typeof AircraftSchema>;
export type Polar = z.infer<typeof PolarSchema>;
export type Powerplant = z.infer<typeof PowerplantSchema>;
export type JetPowerplant = z.infer<typeof JetSchema>;
export type JetLapse = z.infer<typeof JetLapseSchema>;
export type PropellerPowerplant = z.infer<typeof PropellerSchema>;
export type ElectricPowerplant = z.infer<typeof ElectricSchema>;
export type Battery = z.infer<typeof BatterySchema>;
export type PropellerCurveData = z.infer<typeof PropellerCurveSchema>;
export type Fuel = z.infer<typeof FuelSchema>;
export type Environment = z.infer<typeof EnvironmentSchema>;
export type ReservePolicy = z.infer<typeof ReservePolicySchema>;
export type Settings = z.infer<typeof SettingsSchema>;
export type Wind = z.infer<typeof WindSchema>;
export type MissionWind = z.infer<typeof MissionWindSchema>;
export type FixedSpeed = z.infer<typeof FixedSpeedSchema>;
export type Leg = z.infer<typeof LegSchema>;
export type LegKind = Leg['kind'];
export type TakeoffLeg = z.infer<typeof TakeoffLegSchema>;
export type LandingLeg = z.infer<typeof LandingLegSchema>;
export type ClimbLeg = z.infer<typeof ClimbLegSchema>;
export type CruiseLeg = z.infer<typeof CruiseLegSchema>;
export type LoiterLeg = z.infer<typeof LoiterLegSchema>;
export type DescentLeg = z.infer<typeof DescentLegSchema>;
export type Allowance = z.infer<typeof Allowance>;
export type Airfield = z.infer<typeof AirfieldSchema>;
export type Runway = z.infer<typeof RunwaySchema>;
export type Launch = z.infer<typeof LaunchSchema>;
export type FieldData = z.infer<typeof FieldDataSchema>;
export type Uncertainty = z.infer<typeof UncertaintySchema>;
export type Surface = z.infer<typeof SurfaceSchema>;
export type Route = z.infer<typeof RouteSchema>;
export type WaypointData = z.infer<typeof WaypointSchema>;
export type WindLevelData = z.infer<typeof WindLevelSchema>;
