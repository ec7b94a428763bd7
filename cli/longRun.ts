/**
 * Long runs — the Monte Carlo, `tune`, several plans — go to a worker thread (Node
 * worker_threads) running the same bundled command, so the main thread stays free: it
 * relays the worker's output, and on Ctrl-C (SIGINT) it stops the worker, says so on stderr
 * and exits 130. The worker reports progress on stderr (processIo.ts).
 */
import { isMainThread, parentPort, Worker, workerData } from 'node:worker_threads';
import type { CliIo } from './common.ts';
import { EXIT_INTERNAL, EXIT_INTERRUPTED } from './common.ts';
import { parseCommandLine } from './main.ts';
import { processIo, progressPrinter } from './processIo.ts';

interface LongRunData {
  legwiseArgv: string[];
  isTTY: boolean;
}

/** Runs that can take seconds to minutes: worth progress and a clean Ctrl-C. */
export function isLongRun(argv: readonly string[]): boolean {
  const parsed = parseCommandLine(argv);
  if (typeof parsed === 'string' || parsed.values.help || parsed.values.version) return false;
  if (parsed.command === 'tune') return true;
  if (parsed.command !== 'solve') return false;
  return (
    parsed.values['monte-carlo'] === true || parsed.inputs.length > 1 || isFolder(parsed.inputs[0])
  );
}

function isFolder(path: string | undefined): boolean {
  if (path === undefined || path === '-') return false;
  try {
    return processIo().stat?.(path).isDirectory === true;
  } catch {
    return false;
  }
}

export function runLong(argv: readonly string[]): void {
  const data: LongRunData = { legwiseArgv: [...argv], isTTY: process.stderr.isTTY === true };
  const worker = new Worker(new URL(import.meta.url), { workerData: data });
  let exit: number | undefined;
  const stop = () => {
    process.stderr.write(
      '\nlegwise: stopped with Ctrl-C before the run finished; no result was printed or written\n',
    );
    void worker.terminate();
    process.exit(EXIT_INTERRUPTED);
  };
  process.once('SIGINT', stop);
  worker.on('message', (m: { exit?: number }) => {
    if (typeof m.exit === 'number') exit = m.exit;
  });
  worker.on('error', (err: Error) => {
    process.stderr.write(`legwise: internal error: ${err.message}\n`);
    exit = EXIT_INTERNAL;
  });
  worker.on('exit', () => {
    process.off('SIGINT', stop);
    process.exitCode = exit ?? EXIT_INTERNAL;
  });
}

/** In a worker started by runLong: run its command line and post the exit code. */
export function startWorkerIfAsked(run: (argv: readonly string[], io: CliIo) => number): void {
  if (isMainThread || parentPort === null) return;
  const data = workerData as Partial<LongRunData> | undefined;
  if (!Array.isArray(data?.legwiseArgv)) return;
  const printer = progressPrinter(data.isTTY === true, (t) => process.stderr.write(t));
  const exit = run(data.legwiseArgv, processIo(printer.progress));
  printer.finish();
  parentPort.postMessage({ exit });
}
