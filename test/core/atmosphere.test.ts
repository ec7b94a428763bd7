import { describe, expect, it } from 'vitest';
import {
  LAYERS,
  MAX_GEOPOTENTIAL_M,
  atmosphereAt,
  densityAltitude,
  dynamicViscosity,
  geometricFromGeopotential,
  geopotentialFromGeometric,
  pressureAltitudeFromPressure,
  pressureAltitudeFromQnh,
  speedOfSound,
  standardAtmosphere,
} from '../../core/atmosphere.ts';
import { InputError } from '../../core/errors.ts';

function expectRel(actual: number, expected: number, tol: number): void {
  expect(Math.abs(actual - expected) / Math.abs(expected)).toBeLessThanOrEqual(tol);
}

/** Agrees with a printed value to its last digit: within half a unit in the last place. */
function expectPrinted(actual: number, printed: string): void {
  const [mantissa = '', exponent = '0'] = printed.toLowerCase().split('e');
  const decimals = mantissa.includes('.') ? (mantissa.split('.')[1] ?? '').length : 0;
  const halfUnit = 0.5 * Math.pow(10, Number(exponent) - decimals);
  expect(Math.abs(actual - Number(printed))).toBeLessThanOrEqual(halfUnit * (1 + 1e-9));
}

function expectInputError(fn: () => unknown, field: string): void {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    expect((e as InputError).field).toBe(field);
    return;
  }
  throw new Error(`expected InputError on ${field}`);
}

// REFERENCES.md table: 1976 U.S. Standard Atmosphere (= ICAO below 32 km), geopotential rows.
// [H m, T K, p Pa, rho kg/m³, a m/s, mu Pa·s or '']
const TABLE: readonly (readonly [number, string, string, string, string, string])[] = [
  [0, '288.150', '101325', '1.22500', '340.294', '1.7894e-5'],
  [1000, '281.650', '89874.6', '1.11164', '336.434', ''],
  [2000, '275.150', '79495.2', '1.00649', '332.529', ''],
  [5000, '255.650', '54019.9', '0.736116', '320.529', ''],
  [11000, '216.650', '22632.0', '0.363918', '295.070', '1.4216e-5'],
  [15000, '216.650', '12044.6', '0.193674', '295.070', '1.4216e-5'],
  [20000, '216.650', '5474.89', '0.0880349', '295.070', '1.4216e-5'],
  [32000, '228.650', '868.014', '0.0132249', '303.131', '1.4868e-5'],
];

describe('1976 U.S. Standard Atmosphere, layers 0–3 (REFERENCES.md table)', () => {
  for (const [H, T, p, rho, a, mu] of TABLE) {
    it(`matches the table at H = ${H} m`, () => {
      const s = standardAtmosphere(H);
      expectRel(s.T_K, Number(T), 1e-6); // 1976 U.S. Standard Atmosphere, via REFERENCES.md
      expectRel(s.p_Pa, Number(p), 1e-5); // same table
      expectRel(s.rho_kg_m3, Number(rho), 1e-5); // same table
      // same table; 6 printed digits, one unit in the last place (≤ 3.1e-6; 320.529 is cut, not rounded)
      expectRel(s.a_m_s, Number(a), 3.2e-6);
      if (mu) expectPrinted(s.mu_Pa_s, mu); // same table, to its printed digits
      expectRel(s.theta * 288.15, s.T_K, 1e-15); // definition of θ = T/T0
      expectRel(s.delta * 101325, s.p_Pa, 1e-15); // definition of δ = p/p0
    });
  }

  it('matches the geometric-altitude rows (z = 1000 m and 2000 m)', () => {
    const z1 = standardAtmosphere(geopotentialFromGeometric(1000));
    expectPrinted(z1.T_K, '281.651'); // 1976 U.S. Standard Atmosphere, geometric table, REFERENCES.md
    expectPrinted(z1.p_Pa, '89876.3'); // same
    expectPrinted(z1.rho_kg_m3, '1.11166'); // same
    const z2 = standardAtmosphere(geopotentialFromGeometric(2000));
    expectPrinted(z2.p_Pa, '79501.4'); // same
    expectPrinted(z2.rho_kg_m3, '1.00655'); // same
    expectPrinted(z2.mu_Pa_s, '1.7260e-5'); // same (geometric 2 km row)
  });
});

