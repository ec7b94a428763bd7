/**
 * A check's sentence in the reader's units: the same words as `Check.detail` (which stays in
 * SI), with every amount through core/format.ts `formatQuantity`, rounded to the display
 * resolution of its quantity ("Needs 75.8 hp of thrust power, 107 hp available."; a jet's as
 * thrust, "Needs 4120 lbf of thrust, 9800 lbf available."). Ratios (speed over stall speed)
 * stay plain numbers; fractions of charge show as percent. A per-leg check names its leg in
 * its label, so its sentence does not.
 */
import { DEFAULT_SCREEN_HEIGHT_M } from '../field/takeoff.ts';
import { formatQuantity, formatSignificant, type FormatOptions } from '../format.ts';
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

/**
 * A check's value and limit as shown: a jet's power check as thrust (lbf or kN), every other
 * check as `checkAmount` gives them.
 */
export function checkFigures(check: Check, system: UnitSystemId): { value: string; limit: string } {
  const Treq = check.thrustRequired_N;
  const Tav = check.thrustAvailable_N;
  if (Treq !== undefined && Tav !== undefined) {
    // SI: kilonewtons from 1 kN up (a business jet's 20 000 N reads as 20.0 kN).
    const opts: FormatOptions =
      system === 'si' && Math.max(Treq, Tav) >= 1000 ? { unit: 'kN' } : {};
    return {
      value: formatQuantity(Treq, 'thrust', system, opts),
      limit: formatQuantity(Tav, 'thrust', system, opts),
    };
  }
  return {
    value: checkAmount(check, check.value, system),
    limit: checkAmount(check, check.limit, system),
  };
}

export function describeCheck(check: Check, system: UnitSystemId): string {
  const a = (v: number) => checkAmount(check, v, system);
  const { value, limit } = checkFigures(check, system);
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
      return `Lowest airspeed ${value} × stall speed against ${limit}.`;
    case 'power':
      return check.thrustRequired_N !== undefined
        ? `Needs ${value} of thrust, ${limit} available.`
        : `Needs ${value} of thrust power, ${limit} available.`;
    case 'climb':
      return `Least rate of climb ${value} against ${limit}.`;
    case 'station':
      return check.state === 'fails'
        ? `Cannot hold station: the wind of ${value} is at least the loiter airspeed of ${limit}.`
        : `Wind ${value} against the loiter airspeed ${limit}.`;
    case 'ceiling':
      return `Highest pressure altitude ${value}${check.subject ? ` (${check.subject})` : ''} against a ceiling of ${limit}.`;
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
