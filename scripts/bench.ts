/**
 * `npm run bench`: the speed bars of DESIGN.md section 6, measured in one run.
 *  1. Median and p90 solve time of the 12-leg example plan (target ≤ 0.3 ms median).
 *  2. A 100 × 60 speed × altitude map of one cruise leg with full leg integration
 *     (target ≤ 25 ms).
 *  3. Cost of the integrator against the closed form it must reproduce: one jet cruise-climb
 *     leg flown by the solver vs Breguet's cruise-climb range (Anderson, Introduction to
 *     Flight, ch. 6), with their agreement and the ODE steps per leg.
 *  4. Optimizer times on the same plan.
 *  5. Every example plan solved with the default ('precise') and the 'fast' tolerance, so a
 *     powerplant whose solve is out of line shows up (median per solve).
 *  6. The reserve Monte Carlo: 10 000 samples of the 12-leg plan (target ≤ 1.5 s).
 *  7. CLI batch mode: `legwise solve FILE...` in one process over 1000 copies of the 12-leg
 *     plan file — read, strict decode, validate, solve, one NDJSON row each (target ≥ 500
 *     plans/s on one core).
 *  8. GPX import of a 190 000-point logger track (elevation and time on every point) in a
 *     child process under an 80 MB heap limit (targets ≤ 0.3 s, ≤ 80 MB).
 * Sections 1, 2, 6, 7 and 8 also print the ratio to the previous implementation's figures
 * (bench-previous.json). Timings use performance.now(); they depend on the machine and are
 * printed, never asserted.
 */
import { spawnSync } from 'node:child_process';
import { atmosphereAt } from '../core/atmosphere.ts';
import { jetDesignPoint } from '../core/plan/migrations/jetMachLapse.ts';
import { tsfcAt_kg_Ns } from '../core/propulsion/jet.ts';

import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { rangeJetCruiseClimb } from '../core/breguet.ts';
import { bestCruiseAltitude } from '../core/optimize/altitudeSweep.ts';
import { powerCurves } from '../core/optimize/curves.ts';
import { speedAltitudeSweep } from '../core/optimize/grid.ts';
import { maxPayload } from '../core/optimize/maxPayload.ts';
import { payloadRange } from '../core/optimize/payloadRange.ts';
import { reserveSensitivity } from '../core/optimize/sensitivity.ts';
import { bestSpeedForLeg, legSpeedRange } from '../core/optimize/speedSweep.ts';
import { runBatch } from '../cli/batch.ts';
import { parsePlanText } from '../core/plan/load.ts';
import { PLAN_SCHEMA_VERSION, PlanSchema } from '../core/plan/schema.ts';
import type { Plan } from '../core/plan/schema.ts';
import { dragCoefficient, polarCoefficients } from '../core/polar.ts';
import { flyLeg } from '../core/solver/legs/index.ts';
import { ambientAt, buildModel } from '../core/solver/model.ts';
import { solvePlan } from '../core/solver/solve.ts';
import { reserveMonteCarlo } from '../core/uncertainty/reserveMonteCarlo.ts';
import { spreadsFromDefaults } from '../core/uncertainty/spreads.ts';
import { G0 } from '../core/units.ts';
import { loggerTrackGpx } from '../test/support/gpxSynth.ts';

// Targets of issue 13 (a lean solver); the previous figures are in bench-previous.json.
const TARGET_SOLVE_MS = 0.3;
const TARGET_SWEEP_MS = 25;
const TARGET_MONTE_CARLO_MS = 1500;
const MONTE_CARLO_SAMPLES = 10_000;

interface PreviousFigures {
  solveTwelveLegs_ms: number;
  sweep100x60_ms: number;
  monteCarlo10000_ms: number;
  cliPlansPerSecond: number;
  gpx190k_ms: number;
}
const PREVIOUS = JSON.parse(
  readFileSync(fileURLToPath(new URL('./bench-previous.json', import.meta.url)), 'utf8'),
) as PreviousFigures;
/** "0.42× the previous 0.75 ms" — below 1 is faster (for rates: above 1 is faster). */
const ratio = (now: number, before: number, unit: string) =>
  `${(now / before).toFixed(2)}× the previous ${before} ${unit}`;
const TARGET_BATCH_PLANS_S = 500;
const BATCH_FILES = 1000;
const TARGET_GPX_MS = 300;
const TARGET_GPX_MB = 80;
const GPX_POINTS = 190_000;

