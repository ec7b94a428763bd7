import { describe, expect, it } from 'vitest';
import { integrate, OdeError, type OdeRhs } from '../../../core/solver/ode.ts';
import { odexSolve, rel } from './fixtures.ts';

const growth: OdeRhs = (_x, y, dy) => {
  dy[0] = y[0]!;
};
const gaussian: OdeRhs = (x, y, dy) => {
  dy[0] = -2 * x * y[0]!;
};
const oscillator: OdeRhs = (_x, y, dy) => {
  dy[0] = y[1]!;
  dy[1] = -y[0]!;
};

describe('integrate (Dormand–Prince 5(4))', () => {
  it("y' = y from 0 to 1 gives e (exact solution e^x)", () => {
    const r = integrate(growth, 0, [1], 1, { rtol: 1e-10, atol: 1e-14 });
    expect(rel(r.y[0]!, Math.E)).toBeLessThan(1e-9); // exact: e^1
    expect(r.x).toBe(1);
    expect(r.steps).toBeGreaterThan(0);
  });

  it("y' = −2ty from 0 to 2 gives exp(−4) (exact solution exp(−t²))", () => {
    const r = integrate(gaussian, 0, [1], 2, { rtol: 1e-10, atol: 1e-14 });
    expect(rel(r.y[0]!, Math.exp(-4))).toBeLessThan(1e-8); // exact: exp(−t²)
  });

  it('harmonic oscillator over 10 periods stays on cos/sin (exact solution)', () => {
    const T = 20 * Math.PI;
    const r = integrate(oscillator, 0, [1, 0], T, { rtol: 1e-11, atol: 1e-13 });
    expect(Math.abs(r.y[0]! - Math.cos(T))).toBeLessThan(1e-8); // exact: cos t
    expect(Math.abs(r.y[1]! + Math.sin(T))).toBeLessThan(1e-8); // exact: −sin t
  });

  it('integrates toward a decreasing independent variable', () => {
    // y' = y backwards from x = 1 (y = e) to 0 must give 1 (exact solution e^x).
    const r = integrate(growth, 1, [Math.E], 0, { rtol: 1e-10, atol: 1e-14 });
    expect(rel(r.y[0]!, 1)).toBeLessThan(1e-9);
    expect(r.x).toBe(0);
  });

  it('agrees with odex on a nonlinear system (Lotka–Volterra)', () => {
    const f = (_x: number, y: number[]) => [y[0]! * (1.5 - y[1]!), y[1]! * (y[0]! - 3)];
    const rhs: OdeRhs = (x, y, dy) => {
      const d = f(x, Array.from(y));
      dy[0] = d[0]!;
      dy[1] = d[1]!;
    };
    const ours = integrate(rhs, 0, [2, 1], 12, { rtol: 1e-11, atol: 1e-13 });
    const ref = odexSolve(f, 0, [2, 1], 12); // independent reference: odex (Bulirsch–Stoer)
    expect(rel(ours.y[0]!, ref[0]!)).toBeLessThan(1e-8);
    expect(rel(ours.y[1]!, ref[1]!)).toBeLessThan(1e-8);
  });

  it('reports accepted steps in order with a dense output accurate between them', () => {
    let prev = 0;
    let worst = 0;
    const out = new Float64Array(1);
    integrate(gaussian, 0, [1], 2, {
      rtol: 1e-9,
      onStep: (s) => {
        expect(s.x0).toBe(prev);
        expect(s.x1).toBeGreaterThan(s.x0);
        prev = s.x1;
        for (const f of [0.25, 0.5, 0.75]) {
          const x = s.x0 + f * (s.x1 - s.x0);
          s.interpolate(x, out);
          worst = Math.max(worst, Math.abs(out[0]! - Math.exp(-x * x)));
        }
      },
    });
    expect(prev).toBe(2);
    expect(worst).toBeLessThan(1e-7); // exact: exp(−x²); 4th-order dense output
  });

  it('stops at an event located on the dense output', () => {
    // cos t first falls to 0.5 at t = π/3 (exact).
    const r = integrate(oscillator, 0, [1, 0], 10, { rtol: 1e-10, event: (_x, y) => y[0]! - 0.5 });
    expect(r.stoppedByEvent).toBe(true);
    expect(Math.abs(r.x - Math.PI / 3)).toBeLessThan(1e-8);
    expect(r.y[0]!).toBeGreaterThanOrEqual(0.5 - 1e-12);
  });

  it('throws a clear OdeError when the step budget runs out', () => {
    expect(() => integrate(oscillator, 0, [1, 0], 1000, { maxSteps: 5 })).toThrow(OdeError);
    expect(() => integrate(oscillator, 0, [1, 0], 1000, { maxSteps: 5 })).toThrow(
      /more than 5 steps/,
    );
  });

  it('refuses a non-finite start instead of returning NaN', () => {
    expect(() => integrate(growth, 0, [Number.NaN], 1)).toThrow(OdeError);
  });

  it('returns the start for an empty interval', () => {
    const r = integrate(growth, 3, [2], 3);
    expect(r.y[0]).toBe(2);
    expect(r.steps).toBe(0);
  });
});
