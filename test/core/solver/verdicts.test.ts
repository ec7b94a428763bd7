/**
 * Honest verdicts: each false verdict once found in plans a user could write, as a plan with
 * the verdict it must get, in the solver and as the CLI's exit code (0 = no check fails,
 * 1 = a check fails; cli/common.ts). Sources: the reserve rule as operators state it (a final
 * reserve time at normal cruising speed, e.g. 14 CFR 91.151(a), 91.167(a)(3)); a reserve
 * altitude at least 300 m (about 1000 ft) above the field, common practice; the shape of a
 * flight (take-off before landing, nothing flown after the landing, no descent below the
 * field, ending at the arrival elevation), common practice / by definition.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runCli } from '../../../cli/main.ts';
import { newPlan } from '../../../core/plan/defaults.ts';
import { parsePlan } from '../../../core/plan/load.ts';
import { PlanSchema, type Plan } from '../../../core/plan/schema.ts';
import { describeCheck, describeMargin } from '../../../core/solver/describe.ts';
import { solvePlan } from '../../../core/solver/solve.ts';
import type { Check, PlanResult } from '../../../core/solver/types.ts';
import { demoJson, setAt } from '../plan/demoPlans.ts';

const EXAMPLES = [
  'light-jet.json',
  'piston-tourer.json',
  'route-survey.json',
  'survey-uav-electric.json',
  'twelve-legs.json',
] as const;

/** A demo plan with edits at dotted paths, validated. */
function demo(file: string, edits: Record<string, unknown> = {}): Plan {
  const raw = demoJson(file);
  for (const [path, value] of Object.entries(edits)) setAt(raw, path, value);
  const r = parsePlan(raw);
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  return r.plan;
}

/** The CLI's exit code for a plan (served from memory, not the disk). */
function exitCode(plan: Plan): number {
  const path = '/virtual/plan.json';
  return runCli(['solve', path], {
    stdout: () => undefined,
    stderr: () => undefined,
    readFile: (p) => (p === path ? JSON.stringify(plan) : readFileSync(p, 'utf8')),
  });
}

function check(r: PlanResult, id: string): Check {
  const c = r.checks.find((x) => x.id === id);
  if (c === undefined) throw new Error(`no check ${id}`);
  return c;
}

describe('false OK: a reserve that cannot be flown fails', () => {
  it('piston tourer with the alternate at 7000 m above its 4300 m ceiling', () => {
    const plan = demo('piston-tourer.json', { 'reserves.alternateAltitude_m': 7000 });
    const r = solvePlan(plan);
    expect(r.reserve.kept).toBe(false);
    expect(r.reserve.problems.map((p) => [p.part, p.why])).toEqual([['alternate', 'aboveCeiling']]);
    const c = check(r, 'reserve');
    expect(c.state).toBe('fails');
    expect(describeCheck(c, 'aviation')).toMatch(
      /^The reserve cannot be flown: the alternate altitude 22970 ft is above the ceiling \(14110 ft pressure altitude\)\.$/,
    );
    expect(r.verdict).toBe('fails');
    expect(exitCode(plan)).toBe(1);
  });

  it('a hold the power cannot hold fails, naming the power', () => {
    // Normal cruise at 68 m/s TAS (flyable at the 2440 m cruise altitude) held at 4250 m,
    // just below the 4300 m ceiling: the engine's power has lapsed below what level flight needs.
    const plan = demo('piston-tourer.json', {
      'legs.3.speed': { kind: 'tas', speed_m_s: 68 },
      'reserves.holdAltitude_m': 4250,
    });
    const r = solvePlan(plan);
    expect(r.completed).toBe(true);
    const p = r.reserve.problems[0];
    expect(p?.why).toBe('powerShort');
    expect(p!.required_W).toBeGreaterThan(p!.available_W);
    const c = check(r, 'reserve');
    expect(c.state).toBe('fails');
    expect(describeCheck(c, 'si')).toMatch(
      /^The reserve cannot be flown: the final reserve needs [\d.]+ kW of thrust power at 4250 m, [\d.]+ kW available\.$/,
    );
    expect(exitCode(plan)).toBe(1);
  });

  it('hold and alternate 1.2 km below the arrival field are refused by the check', () => {
    // The tourer flies to a field at 1500 m; hold and alternate left at 300 m.
    const plan = demo('piston-tourer.json', {
      'environment.arrivalElevation_m': 1500,
      'legs.4.toAltitude_m': 1500,
      'reserves.holdAltitude_m': 300,
      'reserves.alternateAltitude_m': 300,
    });
    const r = solvePlan(plan);
    expect(r.completed).toBe(true);
    expect(r.reserve.problems.map((p) => [p.part, p.why])).toEqual([
      ['alternate', 'belowField'],
      ['hold', 'belowField'],
    ]);
    // limit: arrival elevation 1500 m + the 300 m default minimum height (common practice)
    expect(r.reserve.problems.every((p) => p.limit === 1800)).toBe(true);
    expect(check(r, 'reserve').detail).toMatch(/below the arrival field \(1500 m\) \+ 300 m/);
    expect(r.verdict).toBe('fails');
    expect(exitCode(plan)).toBe(1);
  });

  it('the minimum height above the field is the user’s setting', () => {
    // Hold 420 m above the field: passes the 300 m default, fails a 500 m setting.
    expect(solvePlan(demo('piston-tourer.json')).reserve.problems).toEqual([]);
    const strict = solvePlan(demo('piston-tourer.json', { 'reserves.minHeightAboveField_m': 500 }));
    expect(strict.reserve.problems[0]?.why).toBe('belowField');
    expect(strict.reserve.problems[0]?.limit).toBe(680);
  });
});