function stats(samples: number[]): { median: number; p90: number; min: number } {
  const s = [...samples].sort((a, b) => a - b);
  const at = (q: number) => s[Math.min(s.length - 1, Math.floor(q * s.length))] ?? 0;
  return { median: at(0.5), p90: at(0.9), min: s[0] ?? 0 };
}

function time(f: () => unknown, runs: number): number[] {
  const out: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    f();
    out.push(performance.now() - t0);
  }
  return out;
}

const verdict = (ok: boolean) => (ok ? 'PASS' : 'MISS');
const ms = (v: number) => `${v.toFixed(3)} ms`;

function loadTwelveLegs(): { plan: Plan; source: string } {
  const path = fileURLToPath(new URL('../examples/twelve-legs.json', import.meta.url));
  if (existsSync(path)) {
    const loaded = parsePlanText(readFileSync(path, 'utf8'));
    if (loaded.ok) return { plan: loaded.plan, source: 'examples/twelve-legs.json' };
    console.warn('examples/twelve-legs.json did not load; using the built-in plan');
  }
  return { plan: builtInTwelveLegs(), source: 'built-in 12-leg plan' };
}

/** Anderson's small business jet (Introduction to Flight, ch. 6; CLmax and thrust invented). */
function andersonJet(): unknown {
  const m0 = 88176.75 / G0;
  const fuel = 33211.9 / G0;
  return {
    name: 'Anderson business jet',
    wingArea_m2: 29.54,
    polar: {
      CD0: 0.02,
      induced: { by: 'geometry', e: 0.81, AR: 16.25 ** 2 / 29.54 },
      CLminD: 0,
      CLmax: 1.5,
    },
    mass: { empty_kg: m0 - fuel - 400, payload_kg: 400, mtow_kg: 9500 },
    ceiling_m: 13000,
    powerplant: {
      type: 'jet',
      maxThrustSL_N: 30000,
      thrustLapseExponent: 0.8,
      tsfc_kg_Ns: 0.6 / 3600 / G0,
      idleFuelFraction: 0.05,
      fuel: { kind: 'jetA1', load_kg: fuel, tankCapacity_L: 5000 },
    },
  };
}

const wind = (speed_m_s: number) => ({ course_deg: 0, wind: { speed_m_s, from_deg: 30 } });
const climb = (id: string, toAltitude_m: number) => ({
  kind: 'climb',
  id,
  ...wind(8),
  toAltitude_m,
  speed: { kind: 'bestRate' },
  throttle: 1,
});
const cruise = (
  id: string,
  end: unknown,
  speed: unknown = { kind: 'bestRange' },
  program = 'constantAltitude',
) => ({
  kind: 'cruise',
  id,
  ...wind(12),
  end,
  speed,
  program,
});
const descent = (id: string, toAltitude_m: number) => ({
  kind: 'descent',
  id,
  ...wind(8),
  toAltitude_m,
  mode: { by: 'glide' },
});
const loiter = (id: string, time_s: number) => ({
  kind: 'loiter',
  id,
  ...wind(10),
  end: { by: 'time', time_s },
  speed: { kind: 'bestEndurance' },
});

function benchPlan(name: string, legs: unknown[], reserves: boolean): Plan {
  return PlanSchema.parse({
    format: 'legwise-plan',
    schemaVersion: PLAN_SCHEMA_VERSION,
    name,
    aircraft: andersonJet(),
    environment: { isaOffset_K: 0, qnh_Pa: 101325, departureElevation_m: 0, arrivalElevation_m: 0 },
    reserves: {
      holdTime_s: reserves ? 1800 : 0,
      holdAltitude_m: 1500,
      contingencyFraction: reserves ? 0.05 : 0,
      alternateDistance_m: reserves ? 150_000 : 0,
      alternateAltitude_m: 4500,
      socFloor: 0,
    },
    settings: { stallFactor: 1.2, tightMargin: 0.1, minClimbRate_m_s: 0.5 },
    legs,
  });
}

