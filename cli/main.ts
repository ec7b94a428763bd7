/**
 * `legwise`: the headless command. `solve` prints a plan's per-leg table, checks and verdict
 * (or JSON / CSV; with `--gpx` it also writes the route with per-waypoint estimates); given
 * several files or a folder it solves them all in this process and prints one summary row
 * per plan (batch.ts). `tune` runs the optimizers, `check` validates a plan file. `-` reads
 * the plan from standard input. All logic sits in `runCli`, which writes through an injected
 * io so tests capture the output; `main` binds it to the process (longRun.ts moves long runs
 * off the main thread so Ctrl-C stops them with a message). Exit codes in common.ts.
 */
import { readFileSync } from 'node:fs';
import { pathToFileURL } from 'node:url';
import { parseArgs } from 'node:util';
import { isMainThread } from 'node:worker_threads';
import { InputError } from '../core/errors.ts';
import type { PlanIssue } from '../core/plan/load.ts';
import type { Plan } from '../core/plan/schema.ts';
import { solvePlan } from '../core/solver/solve.ts';
import type { PlanResult } from '../core/solver/types.ts';
import type { UnitSystemId } from '../core/units.ts';
import { runBatch } from './batch.ts';
import { CAUTION, EXIT_FAILS, EXIT_INTERNAL, EXIT_OK, EXIT_USAGE } from './common.ts';
import type { CliIo, OutputOptions } from './common.ts';
import { expandInputs, readPlan, STDIN } from './input.ts';
import { isLongRun, runLong, startWorkerIfAsked } from './longRun.ts';
import { renderMonteCarloText, runMonteCarlo } from './monteCarloReport.ts';
import { processIo } from './processIo.ts';
import { renderRouteText, routeGpx } from './routeReport.ts';
import { mergeWarnings, renderSolveCsv, renderSolveJson, renderSolveText } from './solveReport.ts';
import { renderTuneJson, renderTuneText, runTune } from './tuneReport.ts';

export type { CliIo } from './common.ts';

