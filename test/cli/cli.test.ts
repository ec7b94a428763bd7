/**
 * End-to-end tests of the `legwise` command through runCli (output captured as strings) and
 * once as a real child process. Expected numbers are the solver's own results formatted by
 * core/format.ts: the CLI must print what the solver computed, not recompute it.
 */
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { CAUTION, runCli } from '../../cli/main.ts';
import { formatQuantity } from '../../core/format.ts';
import { parsePlanText } from '../../core/plan/load.ts';
import { solvePlan } from '../../core/solver/solve.ts';
import type { PlanResult } from '../../core/solver/types.ts';
import { reserveMonteCarlo } from '../../core/uncertainty/reserveMonteCarlo.ts';
import type { UnitSystemId } from '../../core/units.ts';
import { DEMO_FILES, demoJson, examplePath, setAt } from '../core/plan/demoPlans.ts';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));

/** Runs the CLI with captured output; `files` are served instead of the disk. */
function run(argv: string[], files: Record<string, string> = {}) {
  let out = '';
  let err = '';
  const code = runCli(argv, {
    stdout: (t) => (out += t),
    stderr: (t) => (err += t),
    readFile: (p) => files[p] ?? readFileSync(p, 'utf8'),
  });
  return { code, out, err };
}

function solved(file: string): PlanResult {
  const r = parsePlanText(readFileSync(examplePath(file), 'utf8'));
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  return solvePlan(r.plan);
}

/** Every number in a JSON tree is finite. */
function allFinite(node: unknown): boolean {
  if (typeof node === 'number') return Number.isFinite(node);
  if (Array.isArray(node)) return node.every(allFinite);
  if (node && typeof node === 'object') return Object.values(node).every(allFinite);
  return true;
}

describe('legwise solve on the demo plans', () => {
  for (const file of DEMO_FILES) {
    for (const units of ['si', 'aviation'] as UnitSystemId[]) {
      it(`${file} (${units}): every leg, the totals, the checks and the caution`, () => {
        const result = solved(file);
        const { code, out, err } = run(['solve', examplePath(file), '--units', units]);
        expect(err).toBe('');
        expect(code).toBe(0); // the demo plans are feasible
        const lines = out.split('\n');
        for (const leg of result.legs) {
          const name = (leg.label || leg.id).slice(0, 29);
          expect(lines.some((l) => l.includes(name) && l.includes(leg.kind))).toBe(true);
        }
        const total = lines.find((l) => /^\s+Total\s/.test(l));
        expect(total).toBeDefined();
        const used =
          result.consumable === 'fuel' ? result.totals.fuelUsed_kg : result.totals.energyUsed_J;
        const q = result.consumable === 'fuel' ? 'fuelMass' : 'energy';
        for (const expected of [
          formatQuantity(result.totals.time_s, 'time', units),
          formatQuantity(result.totals.groundDistance_m, 'distance', units, { withUnit: false }),
          formatQuantity(used, q, units, { withUnit: false }),
          formatQuantity(result.landing.remaining, q, units, { withUnit: false }),
        ]) {
          expect(total).toContain(expected);
        }
        for (const check of result.checks) expect(out).toContain(check.label);
        expect(out).toMatch(/^Verdict: (OK|TIGHT)/m);
        expect(out.trimEnd().endsWith(CAUTION)).toBe(true);
      });
    }
  }
});

describe('legwise solve --json and --csv', () => {
  it.each(DEMO_FILES)('%s --json is the full result plus the caution, with no NaN', (file) => {
    const { code, out } = run(['solve', examplePath(file), '--json']);
    expect(code).toBe(0);
    expect(out).not.toMatch(/NaN|Infinity/);
    const json = JSON.parse(out) as PlanResult & { caution: string };
    expect(json.caution).toBe(CAUTION);
    const result = solved(file);
    expect(json.legs).toHaveLength(result.legs.length);
    expect(json.totals.time_s).toBeCloseTo(result.totals.time_s, 6); // same solver, same numbers
    expect(allFinite(json)).toBe(true);
  });

  it.each(DEMO_FILES)(
    '%s --csv has the caution comment, a unit-suffixed header and one row per leg',
    (file) => {
      const { code, out } = run(['solve', examplePath(file), '--csv', '--units', 'aviation']);
      expect(code).toBe(0);
      const lines = out.trimEnd().split('\n');
      expect(lines[0]).toBe(`# ${CAUTION}`);
      const header = lines[1]?.split(',') ?? [];
      expect(header).toContain('ground_distance_nmi');
      expect(header).toContain('mean_tas_kt');
      expect(header.some((h) => /^(fuel|energy)_used_(lb|Wh)$/.test(h))).toBe(true);
      const rows = lines.slice(2);
      expect(rows).toHaveLength(solved(file).legs.length);
      expect(out).not.toMatch(/NaN|Infinity/);
    },
  );
});

