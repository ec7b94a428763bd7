/**
 * Go/no-go at the airfield as field lists: the departure (runway, launch or no check), the
 * arrival (runway or no check), the safety factors, and the aircraft's field data. The
 * factors' hints are common practice (take-off distance × 1.15, landing distance × 1.43 =
 * 1/0.7, launch speed ≥ 1.15 × stall speed); the checks themselves are the solver's
 * (core/solver/fieldChecks.ts).
 */
import type { Airfield, Plan, Runway } from '../../../core/plan/schema.ts';
import { SURFACES, type SurfaceId } from '../../../core/field/surfaces.ts';
import { DEFAULT_CL_GROUND } from '../../../core/field/groundRun.ts';
import { choice, num, type FieldDef, type FieldSection } from './fieldTypes.ts';
import { setAtPath } from './paths.ts';

/** Common-practice factors (see the schema comments in core/plan/schema.ts). */
export const FIELD_FACTORS = { takeoffFactor: 1.15, landingFactor: 1.43, launchFactor: 1.15 };

export const DEFAULT_RUNWAY = {
  by: 'runway',
  available_m: 800,
  surface: 'dryHard',
  slope: 0,
  heading_deg: 360,
  surfaceWind: { speed_m_s: 0, from_deg: 360 },
} as const satisfies Airfield['departure'];

export const DEFAULT_LAUNCH = {
  by: 'launch',
  releaseSpeed_m_s: 15,
  headwind_m_s: 0,
} as const satisfies Airfield['departure'];

type End = 'departure' | 'arrival';

function endValue(by: string, end: End): Airfield['departure'] {
  if (by === 'runway') return structuredClone(DEFAULT_RUNWAY) as Airfield['departure'];
  if (by === 'launch' && end === 'departure')
    return structuredClone(DEFAULT_LAUNCH) as Airfield['departure'];
  return { by: 'none' };
}

/**
 * The plan with a new kind of check at one end. The airfield block appears with the first
 * check and goes when neither end is checked any more.
 */
export function withAirfieldEnd(plan: Plan, end: End, by: string): Plan {
  const current: Airfield = plan.airfield ?? {
    departure: { by: 'none' },
    arrival: { by: 'none' },
    ...FIELD_FACTORS,
  };
  const next = { ...current, [end]: endValue(by, end) } as Airfield;
  if (next.departure.by === 'none' && next.arrival.by === 'none') {
    const { airfield: _dropped, ...rest } = plan;
    return rest;
  }
  return { ...plan, airfield: next };
}

const SURFACE_OPTIONS = (Object.keys(SURFACES) as SurfaceId[]).map((id) => ({
  value: id,
  label: SURFACES[id].label,
}));

/**
 * With a mission wind the field wind follows it unless set to its own (the absent source
 * means 'mission', core/solver/missionWind.ts); the own-wind boxes show only when used.
 */
function followsMission(plan: Plan, path: string, label: string, own: string | undefined) {
  if (plan.environment.missionWind === undefined) return { fields: [], own: true };
  const pick: FieldDef = {
    ...choice(path, label, [
      { value: 'mission', label: 'Mission wind' },
      { value: 'own', label: 'Own value' },
    ]),
    fallback: 'mission',
    apply: (pl: Plan, v: string) => setAtPath(pl, path, v === 'mission' ? undefined : v),
  };
  return { fields: [pick], own: own === 'own' };
}

function runwayFields(plan: Plan, p: string, end: Runway | undefined): FieldDef[] {
  const wind = followsMission(
    plan,
    `${p}.surfaceWindSource`,
    'Surface wind',
    end?.surfaceWindSource,
  );
  return [
    num(`${p}.available_m`, 'Runway available', 'shortDistance', 'm'),
    choice(`${p}.surface`, 'Surface', SURFACE_OPTIONS),
    num(`${p}.slope`, 'Slope (+ uphill)', 'ratio', 'fraction'),
    num(`${p}.heading_deg`, 'Runway direction', 'angle', 'deg'),
    ...wind.fields,
    ...(wind.own
      ? [
          num(`${p}.surfaceWind.speed_m_s`, 'Surface wind speed', 'windSpeed', 'm_s'),
          num(`${p}.surfaceWind.from_deg`, 'Surface wind from', 'angle', 'deg', {
            hint: 'same north as the runway direction',
          }),
        ]
      : []),
    num(`${p}.temperature_K`, 'Outside air temperature', 'temperature', 'K', {
      optional: true,
      hint: 'empty: ISA with the plan’s deviation',
    }),
  ];
}

