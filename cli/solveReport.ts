/**
 * `legwise solve` output: the per-leg table with totals, the checks and the verdict as text;
 * the same table as CSV with unit-suffixed headers; or the whole result as JSON. Every
 * number goes through core/format.ts, so the CLI, reports and screens agree.
 */
import {
  displayValue,
  formatQuantity,
  formatSignificant,
  NO_VALUE,
  unitLabel,
} from '../core/format.ts';
import type { Plan } from '../core/plan/schema.ts';
import {
  checkFigures,
  describeCheck,
  describeMargin,
  describeReserveProblem,
  minutesText,
} from '../core/solver/describe.ts';
import { routeProgress } from '../core/solver/routeProgress.ts';
import type { CheckState, LegResult, PlanResult, Span } from '../core/solver/types.ts';
import type { ReserveMonteCarloResult } from '../core/uncertainty/reserveMonteCarlo.ts';
import type { Quantity, UnitSystemId } from '../core/units.ts';
import { UNIT_SYSTEMS } from '../core/units.ts';
import { CAUTION } from './common.ts';
import { clip, csvField, renderTable } from './table.ts';
import type { Column } from './table.ts';

const SYSTEM_NAMES: Record<UnitSystemId, string> = {
  si: 'SI (m, km, m/s, kg)',
  aviation: 'aviation (ft, NM, kt, lb)',
  uav: 'small UAV (m, km, m/s, wind kt, kg, Wh)',
};

/** The consumable's quantity: fuel mass, or battery energy. */
function consumableQuantity(result: PlanResult): Quantity {
  return result.consumable === 'fuel' ? 'fuelMass' : 'energy';
}

function usedOf(result: PlanResult, leg: LegResult): number {
  return result.consumable === 'fuel' ? leg.fuelUsed_kg : leg.energyUsed_J;
}

function leftOf(result: PlanResult, leg: LegResult): number {
  return result.consumable === 'fuel' ? leg.end.fuel_kg : leg.end.energy_J;
}

/** "0.42–0.51"; a dash for allowance legs, whose span is 0..0. */
function span(s: Span): string {
  if (!(s.max > 0)) return NO_VALUE;
  const lo = formatSignificant(s.min);
  const hi = formatSignificant(s.max);
  return lo === hi ? lo : `${lo}–${hi}`;
}

function legName(leg: LegResult): string {
  return clip(leg.label.trim() === '' ? leg.id : leg.label, 30);
}

export function legColumns(result: PlanResult, units: UnitSystemId): Column[] {
  const c = consumableQuantity(result);
  const what = result.consumable === 'fuel' ? 'Fuel' : 'Energy';
  const u = (q: Quantity) => unitLabel(q, units);
  return [
    { header: '#', align: 'right' },
    { header: 'Leg', align: 'left' },
    { header: 'Kind', align: 'left' },
    { header: 'Time', align: 'right' },
    { header: `Dist (${u('distance')})`, align: 'right' },
    { header: `${what} (${u(c)})`, align: 'right' },
    { header: `Left (${u(c)})`, align: 'right' },
    { header: `TAS (${u('airspeed')})`, align: 'right' },
    { header: `GS (${u('groundSpeed')})`, align: 'right' },
    { header: 'CL', align: 'right' },
    { header: 'L/D', align: 'right' },
  ];
}

const bare = (v: number, q: Quantity, units: UnitSystemId) =>
  formatQuantity(v, q, units, { withUnit: false });

function legRow(result: PlanResult, leg: LegResult, units: UnitSystemId): string[] {
  const c = consumableQuantity(result);
  const head = [String(leg.index + 1), legName(leg), leg.kind];
  if (leg.status === 'notReached') return [...head, 'not reached'];
  const allowance = leg.kind === 'takeoff' || leg.kind === 'landing';
  return [
    ...head,
    formatQuantity(leg.time_s, 'time', units),
    bare(leg.groundDistance_m, 'distance', units),
    bare(usedOf(result, leg), c, units),
    bare(leftOf(result, leg), c, units),
    allowance ? NO_VALUE : bare(leg.meanTas_m_s, 'airspeed', units),
    allowance ? NO_VALUE : bare(leg.meanGroundSpeed_m_s, 'groundSpeed', units),
    span(leg.CL),
    span(leg.LD),
  ];
}

/** The totals row: mission time, ground distance, consumable used, and left on landing. */
export function totalsRow(result: PlanResult, units: UnitSystemId): string[] {
  const c = consumableQuantity(result);
  const used =
    result.consumable === 'fuel' ? result.totals.fuelUsed_kg : result.totals.energyUsed_J;
  return [
    '',
    'Total',
    '',
    formatQuantity(result.totals.time_s, 'time', units),
    bare(result.totals.groundDistance_m, 'distance', units),
    bare(used, c, units),
    bare(result.landing.remaining, c, units),
  ];
}

