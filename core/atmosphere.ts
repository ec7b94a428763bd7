/**
 * Standard atmosphere: the 1976 U.S. Standard Atmosphere (NOAA/NASA/USAF, 1976), all seven
 * layers from −5 km up to 86 km geometric. Below 32 km it is identical to the ICAO standard
 * atmosphere (ICAO Doc 7488). Heights are geopotential unless a name says geometric.
 *
 * Layer table and constants: the standard's Table 4 and Table 2 (R* = 8314.32 J/(kmol·K),
 * M0 = 28.9644 kg/kmol). Using the standard's own R* and M0 rather than ICAO's rounded
 * 287.05287 J/(kg·K) reproduces the tabulated base pressures to their printed 7 digits.
 * Between 80 and 86 km the standard lets the mean molecular weight fall slightly (Table 8);
 * pressure, density and speed of sound depend only on the molecular-scale temperature, the
 * kinetic temperature T_K (and viscosity) carry the M/M0 factor.
 *
 * Off-standard days (ISA+ΔT) follow common practice: the pressure at a pressure altitude is
 * the standard one, the temperature is shifted by ΔT and density follows from the gas law.
 */
import { InputError, requireFinite } from './errors.ts';
import { G0 } from './units.ts';

export const R_STAR = 8314.32; // J/(kmol·K), 1976 standard Table 2
export const M0_KG_KMOL = 28.9644; // sea-level mean molecular weight, 1976 standard Table 2
export const R_AIR = R_STAR / M0_KG_KMOL; // J/(kg·K) = 287.0531
export const GAMMA = 1.4;
export const EARTH_RADIUS_M = 6356766; // r0, effective radius for geopotential height
export const T0_K = 288.15;
export const P0_PA = 101325;
export const RHO0_KG_M3 = P0_PA / (R_AIR * T0_K); // 1.2250
export const A0_M_S = Math.sqrt(GAMMA * R_AIR * T0_K); // 340.294
export const SUTHERLAND_BETA = 1.458e-6; // kg/(m·s·K^½)
export const SUTHERLAND_S_K = 110.4;

/** Lowest geopotential height served: the standard tabulates from −5 km. */
export const MIN_GEOPOTENTIAL_M = -5000;
export const MAX_GEOMETRIC_M = 86000;
/** 84 852.05 m, the geopotential height of 86 km geometric. */
export const MAX_GEOPOTENTIAL_M =
  (EARTH_RADIUS_M * MAX_GEOMETRIC_M) / (EARTH_RADIUS_M + MAX_GEOMETRIC_M);
const HEIGHT_LIMIT = 'between -5000 and 84852 m geopotential (86 km geometric)';

/** ISA offsets beyond these are not weather on Earth; they are input mistakes. */
export const MIN_ISA_OFFSET_K = -80;
export const MAX_ISA_OFFSET_K = 60;
const MIN_TEMPERATURE_K = 100;

export interface AtmosphereState {
  T_K: number;
  p_Pa: number;
  rho_kg_m3: number;
  a_m_s: number;
  mu_Pa_s: number;
  /** T/T0 */
  theta: number;
  /** p/p0 */
  delta: number;
  /** rho/rho0 */
  sigma: number;
}

export interface AtmosphereLayer {
  /** Geopotential base height, m. */
  readonly H_m: number;
  /** Molecular-scale temperature at the base, K. */
  readonly T_K: number;
  readonly lapse_K_m: number;
  readonly p_Pa: number;
  readonly rho_kg_m3: number;
}

// 1976 standard Table 4: geopotential base, base temperature, lapse rate.
const LAYER_DEFS: readonly (readonly [number, number, number])[] = [
  [0, 288.15, -0.0065],
  [11000, 216.65, 0],
  [20000, 216.65, 0.001],
  [32000, 228.65, 0.0028],
  [47000, 270.65, 0],
  [51000, 270.65, -0.0028],
  [71000, 214.65, -0.002],
];

/** Base pressures are chained from p0 so pressure is continuous across layer boundaries. */
export const LAYERS: readonly AtmosphereLayer[] = buildLayers();

function buildLayers(): AtmosphereLayer[] {
  const layers: AtmosphereLayer[] = [];
  let p = P0_PA;
  LAYER_DEFS.forEach(([H_m, T_K, lapse_K_m], i) => {
    if (i > 0) {
      const below = layers[i - 1] as AtmosphereLayer;
      p = pressureInLayer(below, H_m);
    }
    layers.push({ H_m, T_K, lapse_K_m, p_Pa: p, rho_kg_m3: p / (R_AIR * T_K) });
  });
  return layers;
}

function layerAt(H_m: number): AtmosphereLayer {
  let layer = LAYERS[0] as AtmosphereLayer;
  for (const l of LAYERS) if (H_m >= l.H_m) layer = l;
  return layer;
}