describe('1976 U.S. Standard Atmosphere, layers 4–6 and the top', () => {
  // U.S. Standard Atmosphere 1976, Table 4 base pressures as listed in REFERENCES.md
  const BASES: readonly (readonly [number, string, number])[] = [
    [11000, '22632.06', 216.65],
    [20000, '5474.889', 216.65],
    [32000, '868.0187', 228.65],
    [47000, '110.9063', 270.65],
    [51000, '66.93887', 270.65],
    [71000, '3.956420', 214.65],
    [84852, '0.3733836', 186.946],
  ];
  for (const [H, p, T] of BASES) {
    it(`reproduces the base pressure at H = ${H} m to its printed digits`, () => {
      const s = standardAtmosphere(H);
      expectPrinted(s.p_Pa, p); // Table 4 base pressure, 1976 standard (REFERENCES.md)
      // base temperature (molecular-scale; kinetic equals it below 80 km), Table 4
      const TM = s.a_m_s ** 2 / (1.4 * (8314.32 / 28.9644));
      expectRel(TM, T, 1e-6);
      // inverse: the printed base pressure lies within 2 mm of the base height, same table
      expectRel(pressureAltitudeFromPressure(Number(p)), H, 1e-6);
    });
  }

  it('applies the molecular-weight fall above 80 km to the kinetic temperature', () => {
    const top = standardAtmosphere(geopotentialFromGeometric(86000));
    // 1976 U.S. Standard Atmosphere at 86 km: T = 186.87 K, rho = 6.958e-6 kg/m³, a = 274.10 m/s
    // (from memory; T = 186.946 K × M/M0 0.999579 from the standard's Table 8)
    expectPrinted(top.T_K, '186.87');
    expectPrinted(top.rho_kg_m3, '6.958e-6');
    expectPrinted(top.a_m_s, '274.10');
    // below 80 km geometric M/M0 = 1, so kinetic = molecular-scale temperature (1976 standard)
    const at79 = standardAtmosphere(geopotentialFromGeometric(79000));
    expectRel(at79.T_K, 214.65 - 0.002 * (geopotentialFromGeometric(79000) - 71000), 1e-12);
  });

  it('is continuous across every layer boundary', () => {
    for (const layer of LAYERS.slice(1)) {
      const below = standardAtmosphere(layer.H_m - 1e-7);
      const at = standardAtmosphere(layer.H_m);
      // hydrostatic equation: p changes by ρ·g·ΔH ≈ 1e-7 relative per 10 m at most (computed)
      expectRel(below.p_Pa, at.p_Pa, 1e-10);
      expectRel(below.rho_kg_m3, at.rho_kg_m3, 1e-9);
    }
  });
});

describe('geopotential and geometric height', () => {
  it('converts the pairs listed in REFERENCES.md (H = r0·z/(r0 + z), 1976 standard)', () => {
    expectPrinted(geometricFromGeopotential(11000), '11019.07'); // REFERENCES.md, computed
    expectPrinted(geometricFromGeopotential(20000), '20063.12'); // same
    expectPrinted(geometricFromGeopotential(32000), '32161.90'); // same
    expectPrinted(geopotentialFromGeometric(86000), '84852.05'); // same
    expectRel(MAX_GEOPOTENTIAL_M, 84852.05, 1e-7); // top of the 1976 standard's lower part
  });
});

