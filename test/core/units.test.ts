import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { InputError } from '../../core/errors.ts';
import {
  FPM,
  FT,
  FUEL_DENSITY_KG_L,
  G0,
  HP,
  INHG,
  KT,
  KWH,
  LB,
  LBF,
  NMI,
  STATUTE_MILE,
  UNIT_IDS,
  UNIT_SYSTEMS,
  UNITS,
  US_GAL,
  convert,
  fromSI,
  isUnitId,
  toSI,
  unitsOf,
  type UnitId,
} from '../../core/units.ts';

function expectRel(actual: number, expected: number, tol: number): void {
  const scale = Math.max(Math.abs(expected), Number.MIN_VALUE);
  expect(Math.abs(actual - expected) / scale).toBeLessThanOrEqual(tol);
}

describe('exact factors', () => {
  it('match their definitions', () => {
    // NIST SP 811 appendix B; international yard and pound agreement (1959)
    expectRel(FT, 0.3048, 1e-15);
    expectRel(FT, 12 * 0.0254, 1e-15); // ft = 12 in, 1 in = 2.54 cm exactly, NIST SP 811
    expectRel(STATUTE_MILE, 5280 * 0.3048, 1e-15); // mile = 5280 ft, NIST SP 811
    expectRel(NMI, 1852, 1e-15); // international nautical mile, NIST SP 811
    expectRel(KT, 1852 / 3600, 1e-15); // knot = 1 nmi/h, NIST SP 811
    expectRel(FPM, 0.00508, 1e-15); // ft/min = 5.08E-03 m/s, NIST SP 811
    expectRel(LB, 0.45359237, 1e-15); // pound (avoirdupois), 1959 agreement
    expectRel(G0, 9.80665, 1e-15); // standard gravity, 3rd CGPM, NIST SP 811
    expectRel(LBF, 4.4482216152605, 1e-14); // NIST SP 811: lbf = 4.448222E+00 N (exact 4.4482216152605)
    expectRel(US_GAL, 231 * Math.pow(0.0254, 3), 1e-14); // US gallon = 231 in³, NIST SP 811
    expectRel(HP, 745.69987158227, 1e-13); // hp = 550 ft·lbf/s = 7.456999E+02 W, NIST SP 811
    expectRel(KWH, 3.6e6, 1e-15); // kWh = 3.6 MJ, NIST SP 811
    expectRel(INHG, 3386.389, 1e-15); // conventional inch of mercury, NIST SP 811: 3.386389E+03 Pa
  });

  it('derive the fuel-consumption factors quoted in REFERENCES.md', () => {
    // 1 lb/(lbf·h) = 28.3255 mg/(N·s): derived from NIST SP 811 factors (REFERENCES.md)
    expectRel(toSI(1, 'lb_lbfh'), 28.3255e-6, 2e-6);
    expectRel(convert(1, 'lb_lbfh', 'g_kNs'), 28.3255, 2e-6);
    // 1 lb/(hp·h) = 608.277 g/kWh: derived from NIST SP 811 factors (REFERENCES.md)
    expectRel(convert(1, 'lb_hph', 'g_kWh'), 608.277, 1e-6);
  });

  it('convert the trade units a pilot meets', () => {
    expectRel(convert(1, 'nmi', 'ft'), 1852 / 0.3048, 1e-15); // exact definitions, NIST SP 811
    expectRel(convert(100, 'kt', 'km_h'), 185.2, 1e-15); // 1 kt = 1.852 km/h exactly
    expectRel(convert(1000, 'ft_min', 'm_s'), 5.08, 1e-15); // 1 ft/min = 0.00508 m/s exactly
    expectRel(convert(29.92, 'inHg', 'hPa'), 1013.20759, 1e-8); // 29.92 × 33.86389, NIST SP 811
    expectRel(convert(1, 'usgal', 'L'), 3.785411784, 1e-15); // NIST SP 811
    expectRel(convert(1, 'ft2', 'm2'), 0.09290304, 1e-15); // 0.3048², NIST SP 811
    expectRel(convert(180, 'deg', 'rad'), Math.PI, 1e-15); // definition of the degree
    expectRel(convert(1, 'kg_L', 'lb_usgal'), 3.785411784 / 0.45359237, 1e-14); // NIST SP 811
    expectRel(convert(5000, 'mAh', 'Ah'), 5, 1e-15); // SI prefixes
    expectRel(convert(200, 'Wh_kg', 'J_kg'), 720000, 1e-15); // 1 Wh = 3600 J
    expectRel(convert(50, 'percent', 'fraction'), 0.5, 1e-15); // definition of percent
  });
});

