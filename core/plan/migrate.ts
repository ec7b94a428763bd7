/**
 * Plan-file migrations: a chain of small steps, each lifting a raw (not yet validated) plan
 * from schema version v to v + 1, so a file written by any earlier Legwise opens in this one.
 * Steps run before validation and so must tolerate any JSON; they never touch physics, only
 * the shape of the file and the defaults that carry an old file's meaning into a new model.
 * Each step reports what it changed in plain words (`notes`), which the loader hands on so
 * the planner and the CLI can tell the user.
 */
import { InputError } from '../errors.ts';
import { PLAN_SCHEMA_VERSION } from './schema.ts';
import { migrateV1toV2 } from './migrations/v1to2.ts';

/** A parsed JSON object whose shape is not yet known. */
export type RawPlan = Record<string, unknown>;

/**
 * Lifts a raw plan from version v to v + 1 (must not mutate its argument); pushes one note
 * per change of meaning onto `notes`.
 */
export type Migration = (raw: RawPlan, notes: string[]) => RawPlan;

/** Keyed by the version a step starts from. */
export type MigrationTable = Readonly<Record<number, Migration>>;

/** The migrations shipped with this version of Legwise. */
export const MIGRATIONS: MigrationTable = { 1: migrateV1toV2 };

/** Oldest schema version the table can bring up to `target`. */
export function oldestReadableVersion(
  migrations: MigrationTable = MIGRATIONS,
  target = PLAN_SCHEMA_VERSION,
): number {
  let v = target;
  while (migrations[v - 1] !== undefined) v -= 1;
  return v;
}

/**
 * Runs the steps from `raw.schemaVersion` up to `target`. The caller has already checked that
 * schemaVersion is an integer not above `target`. Throws InputError on `schemaVersion` when no
 * chain of steps reaches the target, or when a step fails or does not advance the version.
 */
export function migratePlan(
  raw: RawPlan,
  migrations: MigrationTable = MIGRATIONS,
  target = PLAN_SCHEMA_VERSION,
  notes: string[] = [],
): RawPlan {
  const from = raw.schemaVersion;
  const oldest = oldestReadableVersion(migrations, target);
  if (typeof from !== 'number' || !Number.isInteger(from) || from < oldest || from > target) {
    throw new InputError('schemaVersion', from, `an integer from ${oldest} to ${target}`);
  }
  let current = raw;
  for (let v = from; v < target; v += 1) {
    const step = migrations[v];
    if (step === undefined) {
      throw new InputError('schemaVersion', from, `an integer from ${oldest} to ${target}`);
    }
    let next: RawPlan;
    try {
      next = step(current, notes);
    } catch (err) {
      const why = err instanceof Error ? err.message : String(err);
      throw new InputError('schemaVersion', v, `convertible to version ${v + 1} (${why})`);
    }
    // Each step owns the version bump; stamping it here keeps a forgetful step harmless.
    current = { ...next, schemaVersion: v + 1 };
  }
  return current;
}
