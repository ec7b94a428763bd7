/**
 * Batch mode, standard input, JSON errors and exit codes, end to end: `node bin/legwise.mjs`
 * as a child process on a temporary folder of plans (the bundle is built from today's
 * sources by the vitest global setup). Expected figures are the solver's own results: the
 * CLI must print what the solver computed, not recompute it. Exit codes are ours
 * (cli/common.ts); 130 for Ctrl-C is the POSIX shell convention 128 + SIGINT.
 */
import { spawnSync } from 'node:child_process';
import { copyFileSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { CAUTION, runCli } from '../../cli/main.ts';
import { parsePlanText } from '../../core/plan/load.ts';
import { solvePlan } from '../../core/solver/solve.ts';
import { demoJson, examplePath, setAt } from '../core/plan/demoPlans.ts';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
let dir = '';

function legwise(args: string[], input?: string | Buffer) {
  const r = spawnSync(process.execPath, ['bin/legwise.mjs', ...args], {
    cwd: ROOT,
    encoding: 'utf8',
    ...(input === undefined ? {} : { input }),
  });
  return { code: r.status, out: r.stdout, err: r.stderr };
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'legwise-batch-'));
  copyFileSync(examplePath('light-jet.json'), join(dir, 'a-light-jet.json'));
  copyFileSync(examplePath('survey-uav-electric.json'), join(dir, 'b-survey.json'));
  // Too little fuel for the reserve: solved, verdict fails (exit 1).
  const short = demoJson('piston-tourer.json');
  setAt(short, 'aircraft.powerplant.fuel.load_kg', 60);
  writeFileSync(join(dir, 'c-short-fuel.json'), JSON.stringify(short, null, 2));
  writeFileSync(join(dir, 'notes.txt'), 'not a plan; not read (no .json ending)');
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function solvedFile(path: string) {
  const r = parsePlanText(readFileSync(path, 'utf8'));
  if (!r.ok) throw new Error(path);
  return solvePlan(r.plan);
}

describe('legwise solve FOLDER / FILE... (batch)', () => {
  it('a folder also stands for its .legwise plans (the desktop app saves them so)', () => {
    const own = mkdtempSync(join(tmpdir(), 'legwise-ext-'));
    try {
      copyFileSync(examplePath('light-jet.json'), join(own, 'saved.legwise'));
      copyFileSync(examplePath('piston-tourer.json'), join(own, 'plain.json'));
      const { code, out } = legwise(['solve', own]);
      expect(code).toBe(0);
      expect(out).toMatch(/plain\.json\s/);
      expect(out).toMatch(/saved\.legwise\s/);
      expect(out).toContain('2 plans: 2 OK');
    } finally {
      rmSync(own, { recursive: true, force: true });
    }
  });

  it('a folder: one table row per .json plan, the summary, the caution; exit = worst (1)', () => {
    const { code, out, err } = legwise(['solve', dir]);
    expect(err).toBe('');
    expect(code).toBe(1);
    const rows = out.split('\n').filter((l) => l.startsWith(dir));
    expect(rows).toHaveLength(3);
    expect(rows[0]).toMatch(/a-light-jet\.json\s+Tessaro TJ-6.*\sOK\s/);
    expect(rows[2]).toMatch(/c-short-fuel\.json\s.*\sFAILS\s/);
    expect(out).toContain('3 plans: 2 OK, 1 FAILS');
    expect(out).not.toContain('notes.txt');
    expect(out.trimEnd().endsWith(CAUTION)).toBe(true);
  });

  it('--json: one JSON object per line (NDJSON) with the solver figures in SI', () => {
    const { code, out } = legwise(['solve', dir, '--json']);
    expect(code).toBe(1);
    const lines = out.trimEnd().split('\n');
    expect(lines).toHaveLength(3);
    const rows = lines.map((l) => JSON.parse(l) as Record<string, unknown>);
    const jet = solvedFile(join(dir, 'a-light-jet.json'));
    expect(rows[0]).toMatchObject({ verdict: 'ok', exit: 0, legs: 5, consumable: 'fuel' });
    expect(rows[0]?.fuelLeft_kg).toBeCloseTo(jet.landing.remaining, 6);
    expect(rows[0]?.time_s).toBeCloseTo(jet.totals.time_s, 6);
    const uav = solvedFile(join(dir, 'b-survey.json'));
    expect(rows[1]?.energyUsed_J).toBeCloseTo(uav.totals.energyUsed_J, 3);
    expect(rows[2]).toMatchObject({ verdict: 'fails', exit: 1, reserveKept: false });
    expect(String(rows[2]?.reason)).not.toBe('');
    for (const r of rows) expect(r.caution).toBe(CAUTION);
  });

  it('--csv: the caution as a comment, a header, one row per plan', () => {
    const { code, out } = legwise(['solve', dir, '--csv', '--units', 'aviation']);
    expect(code).toBe(1);
    const lines = out.trimEnd().split('\n');
    expect(lines[0]).toBe(`# ${CAUTION}`);
    expect(lines[1]).toMatch(
      /^file,plan,verdict,exit,legs,consumable,time_min,ground_distance_nmi,/,
    );
    expect(lines).toHaveLength(5);
    expect(lines[4]).toMatch(/c-short-fuel\.json,.*,fails,1,/);
  });

  it('a refused and a missing file get rows too and make the exit 2', () => {
    const bad = join(dir, 'bad.json.txt');
    writeFileSync(bad, '{"format": "legwise-plan", "format": "x"}');
    const { code, out } = legwise([
      'solve',
      join(dir, 'a-light-jet.json'),
      bad,
      join(dir, 'missing.json'),
      '--json',
    ]);
    expect(code).toBe(2);
    const rows = out
      .trimEnd()
      .split('\n')
      .map((l) => JSON.parse(l) as { verdict: string; exit: number; reason: string });
    expect(rows.map((r) => [r.verdict, r.exit])).toEqual([
      ['ok', 0],
      ['refused', 2],
      ['refused', 2],
    ]);
    expect(rows[1]?.reason).toMatch(
      /^format: given twice \(line 1, column 2 and line 1, column 28\)/,
    );
    expect(rows[2]?.reason).toBe('cannot read: no such file');
  });

  it('refuses --gpx and --monte-carlo with several plans', () => {
    expect(legwise(['solve', dir, '--gpx', join(dir, 'x.gpx')]).err).toMatch(
      /--gpx: only with a single plan/,
    );
    expect(legwise(['solve', dir, '--monte-carlo']).code).toBe(2);
  });
});

