/** Words and rows of the Confidence panel, in the current unit system. */
import type { Plan } from '../../../core/plan/schema.ts';
import type { Quantity } from '../../../core/units.ts';
import { formatNumber } from '../../../core/format.ts';
import { failureSentence } from '../../../core/uncertainty/failureCauses.ts';
import type { ConfidenceResult } from './confidence.ts';
import { legTitle } from './legLabels.ts';

interface Fmt {
  format(value_si: number, quantity: Quantity, opts?: { signed?: boolean }): string;
}

/**
 * One sentence a pilot can repeat: "In 97 of 100 simulated flights the reserve is kept."
 * Out of 100, rounded down so that it never claims more than the run showed; the counts
 * themselves in brackets.
 */
export function keptSentence(r: ConfidenceResult): string {
  const kept = Math.round(r.samples * (1 - r.probabilityReserveNotKept));
  if (kept === r.samples) return `In all ${r.samples} simulated flights the reserve is kept.`;
  if (kept === 0) return `In none of the ${r.samples} simulated flights is the reserve kept.`;
  const per100 = Math.floor((100 * kept) / r.samples);
  return per100 >= 1
    ? `In ${per100} of 100 simulated flights the reserve is kept (${kept} of ${r.samples}).`
    : `In ${kept} of ${r.samples} simulated flights the reserve is kept.`;
}

const INPUT_NAMES: Record<string, string> = {
  'aircraft.polar.CD0': 'Zero-lift drag CD0',
  'aircraft.mass.payload_kg': 'Payload',
  'aircraft.powerplant.propEfficiency': 'Propeller efficiency',
  'aircraft.powerplant.bsfc_kg_J': 'Fuel consumption (BSFC)',
  'aircraft.powerplant.tsfc_kg_Ns': 'Fuel consumption (TSFC)',
  'aircraft.powerplant.battery.energy_J': 'Battery capacity',
};

/** A drawn input's plan path in words, e.g. "Wind speed, leg 3 (Transit to station A)". */
export function inputName(path: string, plan: Plan): string {
  const named = INPUT_NAMES[path];
  if (named) return named;
  const m = /^legs\.(\d+)\.wind\.(speed_m_s|from_deg)$/.exec(path);
  if (m) {
    const i = Number(m[1]);
    const leg = plan.legs[i];
    const what = m[2] === 'speed_m_s' ? 'Wind speed' : 'Wind direction';
    return `${what}, leg ${i + 1}${leg ? ` (${legTitle(leg, i)})` : ''}`;
  }
  return path;
}

export interface ImportanceRow {
  input: string;
  label: string;
  rho: string;
  effect: string;
}

/** The inputs that move the landing margin most, strongest first (Spearman's ρ). */
export function importanceRows(r: ConfidenceResult, plan: Plan, count = 6): ImportanceRow[] {
  return r.importance
    .filter((e) => Math.abs(e.rho) >= 0.05)
    .slice(0, count)
    .map((e) => ({
      input: e.input,
      label: inputName(e.input, plan),
      rho: formatNumber(e.rho, 2, true),
      effect: e.rho > 0 ? 'more of it, more left' : 'more of it, less left',
    }));
}

export interface PercentileRow {
  label: string;
  p5: string;
  p50: string;
  p95: string;
}

/** Landing amount and margin over the reserve: 5th, 50th and 95th percentile. */
export function percentileRows(r: ConfidenceResult, units: Fmt): PercentileRow[] {
  const q: Quantity = r.consumable === 'battery' ? 'energy' : 'fuelMass';
  const what = r.consumable === 'battery' ? 'Energy on landing' : 'Fuel on landing';
  const rows: PercentileRow[] = [];
  if (r.remaining)
    rows.push({
      label: what,
      p5: units.format(r.remaining.p5, q),
      p50: units.format(r.remaining.p50, q),
      p95: units.format(r.remaining.p95, q),
    });
  if (r.margin)
    rows.push({
      label: 'Over the reserve',
      p5: units.format(r.margin.p5, q, { signed: true }),
      p50: units.format(r.margin.p50, q, { signed: true }),
      p95: units.format(r.margin.p95, q, { signed: true }),
    });
  return rows;
}

/** Failure causes shown one by one; the rest are summed in one more line. */
const CAUSES_SHOWN = 5;

/**
 * The failed flights by leg and cause, one sentence each ("In 9 of 1000 simulated flights
 * leg 4 (cruise) ran out of fuel in a headwind of 22 – 27 kt."), most frequent first.
 */
export function failureLines(r: ConfidenceResult, plan: Plan, units: Fmt): string[] {
  const format = (v: number, q: Quantity) => units.format(v, q);
  const lines = r.failures
    .slice(0, CAUSES_SHOWN)
    .map((f) => failureSentence(f, r.samples, plan, r.consumable, format));
  const rest = r.failures.slice(CAUSES_SHOWN).reduce((n, f) => n + f.count, 0);
  if (rest > 0) lines.push(`${rest} more failed on other legs or for other causes.`);
  return lines;
}

/** Which correlation of the legs' wind errors the run used, and where it came from. */
export function correlationLine(r: ConfidenceResult, plan: Plan): string {
  const from =
    plan.uncertainty?.windCorrelation === undefined ? 'default, common practice' : 'set here';
  return `Wind errors of the legs of one flight correlated ${String(Number(r.windCorrelation.toFixed(2)))} (${from}).`;
}
