/**
 * `legwise solve FILE... | FOLDER`: every plan solved in this one process, one summary row
 * per plan — a table, CSV (`--csv`) or one JSON object per line (`--json`, NDJSON). A file
 * that cannot be read or is refused gets a row too, and the exit code is the worst of all
 * plans (0 < 1 < 2 < 3, common.ts).
 */
import { displayValue, formatQuantity } from '../core/format.ts';
import type { Plan } from '../core/plan/schema.ts';
import { describeCheck } from '../core/solver/describe.ts';
import { solvePlan } from '../core/solver/solve.ts';
import type { PlanResult } from '../core/solver/types.ts';
import type { Quantity, UnitSystemId } from '../core/units.ts';
import { UNIT_SYSTEMS } from '../core/units.ts';
import { CAUTION, EXIT_FAILS, EXIT_INTERNAL, EXIT_OK, EXIT_USAGE } from './common.ts';
import type { CliIo, OutputOptions } from './common.ts';
import { readPlan } from './input.ts';
import { clip, csvField, renderTable } from './table.ts';
import type { Column } from './table.ts';

export type RowVerdict = 'ok' | 'tight' | 'fails' | 'refused' | 'error';

/** One plan's summary, SI. Flight figures are null when the plan was not solved. */
export interface BatchRow {
  file: string;
  plan: string | null;
  verdict: RowVerdict;
  exit: number;
  legs: number | null;
  consumable: PlanResult['consumable'] | null;
  time_s: number | null;
  groundDistance_m: number | null;
  /** Fuel kg or usable energy J, by `consumable`. */
  used: number | null;
  left: number | null;
  reserveRequired: number | null;
  reserveKept: boolean | null;
  /** Why the verdict is not OK: the first failing check, the leg that failed, the refusal. */
  reason: string;
}

const empty = {
  plan: null,
  legs: null,
  consumable: null,
  time_s: null,
  groundDistance_m: null,
  used: null,
  left: null,
  reserveRequired: null,
  reserveKept: null,
} as const;

function reasonOf(result: PlanResult, units: UnitSystemId): string {
  if (!result.completed && result.failure !== null) {
    return `leg ${result.failure.legIndex + 1} cannot be flown: ${result.failure.message}`;
  }
  const worst =
    result.checks.find((c) => c.state === 'fails') ??
    result.checks.find((c) => c.state === 'tight');
  return worst === undefined ? '' : `${worst.label}: ${describeCheck(worst, units)}`;
}

export function solvedRow(
  file: string,
  plan: Plan,
  result: PlanResult,
  units: UnitSystemId,
): BatchRow {
  const fuel = result.consumable === 'fuel';
  const fails = result.verdict === 'fails' || !result.completed;
  return {
    file,
    plan: plan.name,
    verdict: fails ? 'fails' : result.verdict,
    exit: fails ? EXIT_FAILS : EXIT_OK,
    legs: plan.legs.length,
    consumable: result.consumable,
    time_s: result.totals.time_s,
    groundDistance_m: result.totals.groundDistance_m,
    used: fuel ? result.totals.fuelUsed_kg : result.totals.energyUsed_J,
    left: result.landing.remaining,
    reserveRequired: result.reserve.required.total,
    reserveKept: result.reserve.kept,
    reason: reasonOf(result, units),
  };
}

/** Reads, validates and solves one file into its row; never throws. */
export function batchRow(file: string, io: CliIo, units: UnitSystemId): BatchRow {
  const read = readPlan(file, io);
  if (!read.ok) {
    return {
      file,
      ...empty,
      verdict: 'refused',
      exit: EXIT_USAGE,
      reason: `cannot read: ${read.why}`,
    };
  }
  const r = read.result;
  if (!r.ok) {
    const n = r.issues.length;
    const first = r.issues[0]?.message ?? 'not a plan file';
    const more = n > 1 ? ` (and ${n - 1} more problem${n === 2 ? '' : 's'})` : '';
    return { file, ...empty, verdict: 'refused', exit: EXIT_USAGE, reason: `${first}${more}` };
  }
  try {
    return solvedRow(file, r.plan, solvePlan(r.plan), units);
  } catch (err) {
    const why = err instanceof Error ? err.message : String(err);
    return {
      file,
      ...empty,
      plan: r.plan.name,
      verdict: 'error',
      exit: EXIT_INTERNAL,
      reason: `internal error: ${why}`,
    };
  }
}

const VERDICT_WORD: Record<RowVerdict, string> = {
  ok: 'OK',
  tight: 'TIGHT',
  fails: 'FAILS',
  refused: 'REFUSED',
  error: 'ERROR',
};

function quantityOf(row: BatchRow): Quantity {
  return row.consumable === 'battery' ? 'energy' : 'fuelMass';
}