function molecularTemperature(layer: AtmosphereLayer, H_m: number): number {
  return layer.T_K + layer.lapse_K_m * (H_m - layer.H_m);
}

// Hydrostatic equation integrated over a layer of constant lapse rate (1976 standard eq. 33a/33b).
function pressureInLayer(layer: AtmosphereLayer, H_m: number): number {
  const dH = H_m - layer.H_m;
  if (layer.lapse_K_m === 0) return layer.p_Pa * Math.exp((-G0 * dH) / (R_AIR * layer.T_K));
  const T = molecularTemperature(layer, H_m);
  return layer.p_Pa * Math.pow(layer.T_K / T, G0 / (R_AIR * layer.lapse_K_m));
}

// 1976 standard Table 8: M/M0 at 0.5 km geometric steps from 80 to 86 km (linear between).
const MOLECULAR_WEIGHT_RATIO = [
  1.0, 0.999996, 0.999989, 0.999971, 0.999941, 0.999909, 0.99987, 0.999829, 0.999786, 0.999741,
  0.999694, 0.999641, 0.999579,
];

/** Mean molecular weight over its sea-level value at geometric height z (1 below 80 km). */
export function molecularWeightRatio(z_m: number): number {
  if (z_m <= 80000) return 1;
  const x = Math.min((z_m - 80000) / 500, MOLECULAR_WEIGHT_RATIO.length - 1);
  const i = Math.min(Math.floor(x), MOLECULAR_WEIGHT_RATIO.length - 2);
  const lo = MOLECULAR_WEIGHT_RATIO[i] as number;
  const hi = MOLECULAR_WEIGHT_RATIO[i + 1] as number;
  return lo + (hi - lo) * (x - i);
}

/** H = r0·z/(r0 + z) (1976 standard eq. 18). */
export function geopotentialFromGeometric(z_m: number, field = 'geometricAltitude_m'): number {
  requireFinite(field, z_m, -100000, 1e6, 'm');
  return (EARTH_RADIUS_M * z_m) / (EARTH_RADIUS_M + z_m);
}

/** z = r0·H/(r0 − H), the inverse of geopotentialFromGeometric. */
export function geometricFromGeopotential(H_m: number, field = 'altitude_m'): number {
  requireFinite(field, H_m, -100000, 1e6, 'm');
  return (EARTH_RADIUS_M * H_m) / (EARTH_RADIUS_M - H_m);
}

/** a = √(γ·R·T). */
export function speedOfSound(T_K: number, field = 'temperature_K'): number {
  if (!Number.isFinite(T_K) || T_K <= 0) throw new InputError(field, T_K, 'above 0 K');
  return Math.sqrt(GAMMA * R_AIR * T_K);
}

/** Sutherland's law μ = β·T^1.5/(T + S), coefficients of the 1976 standard. */
export function dynamicViscosity(T_K: number, field = 'temperature_K'): number {
  if (!Number.isFinite(T_K) || T_K <= 0) throw new InputError(field, T_K, 'above 0 K');
  return (SUTHERLAND_BETA * Math.pow(T_K, 1.5)) / (T_K + SUTHERLAND_S_K);
}

function checkHeight(H_m: number, field: string): void {
  if (!Number.isFinite(H_m) || H_m < MIN_GEOPOTENTIAL_M || H_m > MAX_GEOPOTENTIAL_M) {
    throw new InputError(field, H_m, HEIGHT_LIMIT);
  }
}

function state(H_m: number, isaOffset_K: number, offsetField: string): AtmosphereState {
  const layer = layerAt(H_m);
  const p = pressureInLayer(layer, H_m);
  const TM = molecularTemperature(layer, H_m) + isaOffset_K;
  const T = TM * molecularWeightRatio((EARTH_RADIUS_M * H_m) / (EARTH_RADIUS_M - H_m));
  if (T <= MIN_TEMPERATURE_K) {
    throw new InputError(
      offsetField,
      isaOffset_K,
      `such that the temperature stays above ${MIN_TEMPERATURE_K} K`,
    );
  }
  const rho = p / (R_AIR * TM);
  return {
    T_K: T,
    p_Pa: p,
    rho_kg_m3: rho,
    a_m_s: Math.sqrt(GAMMA * R_AIR * TM),
    mu_Pa_s: dynamicViscosity(T),
    theta: T / T0_K,
    delta: p / P0_PA,
    sigma: rho / RHO0_KG_M3,
  };
}

/** The standard day at geopotential height H. */
export function standardAtmosphere(H_m: number, field = 'altitude_m'): AtmosphereState {
  checkHeight(H_m, field);
  return state(H_m, 0, field);
}

export interface AtmosphereFields {
  altitude?: string;
  isaOffset?: string;
}

/**
 * An ISA+ΔT day at a pressure altitude: standard pressure, temperature shifted by ΔT,
 * density from the gas law, speed of sound and viscosity from the shifted temperature.
 */
