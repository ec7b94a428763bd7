/**
 * Loiter leg: level flight at the current altitude at best-endurance or a given speed, for
 * a time (integrated over time) or for an amount of the consumable (integrated over the
 * consumable left; the solver uses this for "until reserve", see loiterReserve.ts).
 */
import type { LoiterLeg } from '../../plan/schema.ts';
import type { SpeedSchedule } from '../point.ts';
import type { LimitKind, MissionState, SegmentSpec } from '../segment.ts';
import {
  flyFlightLeg,
  legWind,
  pathFor,
  refusedLeg,
  type LegContext,
  type LegOutcome,
} from './common.ts';

/** `consume`: for an "until reserve" loiter, the amount of fuel kg or battery J to use. */
export function flyLoiter(
  ctx: LegContext,
  leg: LoiterLeg,
  start: MissionState,
  consume = 0,
): LegOutcome {
  const wind = legWind(ctx.model, ctx.index, leg);
  if (typeof wind === 'string') return refusedLeg(ctx, leg, start, wind);
  const speed: SpeedSchedule =
    leg.speed.kind === 'bestEndurance'
      ? { kind: 'bestEndurance' }
      : { kind: 'fixed', speed: leg.speed };
  const path = pathFor(`legs.${ctx.index}.speed`, speed, { kind: 'level' }, wind);
  const fixedSpeed = speed.kind === 'fixed';
  const limits: LimitKind[] = ['power', 'consumable', 'wind'];
  if (fixedSpeed) limits.push('stall');
  const spec: SegmentSpec =
    leg.end.by === 'time'
      ? { path, indep: 't', to: start.t_s + leg.end.time_s, limits, samples: ctx.samples }
      : { path, indep: 'q', to: Math.max(start.left - consume, 0), limits, samples: ctx.samples };
  return flyFlightLeg(ctx, leg, start, spec, wind, { stall: true, power: true, climb: false });
}
