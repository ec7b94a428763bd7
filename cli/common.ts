/**
 * What every `legwise` subcommand shares: the output channels (so tests capture them as
 * strings), the caution line, and the option values once parsed.
 */
import type { UnitSystemId } from '../core/units.ts';

export interface CliIo {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
  /** Reads a file as UTF-8 text; throws like fs.readFileSync. */
  readFile: (path: string) => string;
  /** Writes UTF-8 text to a file (`solve --gpx`); throws like fs.writeFileSync. */
  writeFile?: (path: string, text: string) => void;
  /**
   * The real file system (main binds these; tests that serve files from memory leave them
   * out and `readFile` is used): size and kind before reading, the raw bytes, a folder's
   * entries, and at most `maxBytes + 1` bytes of standard input.
   */
  stat?: (path: string) => { size: number; isDirectory: boolean };
  readBytes?: (path: string) => Uint8Array;
  listDir?: (path: string) => string[];
  readStdin?: (maxBytes: number) => Uint8Array;
  /** Canonical form of a path, to tell whether an output would overwrite an input. */
  resolvePath?: (path: string) => string;
  /** Progress of a long run (Monte Carlo, tune, batch): done of total, and what runs. */
  progress?: (done: number, total: number, what: string) => void;
}

/** Printed with every result: these are estimates, never a substitute for approved data. */
export const CAUTION =
  "CAUTION: Estimates for planning only. The aircraft's approved documents, local regulations " +
  'and licensed practice take precedence. The reserve rule (by default a final reserve time at ' +
  'normal cruise) is common practice; local regulations set the rule that applies.';

export interface OutputOptions {
  units: UnitSystemId;
  json: boolean;
  csv: boolean;
  /** solve: also run the reserve Monte Carlo. */
  monteCarlo?: boolean;
  /** solve: write the plan's route with per-waypoint estimates to this GPX file. */
  gpx?: string;
}

/**
 * Exit codes: 0 solved and feasible, 1 solved but the verdict fails, 2 bad file or usage,
 * 3 an internal error (a fault in Legwise, not in the plan). A batch exits with the worst.
 */
export const EXIT_OK = 0;
export const EXIT_FAILS = 1;
export const EXIT_USAGE = 2;
export const EXIT_INTERNAL = 3;
/** Ctrl-C: 128 + SIGINT (2), the shell convention (POSIX, "Exit Status for Commands"). */
export const EXIT_INTERRUPTED = 130;
