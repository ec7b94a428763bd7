/**
 * Battery pack as an equivalent circuit: open-circuit voltage vs state of charge behind an
 * internal resistance (the zeroth-order Thevenin model; e.g. Plett, Battery Management
 * Systems, vol. 1, ch. 2 — from memory). Cells in series Ns and in parallel Np:
 *   E(SoC) = Ns·OCV_cell(SoC), R = (Ns/Np)·R_cell·f_R(T), Q = Np·Q_cell·f_Q(T).
 * For a terminal power P the current solves P = V·I with V = E − I·R, i.e. R·I² − E·I + P = 0;
 * the physical (lower-current, higher-voltage) root I = 2P/(E + √(E² − 4RP)) exists while
 * P ≤ E²/(4R), the pack's maximum power. Charge is drawn as dQ/dt = −I.
 *
 * Constant power over a piece of the OCV table where E is linear in SoC (E = a + b·s): dt =
 * Q·ds/I with 1/I = (E + √(E² − c))/(2P), c = 4RP, integrates in closed form (header of
 * `timeBetween`), so a leg at constant power is discharged exactly, without steps.
 *
 * Defaults (common practice, from memory): a Li-ion (NMC) cell OCV table 3.0–4.2 V; cold
 * lowers the usable capacity and raises the resistance (tables below, linear between points;
 * no extrapolation outside −20…60 °C). Left out: RC (polarisation) branches and their time
 * constants, self-heating of the cells, hysteresis, ageing, cell-to-cell spread, Peukert-type
 * rate effects on capacity beyond the resistance.
 */
import { InputError, requireFinite, requirePositive } from '../errors.ts';

export interface OcvPoint {
  soc: number;
  voltage_V: number;
}

export interface CircuitPack {
  cellsSeries: number;
  cellsParallel: number;
  /** Rated capacity of one cell at 25 °C, A·s (1 Ah = 3600 A·s). */
  cellCapacity_As: number;
  /** Internal resistance of one cell at 25 °C, Ω. */
  cellResistance_ohm: number;
  /** Controller cut-off, per cell, V. */
  cutoffVoltage_V: number;
  /** Open-circuit voltage of one cell vs SoC, SoC from 0 to 1, both strictly increasing. */
  ocv?: readonly OcvPoint[];
  /** Cell temperature in flight (default 298.15 K, 25 °C). */
  cellTemperature_K?: number;
}

/** Li-ion (NMC) cell OCV vs SoC — common practice, from memory (typical published curves). */
export const LI_ION_OCV: readonly OcvPoint[] = Object.freeze([
  { soc: 0, voltage_V: 3.0 },
  { soc: 0.05, voltage_V: 3.3 },
  { soc: 0.1, voltage_V: 3.45 },
  { soc: 0.2, voltage_V: 3.55 },
  { soc: 0.3, voltage_V: 3.62 },
  { soc: 0.4, voltage_V: 3.67 },
  { soc: 0.5, voltage_V: 3.72 },
  { soc: 0.6, voltage_V: 3.78 },
  { soc: 0.7, voltage_V: 3.85 },
  { soc: 0.8, voltage_V: 3.93 },
  { soc: 0.9, voltage_V: 4.05 },
  { soc: 1, voltage_V: 4.2 },
]);

/** Cell temperature (°C) → usable-capacity factor and resistance factor; common practice, from memory. */
export const TEMPERATURE_FACTORS: readonly {
  celsius: number;
  capacity: number;
  resistance: number;
}[] = Object.freeze([
  { celsius: -20, capacity: 0.7, resistance: 4 },
  { celsius: -10, capacity: 0.8, resistance: 2.6 },
  { celsius: 0, capacity: 0.88, resistance: 1.8 },
  { celsius: 10, capacity: 0.95, resistance: 1.3 },
  { celsius: 25, capacity: 1, resistance: 1 },
  { celsius: 40, capacity: 1, resistance: 0.85 },
  { celsius: 60, capacity: 1, resistance: 0.75 },
]);

