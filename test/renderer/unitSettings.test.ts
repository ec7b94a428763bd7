import { describe, expect, it } from 'vitest';
import { formatQuantity } from '../../core/format.ts';
import { UNIT_SYSTEMS } from '../../core/units.ts';
import { createUnits } from '../../renderer/src/composables/useUnits.ts';
import {
  cleanLocale,
  cleanOverrides,
  cleanTransitionAltitude,
  effectiveUnits,
} from '../../renderer/src/support/unitSettings.ts';

describe('unit presets and per-quantity units', () => {
  it('the small-UAV preset: m, km, m/s airspeed, kt wind, kg, Wh (issue 11)', () => {
    const uav = UNIT_SYSTEMS.uav;
    expect([uav.altitude, uav.distance, uav.airspeed, uav.windSpeed, uav.mass, uav.energy]).toEqual(
      ['m', 'km', 'm_s', 'kt', 'kg', 'Wh'],
    );
    // Wind in knots as forecasts give it in aviation (common practice); SI stays SI.
    expect(UNIT_SYSTEMS.aviation.windSpeed).toBe('kt');
    expect(UNIT_SYSTEMS.si.windSpeed).toBe('m_s');
  });

  it('a choice per quantity overrides the preset; followers follow it', () => {
    const map = effectiveUnits('si', { airspeed: 'km_h', temperature: 'degF', altitude: 'ft' });
    expect(map.airspeed).toBe('km_h');
    expect(map.groundSpeed).toBe('km_h');
    expect(map.temperature).toBe('degF');
    expect(map.temperatureDelta).toBe('degF_delta');
    expect(map.altitude).toBe('ft');
    expect(map.distance).toBe('km');
  });

  it('stored choices are cleaned: unknown units, wrong dimensions and the preset unit drop out', () => {
    expect(
      cleanOverrides('si', { altitude: 'ft', mass: 'kg', distance: 'lb', energy: 'furlong' }),
    ).toEqual({
      altitude: 'ft',
    });
    expect(cleanOverrides('si', 'garbage')).toEqual({});
    expect(cleanLocale('de-DE')).toBe('de-DE');
    expect(cleanLocale(42)).toBe('auto');
    expect(cleanTransitionAltitude('5000')).toBe(5000);
    expect(cleanTransitionAltitude('50')).toBeNull();
    expect(cleanTransitionAltitude('abc')).toBeNull();
  });

  it('the screen formats with the chosen units through core/format.ts', () => {
    const u = createUnits({ preset: 'si', overrides: { altitude: 'ft' } });
    // 3048 m = 10 000 ft exactly (NIST SP 811: ft = 0.3048 m).
    expect(u.format(3048, 'altitude')).toBe(formatQuantity(3048, 'altitude', 'si', { unit: 'ft' }));
    expect(u.unitLabel('altitude')).toBe('ft');
    expect(u.unitsInWords.value).toMatch(/^altitude ft, distance km, airspeed m\/s, wind m\/s/);
    u.setUnit('altitude', 'm');
    expect(u.overrides.value).toEqual({});
    expect(u.system.value).toBe('si');
    u.setSystem('uav');
    expect(u.unitLabel('windSpeed')).toBe('kt');
  });

  it('only altitude boxes read flight levels, above the set transition altitude', () => {
    const u = createUnits({ preset: 'aviation', locale: 'en-US', transitionAltitude_ft: 6000 });
    // 6000 ft = 1828.8 m (ft = 0.3048 m exactly, NIST SP 811).
    expect(u.reading('altitude', 101_325).flightLevels?.transitionAltitude_m).toBeCloseTo(
      1828.8,
      9,
    );
    expect(u.reading('distance').flightLevels).toBeUndefined();
    expect(u.numberStyle.value.decimal).toBe('.');
    u.locale.value = 'de-DE';
    expect(u.numberStyle.value.decimal).toBe(',');
  });
});
