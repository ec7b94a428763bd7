/**
 * The leg table as CSV (RFC 4180: comma-separated, CRLF line ends, fields with commas,
 * quotes or line breaks in double quotes) in the chosen unit system, units in the header.
 * Text cells that a spreadsheet would run as a formula get a leading apostrophe (OWASP
 * "CSV injection" advice).
 */
import type { Plan } from '../../../core/plan/schema.ts';
import type { LegResult, PlanResult } from '../../../core/solver/types.ts';
import { displayValue, formatSignificant } from '../../../core/format.ts';
import { UNITS, unitMap, type Quantity, type UnitSystem } from '../../../core/units.ts';
import { legTitle } from './legLabels.ts';

export function csvCell(value: string | number): string {
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  const text = /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function csvLine(cells: readonly (string | number)[]): string {
  return cells.map(csvCell).join(',');
}

interface Column {
  title: string;
  quantity: Quantity | null;
  leg: (leg: LegResult, index: number) => string | number;
  total?: (result: PlanResult) => string | number;
}

function columns(plan: Plan, result: PlanResult, system: UnitSystem): Column[] {
  const v = (x: number, q: Quantity) => displayValue(x, q, system);
  const battery = result.consumable === 'battery';
  const used: Column = battery
    ? {
        title: 'Energy used',
        quantity: 'energy',
        leg: (l) => v(l.energyUsed_J, 'energy'),
        total: (r) => v(r.totals.energyUsed_J, 'energy'),
      }
    : {
        title: 'Fuel used',
        quantity: 'fuelMass',
        leg: (l) => v(l.fuelUsed_kg, 'fuelMass'),
        total: (r) => v(r.totals.fuelUsed_kg, 'fuelMass'),
      };
  const left: Column = battery
    ? {
        title: 'Energy left',
        quantity: 'energy',
        leg: (l) => v(l.end.energy_J, 'energy'),
        total: (r) => v(r.landing.remaining, 'energy'),
      }
    : {
        title: 'Fuel left',
        quantity: 'fuelMass',
        leg: (l) => v(l.end.fuel_kg, 'fuelMass'),
        total: (r) => v(r.landing.remaining, 'fuelMass'),
      };
  const flown = (l: LegResult) => l.status !== 'notReached';
  const coef = (l: LegResult, x: number) =>
    flown(l) && l.CL.max > 0 ? formatSignificant(x, 3) : '';
  return [
    { title: 'Leg', quantity: null, leg: (_l, i) => i + 1, total: () => 'Total' },
    { title: 'Kind', quantity: null, leg: (l) => l.kind },
    {
      title: 'Label',
      quantity: null,
      leg: (l, i) => legTitle(plan.legs[i] ?? { kind: l.kind, label: l.label }, i),
    },
    { title: 'Status', quantity: null, leg: (l) => l.status, total: (r) => r.verdict },
    {
      title: 'Time',
      quantity: 'time',
      leg: (l) => v(l.time_s, 'time'),
      total: (r) => v(r.totals.time_s, 'time'),
    },
    {
      title: 'Ground distance',
      quantity: 'distance',
      leg: (l) => v(l.groundDistance_m, 'distance'),
      total: (r) => v(r.totals.groundDistance_m, 'distance'),
    },
    {
      title: 'Air distance',
      quantity: 'distance',
      leg: (l) => v(l.airDistance_m, 'distance'),
      total: (r) => v(r.totals.airDistance_m, 'distance'),
    },
    used,
    left,
    { title: 'End altitude', quantity: 'altitude', leg: (l) => v(l.end.h_m, 'altitude') },
    {
      title: 'Mean TAS',
      quantity: 'airspeed',
      leg: (l) => (l.meanTas_m_s > 0 ? v(l.meanTas_m_s, 'airspeed') : ''),
    },
    {
      title: 'Mean GS',
      quantity: 'groundSpeed',
      leg: (l) => (l.meanGroundSpeed_m_s > 0 ? v(l.meanGroundSpeed_m_s, 'groundSpeed') : ''),
    },
    { title: 'CL min', quantity: null, leg: (l) => coef(l, l.CL.min) },
    { title: 'CL max', quantity: null, leg: (l) => coef(l, l.CL.max) },
    { title: 'L/D min', quantity: null, leg: (l) => coef(l, l.LD.min) },
    { title: 'L/D max', quantity: null, leg: (l) => coef(l, l.LD.max) },
    { title: 'Error', quantity: null, leg: (l) => l.error ?? '' },
  ];
}

/** CSV text of the leg table with a totals row, values in `system`'s display units. */
export function buildLegCsv(plan: Plan, result: PlanResult, system: UnitSystem): string {
  const cols = columns(plan, result, system);
  const header = cols.map((c) => {
    const label = c.quantity ? UNITS[unitMap(system)[c.quantity]].label : '';
    return label ? `${c.title} (${label})` : c.title;
  });
  const rows = result.legs.map((leg, i) => cols.map((c) => c.leg(leg, i)));
  const totals = cols.map((c) => (c.total ? c.total(result) : ''));
  return [header, ...rows, totals].map(csvLine).join('\r\n') + '\r\n';
}

/** A file name from the plan name: letters, digits, dashes; never empty. */
export function fileStem(name: string): string {
  const stem = name
    .normalize('NFKD')
    .replace(/[^\w\s-]/g, '')
    .trim()
    .replace(/[\s_]+/g, '-')
    .slice(0, 60)
    .replace(/-+$/, '');
  return stem || 'plan';
}
