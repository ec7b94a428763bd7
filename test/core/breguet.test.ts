import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import {
  enduranceJetConstantAltitudeSpeed,
  enduranceJetConstantCL,
  endurancePropConstantAltitudeCL,
  endurancePropConstantAltitudeSpeed,
  endurancePropCruiseClimb,
  rangeJetConstantAltitudeCL,
  rangeJetConstantAltitudeSpeed,
  rangeJetCruiseClimb,
  rangePropConstantAltitudeSpeed,
  rangePropConstantCL,
} from '../../core/breguet.ts';
import { InputError } from '../../core/errors.ts';
import {
  jetBestRangePoint,
  maxLiftToDrag,
  minPowerPoint,
  polarCoefficients,
} from '../../core/polar.ts';
import { G0, toSI } from '../../core/units.ts';

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);

/**
 * odex (CommonJS) is loaded through require with the small typed surface used here: a static
 * import would make tsc type-check the package's own TypeScript source under our strict flags.
 */
interface OdexSolver {
  absoluteTolerance: number;
  relativeTolerance: number;
  solve(
    f: (x: number, y: number[]) => number[],
    x0: number,
    y0: number[],
    x1: number,
  ): { y: number[] };
}
const odex = createRequire(import.meta.url)('odex') as { Solver: new (n: number) => OdexSolver };

/**
 * ∫ f(W) dW from W0 down to W1 with odex (Hairer's extrapolation code, an independent
 * integrator). f is dx/dW or dt/dW, negative, so the integral from W0 to W1 < W0 is positive.
 */
function integrateOverWeight(f: (W: number) => number, W0: number, W1: number): number {
  const solver = new odex.Solver(1);
  solver.absoluteTolerance = solver.relativeTolerance = 1e-12;
  const out = solver.solve((W: number) => [f(W)], W0, [0], W1);
  return out.y[0] as number;
}

// A mid-size case: 30 % of the take-off weight is fuel.
const ct = 1.6e-4; // 1/s
const cp = 7.5e-7; // 1/m
const eta = 0.82;
const rho = 0.75;
const S = 25;
const CD0 = 0.022;
const k = 0.045;
const CL = 0.45;
const CD = CD0 + k * CL * CL;
const V = 140;
const W0 = 60000;
const W1 = 42000;
const q = 0.5 * rho * V * V;
/** Level-flight drag at constant q: D = q·S·CD0 + k·W²/(q·S) (parabolic polar, Anderson ch. 6). */
const dragAtSpeed = (W: number): number => q * S * CD0 + (k * W * W) / (q * S);
/** Level-flight speed at constant CL: V = √(2W/(ρ·S·CL)). */
const speedAtCL = (W: number): number => Math.sqrt((2 * W) / (rho * S * CL));