describe('false OK: the reserve by the operators’ rule', () => {
  it('a tourer landing between the endurance and the normal-cruise reserve is short', () => {
    // Find the fuel load that lands halfway between the two required reserves.
    const base = demo('piston-tourer.json');
    const cruiseRule = solvePlan(base);
    const enduranceRule = solvePlan(
      demo('piston-tourer.json', { 'reserves.finalReserveSpeed': 'bestEndurance' }),
    );
    const need = cruiseRule.reserve.required.total;
    const needEndurance = enduranceRule.reserve.required.total;
    expect(need).toBeGreaterThan(needEndurance); // cruise burns more per hour than best endurance
    const pp = base.aircraft.powerplant;
    if (pp.type === 'electric') throw new Error('fuel aircraft expected');
    const cut = cruiseRule.landing.remaining - 0.5 * (need + needEndurance);
    const edits = { 'aircraft.powerplant.fuel.load_kg': pp.fuel.load_kg - cut };
    const short = solvePlan(demo('piston-tourer.json', edits));
    const old = solvePlan(
      demo('piston-tourer.json', { ...edits, 'reserves.finalReserveSpeed': 'bestEndurance' }),
    );
    expect(old.reserve.kept).toBe(true); // the best-endurance rule would call it kept
    expect(short.reserve.kept).toBe(false); // normal cruise: not kept
    expect(check(short, 'reserve').state).toBe('fails');
    expect(short.reserve.requiredTime_s).toBeGreaterThan(short.reserve.remainingTime_s);
    expect(exitCode(demo('piston-tourer.json', edits))).toBe(1);
  });

  it('the reserve shows in minutes in the check, in the user’s units', () => {
    const r = solvePlan(demo('piston-tourer.json'));
    const text = describeCheck(check(r, 'reserve'), 'aviation');
    expect(text).toMatch(
      /^On landing [\d.]+ lb \(\d+ h \d\d min at normal cruise\) left against [\d.]+ lb \(\d+ min; final reserve 45 min\) of reserve required\.$/,
    );
  });
});

describe('false OK: impossible geometry fails, naming the legs', () => {
  it('legs in reverse order', () => {
    const plan = demo('piston-tourer.json');
    plan.legs.reverse();
    const r = solvePlan(PlanSchema.parse(plan));
    const c = check(r, 'shape:order');
    expect(c.state).toBe('fails');
    expect(c.legIndices).toContain(5); // the take-off now comes after the landing (leg 1)
    expect(describeCheck(c, 'si')).toMatch(
      /Leg 6 “Start, taxi and take-off” \(takeoff\) comes after the landing Leg 1/,
    );
    expect(r.verdict).toBe('fails');
    expect(exitCode(plan)).toBe(1);
  });

  it('a mission that ends 5 km below the arrival elevation', () => {
    // Arrival field at 5000 m, the descent still to 180 m.
    const plan = demo('piston-tourer.json', { 'environment.arrivalElevation_m': 5000 });
    const r = solvePlan(plan);
    const arrival = check(r, 'shape:arrival');
    expect(arrival.state).toBe('fails');
    expect(describeMargin(arrival, 'si')).toBe('-4820 m');
    // the descent to 180 m is not below the lower field (the departure at 120 m): order is fine
    expect(check(r, 'shape:order').state).toBe('ok');
    expect(r.verdict).toBe('fails');
    expect(exitCode(plan)).toBe(1);
  });

  it('a descent below the field fails, naming the leg', () => {
    const plan = demo('piston-tourer.json', { 'legs.4.toAltitude_m': -300 });
    const r = solvePlan(plan);
    const order = check(r, 'shape:order');
    expect(order.state).toBe('fails');
    expect(order.legIndices).toEqual([4]);
    expect(describeCheck(order, 'aviation')).toMatch(
      /Leg 5 “Descent to the field” \(descent\) descends to -980 ft, below the field \(390 ft\)/,
    );
    expect(exitCode(plan)).toBe(1);
  });

  it('a mission that ends above the arrival elevation beyond the tolerance', () => {
    const plan = demo('piston-tourer.json', { 'legs.4.toAltitude_m': 180 + 100 });
    const r = solvePlan(plan);
    expect(check(r, 'shape:arrival').state).toBe('fails');
    expect(describeMargin(check(r, 'shape:arrival'), 'si')).toBe('+100 m');
    // within a wider tolerance the same plan passes that check
    const loose = solvePlan(
      demo('piston-tourer.json', {
        'legs.4.toAltitude_m': 180 + 100,
        'settings.arrivalTolerance_m': 150,
      }),
    );
    expect(check(loose, 'shape:arrival').state).toBe('ok');
  });

  it('no flight legs, or flight legs of zero time, is not OK', () => {
    const allowances = demo('piston-tourer.json');
    allowances.legs = allowances.legs.filter((l) => l.kind === 'takeoff' || l.kind === 'landing');
    const r = solvePlan(allowances);
    expect(check(r, 'shape:flight').state).toBe('fails');
    expect(r.verdict).toBe('fails');
    expect(exitCode(allowances)).toBe(1);
    // A climb to the field's own elevation takes no time.
    const flat = demo('piston-tourer.json');
    flat.legs = [
      flat.legs[0]!,
      { ...flat.legs[1]!, toAltitude_m: 120 } as Plan['legs'][number],
      flat.legs[5]!,
    ];
    flat.environment.arrivalElevation_m = 120;
    const z = solvePlan(PlanSchema.parse(flat));
    expect(z.totals.time_s).toBe(0);
    expect(check(z, 'shape:flight').state).toBe('fails');
  });
});