/** NDJSON: one object per plan, SI with the unit in each key, the caution in every line. */
export function renderRowJson(row: BatchRow): string {
  const fuel = row.consumable !== 'battery';
  const [usedKey, leftKey, reserveKey] = fuel
    ? ['fuelUsed_kg', 'fuelLeft_kg', 'reserveRequired_kg']
    : ['energyUsed_J', 'energyLeft_J', 'reserveRequired_J'];
  return `${JSON.stringify({
    file: row.file,
    plan: row.plan,
    verdict: row.verdict,
    exit: row.exit,
    legs: row.legs,
    consumable: row.consumable,
    time_s: row.time_s,
    groundDistance_m: row.groundDistance_m,
    [usedKey]: row.used,
    [leftKey]: row.left,
    [reserveKey]: row.reserveRequired,
    reserveKept: row.reserveKept,
    reason: row.reason,
    caution: CAUTION,
  })}\n`;
}

export function csvHeader(units: UnitSystemId): string {
  const sys = UNIT_SYSTEMS[units];
  return [
    'file',
    'plan',
    'verdict',
    'exit',
    'legs',
    'consumable',
    'time_min',
    `ground_distance_${sys.distance}`,
    'used',
    'left',
    'reserve_required',
    'consumable_unit',
    'reserve_kept',
    'reason',
  ].join(',');
}

export function renderRowCsv(row: BatchRow, units: UnitSystemId): string {
  const q = quantityOf(row);
  const sys = UNIT_SYSTEMS[units];
  const n = (v: number | null, quantity: Quantity, decimals: number) =>
    v === null ? '' : displayValue(v, quantity, units, { decimals });
  const cells: (string | number)[] = [
    row.file,
    row.plan ?? '',
    row.verdict,
    row.exit,
    row.legs ?? '',
    row.consumable ?? '',
    row.time_s === null
      ? ''
      : displayValue(row.time_s, 'time', units, { unit: 'min', decimals: 2 }),
    n(row.groundDistance_m, 'distance', 2),
    n(row.used, q, 3),
    n(row.left, q, 3),
    n(row.reserveRequired, q, 3),
    row.consumable === null ? '' : sys[q],
    row.reserveKept === null ? '' : String(row.reserveKept),
    row.reason,
  ];
  return `${cells.map(csvField).join(',')}\n`;
}

function textCells(row: BatchRow, units: UnitSystemId): string[] {
  const q = quantityOf(row);
  const f = (v: number | null, quantity: Quantity) =>
    v === null ? '' : formatQuantity(v, quantity, units);
  return [
    clipStart(row.file, 48),
    clip(row.plan ?? '', 30),
    VERDICT_WORD[row.verdict],
    f(row.time_s, 'time'),
    f(row.groundDistance_m, 'distance'),
    f(row.used, q),
    f(row.left, q),
    clip(row.reason, 90),
  ];
}

/** Long paths keep their end, where the file name is. */
function clipStart(text: string, max: number): string {
  return text.length <= max ? text : `…${text.slice(text.length - max + 1)}`;
}

const TEXT_COLUMNS: Column[] = [
  { header: 'File', align: 'left' },
  { header: 'Plan', align: 'left' },
  { header: 'Verdict', align: 'left' },
  { header: 'Time', align: 'right' },
  { header: 'Distance', align: 'right' },
  { header: 'Used', align: 'right' },
  { header: 'Left', align: 'right' },
  { header: 'Why', align: 'left' },
];

/** "12 plans: 10 OK, 1 TIGHT, 1 FAILS" (kinds that occur only). */
export function batchSummary(rows: readonly BatchRow[]): string {
  const counts = new Map<RowVerdict, number>();
  for (const r of rows) counts.set(r.verdict, (counts.get(r.verdict) ?? 0) + 1);
  const parts = (Object.keys(VERDICT_WORD) as RowVerdict[])
    .filter((v) => counts.has(v))
    .map((v) => `${counts.get(v)} ${VERDICT_WORD[v]}`);
  return `${rows.length} plan${rows.length === 1 ? '' : 's'}: ${parts.join(', ')}`;
}

/**
 * Solves every file and prints the rows; CSV and NDJSON rows go out as each plan is done,
 * the table once all are. Returns the worst exit code.
 */
export function runBatch(files: readonly string[], opts: OutputOptions, io: CliIo): number {
  let worst = EXIT_OK;
  const rows: BatchRow[] = [];
  if (opts.csv) io.stdout(`# ${CAUTION}\n${csvHeader(opts.units)}\n`);
  files.forEach((file, i) => {
    const row = batchRow(file, io, opts.units);
    worst = Math.max(worst, row.exit);
    if (opts.json) io.stdout(renderRowJson(row));
    else if (opts.csv) io.stdout(renderRowCsv(row, opts.units));
    else rows.push(row);
    io.progress?.(i + 1, files.length, 'plans solved');
  });
  if (!opts.json && !opts.csv) {
    const lines = renderTable(
      TEXT_COLUMNS,
      rows.map((r) => textCells(r, opts.units)),
    );
    io.stdout(`${lines.join('\n')}\n\n${batchSummary(rows)}\n\n${CAUTION}\n`);
  }
  return worst;
}
