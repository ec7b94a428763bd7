/**
 * Unit preset, per-quantity units, number locale, transition altitude and height reference, kept between
 * sessions in the renderer's settings store (localStorage; renderer/src/support/settingsStore.ts).
 */
import { watch } from 'vue';
import type { Units, UnitSettings } from '../composables/useUnits.ts';
import { readSetting, writeSetting } from './settingsStore.ts';
import {
  cleanLocale,
  cleanOverrides,
  cleanTransitionAltitude,
  isUnitSystemId,
} from './unitSettings.ts';
import { isAltitudeReference } from './heightReference.ts';

function parseJson(text: string | null): unknown {
  if (text === null) return null;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return null;
  }
}

export function readUnitSettings(): UnitSettings {
  const saved = readSetting('units');
  const preset = isUnitSystemId(saved) ? saved : 'si';
  const settings: UnitSettings = {
    preset,
    overrides: cleanOverrides(preset, parseJson(readSetting('unitChoices'))),
    locale: cleanLocale(readSetting('numberLocale')),
  };
  const reference = readSetting('altitudeReference');
  if (isAltitudeReference(reference)) settings.altitudeReference = reference;
  const ta = cleanTransitionAltitude(readSetting('transitionAltitude_ft'));
  return ta === null ? settings : { ...settings, transitionAltitude_ft: ta };
}

/** Writes every change of the unit settings to the store. */
export function rememberUnitSettings(units: Units): void {
  watch(units.preset, (p) => writeSetting('units', p));
  watch(units.overrides, (o) =>
    writeSetting('unitChoices', Object.keys(o).length === 0 ? null : JSON.stringify(o)),
  );
  watch(units.locale, (l) => writeSetting('numberLocale', l === 'auto' ? null : l));
  watch(units.altitudeReference, (r) => writeSetting('altitudeReference', r === 'msl' ? null : r));
  watch(units.transitionAltitude_ft, (t) => writeSetting('transitionAltitude_ft', String(t)));
}