/** A check's value or limit in the chosen units (ratios as plain numbers). */
export { checkAmount } from '../core/solver/describe.ts';

const STATE_WORD: Record<CheckState, string> = { ok: 'ok', tight: 'TIGHT', fails: 'FAILS' };

/** One row per check: the label names the leg, the sentence does not repeat it. */
function checkRows(result: PlanResult, units: UnitSystemId): string[][] {
  return result.checks.map((c) => {
    const { value, limit } = checkFigures(c, units);
    return [
      STATE_WORD[c.state],
      c.label,
      `${value} / ${limit}`,
      describeMargin(c, units),
      describeCheck(c, units),
    ];
  });
}

/**
 * " (40.2 % of usable energy; pack at 46.2 % of nominal)": the charge on landing as a share of
 * the usable energy, and of the pack's nominal energy with the unusable share counted as kept
 * (nominal = usable / usableFraction).
 */
function chargeWords(plan: Plan, result: PlanResult, units: UnitSystemId): string {
  if (result.consumable !== 'battery') return '';
  const soc = result.landing.soc;
  const pp = plan.aircraft.powerplant;
  const pack =
    pp.type === 'electric'
      ? `; pack at ${formatQuantity(1 - pp.battery.usableFraction * (1 - soc), 'ratio', units)} of nominal`
      : '';
  return ` (${formatQuantity(soc, 'ratio', units)} of usable energy${pack})`;
}

/**
 * The reserve in time as well as amount: the final reserve's rule, altitude and time, the
 * required and remaining amounts as minutes at its rate; or why it cannot be flown.
 */
export function reserveLines(result: PlanResult, units: UnitSystemId): string[] {
  const r = result.reserve;
  const c = consumableQuantity(result);
  const f = r.final;
  const out: string[] = [];
  const rule = f.rule === 'normalCruise' ? 'normal cruise' : 'best endurance';
  if (f.time_s > 0) {
    const where = f.level === 'lastCruise' ? 'the last cruise altitude' : 'the hold altitude';
    const speed =
      f.rule === 'normalCruise'
        ? f.cruiseLegIndex >= 0
          ? ` (speed of leg ${f.cruiseLegIndex + 1})`
          : ' (no cruise leg: best range)'
        : '';
    out.push(
      `Final reserve: ${minutesText(f.time_s)} at ${rule}${speed}, ${formatQuantity(f.altitude_m, 'altitude', units)} (${where})` +
        (r.problems.length === 0
          ? `: ${formatQuantity(f.timed, c, units)}, climb to it ${formatQuantity(f.climb, c, units)}.`
          : '.'),
    );
  }
  for (const p of r.problems)
    out.push(`  ! reserve cannot be flown: ${describeReserveProblem(p, units)}`);
  if (r.problems.length === 0 && r.requiredTime_s > 0) {
    out.push(
      `In time at ${rule}: required ${minutesText(r.requiredTime_s)}, on landing ${minutesText(r.remainingTime_s)}.`,
    );
  }
  return out;
}

export function verdictLine(result: PlanResult): string {
  if (!result.completed && result.failure !== null) {
    return `Verdict: FAILS — leg ${result.failure.legIndex + 1} cannot be flown: ${result.failure.message}`;
  }
  if (result.verdict === 'fails') return 'Verdict: FAILS — at least one check fails.';
  if (result.verdict === 'tight') return 'Verdict: TIGHT — feasible, but some margins are small.';
  return 'Verdict: OK — every check passes.';
}

/** Load-time warnings first, then the solver's, without repeats. */
export function mergeWarnings(loadWarnings: readonly string[], result: PlanResult): string[] {
  return [...new Set([...loadWarnings, ...result.warnings])];
}