describe('temperatures', () => {
  it('convert absolute temperatures exactly', () => {
    expectRel(toSI(0, 'degC'), 273.15, 1e-15); // ITS-90 / NIST SP 811: T(K) = t(°C) + 273.15
    expectRel(toSI(32, 'degF'), 273.15, 1e-15); // NIST SP 811: T(K) = (t(°F) + 459.67)/1.8
    expectRel(toSI(212, 'degF'), 373.15, 1e-15); // NIST SP 811, same relation
    expectRel(convert(-40, 'degC', 'degF'), -40, 1e-14); // the two scales cross at −40, NIST SP 811
    expectRel(fromSI(288.15, 'degC'), 15, 1e-13); // ISA sea-level temperature, 1976 standard
    expect(toSI(-459.67, 'degF')).toBeGreaterThanOrEqual(0); // absolute zero, NIST SP 811
  });

  it('treat an ISA offset as a difference, without the 273.15 offset', () => {
    expectRel(toSI(10, 'degC_delta'), 10, 1e-15); // a 1 °C step is a 1 K step, NIST SP 811
    expectRel(toSI(18, 'degF_delta'), 10, 1e-15); // a 1 °F step is 5/9 K, NIST SP 811
    expectRel(convert(10, 'K_delta', 'degF_delta'), 18, 1e-15); // NIST SP 811
  });

  it('refuse temperatures below absolute zero', () => {
    expect(() => toSI(-300, 'degC', 'oat')).toThrow(InputError);
    expect(() => toSI(-1, 'K')).toThrow(/absolute zero/);
  });
});

describe('errors', () => {
  it('refuse conversions between dimensions', () => {
    expect(() => convert(1, 'kg', 'm')).toThrow(InputError);
    expect(() => convert(1, 'K', 'K_delta')).toThrow(InputError);
    expect(() => convert(1, 'N', 'lb')).toThrow(/force/);
  });

  it('refuse non-finite values and unknown units, naming the field', () => {
    for (const bad of [Number.NaN, Infinity, -Infinity]) {
      expect(() => toSI(bad, 'm', 'legs.0.distance')).toThrow(/legs\.0\.distance/);
      expect(() => fromSI(bad, 'ft')).toThrow(InputError);
      expect(() => convert(bad, 'm', 'm')).toThrow(InputError);
    }
    expect(() => toSI(1, 'furlong' as UnitId)).toThrow(InputError);
    expect(isUnitId('kt')).toBe(true);
    expect(isUnitId('toString')).toBe(false);
  });
});

describe('unit table and systems', () => {
  it('has at least the SI unit (factor 1, no offset) in every dimension', () => {
    const dims = new Set(UNIT_IDS.map((u) => UNITS[u].dimension));
    for (const d of dims) {
      expect(unitsOf(d).some((u) => UNITS[u].factor === 1 && !UNITS[u].offset)).toBe(true);
    }
  });

  it('maps each display quantity to units of one dimension in both systems', () => {
    const si = UNIT_SYSTEMS.si;
    const aviation = UNIT_SYSTEMS.aviation;
    for (const q of Object.keys(si) as (keyof typeof si)[]) {
      expect(UNITS[si[q]].dimension).toBe(UNITS[aviation[q]].dimension);
    }
    expect(aviation.airspeed).toBe('kt');
    expect(aviation.altitude).toBe('ft');
    expect(si.airspeed).toBe('m_s');
  });

  it('lists typical fuel densities in a plausible band', () => {
    // common practice: liquid aviation and diesel fuels lie between 0.68 and 0.86 kg/L
    for (const rho of Object.values(FUEL_DENSITY_KG_L)) {
      expect(rho).toBeGreaterThan(0.68);
      expect(rho).toBeLessThan(0.86);
    }
  });
});

describe('round trips (property)', () => {
  it('toSI then fromSI returns the value to 1e-12 for every unit', () => {
    const unit = fc.constantFrom(...UNIT_IDS);
    // subnormal numbers lose digits in any multiplication; they are not quantities
    const value = fc
      .double({ min: -1e9, max: 1e9, noNaN: true })
      .filter((v) => v === 0 || Math.abs(v) > 1e-200);
    fc.assert(
      fc.property(unit, value, (u, v) => {
        const def = UNITS[u];
        // absolute temperatures must stay above 0 K; the offset sets the precision floor
        const zero = -(def.offset ?? 0) / def.factor;
        const x = def.dimension === 'temperature' ? Math.max(v, zero) : v;
        const back = fromSI(toSI(x, u), u);
        const scale = Math.max(Math.abs(x), Math.abs(zero), Number.MIN_VALUE);
        // exact definitions (NIST SP 811) leave only floating-point rounding
        expect(Math.abs(back - x) / scale).toBeLessThanOrEqual(1e-12);
      }),
      { numRuns: 2000 },
    );
  });

  it('convert a→b→a is lossless to 1e-12 within each dimension', () => {
    const pair = fc
      .tuple(fc.constantFrom(...UNIT_IDS), fc.constantFrom(...UNIT_IDS))
      .filter(([a, b]) => UNITS[a].dimension === UNITS[b].dimension);
    fc.assert(
      fc.property(pair, fc.double({ min: 1e-6, max: 1e6, noNaN: true }), ([a, b], v) => {
        const back = convert(convert(v, a, b), b, a);
        // an offset (°C, °F: up to 460 degrees) sets the floor of absolute precision
        const hasOffset = UNITS[a].offset !== undefined || UNITS[b].offset !== undefined;
        const scale = hasOffset ? Math.max(v, 1000) : v;
        // exact definitions (NIST SP 811) leave only floating-point rounding
        expect(Math.abs(back - v) / scale).toBeLessThanOrEqual(1e-12);
      }),
      { numRuns: 1000 },
    );
  });
});
