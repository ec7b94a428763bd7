/**
 * The fields of one leg, by kind. Discriminators (how the leg ends, how its speed is
 * chosen, how the allowance is given) are choices that rebuild their sub-object.
 */
import type { Leg, LegKind, Plan, WaypointData } from '../../../core/plan/schema.ts';
import { choice, num, text, type ChoiceOption, type FieldDef } from './fieldTypes.ts';
import { setAtPath } from './paths.ts';

export const LEG_KIND_NAMES: Readonly<Record<LegKind, string>> = {
  takeoff: 'Take-off',
  climb: 'Climb',
  cruise: 'Cruise',
  loiter: 'Loiter',
  descent: 'Descent',
  landing: 'Landing',
};

export const LEG_KINDS: readonly LegKind[] = [
  'takeoff',
  'climb',
  'cruise',
  'loiter',
  'descent',
  'landing',
];

const FIXED_SPEEDS: ChoiceOption[] = [
  { value: 'tas', label: 'True airspeed (TAS)' },
  { value: 'eas', label: 'Equivalent airspeed (EAS)' },
  { value: 'cas', label: 'Calibrated airspeed (CAS)' },
  { value: 'mach', label: 'Mach number' },
];

/** A speed object of another kind, carrying the airspeed over between TAS/EAS/CAS. */
export function speedVariant(kind: string, current: unknown): unknown {
  const c = (current ?? {}) as { speed_m_s?: number; mach?: number };
  if (kind === 'tas' || kind === 'eas' || kind === 'cas') {
    const speed = c.speed_m_s ?? (c.mach !== undefined ? c.mach * 340 : 50);
    return { kind, speed_m_s: Number(speed.toPrecision(6)) };
  }
  if (kind === 'mach') {
    const mach = c.speed_m_s !== undefined ? Math.min(0.9, c.speed_m_s / 340) : 0.3;
    return { kind, mach: Number(mach.toPrecision(3)) };
  }
  return { kind };
}

function speedFields(
  base: string,
  optimum: ChoiceOption | null,
  speed: { kind: string },
): FieldDef[] {
  const options = optimum ? [optimum, ...FIXED_SPEEDS] : FIXED_SPEEDS;
  const fields: FieldDef[] = [choice(`${base}.kind`, 'Airspeed', options, speedVariant)];
  if (speed.kind === 'mach') fields.push(num(`${base}.mach`, 'Mach', null, 'fraction'));
  else if (speed.kind === 'tas' || speed.kind === 'eas' || speed.kind === 'cas') {
    fields.push(num(`${base}.speed_m_s`, `${speed.kind.toUpperCase()}`, 'airspeed', 'm_s'));
  }
  return fields;
}

type Track = { windSource?: 'leg' | 'aloft' | 'mission'; toWaypoint?: string };

/** A choice whose default value is stored as an absent key (the plan file stays lean). */
function optionalChoice(
  path: string,
  label: string,
  options: ChoiceOption[],
  absent: string,
): FieldDef {
  return {
    ...choice(path, label, options),
    fallback: absent,
    apply: (plan: Plan, v: string) => setAtPath(plan, path, v === absent ? undefined : v),
  };
}

function targetField(p: string, waypoints: readonly WaypointData[]): FieldDef[] {
  if (waypoints.length === 0) return [];
  const options = [
    { value: '', label: '— none, own track —' },
    ...waypoints.map((w, i) => ({ value: w.id, label: `${i + 1}. ${w.name.trim() || w.id}` })),
  ];
  return [optionalChoice(`${p}.toWaypoint`, 'Flies to waypoint', options, '')];
}

/**
 * Course and wind. With a mission wind (environment.missionWind) a leg follows it unless it
 * overrides it: the absent windSource then means 'mission' (core/solver/missionWind.ts).
 */
function trackFields(
  p: string,
  leg: Track,
  waypoints: readonly WaypointData[],
  missionWind: boolean,
): FieldDef[] {
  const fields: FieldDef[] = [...targetField(p, waypoints)];
  if (!leg.toWaypoint) fields.push(num(`${p}.course_deg`, 'Track (° true)', 'angle', 'deg'));
  const absent = missionWind ? 'mission' : 'leg';
  const options: ChoiceOption[] = [
    { value: 'leg', label: 'Own wind for this leg' },
    { value: 'aloft', label: 'Winds-aloft table' },
  ];
  if (missionWind || leg.windSource === 'mission') {
    options.unshift({ value: 'mission', label: 'Mission wind' });
  }
  fields.push(optionalChoice(`${p}.windSource`, 'Wind', options, absent));
  const source = leg.windSource ?? absent;
  if (source === 'leg')
    fields.push(
      num(`${p}.wind.speed_m_s`, 'Wind speed', 'windSpeed', 'm_s'),
      num(`${p}.wind.from_deg`, 'Wind from (° true)', 'angle', 'deg'),
    );
  return fields;
}

const ALLOWANCE_DEFAULTS: Record<string, unknown> = {
  fuel: { by: 'fuel', fuel_kg: 2 },
  energy: { by: 'energy', energy_J: 36_000 },
  massFraction: { by: 'massFraction', fraction: 0.005 },
  time: { by: 'time', time_s: 120 },
};

