/**
 * `legwise tune`: runs the optimizers of core/optimize on a plan — best cruise altitude,
 * best speed for each cruise and loiter leg, maximum payload, and the sensitivity of the
 * landing reserve margin — and prints them next to the plan as given. Each optimizer solves
 * the whole plan many times; one that cannot apply to this plan (no climb before the cruise,
 * say) reports why instead of stopping the others.
 */
import {
  bestCruiseAltitude,
  MIN_HEIGHT_ABOVE_DEPARTURE_M,
} from '../core/optimize/altitudeSweep.ts';
import type { AltitudeSweepResult } from '../core/optimize/altitudeSweep.ts';
import { maxPayload } from '../core/optimize/maxPayload.ts';
import type { MaxPayloadResult } from '../core/optimize/maxPayload.ts';
import { reserveSensitivity } from '../core/optimize/sensitivity.ts';
import type { SensitivityEntry } from '../core/optimize/sensitivity.ts';
import { bestSpeedForLeg, legObjective, legObjectiveValue } from '../core/optimize/speedSweep.ts';
import type { LegObjective, SpeedSweepResult } from '../core/optimize/speedSweep.ts';
import { InputError } from '../core/errors.ts';
import { formatQuantity } from '../core/format.ts';
import type { CruiseLeg, LoiterLeg, Plan } from '../core/plan/schema.ts';
import type { PlanResult } from '../core/solver/types.ts';
import type { Quantity, UnitSystemId } from '../core/units.ts';
import { CAUTION } from './common.ts';
import { clip } from './table.ts';

/** An optimizer's answer, or the reason it does not apply. */
export type Outcome<T> = { ok: true; value: T } | { ok: false; error: string };

function attempt<T>(run: () => T): Outcome<T> {
  try {
    return { ok: true, value: run() };
  } catch (err) {
    if (err instanceof InputError) return { ok: false, error: err.message };
    throw err;
  }
}

export interface LegSpeedTuning {
  legIndex: number;
  id: string;
  label: string;
  /** Mean TAS and objective value of the leg in the plan as given (null if not flown cleanly). */
  planned: { tas_m_s: number; value: number | null };
  outcome: Outcome<SpeedSweepResult>;
}

export interface TuneReport {
  plan: string;
  baseline: {
    verdict: PlanResult['verdict'];
    landingRemaining: number;
    consumable: PlanResult['consumable'];
  };
  bestCruiseAltitude: Outcome<AltitudeSweepResult>;
  bestSpeeds: LegSpeedTuning[];
  maxPayload: Outcome<MaxPayloadResult>;
  reserveSensitivity: Outcome<SensitivityEntry[]>;
}

export function runTune(
  plan: Plan,
  base: PlanResult,
  progress?: (done: number, total: number, what: string) => void,
): TuneReport {
  const bestSpeeds: LegSpeedTuning[] = [];
  const tuned = plan.legs.filter((l) => l.kind === 'cruise' || l.kind === 'loiter').length;
  const steps = tuned + 3;
  let done = 0;
  const step = <T>(run: () => T): T => {
    const out = run();
    done += 1;
    progress?.(done, steps, 'optimizer runs');
    return out;
  };
  plan.legs.forEach((leg, i) => {
    if (leg.kind !== 'cruise' && leg.kind !== 'loiter') return;
    const objective = legObjective(leg as CruiseLeg | LoiterLeg);
    bestSpeeds.push({
      legIndex: i,
      id: leg.id,
      label: leg.label,
      planned: {
        tas_m_s: base.legs[i]?.meanTas_m_s ?? 0,
        value: legObjectiveValue(base, i, objective),
      },
      outcome: step(() => attempt(() => bestSpeedForLeg(plan, i))),
    });
  });
  const altitude = step(() => attempt(() => bestCruiseAltitude(plan)));
  const payload = step(() => attempt(() => maxPayload(plan)));
  const sensitivity = step(() => attempt(() => reserveSensitivity(plan)));
  return {
    plan: plan.name,
    baseline: {
      verdict: base.verdict,
      landingRemaining: base.landing.remaining,
      consumable: base.consumable,
    },
    bestCruiseAltitude: altitude,
    bestSpeeds,
    maxPayload: payload,
    reserveSensitivity: sensitivity,
  };
}