export function atmosphereAt(
  pressureAltitude_m: number,
  isaOffset_K = 0,
  fields: AtmosphereFields = {},
): AtmosphereState {
  const altitudeField = fields.altitude ?? 'pressureAltitude_m';
  const offsetField = fields.isaOffset ?? 'isaOffset_K';
  checkHeight(pressureAltitude_m, altitudeField);
  requireFinite(offsetField, isaOffset_K, MIN_ISA_OFFSET_K, MAX_ISA_OFFSET_K, 'K');
  return state(pressureAltitude_m, isaOffset_K, offsetField);
}

const P_TOP_PA = pressureInLayer(layerAt(MAX_GEOPOTENTIAL_M), MAX_GEOPOTENTIAL_M);
const P_BOTTOM_PA = pressureInLayer(layerAt(MIN_GEOPOTENTIAL_M), MIN_GEOPOTENTIAL_M);

/** The standard (pressure) altitude at which the standard pressure equals p; exact per layer. */
export function pressureAltitudeFromPressure(p_Pa: number, field = 'pressure_Pa'): number {
  if (!Number.isFinite(p_Pa) || p_Pa < P_TOP_PA || p_Pa > P_BOTTOM_PA) {
    throw new InputError(field, p_Pa, `between ${sig(P_TOP_PA)} and ${sig(P_BOTTOM_PA)} Pa`);
  }
  let layer = LAYERS[0] as AtmosphereLayer;
  for (const l of LAYERS) if (p_Pa <= l.p_Pa) layer = l;
  const ratio = p_Pa / layer.p_Pa;
  if (layer.lapse_K_m === 0) return layer.H_m - ((R_AIR * layer.T_K) / G0) * Math.log(ratio);
  const T = layer.T_K * Math.pow(ratio, (-R_AIR * layer.lapse_K_m) / G0);
  return layer.H_m + (T - layer.T_K) / layer.lapse_K_m;
}

/** QNH limits: beyond the recorded extremes (about 870 and 1085 hPa) with room to spare. */
export const MIN_QNH_PA = 80000;
export const MAX_QNH_PA = 110000;

/**
 * Pressure altitude of an aerodrome from its elevation and QNH. An altimeter set to QNH reads
 * the elevation, so Hp = elevation + Hp(QNH): a high QNH lowers the pressure altitude
 * (about 8.3 m, 27 ft, per hPa near sea level). The elevation is taken as the altimeter
 * height, the common practice.
 */
export function pressureAltitudeFromQnh(
  elevation_m: number,
  qnh_Pa: number,
  fields: { elevation?: string; qnh?: string } = {},
): number {
  requireFinite(fields.elevation ?? 'elevation_m', elevation_m, -1000, 10000, 'm');
  requireFinite(fields.qnh ?? 'qnh_Pa', qnh_Pa, MIN_QNH_PA, MAX_QNH_PA, 'Pa');
  return elevation_m + pressureAltitudeFromPressure(qnh_Pa);
}

const RHO_TOP =
  P_TOP_PA / (R_AIR * molecularTemperature(layerAt(MAX_GEOPOTENTIAL_M), MAX_GEOPOTENTIAL_M));
const RHO_BOTTOM =
  P_BOTTOM_PA / (R_AIR * molecularTemperature(LAYERS[0] as AtmosphereLayer, MIN_GEOPOTENTIAL_M));

/**
 * Density altitude: the standard-day height with density rho; exact per layer, since
 * ρ/ρb = (T/Tb)^−(1 + g0/(R·L)) where L ≠ 0 and ρ/ρb = p/pb where L = 0.
 */
export function densityAltitude(rho_kg_m3: number, field = 'density_kg_m3'): number {
  if (!Number.isFinite(rho_kg_m3) || rho_kg_m3 < RHO_TOP || rho_kg_m3 > RHO_BOTTOM) {
    throw new InputError(field, rho_kg_m3, `between ${sig(RHO_TOP)} and ${sig(RHO_BOTTOM)} kg/m³`);
  }
  let layer = LAYERS[0] as AtmosphereLayer;
  for (const l of LAYERS) if (rho_kg_m3 <= l.rho_kg_m3) layer = l;
  const ratio = rho_kg_m3 / layer.rho_kg_m3;
  if (layer.lapse_K_m === 0) return layer.H_m - ((R_AIR * layer.T_K) / G0) * Math.log(ratio);
  const exponent = -1 / (1 + G0 / (R_AIR * layer.lapse_K_m));
  const T = layer.T_K * Math.pow(ratio, exponent);
  return layer.H_m + (T - layer.T_K) / layer.lapse_K_m;
}

// Limits in messages to 7 significant digits.
function sig(x: number): number {
  return Number(x.toPrecision(7));
}
