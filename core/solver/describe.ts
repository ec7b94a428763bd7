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
import type { Quantity, UnitSystem } from '../units.ts';
import type { Check, ReserveProblem } from './types.ts';

/** Beyond this relative margin (±999 %) a margin reads as a multiple ("> 10×"). */
const MAX_PERCENT_MARGIN = 9.99;

/** A time as minutes for reserves: "45 min", "3 h 05 min". */
export function minutesText(seconds: number): string {
  const m = Math.round(seconds / 60);
  if (m < 120) return `${m} min`;
  const mm = m % 60;
  return `${Math.floor(m / 60)} h ${mm < 10 ? '0' : ''}${mm} min`;
}

/** Why a reserve cannot be flown, in the reader's units. */
export function describeReserveProblem(p: ReserveProblem, system: UnitSystem): string {
  const what = p.part === 'hold' ? 'final reserve' : 'alternate';
  const alt = (h: number) => formatQuantity(h, 'altitude', system);
  switch (p.why) {
    case 'belowField':
      return `the ${what} altitude ${alt(p.altitude_m)} is below the arrival field + minimum height (${alt(p.limit)})`;
    case 'aboveCeiling':
      return `the ${what} altitude ${alt(p.altitude_m)} is above the ceiling (${alt(p.limit)} pressure altitude)`;
    case 'cannotClimb':
      return `the ${what} climb cannot go above ${alt(p.altitude_m)} (rate of climb below ${formatQuantity(p.limit, 'verticalSpeed', system)})`;
    case 'powerShort':
      return `the ${what} needs ${formatQuantity(p.required_W, 'power', system)} of thrust power at ${alt(p.altitude_m)}, ${formatQuantity(p.available_W, 'power', system)} available`;
    default:
      return `the ${what} could not be flown at ${alt(p.altitude_m)}`;
  }
}

/**
 * A check's margin as a person reads it: a percentage of the limit; for a limit at or near
 * zero the absolute difference in the check's unit (a percentage of nothing means nothing);
 * beyond ±999 % a multiple ("> 10×"); for a speed the planner chose and for checks that are
 * yes-or-no (leg order, a reserve that cannot be flown) no figure at all.
 */
export function describeMargin(check: Check, system: UnitSystem): string {
  if (check.chosenSpeed) return check.chosenSpeed.atStallMargin ? 'at floor' : 'chosen';
  if (check.id === 'shape:order' || check.id === 'shape:flight') return '—';
  if (check.reserveProblems !== undefined && check.reserveProblems.length > 0) return '—';
  if (check.incomplete) return '—';
  if (check.id === 'shape:arrival') {
    return formatQuantity(check.value - check.limit, 'altitude', system, { signed: true });
  }
  if (!Number.isFinite(check.margin)) return '—';
  const diff = check.limit - check.value;
  const signedDiff = check.margin >= 0 ? Math.abs(diff) : -Math.abs(diff);
  const tinyLimit = Math.abs(check.limit) <= 1e-3 * Math.abs(check.value);
  if (tinyLimit && check.thrustRequired_N === undefined) {
    const q = checkDisplayQuantity(check);
    return q === null
      ? formatSignificant(signedDiff, 3)
      : formatQuantity(signedDiff, q, system, { signed: true });
  }
  if (check.margin > MAX_PERCENT_MARGIN) return '> 10×';
  if (check.margin < -MAX_PERCENT_MARGIN) return '> 10× over';
  const pct = 100 * check.margin;
  const text = Math.abs(pct) < 10 ? pct.toFixed(1) : pct.toFixed(0);
  return `${pct >= 0 ? '+' : ''}${text === '-0.0' ? '0.0' : text} %`;
}

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
    case 'count':
      return null;
    default:
      return check.quantity;
  }
}

/** A check's value or limit in the unit system (ratios as plain numbers, 3 digits). */
export function checkAmount(check: Check, v: number, system: UnitSystem): string {
  const q = checkDisplayQuantity(check);
  return q === null ? formatSignificant(v, 3) : formatQuantity(v, q, system);
}

/**
 * A check's value and limit as shown: a jet's power check as thrust (lbf or kN), every other
 * check as `checkAmount` gives them.
 */
export function checkFigures(check: Check, system: UnitSystem): { value: string; limit: string } {
  // Yes-or-no shape checks: a count of legs out of order against none allowed.
  if (check.id === 'shape:order') {
    return { value: `${check.value} out of order`, limit: 'none' };
  }
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

export function describeCheck(check: Check, system: UnitSystem): string {
  const a = (v: number) => checkAmount(check, v, system);
  const { value, limit } = checkFigures(check, system);
  const kind = check.id.split(':')[0];
  const screen = formatQuantity(DEFAULT_SCREEN_HEIGHT_M, 'shortDistance', system);
  switch (kind) {
    case 'mtow':
      return `Take-off mass ${value} against a maximum of ${limit}.`;
    case 'tank':
      return `Fuel load ${value} against a tank capacity of ${limit}.`;
    case 'reserve': {
      if (check.incomplete)
        return `The mission is not completed; ${value} left where it stops, ${limit} of reserve required.`;
      const problems = check.reserveProblems ?? [];
      if (problems.length > 0) {
        return `The reserve cannot be flown: ${problems.map((p) => describeReserveProblem(p, system)).join('; ')}.`;
      }
      const t = check.reserveTime;
      if (t === undefined || !(t.required_s > 0)) {
        return `On landing ${value} left against ${limit} of reserve required.`;
      }
      const rule = t.rule === 'normalCruise' ? 'normal cruise' : 'best endurance';
      const final = t.final_s > 0 ? `; final reserve ${minutesText(t.final_s)}` : '';
      return `On landing ${value} (${minutesText(t.remaining_s)} at ${rule}) left against ${limit} (${minutesText(t.required_s)}${final}) of reserve required.`;
    }
    case 'socFloor':
      return `Lowest charge ${value} of usable energy against a floor of ${limit}.`;
    case 'stall':
      if (check.chosenSpeed) {
        return check.chosenSpeed.atStallMargin
          ? `Speed chosen by the planner, limited by the stall margin: ${value} × stall speed (${limit} set).`
          : `Speed chosen by the planner: lowest ${value} × stall speed (at least ${limit} by construction).`;
      }
      return `Lowest airspeed ${value} × stall speed against ${limit}.`;
    case 'shape':
      if (check.id === 'shape:arrival') {
        return `The last leg ends at ${value}; the arrival elevation is ${limit}.`;
      }
      if (check.id === 'shape:order' && (check.orderProblems ?? []).length > 0) {
        const words = (check.orderProblems ?? []).map((o) =>
          o.why === 'belowField'
            ? `${o.leg} descends to ${formatQuantity(o.altitude_m, 'altitude', system)}, below the field (${formatQuantity(o.field_m, 'altitude', system)})`
            : o.why === 'takeoffAfterLanding'
              ? `${o.leg} comes after the landing ${o.other}`
              : `${o.leg} is a flight leg after the landing ${o.other}`,
        );
        return `The legs cannot be flown in this order: ${words.join('; ')}.`;
      }
      return check.detail;
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
    case 'oneEngineOut':
      return `Estimate, one engine inoperative: service ceiling ${value} against the mission's highest altitude ${limit}.`;
    default:
      return check.detail;
  }
}
