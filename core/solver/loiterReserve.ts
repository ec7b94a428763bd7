/**
 * "Loiter until reserve": the amount c of fuel (kg) or battery energy (J) the loiter may use
 * so that the rest of the plan lands with exactly the required reserve.
 *
 * F(c) = (consumable left on landing) − (required reserve), each trial flying the loiter for
 * c and then the rest of the plan. F falls with c almost linearly (slope ≈ −(1 + contingency
 * fraction); a lighter aircraft burns a little less afterwards), so the search runs on c
 * rather than on the loiter time: a secant step from the slope guess, then Illinois regula
 * falsi on a bracket [c_ok, c_short] with F(c_ok) ≥ 0; a trial whose rest of the plan fails
 * (e.g. runs dry) counts as short and is bisected. At most MAX_TRIALS trials; the answer is
 * always the safe end of the bracket, so the reserve is kept, not broken by rounding.
 */

export const MAX_TRIALS = 60;

export interface LoiterSearch {
  consume: number;
  /** 'ok': found; 'none': even no loiter leaves less than the reserve; 'restFails': the rest fails anyway. */
  status: 'ok' | 'none' | 'restFails';
  trials: number;
}

/**
 * `F(c)` returns the landing surplus over the reserve, or null when the rest of the plan
 * cannot be flown; `cMax` is all that is on board; `slope` the expected −dF/dc.
 */
export function searchLoiterConsumption(
  F: (c: number) => number | null,
  cMax: number,
  slope: number,
  tolerance: number,
): LoiterSearch {
  const F0 = F(0);
  if (F0 === null) return { consume: 0, status: 'restFails', trials: 1 };
  if (F0 < 0) return { consume: 0, status: 'none', trials: 1 };
  if (!(cMax > 0)) return { consume: 0, status: 'ok', trials: 1 };
  let lo = 0;
  let Flo = F0;
  let hi = cMax;
  let hiTried = false;
  // Regula-falsi weights at the bracket ends (Illinois halves the one retained twice).
  let wLo = F0;
  let wHi: number | null = null;
  let lastMoved: 'lo' | 'hi' | null = null;
  let trials = 1;
  while (trials < MAX_TRIALS && Flo > tolerance && hi - lo > 1e-13 * cMax) {
    let c: number;
    if (wHi !== null) c = lo + (wLo * (hi - lo)) / (wLo - wHi);
    else {
      c = lo + Flo / slope;
      if (!(c < hi)) c = hiTried ? 0.5 * (lo + hi) : hi;
    }
    if (!(c > lo && (c < hi || (c === hi && !hiTried)))) c = 0.5 * (lo + hi);
    const Fc = F(c);
    trials++;
    if (Fc !== null && Fc >= 0) {
      if (c >= hi) return { consume: hi, status: 'ok', trials };
      if (lo > 0 || Flo > Fc) slope = Math.max((Flo - Fc) / (c - lo), 1e-6 * slope);
      lo = c;
      Flo = Fc;
      wLo = Fc;
      if (lastMoved === 'lo' && wHi !== null) wHi *= 0.5;
      lastMoved = 'lo';
    } else {
      hi = c;
      hiTried = true;
      wHi = Fc;
      if (lastMoved === 'hi') wLo *= 0.5;
      lastMoved = 'hi';
    }
  }
  return { consume: lo, status: 'ok', trials };
}
