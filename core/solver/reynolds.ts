/**
 * Small-aircraft honesty: the chord Reynolds number Re = ρ·V·c/μ of the cruise and loiter
 * legs flown, with the mean geometric chord c = S/b (wing area over span; b = √(AR·S) from
 * the polar's aspect ratio when no span is given) and the air's viscosity μ by Sutherland's
 * law with the 1976 standard's coefficients (core/atmosphere.ts).
 *
 * Below about 2×10⁵ (common practice for wing sections; laminar separation bubbles form and
 * the section drag rises, CLmax falls) a polar measured or estimated at higher Reynolds
 * numbers is unreliable and optimistic; Legwise uses the same polar at every Reynolds number
 * (README, "What the models leave out"), so the solver warns instead.
 */
import type { Plan } from '../plan/schema.ts';
import { airFresh, type FlightModel } from './model.ts';
import { legName } from './legs/common.ts';
import { fmt } from './point.ts';
import type { LegResult } from './types.ts';

/** Chord Reynolds number below which a polar is not to be trusted (common practice). */
export const LOW_REYNOLDS = 2e5;

/** Re = ρ·V·c/μ. */
export function chordReynolds(
  rho_kg_m3: number,
  V_m_s: number,
  chord_m: number,
  mu_Pa_s: number,
): number {
  return (rho_kg_m3 * V_m_s * chord_m) / mu_Pa_s;
}

/** Mean geometric chord S/b: from the given span, else from the polar's aspect ratio; null if neither. */
export function meanChord_m(aircraft: Plan['aircraft']): number | null {
  const S = aircraft.wingArea_m2;
  if (aircraft.span_m !== undefined) return S / aircraft.span_m;
  const induced = aircraft.polar.induced;
  if (induced.by === 'geometry') return Math.sqrt(S / induced.AR);
  return null;
}

export interface LegReynolds {
  legIndex: number;
  /** The least chord Reynolds number of the leg (its mean TAS, the thinnest air it flies). */
  reynolds: number;
  tas_m_s: number;
  h_m: number;
  chord_m: number;
}

/** Chord Reynolds number of every flown cruise and loiter leg (empty without a chord). */
export function legReynolds(
  model: FlightModel,
  plan: Plan,
  legs: readonly LegResult[],
): LegReynolds[] {
  const chord = meanChord_m(plan.aircraft);
  if (chord === null) return [];
  const out: LegReynolds[] = [];
  for (const r of legs) {
    const leg = plan.legs[r.index];
    if (r.status !== 'flown' || (r.kind !== 'cruise' && r.kind !== 'loiter')) continue;
    if (!(r.meanTas_m_s > 0) || leg === undefined) continue;
    const aloft = 'windSource' in leg && leg.windSource === 'aloft';
    let least = Infinity;
    let at = r.start.h_m;
    for (const h of [r.start.h_m, r.end.h_m]) {
      const atm = airFresh(model, h, aloft);
      const re = chordReynolds(atm.rho_kg_m3, r.meanTas_m_s, chord, atm.mu_Pa_s);
      if (re < least) {
        least = re;
        at = h;
      }
    }
    out.push({
      legIndex: r.index,
      reynolds: least,
      tas_m_s: r.meanTas_m_s,
      h_m: at,
      chord_m: chord,
    });
  }
  return out;
}

/** Re as "1.52×10⁵". */
function scientific(v: number): string {
  const e = Math.floor(Math.log10(v));
  const m = v / 10 ** e;
  const sup = String(e).replace(/\d/g, (d) => '⁰¹²³⁴⁵⁶⁷⁸⁹'[Number(d)] as string);
  return `${m.toFixed(2)}×10${sup}`;
}

/** One warning per cruise or loiter leg flown below LOW_REYNOLDS. */
export function reynoldsWarnings(
  model: FlightModel,
  plan: Plan,
  legs: readonly LegResult[],
): string[] {
  return legReynolds(model, plan, legs)
    .filter((l) => l.reynolds < LOW_REYNOLDS)
    .map((l) => {
      const name = legName(l.legIndex, plan.legs[l.legIndex]!);
      return `${name}: chord Reynolds number ${scientific(l.reynolds)} (mean chord ${fmt(l.chord_m)} m, ${fmt(l.tas_m_s)} m/s at ${fmt(l.h_m)} m) is below about ${scientific(LOW_REYNOLDS)} (common practice): the polar is unreliable there and likely optimistic (more drag, lower CLmax than assumed).`;
    });
}
