/**
 * The aircraft sheet and the mission conditions as field lists. Which fields appear
 * follows the plan: the powerplant kind, how the induced drag is given, the lapse model.
 */
import type { JetPowerplant, Plan, Powerplant, Fuel } from '../../../core/plan/schema.ts';
import { choice, num, text, type FieldDef, type FieldSection } from './fieldTypes.ts';
import { missionWindFields } from './missionWindFields.ts';
import { setAtPath } from './paths.ts';
import { engineFields, propellerCurveFields, stallDragRiseFields } from './propellerFields.ts';

const A = 'aircraft';

export function aircraftSections(plan: Plan): FieldSection[] {
  return [
    {
      id: 'airframe',
      title: 'Airframe',
      fields: [
        text(`${A}.name`, 'Aircraft name'),
        num(`${A}.wingArea_m2`, 'Wing area', 'area', 'm2'),
        num(`${A}.ceiling_m`, 'Operating ceiling', 'altitude', 'm'),
        ...engineFields(plan),
      ],
    },
    { id: 'polar', title: 'Drag polar', fields: polarFields(plan) },
    {
      id: 'mass',
      title: 'Masses',
      fields: [
        num(`${A}.mass.empty_kg`, 'Empty mass', 'mass', 'kg', {
          hint:
            plan.aircraft.powerplant.type === 'electric'
              ? 'without payload and battery pack'
              : 'without payload and fuel',
        }),
        num(`${A}.mass.payload_kg`, 'Payload', 'mass', 'kg'),
        num(`${A}.mass.mtow_kg`, 'Maximum take-off mass (MTOW)', 'mass', 'kg'),
      ],
    },
    { id: 'powerplant', title: 'Powerplant', fields: powerplantFields(plan.aircraft.powerplant) },
  ];
}

function polarFields(plan: Plan): FieldDef[] {
  const p = `${A}.polar`;
  const induced: FieldDef[] =
    plan.aircraft.polar.induced.by === 'geometry'
      ? [
          num(`${p}.induced.e`, 'Oswald efficiency e', null, 'fraction'),
          num(`${p}.induced.AR`, 'Aspect ratio AR', null, 'fraction'),
        ]
      : [num(`${p}.induced.k`, 'Induced-drag factor k', null, 'fraction')];
  return [
    num(`${p}.CD0`, 'Zero-lift drag CD0', null, 'fraction'),
    choice(
      `${p}.induced.by`,
      'Induced drag given as',
      [
        { value: 'geometry', label: 'e and AR (k = 1/(π·e·AR))' },
        { value: 'factor', label: 'factor k' },
      ],
      (by, current) => inducedVariant(by, current),
    ),
    ...induced,
    num(`${p}.CLminD`, 'CL of minimum drag', null, 'fraction'),
    num(`${p}.CLmax`, 'CLmax (clean)', null, 'fraction'),
    num(`${p}.CLmaxFlaps`, 'CLmax with flaps', null, 'fraction', {
      optional: true,
      hint: 'optional',
    }),
    ...stallDragRiseFields(plan),
  ];
}

function inducedVariant(by: string, current: unknown): unknown {
  const c = current as { by: string; e?: number; AR?: number; k?: number };
  if (by === 'factor') {
    const k = c.e && c.AR ? 1 / (Math.PI * c.e * c.AR) : 0.05;
    return { by: 'factor', k: Number(k.toPrecision(4)) };
  }
  return {
    by: 'geometry',
    e: 0.8,
    AR: c.k ? Number((1 / (Math.PI * 0.8 * c.k)).toPrecision(4)) : 8,
  };
}

