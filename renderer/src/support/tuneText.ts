/** Sentences and table rows for the Tune panel, in the current unit system. */
import type { Plan } from '../../../core/plan/schema.ts';
import type { PlanResult } from '../../../core/solver/types.ts';
import type { SensitivityEntry } from '../../../core/optimize/sensitivity.ts';
import type { Quantity } from '../../../core/units.ts';
import type { SpeedFinding } from '../composables/useTune.ts';
import { legTitle } from './legLabels.ts';

interface Fmt {
  format(value_si: number, quantity: Quantity, opts?: { signed?: boolean }): string;
}

/** The value the speed optimum is judged by, for the finding's objective, in words. */
function objectiveText(f: SpeedFinding, value: number, consumable: Quantity, units: Fmt): string {
  const o = f.sweep.objective;
  if (o.quantity === 'consumption') return `uses ${units.format(value, consumable)}`;
  if (o.quantity === 'groundDistance') return `covers ${units.format(value, 'distance')}`;
  return `lasts ${units.format(value, 'time')}`;
}

function currentValue(f: SpeedFinding, result: PlanResult | null): number | null {
  const leg = result?.legs[f.legIndex];
  if (!leg || leg.status !== 'flown') return null;
  const o = f.sweep.objective;
  if (o.quantity === 'consumption')
    return result?.consumable === 'battery' ? leg.energyUsed_J : leg.fuelUsed_kg;
  return o.quantity === 'groundDistance' ? leg.groundDistance_m : leg.time_s;
}

export function speedFindingText(
  f: SpeedFinding,
  plan: Plan,
  result: PlanResult | null,
  units: Fmt,
): string {
  const consumable: Quantity = result?.consumable === 'battery' ? 'energy' : 'fuelMass';
  const leg = plan.legs[f.legIndex];
  const name = leg ? legTitle(leg, f.legIndex) : `leg ${f.legIndex + 1}`;
  const best = `${units.format(f.sweep.best.tas_m_s, 'airspeed')} TAS`;
  const now = currentValue(f, result);
  const nowText =
    now === null ? '' : ` (now ${objectiveText(f, now, consumable, units).replace(/^\w+ /, '')})`;
  return `${name}: ${best} ${objectiveText(f, f.sweep.best.value, consumable, units)}${nowText}.`;
}

export interface SensitivityRow {
  input: string;
  label: string;
  minus: string;
  plus: string;
}

export function sensitivityRows(
  entries: readonly SensitivityEntry[],
  consumable: Quantity,
  units: Fmt,
): SensitivityRow[] {
  return entries.map((e) => ({
    input: e.input,
    label: e.label,
    minus: units.format(e.minus, consumable, { signed: true }),
    plus: units.format(e.plus, consumable, { signed: true }),
  }));
}