/** Fallback when the example file is missing: the same jet on a twelve-leg mission. */
function builtInTwelveLegs(): Plan {
  const distance = (distance_m: number) => ({ by: 'distance', distance_m });
  return benchPlan(
    'Bench fallback: twelve legs',
    [
      { kind: 'takeoff', id: 'l1', allowance: { by: 'fuel', fuel_kg: 20 } },
      climb('l2', 7000),
      cruise('l3', distance(400_000)),
      descent('l4', 3000),
      loiter('l5', 1800),
      climb('l6', 9000),
      cruise('l7', distance(300_000), { kind: 'mach', mach: 0.55 }),
      loiter('l8', 1200),
      cruise('l9', distance(300_000), { kind: 'tas', speed_m_s: 170 }, 'cruiseClimb'),
      descent('l10', 1000),
      cruise('l11', distance(30_000), { kind: 'tas', speed_m_s: 110 }),
      { kind: 'landing', id: 'l12', allowance: { by: 'fuel', fuel_kg: 10 } },
    ],
    true,
  );
}

/** One climb and one cruise-climb leg burning 2500 kg at 150 m/s TAS, still air. */
function jetCruiseClimbPlan(): Plan {
  const still = { course_deg: 0, wind: { speed_m_s: 0, from_deg: 0 } };
  return benchPlan(
    'Integrator vs closed form',
    [
      { ...climb('c', 6700), ...still },
      {
        ...cruise(
          'cc',
          { by: 'fuel', fuel_kg: 2500 },
          { kind: 'tas', speed_m_s: 150 },
          'cruiseClimb',
        ),
        ...still,
      },
    ],
    false,
  );
}

function benchSolve(plan: Plan, source: string): void {
  const r = solvePlan(plan);
  for (let i = 0; i < 100; i++) solvePlan(plan); // warm-up
  const s = stats(time(() => solvePlan(plan), 400));
  const steps = r.legs.map((l) => l.steps);
  const flightLegs = steps.filter((n) => n > 0);
  const mean = flightLegs.reduce((a, b) => a + b, 0) / Math.max(1, flightLegs.length);
  console.log(
    `1. Solve ${source} (${plan.legs.length} legs, verdict ${r.verdict}), 400 runs after 100 warm-up`,
  );
  console.log(
    `   median ${ms(s.median)}, p90 ${ms(s.p90)}, min ${ms(s.min)}   target ≤ ${TARGET_SOLVE_MS} ms median: ${verdict(s.median <= TARGET_SOLVE_MS)}; ${ratio(s.median, PREVIOUS.solveTwelveLegs_ms, 'ms')}`,
  );
  console.log(
    `   ODE steps per leg: [${steps.join(', ')}], mean over flight legs ${mean.toFixed(1)}`,
  );
  benchAgainstConstantPropeller(plan);
}

/** The plan with the flat propeller of earlier versions (constant η, no `propeller` block). */
function withConstantPropeller(plan: Plan): Plan | null {
  const pp = plan.aircraft.powerplant;
  if (pp.type === 'jet' || pp.propeller === undefined) return null;
  const { propeller: _curve, ...flat } = pp;
  return { ...plan, aircraft: { ...plan.aircraft, powerplant: flat } };
}

/** Cost of the speed-dependent propeller against the old constant η, timed alternately. */
function benchAgainstConstantPropeller(plan: Plan): void {
  const old = withConstantPropeller(plan);
  if (old === null) return;
  for (let i = 0; i < 50; i++) {
    solvePlan(plan);
    solvePlan(old);
  }
  const a: number[] = [];
  const b: number[] = [];
  for (let i = 0; i < 200; i++) {
    a.push(...time(() => solvePlan(plan), 1));
    b.push(...time(() => solvePlan(old), 1));
  }
  const now = stats(a).median;
  const before = stats(b).median;
  console.log(
    `   propeller η(V) (this plan's model) median ${ms(now)} vs constant η (the old model) ${ms(before)}, timed alternately: ×${(now / before).toFixed(2)}`,
  );
}

