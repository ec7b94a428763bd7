/**
 * Schema version 1 → 2. Version 2 gathers every file-format change of one release: each
 * model that needs new or changed fields adds one part here (a small function in its own
 * file beside this one), so old files get the better model with defaults that reproduce their
 * old inputs, and every part says in plain words what it changed. Parts run in order on the
 * raw (not yet validated) plan, must not mutate their argument and must tolerate any JSON.
 */
import type { RawPlan } from '../migrate.ts';
import { finalReserveAtCruise } from './finalReserveAtCruise.ts';
import { propellerCurvePart } from './propellerCurve.ts';
import { jetMachLapse } from './jetMachLapse.ts';
import { stallDragRisePart } from './stallDragRise.ts';

/** One part of the step: returns the lifted plan and pushes a note per change it made. */
export type MigrationPart = (raw: RawPlan, notes: string[]) => RawPlan;

/** The parts of the 1 → 2 step, in the order they run. */
export const V1_TO_V2_PARTS: readonly MigrationPart[] = [
  propellerCurvePart,
  stallDragRisePart,
  finalReserveAtCruise,
  jetMachLapse,
];

export function migrateV1toV2(raw: RawPlan, notes: string[]): RawPlan {
  let out = raw;
  for (const part of V1_TO_V2_PARTS) out = part(out, notes);
  return { ...out, schemaVersion: 2 };
}
