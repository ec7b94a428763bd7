/**
 * Reading and writing plan files (format `legwise-plan`, DESIGN.md section 4): JSON text →
 * format tag → schema version → migrations → zod schema → rules that tie fields together.
 * Every refusal is a list of issues whose messages start with the JSON path and name the
 * value and the limit; nothing here throws for any input text.
 */
import { InputError } from '../errors.ts';
import { decodePlanBytes } from './decode.ts';
import {
  cleanJsonMessage,
  duplicateKey,
  excerptAt,
  jsonErrorOffset,
  lineColumn,
} from './jsonError.ts';
import {
  describeValue,
  issue,
  orderBySchema,
  planIssueFromZod,
  unknownFieldIssues,
} from './issues.ts';
import type { PlanIssue } from './issues.ts';
import { MIGRATIONS, migratePlan, oldestReadableVersion } from './migrate.ts';
import type { MigrationTable, RawPlan } from './migrate.ts';
import { PLAN_FORMAT, PLAN_SCHEMA_VERSION, PlanSchema } from './schema.ts';
import type { Plan } from './schema.ts';
import { planWarnings } from './sanity.ts';

export type { PlanIssue } from './issues.ts';

/**
 * `changes`: what migrating an older file changed, in plain words (empty for a current file);
 * `warnings`: unusual values (sanity.ts).
 */
export type LoadResult =
  | { ok: true; plan: Plan; warnings: string[]; changes: string[] }
  | { ok: false; issues: PlanIssue[] };

export interface LoadOptions {
  /** Migration steps to use instead of the shipped ones (tests, future versions). */
  migrations?: MigrationTable;
}

/** Plan files are small (a 200-leg plan is well under 1 MB); refuse anything much larger. */
export const MAX_PLAN_TEXT_LENGTH = 5 * 1024 * 1024;
/** A file that is wrong everywhere still gets a readable list. */
export const MAX_ISSUES = 100;

function refuse(issues: PlanIssue[]): LoadResult {
  if (issues.length <= MAX_ISSUES) return { ok: false, issues };
  const rest = issues.length - MAX_ISSUES;
  return {
    ok: false,
    issues: [...issues.slice(0, MAX_ISSUES), issue('file', `and ${rest} more problems`)],
  };
}

/** The refusal for a file of `size` bytes or characters above MAX_PLAN_TEXT_LENGTH. */
export function tooLargeIssue(size: number): PlanIssue {
  const mb = (size / (1024 * 1024)).toFixed(1);
  return issue('file', `${mb} MB is too large — a plan file may be at most 5 MB`);
}

/**
 * Parses the bytes of a plan file: UTF-8 only (decode.ts says what is refused and why),
 * the size checked before anything is decoded.
 */
export function parsePlanBytes(bytes: Uint8Array, options: LoadOptions = {}): LoadResult {
  if (bytes.length > MAX_PLAN_TEXT_LENGTH) return refuse([tooLargeIssue(bytes.length)]);
  const decoded = decodePlanBytes(bytes);
  if (!decoded.ok) return refuse([issue('file', decoded.message)]);
  return parsePlanText(decoded.text, options);
}

/** Parses the text of a plan file. */
export function parsePlanText(text: string, options: LoadOptions = {}): LoadResult {
  if (typeof text !== 'string') return refuse([issue('file', 'expected the text of a plan file')]);
  if (text.length > MAX_PLAN_TEXT_LENGTH) return refuse([tooLargeIssue(text.length)]);
  // Some editors write a byte-order mark; JSON itself does not allow one.
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  let data: unknown;
  try {
    data = JSON.parse(body);
  } catch (err) {
    const offset = jsonErrorOffset(body);
    const { line, column } = lineColumn(body, offset < 0 ? 0 : offset);
    const why = cleanJsonMessage(err instanceof Error ? err.message : String(err));
    const near = excerptAt(body, offset < 0 ? 0 : offset);
    const shown = near === '' ? '' : ` near: ${near}`;
    return refuse([
      issue('file', `not valid JSON at line ${line}, column ${column} (${why})${shown}`),
    ]);
  }
  const twice = duplicateKey(body);
  if (twice !== undefined) {
    const a = lineColumn(body, twice.first);
    const b = lineColumn(body, twice.again);
    return refuse([
      issue(
        twice.path,
        `given twice (line ${a.line}, column ${a.column} and line ${b.line}, column ${b.column}) — each key may appear once, so it is clear which value counts`,
      ),
    ]);
  }
  return parsePlan(data, options);
}

