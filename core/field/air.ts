/**
 * The air at an airfield: pressure altitude from elevation and QNH, temperature either as the
 * ISA offset or as the outside air temperature reported at the field.
 *
 * Pressure altitude and the ISA+ΔT day follow core/atmosphere.ts (1976 U.S. Standard
 * Atmosphere; ΔT at constant pressure is common practice). With an outside air temperature
 * the offset is ΔT = OAT − T_std(Hp), so density is p_std(Hp)/(R·OAT) — the usual way a
 * density altitude is worked out for a take-off (common practice).
 */
import { atmosphereAt, P0_PA, pressureAltitudeFromQnh, standardAtmosphere } from '../atmosphere.ts';
import type { AtmosphereState } from '../atmosphere.ts';
import { InputError, requireFinite } from '../errors.ts';

export interface FieldAirInput {
  /** Field elevation above mean sea level. */
  elevation_m: number;
  /** Altimeter setting; standard (101 325 Pa) when omitted. */
  qnh_Pa?: number;
  /** Outside air temperature at the field; overrides isaOffset_K when given. */
  temperature_K?: number;
  /** Temperature offset from ISA; 0 when omitted. */
  isaOffset_K?: number;
}

export interface FieldAir {
  atm: AtmosphereState;
  pressureAltitude_m: number;
  isaOffset_K: number;
}

export function fieldAir(input: FieldAirInput, field = 'airfield'): FieldAir {
  const elevation_m = requireFinite(`${field}.elevation_m`, input.elevation_m, -500, 6000, 'm');
  const pressureAltitude_m = pressureAltitudeFromQnh(elevation_m, input.qnh_Pa ?? P0_PA, {
    elevation: `${field}.elevation_m`,
    qnh: `${field}.qnh_Pa`,
  });
  let isaOffset_K = input.isaOffset_K ?? 0;
  if (input.temperature_K !== undefined) {
    const T = requireFinite(`${field}.temperature_K`, input.temperature_K, 200, 340, 'K');
    if (input.isaOffset_K !== undefined) {
      throw new InputError(
        `${field}.isaOffset_K`,
        input.isaOffset_K,
        'omitted when temperature_K is given',
      );
    }
    isaOffset_K = T - standardAtmosphere(pressureAltitude_m, `${field}.elevation_m`).T_K;
  }
  const atm = atmosphereAt(pressureAltitude_m, isaOffset_K, {
    altitude: `${field}.elevation_m`,
    isaOffset:
      input.temperature_K !== undefined ? `${field}.temperature_K` : `${field}.isaOffset_K`,
  });
  return { atm, pressureAltitude_m, isaOffset_K };
}
