/**
 * How a leg is named on screen and in exports: its own label, or its kind and position.
 */
import type { Leg } from '../../../core/plan/schema.ts';
import { formatDuration, formatNumber } from '../../../core/format.ts';
import { LEG_KIND_NAMES } from './legFields.ts';

export function legTitle(leg: Pick<Leg, 'kind' | 'label'>, index: number): string {
  const label = leg.label?.trim();
  return label ? label : `${LEG_KIND_NAMES[leg.kind]} ${index + 1}`;
}

type Fmt = (
  value_si: number,
  quantity: 'altitude' | 'distance' | 'time' | 'fuelMass' | 'energy' | 'airspeed',
) => string;

/**
 * One line on what the leg does, e.g. "to 1500 m MSL, best rate" or "120.0 km at best range";
 * a cruise whose distance the route sets says where it goes instead ("to Lake at best range").
 * `height` names a climb's or descent's target with its reference (heightReference.ts);
 * without it the altitude is formatted as is.
 */
export function legSummary(
  leg: Leg,
  fmt: Fmt,
  routeTo?: string,
  height: (altitude_m: number) => string = (a) => fmt(a, 'altitude'),
): string {
  switch (leg.kind) {
    case 'takeoff':
    case 'landing': {
      const a = leg.allowance;
      if (a.by === 'fuel') return `allowance ${fmt(a.fuel_kg, 'fuelMass')}`;
      if (a.by === 'energy') return `allowance ${fmt(a.energy_J, 'energy')}`;
      // Seconds matter in a one-minute allowance: m:ss, not "0:01 h".
      if (a.by === 'time') {
        return `allowance ${formatDuration(a.time_s, { seconds: true })} at full power`;
      }
      return `allowance ${formatNumber(a.fraction * 100, 1)} % of mass`;
    }
    case 'climb':
      return `to ${height(leg.toAltitude_m)}, ${speedText(leg.speed, fmt)}`;
    case 'cruise': {
      const end =
        leg.end.by === 'distance'
          ? routeTo !== undefined
            ? `to ${routeTo}`
            : fmt(leg.end.distance_m, 'distance')
          : leg.end.by === 'fuel'
            ? `${fmt(leg.end.fuel_kg, 'fuelMass')} fuel`
            : `${fmt(leg.end.energy_J, 'energy')}`;
      return `${end} at ${speedText(leg.speed, fmt)}${leg.program === 'cruiseClimb' ? ', cruise-climb' : ''}`;
    }
    case 'loiter':
      return `${leg.end.by === 'time' ? fmt(leg.end.time_s, 'time') : 'until reserve'} at ${speedText(leg.speed, fmt)}`;
    case 'descent':
      return `to ${height(leg.toAltitude_m)}, ${leg.mode.by === 'glide' ? 'glide' : speedText(leg.mode.speed, fmt)}`;
  }
}

function speedText(speed: { kind: string; speed_m_s?: number; mach?: number }, fmt: Fmt): string {
  switch (speed.kind) {
    case 'bestRate':
      return 'best rate';
    case 'bestRange':
      return 'best range';
    case 'bestEndurance':
      return 'best endurance';
    case 'mach':
      return `Mach ${formatNumber(speed.mach ?? Number.NaN, 2)}`;
    default:
      return `${fmt(speed.speed_m_s ?? Number.NaN, 'airspeed')} ${speed.kind.toUpperCase()}`;
  }
}