function allowanceFields(p: string, by: string, electric: boolean): FieldDef[] {
  const value: Record<string, FieldDef> = {
    fuel: num(`${p}.allowance.fuel_kg`, 'Fuel allowance', 'fuelMass', 'kg'),
    energy: num(`${p}.allowance.energy_J`, 'Energy allowance', 'energy', 'J'),
    massFraction: num(`${p}.allowance.fraction`, 'Mass fraction used', 'ratio', 'fraction'),
    time: num(`${p}.allowance.time_s`, 'Time at full power', 'time', 's'),
  };
  return [
    choice(
      `${p}.allowance.by`,
      'Allowance given as',
      [
        electric
          ? { value: 'energy', label: 'Battery energy' }
          : { value: 'fuel', label: 'Fuel mass' },
        { value: 'massFraction', label: 'Fraction of mass' },
        { value: 'time', label: 'Time at full power' },
      ],
      (by) => ALLOWANCE_DEFAULTS[by],
    ),
    ...(value[by] ? [value[by]] : []),
  ];
}

/**
 * Every editable field of leg `index`, with absolute plan paths. Options that the plan
 * check refuses for the powerplant (fuel for a battery, energy for a fuel burner) are left out.
 */
export function legFields(
  leg: Leg,
  index: number,
  electric = false,
  waypoints: readonly WaypointData[] = [],
  routeDistance = false,
  missionWind = false,
): FieldDef[] {
  const p = `legs.${index}`;
  const label = text(`${p}.label`, 'Label');
  switch (leg.kind) {
    case 'takeoff':
    case 'landing':
      return [label, ...allowanceFields(p, leg.allowance.by, electric)];
    case 'climb':
      return [
        label,
        num(`${p}.toAltitude_m`, 'Climb to altitude', 'altitude', 'm', { datum: 'launch' }),
        ...speedFields(`${p}.speed`, { value: 'bestRate', label: 'Best rate of climb' }, leg.speed),
        num(`${p}.throttle`, 'Throttle (of max)', 'ratio', 'fraction'),
        ...trackFields(p, leg, waypoints, missionWind),
      ];
    case 'cruise':
      return [
        label,
        choice(
          `${p}.end.by`,
          'Cruise ends after',
          [
            { value: 'distance', label: 'a ground distance' },
            electric
              ? { value: 'energy', label: 'a battery energy used' }
              : { value: 'fuel', label: 'a fuel mass burnt' },
          ],
          (by) =>
            by === 'fuel'
              ? { by, fuel_kg: 20 }
              : by === 'energy'
                ? { by, energy_J: 1e6 }
                : { by: 'distance', distance_m: 100_000 },
        ),
        // The cruise that flies the rest of a route leg takes its distance from the route.
        ...(leg.end.by === 'distance'
          ? routeDistance
            ? []
            : [num(`${p}.end.distance_m`, 'Ground distance', 'distance', 'm')]
          : leg.end.by === 'fuel'
            ? [num(`${p}.end.fuel_kg`, 'Fuel to burn', 'fuelMass', 'kg')]
            : [num(`${p}.end.energy_J`, 'Energy to use', 'energy', 'J')]),
        ...speedFields(
          `${p}.speed`,
          { value: 'bestRange', label: 'Best range in the wind' },
          leg.speed,
        ),
        choice(`${p}.program`, 'Altitude program', [
          { value: 'constantAltitude', label: 'Constant altitude' },
          { value: 'cruiseClimb', label: 'Cruise-climb (constant CL)' },
        ]),
        ...trackFields(p, leg, waypoints, missionWind),
      ];
    case 'loiter':
      return [
        label,
        choice(
          `${p}.end.by`,
          'Loiter ends after',
          [
            { value: 'time', label: 'a time' },
            { value: 'reserve', label: 'all but the reserve is used' },
          ],
          (by) => (by === 'time' ? { by, time_s: 1800 } : { by: 'reserve' }),
        ),
        ...(leg.end.by === 'time' ? [num(`${p}.end.time_s`, 'Loiter time', 'time', 's')] : []),
        ...speedFields(
          `${p}.speed`,
          { value: 'bestEndurance', label: 'Best endurance' },
          leg.speed,
        ),
        ...trackFields(p, leg, waypoints, missionWind),
      ];
    case 'descent':
      return [
        label,
        num(`${p}.toAltitude_m`, 'Descend to altitude', 'altitude', 'm', { datum: 'launch' }),
        choice(
          `${p}.mode.by`,
          'Descent',
          [
            { value: 'rate', label: 'At a rate and speed' },
            { value: 'glide', label: 'Glide at idle, best L/D' },
          ],
          (by) =>
            by === 'rate'
              ? { by, rate_m_s: 2.5, speed: { kind: 'tas', speed_m_s: 50 } }
              : { by: 'glide' },
        ),
        ...(leg.mode.by === 'rate'
          ? [
              num(`${p}.mode.rate_m_s`, 'Descent rate', 'verticalSpeed', 'm_s'),
              ...speedFields(`${p}.mode.speed`, null, leg.mode.speed),
            ]
          : []),
        ...trackFields(p, leg, waypoints, missionWind),
      ];
  }
}

/**
 * Legs made fit for a new powerplant: a battery burns no fuel and a fuel burner has no
 * pack energy, so allowances and cruise ends given in the other consumable are replaced.
 */
export function adaptLegs(legs: readonly Leg[], electric: boolean): Leg[] {
  const wrong = electric ? 'fuel' : 'energy';
  return legs.map((leg) => {
    if ((leg.kind === 'takeoff' || leg.kind === 'landing') && leg.allowance.by === wrong) {
      return { ...leg, allowance: { by: 'time', time_s: 60 } };
    }
    if (leg.kind === 'cruise' && leg.end.by === wrong)
      return { ...leg, end: { by: 'distance', distance_m: 100_000 } };
    return leg;
  });
}