describe('bad files and bad command lines', () => {
  it('a bad file exits 2 with path-named messages and no stack trace', () => {
    const data = demoJson('piston-tourer.json');
    setAt(data, 'aircraft.mass.empty_kg', -3);
    setAt(data, 'legs.2.kind', 'hover');
    const { code, out, err } = run(['solve', 'bad.json'], { 'bad.json': JSON.stringify(data) });
    expect(code).toBe(2);
    expect(out).toBe('');
    expect(err).toContain('bad.json: not a usable plan file (2 problems):');
    expect(err).toContain('aircraft.mass.empty_kg: -3 — must be from 0.01 to 500000 kg');
    expect(err).toContain('legs.2.kind: "hover" — must be one of');
    expect(err).not.toMatch(/\n\s+at /);
  });

  it('broken JSON, a missing file, and check on a bad file exit 2', () => {
    const broken = run(['solve', 'x.json'], { 'x.json': '{\n  "format": "legwise-plan",\n}' });
    expect(broken.code).toBe(2);
    expect(broken.err).toContain('file: not valid JSON at line 3, column 1');
    const missing = run(['solve', 'no/such/plan.json']);
    expect(missing.code).toBe(2);
    expect(missing.err).toBe('legwise: cannot read no/such/plan.json: no such file\n');
    expect(run(['check', 'x.json'], { 'x.json': '[]' }).code).toBe(2);
  });

  it('usage errors exit 2', () => {
    for (const argv of [
      [],
      ['fly', 'a.json'],
      ['solve'],
      ['tune', 'a', 'b'],
      ['check', 'a', 'b'],
      ['solve', 'a', 'b', '--gpx', 'out.gpx'],
      ['solve', 'a', '--gpx', 'a'],
      ['solve', '-', '-'],
      ['solve', 'a', '--units', 'imperial'],
      ['solve', 'a', '--bogus'],
      ['tune', 'a', '--csv'],
      ['solve', 'a', '--csv', '--json'],
    ]) {
      const r = run(argv);
      expect(r.code, argv.join(' ')).toBe(2);
      expect(r.err).toMatch(/^legwise: .*\nRun "legwise --help" for usage\.\n$/);
    }
  });

  it('--help and --version', () => {
    const help = run(['--help']);
    expect(help.code).toBe(0);
    expect(help.out).toContain('Usage: legwise <command> <plan.json>');
    const pkg = JSON.parse(readFileSync(`${ROOT}package.json`, 'utf8')) as { version: string };
    expect(run(['--version']).out).toBe(`legwise ${pkg.version}\n`);
  });
});

describe('verdicts and the other commands', () => {
  it('a plan whose checks fail exits 1 and still prints the table and the caution', () => {
    const data = demoJson('piston-tourer.json');
    setAt(data, 'aircraft.mass.payload_kg', 600); // 780 + 600 + 150 kg is far above the 1270 kg MTOW
    const { code, out } = run(['solve', 'heavy.json'], { 'heavy.json': JSON.stringify(data) });
    expect(code).toBe(1);
    expect(out).toMatch(/^Verdict: FAILS/m);
    expect(out).toContain(CAUTION);
  });

  it('check validates only and lists warnings', () => {
    const ok = run(['check', examplePath('light-jet.json')]);
    expect(ok.code).toBe(0);
    expect(ok.out).toContain('valid plan "Tessaro TJ-6');
    const data = demoJson('light-jet.json');
    setAt(data, 'aircraft.polar.CD0', 0.012); // below the 0.015–0.025 common range for jets
    const warned = run(['check', 'w.json', '--json'], { 'w.json': JSON.stringify(data) });
    expect(warned.code).toBe(0);
    expect(JSON.parse(warned.out).warnings[0]).toContain('aircraft.polar.CD0: 0.012 is below');
  });

  it('tune prints each optimizer section and the caution', () => {
    const { code, out, err } = run([
      'tune',
      examplePath('piston-tourer.json'),
      '--units',
      'aviation',
    ]);
    expect(err).toBe('');
    expect(code).toBe(0);
    for (const heading of [
      'Best cruise altitude',
      'Best speed per cruise and loiter leg',
      'Maximum payload',
      'Reserve margin on landing',
    ]) {
      expect(out).toContain(heading);
    }
    expect(out).toContain('Cruise to the coast');
    expect(out).not.toMatch(/NaN|Infinity/);
    expect(out.trimEnd().endsWith(CAUTION)).toBe(true);
  });

  it('tune --json parses and carries the caution', () => {
    const { code, out } = run(['tune', examplePath('survey-uav-electric.json'), '--json']);
    expect(code).toBe(0);
    const json = JSON.parse(out) as { caution: string; bestSpeeds: unknown[] };
    expect(json.caution).toBe(CAUTION);
    expect(json.bestSpeeds).toHaveLength(3); // two cruise legs and one loiter leg
    expect(out).not.toMatch(/NaN|Infinity/);
  });
});