function endFields(plan: Plan, end: End): FieldDef[] {
  const p = `airfield.${end}`;
  const options =
    end === 'departure'
      ? [
          { value: 'none', label: 'No check' },
          { value: 'runway', label: 'Runway' },
          { value: 'launch', label: 'Hand or catapult' },
        ]
      : [
          { value: 'none', label: 'No check' },
          { value: 'runway', label: 'Runway' },
        ];
  const pick = {
    ...choice(`${p}.by`, 'Check', options),
    fallback: 'none',
    apply: (pl: Plan, by: string) => withAirfieldEnd(pl, end, by),
  };
  const value = plan.airfield?.[end];
  const kind = value?.by ?? 'none';
  if (kind === 'runway') return [pick, ...runwayFields(plan, p, value as Runway)];
  if (kind === 'launch') {
    const source = value?.by === 'launch' ? value.headwindSource : undefined;
    const wind = followsMission(plan, `${p}.headwindSource`, 'Launch headwind', source);
    return [
      pick,
      num(`${p}.releaseSpeed_m_s`, 'Release ground speed', 'airspeed', 'm_s'),
      ...wind.fields,
      ...(wind.own ? [num(`${p}.headwind_m_s`, 'Headwind at launch', 'windSpeed', 'm_s')] : []),
      num(`${p}.catapultStroke_m`, 'Catapult stroke', 'shortDistance', 'm', {
        optional: true,
        hint: 'optional',
      }),
    ];
  }
  return [pick];
}

/** Departure, arrival and the factors (the factors only while some end is checked). */
export function airfieldSections(plan: Plan): FieldSection[] {
  const a = plan.airfield;
  const factors: FieldDef[] = [];
  if (a?.departure.by === 'runway')
    factors.push(
      num('airfield.takeoffFactor', 'Take-off distance factor', null, 'fraction', {
        hint: 'common practice 1.15',
      }),
    );
  if (a?.departure.by === 'launch')
    factors.push(
      num('airfield.launchFactor', 'Release speed / stall speed at least', null, 'fraction', {
        hint: 'common practice 1.15',
      }),
    );
  if (a?.arrival.by === 'runway')
    factors.push(
      num('airfield.landingFactor', 'Landing distance factor', null, 'fraction', {
        hint: 'common practice 1.43 (= 1/0.7)',
      }),
    );
  const sections: FieldSection[] = [
    { id: 'departure', title: 'Departure', fields: endFields(plan, 'departure') },
    { id: 'arrival', title: 'Arrival', fields: endFields(plan, 'arrival') },
  ];
  if (factors.length) sections.push({ id: 'factors', title: 'Safety factors', fields: factors });
  return sections;
}

/** The aircraft's data for take-off and landing distances (block created on first edit). */
export function fieldDataSection(plan: Plan): FieldSection {
  const block = {
    path: 'aircraft.field',
    create: () => ({ CLground: DEFAULT_CL_GROUND }),
  };
  const fields: FieldDef[] = [
    num('aircraft.field.CLground', 'CL during the ground run', null, 'fraction', {
      block,
      hint: `common practice ${DEFAULT_CL_GROUND}`,
    }),
  ];
  if (plan.aircraft.powerplant.type !== 'jet')
    fields.push(
      num('aircraft.field.propDiameter_m', 'Propeller diameter', 'shortDistance', 'm', {
        block,
        optional: true,
        hint: 'needed for the take-off check (static thrust)',
      }),
    );
  return { id: 'ground', title: 'Aircraft on the ground', fields };
}
