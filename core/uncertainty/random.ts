/**
 * Reproducible random numbers for the Monte Carlo: xoroshiro128+ (Blackman & Vigna) from the
 * pure-rand library with an integer random seed, uniform doubles with 53 random bits
 * (pure-rand uniformFloat64), standard normal deviates by the Box–Muller transform
 * (Box & Muller, Ann. Math. Statist. 29, 1958), both deviates of each pair used.
 */
import { uniformFloat64 } from 'pure-rand/distribution/uniformFloat64';
import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';
import { InputError } from '../errors.ts';

export interface NormalSource {
  /** Uniform in [0, 1). */
  uniform(): number;
  /** Standard normal N(0, 1). */
  normal(): number;
}

export function normalSource(randomSeed: number): NormalSource {
  if (!Number.isSafeInteger(randomSeed) || randomSeed < -(2 ** 31) || randomSeed > 2 ** 31 - 1) {
    throw new InputError('seed', randomSeed, 'an integer between -2147483648 and 2147483647');
  }
  const rng = xoroshiro128plus(randomSeed);
  let spare: number | null = null;
  return {
    uniform: () => uniformFloat64(rng),
    normal: () => {
      if (spare !== null) {
        const z = spare;
        spare = null;
        return z;
      }
      // 1 − u lies in (0, 1], so the logarithm is finite.
      const r = Math.sqrt(-2 * Math.log(1 - uniformFloat64(rng)));
      const phi = 2 * Math.PI * uniformFloat64(rng);
      spare = r * Math.sin(phi);
      return r * Math.cos(phi);
    },
  };
}
