import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/errors.ts';
import { bestCruiseAltitude } from '../../../core/optimize/altitudeSweep.ts';
import { solvePlan } from '../../../core/solver/solve.ts';
import type { Plan } from '../../../core/plan/schema.ts';
import type { WindLevel } from '../../../core/weather/windsAloft.ts';
import { mission, propCruiseByFuel } from './fixtures.ts';

/** The jet mission with every climb, cruise and descent leg in the winds-aloft table. */
function jetInTable(levels: WindLevel[]): Plan {
  const plan = mission('jet', 1_500_000);
  plan.environment.windsAloft = levels;
  for (const leg of plan.legs) if ('windSource' in leg || 'wind' in leg) leg.windSource = 'aloft';
  return plan;
}

describe('bestCruiseAltitude', () => {
  it('a jet prefers a higher cruise altitude than a piston propeller aircraft', () => {
    // Common practice: jet range grows with altitude (thinner air at the same CL means more
    // speed for the same TSFC), a normally aspirated piston gains little and pays to climb.
    const jet = bestCruiseAltitude(mission('jet', 1_500_000), { points: 13 });
    const piston = bestCruiseAltitude(mission('prop', 500_000), { points: 13 });
    expect(jet.best).not.toBeNull();
    expect(piston.best).not.toBeNull();
    expect(jet.best!.altitude_m).toBeGreaterThan(piston.best!.altitude_m + 3000);
  });

  it('the best altitude leaves at least as much on landing as every feasible grid point', () => {
    const r = bestCruiseAltitude(mission('jet', 1_500_000), { points: 9 });
    r.curve.remaining.forEach((v, i) => {
      if (r.curve.feasible[i]) expect(r.best!.remaining).toBeGreaterThanOrEqual(v);
    });
    // The answer is a real mission: solving it at that altitude gives the same remainder
    // (consistency with the solver, relative 1e-9).
    const plan = mission('jet', 1_500_000);
    (plan.legs[1] as { toAltitude_m: number }).toAltitude_m = r.best!.altitude_m;
    const solved = solvePlan(plan).landing.remaining;
    expect(Math.abs(solved - r.best!.remaining) / solved).toBeLessThan(1e-9);
  });

  it('says when the best altitude is the top of the grid: the ceiling here', () => {
    // Common practice: a jet's range keeps growing with altitude in this range, so with the
    // fixture's 13 000 m ceiling the best altitude is the ceiling itself.
    const r = bestCruiseAltitude(mission('jet', 1_500_000), { points: 9 });
    expect(r.top_m - r.best!.altitude_m).toBeLessThanOrEqual(1); // the 1 m of AltitudeSweepResult.limitedBy
    expect(r.limitedBy).toBe('ceiling');
    expect(r.bottom_m).toBe(300); // departure 0 m + MIN_HEIGHT_ABOVE_DEPARTURE_M
    const piston = bestCruiseAltitude(mission('prop', 500_000), { points: 9 });
    expect(piston.limitedBy).toBeNull();
  });

  it('with a strong headwind high up and light wind low, picks a lower altitude than in calm air', () => {
    // The legs fly east (course 090); a wind from 090 is a pure headwind (meteorological
    // convention). A jet-stream-like profile (common practice: winds aloft strengthen toward
    // the tropopause): 5–10 m/s up to 8 km, 90 m/s at 10 km, 120 m/s at 13 km.
    const calm = bestCruiseAltitude(
      jetInTable([
        { altitude_m: 0, from_deg: 90, speed_m_s: 0 },
        { altitude_m: 13000, from_deg: 90, speed_m_s: 0 },
      ]),
      { points: 13 },
    );
    const windy = bestCruiseAltitude(
      jetInTable([
        { altitude_m: 0, from_deg: 90, speed_m_s: 5 },
        { altitude_m: 8000, from_deg: 90, speed_m_s: 10 },
        { altitude_m: 10000, from_deg: 90, speed_m_s: 90 },
        { altitude_m: 13000, from_deg: 90, speed_m_s: 120 },
      ]),
      { points: 13 },
    );
    expect(calm.best).not.toBeNull();
    expect(windy.best).not.toBeNull();
    // In calm air the jet's best altitude is near the top (common practice, first test).
    expect(calm.best!.altitude_m).toBeGreaterThan(11_000);
    expect(windy.best!.altitude_m).toBeLessThan(calm.best!.altitude_m - 2000);
    // Below the jet stream the table is light: the lower level really leaves more fuel.
    expect(windy.best!.remaining).toBeGreaterThan(
      windy.curve.remaining[windy.curve.remaining.length - 1]!,
    );
  });

  it('marks the altitudes where the mission fails as infeasible, with finite numbers', () => {
    // The electric UAV pays for every metre of climb from its pack; flown high enough, the
    // 30 km mission no longer fits the battery.
    const r = bestCruiseAltitude(mission('electric', 30_000), { points: 11 });
    expect(r.curve.feasible.some((f) => f)).toBe(true);
    expect(r.curve.feasible.some((f) => !f)).toBe(true);
    r.curve.remaining.forEach((v, i) => {
      expect(Number.isFinite(v)).toBe(true);
      expect(Number.isFinite(r.curve.altitude_m[i]!)).toBe(true);
      if (!r.curve.feasible[i]) expect(v).toBe(0);
    });
  });

  it('stops the grid where the climb can go no higher, below the ceiling', () => {
    const plan = mission('prop', 300_000);
    plan.aircraft.ceiling_m = 12_000;
    const r = bestCruiseAltitude(plan, { points: 7, refine: false });
    expect(r.top_m).toBeLessThan(12_000);
    expect(r.curve.altitude_m[r.curve.altitude_m.length - 1]).toBe(r.top_m);
    // Departure elevation + 300 m is the bottom of the grid (common practice floor).
    expect(r.curve.altitude_m[0]).toBe(plan.environment.departureElevation_m + 300);
  });

  it('never changes the plan and refuses a plan without a climb before the cruise', () => {
    const plan = mission('prop', 300_000);
    const before = JSON.stringify(plan);
    bestCruiseAltitude(plan, { points: 5 });
    expect(JSON.stringify(plan)).toBe(before);
    expect(() => bestCruiseAltitude(propCruiseByFuel(50))).toThrow(InputError);
  });
});