describe('the installed command', () => {
  it('node bin/legwise.mjs solve examples/piston-tourer.json runs as a child process', () => {
    const child = spawnSync(
      process.execPath,
      ['bin/legwise.mjs', 'solve', 'examples/piston-tourer.json'],
      {
        cwd: ROOT,
        encoding: 'utf8',
      },
    );
    expect(child.stderr).toBe('');
    expect(child.status).toBe(0);
    expect(child.stdout).toContain('Corvale CT-4');
    expect(child.stdout).toMatch(/^\s+Total\s/m);
    expect(child.stdout.trimEnd().endsWith(CAUTION)).toBe(true);
  });

  it('exits 2 with a message for a missing file', () => {
    const child = spawnSync(process.execPath, ['bin/legwise.mjs', 'solve', 'examples/none.json'], {
      cwd: ROOT,
      encoding: 'utf8',
    });
    expect(child.status).toBe(2);
    expect(child.stderr).toBe('legwise: cannot read examples/none.json: no such file\n');
  });
});

describe('legwise solve --monte-carlo', () => {
  // The survey UAV with its own uncertainty block: 200 samples keep the test quick.
  const uncertainty = {
    windSpeed_m_s: 3,
    windDirection_deg: 20,
    cd0: 0.08,
    efficiency: 0.05,
    fuelConsumption: 0,
    batteryCapacity: 0.08,
    payload_kg: 0.2,
    samples: 200,
    seed: 7,
  };
  const data = demoJson('survey-uav-electric.json');
  setAt(data, 'uncertainty', uncertainty);
  const files = { 'mc.json': JSON.stringify(data) };
  const plan = (() => {
    const r = parsePlanText(files['mc.json']);
    if (!r.ok) throw new Error('mc.json');
    return r.plan;
  })();
  const { samples, seed, ...spreads } = uncertainty;
  // The CLI must print what core/uncertainty computes for the same setup.
  const mc = reserveMonteCarlo(plan, spreads, { samples, seed });

  it('prints how many of 100 flights keep the reserve, and the margin percentiles', () => {
    const { code, out, err } = run(['solve', 'mc.json', '--monte-carlo'], files);
    expect(err).toBe('');
    expect(code).toBe(0);
    const kept = Math.floor(100 * (1 - mc.probabilityReserveNotKept));
    expect(out).toContain(`In ${kept} of 100 simulated flights the reserve is kept.`);
    // Said once: no second count of the same thing in samples.
    expect(out).not.toMatch(/not kept in \d+ of/);
    expect(out).toContain('200 simulated flights (random seed 7)');
    expect(out).toContain(`p50 ${formatQuantity(mc.margin!.p50, 'energy', 'si')}`);
    expect(out.trimEnd().endsWith(CAUTION)).toBe(true);
  });

  it('--json carries the whole Monte Carlo result', () => {
    const { code, out } = run(['solve', 'mc.json', '--monte-carlo', '--json'], files);
    expect(code).toBe(0);
    const json = JSON.parse(out) as {
      monteCarlo: { samples: number; probabilityReserveNotKept: number };
    };
    expect(json.monteCarlo.samples).toBe(200);
    expect(json.monteCarlo.probabilityReserveNotKept).toBe(mc.probabilityReserveNotKept);
  });

  it('states the wind-error correlation it used (the default, common practice)', () => {
    const { out } = run(['solve', 'mc.json', '--monte-carlo'], files);
    expect(mc.windCorrelation).toBe(0.8);
    expect(out).toContain(
      'Wind errors of the legs of one flight correlated 0.8 (default, common practice).',
    );
  });

  it('counts the failed flights by leg and cause, in words', () => {
    // The survey loiter (19 m/s TAS) in a 17 m/s wind with σ 3 m/s: some flights cannot hold
    // station; the CLI must say so with core's counts (core/uncertainty/failureCauses.ts).
    const windy = demoJson('survey-uav-electric.json');
    setAt(windy, 'uncertainty', { ...uncertainty, windCorrelation: 0.5 });
    setAt(windy, 'legs.3.wind.speed_m_s', 17);
    const text = JSON.stringify(windy);
    const parsed = parsePlanText(text);
    if (!parsed.ok) throw new Error('windy plan');
    const core = reserveMonteCarlo(
      parsed.plan,
      { ...spreads, windCorrelation: 0.5 },
      { samples, seed },
    );
    const station = core.failures.find((f) => f.legIndex === 3 && f.cause === 'station');
    expect(station?.count).toBeGreaterThan(0);
    const { out } = run(['solve', 'windy.json', '--monte-carlo'], { 'windy.json': text });
    expect(out).toContain('correlated 0.5 (set in the plan)');
    const failed = Math.round(core.failedFraction * samples);
    expect(out).toContain(
      `${failed} of the ${samples} simulated flights have a leg that cannot be flown:`,
    );
    expect(out).toMatch(
      new RegExp(
        `In ${station!.count} of ${samples} simulated flights leg 4 “Survey lines” \\(loiter\\) could not hold station in a wind of [0-9.]+ m/s – [0-9.]+ m/s\\.`,
      ),
    );
  });

  it('is refused with --csv and outside solve', () => {
    expect(run(['solve', 'mc.json', '--monte-carlo', '--csv'], files).code).toBe(2);
    expect(run(['tune', 'mc.json', '--monte-carlo'], files).code).toBe(2);
  });
});

