/**
 * Files the operating system asks us to open: a double-clicked plan (macOS 'open-file',
 * elsewhere the command line of the first or a second instance). Pure functions of the
 * argument list, so tests need no Electron.
 */
import path from 'node:path';

/** Our own extension for plan files; `.json` plans of earlier versions open too. */
export const PLAN_FILE_EXTENSION = '.legwise';
/** Our own extension for aircraft files (the aircraft library). */
export const AIRCRAFT_FILE_EXTENSION = '.lwac';
export const OPENABLE_PLAN_EXTENSIONS = [PLAN_FILE_EXTENSION, '.json'] as const;

export function isPlanFileName(name: string): boolean {
  const lower = name.toLowerCase();
  return OPENABLE_PLAN_EXTENSIONS.some((ext) => lower.endsWith(ext));
}

/**
 * The plan file named on a command line, resolved against `cwd`, or null. Skips the
 * executable (and, unpackaged, the app folder `electron .` passes), every switch
 * Chromium or the OS adds (`--…`, `-psn_…` on macOS), and anything not named like a plan.
 */
export function planPathFromArgv(
  argv: readonly string[],
  options: { isPackaged: boolean; cwd: string },
): string | null {
  const rest = argv.slice(options.isPackaged ? 1 : 2);
  for (const arg of rest) {
    if (arg.startsWith('-')) continue;
    if (!isPlanFileName(arg)) continue;
    return path.resolve(options.cwd, arg);
  }
  return null;
}
