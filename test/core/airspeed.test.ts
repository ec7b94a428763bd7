import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  SPEED_KINDS,
  casFromEas,
  casFromTas,
  easFromCas,
  easFromTas,
  fromTas,
  machFromTas,
  tasFromCas,
  tasFromEas,
  tasFromMach,
  toTas,
} from '../../core/airspeed.ts';
import { atmosphereAt, standardAtmosphere } from '../../core/atmosphere.ts';
import { InputError } from '../../core/errors.ts';

function expectRel(actual: number, expected: number, tol: number): void {
  expect(Math.abs(actual - expected) / Math.abs(expected)).toBeLessThanOrEqual(tol);
}

function expectInputError(fn: () => unknown, field: string, limit?: RegExp): void {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    expect((e as InputError).field).toBe(field);
    if (limit) expect((e as InputError).limit).toMatch(limit);
    return;
  }
  throw new Error(`expected InputError on ${field}`);
}

const seaLevel = atmosphereAt(0);

describe('sea-level standard day', () => {
  it('has CAS = EAS = TAS (definition of CAS and EAS)', () => {
    for (const tas of [0, 10, 50, 120, 250, 330]) {
      // CAS and EAS are defined to equal TAS at sea-level standard (Anderson, Introduction to Flight, ch. 4)
      if (tas === 0) {
        expect(casFromTas(0, seaLevel)).toBe(0);
        continue;
      }
      expectRel(casFromTas(tas, seaLevel), tas, 1e-13);
      expectRel(easFromTas(tas, seaLevel), tas, 1e-15);
      expectRel(tasFromCas(tas, seaLevel), tas, 1e-13);
    }
  });
});

describe('10 000 m ISA, Mach 0.8: independent computation', () => {
  it('agrees with the pitot relations written out in full', () => {
    // Anderson, Introduction to Flight, ch. 4, isentropic pitot relation; constants of the
    // 1976 U.S. Standard Atmosphere; written here with plain Math.pow, independently of core.
    const R = 8314.32 / 28.9644;
    const g0 = 9.80665;
    const T = 288.15 - 0.0065 * 10000;
    const p = 101325 * Math.pow(T / 288.15, g0 / (R * 0.0065));
    const rho = p / (R * T);
    const a = Math.sqrt(1.4 * R * T);
    const a0 = Math.sqrt(1.4 * R * 288.15);
    const tas = 0.8 * a;
    const qc = p * (Math.pow(1 + 0.2 * 0.8 * 0.8, 3.5) - 1);
    const cas = a0 * Math.sqrt(5 * (Math.pow(qc / 101325 + 1, 2 / 7) - 1));
    const eas = tas * Math.sqrt(rho / (101325 / (R * 288.15)));

    const atm = standardAtmosphere(10000);
    expectRel(tasFromMach(0.8, atm), tas, 1e-12);
    expectRel(casFromTas(tas, atm), cas, 1e-12);
    expectRel(easFromTas(tas, atm), eas, 1e-12);
    expectRel(machFromTas(tas, atm), 0.8, 1e-14);
    // magnitude check (computed above; ≈ 240 m/s TAS, ≈ 150 m/s CAS, common practice for M0.8 at FL330)
    expect(tas).toBeGreaterThan(235);
    expect(tas).toBeLessThan(245);
    expect(cas).toBeGreaterThan(140);
    expect(cas).toBeLessThan(160);
  });
});

describe('round trips and the compressibility correction (property)', () => {
  const altitude = fc.double({ min: 0, max: 15000, noNaN: true });
  const mach = fc.double({ min: 0.05, max: 0.95, noNaN: true });

  it('TAS → CAS → TAS and TAS → EAS → TAS to 1e-12', () => {
    fc.assert(
      fc.property(altitude, mach, (H, M) => {
        const atm = atmosphereAt(H);
        const tas = tasFromMach(M, atm);
        // exact algebraic inverses: rounding only
        expectRel(tasFromCas(casFromTas(tas, atm), atm), tas, 1e-12);
        expectRel(tasFromEas(easFromTas(tas, atm), atm), tas, 1e-12);
        const eas = easFromTas(tas, atm);
        expectRel(easFromCas(casFromEas(eas, atm), atm), eas, 1e-12);
      }),
      { numRuns: 1000 },
    );
  });

  it('every speed kind survives toTas(fromTas(…)), also on ISA+ΔT days', () => {
    const dT = fc.double({ min: -30, max: 30, noNaN: true });
    fc.assert(
      fc.property(altitude, mach, dT, fc.constantFrom(...SPEED_KINDS), (H, M, t, kind) => {
        const atm = atmosphereAt(H, t);
        const tas = M * atm.a_m_s;
        expectRel(toTas(kind, fromTas(kind, tas, atm), atm), tas, 1e-12); // exact inverses
      }),
      { numRuns: 1000 },
    );
  });

  it('CAS exceeds EAS above sea level (compressibility correction sign, common practice)', () => {
    const aloft = fc.double({ min: 100, max: 15000, noNaN: true });
    fc.assert(
      fc.property(aloft, mach, (H, M) => {
        const atm = atmosphereAt(H);
        const tas = tasFromMach(M, atm);
        expect(casFromTas(tas, atm)).toBeGreaterThan(easFromTas(tas, atm));
      }),
    );
  });

  it('CAS → EAS as Mach → 0 (incompressible limit of the pitot relation)', () => {
    const atm = atmosphereAt(8000);
    const tas = tasFromMach(0.01, atm);
    // series of the pitot relation: CAS/EAS − 1 = O(M²) ≈ 1e-5 at M 0.01 (computed)
    expectRel(casFromTas(tas, atm), easFromTas(tas, atm), 1e-4);
  });
});

describe('refusals', () => {
  it('refuses Mach 1 and above with field and limit', () => {
    expectInputError(() => tasFromMach(1, seaLevel), 'mach', /subsonic \(Mach < 1\)/);
    expectInputError(() => machFromTas(400, seaLevel), 'airspeed_m_s', /subsonic/);
    // CAS 300 m/s at 11 km would be about Mach 1.55 (pitot relation, computed)
    expectInputError(() => tasFromCas(300, atmosphereAt(11000)), 'airspeed_m_s', /subsonic/);
    expectInputError(() => tasFromCas(341, seaLevel), 'airspeed_m_s', /subsonic/);
    expectInputError(() => tasFromEas(200, atmosphereAt(15000)), 'airspeed_m_s', /subsonic/);
    // 5 km below standard sea level, Mach 0.99 needs a CAS above a0 (subsonic form fails)
    const deep = atmosphereAt(-5000);
    expectInputError(() => casFromTas(0.99 * deep.a_m_s, deep), 'airspeed_m_s', /subsonic/);
  });

  it('refuses negative and non-finite speeds, naming the field', () => {
    expectInputError(() => casFromTas(-1, seaLevel, 'legs.3.speed'), 'legs.3.speed');
    expectInputError(() => tasFromEas(Number.NaN, seaLevel), 'airspeed_m_s');
    expectInputError(() => tasFromMach(-0.1, seaLevel), 'mach');
    expectInputError(() => toTas('cas', Infinity, seaLevel), 'airspeed_m_s');
    expectInputError(() => toTas('knots' as 'tas', 50, seaLevel), 'speedKind');
  });
});
