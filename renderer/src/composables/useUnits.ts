/**
 * The unit system the screen shows (SI or aviation). The plan never changes with it:
 * fields convert what they show from the stored SI value and convert what is typed back.
 * All number text on screen goes through `format` (core/format.ts).
 */
import { computed, inject, ref, type ComputedRef, type InjectionKey, type Ref } from 'vue';
import {
  convert,
  UNITS,
  UNIT_SYSTEMS,
  type Quantity,
  type UnitId,
  type UnitSystemId,
} from '../../../core/units.ts';
import {
  displayValue,
  formatQuantity,
  formatSignificant,
  type FormatOptions,
} from '../../../core/format.ts';

export interface Units {
  readonly system: Ref<UnitSystemId>;
  readonly systemName: ComputedRef<string>;
  unitFor(quantity: Quantity): UnitId;
  unitLabel(quantity: Quantity): string;
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
  setSystem(system: UnitSystemId): void;
}

export const UNIT_SYSTEM_NAMES: Readonly<Record<UnitSystemId, string>> = {
  si: 'SI',
  aviation: 'Aviation (ft, kt, NM, lb, US gal)',
};

export function isUnitSystemId(value: unknown): value is UnitSystemId {
  return value === 'si' || value === 'aviation';
}

export function createUnits(initial: UnitSystemId = 'si'): Units {
  const system = ref<UnitSystemId>(initial);
  const unitFor = (q: Quantity): UnitId => UNIT_SYSTEMS[system.value][q];
  return {
    system,
    systemName: computed(() => UNIT_SYSTEM_NAMES[system.value]),
    unitFor,
    unitLabel: (q) => UNITS[unitFor(q)].label,
    toDisplay: (value, stored, q) => convert(value, stored, unitFor(q)),
    fromDisplay: (value, stored, q) => convert(value, unitFor(q), stored),
    format: (v, q, opts) => formatQuantity(v, q, system.value, opts),
    value: (v, q, opts) => displayValue(v, q, system.value, opts),
    plain: (v, sig = 3) => formatSignificant(v, sig),
    setSystem: (s) => {
      system.value = s;
    },
  };
}

export const UNITS_KEY: InjectionKey<Units> = Symbol('units');

export function useUnits(): Units {
  const units = inject(UNITS_KEY);
  if (!units) throw new Error('useUnits() needs the unit system provided by the app');
  return units;
}
