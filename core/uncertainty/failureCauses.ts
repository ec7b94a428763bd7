/**
 * Why simulated flights failed: every sample whose mission is not completed is counted by the
 * leg that failed and the limit that stopped it (LegResult.stopCause), with the wind that leg
 * met in those flights, so a summary can say "in 9 of 1000 flights leg 4 (cruise) ran out of
 * fuel in a headwind of 22–27 m/s". Plain bookkeeping; no model.
 */
import type { Plan } from '../plan/schema.ts';
import type { Consumable, PlanResult, StopCause } from '../solver/types.ts';
import type { Quantity } from '../units.ts';

export interface Span {
  min: number;
  max: number;
}

export interface FailureCause {
  legIndex: number;
  cause: StopCause;
  /** Simulated flights that failed on this leg for this reason. */
  count: number;
  /** In those flights: the leg's wind speed and its headwind component (+ head, − tail). */
  windSpeed_m_s: Span;
  headwind_m_s: Span;
  /** The solver's message of the first such flight. */
  example: string;
}

const widen = (s: Span, v: number) => {
  s.min = Math.min(s.min, v);
  s.max = Math.max(s.max, v);
};

/** Collects the failures of the samples; `list()` gives them most frequent first. */
export function failureTally() {
  const byKey = new Map<string, FailureCause>();
  return {
    /** Records a sample (its perturbed plan and result); completed flights are ignored. */
    add(plan: Plan, r: PlanResult): void {
      if (r.completed || r.failure === null) return;
      const i = r.failure.legIndex;
      const leg = r.legs[i];
      const cause: StopCause = leg?.stopCause ?? 'other';
      const planLeg = plan.legs[i];
      const ownWind = planLeg !== undefined && 'wind' in planLeg && planLeg.windSource !== 'aloft';
      // A leg on the winds-aloft table: the components it reports are all that is known.
      const speed = ownWind
        ? planLeg.wind.speed_m_s
        : Math.hypot(leg?.headwind_m_s ?? 0, leg?.crosswind_m_s ?? 0);
      // A loiter reports no mean head- or tailwind (an orbit): its wind is all of it.
      const head = leg?.kind === 'loiter' ? speed : (leg?.headwind_m_s ?? 0);
      const key = `${i}:${cause}`;
      const f = byKey.get(key);
      if (f === undefined) {
        byKey.set(key, {
          legIndex: i,
          cause,
          count: 1,
          windSpeed_m_s: { min: speed, max: speed },
          headwind_m_s: { min: head, max: head },
          example: r.failure.message,
        });
        return;
      }
      f.count++;
      widen(f.windSpeed_m_s, speed);
      widen(f.headwind_m_s, head);
    },
    list(): FailureCause[] {
      return [...byKey.values()].sort((a, b) => b.count - a.count || a.legIndex - b.legIndex);
    },
  };
}

const CAUSE_WORDS: Record<StopCause, (c: Consumable) => string> = {
  consumable: (c) => (c === 'fuel' ? 'ran out of fuel' : 'ran out of usable battery energy'),
  power: () => 'needed more power than available',
  stall: () => 'fell below the stall margin',
  climb: () => 'could not keep climbing',
  wind: () => 'had no ground speed left against the wind',
  station: () => 'could not hold station',
  refused: () => 'could not be started',
  other: () => 'could not be flown',
};

/** "22–27 m/s", or "25 m/s" when both ends read the same. */
function spanText(s: Span, format: (v: number) => string): string {
  const lo = format(s.min);
  const hi = format(s.max);
  return lo === hi ? lo : `${lo} – ${hi}`;
}

/**
 * One sentence for a failure cause, e.g. "In 9 of 1000 simulated flights leg 4 (cruise) ran
 * out of fuel in a headwind of 22 – 27 m/s." `format` puts a speed in the reader's units.
 */
export function failureSentence(
  f: FailureCause,
  samples: number,
  plan: Plan,
  consumable: Consumable,
  format: (v_m_s: number, q: Quantity) => string,
): string {
  const leg = plan.legs[f.legIndex];
  const label = leg?.label ? ` “${leg.label}”` : '';
  const name = `leg ${f.legIndex + 1}${label}${leg ? ` (${leg.kind})` : ''}`;
  const what = CAUSE_WORDS[f.cause](consumable);
  const speed = (v: number) => format(v, 'airspeed');
  let wind = '';
  if (f.cause === 'station' || leg?.kind === 'loiter') {
    if (f.windSpeed_m_s.max > 0) wind = ` in a wind of ${spanText(f.windSpeed_m_s, speed)}`;
  } else if (f.headwind_m_s.min > 0) {
    wind = ` in a headwind of ${spanText(f.headwind_m_s, speed)}`;
  } else if (f.headwind_m_s.max < 0) {
    const tail = { min: -f.headwind_m_s.max, max: -f.headwind_m_s.min };
    wind = ` with a tailwind of ${spanText(tail, speed)}`;
  } else if (f.windSpeed_m_s.max > 0) {
    wind = ` in a wind of ${spanText(f.windSpeed_m_s, speed)}`;
  }
  return `In ${f.count} of ${samples} simulated flights ${name} ${what}${wind}.`;
}
