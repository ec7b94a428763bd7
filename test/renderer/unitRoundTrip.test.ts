import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { UNITS, UNIT_SYSTEMS, unitsOf, type Quantity, type UnitId } from '../../core/units.ts';
import {
  editableText,
  flightLevelBoxText,
  storedFromText,
} from '../../renderer/src/support/fieldBinding.ts';
import { numberStyle, type NumberStyle } from '../../renderer/src/support/numberText.ts';
import { CHOOSABLE } from '../../renderer/src/support/unitSettings.ts';
import { allFields } from '../../renderer/src/composables/usePlan.ts';
import type { NumberFieldDef } from '../../renderer/src/support/fieldTypes.ts';
import { getAtPath } from '../../renderer/src/support/paths.ts';
import { examplePlan } from './fixtures.ts';

/** Every unit a quantity can be shown in: its unit in each preset and every per-quantity choice. */
function unitsShown(q: Quantity): UnitId[] {
  const set = new Set<UnitId>(Object.values(UNIT_SYSTEMS).map((s) => s[q]));
  for (const c of CHOOSABLE) if (c.quantity === q) c.units.forEach((u) => set.add(u));
  return [...set];
}

/** The SI unit of a dimension (factor 1, no offset): where the plan stores it. */
function siUnit(u: UnitId): UnitId {
  const si = unitsOf(UNITS[u].dimension).find((x) => UNITS[x].factor === 1 && !UNITS[x].offset);
  if (!si) throw new Error(`no SI unit for ${u}`);
  return si;
}

const QUANTITIES = Object.keys(UNIT_SYSTEMS.si) as Quantity[];
const STYLES: NumberStyle[] = [numberStyle('en-US'), numberStyle('de-DE')];

/**
 * Typed text as a person writes a number: up to 9 significant digits, at most 6 decimals,
 * no leading or trailing zeros (the one spelling of its value), optional minus.
 */
const typedNumber = fc
  .tuple(
    fc.boolean(),
    fc.integer({ min: 0, max: 999_999 }),
    fc.integer({ min: 0, max: 6 }),
    fc.integer({ min: 0, max: 999 }),
  )
  .map(([neg, whole, places, frac]) => {
    const fracText =
      places === 0 ? '' : String(frac).padStart(3, '0').slice(0, places).replace(/0+$/, '');
    const body = fracText === '' ? String(whole) : `${whole}.${fracText}`;
    return body === '0' ? '0' : `${neg ? '-' : ''}${body}`;
  });

describe('unit round trips: typed → stored (SI) → shown is the typed text', () => {
  it('for every quantity, every unit it can be shown in, in an English and a German locale', () => {
    // Exact factors (NIST SP 811 appendix B; 1959 yard and pound; 3rd CGPM g0): a value typed
    // in any unit converts to SI at full precision and back to the same digits.
    const cases = QUANTITIES.flatMap((q) => unitsShown(q).map((u) => [q, u] as const));
    expect(cases.length).toBeGreaterThan(QUANTITIES.length);
    fc.assert(
      fc.property(
        fc.constantFrom(...cases),
        fc.constantFrom(...STYLES),
        typedNumber,
        ([quantity, unit], style, plain) => {
          const stored = siUnit(unit);
          // Absolute temperatures below 0 K are refused (core/units.ts), so skip them here.
          if (
            UNITS[unit].dimension === 'temperature' &&
            Number(plain) * UNITS[unit].factor + (UNITS[unit].offset ?? 0) < 0
          )
            return true;
          const typed = style.decimal === '.' ? plain : plain.replace('.', style.decimal);
          const si = storedFromText(typed, unit, stored, { style });
          expect(Number.isFinite(si)).toBe(true);
          expect(editableText(si, stored, unit, quantity, style)).toBe(typed);
          return true;
        },
      ),
      { seed: 11, numRuns: 3000 },
    );
  });

  it('a flight level typed is shown back as that level', () => {
    // FL270 with QNH 1018 hPa: the altitude whose pressure altitude is 27 000 ft (core/levels.ts).
    const rule = { transitionAltitude_m: 18_000 * 0.3048, qnh_Pa: 101_800 };
    const reading = { style: numberStyle('en-US'), flightLevels: rule };
    const stored = storedFromText('FL270', 'ft', 'm', reading);
    expect(flightLevelBoxText(stored, 'm', rule)).toBe('FL270');
    expect(flightLevelBoxText(2438.4, 'm', rule)).toBeNull();
  });

  it('pilot values stay pilot values: 8000 ft, 120 kt, 2400 lb, 40 US gal, 29.92 inHg', () => {
    // 8000 ft = 2438.4 m; 120 kt = 61.7333… m/s; 2400 lb = 1088.621688 kg; 40 US gal =
    // 151.41647136 L; 29.92 inHg = 1013.20759 hPa (exact factors, NIST SP 811 appendix B).
    const cases: [string, UnitId, UnitId, Quantity, number][] = [
      ['8000', 'ft', 'm', 'altitude', 2438.4],
      ['120', 'kt', 'm_s', 'airspeed', (120 * 1852) / 3600],
      ['2400', 'lb', 'kg', 'mass', 1088.621688],
      ['40', 'usgal', 'L', 'fuelVolume', 151.41647136],
      ['29.92', 'inHg', 'Pa', 'pressure', 101320.75888],
    ];
    for (const [text, unit, stored, q, expected] of cases) {
      const si = storedFromText(text, unit, stored);
      expect(Math.abs(si - expected) / expected).toBeLessThan(1e-14);
      expect(editableText(si, stored, unit, q)).toBe(text);
    }
  });
});

describe('demo plans for pilots hold pilot values', () => {
  it('light jet: every altitude, speed, wind, mass, distance and fuel volume is a whole number in aviation units', () => {
    // Written as pilots give them (8000 ft = 2438.4 m, 250 kt, 2800 lb, 130 NM, 66 US gal),
    // converted with the exact factors (NIST SP 811), so the boxes show them back whole.
    const pilotQuantities = new Set([
      'altitude',
      'airspeed',
      'windSpeed',
      'verticalSpeed',
      'mass',
      'fuelMass',
      'fuelVolume',
      'distance',
    ]);
    for (const name of ['light-jet'] as const) {
      const plan = examplePlan(name);
      const fields = allFields(plan).filter(
        (f): f is NumberFieldDef =>
          f.type === 'number' && f.quantity !== null && pilotQuantities.has(f.quantity ?? ''),
      );
      let checked = 0;
      for (const f of fields) {
        const v = getAtPath(plan, f.path);
        if (typeof v !== 'number' || v === 0) continue;
        // Above an 18 000 ft transition altitude (USA, from memory) altitudes read as levels.
        const rule = { transitionAltitude_m: 18_000 * 0.3048, qnh_Pa: plan.environment.qnh_Pa };
        const level = f.quantity === 'altitude' ? flightLevelBoxText(v, f.stored, rule) : null;
        const text =
          level ?? editableText(v, f.stored, UNIT_SYSTEMS.aviation[f.quantity!], f.quantity!);
        expect(text, `${name} ${f.path}`).toMatch(/^(\d+|FL\d{3})$/);
        checked++;
      }
      expect(checked).toBeGreaterThan(15);
    }
  });
});