function objectiveText(
  objective: LegObjective,
  value: number,
  consumable: Quantity,
  units: UnitSystemId,
): string {
  if (objective.quantity === 'consumption')
    return `uses ${formatQuantity(value, consumable, units)}`;
  if (objective.quantity === 'groundDistance')
    return `covers ${formatQuantity(value, 'distance', units)}`;
  return `lasts ${formatQuantity(value, 'time', units)}`;
}

export function renderTuneText(report: TuneReport, units: UnitSystemId): string {
  const c: Quantity = report.baseline.consumable === 'fuel' ? 'fuelMass' : 'energy';
  const amount = (v: number) => formatQuantity(v, c, units);
  const lines: string[] = [
    report.plan,
    '',
    'Best cruise altitude (whole mission flown at each trial altitude)',
  ];
  const alt = report.bestCruiseAltitude;
  if (!alt.ok) lines.push(`  not available: ${alt.error}`);
  else if (alt.value.best === null)
    lines.push('  no altitude up to the ceiling lets the whole mission be flown');
  else {
    const { altitude_m, remaining } = alt.value.best;
    // The sweep starts MIN_HEIGHT_ABOVE_DEPARTURE_M above the field: a plan cruising lower
    // can do better than every altitude tried.
    const better =
      remaining < report.baseline.landingRemaining
        ? `; the plan as given does better — the sweep starts ${formatQuantity(MIN_HEIGHT_ABOVE_DEPARTURE_M, 'altitude', units)} above the departure field, at ${formatQuantity(alt.value.bottom_m, 'altitude', units)}`
        : '';
    const limit =
      alt.value.limitedBy === 'ceiling'
        ? ', limited by the ceiling'
        : alt.value.limitedBy === 'climb'
          ? ', limited by the highest altitude the climb reaches'
          : '';
    lines.push(
      `  ${formatQuantity(altitude_m, 'altitude', units)}${limit}: ${amount(remaining)} left on landing ` +
        `(plan as given: ${amount(report.baseline.landingRemaining)}${better})`,
    );
  }
  lines.push('', 'Best speed per cruise and loiter leg (true airspeed)');
  if (report.bestSpeeds.length === 0) lines.push('  no cruise or loiter legs');
  for (const s of report.bestSpeeds) {
    const name = `${s.legIndex + 1} ${clip(s.label || s.id, 28)}`;
    if (!s.outcome.ok) {
      lines.push(`  ${name}: not available: ${s.outcome.error}`);
      continue;
    }
    const r = s.outcome.value;
    const planned =
      s.planned.value === null
        ? 'not flown cleanly as planned'
        : `plan: ${formatQuantity(s.planned.tas_m_s, 'airspeed', units)}, ${objectiveText(r.objective, s.planned.value, c, units)}`;
    lines.push(
      `  ${name}: ${formatQuantity(r.best.tas_m_s, 'airspeed', units)}, ` +
        `${objectiveText(r.objective, r.best.value, c, units)} (${planned})`,
    );
  }
  lines.push('', 'Maximum payload for this mission');
  const mp = report.maxPayload;
  if (!mp.ok) lines.push(`  not available: ${mp.error}`);
  else if (!mp.value.feasible)
    lines.push(`  none: the plan fails even empty (${mp.value.limitingLabel})`);
  else
    lines.push(
      `  ${formatQuantity(mp.value.payload_kg, 'mass', units)}, limited by: ${mp.value.limitingLabel}`,
    );
  lines.push('', 'Reserve margin on landing: change for −5 % / +5 % of each input');
  const rs = report.reserveSensitivity;
  if (!rs.ok) lines.push(`  not available: ${rs.error}`);
  else {
    const width = Math.max(5, ...rs.value.map((e) => e.label.length));
    lines.push(`  ${'Input'.padEnd(width)}  ${'−5 %'.padStart(12)}  ${'+5 %'.padStart(12)}`);
    for (const e of rs.value) {
      const d = (v: number) => formatQuantity(v, c, units, { signed: true });
      lines.push(
        `  ${e.label.padEnd(width)}  ${d(e.minus).padStart(12)}  ${d(e.plus).padStart(12)}`,
      );
    }
  }
  lines.push('', CAUTION);
  return `${lines.join('\n')}\n`;
}

export function renderTuneJson(report: TuneReport): string {
  return `${JSON.stringify({ caution: CAUTION, ...report }, null, 2)}\n`;
}
