/**
 * The person's unit and number settings: a preset (SI, aviation, small UAV), a unit chosen
 * per quantity on top of it, the locale whose decimal mark and thousands separator typed
 * numbers use, and the transition altitude above which altitudes may be typed as flight
 * levels. Kept between sessions in the renderer's settings store; pure functions here so the
 * rules are tested without a screen.
 */
import {
  UNIT_SYSTEMS,
  type Quantity,
  type UnitId,
  type UnitMap,
  type UnitSystemId,
} from '../../../core/units.ts';

export const UNIT_PRESET_NAMES: Readonly<Record<UnitSystemId, string>> = {
  si: 'SI',
  aviation: 'Aviation (ft, kt, NM, lb, US gal)',
  uav: 'Small UAV (m, m/s, wind kt, kg, Wh)',
};

export function isUnitSystemId(value: unknown): value is UnitSystemId {
  return value === 'si' || value === 'aviation' || value === 'uav';
}

/** A quantity the person may set on its own, the units offered, and what follows it. */
export interface ChoosableQuantity {
  readonly quantity: Quantity;
  readonly label: string;
  readonly units: readonly UnitId[];
  /** Quantities shown in a unit that follows this one (ground speed follows airspeed). */
  readonly follows?: Readonly<Partial<Record<Quantity, Readonly<Partial<Record<UnitId, UnitId>>>>>>;
}

export const CHOOSABLE: readonly ChoosableQuantity[] = [
  { quantity: 'altitude', label: 'Altitude', units: ['m', 'ft'] },
  { quantity: 'distance', label: 'Distance', units: ['km', 'nmi', 'mi'] },
  {
    quantity: 'airspeed',
    label: 'Airspeed',
    units: ['m_s', 'km_h', 'kt'],
    follows: { groundSpeed: { m_s: 'm_s', km_h: 'km_h', kt: 'kt' } },
  },
  { quantity: 'windSpeed', label: 'Wind', units: ['kt', 'm_s', 'km_h'] },
  { quantity: 'mass', label: 'Mass', units: ['kg', 'lb'] },
  { quantity: 'fuelMass', label: 'Fuel mass', units: ['kg', 'lb'] },
  { quantity: 'fuelVolume', label: 'Fuel volume', units: ['L', 'usgal'] },
  { quantity: 'energy', label: 'Energy', units: ['Wh', 'kWh', 'J'] },
  { quantity: 'pressure', label: 'Pressure', units: ['hPa', 'inHg'] },
  {
    quantity: 'temperature',
    label: 'Temperature',
    units: ['degC', 'degF'],
    follows: { temperatureDelta: { degC: 'degC_delta', degF: 'degF_delta' } },
  },
];

export type UnitOverrides = Readonly<Partial<Record<Quantity, UnitId>>>;

/** The preset's units with the person's per-quantity choices (and what follows them). */
export function effectiveUnits(preset: UnitSystemId, overrides: UnitOverrides): UnitMap {
  const map: Record<Quantity, UnitId> = { ...UNIT_SYSTEMS[preset] };
  for (const c of CHOOSABLE) {
    const unit = overrides[c.quantity];
    if (unit === undefined || !c.units.includes(unit)) continue;
    map[c.quantity] = unit;
    for (const [q, byUnit] of Object.entries(c.follows ?? {})) {
      const follower = byUnit?.[unit];
      if (follower) map[q as Quantity] = follower;
    }
  }
  return map;
}

/** Only the choices that differ from the preset and name a unit offered for the quantity. */
export function cleanOverrides(preset: UnitSystemId, raw: unknown): UnitOverrides {
  if (typeof raw !== 'object' || raw === null) return {};
  const out: Partial<Record<Quantity, UnitId>> = {};
  for (const c of CHOOSABLE) {
    const u = (raw as Record<string, unknown>)[c.quantity];
    if (typeof u === 'string' && (c.units as readonly string[]).includes(u)) {
      if (u !== UNIT_SYSTEMS[preset][c.quantity]) out[c.quantity] = u as UnitId;
    }
  }
  return out;
}

/** Locales offered beside the browser's own (their marks come from Intl). */
export const NUMBER_LOCALES: readonly string[] = [
  'en-US',
  'en-GB',
  'de-DE',
  'de-CH',
  'fr-FR',
  'es-ES',
  'it-IT',
  'nl-NL',
  'pl-PL',
  'pt-BR',
  'sv-SE',
];

/** "auto" follows the browser's language; otherwise a BCP 47 tag Intl knows. */
export function cleanLocale(raw: unknown): string {
  if (typeof raw !== 'string' || raw === 'auto') return 'auto';
  try {
    return Intl.NumberFormat.supportedLocalesOf([raw]).length > 0 ? raw : 'auto';
  } catch {
    return 'auto';
  }
}

/** 18 000 ft: the transition altitude in the United States (14 CFR 91.121, from memory). */
export const DEFAULT_TRANSITION_ALTITUDE_FT = 18_000;

/** A transition altitude in feet from 1000 to 20 000 (common practice spans 3000–18 000). */
export function cleanTransitionAltitude(raw: unknown): number | null {
  const v = typeof raw === 'string' ? Number(raw) : raw;
  if (typeof v !== 'number' || !Number.isFinite(v) || v < 1000 || v > 20_000) return null;
  return v;
}