function benchSweep(plan: Plan): void {
  const legIndex = plan.legs.findIndex((l) => l.kind === 'cruise');
  const range = legSpeedRange(plan, solvePlan(plan), legIndex);
  const speeds = Array.from(
    { length: 100 },
    (_, i) => range.lo_m_s + ((range.hi_m_s - range.lo_m_s) * i) / 99,
  );
  const h0 = plan.environment.departureElevation_m + 100;
  const altitudes = Array.from(
    { length: 60 },
    (_, i) => h0 + ((plan.aircraft.ceiling_m - h0) * i) / 59,
  );
  speedAltitudeSweep(plan, legIndex, speeds, altitudes); // warm-up
  let last = speedAltitudeSweep(plan, legIndex, speeds, altitudes);
  const s = stats(
    time(() => {
      last = speedAltitudeSweep(plan, legIndex, speeds, altitudes);
    }, 7),
  );
  const feasible = last.values.flat().filter((v) => v !== null).length;
  console.log(
    `2. Speed × altitude map of leg ${legIndex + 1}: 100 speeds (${range.lo_m_s.toFixed(1)}–${range.hi_m_s.toFixed(1)} m/s) × 60 altitudes, full leg integration, 7 runs`,
  );
  console.log(
    `   median ${ms(s.median)}, min ${ms(s.min)}   target ≤ ${TARGET_SWEEP_MS} ms: ${verdict(s.median <= TARGET_SWEEP_MS)}; ${ratio(s.median, PREVIOUS.sweep100x60_ms, 'ms')}`,
  );
  console.log(
    `   ${feasible} of 6000 cells flyable, ${(last.steps / last.legsFlown).toFixed(1)} ODE steps per leg on average`,
  );
}

function benchClosedForm(): void {
  const plan = jetCruiseClimbPlan();
  const result = solvePlan(plan);
  const leg = result.legs[1];
  if (leg === undefined || leg.status !== 'flown') {
    console.log(
      `3. Integrator vs closed form: the cruise-climb leg was not flown (${result.failure?.message ?? '?'})`,
    );
    return;
  }
  const model = buildModel(plan);
  const legPlan = plan.legs[1] as Plan['legs'][number];
  const start = {
    t_s: 0,
    x_m: 0,
    air_m: 0,
    h_m: leg.start.h_m,
    mass_kg: leg.start.mass_kg,
    left: leg.start.fuel_kg,
  };
  const ctx = { model, index: 1, samples: 0 };
  const V = 150;
  const rho = ambientAt(model, leg.start.h_m).atm.rho_kg_m3;
  const CL = (2 * leg.start.mass_kg * G0) / (rho * V * V * plan.aircraft.wingArea_m2);
  const CD = dragCoefficient(polarCoefficients(plan.aircraft.polar), CL);
  const pp = plan.aircraft.powerplant;
  const ct = pp.type === 'jet' ? pp.tsfc_kg_Ns * G0 : 0;
  const args = { ct, V, CL, CD, W0: leg.start.mass_kg * G0, W1: leg.end.mass_kg * G0 };
  const closed = () => rangeJetCruiseClimb(args);
  const integrated = () => flyLeg(ctx, legPlan, start);
  for (let i = 0; i < 2000; i++) {
    closed();
    integrated();
  }
  const runs = 20000;
  const tInt = stats(time(integrated, runs)).median;
  // The closed form is too quick for one timer reading: time it in batches of 1000.
  const tClosed =
    stats(
      time(() => {
        for (let i = 0; i < 1000; i++) closed();
      }, 200),
    ).median / 1000;
  const diff = Math.abs(leg.groundDistance_m - closed()) / closed();
  console.log(
    '3. Integrated vs closed-form cost: one jet cruise-climb leg (Anderson business jet, 2500 kg fuel, 150 m/s)',
  );
  console.log(
    `   integrated leg ${(tInt * 1000).toFixed(2)} µs (${leg.steps} ODE steps), Breguet cruise-climb ${(tClosed * 1000).toFixed(4)} µs → ratio ${(tInt / tClosed).toFixed(0)}`,
  );
  console.log(
    `   range integrated ${leg.groundDistance_m.toFixed(1)} m vs closed form ${closed().toFixed(1)} m, relative difference ${diff.toExponential(2)}`,
  );
}

function benchOptimizers(plan: Plan): void {
  const legIndex = plan.legs.findIndex((l) => l.kind === 'cruise');
  const rows: [string, () => unknown][] = [
    [`bestSpeedForLeg (leg ${legIndex + 1})`, () => bestSpeedForLeg(plan, legIndex)],
    ['bestCruiseAltitude', () => bestCruiseAltitude(plan)],
    ['payloadRange', () => payloadRange(plan)],
    ['maxPayload', () => maxPayload(plan)],
    ['reserveSensitivity', () => reserveSensitivity(plan)],
    [`powerCurves (leg ${legIndex + 1})`, () => powerCurves(plan, legIndex)],
  ];
  console.log('4. Optimizers on the same plan (one warm-up, median of 3 runs)');
  for (const [name, f] of rows) {
    try {
      f();
      console.log(`   ${name.padEnd(28)} ${ms(stats(time(f, 3)).median)}`);
    } catch (e) {
      console.log(
        `   ${name.padEnd(28)} not available: ${e instanceof Error ? e.message : String(e)}`,
      );
    }
  }
}

