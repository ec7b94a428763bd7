/**
 * Saved files carry no float noise. Reference: IEEE 754 binary64 keeps any decimal of at
 * most 15 significant digits exactly through text → double → text (DBL_DIG = 15, C11
 * §5.2.4.2.2), and ECMAScript's Number::toString writes the shortest text that reads back
 * as the same double (ECMA-262 §6.1.6.1.20). ft = 0.3048 m and lb = 0.45359237 kg exactly.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { newPlan } from '../../../core/plan/defaults.ts';
import { fileNumber, parsePlanText, serializePlan } from '../../../core/plan/load.ts';

/** Every number literal in the text with more than 15 significant digits. */
function noisyNumbers(text: string): string[] {
  const numbers = text.match(/-?\d+(\.\d+)?(e[-+]?\d+)?/gi) ?? [];
  return numbers.filter(
    (n) =>
      n
        .replace(/^-|e.*$/gi, '')
        .replace('.', '')
        .replace(/^0+/, '').length > 15,
  );
}

describe('serializePlan writes numbers without float noise', () => {
  it('noise is written as the short decimal and 8000 ft as 2438.4 m', () => {
    const plan = newPlan();
    plan.reserves.contingencyFraction = 0.1 + 0.2 - 0.25; // 0.04999999999999999 in binary64
    plan.settings.stallFactor = 1 + 0.1 + 0.1; // 1.2000000000000002
    plan.aircraft.ceiling_m = 8000 * 0.3048; // 2438.4 exactly as decimal
    expect(String(0.95 + 1e-16)).toBe('0.9500000000000001'); // the noisy neighbour of 0.95
    plan.environment.isaOffset_K = 0.95 + 1e-16;
    const text = serializePlan(plan);
    expect(noisyNumbers(text)).toEqual([]);
    expect(text).toContain('"contingencyFraction": 0.05');
    expect(text).toContain('"stallFactor": 1.2');
    expect(text).toContain('"ceiling_m": 2438.4');
    expect(text).toContain('"isaOffset_K": 0.95');
    expect(text).not.toContain('0.9500000000000001');
  });

  it('a saved plan reads back and saves to the same text', () => {
    const plan = newPlan();
    plan.aircraft.mass.payload_kg = 11905 * 0.45359237;
    const first = serializePlan(plan);
    const loaded = parsePlanText(first);
    expect(loaded.ok).toBe(true);
    if (loaded.ok) expect(serializePlan(loaded.plan)).toBe(first);
  });

  it('property: fileNumber keeps the value to 15 digits and writes at most 15', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e9, max: 1e9, noNaN: true, noDefaultInfinity: true }), (v) => {
        const w = fileNumber(v);
        expect(Math.abs(w - v)).toBeLessThanOrEqual(Math.abs(v) * 1e-14);
        expect(noisyNumbers(JSON.stringify(w))).toEqual([]);
        expect(fileNumber(w)).toBe(w); // idempotent
      }),
      { seed: 20261203, numRuns: 2000 },
    );
  });
});
