/**
 * Aircraft-sheet fields of the propeller efficiency curve (core/propulsion/propellerCurve.ts),
 * the polar's stall drag rise (core/polar.ts) and the engine count with its one-engine-out
 * drag (core/solver/oneEngineOut.ts). Optional blocks are switched on and off by a choice.
 */
import type { ElectricPowerplant, Plan, PropellerPowerplant } from '../../../core/plan/schema.ts';
import { choice, num, type FieldDef } from './fieldTypes.ts';
import { setAtPath } from './paths.ts';

const PP = 'aircraft.powerplant';

/** Efficiency with airspeed: constant, momentum theory (editable) or a table (from the file). */
export function propellerCurveFields(pp: PropellerPowerplant | ElectricPowerplant): FieldDef[] {
  const options = [
    { value: 'constant', label: 'Constant at every speed' },
    { value: 'momentum', label: 'Momentum theory (from diameter)' },
    ...(pp.propeller?.model === 'table'
      ? [{ value: 'table', label: 'Table from the plan file' }]
      : []),
  ];
  const model = {
    ...choice(`${PP}.propeller.model`, 'Propeller efficiency with speed', options),
    fallback: 'constant',
    apply: (plan: Plan, v: string) => setAtPath(plan, PP, propellerVariant(pp, v)),
  };
  if (pp.propeller?.model !== 'momentum') return [model];
  const p = `${PP}.propeller`;
  return [
    model,
    num(`${p}.diameter_m`, 'Propeller diameter', 'shortDistance', 'm', {
      hint: 'one propeller; take-off uses the same propeller',
    }),
    num(`${p}.cruiseAltitude_m`, 'Cruise point: pressure altitude', 'altitude', 'm'),
    num(`${p}.cruisePowerFraction`, 'Cruise point: power (of max)', 'ratio', 'fraction'),
    num(`${p}.cruiseSpeed_m_s`, 'Cruise point: true airspeed', 'airspeed', 'm_s', {
      optional: true,
      hint: 'empty = level speed at MTOW with that power; the efficiency above holds here',
    }),
  ];
}

function propellerVariant<T extends PropellerPowerplant | ElectricPowerplant>(pp: T, v: string): T {
  const { propeller, ...rest } = pp;
  if (v === 'constant') return rest as T;
  if (v === 'table' && propeller?.model === 'table') return pp;
  return {
    ...rest,
    propeller: {
      model: 'momentum',
      diameter_m: pp.type === 'electric' ? 0.4 : 1.8,
      cruiseAltitude_m: 1500,
      cruisePowerFraction: 0.75,
    },
  } as T;
}

/** The stall drag rise of the polar: none, or onset CL and the rise at CLmax. */
export function stallDragRiseFields(plan: Plan): FieldDef[] {
  const p = 'aircraft.polar';
  const polar = plan.aircraft.polar;
  const model = {
    ...choice(`${p}.stallDragRise.kind`, 'Drag near the stall', [
      { value: 'parabola', label: 'Parabola up to CLmax' },
      { value: 'rise', label: 'Drag rise approaching CLmax' },
    ]),
    fallback: polar.stallDragRise === undefined ? 'parabola' : 'rise',
    apply: (pl: Plan, v: string) => {
      const { stallDragRise: _r, ...rest } = pl.aircraft.polar;
      const next =
        v === 'rise'
          ? {
              ...rest,
              stallDragRise: {
                onsetCL: Number((0.8 * rest.CLmax).toPrecision(3)),
                atCLmax: rest.CD0,
              },
            }
          : rest;
      return setAtPath(pl, p, next);
    },
  };
  if (polar.stallDragRise === undefined) return [model];
  return [
    model,
    num(`${p}.stallDragRise.onsetCL`, 'Drag rise from CL', null, 'fraction', {
      hint: 'below CLmax',
    }),
    num(`${p}.stallDragRise.atCLmax`, 'Extra drag coefficient at CLmax', null, 'fraction'),
  ];
}

/** Engine count and, for a multi-engine aircraft, the one-engine-out drag increment. */
export function engineFields(plan: Plan): FieldDef[] {
  const fields: FieldDef[] = [
    num('aircraft.engineCount', 'Number of engines', null, 'fraction', {
      optional: true,
      hint: 'empty = 1; totals above are for all engines',
    }),
  ];
  if ((plan.aircraft.engineCount ?? 1) >= 2) {
    fields.push(
      num('aircraft.oeiDragIncrement', 'Extra drag coefficient, one engine out', null, 'fraction', {
        optional: true,
        hint: 'empty = 0.003 (feathered propeller and trim, from memory)',
      }),
    );
  }
  return fields;
}
