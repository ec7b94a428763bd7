import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parsePlanText } from '../../../core/plan/load.ts';
import { describeCheck } from '../../../core/solver/describe.ts';
import { solvePlan } from '../../../core/solver/solve.ts';
import type { Check } from '../../../core/solver/types.ts';

function check(over: Partial<Check>): Check {
  return {
    id: 'x',
    label: 'x',
    legIndex: null,
    value: 0,
    limit: 0,
    quantity: 'ratio',
    margin: 0,
    state: 'ok',
    detail: 'SI sentence',
    ...over,
  };
}

describe('describeCheck: the check sentence in the reader’s units', () => {
  it('power in horsepower, rounded to the display resolution', () => {
    const c = check({
      id: 'power:2',
      label: 'Leg 3 (cruise): power',
      subject: 'Leg 3 (cruise)',
      legIndex: 2,
      value: 56549,
      limit: 79637,
      quantity: 'power',
    });
    // 1 hp = 745.699 872 W (NIST SP 811): 75.83 hp and 106.8 hp. The leg is named in the
    // check's label, not again in its sentence.
    expect(describeCheck(c, 'aviation')).toBe('Needs 75.8 hp of thrust power, 107 hp available.');
    expect(describeCheck(c, 'si')).toBe('Needs 56.5 kW of thrust power, 79.6 kW available.');
    expect(c.detail).toBe('SI sentence');
  });

  it('a jet power check in thrust: lbf, or kN in SI', () => {
    const c = check({
      id: 'power:2',
      label: 'Leg 3 (cruise): power',
      subject: 'Leg 3 (cruise)',
      legIndex: 2,
      value: 6156 * 200,
      limit: 11_009 * 200,
      quantity: 'power',
      thrustRequired_N: 6156,
      thrustAvailable_N: 11_009,
    });
    // 1 lbf = 4.448 221 615 260 5 N (NIST SP 811): 1383.9 lbf and 2474.9 lbf.
    expect(describeCheck(c, 'aviation')).toBe('Needs 1384 lbf of thrust, 2475 lbf available.');
    expect(describeCheck(c, 'si')).toBe('Needs 6.2 kN of thrust, 11.0 kN available.');
  });

  it('runway distances in feet, the screen height as 50 ft', () => {
    const c = check({
      id: 'takeoffRun',
      label: 'Take-off distance',
      value: 1.15 * 600,
      limit: 800,
      factor: 1.15,
      quantity: 'distance',
    });
    // 1 ft = 0.3048 m exactly (NIST SP 811): 600 m = 1968.5 ft, 690 m = 2263.8 ft, 800 m = 2624.7 ft.
    expect(describeCheck(c, 'aviation')).toBe(
      'Take-off distance to 50 ft 1969 ft × 1.15 = 2264 ft against 2625 ft of runway.',
    );
    expect(describeCheck(c, 'si')).toBe(
      'Take-off distance to 15 m 600 m × 1.15 = 690 m against 800 m of runway.',
    );
    expect(describeCheck({ ...c, reason: 'it cannot stop' }, 'si')).toBe(
      'Take-off distance: it cannot stop.',
    );
  });

  // Display resolution of core/format.ts: ratios to 3 significant digits, percentages to 0.1.
  it('ratios stay plain numbers; the battery floor is a percentage', () => {
    const stall = check({
      id: 'stall:0',
      subject: 'Leg 1 (cruise)',
      value: 1.357,
      limit: 1.2,
    });
    expect(describeCheck(stall, 'aviation')).toBe(
      'Lowest airspeed 1.36 × stall speed against 1.20.',
    );
    const soc = check({ id: 'socFloor', value: 0.234, limit: 0.2 });
    expect(describeCheck(soc, 'si')).toBe(
      'Lowest charge 23.4 % of usable energy against a floor of 20.0 %.',
    );
  });

  it('every check of the demo plans gets a sentence without raw SI units in aviation units', () => {
    for (const name of ['twelve-legs', 'light-jet', 'survey-uav-electric', 'piston-tourer']) {
      const loaded = parsePlanText(
        readFileSync(new URL(`../../../examples/${name}.json`, import.meta.url), 'utf8'),
      );
      if (!loaded.ok) throw new Error(name);
      const r = solvePlan(loaded.plan);
      // One plan-level ceiling check, not one per leg.
      expect(r.checks.filter((c) => c.id.startsWith('ceiling')).map((c) => c.id)).toEqual([
        'ceiling',
      ]);
      for (const c of r.checks) {
        const text = describeCheck(c, 'aviation');
        expect(text).not.toMatch(/NaN|Infinity|undefined/);
        expect(text).not.toMatch(/\d W\b|\d kg\b|\d m\b|\d m\/s\b/);
        expect(c.detail.length).toBeGreaterThan(0);
      }
    }
  });
});
