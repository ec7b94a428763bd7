/** The aircraft and conditions summary of the printed report, as label–value pairs. */
import { DEFAULT_MIN_HEIGHT_ABOVE_FIELD_M, type Plan } from '../../../core/plan/schema.ts';
import type { PlanResult } from '../../../core/solver/types.ts';
import type { Quantity } from '../../../core/units.ts';
import { formatSignificant } from '../../../core/format.ts';

interface Fmt {
  format(value_si: number, quantity: Quantity): string;
}

export interface SummaryItem {
  label: string;
  value: string;
}

const pct = (fraction: number) => `${formatSignificant(fraction * 100, 3)} %`;

export function aircraftSummary(plan: Plan, result: PlanResult | null, u: Fmt): SummaryItem[] {
  const a = plan.aircraft;
  const pp = a.powerplant;
  const polar = a.polar;
  const induced =
    polar.induced.by === 'geometry'
      ? `e ${formatSignificant(polar.induced.e, 3)}, AR ${formatSignificant(polar.induced.AR, 3)}`
      : `k ${formatSignificant(polar.induced.k, 3)}`;
  const items: SummaryItem[] = [
    { label: 'Aircraft', value: a.name },
    { label: 'Wing area', value: u.format(a.wingArea_m2, 'area') },
    {
      label: 'Drag polar',
      value: `CD0 ${formatSignificant(polar.CD0, 3)}, ${induced}, CL min. drag ${formatSignificant(polar.CLminD, 2)}, CLmax ${formatSignificant(polar.CLmax, 3)}`,
    },
    {
      label: 'Masses',
      value: `empty ${u.format(a.mass.empty_kg, 'mass')}, payload ${u.format(a.mass.payload_kg, 'mass')}, MTOW ${u.format(a.mass.mtow_kg, 'mass')}`,
    },
  ];
  if (pp.type === 'electric') {
    items.push({
      label: 'Powerplant',
      value: `electric, ${u.format(pp.maxShaftPower_W, 'power')}; battery ${u.format(pp.battery.energy_J, 'energy')}, ${u.format(pp.battery.mass_kg, 'mass')}, ${pct(pp.battery.usableFraction)} usable`,
    });
  } else {
    const engine =
      pp.type === 'jet'
        ? `jet, ${u.format(pp.maxThrustSL_N, 'thrust')} sea-level thrust, TSFC ${u.format(pp.tsfc_kg_Ns, 'tsfc')}`
        : `${pp.engine}, ${u.format(pp.maxPowerSL_W, 'power')}, BSFC ${u.format(pp.bsfc_kg_J, 'bsfc')}, propeller ${pct(pp.propEfficiency)}`;
    items.push({ label: 'Powerplant', value: engine });
    items.push({
      label: 'Fuel',
      value: `${pp.fuel.kind}, ${u.format(pp.fuel.load_kg, 'fuelMass')} on board, tank ${u.format(pp.fuel.tankCapacity_L / 1000, 'fuelVolume')}`,
    });
  }
  if (result)
    items.push({ label: 'Take-off mass', value: u.format(result.takeoffMass_kg, 'mass') });
  const env = plan.environment;
  items.push({
    label: 'Conditions',
    value: `ISA ${u.format(env.isaOffset_K, 'temperatureDelta')}, QNH ${u.format(env.qnh_Pa, 'pressure')}, departure ${u.format(env.departureElevation_m, 'altitude')}, arrival ${u.format(env.arrivalElevation_m, 'altitude')}`,
  });
  const r = plan.reserves;
  items.push({
    label: 'Reserve policy',
    value: `final reserve ${u.format(r.holdTime_s, 'time')} at ${r.finalReserveSpeed === 'bestEndurance' ? 'best endurance' : 'normal cruise'}, ${r.finalReserveLevel === 'lastCruise' ? 'at the last cruise altitude' : `at ${u.format(r.holdAltitude_m, 'altitude')}`} (at least ${u.format(r.minHeightAboveField_m ?? DEFAULT_MIN_HEIGHT_ABOVE_FIELD_M, 'altitude')} above the arrival field), contingency ${pct(r.contingencyFraction)}, alternate ${u.format(r.alternateDistance_m, 'distance')}${pp.type === 'electric' ? `, battery floor ${pct(r.socFloor)}` : ''}`,
  });
  return items;
}
