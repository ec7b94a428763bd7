/**
 * The outcome words of the planner (screen and printed report share VerdictList): the reserve
 * in minutes as well as amount, why a reserve cannot be flown, and readable margins. Minutes
 * are the solver's required and remaining amounts over the final reserve's mean rate
 * (definition); amounts through core/format.ts; 1 lb = 0.45359237 kg exactly.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { formatQuantity } from '../../core/format.ts';
import { minutesText } from '../../core/solver/describe.ts';
import { parsePlanText } from '../../core/plan/load.ts';
import { solvePlan } from '../../core/solver/solve.ts';
import { landingLine, marginText } from '../../renderer/src/support/outcomeText.ts';

type RawPlan = { reserves: Record<string, unknown> } & Record<string, unknown>;

function example(file: string, edit?: (raw: RawPlan) => void) {
  const raw = JSON.parse(
    readFileSync(fileURLToPath(new URL(`../../examples/${file}`, import.meta.url)), 'utf8'),
  ) as RawPlan;
  edit?.(raw);
  const r = parsePlanText(JSON.stringify(raw));
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  return solvePlan(r.plan);
}

describe('landing line', () => {
  it('shows the reserve in minutes at normal cruise as well as in fuel', () => {
    const r = example('piston-tourer.json');
    const line = landingLine(r, 'aviation');
    expect(line).toContain(formatQuantity(r.landing.remaining, 'fuelMass', 'aviation'));
    expect(line).toContain(`${minutesText(r.reserve.remainingTime_s)} at normal cruise`);
    expect(line).toContain(
      `asks for ${formatQuantity(r.reserve.required.total, 'fuelMass', 'aviation')} (${minutesText(r.reserve.requiredTime_s)} at normal cruise)`,
    );
    expect(line).toMatch(/final reserve 45 min at normal cruise, 1970 ft\.$/); // 600 m = 1968.5 ft
  });

  it('says why a reserve cannot be flown, in the user’s units', () => {
    const r = example('piston-tourer.json', (p) => (p.reserves.alternateAltitude_m = 7000));
    expect(landingLine(r, 'si')).toMatch(
      /the reserve cannot be flown: the alternate altitude 7000 m is above the ceiling \(4300 m pressure altitude\)\.$/,
    );
  });
});

describe('margins on screen', () => {
  it('large margins read as multiples, never as thousands of percent', () => {
    const r = example('route-survey.json');
    const reserve = r.checks.find((c) => c.id === 'reserve')!;
    expect(reserve.margin).toBeGreaterThan(9.99);
    expect(marginText(reserve, 'si')).toBe('> 10×');
    for (const c of r.checks) expect(marginText(c, 'si')).not.toMatch(/\d{4,} %/);
  });
});