function benchExamples(): void {
  const dir = fileURLToPath(new URL('../examples/', import.meta.url));
  const files = existsSync(dir) ? readdirSync(dir).filter((f) => f.endsWith('.json')) : [];
  console.log(
    '5. Example plans: median solve time, precise and fast tolerance (100 runs after 30)',
  );
  for (const file of files.sort()) {
    const loaded = parsePlanText(readFileSync(`${dir}${file}`, 'utf8'));
    if (!loaded.ok) {
      console.log(`   ${file.padEnd(28)} does not load`);
      continue;
    }
    const plan = loaded.plan;
    const cells = (['precise', 'fast'] as const).map((tolerance) => {
      const solve = () => solvePlan(plan, { tolerance });
      time(solve, 30);
      return `${tolerance} ${ms(stats(time(solve, 100)).median)}`;
    });
    const kind = plan.aircraft.powerplant.type;
    console.log(`   ${file.padEnd(28)} ${kind.padEnd(10)} ${cells.join(', ')}`);
    const old = withDensityLapseJet(plan);
    if (old !== null) {
      const solveOld = () => solvePlan(old);
      const solveNew = () => solvePlan(plan);
      time(solveOld, 30);
      const a = stats(time(solveNew, 100)).median;
      const b = stats(time(solveOld, 100)).median;
      console.log(
        `   ${''.padEnd(28)} engine-class lapse + Mach TSFC ${ms(a)} vs σ^0.8 + constant TSFC (the old jet model) ${ms(b)}: ×${(a / b).toFixed(2)}`,
      );
    }
  }
}

/**
 * A jet plan with the version-1 engine model: T_SL·σ^0.8 and one TSFC, the one the Mach-and-θ
 * form gives at the plan's design point (core/plan/migrations/jetMachLapse.ts), for timing.
 */
function withDensityLapseJet(plan: Plan): Plan | null {
  const pp = plan.aircraft.powerplant;
  if (pp.type !== 'jet' || pp.thrustLapse === undefined) return null;
  const point = jetDesignPoint(plan as unknown as Record<string, unknown>);
  const atm = atmosphereAt(point.altitude_m, plan.environment.isaOffset_K);
  const tsfc = tsfcAt_kg_Ns(pp, atm, point.mach);
  const { thrustLapse: _l, tsfcMachFactor: _f, ...rest } = pp;
  const powerplant = { ...rest, thrustLapseExponent: 0.8, tsfc_kg_Ns: tsfc };
  return { ...plan, aircraft: { ...plan.aircraft, powerplant } };
}

function benchMonteCarlo(plan: Plan, source: string): void {
  const spreads = spreadsFromDefaults(plan);
  const run = () => reserveMonteCarlo(plan, spreads, { samples: MONTE_CARLO_SAMPLES, seed: 1 });
  reserveMonteCarlo(plan, spreads, { samples: 200, seed: 2 }); // warm-up
  let last = run();
  const s = stats(
    time(() => {
      last = run();
    }, 3),
  );
  console.log(
    `6. Reserve Monte Carlo of ${source}: ${MONTE_CARLO_SAMPLES} samples ('fast' tolerance), 3 runs after a warm-up`,
  );
  console.log(
    `   median ${ms(s.median)}, min ${ms(s.min)}   target ≤ ${TARGET_MONTE_CARLO_MS} ms: ${verdict(s.median <= TARGET_MONTE_CARLO_MS)}; ${ratio(s.median, PREVIOUS.monteCarlo10000_ms, 'ms')}`,
  );
  console.log(
    `   reserve not kept in ${(100 * last.probabilityReserveNotKept).toFixed(1)} % of samples; ${(MONTE_CARLO_SAMPLES / (s.median / 1000)).toFixed(0)} solves per second`,
  );
  const flat = withConstantPropeller(plan);
  if (flat !== null) {
    const runOld = () =>
      reserveMonteCarlo(flat, spreadsFromDefaults(flat), { samples: MONTE_CARLO_SAMPLES, seed: 1 });
    const pair = time(runOld, 1).concat(time(run, 1));
    console.log(
      `   one run each, back to back: constant η (the old model) ${ms(pair[0]!)}, propeller η(V) ${ms(pair[1]!)}: ×${(pair[1]! / pair[0]!).toFixed(2)}`,
    );
  }
}

