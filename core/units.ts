/**
 * Units: exact conversion factors and the display unit systems.
 *
 * Factors are exact by definition (NIST SP 811, 2008, appendix B; the 1959 international
 * yard and pound agreement fixes ft = 0.3048 m and lb = 0.45359237 kg; g0 = 9.80665 m/s²
 * by the 3rd CGPM). Every value in core is SI; this module is the only place that knows
 * other units. A value v in unit u is v·factor + offset in SI (offset only for °C and °F).
 */
import { InputError } from './errors.ts';

// --- Exact factors (to SI) ---------------------------------------------------------------
export const G0 = 9.80665; // m/s², standard gravity (exact)
export const FT = 0.3048; // m (exact, 1959)
export const STATUTE_MILE = 1609.344; // m = 5280 ft (exact)
export const NMI = 1852; // m (exact)
export const KT = 1852 / 3600; // m/s (exact)
export const KMH = 1 / 3.6; // m/s (exact)
export const FPM = 0.3048 / 60; // m/s per ft/min (exact)
export const LB = 0.45359237; // kg (exact, 1959)
export const LBF = LB * G0; // N = 4.4482216152605 (exact)
export const US_GAL = 3.785411784e-3; // m³ = 231 in³ (exact)
export const LITRE = 1e-3; // m³ (exact)
export const MIN = 60; // s
export const HOUR = 3600; // s
export const HP = 550 * FT * LBF; // W, mechanical horsepower = 550 ft·lbf/s (exact)
export const WH = 3600; // J (exact)
export const KWH = 3.6e6; // J (exact)
export const HPA = 100; // Pa (exact)
export const INHG = 3386.389; // Pa, conventional inch of mercury (NIST SP 811: 3.386389E+03)
const DEG = Math.PI / 180; // rad

export type Dimension =
  | 'length'
  | 'speed'
  | 'mass'
  | 'force'
  | 'power'
  | 'energy'
  | 'time'
  | 'temperature'
  | 'temperatureDelta'
  | 'pressure'
  | 'area'
  | 'volume'
  | 'density'
  | 'angle'
  | 'tsfc'
  | 'bsfc'
  | 'specificEnergy'
  | 'charge'
  | 'voltage'
  | 'ratio';

export interface UnitDef {
  readonly dimension: Dimension;
  readonly label: string;
  /** SI value = value · factor + offset. */
  readonly factor: number;
  readonly offset?: number;
}

