/**
 * Descent leg, integrated over altitude: at a given rate and speed (thrust power
 * D·V − W·RoD·k_a with the acceleration factor k_a of the speed schedule, idle consumption
 * below idle), or gliding at idle at the (L/D)max speed with sink V/((L/D)·k_a) (Anderson,
 * Introduction to Flight, ch. 6, and Aircraft Performance and Design, ch. 5; point.ts). A rate
 * steeper than an idle glide at that speed (thrust power required below zero) is flown at idle
 * with a warning that it needs drag devices, and the leg gets no power check (legs/common.ts).
 */
import type { DescentLeg } from '../../plan/schema.ts';
import { fmt, type FlightPath } from '../point.ts';
import type { LimitKind, MissionState, SegmentSpec } from '../segment.ts';
import {
  flyFlightLeg,
  legWind,
  pathFor,
  refusedLeg,
  type LegContext,
  type LegOutcome,
} from './common.ts';

export function flyDescent(ctx: LegContext, leg: DescentLeg, start: MissionState): LegOutcome {
  if (leg.toAltitude_m > start.h_m) {
    return refusedLeg(
      ctx,
      leg,
      start,
      `descends to ${fmt(leg.toAltitude_m)} m, above the current altitude ${fmt(start.h_m)} m (use a climb leg)`,
    );
  }
  const wind = legWind(ctx.model, ctx.index, leg);
  if (typeof wind === 'string') return refusedLeg(ctx, leg, start, wind);
  const field = `legs.${ctx.index}.mode`;
  const byRate = leg.mode.by === 'rate';
  const path: FlightPath =
    leg.mode.by === 'rate'
      ? pathFor(
          field,
          { kind: 'fixed', speed: leg.mode.speed },
          { kind: 'descent', rate_m_s: leg.mode.rate_m_s },
          wind,
        )
      : pathFor(field, { kind: 'bestGlide' }, { kind: 'glide' }, wind);
  const limits: LimitKind[] = byRate
    ? ['stall', 'power', 'consumable', 'wind']
    : ['consumable', 'wind'];
  const spec: SegmentSpec = {
    path,
    indep: 'h',
    to: leg.toAltitude_m,
    limits,
    samples: ctx.samples,
  };
  return flyFlightLeg(ctx, leg, start, spec, wind, { stall: true, power: byRate, climb: false });
}
