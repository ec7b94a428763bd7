import { describe, expect, it } from 'vitest';
import { fitPolar } from '../../core/polarFit.ts';
import { parsePairs } from '../../renderer/src/support/polarPairs.ts';
import { historyActionFor, legMoveFor } from '../../renderer/src/support/shortcuts.ts';

describe('pasted (CL, CD) pairs', () => {
  it('reads commas, semicolons, tabs and spaces, skips a header and comments', () => {
    const text = 'CL\tCD\n# wind tunnel run 3\n0.2, 0.031\n0.4;0.036\n0.6\t0.045\n0.8 0.058\n';
    const { points, errors } = parsePairs(text);
    expect(errors).toEqual([]);
    // The pairs typed above, read back as numbers.
    expect(points).toEqual([
      { CL: 0.2, CD: 0.031 },
      { CL: 0.4, CD: 0.036 },
      { CL: 0.6, CD: 0.045 },
      { CL: 0.8, CD: 0.058 },
    ]);
  });

  it('names the lines it cannot read', () => {
    const { points, errors } = parsePairs('0.2, 0.03\n0.4\n0.5, x\n0.6, -0.01\n');
    expect(points).toHaveLength(1);
    expect(errors.map((e) => e.line)).toEqual([2, 3, 4]);
  });

  it('pairs made from a known polar fit back to it', () => {
    // CD = 0.025 + 0.05·(CL − 0.1)², generated here (parabolic polar, Anderson ch. 6); the fit
    // must recover the coefficients it was made from (relative 1e-9).
    const text = [0, 0.2, 0.4, 0.6, 0.8, 1, 1.2]
      .map((CL) => `${CL}, ${0.025 + 0.05 * (CL - 0.1) ** 2}`)
      .join('\n');
    const fit = fitPolar(parsePairs(text).points, { withOffset: true });
    expect(Math.abs(fit.CD0 - 0.025) / 0.025).toBeLessThan(1e-9);
    expect(Math.abs(fit.k - 0.05) / 0.05).toBeLessThan(1e-9);
    expect(Math.abs(fit.CLminD - 0.1) / 0.1).toBeLessThan(1e-9);
  });
});

describe('keyboard shortcuts', () => {
  const key = (
    k: string,
    mods: Partial<Record<'ctrlKey' | 'metaKey' | 'shiftKey' | 'altKey', boolean>> = {},
  ) => ({
    key: k,
    ctrlKey: false,
    metaKey: false,
    shiftKey: false,
    altKey: false,
    ...mods,
  });

  it('undo is Ctrl+Z (Cmd+Z), redo Ctrl+Shift+Z or Ctrl+Y', () => {
    expect(historyActionFor(key('z', { ctrlKey: true }))).toBe('undo');
    expect(historyActionFor(key('z', { metaKey: true }))).toBe('undo');
    expect(historyActionFor(key('Z', { ctrlKey: true, shiftKey: true }))).toBe('redo');
    expect(historyActionFor(key('y', { ctrlKey: true }))).toBe('redo');
    expect(historyActionFor(key('z'))).toBe(null);
    expect(historyActionFor(key('z', { ctrlKey: true, altKey: true }))).toBe(null);
  });

  it('Alt+ArrowUp and Alt+ArrowDown move a leg, nothing else does', () => {
    expect(legMoveFor(key('ArrowUp', { altKey: true }))).toBe(-1);
    expect(legMoveFor(key('ArrowDown', { altKey: true }))).toBe(1);
    expect(legMoveFor(key('ArrowDown'))).toBe(0);
    expect(legMoveFor(key('ArrowDown', { altKey: true, shiftKey: true }))).toBe(0);
  });
});
