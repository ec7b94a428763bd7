/**
 * Migration part (schema 1 → 2): a propeller whose efficiency was one constant gets the
 * momentum-theory curve (core/propulsion/propellerCurve.ts), calibrated so that the old
 * constant becomes the efficiency at the cruise point — so the old plan keeps its numbers at
 * its design point and gets the efficiency falling at low speed (climb, take-off) that the
 * constant left out.
 *
 * Defaults: the diameter is aircraft.field.propDiameter_m where the file has it (moved, so
 * there is one diameter), else the two-blade sizing D = 22 in·(P/hp)^(1/4) (Raymer, Aircraft
 * Design: A Conceptual Approach, ch. 10, from memory); the cruise point is 75 % power (common
 * practice) at the altitude of the first cruise leg (the last climb's target before it, else
 * the departure elevation), at the speed that power gives level at MTOW.
 */
import type { RawPlan } from '../migrate.ts';
import type { MigrationPart } from './v1to2.ts';

const INCH_M = 0.0254;
const HP_W = 745.69987158227;

function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function finite(v: unknown): number | null {
  return typeof v === 'number' && Number.isFinite(v) ? v : null;
}

/** Raymer's two-blade propeller sizing, D = 22 in·(P/hp)^(1/4), kept inside the schema's bounds. */
export function sizedDiameter_m(power_W: number): number {
  const D = 22 * INCH_M * Math.pow(power_W / HP_W, 0.25);
  return Math.min(6, Math.max(0.05, Number(D.toPrecision(3))));
}

function cruiseAltitude(raw: RawPlan): number {
  let h: number | null = null;
  const env = raw.environment;
  if (isRecord(env)) h = finite(env.departureElevation_m);
  if (Array.isArray(raw.legs)) {
    for (const leg of raw.legs) {
      if (!isRecord(leg)) continue;
      if (leg.kind === 'cruise') break;
      if (leg.kind === 'climb') h = finite(leg.toAltitude_m) ?? h;
    }
  }
  return Math.min(15_000, Math.max(-400, h ?? 0));
}

export const propellerCurvePart: MigrationPart = (raw, notes) => {
  const ac = raw.aircraft;
  if (!isRecord(ac) || !isRecord(ac.powerplant)) return raw;
  const pp = ac.powerplant;
  if (pp.type !== 'propeller' && pp.type !== 'electric') return raw;
  if (pp.propeller !== undefined) return raw;
  const power = finite(pp.type === 'propeller' ? pp.maxPowerSL_W : pp.maxShaftPower_W);
  if (power === null || !(power > 0)) return raw;
  const field = isRecord(ac.field) ? ac.field : null;
  const given = field ? finite(field.propDiameter_m) : null;
  const diameter = given !== null && given > 0 ? given : sizedDiameter_m(power);
  const altitude = cruiseAltitude(raw);
  const newAircraft: Record<string, unknown> = {
    ...ac,
    powerplant: {
      ...pp,
      propeller: {
        model: 'momentum',
        diameter_m: diameter,
        cruiseAltitude_m: altitude,
        cruisePowerFraction: 0.75,
      },
    },
  };
  if (field && given !== null) {
    const rest = { ...field };
    delete rest.propDiameter_m;
    newAircraft.field = rest;
  }
  const eta = finite(pp.propEfficiency);
  const from =
    given !== null && given > 0
      ? `the diameter ${diameter} m from aircraft.field.propDiameter_m (moved there)`
      : `a diameter of ${diameter} m estimated from the engine power (two-blade sizing; set your propeller's)`;
  notes.push(
    `Propeller efficiency now varies with airspeed (momentum theory): the old constant ${eta ?? ''} is the efficiency at the cruise point (75 % power at ${altitude} m), with ${from}. Climb and low-speed thrust are lower than before.`,
  );
  return { ...raw, aircraft: newAircraft };
};
