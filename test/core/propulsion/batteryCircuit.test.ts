/**
 * Equivalent-circuit pack (core/propulsion/batteryCircuit.ts, packDischarge.ts). References:
 * the quadratic P = (E − I·R)·I solved by the textbook root formula (exact algebra); the
 * charge balance dQ/dt = −I integrated independently with odex (Dormand–Prince 5(4), the
 * independent integrator in devDependencies); the OCV and temperature tables are common
 * practice, from memory, so the cold-pack check is about direction, not a published number.
 */
import fc from 'fast-check';
import odex from 'odex';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/errors.ts';
import {
  LI_ION_OCV,
  currentFor_A,
  maxPower_W,
  packModel,
  packOcv_V,
  terminalVoltage_V,
  timeBetween_s,
  type CircuitPack,
} from '../../../core/propulsion/batteryCircuit.ts';
import { dischargeProfile } from '../../../core/propulsion/packDischarge.ts';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
const AH = 3600; // A·s per ampere-hour (exact)

// A fictional 6S2P pack of 5 Ah, 20 mΩ cells, 3.3 V cut-off.
const PACK: CircuitPack = {
  cellsSeries: 6,
  cellsParallel: 2,
  cellCapacity_As: 5 * AH,
  cellResistance_ohm: 0.02,
  cutoffVoltage_V: 3.3,
};

/** Linear interpolation in the cell table, written out again for the odex reference. */
function cellOcv(s: number): number {
  const t = LI_ION_OCV;
  for (let i = 1; i < t.length; i++) {
    const a = t[i - 1]!;
    const b = t[i]!;
    if (s <= b.soc)
      return a.voltage_V + ((b.voltage_V - a.voltage_V) * (s - a.soc)) / (b.soc - a.soc);
  }
  return t[t.length - 1]!.voltage_V;
}

/** odex: SoC after `duration` at power P from `soc0`, with I = (E − √(E² − 4RP))/(2R). */
function odexSoc(soc0: number, P: number, duration: number, R: number, Q: number): number {
  const solver = new odex.Solver(1);
  solver.absoluteTolerance = solver.relativeTolerance = 1e-12;
  let end = NaN;
  solver.solve(
    (_t: number, y: number[]) => {
      const E = 6 * cellOcv(y[0]!);
      const I = (E - Math.sqrt(E * E - 4 * R * P)) / (2 * R);
      return [-I / Q];
    },
    0,
    [soc0],
    duration,
    (_n: number, _x0: number, x: number, y: number[]) => {
      if (x === duration) end = y[0]!;
    },
  );
  return end;
}

describe('current from power: the lower root of R·I² − E·I + P = 0', () => {
  it('satisfies P = V·I with V = E − I·R, the root formula of the quadratic (exact algebra)', () => {
    const m = packModel(PACK);
    const E = 6 * 3.72; // SoC 0.5 in the table
    const R = (6 / 2) * 0.02;
    expect(rel(packOcv_V(m, 0.5), E)).toBeLessThan(1e-14);
    for (const P of [10, 300, 1500]) {
      const I = currentFor_A(m, 0.5, P)!;
      expect(rel(I, (E - Math.sqrt(E * E - 4 * R * P)) / (2 * R))).toBeLessThan(1e-10);
      const V = terminalVoltage_V(m, 0.5, P)!;
      expect(rel(V * I, P)).toBeLessThan(1e-12);
      expect(rel(V, E - I * R)).toBeLessThan(1e-14);
    }
    // Maximum power E²/(4R) (the quadratic's discriminant at zero); beyond it, no current.
    expect(rel(maxPower_W(m, 0.5), (E * E) / (4 * R))).toBeLessThan(1e-14);
    expect(currentFor_A(m, 0.5, ((E * E) / (4 * R)) * 1.001)).toBeNull();
  });

  it('a constant-power discharge at a (near) flat OCV lasts Q·ΔSoC/I with I from the quadratic', () => {
    const flat: CircuitPack = {
      ...PACK,
      ocv: [
        { soc: 0, voltage_V: 3.7 },
        { soc: 1, voltage_V: 3.7 + 1e-9 },
      ],
      cutoffVoltage_V: 3.0,
    };
    const m = packModel(flat);
    const E = 6 * 3.7;
    const R = 0.06;
    const P = 400;
    const I = (E - Math.sqrt(E * E - 4 * R * P)) / (2 * R);
    const Q = 2 * 5 * AH;
    expect(rel(timeBetween_s(m, 0.2, 0.9, P)!, (Q * 0.7) / I)).toBeLessThan(1e-8);
  });
});

