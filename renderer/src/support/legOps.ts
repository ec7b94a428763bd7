/**
 * Editing the leg list: add, duplicate, move, delete. Pure functions over the array;
 * every new leg gets an id no other leg in the plan has.
 */
import type { Leg, LegKind } from '../../../core/plan/schema.ts';

/** The first `kind-N` id not taken by any leg (ids only need to be unique in the plan). */
export function uniqueLegId(legs: readonly Pick<Leg, 'id'>[], kind: string): string {
  const taken = new Set(legs.map((l) => l.id));
  for (let n = 1; ; n++) {
    const id = `${kind}-${n}`;
    if (!taken.has(id)) return id;
  }
}

/** Inserts `leg` at `at` (0 … length; default: the end). */
export function insertLeg(legs: readonly Leg[], leg: Leg, at = legs.length): Leg[] {
  const i = Math.min(Math.max(0, Math.floor(at)), legs.length);
  return [...legs.slice(0, i), leg, ...legs.slice(i)];
}

export function addLeg(
  legs: readonly Leg[],
  kind: LegKind,
  makeLeg: (kind: LegKind, id: string) => Leg,
  at = legs.length,
): { legs: Leg[]; id: string } {
  const id = uniqueLegId(legs, kind);
  return { legs: insertLeg(legs, makeLeg(kind, id), at), id };
}

/** A deep copy of leg `index` right after it, with a fresh id. */
export function duplicateLeg(legs: readonly Leg[], index: number): { legs: Leg[]; id: string } {
  const source = legs[index];
  if (!source) throw new RangeError(`no leg ${index} in a plan of ${legs.length}`);
  const id = uniqueLegId(legs, source.kind);
  const copy = { ...structuredClone(source), id };
  return { legs: insertLeg(legs, copy, index + 1), id };
}

/** Moves leg `from` to position `to` (both clamped to the list); a no-op returns the same order. */
export function moveLeg(legs: readonly Leg[], from: number, to: number): Leg[] {
  if (from < 0 || from >= legs.length)
    throw new RangeError(`no leg ${from} in a plan of ${legs.length}`);
  const target = Math.min(Math.max(0, to), legs.length - 1);
  const rest = legs.filter((_, i) => i !== from);
  return [...rest.slice(0, target), legs[from] as Leg, ...rest.slice(target)];
}

/** Removes leg `index`; a plan keeps at least one leg, so the last one cannot go. */
export function deleteLeg(legs: readonly Leg[], index: number): Leg[] {
  if (index < 0 || index >= legs.length)
    throw new RangeError(`no leg ${index} in a plan of ${legs.length}`);
  if (legs.length <= 1) return legs.slice();
  return legs.filter((_, i) => i !== index);
}