function powerplantFields(pp: Powerplant): FieldDef[] {
  const p = `${A}.powerplant`;
  const kind = choice(
    `${p}.type`,
    'Powerplant kind',
    [
      { value: 'propeller', label: 'Propeller (piston or turboprop)' },
      { value: 'jet', label: 'Jet' },
      { value: 'electric', label: 'Battery-electric' },
    ],
    (type, current) => powerplantVariant(type, current as Powerplant),
  );
  switch (pp.type) {
    case 'jet':
      return [
        kind,
        num(`${p}.maxThrustSL_N`, 'Max thrust, sea level static', 'thrust', 'N'),
        ...jetLapseFields(pp),
        num(
          `${p}.tsfc_kg_Ns`,
          pp.tsfcMachFactor === undefined ? 'TSFC' : 'TSFC c₁ (sea level, static)',
          'tsfc',
          'kg_Ns',
        ),
        num(`${p}.tsfcMachFactor`, 'TSFC Mach factor f = c₂/c₁', null, 'fraction', {
          optional: true,
          hint: 'TSFC = c₁·(1 + f·M)·√θ; empty = constant TSFC; high bypass 1.2',
        }),
        num(`${p}.idleFuelFraction`, 'Idle fuel flow (of max)', 'ratio', 'fraction'),
        ...fuelFields(`${p}.fuel`),
      ];
    case 'propeller':
      return [
        kind,
        choice(`${p}.engine`, 'Engine', [
          { value: 'piston', label: 'Piston' },
          { value: 'turboprop', label: 'Turboprop' },
        ]),
        num(`${p}.maxPowerSL_W`, 'Max shaft power, sea level', 'power', 'W'),
        choice(
          `${p}.lapse.model`,
          'Power lapse',
          [
            { value: 'gaggFerrar', label: 'Gagg–Ferrar (normally aspirated)' },
            { value: 'densityPower', label: 'σⁿ' },
          ],
          (model) => (model === 'densityPower' ? { model, exponent: 0.8 } : { model }),
        ),
        ...(pp.lapse.model === 'densityPower'
          ? [num(`${p}.lapse.exponent`, 'Lapse exponent n', null, 'fraction')]
          : []),
        num(`${p}.criticalAltitude_m`, 'Critical altitude (0 = none)', 'altitude', 'm'),
        num(`${p}.propEfficiency`, 'Propeller efficiency', 'ratio', 'fraction'),
        ...propellerCurveFields(pp),
        num(`${p}.bsfc_kg_J`, 'BSFC', 'bsfc', 'kg_J'),
        num(`${p}.idlePowerFraction`, 'Idle power (of max)', 'ratio', 'fraction'),
        ...fuelFields(`${p}.fuel`),
      ];
    case 'electric':
      return [
        kind,
        num(`${p}.maxShaftPower_W`, 'Max continuous shaft power', 'power', 'W'),
        num(`${p}.motorEfficiency`, 'Motor efficiency', 'ratio', 'fraction'),
        num(`${p}.controllerEfficiency`, 'Controller efficiency', 'ratio', 'fraction'),
        num(`${p}.propEfficiency`, 'Propeller efficiency', 'ratio', 'fraction'),
        ...propellerCurveFields(pp),
        num(`${p}.battery.energy_J`, 'Battery energy (nominal)', 'energy', 'J'),
        num(`${p}.battery.mass_kg`, 'Battery mass', 'mass', 'kg'),
        num(`${p}.battery.usableFraction`, 'Usable fraction', 'ratio', 'fraction'),
        num(`${p}.battery.peukertExponent`, 'Peukert exponent n', null, 'fraction'),
        num(`${p}.battery.ratedDischargeTime_s`, 'Rated discharge time', 'time', 's'),
      ];
  }
}

const ENGINE_CLASS_DEFAULTS: Record<string, string> = {
  highBypass: '0.49 and 3',
  lowBypass: '0 and 3.8',
  turbojet: '0.16 and 24',
};

/** Jet thrust lapse: σⁿ, or an engine class with its throttle ratio and optional coefficients. */
function jetLapseFields(pp: JetPowerplant): FieldDef[] {
  const p = `${A}.powerplant`;
  const model = {
    ...choice(`${p}.thrustLapse.engineClass`, 'Thrust lapse', [
      { value: 'density', label: 'σⁿ (density only)' },
      { value: 'highBypass', label: 'High-bypass turbofan (with Mach)' },
      { value: 'lowBypass', label: 'Low-bypass turbofan (with Mach)' },
      { value: 'turbojet', label: 'Turbojet (with Mach)' },
    ]),
    fallback: 'density',
    apply: (plan: Plan, v: string) => setAtPath(plan, p, jetLapseVariant(pp, v)),
  };
  if (pp.thrustLapse === undefined) {
    return [
      model,
      num(`${p}.thrustLapseExponent`, 'Thrust lapse exponent n (T = T₀·σⁿ)', null, 'fraction'),
    ];
  }
  const d = ENGINE_CLASS_DEFAULTS[pp.thrustLapse.engineClass] ?? '';
  return [
    model,
    num(`${p}.thrustLapse.throttleRatio`, 'Throttle ratio (θ₀ at the break)', null, 'fraction', {
      hint: '1.0–1.1 common practice',
    }),
    num(`${p}.thrustLapse.machCoefficient`, 'Lapse coefficient of √M', null, 'fraction', {
      optional: true,
      hint: `optional; class values ${d} (√M, break)`,
    }),
    num(
      `${p}.thrustLapse.breakCoefficient`,
      'Lapse coefficient above the break',
      null,
      'fraction',
      {
        optional: true,
        hint: 'optional',
      },
    ),
  ];
}