describe('bestCruiseAltitude snapped to levels people fly', () => {
  // 500 ft steps and 100 m steps (common practice); ft = 0.3048 m exactly.
  const FT = 0.3048;
  it('the suggested level is on the grid, next to the optimum, and no worse than its neighbour', () => {
    const plan = mission('prop', 500_000);
    const r = bestCruiseAltitude(plan, { points: 9, levels: { step: 'ft500' } });
    expect(r.best).not.toBeNull();
    const level = r.level!;
    expect(level).not.toBeNull();
    const ft = level.altitude_m / FT;
    expect(Math.abs(ft / 500 - Math.round(ft / 500))).toBeLessThan(1e-9);
    expect(Math.abs(level.altitude_m - r.best!.altitude_m)).toBeLessThan(500 * FT);
    // The optimum is the best continuous altitude: a level never beats it (beyond solver noise).
    expect(level.remaining).toBeLessThanOrEqual(r.best!.remaining * (1 + 1e-9));
    // Solving the plan at the level gives the remainder reported (consistency, relative 1e-9).
    (plan.legs[1] as { toAltitude_m: number }).toAltitude_m = level.altitude_m;
    const solved = solvePlan(plan).landing.remaining;
    expect(Math.abs(solved - level.remaining) / solved).toBeLessThan(1e-9);
  });

  it('100 m steps land on whole hundreds of metres; no levels option, no level field', () => {
    const r = bestCruiseAltitude(mission('prop', 500_000), { points: 9, levels: { step: 'm100' } });
    expect(r.level!.altitude_m % 100).toBe(0);
    expect('level' in bestCruiseAltitude(mission('prop', 500_000), { points: 5 })).toBe(false);
  });
});