const unitTable = {
  // length
  m: { dimension: 'length', label: 'm', factor: 1 },
  km: { dimension: 'length', label: 'km', factor: 1000 },
  ft: { dimension: 'length', label: 'ft', factor: FT },
  nmi: { dimension: 'length', label: 'NM', factor: NMI },
  mi: { dimension: 'length', label: 'mi', factor: STATUTE_MILE },
  // speed (vertical speed is a speed: m/s and ft/min convert into each other)
  m_s: { dimension: 'speed', label: 'm/s', factor: 1 },
  km_h: { dimension: 'speed', label: 'km/h', factor: KMH },
  kt: { dimension: 'speed', label: 'kt', factor: KT },
  ft_min: { dimension: 'speed', label: 'ft/min', factor: FPM },
  // mass
  kg: { dimension: 'mass', label: 'kg', factor: 1 },
  g: { dimension: 'mass', label: 'g', factor: 1e-3 },
  lb: { dimension: 'mass', label: 'lb', factor: LB },
  // force
  N: { dimension: 'force', label: 'N', factor: 1 },
  kN: { dimension: 'force', label: 'kN', factor: 1000 },
  lbf: { dimension: 'force', label: 'lbf', factor: LBF },
  // power
  W: { dimension: 'power', label: 'W', factor: 1 },
  kW: { dimension: 'power', label: 'kW', factor: 1000 },
  hp: { dimension: 'power', label: 'hp', factor: HP },
  // energy
  J: { dimension: 'energy', label: 'J', factor: 1 },
  Wh: { dimension: 'energy', label: 'Wh', factor: WH },
  kWh: { dimension: 'energy', label: 'kWh', factor: KWH },
  // time
  s: { dimension: 'time', label: 's', factor: 1 },
  min: { dimension: 'time', label: 'min', factor: MIN },
  h: { dimension: 'time', label: 'h', factor: HOUR },
  // absolute temperature (°C and °F carry an offset)
  K: { dimension: 'temperature', label: 'K', factor: 1 },
  degC: { dimension: 'temperature', label: '°C', factor: 1, offset: 273.15 },
  degF: { dimension: 'temperature', label: '°F', factor: 5 / 9, offset: 273.15 - (32 * 5) / 9 },
  // temperature difference (ISA offset): +10 °C = +10 K, +18 °F = +10 K, no offset
  K_delta: { dimension: 'temperatureDelta', label: 'K', factor: 1 },
  degC_delta: { dimension: 'temperatureDelta', label: '°C', factor: 1 },
  degF_delta: { dimension: 'temperatureDelta', label: '°F', factor: 5 / 9 },
  // pressure
  Pa: { dimension: 'pressure', label: 'Pa', factor: 1 },
  hPa: { dimension: 'pressure', label: 'hPa', factor: HPA },
  inHg: { dimension: 'pressure', label: 'inHg', factor: INHG },
  // area
  m2: { dimension: 'area', label: 'm²', factor: 1 },
  ft2: { dimension: 'area', label: 'ft²', factor: FT * FT },
  // volume
  m3: { dimension: 'volume', label: 'm³', factor: 1 },
  L: { dimension: 'volume', label: 'L', factor: LITRE },
  usgal: { dimension: 'volume', label: 'US gal', factor: US_GAL },
  // density (fuel and air)
  kg_m3: { dimension: 'density', label: 'kg/m³', factor: 1 },
  kg_L: { dimension: 'density', label: 'kg/L', factor: 1 / LITRE },
  lb_usgal: { dimension: 'density', label: 'lb/US gal', factor: LB / US_GAL },
  // angle
  rad: { dimension: 'angle', label: 'rad', factor: 1 },
  deg: { dimension: 'angle', label: '°', factor: DEG },
  // thrust-specific fuel consumption, SI kg/(N·s)
  kg_Ns: { dimension: 'tsfc', label: 'kg/(N·s)', factor: 1 },
  g_kNs: { dimension: 'tsfc', label: 'g/(kN·s)', factor: 1e-6 },
  lb_lbfh: { dimension: 'tsfc', label: 'lb/(lbf·h)', factor: LB / (LBF * HOUR) },
  // brake-specific fuel consumption, SI kg/J
  kg_J: { dimension: 'bsfc', label: 'kg/J', factor: 1 },
  g_kWh: { dimension: 'bsfc', label: 'g/kWh', factor: 1e-3 / KWH },
  lb_hph: { dimension: 'bsfc', label: 'lb/(hp·h)', factor: LB / (HP * HOUR) },
  // specific energy, SI J/kg
  J_kg: { dimension: 'specificEnergy', label: 'J/kg', factor: 1 },
  Wh_kg: { dimension: 'specificEnergy', label: 'Wh/kg', factor: WH },
  // battery charge and voltage
  C: { dimension: 'charge', label: 'C', factor: 1 },
  Ah: { dimension: 'charge', label: 'Ah', factor: HOUR },
  mAh: { dimension: 'charge', label: 'mAh', factor: HOUR / 1000 },
  V: { dimension: 'voltage', label: 'V', factor: 1 },
  // dimensionless
  fraction: { dimension: 'ratio', label: '', factor: 1 },
  percent: { dimension: 'ratio', label: '%', factor: 0.01 },
} as const satisfies Record<string, UnitDef>;

export type UnitId = keyof typeof unitTable;
export const UNITS: Readonly<Record<UnitId, UnitDef>> = unitTable;
export const UNIT_IDS = Object.keys(unitTable) as readonly UnitId[];

export function isUnitId(id: string): id is UnitId {
  return Object.prototype.hasOwnProperty.call(unitTable, id);
}

/** All units of one dimension, in table order. */
export function unitsOf(dimension: Dimension): UnitId[] {
  return UNIT_IDS.filter((u) => UNITS[u].dimension === dimension);
}

function unitDef(unit: string, field: string): UnitDef {
  if (!isUnitId(unit)) throw new InputError(`${field}.unit`, unit, 'a known unit');
  return UNITS[unit];
}

/** Value in `unit` → SI. Refuses non-finite values and absolute temperatures below 0 K. */
export function toSI(value: number, unit: UnitId, field = 'value'): number {
  const def = unitDef(unit, field);
  if (!Number.isFinite(value)) throw new InputError(field, value, 'a finite number');
  const si = value * def.factor + (def.offset ?? 0);
  if (def.dimension === 'temperature' && si < 0) {
    // −459.67 °F lands a few ulp below 0 K through the offset; only rounding noise passes.
    if (si > -1e-9) return 0;
    const zero = Number(fromSI(0, unit).toPrecision(6));
    throw new InputError(field, value, `at or above absolute zero (${zero} ${def.label})`);
  }
  return si;
}

/** SI value → `unit`. */
export function fromSI(value_si: number, unit: UnitId, field = 'value'): number {
  const def = unitDef(unit, field);
  if (!Number.isFinite(value_si)) throw new InputError(field, value_si, 'a finite number');
  return (value_si - (def.offset ?? 0)) / def.factor;
}

