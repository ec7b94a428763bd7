import { describe, expect, it } from 'vitest';
import {
  editableText,
  parseNumberText,
  plainNumber,
  storedFromText,
} from '../../renderer/src/support/fieldBinding.ts';
import { assignIssues, limitInUnit, shortMessage } from '../../renderer/src/support/issues.ts';
import { getAtPath, setAtPath } from '../../renderer/src/support/paths.ts';

describe('typed numbers', () => {
  it('reads plain decimals and exponents without a locale; refuses the rest', () => {
    // Values below are the typed text itself (no conversion involved).
    expect(parseNumberText(' 12.5 ')).toEqual({ ok: true, value: 12.5 });
    // Without a locale a comma is refused, never guessed as a decimal mark (issue 11).
    expect(parseNumberText('12,5').ok).toBe(false);
    expect(parseNumberText('-3e2')).toEqual({ ok: true, value: -300 });
    expect(parseNumberText('1 200')).toEqual({ ok: true, value: 1200 });
    expect(parseNumberText('').ok).toBe(false);
    expect(parseNumberText('12a').ok).toBe(false);
    expect(parseNumberText('1,200.5').ok).toBe(false);
    expect(Number.isNaN(storedFromText('abc', 'ft', 'm'))).toBe(true);
  });

  it('shows stored values in the display unit, exactly where they are exact', () => {
    // 4500 m = 14763.78 ft (NIST SP 811: ft = 0.3048 m); 5 significant digits shown.
    expect(editableText(4500, 'm', 'ft')).toBe('14764');
    // 0.8 as a percentage (exact).
    expect(editableText(0.8, 'fraction', 'percent')).toBe('80');
    // 8.5e-8 kg/J = 306 g/kWh (1 kWh = 3.6 MJ exactly, NIST SP 811).
    expect(editableText(8.5e-8, 'kg_J', 'g_kWh')).toBe('306');
    expect(plainNumber(0.000123456, 3)).toBe('0.000123');
    expect(editableText(Number.NaN, 'm', 'm')).toBe('');
  });
});

describe('plan-check issues at their fields', () => {
  const issues = [
    {
      path: 'aircraft.mass.empty_kg',
      message: 'aircraft.mass.empty_kg: -5 — must be from 0.01 to 500000 kg',
    },
    { path: 'legs.2.speed', message: 'legs.2.speed: an object — does not match any allowed form' },
    { path: 'notes', message: 'notes: too long' },
  ];
  const fields = ['aircraft.mass.empty_kg', 'legs.2.speed.kind', 'legs.2.speed.speed_m_s'];

  it('go to the field they name, or to the discriminator of the object they name', () => {
    const { byField, general } = assignIssues(issues, fields);
    expect(byField.get('aircraft.mass.empty_kg')).toBe('-5 — must be from 0.01 to 500000 kg');
    expect(byField.get('legs.2.speed.kind')).toBe('an object — does not match any allowed form');
    expect(general.map((i) => i.path)).toEqual(['notes']);
    expect(shortMessage(issues[2]!)).toBe('too long');
  });

  it('restate the limit in the unit the field shows', () => {
    // 0.01 kg = 0.02205 lb and 500 000 kg = 1 102 311 lb (lb = 0.45359237 kg exactly, 1959 agreement);
    // 4 significant digits, whole numbers kept whole.
    expect(limitInUnit('-5 — must be from 0.01 to 500000 kg', 'kg', 'lb')).toBe(
      'must be from 0.02205 to 1102311 lb',
    );
    // Fractions shown as percent: 0.5 = 50 % (exact).
    expect(limitInUnit('0.7 — must be from 0 to 0.5', 'fraction', 'percent')).toBe(
      'must be from 0 to 50 %',
    );
    expect(limitInUnit('must be from 0 to 5 m', 'm', 'm')).toBe('must be from 0 to 5 m');
  });
});

describe('plan paths', () => {
  it('write copies only along the path', () => {
    const plan = { a: { b: 1 }, legs: [{ x: 1 }, { x: 2 }] };
    const next = setAtPath(plan, 'legs.1.x', 5);
    expect(getAtPath(next, 'legs.1.x')).toBe(5);
    expect(plan.legs[1]?.x).toBe(2);
    expect(next.a).toBe(plan.a);
    expect(next.legs[0]).toBe(plan.legs[0]);
    const removed = setAtPath({ p: { q: 1, r: 2 } }, 'p.q', undefined);
    expect(removed).toEqual({ p: { r: 2 } });
  });
});