describe('Breguet forms agree with odex integration of their ODE to 1e-8', () => {
  it('jet cruise-climb range: dx/dW = −V/(c_t·D), D = W·CD/CL', () => {
    const ref = integrateOverWeight((W) => -V / (ct * ((W * CD) / CL)), W0, W1); // odex
    expect(rel(rangeJetCruiseClimb({ ct, V, CL, CD, W0, W1 }), ref)).toBeLessThan(1e-8);
  });

  it('jet constant-altitude constant-CL range: dx/dW = −V(W)/(c_t·D(W)), V = √(2W/(ρSCL))', () => {
    const ref = integrateOverWeight((W) => -speedAtCL(W) / (ct * ((W * CD) / CL)), W0, W1); // odex
    expect(rel(rangeJetConstantAltitudeCL({ ct, rho, S, CL, CD, W0, W1 }), ref)).toBeLessThan(1e-8);
  });

  it('jet constant-altitude constant-speed range: dx/dW = −V/(c_t·D(W)), D at constant q', () => {
    const ref = integrateOverWeight((W) => -V / (ct * dragAtSpeed(W)), W0, W1); // odex
    const R = rangeJetConstantAltitudeSpeed({ ct, V, rho, S, CD0, k, W0, W1 });
    expect(rel(R, ref)).toBeLessThan(1e-8);
  });

  it('jet endurance at constant CL: dt/dW = −1/(c_t·D), D = W·CD/CL', () => {
    const ref = integrateOverWeight((W) => -1 / (ct * ((W * CD) / CL)), W0, W1); // odex
    expect(rel(enduranceJetConstantCL({ ct, CL, CD, W0, W1 }), ref)).toBeLessThan(1e-8);
  });

  it('jet endurance at constant altitude and speed: dt/dW = −1/(c_t·D(W))', () => {
    const ref = integrateOverWeight((W) => -1 / (ct * dragAtSpeed(W)), W0, W1); // odex
    const E = enduranceJetConstantAltitudeSpeed({ ct, V, rho, S, CD0, k, W0, W1 });
    expect(rel(E, ref)).toBeLessThan(1e-8);
  });

  it('propeller range at constant CL: dx/dW = −η/(c_p·D), D = W·CD/CL', () => {
    const ref = integrateOverWeight((W) => -eta / (cp * ((W * CD) / CL)), W0, W1); // odex
    expect(rel(rangePropConstantCL({ eta, cp, CL, CD, W0, W1 }), ref)).toBeLessThan(1e-8);
  });

  it('propeller range at constant altitude and speed: dx/dW = −η/(c_p·D(W))', () => {
    const ref = integrateOverWeight((W) => -eta / (cp * dragAtSpeed(W)), W0, W1); // odex
    const R = rangePropConstantAltitudeSpeed({ eta, cp, V, rho, S, CD0, k, W0, W1 });
    expect(rel(R, ref)).toBeLessThan(1e-8);
  });

  it('propeller endurance at constant altitude and CL: dt/dW = −η/(c_p·D·V(W))', () => {
    const f = (W: number): number => -eta / (cp * ((W * CD) / CL) * speedAtCL(W));
    const ref = integrateOverWeight(f, W0, W1); // odex
    const E = endurancePropConstantAltitudeCL({ eta, cp, rho, S, CL, CD, W0, W1 });
    expect(rel(E, ref)).toBeLessThan(1e-8);
  });

  it('propeller endurance in a cruise-climb: dt/dW = −η/(c_p·D·V), V and CL constant', () => {
    const ref = integrateOverWeight((W) => -eta / (cp * ((W * CD) / CL) * V), W0, W1); // odex
    expect(rel(endurancePropCruiseClimb({ eta, cp, V, CL, CD, W0, W1 }), ref)).toBeLessThan(1e-8);
  });

  it('propeller endurance at constant altitude and speed: dt/dW = −η/(c_p·D(W)·V)', () => {
    const ref = integrateOverWeight((W) => -eta / (cp * dragAtSpeed(W) * V), W0, W1); // odex
    const E = endurancePropConstantAltitudeSpeed({ eta, cp, V, rho, S, CD0, k, W0, W1 });
    expect(rel(E, ref)).toBeLessThan(1e-8);
  });

  it('keep their digits for a very small burn (compared with odex)', () => {
    const w1 = W0 * (1 - 1e-7);
    const ref = integrateOverWeight((W) => -V / (ct * dragAtSpeed(W)), W0, w1); // odex
    const R = rangeJetConstantAltitudeSpeed({ ct, V, rho, S, CD0, k, W0, W1: w1 });
    expect(rel(R, ref)).toBeLessThan(1e-8);
  });
});

