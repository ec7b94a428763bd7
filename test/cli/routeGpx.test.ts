/**
 * `legwise solve --gpx FILE` end to end: the route written as GPX 1.1 with each waypoint's
 * estimate, read back with the project's GPX parser (core/route/gpx.ts) and
 * compared with the solver's own per-waypoint estimates (routeProgress): the CLI must write
 * what the solver computed, not recompute it. Also the route table of the text output and
 * the refusals (no route, wrong command, unwritable file).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { CAUTION, runCli } from '../../cli/main.ts';
import { formatQuantity } from '../../core/format.ts';
import { parsePlanText } from '../../core/plan/load.ts';
import type { Plan } from '../../core/plan/schema.ts';
import { parseGpx } from '../../core/route/gpx.ts';
import { routeProgress } from '../../core/solver/routeProgress.ts';
import { solvePlan } from '../../core/solver/solve.ts';
import { demoJson, examplePath, setAt } from '../core/plan/demoPlans.ts';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const ROUTE_FILE = examplePath('route-survey.json');

function run(argv: string[], files: Record<string, string> = {}, writable = true) {
  let out = '';
  let err = '';
  const written: Record<string, string> = {};
  const code = runCli(argv, {
    stdout: (t) => (out += t),
    stderr: (t) => (err += t),
    readFile: (p) => files[p] ?? readFileSync(p, 'utf8'),
    writeFile: (p, text) => {
      if (!writable) throw Object.assign(new Error('denied'), { code: 'EACCES' });
      written[p] = text;
    },
  });
  return { code, out, err, written };
}

function routePlan(text = readFileSync(ROUTE_FILE, 'utf8')): Plan {
  const r = parsePlanText(text);
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  return r.plan;
}

/** Every `lw:<tag>` value of the GPX text, in document order. */
function extensionValues(gpx: string, tag: string): number[] {
  return [...gpx.matchAll(new RegExp(`<lw:${tag}>([^<]*)</lw:${tag}>`, 'g'))].map((m) =>
    Number(m[1]),
  );
}

describe('legwise solve --gpx', () => {
  it('writes the route with each waypoint and the solver’s ETA and fuel left', () => {
    const { code, out, err, written } = run(['solve', ROUTE_FILE, '--gpx', 'out.gpx']);
    expect(code).toBe(0);
    expect(out.trimEnd().endsWith(CAUTION)).toBe(true);
    expect(err).toMatch(/wrote out\.gpx: the route's 6 waypoints with estimated time and fuel/);
    const gpx = written['out.gpx'];
    expect(gpx).toBeDefined();
    const parsed = parseGpx(gpx!);
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
    const plan = routePlan();
    // parseGpx (core/route/gpx.ts) reads back the waypoints exactly as planned
    expect(parsed.route.waypoints.map((w) => w.id)).toEqual(plan.route!.waypoints.map((w) => w.id));
    parsed.route.waypoints.forEach((w, i) => {
      const p = plan.route!.waypoints[i]!;
      expect(w.lat_deg).toBe(p.lat_deg);
      expect(w.lon_deg).toBe(p.lon_deg);
      expect(w.name).toBe(p.name);
    });
    const progress = routeProgress(plan, solvePlan(plan));
    // the solver's own estimates, written with full precision (xsdDecimal, round trip)
    expect(extensionValues(gpx!, 'eta_s')).toEqual(progress.map((w) => w.eta_s));
    expect(extensionValues(gpx!, 'fuel_kg')).toEqual(progress.map((w) => w.remaining));
    expect(gpx).toContain('<desc>'); // the caution travels with the file
  });

  it('prints the route table: one row per waypoint with ETA, distance and fuel left', () => {
    const { code, out } = run(['solve', ROUTE_FILE, '--units', 'aviation']);
    expect(code).toBe(0);
    const plan = routePlan();
    const progress = routeProgress(plan, solvePlan(plan));
    const lines = out.split('\n');
    expect(lines.some((l) => l.startsWith('Route (ETA'))).toBe(true);
    for (const w of progress) {
      const row = lines.find((l) => l.includes(`(${w.id})`) && /^\s+\d+\s/.test(l));
      expect(row, w.id).toBeDefined();
      expect(row).toContain(formatQuantity(w.eta_s!, 'time', 'aviation'));
      expect(row).toContain(formatQuantity(w.remaining!, 'fuelMass', 'aviation'));
    }
  });

  it('--json carries the per-waypoint estimates', () => {
    const { code, out } = run(['solve', ROUTE_FILE, '--json']);
    expect(code).toBe(0);
    const json = JSON.parse(out) as { waypoints: { id: string; eta_s: number }[] };
    expect(json.waypoints.map((w) => w.id)).toEqual(['launch', 'a1', 'a2', 'b1', 'b2', 'recovery']);
    expect(json.waypoints.every((w) => Number.isFinite(w.eta_s))).toBe(true);
  });

  it('a mission that stops early writes the route without estimates and exits 1', () => {
    const data = demoJson('route-survey.json');
    setAt(data, 'legs.5.toWaypoint', 'nowhere');
    const files = { 'stop.json': JSON.stringify(data) };
    const { code, err, written } = run(['solve', 'stop.json', '--gpx', 'o.gpx'], files);
    expect(code).toBe(1);
    expect(err).toMatch(/without estimates — the mission does not reach every waypoint/);
    expect(written['o.gpx']).toContain('<rtept');
    expect(written['o.gpx']).not.toContain('lw:eta_s');
  });

  it('refuses a plan without a route (exit 2, nothing written, no table)', () => {
    const { code, out, err, written } = run([
      'solve',
      examplePath('piston-tourer.json'),
      '--gpx',
      'x.gpx',
    ]);
    expect(code).toBe(2);
    expect(out).toBe('');
    expect(err).toMatch(/--gpx: .*piston-tourer\.json has no route \(plan\.route\) to export/);
    expect(written).toEqual({});
  });

  it('--gpx only with solve, with a file name; an unwritable file exits 2', () => {
    for (const argv of [
      ['tune', ROUTE_FILE, '--gpx', 'x.gpx'],
      ['check', ROUTE_FILE, '--gpx', 'x.gpx'],
      ['solve', ROUTE_FILE, '--gpx', ' '],
      ['solve', ROUTE_FILE, '--gpx'],
    ]) {
      const r = run(argv);
      expect(r.code, argv.join(' ')).toBe(2);
      expect(r.err).toMatch(/^legwise: .*\nRun "legwise --help" for usage\.\n$/);
    }
    const denied = run(['solve', ROUTE_FILE, '--gpx', 'ro.gpx'], {}, false);
    expect(denied.code).toBe(2);
    expect(denied.err).toBe('legwise: cannot write ro.gpx: EACCES\n');
  });

  it('node bin/legwise.mjs solve … --gpx writes the file on disk', () => {
    const dir = mkdtempSync(join(tmpdir(), 'legwise-gpx-'));
    try {
      const file = join(dir, 'survey.gpx');
      const child = spawnSync(
        process.execPath,
        ['bin/legwise.mjs', 'solve', 'examples/route-survey.json', '--gpx', file],
        { cwd: ROOT, encoding: 'utf8' },
      );
      expect(child.status).toBe(0);
      const parsed = parseGpx(readFileSync(file, 'utf8'));
      expect(parsed.ok).toBe(true);
      expect(extensionValues(readFileSync(file, 'utf8'), 'eta_s')).toHaveLength(6);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