describe('standard input and JSON errors', () => {
  it('solve - reads the plan from stdin', () => {
    const text = readFileSync(examplePath('piston-tourer.json'), 'utf8');
    const { code, out, err } = legwise(['solve', '-'], text);
    expect(err).toBe('');
    expect(code).toBe(0);
    expect(out).toContain('Corvale CT-4');
    expect(out.trimEnd().endsWith(CAUTION)).toBe(true);
  });

  it('a plan on stdin can be one row of a batch', () => {
    const text = readFileSync(examplePath('piston-tourer.json'), 'utf8');
    const { code, out } = legwise(['solve', examplePath('light-jet.json'), '-', '--json'], text);
    expect(code).toBe(0);
    const rows = out
      .trimEnd()
      .split('\n')
      .map((l) => JSON.parse(l) as { file: string });
    expect(rows.map((r) => r.file)).toEqual([examplePath('light-jet.json'), '-']);
  });

  it('check --json and solve --json on a bad file: JSON on stdout, exit 2', () => {
    for (const command of ['check', 'solve', 'tune']) {
      const { code, out, err } = legwise([command, '-', '--json'], '{"format": "legwise-plan",\n');
      expect(code).toBe(2);
      const json = JSON.parse(out) as {
        ok: boolean;
        exit: number;
        problems: { message: string }[];
      };
      expect(json).toMatchObject({ ok: false, exit: 2, caution: CAUTION });
      expect(json.problems[0]?.message).toMatch(/^file: not valid JSON at line 2, column 1 /);
      expect(err).toContain('standard input: not a usable plan file');
    }
    const missing = legwise(['check', join(dir, 'none.json'), '--json']);
    expect(missing.code).toBe(2);
    expect(JSON.parse(missing.out)).toMatchObject({
      ok: false,
      error: expect.stringMatching(/no such file/),
    });
    const usage = legwise(['solve', '--json', '--units', 'furlongs', 'x.json']);
    expect(usage.code).toBe(2);
    expect(JSON.parse(usage.out)).toMatchObject({ ok: false, exit: 2 });
  });

  it('--gpx onto the plan itself is refused and the plan is unchanged', () => {
    const plan = join(dir, 'route.json');
    copyFileSync(examplePath('route-survey.json'), plan);
    const before = readFileSync(plan, 'utf8');
    const { code, err } = legwise(['solve', plan, '--gpx', join(dir, '.', 'route.json')]);
    expect(code).toBe(2);
    expect(err).toMatch(
      /is the plan file itself; writing the route there would overwrite the plan/,
    );
    expect(readFileSync(plan, 'utf8')).toBe(before);
  });

  it('a file larger than 5 MB is refused from its size, before it is read', () => {
    const big = join(dir, 'big.json');
    writeFileSync(big, ' '.repeat(6 * 1024 * 1024));
    const { code, err } = legwise(['check', big]);
    expect(code).toBe(2);
    expect(err).toContain('file: 6.0 MB is too large — a plan file may be at most 5 MB');
    // In process: the size comes from stat, and the bytes are never asked for.
    let read = false;
    const r = runCli(['check', 'huge.json'], {
      stdout: () => undefined,
      stderr: () => undefined,
      readFile: () => {
        read = true;
        return '';
      },
      stat: () => ({ size: 1024 ** 3, isDirectory: false }),
      readBytes: () => {
        read = true;
        return new Uint8Array();
      },
    });
    expect(r).toBe(2);
    expect(read).toBe(false);
  });
});

describe('exit 3: an internal error is not an infeasible plan', () => {
  it('an unexpected exception in the solver exits 3 with a message (and JSON with --json)', async () => {
    vi.resetModules();
    vi.doMock('../../core/solver/solve.ts', () => ({
      solvePlan: () => {
        throw new TypeError('simulated fault');
      },
    }));
    const { runCli: run } = await import('../../cli/main.ts');
    let out = '';
    let err = '';
    const io = {
      stdout: (t: string) => (out += t),
      stderr: (t: string) => (err += t),
      readFile: (p: string) => readFileSync(p, 'utf8'),
    };
    expect(run(['solve', examplePath('light-jet.json'), '--json'], io)).toBe(3);
    expect(err).toMatch(/^legwise: internal error: simulated fault — this is a fault in Legwise/);
    expect(JSON.parse(out)).toMatchObject({ ok: false, exit: 3 });
    out = '';
    // In a batch the plan's row says ERROR and the exit is 3.
    expect(
      run(['solve', examplePath('light-jet.json'), examplePath('piston-tourer.json')], io),
    ).toBe(3);
    expect(out).toMatch(/light-jet\.json\s.*ERROR\s+internal error: simulated fault/);
    vi.doUnmock('../../core/solver/solve.ts');
    vi.resetModules();
  });
});
