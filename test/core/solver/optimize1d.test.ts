import { describe, expect, it } from 'vitest';
import { maximizeBounded } from '../../../core/solver/optimize1d.ts';
import { rel } from './fixtures.ts';

describe('maximizeBounded with a hint from the previous state', () => {
  // f(x) = −(x − c)², maximum exactly at c (exact solution).
  const parabola = (c: number) => (x: number) => -((x - c) ** 2);

  it('confirms a maximum at the lower end with the hint, and finds it without', () => {
    for (const hint of [undefined, 'lo' as const]) {
      const m = maximizeBounded(parabola(1), 2, 10, undefined, hint);
      expect(m).toEqual({ x: 2, atBound: 'lo' });
    }
  });

  it('confirms a maximum at the upper end with the hint', () => {
    expect(maximizeBounded(parabola(20), 2, 10, undefined, 'hi')).toEqual({ x: 10, atBound: 'hi' });
  });

  it('a wrong hint costs two evaluations and the interior maximum is still found', () => {
    let calls = 0;
    const f = (x: number) => {
      calls++;
      return parabola(5)(x);
    };
    const m = maximizeBounded(f, 2, 10, undefined, 'lo');
    expect(m.atBound).toBeNull();
    expect(rel(m.x, 5)).toBeLessThan(1e-9);
    expect(calls).toBeGreaterThan(2);
  });
});
