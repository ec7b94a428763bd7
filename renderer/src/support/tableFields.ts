/**
 * Fields of the table editors: one row per route waypoint and per winds-aloft level. The
 * paths are the plan's, so plan-check issues land in the cell they name.
 */
import { num, text, type FieldDef } from './fieldTypes.ts';

export function waypointFields(i: number): FieldDef[] {
  const p = `route.waypoints.${i}`;
  return [
    text(`${p}.name`, `Waypoint ${i + 1} name`),
    num(`${p}.lat_deg`, `Waypoint ${i + 1} latitude (° north)`, null, 'deg', { digits: 9 }),
    num(`${p}.lon_deg`, `Waypoint ${i + 1} longitude (° east)`, null, 'deg', { digits: 9 }),
    num(`${p}.altitude_m`, `Waypoint ${i + 1} altitude`, 'altitude', 'm', {
      optional: true,
      datum: 'launch',
    }),
  ];
}

export function windLevelFields(i: number): FieldDef[] {
  const p = `environment.windsAloft.${i}`;
  return [
    num(`${p}.altitude_m`, `Level ${i + 1} pressure altitude`, 'altitude', 'm'),
    num(`${p}.from_deg`, `Level ${i + 1} wind from (° true)`, 'angle', 'deg'),
    num(`${p}.speed_m_s`, `Level ${i + 1} wind speed`, 'windSpeed', 'm_s'),
    num(`${p}.isaOffset_K`, `Level ${i + 1} ISA deviation`, 'temperatureDelta', 'K_delta', {
      optional: true,
    }),
  ];
}
