/**
 * Version-1 jets → the engine-class lapse and the Mach-and-θ TSFC (core/propulsion/jet.ts).
 *
 * A version-1 jet had T_max = T_SL·σ^n and one TSFC meant for the cruise Mach. A version-2
 * file gets the high-bypass turbofan lapse (Mattingly, Aircraft Engine Design, ch. 2, from
 * memory; throttle ratio 1.05), which keeps the old sea-level static thrust exactly and adds the
 * loss of thrust with Mach that σ^n left out. TSFC becomes c₁·(1 + 1.2·M)·√θ with c₁ chosen so
 * that the old value holds at the old design point: the first Mach cruise at the altitude the
 * climbs before it reach (ISA + the plan's offset), else M 0.75 at 11 000 m. The exponent n is
 * dropped (the class lapse replaces it). The note names the numbers so the user can check them.
 */
import { atmosphereAt } from '../../atmosphere.ts';
import { TSFC_MACH_FACTOR } from '../../propulsion/jet.ts';
import { fromSI } from '../../units.ts';
import type { RawPlan } from '../migrate.ts';
import type { MigrationPart } from './v1to2.ts';

type Obj = Record<string, unknown>;
const isObj = (v: unknown): v is Obj => typeof v === 'object' && v !== null && !Array.isArray(v);
const num = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null);

/** Throttle ratio given to a migrated jet: the middle of 1.0–1.1 (common practice, from memory). */
const THROTTLE_RATIO = 1.05;

/** When a plan has no Mach cruise: a typical jet cruise (common practice). */
const FALLBACK = { mach: 0.75, altitude_m: 11_000 };

/** Mach and altitude of the first Mach-number cruise leg, the altitude being the last climb target before it. */
export function jetDesignPoint(raw: RawPlan): { mach: number; altitude_m: number; found: boolean } {
  const legs = Array.isArray(raw.legs) ? raw.legs : [];
  let altitude: number | null = null;
  for (const leg of legs) {
    if (!isObj(leg)) continue;
    if (leg.kind === 'climb' || leg.kind === 'descent')
      altitude = num(leg.toAltitude_m) ?? altitude;
    const speed = leg.speed;
    if (leg.kind === 'cruise' && isObj(speed) && speed.kind === 'mach') {
      const mach = num(speed.mach);
      if (
        mach !== null &&
        mach > 0 &&
        mach < 1 &&
        altitude !== null &&
        altitude >= -400 &&
        altitude <= 20_000
      ) {
        return { mach, altitude_m: altitude, found: true };
      }
    }
  }
  return { ...FALLBACK, found: false };
}

function round(v: number, digits: number): number {
  return Number(v.toPrecision(digits));
}

export const jetMachLapse: MigrationPart = (raw, notes) => {
  const aircraft = raw.aircraft;
  if (!isObj(aircraft) || !isObj(aircraft.powerplant)) return raw;
  const pp = aircraft.powerplant;
  if (pp.type !== 'jet' || pp.thrustLapse !== undefined) return raw;
  const tsfc = num(pp.tsfc_kg_Ns);
  const env = raw.environment;
  const dT = isObj(env) ? (num(env.isaOffset_K) ?? 0) : 0;
  const point = jetDesignPoint(raw);
  const f = TSFC_MACH_FACTOR.highBypass;
  const { thrustLapseExponent, ...rest } = pp;
  const out: Obj = {
    ...rest,
    thrustLapse: { engineClass: 'highBypass', throttleRatio: THROTTLE_RATIO },
  };
  let tsfcWords = 'its TSFC was left as it was (not a number)';
  if (tsfc !== null && tsfc > 0 && Math.abs(dT) <= 60) {
    const theta = atmosphereAt(point.altitude_m, dT).theta;
    const c1 = tsfc / ((1 + f * point.mach) * Math.sqrt(theta));
    out.tsfc_kg_Ns = round(c1, 6);
    out.tsfcMachFactor = round(f, 6);
    const where = `M ${point.mach} at ${point.altitude_m} m${point.found ? ' (the first Mach cruise)' : ' (no Mach cruise in the plan: a typical jet cruise)'}`;
    tsfcWords =
      `TSFC now rises with Mach and temperature, (c₁ + c₂·M)·√θ with c₂ = 1.2·c₁; c₁ = ` +
      `${round(fromSI(c1, 'lb_lbfh'), 4)} lb/(lbf·h) keeps the old ${round(fromSI(tsfc, 'lb_lbfh'), 4)} lb/(lbf·h) at ${where}`;
  }
  notes.push(
    `aircraft.powerplant: the jet's thrust now falls with Mach as well as with altitude ` +
      `(high-bypass turbofan lapse after Mattingly, throttle ratio ${THROTTLE_RATIO}, replacing σ^${String(thrustLapseExponent)}); ` +
      `the sea-level static thrust is kept. ${tsfcWords}. Expect less thrust at cruise than before — check climbs and cruise levels.`,
  );
  return { ...raw, aircraft: { ...aircraft, powerplant: out } };
};
