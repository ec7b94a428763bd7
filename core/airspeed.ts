/**
 * Airspeeds: true (TAS), equivalent (EAS), calibrated (CAS) and Mach, subsonic flight only.
 *
 * EAS gives the same dynamic pressure ½ρV² at sea-level density: EAS = TAS·√σ.
 * CAS is what a perfect pitot-static system calibrated at sea-level standard would show. The
 * isentropic pitot relation (Anderson, Introduction to Flight, ch. 4) gives the impact pressure
 * qc = p·[(1 + 0.2·M²)^3.5 − 1] for γ = 1.4, and CAS is the speed with that same qc at
 * sea level: CAS = a0·√(5·[(qc/p0 + 1)^(2/7) − 1]). Supersonic flight needs the Rayleigh
 * pitot formula and is refused here.
 */
import { A0_M_S, P0_PA, type AtmosphereState } from './atmosphere.ts';
import { InputError } from './errors.ts';

export type SpeedKind = 'tas' | 'eas' | 'cas' | 'mach';
export const SPEED_KINDS: readonly SpeedKind[] = ['tas', 'eas', 'cas', 'mach'];

const SUBSONIC = 'subsonic (Mach < 1)';

function checkSpeed(value: number, field: string): number {
  if (!Number.isFinite(value) || value < 0) throw new InputError(field, value, 'at least 0 m/s');
  return value;
}

function checkMach(M: number, field: string, value: number): number {
  if (!(M < 1)) throw new InputError(field, value, SUBSONIC);
  return M;
}

// (1 + x)^n − 1 written with expm1/log1p so low speeds keep full precision.
function powMinusOne(x: number, n: number): number {
  return Math.expm1(n * Math.log1p(x));
}

/** Impact pressure qc (total minus static) of subsonic flow at Mach M and static pressure p. */
export function impactPressure(M: number, p_Pa: number): number {
  return p_Pa * powMinusOne(0.2 * M * M, 3.5);
}

/** Mach number from impact pressure and static pressure (subsonic isentropic relation). */
export function machFromImpactPressure(qc_Pa: number, p_Pa: number): number {
  return Math.sqrt(5 * powMinusOne(qc_Pa / p_Pa, 2 / 7));
}

export function machFromTas(tas_m_s: number, atm: AtmosphereState, field = 'airspeed_m_s'): number {
  checkSpeed(tas_m_s, field);
  return checkMach(tas_m_s / atm.a_m_s, field, tas_m_s);
}

export function tasFromMach(mach: number, atm: AtmosphereState, field = 'mach'): number {
  if (!Number.isFinite(mach) || mach < 0) throw new InputError(field, mach, 'at least 0');
  checkMach(mach, field, mach);
  return mach * atm.a_m_s;
}

export function easFromTas(tas_m_s: number, atm: AtmosphereState, field = 'airspeed_m_s'): number {
  machFromTas(tas_m_s, atm, field);
  return tas_m_s * Math.sqrt(atm.sigma);
}

export function tasFromEas(eas_m_s: number, atm: AtmosphereState, field = 'airspeed_m_s'): number {
  checkSpeed(eas_m_s, field);
  const tas = eas_m_s / Math.sqrt(atm.sigma);
  checkMach(tas / atm.a_m_s, field, eas_m_s);
  return tas;
}

export function casFromTas(tas_m_s: number, atm: AtmosphereState, field = 'airspeed_m_s'): number {
  const M = machFromTas(tas_m_s, atm, field);
  const qc = impactPressure(M, atm.p_Pa);
  const cas = A0_M_S * machFromImpactPressure(qc, P0_PA);
  // Below sea level a subsonic TAS can need a CAS above a0, where the subsonic form fails.
  checkMach(cas / A0_M_S, field, tas_m_s);
  return cas;
}

export function tasFromCas(cas_m_s: number, atm: AtmosphereState, field = 'airspeed_m_s'): number {
  checkSpeed(cas_m_s, field);
  checkMach(cas_m_s / A0_M_S, field, cas_m_s);
  const qc = impactPressure(cas_m_s / A0_M_S, P0_PA);
  const M = checkMach(machFromImpactPressure(qc, atm.p_Pa), field, cas_m_s);
  return M * atm.a_m_s;
}

export function casFromEas(eas_m_s: number, atm: AtmosphereState, field = 'airspeed_m_s'): number {
  return casFromTas(tasFromEas(eas_m_s, atm, field), atm, field);
}

export function easFromCas(cas_m_s: number, atm: AtmosphereState, field = 'airspeed_m_s'): number {
  return easFromTas(tasFromCas(cas_m_s, atm, field), atm, field);
}

/** Any kind of airspeed (m/s, or Mach) → TAS in m/s. */
export function toTas(
  kind: SpeedKind,
  value: number,
  atm: AtmosphereState,
  field?: string,
): number {
  switch (kind) {
    case 'tas':
      machFromTas(value, atm, field);
      return value;
    case 'eas':
      return tasFromEas(value, atm, field);
    case 'cas':
      return tasFromCas(value, atm, field);
    case 'mach':
      return tasFromMach(value, atm, field);
    default:
      throw new InputError('speedKind', kind, SPEED_KINDS.join(', '));
  }
}

/** TAS in m/s → the requested kind (m/s, or Mach). */
export function fromTas(
  kind: SpeedKind,
  tas_m_s: number,
  atm: AtmosphereState,
  field?: string,
): number {
  switch (kind) {
    case 'tas':
      machFromTas(tas_m_s, atm, field);
      return tas_m_s;
    case 'eas':
      return easFromTas(tas_m_s, atm, field);
    case 'cas':
      return casFromTas(tas_m_s, atm, field);
    case 'mach':
      return machFromTas(tas_m_s, atm, field);
    default:
      throw new InputError('speedKind', kind, SPEED_KINDS.join(', '));
  }
}
