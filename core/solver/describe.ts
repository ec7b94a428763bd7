/**
 * A check's sentence in the reader's units: the same words as `Check.detail` (which stays in
 * SI), with every amount through core/format.ts `formatQuantity`, rounded to the display
 * resolution of its quantity ("needs 75.8 hp of thrust power, 107 hp available"). Ratios
 * (speed over stall speed) stay plain numbers; fractions of charge show as percent.
 */
import { DEFAULT_SCREEN_HEIGHT_M } from '../field/takeoff.ts';
import { formatQuantity, formatSignificant } from '../format.ts';
import type { Quantity, UnitSystemId } from '../units.ts';
import type { Check } from './types.ts';

/** The display quantity of a check's value and limit (null: a plain ratio). */
export function checkDisplayQuantity(check: Check): Quantity | null {
  switch (check.quantity) {
    case 'volume':
      return 'fuelVolume';
    // Runway lengths: metres or feet, not kilometres or nautical miles.
    case 'distance':
      return 'shortDistance';
    case 'ratio':
      return check.id === 'socFloor' ? 'ratio' : null;
    default:
      return check.quantity;
  }
}

/** A check's value or limit in the unit system (ratios as plain numbers, 3 digits). */
export function checkAmount(check: Check, v: number, system: UnitSystemId): string {
  const q = checkDisplayQuantity(check);
  return q === null ? formatSignificant(v, 3) : formatQuantity(v, q, system);
}

export function describeCheck(check: Check, system: UnitSystemId): string {
  const a = (v: number) => checkAmount(check, v, system);
  const value = a(check.value);
  const limit = a(check.limit);
  const who = check.subject ?? check.label;
  const kind = check.id.split(':')[0];
  const screen = formatQuantity(DEFAULT_SCREEN_HEIGHT_M, 'shortDistance', system);
  switch (kind) {
    case 'mtow':
      return `Take-off mass ${value} against a maximum of ${limit}.`;
    case 'tank':
      return `Fuel load ${value} against a tank capacity of ${limit}.`;
    case 'reserve':
      return check.incomplete
        ? `The mission is not completed; ${value} left where it stops, ${limit} of reserve required.`
        : `On landing ${value} left against ${limit} of reserve required.`;
    case 'socFloor':
      return `Lowest charge ${value} of usable energy against a floor of ${limit}.`;
    case 'stall':
      return `${who}: lowest airspeed ${value} × stall speed against ${limit}.`;
    case 'power':
      return `${who}: needs ${value} of thrust power, ${limit} available.`;
    case 'climb':
      return `${who}: least rate of climb ${value} against ${limit}.`;
    case 'ceiling':
      return `Highest altitude ${value}${check.subject ? ` (${check.subject})` : ''} against a ceiling of ${limit}.`;
    case 'takeoffRun':
    case 'landingRun': {
      if (check.reason !== undefined) return `${check.label}: ${check.reason}.`;
      const what =
        kind === 'takeoffRun'
          ? `Take-off distance to ${screen}`
          : `Landing distance from ${screen}`;
      const f = check.factor ?? 1;
      return `${what} ${a(check.value / f)} × ${formatSignificant(f, 3)} = ${value} against ${limit} of runway.`;
    }
    case 'launch':
      return `Release airspeed ${value} × stall speed against ${limit}.`;
    default:
      return check.detail;
  }
}