export const USAGE = `Usage: legwise <command> <plan.json> [options]

Commands
  solve <plan.json>   fly the plan: per-leg table, totals, checks and verdict
  solve <plan.json|folder>...
                      several plans (or every .legwise and .json file in a folder): one summary row
                      per plan — table, --csv, or one JSON object per line with --json
  tune <plan.json>    best cruise altitude, best speed per cruise/loiter leg,
                      maximum payload and reserve sensitivity
  check <plan.json>   validate the file only: problems and sanity warnings
  A plan named "-" is read from standard input.

Options
  --units si|aviation|uav  units for printed values (default si; aviation = ft, NM, kt, lb;
                       uav = m, km, m/s, wind in kt, kg, Wh)
  --json               machine-readable output (solve, tune, check); errors are JSON too
  --csv                per-leg table as CSV (solve)
  --monte-carlo        solve: also simulate the flight many times with uncertain wind,
                       drag, efficiency, consumption and payload (the plan's uncertainty
                       block, or defaults) and say how often the reserve is kept
  --gpx FILE           solve: write the plan's route as GPX 1.1 to FILE, each waypoint
                       with its estimated time from the start and fuel or energy left
  -h, --help           this text
  -v, --version        the Legwise version

Long runs (Monte Carlo, tune, several plans) show progress on stderr; Ctrl-C stops them.

Exit status: 0 solved and feasible (or valid, for check), 1 solved but the verdict
fails, 2 the file or the command line is wrong, 3 an internal error in Legwise;
several plans: the worst of them. 130 stopped with Ctrl-C.
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

/** An error as one JSON object on stdout (with --json), so a script always gets JSON. */
function jsonError(io: CliIo, exit: number, error: string, extra: object = {}): void {
  io.stdout(`${JSON.stringify({ caution: CAUTION, ok: false, exit, error, ...extra }, null, 2)}\n`);
}

function usageError(io: CliIo, message: string, json = false): number {
  io.stderr(`legwise: ${message}\nRun "legwise --help" for usage.\n`);
  if (json) jsonError(io, EXIT_USAGE, message);
  return EXIT_USAGE;
}

/** Reads and validates the plan file; prints the problems and returns null when it is refused. */
function loadPlan(
  path: string,
  io: CliIo,
  json: boolean,
): { plan: Plan; warnings: string[] } | null {
  const read = readPlan(path, io);
  const name = path === STDIN ? 'standard input' : path;
  if (!read.ok) {
    io.stderr(`legwise: cannot read ${name}: ${read.why}\n`);
    if (json) jsonError(io, EXIT_USAGE, `cannot read ${name}: ${read.why}`, { file: path });
    return null;
  }
  const r = read.result;
  if (r.ok) {
    const changes = r.changes.map((c) => `updated from an older plan file: ${c}`);
    return { plan: r.plan, warnings: [...changes, ...r.warnings] };
  }
  const n = r.issues.length;
  const what = `not a usable plan file (${n} problem${n === 1 ? '' : 's'})`;
  io.stderr(`${name}: ${what}:\n`);
  for (const issue of r.issues) io.stderr(`  ${issue.message}\n`);
  if (json) {
    const problems = r.issues.map((i: PlanIssue) => ({ path: i.path, message: i.message }));
    jsonError(io, EXIT_USAGE, `${name}: ${what}`, { file: path, problems });
  }
  return null;
}

function runCheck(path: string, opts: OutputOptions, io: CliIo): number {
  const loaded = loadPlan(path, io, opts.json);
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
  const loaded = loadPlan(path, io, opts.json);
  if (loaded === null) return EXIT_USAGE;
  const { plan } = loaded;
  if (opts.gpx !== undefined && plan.route === undefined) {
    return usageError(
      io,
      `--gpx: ${path} has no route (plan.route) to export; add waypoints to the plan first`,
      opts.json,
    );
  }
  const result = solvePlan(plan);
  const warnings = mergeWarnings(loaded.warnings, result);
  const mc = opts.monteCarlo ? runMonteCarlo(plan, io.progress) : null;
  if (opts.json) io.stdout(renderSolveJson(plan, result, warnings, mc));
  else if (opts.csv) io.stdout(renderSolveCsv(result, opts.units));
  else {
    const route = renderRouteText(plan, result, opts.units);
    const monteCarlo = mc ? renderMonteCarloText(mc, opts.units, plan) : '';
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
  const loaded = loadPlan(path, io, opts.json);
  if (loaded === null) return EXIT_USAGE;
  const base = solvePlan(loaded.plan);
  const report = runTune(loaded.plan, base, io.progress);
  io.stdout(opts.json ? renderTuneJson(report) : renderTuneText(report, opts.units));
  return base.verdict === 'fails' || !base.completed ? EXIT_FAILS : EXIT_OK;
}

const COMMANDS = {
  solve: runSolve,
  tune: runTuneCommand,
  check: runCheck,
} as const;

const OPTIONS = {
  units: { type: 'string' },
  json: { type: 'boolean' },
  csv: { type: 'boolean' },
  'monte-carlo': { type: 'boolean' },
  gpx: { type: 'string' },
  help: { type: 'boolean', short: 'h' },
  version: { type: 'boolean', short: 'v' },
} as const;

/** The command line split into command, inputs and options; a string says what is wrong. */
export function parseCommandLine(
  argv: readonly string[],
):
  | { command?: string; inputs: string[]; values: Record<string, string | boolean | undefined> }
  | string {
  try {
    const { values, positionals } = parseArgs({
      args: [...argv],
      allowPositionals: true,
      strict: true,
      options: OPTIONS,
    });
    const [command, ...inputs] = positionals;
    return { ...(command === undefined ? {} : { command }), inputs, values };
  } catch (err) {
    return err instanceof Error ? err.message : String(err);
  }
}

/** Checks the options against the command; an error message, or the options. */
function outputOptions(
  command: string,
  inputs: readonly string[],
  values: Record<string, string | boolean | undefined>,
  io: CliIo,
): OutputOptions | string {
  const json = values.json === true;
  const units = (values.units as string | undefined) ?? 'si';
  if (units !== 'si' && units !== 'aviation' && units !== 'uav') {
    return `--units: "${units}" — must be "si", "aviation" or "uav"`;
  }
  if (values.csv && (json || command !== 'solve')) {
    return '--csv: only with solve, and not together with --json';
  }
  if (values['monte-carlo'] && (values.csv || command !== 'solve')) {
    return '--monte-carlo: only with solve, and not together with --csv';
  }
  const gpx = values.gpx as string | undefined;
  if (gpx !== undefined) {
    if (command !== 'solve') return '--gpx: only with solve';
    if (gpx.trim() === '') return '--gpx: needs a file name';
    if (gpx === STDIN) return '--gpx: needs a file name ("-" is standard input, not a file)';
    const same = (a: string, b: string) =>
      io.resolvePath ? io.resolvePath(a) === io.resolvePath(b) : a === b;
    const input = inputs.find((f) => f !== STDIN && same(f, gpx));
    if (input !== undefined) {
      return `--gpx: ${gpx} is the plan file itself; writing the route there would overwrite the plan — choose another file name`;
    }
  }
  if (inputs.filter((f) => f === STDIN).length > 1) {
    return `${command}: standard input ("-") can be read only once`;
  }
  return {
    units: units as UnitSystemId,
    json,
    csv: values.csv === true,
    monteCarlo: values['monte-carlo'] === true,
    ...(gpx !== undefined ? { gpx } : {}),
  };
}

function dispatch(argv: readonly string[], io: CliIo): number {
  const parsed = parseCommandLine(argv);
  if (typeof parsed === 'string') return usageError(io, parsed, argv.includes('--json'));
  const { command, inputs, values } = parsed;
  const json = values.json === true;
  if (values.help) {
    io.stdout(USAGE);
    return EXIT_OK;
  }
  if (values.version) {
    io.stdout(`legwise ${version()}\n`);
    return EXIT_OK;
  }
  if (command === undefined) return usageError(io, 'missing command (solve, tune or check)', json);
  if (!Object.hasOwn(COMMANDS, command)) {
    return usageError(io, `unknown command "${command}"`, json);
  }
  if (inputs.length === 0) return usageError(io, `${command}: missing plan file`, json);
  const opts = outputOptions(command, inputs, values, io);
  if (typeof opts === 'string') return usageError(io, opts, json);
  const expanded = command === 'solve' ? expandInputs(inputs, io) : { files: inputs, folders: 0 };
  if ('error' in expanded) return usageError(io, expanded.error, json);
  const batch = command === 'solve' && (expanded.files.length > 1 || expanded.folders > 0);
  if (batch) {
    if (opts.gpx !== undefined) return usageError(io, '--gpx: only with a single plan', json);
    if (opts.monteCarlo) return usageError(io, '--monte-carlo: only with a single plan', json);
    if (expanded.files.length === 0) {
      return usageError(io, `solve: no .json plan files in ${inputs.join(', ')}`, json);
    }
    return runBatch(expanded.files, opts, io);
  }
  if (inputs.length > 1)
    return usageError(io, `${command}: unexpected argument "${inputs[1]}"`, json);
  return COMMANDS[command as keyof typeof COMMANDS](inputs[0] as string, opts, io);
}

/** Runs one command line (without the program name) and returns the exit code. */
export function runCli(argv: readonly string[], io: CliIo): number {
  try {
    return dispatch(argv, io);
  } catch (err) {
    // A plan that passed validation should never be refused by core, and nothing else should
    // throw: say so, and exit 3 (not 1, which means "solved, infeasible").
    const why = err instanceof Error ? err.message : String(err);
    const message =
      err instanceof InputError
        ? `internal error: a validated plan was refused by the solver: ${why}`
        : `internal error: ${why}`;
    io.stderr(
      `legwise: ${message} — this is a fault in Legwise, not in your plan; please report it\n`,
    );
    if (argv.includes('--json')) jsonError(io, EXIT_INTERNAL, message);
    return EXIT_INTERNAL;
  }
}

/** Binds runCli to the process; long runs go to a worker thread so Ctrl-C can stop them. */
export function main(argv: readonly string[] = process.argv.slice(2)): void {
  // A closed pipe (`legwise solve x | head`) is not an error worth a stack trace.
  process.stdout.on('error', (err: NodeJS.ErrnoException) => {
    if (err.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw err;
  });
  if (isLongRun(argv)) {
    runLong(argv);
    return;
  }
  process.exitCode = runCli(argv, processIo());
}

export { CAUTION };

// A worker thread started by runLong runs the command line it was given.
startWorkerIfAsked(runCli);

// Run when started directly (`node dist-cli/legwise.mjs solve plan.json`); bin/legwise.mjs
// calls main().
const entry = process.argv[1];
if (isMainThread && entry !== undefined && import.meta.url === pathToFileURL(entry).href) main();