export function renderSolveText(
  plan: Plan,
  result: PlanResult,
  warnings: readonly string[],
  units: UnitSystemId,
  /** A section printed before the caution (the Monte Carlo of `--monte-carlo`). */
  extra = '',
): string {
  const lines: string[] = [];
  const c = consumableQuantity(result);
  lines.push(`${plan.name}`);
  lines.push(
    `${plan.aircraft.name} · take-off mass ${formatQuantity(result.takeoffMass_kg, 'mass', units)} · ` +
      `units ${SYSTEM_NAMES[units]}`,
  );
  lines.push('');
  const rows = result.legs.map((leg) => legRow(result, leg, units));
  lines.push(...renderTable(legColumns(result, units), [...rows, totalsRow(result, units)]));
  for (const leg of result.legs) {
    if (leg.status === 'failed')
      lines.push(`  ! leg ${leg.index + 1} failed: ${leg.error ?? 'no reason given'}`);
  }
  const soc = chargeWords(plan, result, units);
  lines.push('');
  lines.push(
    `On landing: ${formatQuantity(result.landing.remaining, c, units)} left${soc}; reserve required ` +
      `${formatQuantity(result.reserve.required.total, c, units)} — ${result.reserve.kept ? 'kept' : 'NOT kept'}.`,
  );
  lines.push(...reserveLines(result, units));
  lines.push('');
  lines.push('Checks');
  const checkColumns: Column[] = [
    { header: 'State', align: 'left' },
    { header: 'Check', align: 'left' },
    { header: 'Value / limit', align: 'right' },
    { header: 'Margin', align: 'right' },
    { header: 'Detail', align: 'left' },
  ];
  lines.push(...renderTable(checkColumns, checkRows(result, units)).map((l) => `  ${l}`));
  lines.push('');
  lines.push(verdictLine(result));
  if (warnings.length > 0) {
    lines.push('');
    lines.push('Warnings');
    for (const w of warnings) lines.push(`  - ${w}`);
  }
  if (extra !== '') {
    lines.push('');
    lines.push(extra.trimEnd());
  }
  lines.push('');
  lines.push(CAUTION);
  return `${lines.join('\n')}\n`;
}

/** Per-leg CSV in the chosen units; the caution as a leading `# ` comment line. */
export function renderSolveCsv(result: PlanResult, units: UnitSystemId): string {
  const sys = UNIT_SYSTEMS[units];
  const c = consumableQuantity(result);
  const cu = sys[c];
  const word = result.consumable === 'fuel' ? 'fuel' : 'energy';
  const header = [
    'leg',
    'id',
    'kind',
    'label',
    'status',
    'time_min',
    `ground_distance_${sys.distance}`,
    `${word}_used_${cu}`,
    `${word}_left_${cu}`,
    `mean_tas_${sys.airspeed}`,
    `mean_gs_${sys.groundSpeed}`,
    'cl_min',
    'cl_max',
    'ld_min',
    'ld_max',
    'error',
  ];
  const num = (v: number, q: Quantity, decimals?: number) =>
    displayValue(v, q, units, decimals === undefined ? {} : { decimals });
  const rows = result.legs.map((leg) => {
    const flown = leg.status !== 'notReached';
    const values: (string | number)[] = [leg.index + 1, leg.id, leg.kind, leg.label, leg.status];
    if (!flown) return [...values, '', '', '', '', '', '', '', '', '', '', leg.error ?? ''];
    // Allowance legs have no airspeed or polar point: those cells stay empty, as "—" in text.
    const aero =
      leg.kind === 'takeoff' || leg.kind === 'landing'
        ? ['', '', '', '', '', '']
        : [
            num(leg.meanTas_m_s, 'airspeed', 1),
            num(leg.meanGroundSpeed_m_s, 'groundSpeed', 1),
            Number(leg.CL.min.toFixed(4)),
            Number(leg.CL.max.toFixed(4)),
            Number(leg.LD.min.toFixed(3)),
            Number(leg.LD.max.toFixed(3)),
          ];
    return [
      ...values,
      displayValue(leg.time_s, 'time', units, { unit: 'min', decimals: 2 }),
      num(leg.groundDistance_m, 'distance', 2),
      num(usedOf(result, leg), c, 3),
      num(leftOf(result, leg), c, 3),
      ...aero,
      leg.error ?? '',
    ];
  });
  const lines = [`# ${CAUTION}`, header.join(','), ...rows.map((r) => r.map(csvField).join(','))];
  return `${lines.join('\n')}\n`;
}

/**
 * The full result plus the caution and the merged warnings (and, for a plan with a route,
 * the per-waypoint estimates; with --monte-carlo, the Monte Carlo), as JSON.
 */
export function renderSolveJson(
  plan: Plan,
  result: PlanResult,
  warnings: readonly string[],
  monteCarlo: ReserveMonteCarloResult | null = null,
): string {
  const out = {
    caution: CAUTION,
    plan: plan.name,
    ...result,
    warnings: [...warnings],
    ...(plan.route ? { waypoints: routeProgress(plan, result) } : {}),
    ...(monteCarlo ? { monteCarlo } : {}),
  };
  return `${JSON.stringify(out, null, 2)}\n`;
}
