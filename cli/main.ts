/**
 * `legwise`: the headless command. `solve` prints a plan's per-leg table, checks and verdict
 * (or JSON / CSV; with `--gpx` it also writes the route with per-waypoint estimates),
 * `tune` runs the optimizers, `check` validates a plan file. All logic sits
 * in `runCli`, which writes through an injected io so tests capture the output; `main` binds
 * it to the process. Exit codes: 0 feasible, 1 solved but failing, 2 bad file or usage.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { pathToFileURL } from 'node:url';
import { parseArgs } from 'node:util';
import { InputError } from '../core/errors.ts';
import { parsePlanText } from '../core/plan/load.ts';
import type { Plan } from '../core/plan/schema.ts';
import { solvePlan } from '../core/solver/solve.ts';
import type { PlanResult } from '../core/solver/types.ts';
import type { UnitSystemId } from '../core/units.ts';
import { CAUTION, EXIT_FAILS, EXIT_OK, EXIT_USAGE } from './common.ts';
import type { CliIo, OutputOptions } from './common.ts';
import { renderMonteCarloText, runMonteCarlo } from './monteCarloReport.ts';
import { renderRouteText, routeGpx } from './routeReport.ts';
import { mergeWarnings, renderSolveCsv, renderSolveJson, renderSolveText } from './solveReport.ts';
import { renderTuneJson, renderTuneText, runTune } from './tuneReport.ts';

export type { CliIo } from './common.ts';

export const USAGE = `Usage: legwise <command> <plan.json> [options]

Commands
  solve <plan.json>   fly the plan: per-leg table, totals, checks and verdict
  tune <plan.json>    best cruise altitude, best speed per cruise/loiter leg,
                      maximum payload and reserve sensitivity
  check <plan.json>   validate the file only: problems and sanity warnings

Options
  --units si|aviation  units for printed values (default si; aviation = ft, NM, kt, lb)
  --json               machine-readable output (solve, tune, check)
  --csv                per-leg table as CSV (solve)
  --monte-carlo        solve: also simulate the flight many times with uncertain wind,
                       drag, efficiency, consumption and payload (the plan's uncertainty
                       block, or defaults) and say how often the reserve is kept
  --gpx FILE           solve: write the plan's route as GPX 1.1 to FILE, each waypoint
                       with its estimated time from the start and fuel or energy left
  -h, --help           this text
  -v, --version        the Legwise version

Exit status: 0 solved and feasible (or valid, for check), 1 solved but the verdict
fails, 2 the file or the command line is wrong.
`;

function version(): string {
  try {
    const pkg = JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8')) as {
      version?: string;
    };
    return pkg.version ?? 'unknown';
  } catch {
    return 'unknown';
  }
}

function usageError(io: CliIo, message: string): number {
  io.stderr(`legwise: ${message}\nRun "legwise --help" for usage.\n`);
  return EXIT_USAGE;
}

/** Reads and validates the plan file; prints the problems and returns null when it is refused. */
function loadPlan(path: string, io: CliIo): { plan: Plan; warnings: string[] } | null {
  let text: string;
  try {
    text = io.readFile(path);
  } catch (err) {
    const code = (err as { code?: string }).code;
    const why =
      code === 'ENOENT'
        ? 'no such file'
        : code === 'EISDIR'
          ? 'is a directory'
          : (code ?? String(err));
    io.stderr(`legwise: cannot read ${path}: ${why}\n`);
    return null;
  }
  const r = parsePlanText(text);
  if (r.ok) {
    const changes = r.changes.map((c) => `updated from an older plan file: ${c}`);
    return { plan: r.plan, warnings: [...changes, ...r.warnings] };
  }
  const n = r.issues.length;
  io.stderr(`${path}: not a usable plan file (${n} problem${n === 1 ? '' : 's'}):\n`);
  for (const issue of r.issues) io.stderr(`  ${issue.message}\n`);
  return null;
}

function runCheck(path: string, opts: OutputOptions, io: CliIo): number {
  const loaded = loadPlan(path, io);
  if (loaded === null) return EXIT_USAGE;
  const { plan, warnings } = loaded;
  if (opts.json) {
    io.stdout(`${JSON.stringify({ file: path, ok: true, plan: plan.name, warnings }, null, 2)}\n`);
    return EXIT_OK;
  }
  io.stdout(`${path}: valid plan "${plan.name}" (${plan.legs.length} legs)\n`);
  if (warnings.length === 0) io.stdout('No warnings.\n');
  for (const w of warnings) io.stdout(`  warning: ${w}\n`);
  return EXIT_OK;
}

function runSolve(path: string, opts: OutputOptions, io: CliIo): number {
  const loaded = loadPlan(path, io);
  if (loaded === null) return EXIT_USAGE;
  const { plan } = loaded;
  if (opts.gpx !== undefined && plan.route === undefined) {
    return usageError(
      io,
      `--gpx: ${path} has no route (plan.route) to export; add waypoints to the plan first`,
    );
  }
  const result = solvePlan(plan);
  const warnings = mergeWarnings(loaded.warnings, result);
  const mc = opts.monteCarlo ? runMonteCarlo(plan) : null;
  if (opts.json) io.stdout(renderSolveJson(plan, result, warnings, mc));
  else if (opts.csv) io.stdout(renderSolveCsv(result, opts.units));
  else {
    const route = renderRouteText(plan, result, opts.units);
    const monteCarlo = mc ? renderMonteCarloText(mc, opts.units) : '';
    const extra = [route, monteCarlo].filter((t) => t !== '').join('\n');
    io.stdout(renderSolveText(plan, result, warnings, opts.units, extra));
  }
  if (opts.gpx !== undefined && !writeGpxFile(opts.gpx, plan, result, io)) return EXIT_USAGE;
  return result.verdict === 'fails' || !result.completed ? EXIT_FAILS : EXIT_OK;
}

