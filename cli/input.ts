/**
 * Reading plan files for the CLI: the size checked before a byte is read (a 1 GB file is
 * refused without reading it), bytes decoded strictly (core/plan/decode.ts), `-` for
 * standard input, and a folder expanded to the plan files in it.
 */
import {
  MAX_PLAN_TEXT_LENGTH,
  parsePlanBytes,
  parsePlanText,
  tooLargeIssue,
} from '../core/plan/load.ts';
import type { LoadResult, PlanIssue } from '../core/plan/load.ts';
import type { CliIo } from './common.ts';

/** `-` reads the plan from standard input. */
export const STDIN = '-';

export type ReadOutcome =
  | { ok: true; result: LoadResult }
  /** The file could not be read at all (missing, a folder, no permission). */
  | { ok: false; why: string };

function errorCode(err: unknown): string {
  const code = (err as { code?: string }).code;
  if (code === 'ENOENT') return 'no such file';
  if (code === 'EISDIR') return 'is a directory';
  if (code === 'EACCES') return 'permission denied';
  return code ?? String(err);
}

const refused = (i: PlanIssue): ReadOutcome => ({ ok: true, result: { ok: false, issues: [i] } });

/** Reads and parses one plan file (or standard input for `-`). */
export function readPlan(path: string, io: CliIo): ReadOutcome {
  try {
    if (path === STDIN) {
      if (io.readStdin === undefined) return { ok: false, why: 'standard input is not available' };
      const bytes = io.readStdin(MAX_PLAN_TEXT_LENGTH);
      if (bytes.length > MAX_PLAN_TEXT_LENGTH) return refused(tooLargeIssue(bytes.length));
      return { ok: true, result: parsePlanBytes(bytes) };
    }
    if (io.stat !== undefined && io.readBytes !== undefined) {
      const s = io.stat(path);
      if (s.isDirectory) return { ok: false, why: 'is a directory' };
      if (s.size > MAX_PLAN_TEXT_LENGTH) return refused(tooLargeIssue(s.size));
      return { ok: true, result: parsePlanBytes(io.readBytes(path)) };
    }
    return { ok: true, result: parsePlanText(io.readFile(path)) };
  } catch (err) {
    return { ok: false, why: errorCode(err) };
  }
}

/**
 * The plan files named on the command line: a folder stands for its plan files — names
 * ending in `.legwise` (the desktop app's extension) or `.json` — not its subfolders, sorted
 * by name; null and a message when a folder cannot be listed.
 */
/** Names a folder's plan files carry: the desktop app's `.legwise` and plain `.json`. */
export function isPlanFileName(name: string): boolean {
  const lower = name.toLowerCase();
  return lower.endsWith('.legwise') || lower.endsWith('.json');
}

export function expandInputs(
  inputs: readonly string[],
  io: CliIo,
): { files: string[]; folders: number } | { error: string } {
  const files: string[] = [];
  let folders = 0;
  for (const input of inputs) {
    let isDirectory = false;
    if (input !== STDIN && io.stat !== undefined) {
      try {
        isDirectory = io.stat(input).isDirectory;
      } catch {
        isDirectory = false; // reported when the file is read
      }
    }
    if (!isDirectory || io.listDir === undefined) {
      files.push(input);
      continue;
    }
    folders += 1;
    let names: string[];
    try {
      names = io.listDir(input);
    } catch (err) {
      return { error: `cannot list ${input}: ${errorCode(err)}` };
    }
    const sep = input.endsWith('/') ? '' : '/';
    const plans = names.filter(isPlanFileName).sort();
    for (const n of plans) {
      const full = `${input}${sep}${n}`;
      try {
        if (io.stat?.(full).isDirectory) continue;
      } catch {
        // reported when read
      }
      files.push(full);
    }
  }
  return { files, folders };
}