describe('worked examples (Anderson, Introduction to Flight, ch. 6; inputs as published, outputs computed)', () => {
  it('light single-engine propeller airplane: R = 1.939e6 m, E = 5.175e4 s', () => {
    const S1 = 16.165;
    const c = polarCoefficients({
      CD0: 0.025,
      induced: { by: 'geometry', e: 0.8, AR: (10.912 * 10.912) / S1 },
      CLminD: 0,
      CLmax: 1.6,
    });
    const cp1 = toSI(0.45, 'lb_hph') * G0; // 0.45 lb/(hp·h) as weight-specific 1/m (NIST SP 811)
    expect(rel(cp1, 7.456e-7)).toBeLessThan(5e-4); // REFERENCES.md, Anderson ch. 6
    const w0 = 13127.5;
    const w1 = w0 - 1632.5;
    const best = maxLiftToDrag(c);
    const R = rangePropConstantCL({ eta: 0.8, cp: cp1, CL: best.CL, CD: best.CD, W0: w0, W1: w1 });
    expect(rel(R, 1.939e6)).toBeLessThan(5e-4); // Anderson ch. 6, computed from published inputs
    const mp = minPowerPoint(c);
    const E = endurancePropConstantAltitudeCL({
      eta: 0.8,
      cp: cp1,
      rho: 1.225,
      S: S1,
      CL: mp.CL,
      CD: mp.CD,
      W0: w0,
      W1: w1,
    });
    expect(rel(E, 5.175e4)).toBeLessThan(5e-4); // Anderson ch. 6, computed from published inputs
  });

  it('small business jet: R = 5.844e6 m, E = 4.782e4 s', () => {
    const S2 = 29.54;
    const c = polarCoefficients({
      CD0: 0.02,
      induced: { by: 'geometry', e: 0.81, AR: (16.25 * 16.25) / S2 },
      CLminD: 0,
      CLmax: 1.5,
    });
    const ct2 = 0.6 / 3600; // 0.6 1/h as published
    const w0 = 88176.75;
    const w1 = w0 - 33211.9;
    const jr = jetBestRangePoint(c);
    const R = rangeJetConstantAltitudeCL({
      ct: ct2,
      rho: 0.6107,
      S: S2,
      CL: jr.CL,
      CD: jr.CD,
      W0: w0,
      W1: w1,
    });
    expect(rel(R, 5.844e6)).toBeLessThan(5e-4); // Anderson ch. 6, computed from published inputs
    const best = maxLiftToDrag(c);
    const E = enduranceJetConstantCL({ ct: ct2, CL: best.CL, CD: best.CD, W0: w0, W1: w1 });
    expect(rel(E, 4.782e4)).toBeLessThan(5e-4); // Anderson ch. 6, computed from published inputs
  });
});

describe('input validation', () => {
  const field = (fn: () => unknown): string => {
    try {
      fn();
    } catch (err) {
      if (err instanceof InputError) return err.field;
      throw err;
    }
    return '(no error)';
  };

  it('names the refused parameter', () => {
    expect(field(() => rangeJetCruiseClimb({ ct, V, CL, CD, W0, W1: W0 }))).toBe('W1');
    expect(field(() => rangeJetCruiseClimb({ ct, V, CL, CD, W0: -1, W1 }))).toBe('W0');
    expect(field(() => rangeJetCruiseClimb({ ct: 0, V, CL, CD, W0, W1 }))).toBe('ct');
    expect(field(() => rangePropConstantCL({ eta: 1.2, cp, CL, CD, W0, W1 }))).toBe('eta');
    expect(field(() => rangePropConstantCL({ eta, cp, CL, CD: NaN, W0, W1 }))).toBe('CD');
    expect(
      field(() => rangeJetConstantAltitudeSpeed({ ct, V, rho, S, CD0, k: Infinity, W0, W1 })),
    ).toBe('k');
    expect(
      field(() => endurancePropConstantAltitudeCL({ eta, cp, rho: 0, S, CL, CD, W0, W1 })),
    ).toBe('rho');
  });

  it('refuses a result that would overflow instead of returning Infinity', () => {
    expect(field(() => rangeJetCruiseClimb({ ct: 1e-320, V, CL, CD, W0, W1 }))).toBe('ct');
  });
});