/** The pack's constants, checked once. */
export interface PackModel {
  /** Pack OCV breakpoints: SoC and E (V), ascending. */
  soc: readonly number[];
  E_V: readonly number[];
  R_ohm: number;
  Q_As: number;
  cutoff_V: number;
  cellsSeries: number;
}

function interpolate(xs: readonly number[], ys: readonly number[], x: number): number {
  let i = 1;
  while (i < xs.length - 1 && xs[i]! < x) i++;
  const x0 = xs[i - 1]!;
  const x1 = xs[i]!;
  return ys[i - 1]! + ((ys[i]! - ys[i - 1]!) * (x - x0)) / (x1 - x0);
}

function positiveInteger(field: string, v: number): number {
  if (!Number.isInteger(v) || v < 1 || v > 10_000)
    throw new InputError(field, v, 'a whole number from 1 to 10000');
  return v;
}

/** Checks the pack and builds its constants (InputError naming the field otherwise). */
export function packModel(pack: CircuitPack, field = 'battery'): PackModel {
  const Ns = positiveInteger(`${field}.cellsSeries`, pack.cellsSeries);
  const Np = positiveInteger(`${field}.cellsParallel`, pack.cellsParallel);
  const Qc = requirePositive(`${field}.cellCapacity_As`, pack.cellCapacity_As, 'A·s');
  const Rc = requirePositive(`${field}.cellResistance_ohm`, pack.cellResistance_ohm, 'Ω');
  const table = pack.ocv ?? LI_ION_OCV;
  if (table.length < 2) throw new InputError(`${field}.ocv`, table.length, 'at least 2 points');
  table.forEach((p, i) => {
    requireFinite(`${field}.ocv.${i}.soc`, p.soc, 0, 1);
    requirePositive(`${field}.ocv.${i}.voltage_V`, p.voltage_V, 'V');
    if (i === 0) return;
    const prev = table[i - 1]!;
    if (!(p.soc > prev.soc))
      throw new InputError(
        `${field}.ocv.${i}.soc`,
        p.soc,
        `above ${prev.soc} (SoC strictly increasing)`,
      );
    if (!(p.voltage_V > prev.voltage_V)) {
      throw new InputError(
        `${field}.ocv.${i}.voltage_V`,
        p.voltage_V,
        `above ${prev.voltage_V} V (the OCV must rise with SoC)`,
      );
    }
  });
  const first = table[0]!;
  const last = table[table.length - 1]!;
  if (first.soc !== 0)
    throw new InputError(`${field}.ocv.0.soc`, first.soc, '0 (the table spans SoC 0 to 1)');
  if (last.soc !== 1)
    throw new InputError(
      `${field}.ocv.${table.length - 1}.soc`,
      last.soc,
      '1 (the table spans SoC 0 to 1)',
    );
  const cut = requirePositive(`${field}.cutoffVoltage_V`, pack.cutoffVoltage_V, 'V');
  if (!(cut < last.voltage_V)) {
    throw new InputError(
      `${field}.cutoffVoltage_V`,
      cut,
      `below the full-charge cell voltage ${last.voltage_V} V`,
    );
  }
  const T = requireFinite(
    `${field}.cellTemperature_K`,
    pack.cellTemperature_K ?? 298.15,
    253.15,
    333.15,
    'K',
  );
  const c = T - 273.15;
  const temps = TEMPERATURE_FACTORS.map((f) => f.celsius);
  const fQ = interpolate(
    temps,
    TEMPERATURE_FACTORS.map((f) => f.capacity),
    c,
  );
  const fR = interpolate(
    temps,
    TEMPERATURE_FACTORS.map((f) => f.resistance),
    c,
  );
  return {
    soc: table.map((p) => p.soc),
    E_V: table.map((p) => Ns * p.voltage_V),
    R_ohm: (Ns / Np) * Rc * fR,
    Q_As: Np * Qc * fQ,
    cutoff_V: Ns * cut,
    cellsSeries: Ns,
  };
}

