/**
 * Cruise leg: level flight at constant altitude, or cruise-climb (constant TAS and CL, the
 * altitude rising as the weight falls; Anderson, Aircraft Performance and Design, ch. 5; a
 * given EAS, CAS or Mach is converted to TAS at the leg start and the TAS held, with a warning),
 * ended by a ground distance (integrated over distance) or by an amount of fuel or battery
 * energy (integrated over the consumable left).
 */
import type { CruiseLeg } from '../../plan/schema.ts';
import { G0 } from '../../units.ts';
import { ambientAt } from '../model.ts';
import { evaluatePoint, newPoint, type SpeedSchedule } from '../point.ts';
import type { LimitKind, MissionState, SegmentSpec } from '../segment.ts';
import {
  consumableWord,
  flyFlightLeg,
  legName,
  legWind,
  pathFor,
  refusedLeg,
  type LegContext,
  type LegOutcome,
} from './common.ts';
import { fmt } from '../point.ts';

export function flyCruise(ctx: LegContext, leg: CruiseLeg, start: MissionState): LegOutcome {
  const model = ctx.model;
  const wind = legWind(ctx.model, ctx.index, leg);
  if (typeof wind === 'string') return refusedLeg(ctx, leg, start, wind);
  const field = `legs.${ctx.index}.speed`;
  const end = leg.end;
  if (end.by === 'fuel' && model.consumable !== 'fuel') {
    return refusedLeg(
      ctx,
      leg,
      start,
      'ends by fuel burned, but the aircraft is electric (end it by energy)',
    );
  }
  if (end.by === 'energy' && model.consumable !== 'battery') {
    return refusedLeg(
      ctx,
      leg,
      start,
      'ends by battery energy, but the aircraft burns fuel (end it by fuel)',
    );
  }
  let speed: SpeedSchedule =
    leg.speed.kind === 'bestRange' ? { kind: 'bestRange' } : { kind: 'fixed', speed: leg.speed };
  let path = pathFor(field, speed, { kind: 'level' }, wind);
  let cruiseClimbNote: string | null = null;
  if (leg.program === 'cruiseClimb') {
    // TAS and CL are set at the start of the leg and then held (Breguet cruise-climb).
    let V0: number;
    try {
      V0 = evaluatePoint(
        model,
        path,
        start.mass_kg,
        start.h_m,
        {},
        newPoint(model, start.h_m),
      ).tas_m_s;
    } catch (e) {
      return refusedLeg(ctx, leg, start, e instanceof Error ? e.message : String(e));
    }
    const rho = ambientAt(model, start.h_m, path.aloft !== undefined).atm.rho_kg_m3;
    const CL = (2 * start.mass_kg * G0) / (rho * V0 * V0 * model.S_m2);
    speed = { kind: 'constantTas', tas_m_s: V0 };
    path = pathFor(field, speed, { kind: 'cruiseClimb', CL }, wind);
    if (leg.speed.kind !== 'bestRange' && leg.speed.kind !== 'tas') {
      const given =
        leg.speed.kind === 'mach'
          ? `Mach ${fmt(leg.speed.mach)}`
          : `${leg.speed.kind.toUpperCase()} ${fmt(leg.speed.speed_m_s)} m/s`;
      cruiseClimbNote = `${legName(ctx.index, leg)}: a cruise-climb holds its true airspeed: ${given} is converted at the start of the leg to ${fmt(V0)} m/s TAS, which is then held (the ${leg.speed.kind === 'mach' ? 'Mach number' : leg.speed.kind.toUpperCase()} changes as the aircraft climbs).`;
    }
  }
  const fixedSpeed = leg.speed.kind !== 'bestRange' || leg.program === 'cruiseClimb';
  const limits: LimitKind[] = ['power', 'consumable', 'wind'];
  if (fixedSpeed) limits.push('stall');
  const amount = end.by === 'fuel' ? end.fuel_kg : end.by === 'energy' ? end.energy_J : 0;
  const spec: SegmentSpec =
    end.by === 'distance'
      ? { path, indep: 'x', to: start.x_m + end.distance_m, limits, samples: ctx.samples }
      : { path, indep: 'q', to: Math.max(start.left - amount, 0), limits, samples: ctx.samples };
  const out = flyFlightLeg(ctx, leg, start, spec, wind, { stall: true, power: true, climb: false });
  if (cruiseClimbNote !== null) out.warnings.unshift(cruiseClimbNote);
  if (!out.failed && end.by !== 'distance' && amount > start.left) {
    const unit = model.consumable === 'fuel' ? 'kg' : 'J';
    out.failed = true;
    out.result.status = 'failed';
    out.result.stopCause = 'consumable';
    out.result.error = `${legName(ctx.index, leg)}: ${consumableWord(model)} exhausted: the leg asks for ${fmt(amount)} ${unit} but ${fmt(start.left)} ${unit} were left`;
  }
  return out;
}