describe('charge integration against odex (dQ/dt = −I)', () => {
  it('the closed-form time through the default Li-ion table matches odex to 1e-8', () => {
    const m = packModel(PACK);
    const P = 250;
    const t = timeBetween_s(m, 0.15, 1, P)!;
    expect(rel(odexSoc(1, P, t, 0.06, 10 * AH), 0.15)).toBeLessThan(1e-8);
  });

  it('a three-leg profile (climb, cruise, loiter) ends at the SoC odex integrates', () => {
    const m = packModel(PACK);
    const legs = [
      { label: 'Climb', power_W: 600, duration_s: 120 },
      { label: 'Cruise', power_W: 250, duration_s: 1200 },
      { label: 'Loiter', power_W: 200, duration_s: 900 },
    ];
    const r = dischargeProfile(m, legs);
    expect(r.failure).toBeNull();
    let soc = 1;
    for (const [i, l] of legs.entries()) {
      soc = odexSoc(soc, l.power_W, l.duration_s, 0.06, 10 * AH);
      expect(rel(r.legs[i]!.socEnd, soc)).toBeLessThan(1e-8);
      // The leg's lowest voltage is its end's, under its load (exact algebra at the end SoC).
      const E = 6 * cellOcv(soc);
      const I = (E - Math.sqrt(E * E - 4 * 0.06 * l.power_W)) / (2 * 0.06);
      expect(rel(r.legs[i]!.voltageMin_V, E - I * 0.06)).toBeLessThan(1e-7);
    }
  });
});

describe('cut-off, cold and refusals', () => {
  it('cut-off triggers a failure naming the leg and the voltage', () => {
    const m = packModel(PACK);
    const r = dischargeProfile(m, [
      { label: 'Cruise out', power_W: 300, duration_s: 2000 },
      { label: 'Climb to 400 m', power_W: 1200, duration_s: 900 },
    ]);
    expect(r.failure?.legIndex).toBe(1);
    expect(r.failure?.message).toMatch(
      /^Climb to 400 m: the pack voltage falls to the cut-off 19\.8 V \(3\.3 V a cell\) after \d+/,
    );
  });

  it('demand beyond the maximum power fails clearly', () => {
    const m = packModel(PACK);
    const r = dischargeProfile(m, [{ label: 'Dash', power_W: 3000, duration_s: 10 }]);
    expect(r.failure?.message).toMatch(
      /^Dash: needs 3000 W, more than the \d+(\.\d+)? W the pack can deliver at 100 % charge/,
    );
  });

  it('a cold pack (−10 °C) reaches its cut-off earlier and sags more under load', () => {
    const warm = packModel(PACK);
    const cold = packModel({ ...PACK, cellTemperature_K: 263.15 });
    const P = 400;
    const until = (m: ReturnType<typeof packModel>) => {
      const r = dischargeProfile(m, [{ label: 'Loiter', power_W: P, duration_s: 1e6 }]);
      const s = /after (\d+(\.\d+)?) s/.exec(r.failure?.message ?? '');
      return Number(s?.[1]);
    };
    expect(until(cold)).toBeLessThan(until(warm));
    expect(terminalVoltage_V(cold, 0.5, P)!).toBeLessThan(terminalVoltage_V(warm, 0.5, P)!);
  });

  it('refuses a cut-off at or above the full-charge voltage, naming the field', () => {
    try {
      packModel({ ...PACK, cutoffVoltage_V: 4.25 });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).field).toBe('battery.cutoffVoltage_V');
    }
  });

  it('refuses an OCV table that does not rise with SoC, naming the point', () => {
    const ocv = LI_ION_OCV.map((p) => ({ ...p }));
    ocv[3]!.voltage_V = 3.4; // below point 2 (3.45 V)
    try {
      packModel({ ...PACK, ocv });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).field).toBe('battery.ocv.3.voltage_V');
    }
  });
});

describe('properties (fast-check)', () => {
  const table = fc
    .array(fc.double({ min: 0.01, max: 0.5, noNaN: true }), { minLength: 1, maxLength: 12 })
    .map((steps) => {
      let v = 3;
      const pts = [{ soc: 0, voltage_V: v }];
      steps.forEach((dv, i) => {
        v += dv;
        pts.push({ soc: (i + 1) / steps.length, voltage_V: v });
      });
      return pts;
    });

  it('voltage is monotone in SoC (open circuit and under any load it can carry); never NaN', () => {
    fc.assert(
      fc.property(
        table,
        fc.double({ min: 253.15, max: 333.15, noNaN: true }),
        fc.double({ min: 0, max: 2000, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (ocv, T, P, a, b) => {
          const m = packModel({ ...PACK, ocv, cutoffVoltage_V: 2.9, cellTemperature_K: T });
          const [lo, hi] = a < b ? [a, b] : [b, a];
          expect(packOcv_V(m, lo)).toBeLessThanOrEqual(packOcv_V(m, hi));
          const Vlo = terminalVoltage_V(m, lo, P);
          const Vhi = terminalVoltage_V(m, hi, P);
          if (Vlo !== null && Vhi !== null) {
            expect(Number.isFinite(Vlo) && Number.isFinite(Vhi)).toBe(true);
            expect(Vlo).toBeLessThanOrEqual(Vhi + 1e-12);
          }
          const t = P >= 1e-3 && hi > lo ? timeBetween_s(m, lo, hi, P) : 0;
          if (t !== null) expect(Number.isFinite(t)).toBe(true);
        },
      ),
      { numRuns: 400 },
    );
  });
});