function benchBatch(): void {
  const path = fileURLToPath(new URL('../examples/twelve-legs.json', import.meta.url));
  if (!existsSync(path)) {
    console.log('7. CLI batch mode: examples/twelve-legs.json missing, skipped');
    return;
  }
  const bytes = readFileSync(path);
  const files = Array.from({ length: BATCH_FILES }, (_, i) => `plan-${i}.json`);
  let bytesOut = 0;
  const io = {
    stdout: (t: string) => {
      bytesOut += t.length;
    },
    stderr: () => undefined,
    readFile: () => bytes.toString('utf8'),
    stat: () => ({ size: bytes.length, isDirectory: false }),
    readBytes: () => bytes,
  };
  const opts = { units: 'si' as const, json: true, csv: false };
  runBatch(files.slice(0, 100), opts, io); // warm-up
  bytesOut = 0;
  const s = stats(time(() => runBatch(files, opts, io), 3));
  const rate = BATCH_FILES / (s.median / 1000);
  console.log(
    `7. CLI batch mode: ${BATCH_FILES} copies of the 12-leg plan file, read → decode → validate → solve → NDJSON row, in one process, 3 runs`,
  );
  console.log(
    `   median ${ms(s.median)} → ${rate.toFixed(0)} plans/s   target ≥ ${TARGET_BATCH_PLANS_S} plans/s: ${verdict(rate >= TARGET_BATCH_PLANS_S)} (${(bytesOut / 3 / BATCH_FILES).toFixed(0)} characters per row); ${ratio(rate, PREVIOUS.cliPlansPerSecond, 'plans/s (one process per plan)')}`,
  );
}

function benchGpx(): void {
  const dir = mkdtempSync(join(tmpdir(), 'legwise-bench-'));
  try {
    const file = join(dir, 'logger.gpx');
    writeFileSync(file, loggerTrackGpx(GPX_POINTS, 5, { climbBias: 0.5, stepScale: 0.2 }));
    const child = spawnSync(
      process.execPath,
      [
        `--max-old-space-size=${TARGET_GPX_MB}`,
        '--import',
        'tsx',
        fileURLToPath(new URL('./gpxBench.ts', import.meta.url)),
        file,
      ],
      { encoding: 'utf8' },
    );
    console.log(
      `8. GPX import: ${GPX_POINTS} logger track points with ele and time, one-pass reader, child process with a ${TARGET_GPX_MB} MB heap limit, median of 3`,
    );
    if (child.status !== 0) {
      console.log(
        `   did not finish (exit ${child.status}): ${child.stderr.trim().split('\n').pop()}  MISS`,
      );
      return;
    }
    const r = JSON.parse(child.stdout.trim().split('\n').pop() ?? '{}') as {
      median_ms: number;
      cpuPerParse_ms: number;
      waypoints: number;
      peakAbove_MB: number;
      text_MB: number;
    };
    console.log(
      `   median ${ms(r.median_ms)}   target ≤ ${TARGET_GPX_MS} ms: ${verdict(r.median_ms <= TARGET_GPX_MS)} (CPU ${ms(r.cpuPerParse_ms)} per parse); ${r.waypoints} waypoints; ${ratio(r.median_ms, PREVIOUS.gpx190k_ms, 'ms')}`,
    );
    console.log(
      `   peak memory above the process's start ${r.peakAbove_MB.toFixed(0)} MB (the ${r.text_MB.toFixed(0)} MB text included)   target ≤ ${TARGET_GPX_MB} MB: ${verdict(r.peakAbove_MB <= TARGET_GPX_MB)}`,
    );
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

function main(): void {
  const { plan, source } = loadTwelveLegs();
  console.log(`Legwise benchmark — Node ${process.version}, ${process.platform}/${process.arch}\n`);
  benchSolve(plan, source);
  benchSweep(plan);
  benchClosedForm();
  benchOptimizers(plan);
  benchExamples();
  benchMonteCarlo(plan, source);
  benchBatch();
  benchGpx();
}

main();
