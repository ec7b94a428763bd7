/**
 * Climb leg: at a throttle setting, best-rate or a given speed, integrated over altitude:
 * ROC = (τ·P_avail − D·V)/(W·(1 + (V/g)·dV/dh)) (Anderson, Introduction to Flight, ch. 6;
 * the acceleration factor of a speed schedule whose TAS changes with height, Aircraft
 * Performance and Design, ch. 5; point.ts, slope.ts). The leg fails where
 * the rate of climb falls below settings.minClimbRate_m_s (the service-ceiling criterion,
 * 0.5 m/s common practice) before the target altitude.
 */
import type { ClimbLeg } from '../../plan/schema.ts';
import { fmt, type SpeedSchedule } from '../point.ts';
import type { LimitKind, MissionState, SegmentSpec } from '../segment.ts';
import {
  flyFlightLeg,
  legWind,
  pathFor,
  refusedLeg,
  type LegContext,
  type LegOutcome,
} from './common.ts';

export function flyClimb(ctx: LegContext, leg: ClimbLeg, start: MissionState): LegOutcome {
  if (leg.toAltitude_m < start.h_m) {
    return refusedLeg(
      ctx,
      leg,
      start,
      `climbs to ${fmt(leg.toAltitude_m)} m, below the current altitude ${fmt(start.h_m)} m (use a descent leg)`,
    );
  }
  const wind = legWind(ctx.model, ctx.index, leg);
  if (typeof wind === 'string') return refusedLeg(ctx, leg, start, wind);
  const speed: SpeedSchedule =
    leg.speed.kind === 'bestRate' ? { kind: 'bestClimb' } : { kind: 'fixed', speed: leg.speed };
  const path = pathFor(
    `legs.${ctx.index}.speed`,
    speed,
    { kind: 'climb', throttle: leg.throttle },
    wind,
  );
  const fixedSpeed = speed.kind === 'fixed';
  const limits: LimitKind[] = ['climb', 'consumable', 'wind'];
  if (fixedSpeed) limits.push('stall');
  const spec: SegmentSpec = {
    path,
    indep: 'h',
    to: leg.toAltitude_m,
    limits,
    minClimbRate_m_s: ctx.model.settings.minClimbRate_m_s,
    samples: ctx.samples,
  };
  return flyFlightLeg(ctx, leg, start, spec, wind, { stall: true, power: false, climb: true });
}
