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
}

/** Printed with every result: these are estimates, never a substitute for approved data. */
export const CAUTION =
  "CAUTION: Estimates for planning only. The aircraft's approved documents, local regulations " +
  'and licensed practice take precedence.';

export interface OutputOptions {
  units: UnitSystemId;
  json: boolean;
  csv: boolean;
  /** solve: also run the reserve Monte Carlo. */
  monteCarlo?: boolean;
  /** solve: write the plan's route with per-waypoint estimates to this GPX file. */
  gpx?: string;
}

/** Exit codes: 0 solved and feasible, 1 solved but the verdict fails, 2 bad file or usage. */
export const EXIT_OK = 0;
export const EXIT_FAILS = 1;
export const EXIT_USAGE = 2;
