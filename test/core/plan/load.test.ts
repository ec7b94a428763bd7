/**
 * Loading plan files. The limits quoted in the expected messages are those of the plan schema
 * (core/plan/schema.ts); the demo plans in examples/ are the good files.
 */
import { describe, expect, it } from 'vitest';
import {
  MAX_PLAN_TEXT_LENGTH,
  parsePlan,
  parsePlanText,
  serializePlan,
} from '../../../core/plan/load.ts';
import type { LoadResult, PlanIssue } from '../../../core/plan/load.ts';
import { PLAN_SCHEMA_VERSION } from '../../../core/plan/schema.ts';
import { DEMO_FILES, demoJson, demoText, setAt } from './demoPlans.ts';

function issuesOf(r: LoadResult): PlanIssue[] {
  if (r.ok) throw new Error('expected the plan to be refused');
  return r.issues;
}

/** Refuses the piston demo after one edit and returns the issue at `path`. */
function refusedAt(path: string, value: unknown, file = 'piston-tourer.json'): PlanIssue {
  const data = demoJson(file);
  setAt(data, path, value);
  const issues = issuesOf(parsePlan(data));
  const hit = issues.find((i) => i.path === path);
  expect(hit, JSON.stringify(issues)).toBeDefined();
  return hit as PlanIssue;
}

describe('good plan files', () => {
  it.each(DEMO_FILES)('%s loads without issues or warnings', (file) => {
    const r = parsePlanText(demoText(file));
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.warnings).toEqual([]);
  });

  it.each(DEMO_FILES)('%s survives serialize → parse unchanged', (file) => {
    const r = parsePlanText(demoText(file));
    if (!r.ok) throw new Error('demo refused');
    const text = serializePlan(r.plan);
    expect(text.endsWith('}\n')).toBe(true);
    expect(text).toContain('\n  "schemaVersion": 2,\n');
    const again = parsePlan(JSON.parse(text));
    expect(again.ok && again.plan).toEqual(r.plan);
    expect(serializePlan(again.ok ? again.plan : r.plan)).toBe(text);
  });

  it('writes keys in schema order whatever order the object has', () => {
    const r = parsePlanText(demoText('light-jet.json'));
    if (!r.ok) throw new Error('demo refused');
    const shuffled = Object.fromEntries(Object.entries(r.plan).reverse());
    const text = serializePlan(shuffled as typeof r.plan);
    expect(Object.keys(JSON.parse(text))).toEqual([
      'format',
      'schemaVersion',
      'name',
      'notes',
      'aircraft',
      'environment',
      'reserves',
      'settings',
      'legs',
    ]);
    expect(text).toBe(serializePlan(r.plan));
  });

  it('fills defaults (leg label) and accepts a byte-order mark', () => {
    const data = demoJson('piston-tourer.json');
    setAt(data, 'legs.0.label', undefined);
    const r = parsePlanText(`\ufeff${JSON.stringify(data)}`);
    expect(r.ok && r.plan.legs[0]?.label).toBe('');
  });
});

