/**
 * What the screen shows values in: a unit preset (SI, aviation, small UAV) with a unit chosen
 * per quantity on top, the locale of typed numbers, and the transition altitude above which
 * altitudes may be typed as flight levels. The plan never changes with any of them: fields
 * convert what they show from the stored SI value and convert what is typed back.
 * All number text on screen goes through `format` (core/format.ts).
 */
import { computed, inject, ref, type ComputedRef, type InjectionKey, type Ref } from 'vue';
import { STANDARD_SETTING_PA, type FlightLevelRule } from '../../../core/levels.ts';
import {
  convert,
  FT,
  UNITS,
  type Quantity,
  type UnitId,
  type UnitMap,
  type UnitSystem,
  type UnitSystemId,
} from '../../../core/units.ts';
import {
  displayValue,
  formatQuantity,
  formatSignificant,
  type FormatOptions,
} from '../../../core/format.ts';
import { numberStyle, type NumberStyle } from '../support/numberText.ts';
import type { TextReading } from '../support/fieldBinding.ts';
import { isAltitudeReference, type AltitudeReference } from '../support/heightReference.ts';
import {
  CHOOSABLE,
  cleanLocale,
  cleanOverrides,
  DEFAULT_TRANSITION_ALTITUDE_FT,
  effectiveUnits,
  UNIT_PRESET_NAMES,
  type UnitOverrides,
} from '../support/unitSettings.ts';

export { isUnitSystemId } from '../support/unitSettings.ts';

export interface UnitSettings {
  preset: UnitSystemId;
  overrides?: UnitOverrides;
  /** "auto" (the browser's language) or a BCP 47 tag. */
  locale?: string;
  transitionAltitude_ft?: number;
  /** Route and leg altitudes shown above MSL or above the departure field. */
  altitudeReference?: AltitudeReference;
}

export interface Units {
  /** The preset chosen. */
  readonly preset: Ref<UnitSystemId>;
  /** Units chosen per quantity that differ from the preset. */
  readonly overrides: Ref<UnitOverrides>;
  /** What core's formatters get: the preset, or the per-quantity map when one is set. */
  readonly system: ComputedRef<UnitSystem>;
  readonly systemName: ComputedRef<string>;
  /** Every choosable quantity with its unit, for the report header ("altitude ft, …"). */
  readonly unitsInWords: ComputedRef<string>;
  /** "auto" or a BCP 47 tag; `numberStyle` holds the marks it stands for. */
  readonly locale: Ref<string>;
  readonly numberStyle: ComputedRef<NumberStyle>;
  readonly transitionAltitude_ft: Ref<number>;
  /** 'agl': route and leg altitude boxes show heights above the departure field. */
  readonly altitudeReference: Ref<AltitudeReference>;
  unitFor(quantity: Quantity): UnitId;
  unitLabel(quantity: Quantity): string;
  /** How a box showing `quantity` reads typed text (altitudes: flight levels with this QNH). */
  reading(quantity: Quantity | null, qnh_Pa?: number): TextReading;
  /** Flight levels above the transition altitude set, with the plan's QNH (core/levels.ts). */
  flightLevelRule(qnh_Pa: number): FlightLevelRule;
  /** A stored value (in `stored`) as a number in the display unit of `quantity`. */
  toDisplay(value: number, stored: UnitId, quantity: Quantity): number;
  /** A number in the display unit of `quantity` back into `stored`. */
  fromDisplay(value: number, stored: UnitId, quantity: Quantity): number;
  /** SI value → text with unit in the current system. */
  format(value_si: number, quantity: Quantity, opts?: FormatOptions): string;
  /** SI value → number at display resolution in the current system (CSV, chart axes). */
  value(value_si: number, quantity: Quantity, opts?: FormatOptions): number;
  /** A plain coefficient (CL, L/D) to `sig` significant digits. */
  plain(value: number, sig?: number): string;
  /** Chooses a preset; per-quantity choices are cleared. */
  setSystem(system: UnitSystemId): void;
  /** Chooses the unit of one quantity (the preset's unit clears the choice). */
  setUnit(quantity: Quantity, unit: UnitId): void;
}

/** The preset names (kept under their old name for callers). */
export const UNIT_SYSTEM_NAMES = UNIT_PRESET_NAMES;

function browserLocale(): string {
  return typeof navigator !== 'undefined' && navigator.language ? navigator.language : 'en-US';
}

export function createUnits(initial: UnitSystemId | UnitSettings = 'si'): Units {
  const settings: UnitSettings = typeof initial === 'string' ? { preset: initial } : initial;
  const preset = ref<UnitSystemId>(settings.preset);
  const overrides = ref<UnitOverrides>(cleanOverrides(settings.preset, settings.overrides));
  const locale = ref(cleanLocale(settings.locale));
  const transitionAltitude_ft = ref(
    settings.transitionAltitude_ft ?? DEFAULT_TRANSITION_ALTITUDE_FT,
  );
  const altitudeReference = ref<AltitudeReference>(
    isAltitudeReference(settings.altitudeReference) ? settings.altitudeReference : 'msl',
  );
  const map = computed<UnitMap>(() => effectiveUnits(preset.value, overrides.value));
  const system = computed<UnitSystem>(() =>
    Object.keys(overrides.value).length === 0 ? preset.value : map.value,
  );
  const style = computed(() =>
    numberStyle(locale.value === 'auto' ? browserLocale() : locale.value),
  );
  const unitFor = (q: Quantity): UnitId => map.value[q];
  const flightLevelRule = (qnh_Pa: number): FlightLevelRule => ({
    transitionAltitude_m: transitionAltitude_ft.value * FT,
    qnh_Pa: Number.isFinite(qnh_Pa) ? qnh_Pa : STANDARD_SETTING_PA,
  });
  return {
    preset,
    overrides,
    system,
    systemName: computed(() =>
      Object.keys(overrides.value).length === 0
        ? UNIT_PRESET_NAMES[preset.value]
        : `${UNIT_PRESET_NAMES[preset.value]}, own choices`,
    ),
    unitsInWords: computed(
      () =>
        CHOOSABLE.map((c) => `${c.label.toLowerCase()} ${UNITS[map.value[c.quantity]].label}`).join(
          ', ',
        ) +
        (altitudeReference.value === 'agl'
          ? '; route and leg altitudes AGL (above the departure field), others MSL'
          : '; altitudes MSL'),
    ),
    locale,
    numberStyle: style,
    transitionAltitude_ft,
    altitudeReference,
    unitFor,
    unitLabel: (q) => UNITS[unitFor(q)].label,
    reading: (q, qnh_Pa = STANDARD_SETTING_PA) =>
      q === 'altitude'
        ? { style: style.value, flightLevels: flightLevelRule(qnh_Pa) }
        : { style: style.value },
    flightLevelRule,
    toDisplay: (value, stored, q) => convert(value, stored, unitFor(q)),
    fromDisplay: (value, stored, q) => convert(value, unitFor(q), stored),
    format: (v, q, opts) => formatQuantity(v, q, system.value, opts),
    value: (v, q, opts) => displayValue(v, q, system.value, opts),
    plain: (v, sig = 3) => formatSignificant(v, sig),
    setSystem: (s) => {
      preset.value = s;
      overrides.value = {};
    },
    setUnit: (q, unit) => {
      overrides.value = cleanOverrides(preset.value, { ...overrides.value, [q]: unit });
    },
  };
}

export const UNITS_KEY: InjectionKey<Units> = Symbol('units');

export function useUnits(): Units {
  const units = inject(UNITS_KEY);
  if (!units) throw new Error('useUnits() needs the unit system provided by the app');
  return units;
}