describe('ISA + ΔT at a pressure altitude (common practice)', () => {
  it('matches the computed checks in REFERENCES.md', () => {
    const a = atmosphereAt(0, 15);
    expectRel(a.rho_kg_m3, 1.16439, 1e-5); // REFERENCES.md, computed: p0/(R·303.15)
    expectRel(a.a_m_s, 349.039, 1e-6); // REFERENCES.md, computed: √(γ·R·303.15)
    expectRel(a.p_Pa, 101325, 1e-15); // pressure unchanged at a pressure altitude
    expectRel(atmosphereAt(5000, 20).rho_kg_m3, 0.682706, 1e-5); // REFERENCES.md, computed
    expectRel(atmosphereAt(11000, -10).rho_kg_m3, 0.381528, 1e-5); // REFERENCES.md, computed
  });

  it('equals the standard day when ΔT = 0', () => {
    for (const H of [-3000, 0, 8000, 25000, 60000, 84000]) {
      const a = atmosphereAt(H, 0);
      const s = standardAtmosphere(H);
      expectRel(a.rho_kg_m3, s.rho_kg_m3, 1e-15); // same model, same numbers
      expectRel(a.mu_Pa_s, s.mu_Pa_s, 1e-15);
    }
  });

  it('takes μ and a from the shifted temperature', () => {
    const hot = atmosphereAt(3000, 25);
    // Sutherland's law and √(γRT) at the actual temperature (common practice)
    expectRel(hot.mu_Pa_s, dynamicViscosity(hot.T_K), 1e-15);
    expectRel(hot.a_m_s, speedOfSound(hot.T_K), 1e-15);
    expectRel(hot.T_K, 288.15 - 19.5 + 25, 1e-12); // 1976 standard lapse −6.5 K/km
  });
});

describe('inverse heights', () => {
  it('gives the pressure altitude of an aerodrome from QNH', () => {
    // standard QNH: pressure altitude equals elevation (definition of the standard)
    expectRel(pressureAltitudeFromQnh(500, 101325), 500, 1e-12);
    // hydrostatic equation near sea level: dH/dp = −R·T0/(g0·p0) ≈ −0.0832 m/Pa (computed)
    const dHdp = -(287.0531 * 288.15) / (9.80665 * 101325);
    expectRel(pressureAltitudeFromQnh(300, 102325) - 300, dHdp * 1000, 1e-2);
    expectRel(pressureAltitudeFromQnh(300, 100325) - 300, -dHdp * 1000, 1e-2);
  });

  it('gives the density altitude of a hot day (≈ 120 ft per °C, common practice)', () => {
    const da = densityAltitude(atmosphereAt(0, 15).rho_kg_m3);
    expectRel(da, 15 * 120 * 0.3048, 0.1); // rule of thumb, common practice
    // 1976 standard ρ0 = 1.2250 kg/m³ (printed to 5 digits, ±0.4 m of height) sits at 0 m
    expect(Math.abs(densityAltitude(1.225))).toBeLessThan(0.05);
  });
});

describe('refusals name their field', () => {
  it('refuses altitudes outside −5 km … 86 km geometric', () => {
    expectInputError(() => standardAtmosphere(90000), 'altitude_m');
    expectInputError(() => standardAtmosphere(-6000, 'legs.1.altitude_m'), 'legs.1.altitude_m');
    expectInputError(() => standardAtmosphere(Number.NaN), 'altitude_m');
    expectInputError(() => atmosphereAt(85000), 'pressureAltitude_m');
    expectInputError(
      () => atmosphereAt(-9000, 0, { altitude: 'cruise.altitude' }),
      'cruise.altitude',
    );
  });

  it('refuses impossible ISA offsets and inverse inputs', () => {
    expectInputError(() => atmosphereAt(1000, 90), 'isaOffset_K');
    expectInputError(() => atmosphereAt(1000, -100, { isaOffset: 'isaDelta' }), 'isaDelta');
    expectInputError(() => atmosphereAt(1000, Infinity), 'isaOffset_K');
    expectInputError(() => pressureAltitudeFromPressure(0), 'pressure_Pa');
    expectInputError(() => pressureAltitudeFromPressure(2e5), 'pressure_Pa');
    expectInputError(() => pressureAltitudeFromQnh(100, 29.92), 'qnh_Pa');
    expectInputError(() => densityAltitude(-1), 'density_kg_m3');
    expectInputError(() => speedOfSound(0), 'temperature_K');
    expectInputError(() => dynamicViscosity(Number.NaN), 'temperature_K');
  });
});