/** Converts between two units of the same dimension; throws InputError otherwise. */
export function convert(value: number, from: UnitId, to: UnitId, field = 'value'): number {
  const a = unitDef(from, field);
  const b = unitDef(to, field);
  if (a.dimension !== b.dimension) {
    throw new InputError(`${field}.unit`, to, `a unit of ${a.dimension} like ${from}`);
  }
  if (from === to) {
    if (!Number.isFinite(value)) throw new InputError(field, value, 'a finite number');
    return value;
  }
  return fromSI(toSI(value, from, field), to, field);
}

// --- Display unit systems ----------------------------------------------------------------
export type Quantity =
  | 'altitude'
  | 'distance'
  | 'shortDistance'
  | 'airspeed'
  | 'groundSpeed'
  | 'windSpeed'
  | 'verticalSpeed'
  | 'mass'
  | 'fuelMass'
  | 'fuelVolume'
  | 'fuelDensity'
  | 'airDensity'
  | 'energy'
  | 'power'
  | 'thrust'
  | 'time'
  | 'temperature'
  | 'temperatureDelta'
  | 'pressure'
  | 'area'
  | 'tsfc'
  | 'bsfc'
  | 'specificEnergy'
  | 'charge'
  | 'voltage'
  | 'angle'
  | 'ratio';

/** The named presets. */
export type UnitSystemId = 'si' | 'aviation' | 'uav';

/** A display unit for every quantity. */
export type UnitMap = Readonly<Record<Quantity, UnitId>>;

/** What values are shown in: a preset, or a unit chosen per quantity. */
export type UnitSystem = UnitSystemId | UnitMap;

/** SI for display: metres, km, m/s, kg, litres, Wh, kW, hPa, °C. */
const SI_UNITS: Readonly<Record<Quantity, UnitId>> = {
  altitude: 'm',
  distance: 'km',
  shortDistance: 'm',
  airspeed: 'm_s',
  groundSpeed: 'm_s',
  windSpeed: 'm_s',
  verticalSpeed: 'm_s',
  mass: 'kg',
  fuelMass: 'kg',
  fuelVolume: 'L',
  fuelDensity: 'kg_L',
  airDensity: 'kg_m3',
  energy: 'Wh',
  power: 'kW',
  thrust: 'N',
  time: 'min',
  temperature: 'degC',
  temperatureDelta: 'K_delta',
  pressure: 'hPa',
  area: 'm2',
  tsfc: 'g_kNs',
  bsfc: 'g_kWh',
  specificEnergy: 'Wh_kg',
  charge: 'Ah',
  voltage: 'V',
  angle: 'deg',
  ratio: 'percent',
};

export const UNIT_SYSTEMS: Readonly<Record<UnitSystemId, Readonly<Record<Quantity, UnitId>>>> = {
  si: SI_UNITS,
  // Trade units of general aviation (ISA deviation stays in °C, as ICAO practice).
  aviation: {
    altitude: 'ft',
    distance: 'nmi',
    shortDistance: 'ft',
    airspeed: 'kt',
    groundSpeed: 'kt',
    windSpeed: 'kt',
    verticalSpeed: 'ft_min',
    mass: 'lb',
    fuelMass: 'lb',
    fuelVolume: 'usgal',
    fuelDensity: 'lb_usgal',
    airDensity: 'kg_m3',
    energy: 'Wh',
    power: 'hp',
    thrust: 'lbf',
    time: 'min',
    temperature: 'degC',
    temperatureDelta: 'degC_delta',
    pressure: 'inHg',
    area: 'ft2',
    tsfc: 'lb_lbfh',
    bsfc: 'lb_hph',
    specificEnergy: 'Wh_kg',
    charge: 'Ah',
    voltage: 'V',
    angle: 'deg',
    ratio: 'percent',
  },
  // Small UAV operators: metres and kilograms, airspeed in m/s, battery energy in Wh and
  // motor power in W, but wind in knots as forecasts give it (common practice).
  uav: {
    ...SI_UNITS,
    windSpeed: 'kt',
    power: 'W',
    temperatureDelta: 'degC_delta',
  },
};

/** The unit for every quantity in a preset or a per-quantity choice. */
export function unitMap(system: UnitSystem): UnitMap {
  return typeof system === 'string' ? UNIT_SYSTEMS[system] : system;
}

/** The display unit for a quantity in a unit system. */
export function displayUnit(system: UnitSystem, quantity: Quantity): UnitId {
  return unitMap(system)[quantity];
}

// --- Fuel densities ----------------------------------------------------------------------
/**
 * Typical fuel densities at about 15 °C, kg/L (common practice; real batches vary by a few
 * percent with grade and temperature, so a plan may override them).
 */
export const FUEL_DENSITY_KG_L = {
  avgas: 0.72,
  mogas: 0.74,
  jetA: 0.804,
  jetA1: 0.804,
  diesel: 0.84,
} as const;
export type FuelKind = keyof typeof FUEL_DENSITY_KG_L;
