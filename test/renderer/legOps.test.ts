import { describe, expect, it } from 'vitest';
import { defaultLeg } from '../../core/plan/defaults.ts';
import type { Leg } from '../../core/plan/schema.ts';
import {
  addLeg,
  deleteLeg,
  duplicateLeg,
  moveLeg,
  uniqueLegId,
} from '../../renderer/src/support/legOps.ts';

const legs = (): Leg[] => [
  defaultLeg('takeoff', 'a'),
  defaultLeg('climb', 'b'),
  defaultLeg('cruise', 'c'),
  defaultLeg('landing', 'd'),
];
const ids = (list: readonly Leg[]) => list.map((l) => l.id);

describe('leg list operations', () => {
  it('new ids never repeat an existing one', () => {
    const list = [defaultLeg('cruise', 'cruise-1'), defaultLeg('cruise', 'cruise-3')];
    expect(uniqueLegId(list, 'cruise')).toBe('cruise-2');
    let grown: Leg[] = list;
    for (let i = 0; i < 20; i++) grown = addLeg(grown, 'cruise', defaultLeg).legs;
    expect(new Set(ids(grown)).size).toBe(grown.length);
  });

  it('adds at the given position and at the end by default', () => {
    const at = addLeg(legs(), 'loiter', defaultLeg, 3);
    expect(ids(at.legs)).toEqual(['a', 'b', 'c', at.id, 'd']);
    const end = addLeg(legs(), 'descent', defaultLeg);
    expect(ids(end.legs).at(-1)).toBe(end.id);
    expect(end.legs.at(-1)?.kind).toBe('descent');
  });

  it('duplicates right after the source, deep-copied', () => {
    const source = legs();
    const { legs: out, id } = duplicateLeg(source, 2);
    expect(ids(out)).toEqual(['a', 'b', 'c', id, 'd']);
    expect(out[3]).not.toBe(source[2]);
    const copy = out[3];
    if (copy?.kind !== 'cruise' || source[2]?.kind !== 'cruise')
      throw new Error('expected cruise legs');
    copy.wind.speed_m_s = 99;
    expect(source[2].wind.speed_m_s).not.toBe(99);
  });

  it('moves up, down and to either end, clamped', () => {
    expect(ids(moveLeg(legs(), 2, 1))).toEqual(['a', 'c', 'b', 'd']);
    expect(ids(moveLeg(legs(), 1, 2))).toEqual(['a', 'c', 'b', 'd']);
    expect(ids(moveLeg(legs(), 3, 0))).toEqual(['d', 'a', 'b', 'c']);
    expect(ids(moveLeg(legs(), 0, 99))).toEqual(['b', 'c', 'd', 'a']);
    expect(ids(moveLeg(legs(), 0, -1))).toEqual(['a', 'b', 'c', 'd']);
    expect(() => moveLeg(legs(), 7, 0)).toThrow(RangeError);
  });

  it('deletes but never the last leg', () => {
    expect(ids(deleteLeg(legs(), 1))).toEqual(['a', 'c', 'd']);
    expect(ids(deleteLeg([defaultLeg('cruise', 'only')], 0))).toEqual(['only']);
    expect(() => deleteLeg(legs(), 4)).toThrow(RangeError);
  });
});