function isRecord(v: unknown): v is RawPlan {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** Format tag and version; undefined when both are acceptable. */
function headerIssue(data: RawPlan, migrations: MigrationTable): PlanIssue | undefined {
  if (data.format !== PLAN_FORMAT) {
    const got = describeValue(data.format);
    return issue(
      'format',
      `expected "${PLAN_FORMAT}", got ${got} — this is not a Legwise plan file`,
    );
  }
  const v = data.schemaVersion;
  if (typeof v !== 'number' || !Number.isInteger(v)) {
    return issue('schemaVersion', `${describeValue(v)} — must be an integer version number`);
  }
  if (v > PLAN_SCHEMA_VERSION) {
    return issue(
      'schemaVersion',
      `this file was written by a newer Legwise (version ${v}); this version reads up to ` +
        `${PLAN_SCHEMA_VERSION} — update Legwise to open it`,
    );
  }
  const oldest = oldestReadableVersion(migrations);
  if (v < oldest) {
    return issue('schemaVersion', `${v} — must be from ${oldest} to ${PLAN_SCHEMA_VERSION}`);
  }
  return undefined;
}

/** Validates parsed JSON as a plan, migrating older versions first. */
export function parsePlan(data: unknown, options: LoadOptions = {}): LoadResult {
  const migrations = options.migrations ?? MIGRATIONS;
  if (!isRecord(data)) {
    return refuse([
      issue('file', `${describeValue(data)} — a plan file must be a JSON object { … }`),
    ]);
  }
  const header = headerIssue(data, migrations);
  if (header !== undefined) return refuse([header]);
  let raw: RawPlan;
  const changes: string[] = [];
  try {
    raw = migratePlan(data, migrations, PLAN_SCHEMA_VERSION, changes);
  } catch (err) {
    if (err instanceof InputError)
      return refuse([issue(err.field, `${describeValue(err.value)} — must be ${err.limit}`)]);
    throw err;
  }
  const parsed = PlanSchema.safeParse(raw);
  const unknown = unknownFieldIssues(PlanSchema, raw);
  if (!parsed.success) {
    return refuse([...parsed.error.issues.map((iss) => planIssueFromZod(iss, raw)), ...unknown]);
  }
  const rules = crossFieldIssues(parsed.data);
  if (unknown.length > 0 || rules.length > 0) return refuse([...unknown, ...rules]);
  return { ok: true, plan: parsed.data, warnings: planWarnings(parsed.data), changes };
}

/**
 * Rules that tie fields together and whose breach is impossible rather than unusual:
 * a battery cannot burn fuel kilograms and a fuel burner has no pack energy; the lift
 * coefficient of minimum drag must lie below the maximum lift coefficient; leg ids identify
 * legs for editing and must be unique. Unusual values are warnings (sanity.ts) and limits
 * that depend on the flight (MTOW, tank, reserve) are solver checks.
 */
export function crossFieldIssues(plan: Plan): PlanIssue[] {
  const out: PlanIssue[] = [];
  const { polar, powerplant } = plan.aircraft;
  if (polar.CLminD >= polar.CLmax) {
    out.push(
      issue('aircraft.polar.CLminD', `${polar.CLminD} — must be below CLmax (${polar.CLmax})`),
    );
  }
  const electric = powerplant.type === 'electric';
  const wrong = electric ? 'fuel' : 'energy';
  const right = electric ? 'energy' : 'fuel';
  const why = electric
    ? 'a battery-electric aircraft burns no fuel'
    : 'this aircraft has no battery';
  const firstUse = new Map<string, number>();
  plan.legs.forEach((leg, i) => {
    const seen = firstUse.get(leg.id);
    if (seen !== undefined) {
      out.push(
        issue(`legs.${i}.id`, `${describeValue(leg.id)} — must be unique; legs.${seen} has it too`),
      );
    } else firstUse.set(leg.id, i);
    let by: string | undefined;
    let at = '';
    if (leg.kind === 'takeoff' || leg.kind === 'landing')
      [by, at] = [leg.allowance.by, 'allowance.by'];
    else if (leg.kind === 'cruise') [by, at] = [leg.end.by, 'end.by'];
    if (by === wrong) {
      out.push(issue(`legs.${i}.${at}`, `"${wrong}" — ${why}; use "${right}" or another option`));
    }
  });
  return out;
}

/**
 * A number as written to a file: 15 significant digits, the most a double always carries
 * through decimal text and back (IEEE 754 binary64, DBL_DIG = 15), then the shortest text
 * that reads back as that (ECMAScript Number::toString). Arithmetic noise such as
 * 1 − 0.05 = 0.9500000000000001 is written 0.95; 2438.4 m (8000 ft) stays 2438.4.
 */
export function fileNumber(value: number): number {
  return Number.isFinite(value) && value !== 0 ? Number(value.toPrecision(15)) : value;
}

/** Plan → file text: schema key order, 2-space indent, trailing newline, no float noise. */
export function serializePlan(plan: Plan): string {
  const ordered = orderBySchema(PlanSchema, plan);
  const text = JSON.stringify(
    ordered,
    (_k, v: unknown) => (typeof v === 'number' ? fileNumber(v) : v),
    2,
  );
  return `${text}\n`;
}

export { migratePlan } from './migrate.ts';
