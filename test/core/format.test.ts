/**
 * Display formatting. Conversions rest on the exact unit definitions of NIST SP 811
 * (ft = 0.3048 m, nmi = 1852 m, kt = 1852/3600 m/s, lb = 0.45359237 kg, hp = 745.69987158227 W,
 * inHg = 3386.389 Pa); resolutions are common practice for flight planning.
 */
import { describe, expect, it } from 'vitest';
import {
  displayValue,
  formatDuration,
  formatIsaDeviation,
  formatNumber,
  formatQuantity,
  formatSignificant,
  NO_VALUE,
  unitLabel,
} from '../../core/format.ts';

describe('formatQuantity', () => {
  it('altitude to 10 ft or 1 m', () => {
    expect(formatQuantity(3048, 'altitude', 'aviation')).toBe('10000 ft'); // 10 000 ft = 3048 m exact
    expect(formatQuantity(3050, 'altitude', 'aviation')).toBe('10010 ft'); // 10 006.6 ft → nearest 10
    expect(formatQuantity(-120, 'altitude', 'aviation')).toBe('-390 ft'); // −393.7 ft
    expect(formatQuantity(2440.4, 'altitude', 'si')).toBe('2440 m');
  });

  it('distance to 0.1 NM or 0.1 km', () => {
    expect(formatQuantity(1852 * 12.34, 'distance', 'aviation')).toBe('12.3 NM'); // nmi = 1852 m exact
    expect(formatQuantity(460_000, 'distance', 'si')).toBe('460.0 km');
    // Whole units from 1000 on: a long sector reads 1872 km, not 1871.9 (common practice).
    expect(formatQuantity(1_871_900, 'distance', 'si')).toBe('1872 km');
    expect(formatQuantity(1852 * 999.94, 'distance', 'aviation')).toBe('999.9 NM');
  });

  it('speeds in kt, m/s and ft/min', () => {
    expect(formatQuantity((100 * 1852) / 3600, 'airspeed', 'aviation')).toBe('100 kt'); // kt = 1852/3600 m/s exact
    expect(formatQuantity(59.04, 'groundSpeed', 'si')).toBe('59.0 m/s');
    expect(formatQuantity(2.54, 'verticalSpeed', 'aviation')).toBe('500 ft/min'); // 2.54 m/s = 500 ft/min exact
  });

  it('masses, energy, power, pressure, ratios', () => {
    expect(formatQuantity(1200, 'mass', 'aviation')).toBe('2646 lb'); // 1200 / 0.45359237 = 2645.5
    expect(formatQuantity(11.9, 'mass', 'si')).toBe('11.9 kg');
    expect(formatQuantity(3.456, 'fuelMass', 'si')).toBe('3.46 kg');
    expect(formatQuantity(2_325_600, 'energy', 'si')).toBe('646 Wh'); // 1 Wh = 3600 J exact
    expect(formatQuantity(134_000, 'power', 'aviation')).toBe('180 hp'); // 134 kW / 745.7 W = 179.7 hp
    expect(formatQuantity(134_000, 'power', 'si')).toBe('134 kW');
    expect(formatQuantity(101_325, 'pressure', 'si')).toBe('1013 hPa');
    expect(formatQuantity(101_325, 'pressure', 'aviation')).toBe('29.92 inHg'); // 101325 / 3386.389 = 29.921
    expect(formatQuantity(0.123, 'ratio', 'si')).toBe('12.3 %');
    expect(formatQuantity(0.08, 'ratio', 'si', { signed: true })).toBe('+8.0 %');
    expect(formatQuantity(270 * (Math.PI / 180), 'angle', 'si')).toBe('270°');
  });

  it('options: explicit unit, decimals, no label', () => {
    expect(formatQuantity(1852, 'distance', 'si', { unit: 'nmi' })).toBe('1.0 NM');
    expect(formatQuantity(1000, 'distance', 'si', { withUnit: false })).toBe('1.0');
    expect(formatQuantity(1000, 'distance', 'si', { decimals: 3 })).toBe('1.000 km');
    expect(unitLabel('fuelVolume', 'aviation')).toBe('US gal');
  });

  it('time uses h:mm or m:ss unless a unit is asked for', () => {
    expect(formatQuantity(3725, 'time', 'si')).toBe('1:02 h');
    expect(formatQuantity(5400, 'time', 'si', { unit: 'h' })).toBe('1.50 h');
  });

  it('never prints NaN or Infinity', () => {
    for (const bad of [Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY]) {
      expect(formatQuantity(bad, 'altitude', 'aviation')).toBe(NO_VALUE);
      expect(formatQuantity(bad, 'time', 'si')).toBe(NO_VALUE);
      expect(formatDuration(bad)).toBe(NO_VALUE);
      expect(formatNumber(bad, 2)).toBe(NO_VALUE);
      expect(formatSignificant(bad)).toBe(NO_VALUE);
      expect(Number.isNaN(displayValue(bad, 'mass', 'si'))).toBe(true);
    }
    expect(NO_VALUE).toBe('—');
  });

  it('no negative zero after rounding', () => {
    expect(formatQuantity(-0.2, 'altitude', 'si')).toBe('0 m');
    expect(formatNumber(-0.0004, 2)).toBe('0.00');
    expect(formatDuration(-0.2)).toBe('0:00 h');
    expect(formatDuration(-0.2, { seconds: true })).toBe('0:00 min');
  });
});

