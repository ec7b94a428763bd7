import { describe, expect, it } from 'vitest';
import { altitudeOfPressureAltitude } from '../../core/levels.ts';
import {
  editableText,
  storedFromText,
  textShowsValue,
} from '../../renderer/src/support/fieldBinding.ts';
import {
  referencedLabel,
  referenceOf,
  referenceOffset_m,
  shownHeight_m,
  storedAltitude_m,
} from '../../renderer/src/support/heightReference.ts';
import { createUnits } from '../../renderer/src/composables/useUnits.ts';
import { PLAIN_STYLE } from '../../renderer/src/support/numberText.ts';

// The international foot is exactly 0.3048 m (NIST SP 811, B.9).
const FT_M = 0.3048;

describe('heights above the departure field (AGL)', () => {
  const elevation_m = 1000 * FT_M; // a field at 1000 ft MSL
  const offset = referenceOffset_m('agl', elevation_m);

  it('stores a typed height as the altitude MSL: typed + departure elevation', () => {
    // Definition: height AGL = altitude MSL − field elevation, so 8000 ft AGL at a 1000 ft
    // field is 9000 ft MSL = 9000 × 0.3048 m = 2743.2 m (exact factor, NIST SP 811).
    const stored = storedFromText('8000', 'ft', 'm', undefined, offset);
    expect(Math.abs(stored - 9000 * FT_M) / (9000 * FT_M)).toBeLessThan(1e-15);
    // In metres: 250 m AGL at a 304.8 m field is 554.8 m MSL (plain addition).
    const m = storedFromText('250', 'm', 'm', undefined, offset);
    expect(Math.abs(m - 554.8) / 554.8).toBeLessThan(1e-15);
    expect(storedAltitude_m(250, offset)).toBe(250 + elevation_m);
  });

  it('shows the stored altitude back as exactly the typed height', () => {
    const stored = storedFromText('8000', 'ft', 'm', undefined, offset);
    expect(editableText(shownHeight_m(stored, offset), 'm', 'ft', 'altitude')).toBe('8000');
    expect(textShowsValue('8000', stored, 'm', 'ft', undefined, offset)).toBe(true);
    // The same text read above MSL is another altitude (1000 ft lower).
    expect(textShowsValue('8000', stored, 'm', 'ft')).toBe(false);
  });

  it('MSL is unshifted; field elevations are always MSL', () => {
    expect(referenceOffset_m('msl', elevation_m)).toBe(0);
    expect(storedFromText('8000', 'ft', 'm', undefined, 0)).toBe(8000 * FT_M);
    expect(referenceOf('msl', 'agl')).toBe('msl');
    expect(referenceOf('launch', 'agl')).toBe('agl');
    expect(referencedLabel('ft', 'agl')).toBe('ft AGL');
    expect(referencedLabel('m', 'msl')).toBe('m MSL');
  });

  it('a flight level is a pressure level and is never shifted by the field elevation', () => {
    const rule = { transitionAltitude_m: 18_000 * FT_M, qnh_Pa: 101_325 };
    // FL270 = 27 000 ft pressure altitude (ICAO Doc 8168 definition of a flight level).
    const stored = storedFromText(
      'FL270',
      'ft',
      'm',
      { style: PLAIN_STYLE, flightLevels: rule },
      offset,
    );
    expect(stored).toBe(altitudeOfPressureAltitude(27_000 * FT_M, 101_325));
  });

  it('the report header names the reference of the altitudes', () => {
    const agl = createUnits({ preset: 'aviation', altitudeReference: 'agl' });
    expect(agl.unitsInWords.value).toContain('route and leg altitudes AGL');
    agl.altitudeReference.value = 'msl';
    expect(agl.unitsInWords.value).toMatch(/; altitudes MSL$/);
  });
});