/** Pack open-circuit voltage at SoC s ∈ [0, 1] (linear in the table; monotone). */
export function packOcv_V(m: PackModel, soc: number): number {
  requireFinite('soc', soc, 0, 1);
  return interpolate(m.soc, m.E_V, soc);
}

/** Largest terminal power at SoC s: E²/(4R) (at V = E/2). */
export function maxPower_W(m: PackModel, soc: number): number {
  const E = packOcv_V(m, soc);
  return (E * E) / (4 * m.R_ohm);
}

/** Current for a terminal power P ≥ 0 at SoC s, the lower root of R·I² − E·I + P = 0; null beyond the maximum power. */
export function currentFor_A(m: PackModel, soc: number, power_W: number): number | null {
  const P = requireFinite('power_W', power_W, 0, Infinity, 'W');
  const E = packOcv_V(m, soc);
  const disc = E * E - 4 * m.R_ohm * P;
  if (disc < 0) return null;
  return (2 * P) / (E + Math.sqrt(disc));
}

/** Terminal voltage E − I·R at SoC s and power P; null beyond the maximum power. */
export function terminalVoltage_V(m: PackModel, soc: number, power_W: number): number | null {
  const I = currentFor_A(m, soc, power_W);
  return I === null ? null : packOcv_V(m, soc) - I * m.R_ohm;
}

/**
 * Time to go from SoC s1 down to s0 < s1 at constant power P > 0 (every piece of E = a + b·s
 * in closed form): t = (Q/(2P))·∫(E + √(E² − c)) ds, c = 4RP, and with dE = b·ds
 * ∫(E + √(E² − c)) dE = E²/2 + (E·√(E² − c) − c·ln(E + √(E² − c)))/2. Null if P exceeds the
 * maximum power anywhere on the way.
 */
export function timeBetween_s(
  m: PackModel,
  s0: number,
  s1: number,
  power_W: number,
): number | null {
  // Below a milliwatt the time overflows long before it means anything for a flight.
  const P = requireFinite('power_W', power_W, MIN_POWER_W, Infinity, 'W');
  if (!(s1 >= s0)) throw new InputError('soc', s1, `at least ${s0}`);
  const c = 4 * m.R_ohm * P;
  const F = (E: number) => {
    const r = Math.sqrt(Math.max(0, E * E - c));
    return 0.5 * E * E + 0.5 * (E * r - c * Math.log(E + r));
  };
  let t = 0;
  for (let i = 1; i < m.soc.length; i++) {
    const lo = Math.max(s0, m.soc[i - 1]!);
    const hi = Math.min(s1, m.soc[i]!);
    if (!(hi > lo)) continue;
    const Elo = packOcv_V(m, lo);
    const Ehi = packOcv_V(m, hi);
    if (Elo * Elo < c) return null;
    const b = (m.E_V[i]! - m.E_V[i - 1]!) / (m.soc[i]! - m.soc[i - 1]!);
    if (Ehi - Elo > 1e-4 * Ehi) {
      t += (m.Q_As / (2 * P)) * ((F(Ehi) - F(Elo)) / b);
    } else {
      // A nearly flat piece: F(Ehi) − F(Elo) cancels; Simpson's rule, error O(ΔE⁴), instead.
      const g = (E: number) => E + Math.sqrt(Math.max(0, E * E - c));
      const mid = g(0.5 * (Elo + Ehi));
      t += ((m.Q_As / (2 * P)) * ((hi - lo) * (g(Elo) + 4 * mid + g(Ehi)))) / 6;
    }
  }
  return t;
}

/** Smallest constant power a discharge is worked out for (1 mW). */
export const MIN_POWER_W = 1e-3;

/** The SoC where the terminal voltage at power P equals the cut-off: E = Vc + P·R/Vc. */
export function cutoffSoc(m: PackModel, power_W: number): number {
  const E = m.cutoff_V + (power_W * m.R_ohm) / m.cutoff_V;
  if (E <= m.E_V[0]!) return 0;
  if (E >= m.E_V[m.E_V.length - 1]!) return 1;
  return interpolate(m.E_V, m.soc, E);
}
