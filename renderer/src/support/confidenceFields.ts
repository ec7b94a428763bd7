/**
 * The spreads of the reserve Monte Carlo as fields of `plan.uncertainty`. While the plan has
 * no such block the fields show the core's defaults (spreadsFromDefaults, common practice,
 * clipped to the plan schema's limits) and the first edit saves them all with the plan.
 */
import type { Plan, Uncertainty } from '../../../core/plan/schema.ts';
import { spreadsFromDefaults, type ReserveSpreads } from '../../../core/uncertainty/spreads.ts';
import { DEFAULT_WIND_CORRELATION } from '../../../core/uncertainty/windErrors.ts';
import { num, type FieldDef, type OptionalBlock } from './fieldTypes.ts';

export const DEFAULT_SAMPLES = 1000;
export const DEFAULT_RANDOM_SEED = 1;

// Upper limits of UncertaintySchema (core/plan/schema.ts) for the spreads it bounds tighter
// than the Monte Carlo itself does.
const SCHEMA_MAX: Partial<Record<keyof ReserveSpreads, number>> = {
  windSpeed_m_s: 20,
  windDirection_deg: 90,
  efficiency: 0.3,
  fuelConsumption: 0.3,
  payload_kg: 10_000,
};

export function defaultUncertainty(plan: Plan): Uncertainty {
  const s = spreadsFromDefaults(plan);
  const clipped = Object.fromEntries(
    Object.entries(s).map(([k, v]) => [k, Math.min(v, SCHEMA_MAX[k as keyof ReserveSpreads] ?? v)]),
  ) as unknown as ReserveSpreads;
  return { ...clipped, samples: DEFAULT_SAMPLES, seed: DEFAULT_RANDOM_SEED };
}

/** What the Monte Carlo runs with: the plan's block, or the defaults. */
export function uncertaintyOf(plan: Plan): Uncertainty {
  return plan.uncertainty ?? defaultUncertainty(plan);
}

export function spreadsOf(u: Uncertainty): ReserveSpreads {
  const { samples: _n, seed: _s, ...spreads } = u;
  return spreads;
}

const block: OptionalBlock = { path: 'uncertainty', create: defaultUncertainty };

/** Fields that apply to the plan's powerplant (the others stay at 0). */
export function uncertaintyFields(plan: Plan): FieldDef[] {
  const type = plan.aircraft.powerplant.type;
  const p = 'uncertainty';
  const f = (
    key: string,
    label: string,
    q: Parameters<typeof num>[2],
    unit: Parameters<typeof num>[3],
  ) => num(`${p}.${key}`, label, q, unit, { block });
  return [
    f('windSpeed_m_s', 'Wind speed, per leg', 'windSpeed', 'm_s'),
    f('windDirection_deg', 'Wind direction, per leg', 'angle', 'deg'),
    num(`${p}.windCorrelation`, 'Wind error correlation between legs', null, 'fraction', {
      block,
      optional: true,
      hint: `0 independent, 1 the same on every leg; empty: ${DEFAULT_WIND_CORRELATION} (common practice)`,
    }),
    f('cd0', 'Zero-lift drag CD0', 'ratio', 'fraction'),
    ...(type !== 'jet' ? [f('efficiency', 'Propeller efficiency', 'ratio', 'fraction')] : []),
    ...(type !== 'electric'
      ? [f('fuelConsumption', 'Fuel consumption', 'ratio', 'fraction')]
      : [f('batteryCapacity', 'Battery capacity', 'ratio', 'fraction')]),
    f('payload_kg', 'Payload', 'mass', 'kg'),
    f('samples', 'Simulated flights', null, 'fraction'),
    f('seed', 'Random seed', null, 'fraction'),
  ];
}