/** The jet with another lapse model, keeping what still applies. */
function jetLapseVariant(pp: JetPowerplant, v: string): JetPowerplant {
  const { thrustLapse, ...rest } = pp;
  if (v === 'density') return { ...rest, thrustLapseExponent: pp.thrustLapseExponent ?? 0.8 };
  const engineClass = v as NonNullable<JetPowerplant['thrustLapse']>['engineClass'];
  return {
    ...rest,
    thrustLapse: { engineClass, throttleRatio: thrustLapse?.throttleRatio ?? 1.05 },
  };
}

function fuelFields(p: string): FieldDef[] {
  return [
    choice(`${p}.kind`, 'Fuel', [
      { value: 'avgas', label: 'Avgas' },
      { value: 'mogas', label: 'Mogas' },
      { value: 'jetA', label: 'Jet A' },
      { value: 'jetA1', label: 'Jet A-1' },
      { value: 'diesel', label: 'Diesel' },
    ]),
    num(`${p}.density_kg_L`, 'Fuel density (override)', 'fuelDensity', 'kg_L', {
      optional: true,
      hint: 'optional',
    }),
    num(`${p}.load_kg`, 'Fuel load', 'fuelMass', 'kg'),
    num(`${p}.tankCapacity_L`, 'Usable tank capacity', 'fuelVolume', 'L'),
  ];
}

const DEFAULT_FUEL: Fuel = { kind: 'avgas', load_kg: 100, tankCapacity_L: 200 };

/** A powerplant of another kind, keeping the fuel load where the new kind burns fuel too. */
export function powerplantVariant(type: string, current: Powerplant): Powerplant {
  const fuel = current.type === 'electric' ? DEFAULT_FUEL : current.fuel;
  if (type === 'jet') {
    return {
      type: 'jet',
      maxThrustSL_N: 5000,
      thrustLapseExponent: 0.8,
      tsfc_kg_Ns: 2.5e-5,
      idleFuelFraction: 0.1,
      fuel: { ...fuel, kind: 'jetA1' },
    };
  }
  if (type === 'electric') {
    return {
      type: 'electric',
      maxShaftPower_W: 2000,
      motorEfficiency: 0.9,
      controllerEfficiency: 0.95,
      propEfficiency: 0.75,
      battery: {
        energy_J: 3.6e6,
        mass_kg: 5,
        usableFraction: 0.9,
        peukertExponent: 1.05,
        ratedDischargeTime_s: 3600,
      },
    };
  }
  return {
    type: 'propeller',
    engine: 'piston',
    maxPowerSL_W: 75_000,
    lapse: { model: 'gaggFerrar' },
    criticalAltitude_m: 0,
    propEfficiency: 0.8,
    bsfc_kg_J: 8.5e-8,
    idlePowerFraction: 0.1,
    fuel: { ...fuel, kind: fuel.kind === 'jetA' || fuel.kind === 'jetA1' ? 'avgas' : fuel.kind },
  };
}

export function missionSections(plan: Plan): FieldSection[] {
  const electric = plan.aircraft.powerplant.type === 'electric';
  return [
    {
      id: 'environment',
      title: 'Conditions',
      fields: [
        num('environment.isaOffset_K', 'ISA deviation', 'temperatureDelta', 'K_delta'),
        num('environment.qnh_Pa', 'QNH', 'pressure', 'Pa'),
        num('environment.departureElevation_m', 'Departure elevation', 'altitude', 'm', {
          datum: 'msl',
        }),
        num('environment.arrivalElevation_m', 'Arrival elevation', 'altitude', 'm', {
          datum: 'msl',
        }),
      ],
    },
    { id: 'missionWind', title: 'Mission wind', fields: missionWindFields(plan) },
    {
      id: 'reserves',
      title: 'Reserve policy',
      fields: [
        num('reserves.holdTime_s', 'Final reserve hold', 'time', 's'),
        num('reserves.holdAltitude_m', 'Hold altitude', 'altitude', 'm', { datum: 'msl' }),
        num('reserves.contingencyFraction', 'Contingency (of trip)', 'ratio', 'fraction'),
        num('reserves.alternateDistance_m', 'Alternate distance', 'distance', 'm'),
        num('reserves.alternateAltitude_m', 'Alternate altitude', 'altitude', 'm', {
          datum: 'msl',
        }),
        ...(electric
          ? [num('reserves.socFloor', 'Battery floor (state of charge)', 'ratio', 'fraction')]
          : []),
      ],
    },
    {
      id: 'settings',
      title: 'Margins',
      fields: [
        num('settings.stallFactor', 'Minimum speed / stall speed', null, 'fraction'),
        num('settings.tightMargin', 'Report as tight below margin', 'ratio', 'fraction'),
        num('settings.minClimbRate_m_s', 'Climb rate defining the ceiling', 'verticalSpeed', 'm_s'),
      ],
    },
  ];
}