describe('formatDuration', () => {
  // One format, h:mm, as a navigation log writes elapsed time (common practice); 1 h = 60 min
  // = 3600 s by definition (SI brochure, table 8).
  it('h:mm everywhere by default, rounded to the minute', () => {
    expect(formatDuration(19 * 60)).toBe('0:19 h');
    expect(formatDuration(45 * 60)).toBe('0:45 h');
    expect(formatDuration(80 * 60)).toBe('1:20 h');
    expect(formatDuration(725)).toBe('0:12 h'); // 12 min 05 s → 12 min
    expect(formatDuration(3599.6)).toBe('1:00 h');
    expect(formatDuration(3 * 3600 + 29.5 * 60)).toBe('3:30 h'); // 29.5 min rounds up
    expect(formatDuration(57 * 3600 + 13 * 60)).toBe('57:13 h'); // hours never wrap into days
    expect(formatDuration(-90 * 60)).toBe('-1:30 h');
  });

  it('m:ss under an hour where seconds matter, h:mm from an hour on', () => {
    expect(formatDuration(725, { seconds: true })).toBe('12:05 min');
    expect(formatDuration(59.6, { seconds: true })).toBe('1:00 min');
    expect(formatDuration(3599.4, { seconds: true })).toBe('59:59 min');
    expect(formatDuration(3725, { seconds: true })).toBe('1:02 h');
    expect(formatDuration(-90, { seconds: true })).toBe('-1:30 min');
  });

  it('leaves the suffix off for a column that names the format', () => {
    expect(formatDuration(80 * 60, { withUnit: false })).toBe('1:20');
    expect(formatQuantity(80 * 60, 'time', 'aviation', { withUnit: false })).toBe('1:20');
    expect(formatQuantity(65, 'time', 'si', { seconds: true, withUnit: false })).toBe('1:05');
  });
});

