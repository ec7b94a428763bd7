/**
 * An independent reference for climbs, descents and glides: the energy equation
 * d(h + V²/2g)/dt = (T − D)·V/W (Anderson, Aircraft Performance and Design, ch. 5, from memory;
 * Raymer, Aircraft Design, ch. 17) integrated with odex over the specific energy
 * E = h + V(h)²/2g. At every step the altitude is recovered from E by Newton's method, and the
 * vertical speed from dh/dE differenced numerically on that inversion — no rate-of-climb
 * formula (nor acceleration factor) of the solver is used.
 */
import { G0 } from '../../../core/units.ts';
import { odexSolve } from './fixtures.ts';

export interface EnergyPath {
  /** The speed schedule: TAS at altitude h (independent of the mass here). */
  tas(h: number): number;
  /** Thrust power T·V, W, at altitude h, TAS V and mass m. */
  thrustPower(h: number, V: number, m: number): number;
  /** Drag, N. */
  drag(h: number, V: number, m: number): number;
  /** Consumption: fuel kg/s (then `burnsMass`) or battery drain W. */
  consumption(h: number, V: number, m: number): number;
  burnsMass: boolean;
}

export interface EnergyResult {
  time_s: number;
  groundDistance_m: number;
  /** Fuel kg or battery energy J used. */
  used: number;
  /** Air path length ∫V dt. */
  path_m: number;
  mass_kg: number;
}

/** Altitude with h + V(h)²/2g = E (Newton with a central-difference slope, from `guess`). */
function altitudeOf(path: EnergyPath, E: number, guess: number): number {
  const g = (h: number) => h + path.tas(h) ** 2 / (2 * G0) - E;
  let h = guess;
  for (let i = 0; i < 60; i++) {
    const slope = (g(h + 1e-3) - g(h - 1e-3)) / 2e-3;
    const step = g(h) / slope;
    h -= step;
    if (Math.abs(step) < 1e-11 * Math.max(1, Math.abs(h))) break;
  }
  return h;
}

/** Flies the path from h0 to h1 (up or down) from mass m0; calm air. */
export function energyReference(
  path: EnergyPath,
  h0: number,
  h1: number,
  m0: number,
): EnergyResult {
  const energy = (h: number) => h + path.tas(h) ** 2 / (2 * G0);
  const E0 = energy(h0);
  const E1 = energy(h1);
  const s = E1 >= E0 ? 1 : -1;
  let guess = h0;
  const hOf = (E: number) => (guess = altitudeOf(path, E, guess));
  // State over u = s·E: t, x, m, used, path.
  const y = odexSolve(
    (u, y) => {
      const E = s * u;
      const m = y[2]!;
      const h = hOf(E);
      const V = path.tas(h);
      const W = m * G0;
      const dEdt = (path.thrustPower(h, V, m) - path.drag(h, V, m) * V) / W;
      const eps = 1e-2;
      const dhdE = (altitudeOf(path, E + eps, h) - altitudeOf(path, E - eps, h)) / (2 * eps);
      const hdot = dhdE * dEdt;
      const dtdu = s / dEdt;
      const rate = path.consumption(h, V, m);
      return [
        dtdu,
        Math.sqrt(V * V - hdot * hdot) * dtdu,
        path.burnsMass ? -rate * dtdu : 0,
        rate * dtdu,
        V * dtdu,
      ];
    },
    s * E0,
    [0, 0, m0, 0, 0],
    s * E1,
  );
  return {
    time_s: y[0]!,
    groundDistance_m: y[1]!,
    mass_kg: y[2]!,
    used: y[3]!,
    path_m: y[4]!,
  };
}