/** Writes the route's GPX; says what was written (on stderr, so stdout stays parseable). */
function writeGpxFile(file: string, plan: Plan, result: PlanResult, io: CliIo): boolean {
  const { text, withEstimates } = routeGpx(plan, result);
  if (io.writeFile === undefined) {
    io.stderr('legwise: --gpx: this environment cannot write files\n');
    return false;
  }
  try {
    io.writeFile(file, text);
  } catch (err) {
    const code = (err as { code?: string }).code;
    io.stderr(`legwise: cannot write ${file}: ${code ?? String(err)}\n`);
    return false;
  }
  const n = plan.route?.waypoints.length ?? 0;
  io.stderr(
    withEstimates
      ? `legwise: wrote ${file}: the route's ${n} waypoints with estimated time and ${result.consumable === 'fuel' ? 'fuel' : 'energy'} left\n`
      : `legwise: wrote ${file}: the route's ${n} waypoints without estimates — the mission does not reach every waypoint\n`,
  );
  return true;
}

function runTuneCommand(path: string, opts: OutputOptions, io: CliIo): number {
  const loaded = loadPlan(path, io);
  if (loaded === null) return EXIT_USAGE;
  const base = solvePlan(loaded.plan);
  const report = runTune(loaded.plan, base);
  io.stdout(opts.json ? renderTuneJson(report) : renderTuneText(report, opts.units));
  return base.verdict === 'fails' || !base.completed ? EXIT_FAILS : EXIT_OK;
}

const COMMANDS = {
  solve: runSolve,
  tune: runTuneCommand,
  check: runCheck,
} as const;

/** Runs one command line (without the program name) and returns the exit code. */
export function runCli(argv: readonly string[], io: CliIo): number {
  let parsed;
  try {
    parsed = parseArgs({
      args: [...argv],
      allowPositionals: true,
      strict: true,
      options: {
        units: { type: 'string' },
        json: { type: 'boolean' },
        csv: { type: 'boolean' },
        'monte-carlo': { type: 'boolean' },
        gpx: { type: 'string' },
        help: { type: 'boolean', short: 'h' },
        version: { type: 'boolean', short: 'v' },
      },
    });
  } catch (err) {
    return usageError(io, err instanceof Error ? err.message : String(err));
  }
  const { values, positionals } = parsed;
  if (values.help) {
    io.stdout(USAGE);
    return EXIT_OK;
  }
  if (values.version) {
    io.stdout(`legwise ${version()}\n`);
    return EXIT_OK;
  }
  const [command, file, ...extra] = positionals;
  if (command === undefined) return usageError(io, 'missing command (solve, tune or check)');
  if (!Object.hasOwn(COMMANDS, command)) return usageError(io, `unknown command "${command}"`);
  if (file === undefined) return usageError(io, `${command}: missing plan file`);
  if (extra.length > 0) return usageError(io, `${command}: unexpected argument "${extra[0]}"`);
  const units = values.units ?? 'si';
  if (units !== 'si' && units !== 'aviation') {
    return usageError(io, `--units: "${units}" — must be "si" or "aviation"`);
  }
  if (values.csv && (values.json || command !== 'solve')) {
    return usageError(io, '--csv: only with solve, and not together with --json');
  }
  if (values['monte-carlo'] && (values.csv || command !== 'solve')) {
    return usageError(io, '--monte-carlo: only with solve, and not together with --csv');
  }
  if (values.gpx !== undefined && command !== 'solve') {
    return usageError(io, '--gpx: only with solve');
  }
  if (values.gpx !== undefined && values.gpx.trim() === '') {
    return usageError(io, '--gpx: needs a file name');
  }
  const opts: OutputOptions = {
    units: units as UnitSystemId,
    json: values.json ?? false,
    csv: values.csv ?? false,
    monteCarlo: values['monte-carlo'] ?? false,
    ...(values.gpx !== undefined ? { gpx: values.gpx } : {}),
  };
  try {
    return COMMANDS[command as keyof typeof COMMANDS](file, opts, io);
  } catch (err) {
    // A plan that passed validation should never be refused by core; if it is, say where.
    if (err instanceof InputError) {
      io.stderr(`legwise: ${err.message}\n`);
      return EXIT_USAGE;
    }
    throw err;
  }
}

/** Binds runCli to the process: real stdout/stderr/files, exit code via process.exitCode. */
export function main(argv: readonly string[] = process.argv.slice(2)): void {
  // A closed pipe (`legwise solve x | head`) is not an error worth a stack trace.
  process.stdout.on('error', (err: NodeJS.ErrnoException) => {
    if (err.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw err;
  });
  process.exitCode = runCli(argv, {
    stdout: (t) => process.stdout.write(t),
    stderr: (t) => process.stderr.write(t),
    readFile: (p) => readFileSync(p, 'utf8'),
    writeFile: (p, text) => writeFileSync(p, text, 'utf8'),
  });
}

export { CAUTION };

// Run when started directly (`tsx cli/main.ts solve plan.json`); bin/legwise.mjs calls main().
const entry = process.argv[1];
if (entry !== undefined && import.meta.url === pathToFileURL(entry).href) main();