describe('pilot precision per quantity', () => {
  it('altitudes entered in whole feet come back as entered', () => {
    // ft = 0.3048 m exactly (1959 agreement): 8000 ft = 2438.4 m, FL-free 35 000 ft = 10 668 m.
    expect(formatQuantity(8000 * 0.3048, 'altitude', 'aviation')).toBe('8000 ft');
    expect(formatQuantity(8005 * 0.3048, 'altitude', 'aviation')).toBe('8005 ft');
    expect(formatQuantity(35000 * 0.3048, 'altitude', 'aviation')).toBe('35000 ft');
    expect(formatQuantity(2427.2, 'altitude', 'aviation')).toBe('7960 ft'); // 7963.3 ft computed → 10 ft
  });

  it('fuel to 0.1 lb below 100 lb and 1 lb from there on, 0.1 L', () => {
    // lb = 0.45359237 kg exactly.
    expect(formatQuantity(42.26 * 0.45359237, 'fuelMass', 'aviation')).toBe('42.3 lb');
    expect(formatQuantity(9.94 * 0.45359237, 'fuelMass', 'aviation')).toBe('9.9 lb');
    expect(formatQuantity(250.4 * 0.45359237, 'fuelMass', 'aviation')).toBe('250 lb');
    expect(formatQuantity(0.0123, 'fuelVolume', 'si')).toBe('12.3 L'); // 1 L = 1e-3 m³ exactly
    expect(formatQuantity(0.0123, 'fuelVolume', 'aviation')).toBe('3.2 US gal'); // 3.785411784 L
  });

  it('energy in Wh without "0.00"', () => {
    // 1 Wh = 3600 J exactly.
    expect(formatQuantity(0, 'energy', 'si')).toBe('0 Wh');
    expect(formatQuantity(0, 'energy', 'si', { withUnit: false })).toBe('0');
    expect(formatQuantity(100, 'energy', 'si')).toBe('0 Wh'); // 0.03 Wh rounds to nothing
    expect(formatQuantity(3.25 * 3600, 'energy', 'si')).toBe('3.3 Wh');
    expect(formatQuantity(143.6 * 3600, 'energy', 'aviation')).toBe('144 Wh');
  });

  it('ISA deviation always signed', () => {
    // A temperature difference of 1 °C is 1 K (ISO 80000-5); ISA ±n °C as ICAO practice.
    expect(formatIsaDeviation(5, 'aviation')).toBe('ISA +5 °C');
    expect(formatIsaDeviation(-10, 'aviation')).toBe('ISA -10 °C');
    expect(formatIsaDeviation(0, 'aviation')).toBe('ISA +0 °C');
    expect(formatIsaDeviation(2.5, 'si')).toBe('ISA +2.5 K');
    expect(formatIsaDeviation(10, 'si', 'degF_delta')).toBe('ISA +18 °F'); // 1 K = 9/5 °F
    expect(formatQuantity(5, 'temperatureDelta', 'aviation')).toBe('+5 °C');
    expect(formatQuantity(0, 'temperatureDelta', 'si')).toBe('+0 K');
    expect(formatIsaDeviation(Number.NaN, 'si')).toBe('ISA —');
  });
});

describe('flight levels above the transition altitude', () => {
  // FL = pressure altitude / 100 ft at 1013.25 hPa (ICAO Annex 2, common practice).
  const standard = { transitionAltitude_m: 18000 * 0.3048, qnh_Pa: 101_325 };
  it('reads FL350 at 35 000 ft with the standard setting', () => {
    expect(formatQuantity(35000 * 0.3048, 'altitude', 'aviation', { flightLevels: standard })).toBe(
      'FL350',
    );
    expect(formatQuantity(9000 * 0.3048, 'altitude', 'aviation', { flightLevels: standard })).toBe(
      '9000 ft',
    );
    // The level has three digits as in a flight plan; SI altitude units still give feet levels.
    const low = { transitionAltitude_m: 3000 * 0.3048, qnh_Pa: 101_325 };
    expect(formatQuantity(5000 * 0.3048, 'altitude', 'si', { flightLevels: low })).toBe('FL050');
  });

  it('corrects for the QNH: 30 hPa high is about 830 ft lower pressure altitude', () => {
    // About 27.5 ft per hPa near sea level (hypsometric rule of thumb, common practice):
    // 35 000 ft MSL with QNH 1043.25 hPa is pressure altitude ≈ 34 170 ft → FL342.
    const high = { transitionAltitude_m: 18000 * 0.3048, qnh_Pa: 104_325 };
    const text = formatQuantity(35000 * 0.3048, 'altitude', 'aviation', { flightLevels: high });
    const level = Number(text.slice(2));
    expect(level).toBeGreaterThanOrEqual(341);
    expect(level).toBeLessThanOrEqual(343);
  });
});

describe('displayValue and formatSignificant', () => {
  it('rounds to the display resolution in the display unit', () => {
    expect(displayValue(3050, 'altitude', 'aviation')).toBe(10010); // ft = 0.3048 m exact
    expect(displayValue(1852 * 12.34, 'distance', 'aviation')).toBeCloseTo(12.3, 10);
    expect(formatSignificant(14.1234)).toBe('14.1');
    expect(formatSignificant(0.45678)).toBe('0.457');
  });
});
