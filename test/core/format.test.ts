/**
 * Display formatting. Conversions rest on the exact unit definitions of NIST SP 811
 * (ft = 0.3048 m, nmi = 1852 m, kt = 1852/3600 m/s, lb = 0.45359237 kg, hp = 745.69987158227 W,
 * inHg = 3386.389 Pa); resolutions are common practice for flight planning.
 */
import { describe, expect, it } from 'vitest';
import {
  displayValue,
  formatDuration,
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
    expect(formatDuration(-0.2)).toBe('0:00 min');
  });
});

describe('formatDuration', () => {
  it('m:ss below an hour, h:mm from an hour on', () => {
    expect(formatDuration(725)).toBe('12:05 min');
    expect(formatDuration(59.6)).toBe('1:00 min');
    expect(formatDuration(3599.6)).toBe('1:00 h');
    expect(formatDuration(3 * 3600 + 29.5 * 60)).toBe('3:30 h');
    expect(formatDuration(-90)).toBe('-1:30 min');
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
