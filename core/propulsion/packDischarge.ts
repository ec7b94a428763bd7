/**
 * A mission profile flown on an equivalent-circuit pack (core/propulsion/batteryCircuit.ts):
 * legs at constant terminal power, each discharged in closed form, with the terminal voltage
 * along the way, its lowest value per leg (at the leg's end: the SoC is lowest there and the
 * load constant), and the first leg where the voltage reaches the controller's cut-off or the
 * demand exceeds the pack's maximum power — named with the voltage, as a failure.
 */
import { requireFinite, requirePositive } from '../errors.ts';
import {
  currentFor_A,
  cutoffSoc,
  maxPower_W,
  MIN_POWER_W,
  terminalVoltage_V,
  timeBetween_s,
  type PackModel,
} from './batteryCircuit.ts';

export interface PowerLeg {
  label: string;
  power_W: number;
  duration_s: number;
}

export interface PackLegResult {
  label: string;
  socStart: number;
  socEnd: number;
  /** Terminal voltage at the start and the end (the leg's lowest) of the leg. */
  voltageStart_V: number;
  voltageMin_V: number;
  current_A: number;
  /** (lowest voltage − cut-off)/cut-off. */
  cutoffMargin: number;
  time_s: number;
}

export interface PackDischarge {
  legs: PackLegResult[];
  failure: { legIndex: number; message: string } | null;
}

/** SoC after flying `duration` at power P from s1 (bisection on the closed-form time). */
function socAfter(m: PackModel, s1: number, P: number, duration: number, floor: number): number {
  let lo = floor;
  let hi = s1;
  for (let i = 0; i < 200 && hi - lo > 1e-15; i++) {
    const mid = 0.5 * (lo + hi);
    const t = timeBetween_s(m, mid, s1, P);
    if (t !== null && t > duration) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

const f = (v: number) => String(Number(v.toPrecision(4)));

export function dischargeProfile(
  m: PackModel,
  legs: readonly PowerLeg[],
  socStart = 1,
): PackDischarge {
  let s = requireFinite('socStart', socStart, 0, 1);
  const out: PackLegResult[] = [];
  for (let i = 0; i < legs.length; i++) {
    const leg = legs[i]!;
    const P = requireFinite(`legs.${i}.power_W`, leg.power_W, MIN_POWER_W, Infinity, 'W');
    const D = requirePositive(`legs.${i}.duration_s`, leg.duration_s, 's');
    const Vs = terminalVoltage_V(m, s, P);
    if (Vs === null) {
      const message = `${leg.label}: needs ${f(P)} W, more than the ${f(maxPower_W(m, s))} W the pack can deliver at ${f(100 * s)} % charge`;
      return { legs: out, failure: { legIndex: i, message } };
    }
    const floor = cutoffSoc(m, P);
    const toCutoff = s > floor ? timeBetween_s(m, floor, s, P) : 0;
    if (toCutoff === null) {
      // The cut-off lies below half the open-circuit voltage: the maximum power is reached first.
      const message = `${leg.label}: needs ${f(P)} W, more than the pack can deliver before its cut-off`;
      return { legs: out, failure: { legIndex: i, message } };
    }
    if (toCutoff < D) {
      const message =
        `${leg.label}: the pack voltage falls to the cut-off ${f(m.cutoff_V)} V ` +
        `(${f(m.cutoff_V / m.cellsSeries)} V a cell) after ${f(toCutoff)} s of ${f(D)} s at ${f(P)} W`;
      return { legs: out, failure: { legIndex: i, message } };
    }
    const end = socAfter(m, s, P, D, floor);
    const Ve = terminalVoltage_V(m, end, P) ?? 0;
    out.push({
      label: leg.label,
      socStart: s,
      socEnd: end,
      voltageStart_V: Vs,
      voltageMin_V: Ve,
      current_A: currentFor_A(m, end, P) ?? 0,
      cutoffMargin: (Ve - m.cutoff_V) / m.cutoff_V,
      time_s: D,
    });
    s = end;
  }
  return { legs: out, failure: null };
}