describe('bad plan files are refused with path-named messages', () => {
  it('negative empty mass', () => {
    const hit = refusedAt('aircraft.mass.empty_kg', -3);
    expect(hit.message).toBe('aircraft.mass.empty_kg: -3 — must be from 0.01 to 500000 kg');
  });

  it('Oswald efficiency outside [0.3, 1], with the reason', () => {
    expect(refusedAt('aircraft.polar.induced.e', 0).message).toMatch(
      /^aircraft\.polar\.induced\.e: 0 — must be from 0\.3 to 1 — an Oswald efficiency below 0\.3 describes no real wing/,
    );
    expect(refusedAt('aircraft.polar.induced.e', 1.2).message).toContain(
      '1.2 — must be from 0.3 to 1 — ',
    );
  });

  it('altitude out of range', () => {
    const hit = refusedAt('legs.1.toAltitude_m', 25000);
    expect(hit.message).toBe('legs.1.toAltitude_m: 25000 — must be from -400 to 20000 m');
  });

  it('unknown leg kind lists the allowed kinds', () => {
    const hit = refusedAt('legs.2.kind', 'hover');
    expect(hit.message).toBe(
      'legs.2.kind: "hover" — must be one of "takeoff", "climb", "cruise", "loiter", "descent", "landing"',
    );
  });

  it('unknown speed kind and end condition name their allowed values', () => {
    expect(refusedAt('legs.2.speed.kind', 'fast').message).toContain(
      '"bestRange", "tas", "eas", "cas", "mach"',
    );
    expect(refusedAt('legs.2.end.by', 'time').message).toContain('"distance", "fuel", "energy"');
    expect(refusedAt('aircraft.powerplant.type', 'rocket').message).toContain(
      '"jet", "propeller", "electric"',
    );
  });

  it('missing field', () => {
    const hit = refusedAt('aircraft.wingArea_m2', undefined);
    expect(hit.message).toBe('aircraft.wingArea_m2: missing — must be a finite number m²');
  });

  it('numbers too large for a double (JSON.parse makes them Infinity)', () => {
    const text = demoText('piston-tourer.json').replace('"empty_kg": 780', '"empty_kg": 1e400');
    expect(issuesOf(parsePlanText(text))[0]?.message).toBe(
      'aircraft.mass.empty_kg: Infinity — must be a finite number kg',
    );
  });

  it('wrong types', () => {
    expect(refusedAt('aircraft.polar.CD0', '0.03').message).toBe(
      'aircraft.polar.CD0: "0.03" — must be a finite number',
    );
    expect(refusedAt('legs', {}).message).toBe('legs: an object — must be a list [ … ]');
    expect(refusedAt('legs', []).message).toBe('legs: a list of 0 — must have at least 1 item');
    expect(refusedAt('name', '').message).toBe(
      'name: empty text "" — must have at least 1 character',
    );
  });

  it('unknown fields are errors, so typos are caught', () => {
    const data = demoJson('piston-tourer.json');
    setAt(data, 'aircraft.mass.payload_lb', 595);
    setAt(data, 'aircraft.mass.payload_kg', undefined);
    const issues = issuesOf(parsePlan(data));
    expect(issues.map((i) => i.path).sort()).toEqual([
      'aircraft.mass.payload_kg',
      'aircraft.mass.payload_lb',
    ]);
    expect(issues.find((i) => i.path === 'aircraft.mass.payload_lb')?.message).toBe(
      'aircraft.mass.payload_lb: unknown field — expected one of empty_kg, payload_kg, mtow_kg',
    );
    // also when everything else is valid, and inside the selected union variant
    const other = demoJson('light-jet.json');
    setAt(other, 'legs.2.speed.speed_m_s', 200); // a speed on a Mach variant
    expect(issuesOf(parsePlan(other)).map((i) => i.path)).toEqual(['legs.2.speed.speed_m_s']);
  });

  it('a file from a newer Legwise is refused with a clear message', () => {
    const data = demoJson('light-jet.json');
    data.schemaVersion = PLAN_SCHEMA_VERSION + 1;
    expect(issuesOf(parsePlan(data))).toEqual([
      {
        path: 'schemaVersion',
        message:
          'schemaVersion: this file was written by a newer Legwise (version 3); this version reads up to 2 — update Legwise to open it',
      },
    ]);
  });

  it('missing or non-integer schema version', () => {
    for (const v of [undefined, '1', 1.5, null]) {
      const data = demoJson('light-jet.json');
      setAt(data, 'schemaVersion', v);
      const [hit] = issuesOf(parsePlan(data));
      expect(hit?.path).toBe('schemaVersion');
      expect(hit?.message).toMatch(/^schemaVersion: .* — must be an integer version number$/);
    }
    const old = demoJson('light-jet.json');
    old.schemaVersion = 0;
    expect(issuesOf(parsePlan(old))[0]?.message).toBe('schemaVersion: 0 — must be from 1 to 2');
  });

  it('wrong format tag is checked first', () => {
    const data = demoJson('light-jet.json');
    data.format = 'flightplan';
    data.schemaVersion = 99;
    expect(issuesOf(parsePlan(data))).toEqual([
      {
        path: 'format',
        message:
          'format: expected "legwise-plan", got "flightplan" — this is not a Legwise plan file',
      },
    ]);
    expect(issuesOf(parsePlan([1, 2]))[0]?.message).toBe(
      'file: a list of 2 — a plan file must be a JSON object { … }',
    );
  });

  it('broken JSON names line and column', () => {
    const text = '{\n  "format": "legwise-plan",\n  "name": "x",\n  }\n';
    expect(issuesOf(parsePlanText(text))[0]?.message).toMatch(
      /^file: not valid JSON at line 4, column 3 \(.+\) near: {3}}$/,
    );
    const truncated = demoText('piston-tourer.json').slice(0, 100);
    const lines = truncated.split('\n');
    const [hit] = issuesOf(parsePlanText(truncated));
    expect(hit?.message).toContain(
      `at line ${lines.length}, column ${(lines.at(-1)?.length ?? 0) + 1}`,
    );
    expect(issuesOf(parsePlanText('{"a": tru}'))[0]?.message).toBe(
      'file: not valid JSON at line 1, column 10 (Unexpected token \'}\') near: {"a": tru}',
    );
    expect(issuesOf(parsePlanText(''))[0]?.message).toMatch(
      /^file: not valid JSON at line 1, column 1 /,
    );
  });

  it('refuses text above the size limit without parsing it', () => {
    const [hit] = issuesOf(parsePlanText(' '.repeat(MAX_PLAN_TEXT_LENGTH + 1)));
    expect(hit?.message).toBe('file: 5.0 MB is too large — a plan file may be at most 5 MB');
  });

  it('cross-field rules: consumable of the powerplant, CLminD below CLmax, unique leg ids', () => {
    const fuelOnBattery = demoJson('survey-uav-electric.json');
    setAt(fuelOnBattery, 'legs.2.end', { by: 'fuel', fuel_kg: 1 });
    expect(issuesOf(parsePlan(fuelOnBattery))[0]?.message).toBe(
      'legs.2.end.by: "fuel" — a battery-electric aircraft burns no fuel; use "energy" or another option',
    );
    const energyOnJet = demoJson('light-jet.json');
    setAt(energyOnJet, 'legs.0.allowance', { by: 'energy', energy_J: 1000 });
    expect(issuesOf(parsePlan(energyOnJet))[0]?.path).toBe('legs.0.allowance.by');
    const liftOrder = demoJson('piston-tourer.json');
    setAt(liftOrder, 'aircraft.polar.CLminD', 0.9);
    setAt(liftOrder, 'aircraft.polar.CLmax', 0.8);
    expect(issuesOf(parsePlan(liftOrder))[0]?.message).toBe(
      'aircraft.polar.CLminD: 0.9 — must be below CLmax (0.8)',
    );
    const dup = demoJson('twelve-legs.json');
    setAt(dup, 'legs.5.id', 'leg-2');
    expect(issuesOf(parsePlan(dup))[0]?.message).toBe(
      'legs.5.id: "leg-2" — must be unique; legs.1 has it too',
    );
  });
});