describe('no false alarm: the planner’s own speeds', () => {
  it('the default new plan and every example read OK', () => {
    const plans = [newPlan(), ...EXAMPLES.map((f) => demo(f))];
    for (const plan of plans) {
      const r = solvePlan(plan);
      expect(r.verdict, plan.name).toBe('ok');
      expect(exitCode(plan), plan.name).toBe(0);
    }
  });

  it('a best-speed leg at the stall floor is information, not a tight margin', () => {
    const r = solvePlan(newPlan());
    const stall = r.checks.filter((c) => c.id.startsWith('stall:'));
    expect(stall.length).toBeGreaterThan(0);
    expect(stall.every((c) => c.state === 'ok' && c.chosenSpeed !== undefined)).toBe(true);
    const floor = stall.filter((c) => c.chosenSpeed?.atStallMargin);
    expect(floor.length).toBeGreaterThan(0); // the default UAV's best speeds sit on the floor
    for (const c of floor) {
      expect(describeCheck(c, 'si')).toMatch(/limited by the stall margin/);
      expect(describeMargin(c, 'si')).toBe('at floor');
    }
  });

  it('a fixed speed below the stall margin still fails', () => {
    const plan = demo('piston-tourer.json', { 'legs.2.speed': { kind: 'tas', speed_m_s: 30 } });
    const r = solvePlan(plan);
    expect(r.verdict).toBe('fails');
  });
});

describe('margins people can read', () => {
  const base: Check = {
    id: 'power:1',
    label: 'Leg 2: power',
    legIndex: 1,
    value: 1200,
    limit: 0,
    quantity: 'power',
    margin: -1e8,
    state: 'fails',
    detail: '',
  };
  it('against a zero limit: the absolute difference in the user’s unit', () => {
    // 1200 W against 0 W available: short by 1.2 kW (1 hp = 745.7 W, exact definition: 1.61 hp).
    expect(describeMargin(base, 'si')).toBe('-1.20 kW');
    expect(describeMargin(base, 'aviation')).toBe('-1.61 hp');
  });
  it('beyond ±999 %: a multiple', () => {
    expect(describeMargin({ ...base, limit: 100, value: 2101, margin: 20.01 }, 'si')).toBe('> 10×');
    expect(describeMargin({ ...base, limit: 100, value: 1200, margin: -11 }, 'si')).toBe(
      '> 10× over',
    );
    expect(describeMargin({ ...base, limit: 100, value: 50, margin: 0.5 }, 'si')).toBe('+50 %');
    expect(describeMargin({ ...base, limit: 100, value: 95, margin: 0.05 }, 'si')).toBe('+5.0 %');
  });
  it('a failed mission’s reserve shows no percentage', () => {
    const plan = demo('piston-tourer.json', { 'legs.2.end.distance_m': 5_000_000 });
    const r = solvePlan(plan);
    expect(r.completed).toBe(false);
    expect(describeMargin(check(r, 'reserve'), 'si')).toBe('—');
  });
  it('every example’s margins are short and finite', () => {
    for (const f of EXAMPLES) {
      for (const c of solvePlan(demo(f)).checks) {
        const m = describeMargin(c, 'aviation');
        expect(m.length, `${f} ${c.id} ${m}`).toBeLessThanOrEqual(12);
        expect(m).not.toMatch(/NaN|Infinity|e\+/);
      }
    }
  });
});