describe('check sentences in the chosen units', () => {
  it('aviation units: power in hp and altitudes in ft, no raw watts', () => {
    const { out } = run(['solve', examplePath('piston-tourer.json'), '--units', 'aviation']);
    // Wording: the sentence no longer repeats the leg (its label does); the ceiling is
    // compared with the pressure altitude.
    expect(out).toMatch(/Needs \d+(\.\d+)? hp of thrust power, \d+(\.\d+)? hp available\./);
    expect(out).toMatch(/Highest pressure altitude \d+ ft .* against a ceiling of \d+ ft\./);
    expect(out).not.toMatch(/\d W of thrust power/);
    const row = out.split('\n').find((l) => l.includes('“Cruise to the coast” (cruise): power'))!;
    expect(row.split('Cruise to the coast')).toHaveLength(2); // the leg named once in the row
  });

  it('a jet power check reads as thrust, in lbf and kN', () => {
    const aviation = run(['solve', examplePath('light-jet.json'), '--units', 'aviation']).out;
    expect(aviation).toMatch(/\d+ lbf \/ \d+ lbf .*Needs \d+ lbf of thrust, \d+ lbf available\./);
    expect(aviation).not.toMatch(/hp of thrust power/);
    const si = run(['solve', examplePath('light-jet.json')]).out;
    expect(si).toMatch(/Needs \d+\.\d kN of thrust, \d+\.\d kN available\./);
  });

  it('a battery landing: share of usable energy and the pack against nominal', () => {
    const result = solved('survey-uav-electric.json');
    const { out } = run(['solve', examplePath('survey-uav-electric.json')]);
    // Pack share = 1 − usableFraction·(1 − soc): the unusable share is counted as still in the
    // pack (definition; the example file gives usableFraction).
    const plan = parsePlanText(readFileSync(examplePath('survey-uav-electric.json'), 'utf8'));
    if (!plan.ok || plan.plan.aircraft.powerplant.type !== 'electric') throw new Error('plan');
    const u = plan.plan.aircraft.powerplant.battery.usableFraction;
    const soc = formatQuantity(result.landing.soc, 'ratio', 'si');
    const pack = formatQuantity(1 - u * (1 - result.landing.soc), 'ratio', 'si');
    expect(out).toContain(`(${soc} of usable energy; pack at ${pack} of nominal)`);
    expect(out).not.toContain('state of charge');
  });
});

describe('tune wording', () => {
  it('says when the best altitude is the ceiling', () => {
    const data = demoJson('light-jet.json');
    setAt(data, 'aircraft.ceiling_m', 7000);
    const { out } = run(['tune', 'j.json'], { 'j.json': JSON.stringify(data) });
    expect(out).toMatch(/\n {2}7000 m, limited by the ceiling: \d+ kg left on landing/);
  });

  it('says where the sweep starts when the plan as given does better', () => {
    const plan = parsePlanText(readFileSync(examplePath('survey-uav-electric.json'), 'utf8'));
    if (!plan.ok) throw new Error('plan');
    const start = plan.plan.environment.departureElevation_m + 300; // MIN_HEIGHT_ABOVE_DEPARTURE_M
    const { out } = run(['tune', examplePath('survey-uav-electric.json')]);
    expect(out).toContain(
      `the plan as given does better — the sweep starts 300 m above the departure field, at ${formatQuantity(start, 'altitude', 'si')}`,
    );
  });
});
