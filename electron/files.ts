/**
 * The shell's file service in plain Node (no Electron): plan files through the core
 * loader with the stamp of what was read (so a save can tell whether another program
 * changed the file since), the recent-files list, the crash-insurance autosave (one
 * file, written atomically) and the shell's own small settings. Writes go through
 * atomicWrite.ts. Every path comes in as an argument, so tests run it against a
 * temporary folder.
 */
import { existsSync, promises as fsp } from 'node:fs';
import path from 'node:path';
import { z } from 'zod';
import type { Plan } from '../core/plan/schema.ts';
import { parsePlan, parsePlanBytes, serializePlan } from '../core/plan/load.ts';
import { failure, type Failure, type RecoveredPlan } from './contract.ts';
import {
  MAX_BACKUP_GENERATIONS,
  atomicWrite,
  errnoOf,
  readWithStamp,
  type FileStamp,
  type WriteOps,
} from './atomicWrite.ts';

export {
  ExternalChangeError,
  atomicWrite,
  backupPathOf,
  type FileStamp,
  type WriteOps,
} from './atomicWrite.ts';

export const MAX_PLAN_FILE_BYTES = 10 * 1024 * 1024;
export const MAX_RECENT = 10;
export const DEFAULT_BACKUP_GENERATIONS = 3;

const ERRNO_WORDS: Record<string, string> = {
  ENOENT: 'the file does not exist',
  EACCES: 'permission denied',
  EPERM: 'permission denied',
  EISDIR: 'it is a folder, not a file',
  ENOSPC: 'the disk is full',
  EROFS: 'the disk is read-only',
};

/** A one-line reason for a file-system error, without a stack. */
export function describeFsError(error: unknown): string {
  const code = errnoOf(error);
  if (code && ERRNO_WORDS[code]) return ERRNO_WORDS[code];
  return error instanceof Error ? error.message : String(error);
}

export type ReadPlanResult =
  { ok: true; plan: Plan; warnings: string[]; changes: string[]; stamp: FileStamp } | Failure;

/**
 * Reads and validates a plan file; a bad file yields the loader's path-named issues.
 * `stamp` (mtime, size, SHA-256 of the bytes read) lets a later save notice another
 * program's edit.
 */
export async function readPlanFile(filePath: string): Promise<ReadPlanResult> {
  const name = path.basename(filePath);
  let bytes: Uint8Array;
  let stamp: FileStamp;
  try {
    const stat = await fsp.stat(filePath);
    if (stat.isDirectory())
      return failure('READ_FAILED', `Could not open ${name}: ${ERRNO_WORDS.EISDIR}.`);
    if (stat.size > MAX_PLAN_FILE_BYTES) {
      return failure(
        'READ_FAILED',
        `Could not open ${name}: it is larger than ${MAX_PLAN_FILE_BYTES} bytes.`,
      );
    }
    const read = await readWithStamp(filePath);
    bytes = read.bytes;
    stamp = read.stamp;
  } catch (error) {
    return failure('READ_FAILED', `Could not open ${name}: ${describeFsError(error)}.`);
  }
  // Strict decoding: UTF-16 or bytes that are not UTF-8 are refused by name, never turned
  // into U+FFFD (core/plan/decode.ts).
  const loaded = parsePlanBytes(bytes);
  if (loaded.ok)
    return {
      ok: true,
      plan: loaded.plan,
      warnings: loaded.warnings,
      changes: loaded.changes,
      stamp,
    };
  const first = loaded.issues[0]?.message ?? 'unknown problem';
  const more = loaded.issues.length > 1 ? ` (and ${loaded.issues.length - 1} more)` : '';
  return failure(
    'INVALID_PLAN',
    `${name} is not a valid Legwise plan: ${first}${more}`,
    loaded.issues,
  );
}

/**
 * The loader's verdict on a plan about to be written: a file we write must open again,
 * so the cross-field rules apply on the way out too. Null when the plan is fine.
 */
export function refuseUnloadablePlan(plan: Plan): Failure | null {
  const loaded = parsePlan(plan);
  if (loaded.ok) return null;
  const first = loaded.issues[0]?.message ?? 'unknown problem';
  return failure('INVALID_PLAN', `The plan cannot be saved yet: ${first}`, loaded.issues);
}

export interface SavePlanOptions {
  ops?: Partial<WriteOps>;
  /** Backups to keep (default DEFAULT_BACKUP_GENERATIONS). */
  generations?: number;
  /** The stamp of the file as opened: the save is refused if the file no longer matches. */
  expect?: FileStamp | null;
}

/**
 * Saves a plan atomically with rotating backups (`<file>.bak` newest). Returns the stamp
 * of what was written, the base for the next save's check. Throws ExternalChangeError
 * when `expect` is given and the file on disk differs.
 */
export async function savePlanFile(
  filePath: string,
  plan: Plan,
  options: SavePlanOptions | Partial<WriteOps> = {},
): Promise<FileStamp> {
  const o: SavePlanOptions =
    'rename' in options || 'beforeSwap' in options
      ? { ops: options as Partial<WriteOps> }
      : (options as SavePlanOptions);
  const text = serializePlan(plan);
  await atomicWrite(filePath, text, {
    generations: o.generations ?? DEFAULT_BACKUP_GENERATIONS,
    ...(o.expect !== undefined ? { expect: o.expect } : {}),
    ...(o.ops ? { ops: o.ops } : {}),
  });
  return (await readWithStamp(filePath)).stamp;
}

/** A file name from a free-text title: no folders, no characters Windows refuses. */
export function safeFileName(title: string, extension: string): string {
  const cleaned = title
    // eslint-disable-next-line no-control-regex
    .replace(/[\\/:*?"<>|\u0000-\u001f]/g, '-')
    .trim()
    .replace(/[. ]+$/, '')
    .slice(0, 100);
  return `${cleaned || 'plan'}${extension}`;
}

// ---- Recent files: a JSON list of absolute paths in the app-data folder. ----

const RecentStoreSchema = z.array(z.string().min(1).max(4096));

/** Pure: put `filePath` first, without duplicates, at most `max` entries. */
export function withRecent(list: readonly string[], filePath: string, max = MAX_RECENT): string[] {
  const resolved = path.resolve(filePath);
  return [resolved, ...list.filter((p) => path.resolve(p) !== resolved)].slice(0, max);
}

/** The stored list, dropping files that no longer exist; a damaged store reads as empty. */
export async function readRecent(
  storePath: string,
  exists: (p: string) => boolean = existsSync,
): Promise<string[]> {
  let raw: unknown;
  try {
    raw = JSON.parse(await fsp.readFile(storePath, 'utf8'));
  } catch {
    return [];
  }
  const parsed = RecentStoreSchema.safeParse(raw);
  return parsed.success ? parsed.data.filter((p) => exists(p)).slice(0, MAX_RECENT) : [];
}

/** Whether `filePath` is in the stored list (existing or not): openRecent accepts only these. */
export async function isRecent(storePath: string, filePath: string): Promise<boolean> {
  const resolved = path.resolve(filePath);
  return (await readRecent(storePath, () => true)).some((p) => path.resolve(p) === resolved);
}

async function writeRecent(storePath: string, list: string[]): Promise<void> {
  await fsp.mkdir(path.dirname(storePath), { recursive: true });
  await atomicWrite(storePath, `${JSON.stringify(list, null, 2)}\n`);
}

export async function addRecent(storePath: string, filePath: string): Promise<string[]> {
  const list = withRecent(await readRecent(storePath), filePath);
  await writeRecent(storePath, list);
  return list;
}

export async function removeRecent(storePath: string, filePath: string): Promise<string[]> {
  const resolved = path.resolve(filePath);
  const list = (await readRecent(storePath)).filter((p) => path.resolve(p) !== resolved);
  await writeRecent(storePath, list);
  return list;
}

// ---- Autosave: ONE file, `<userData>/autosave/current.autosave.json`. ----
// The plan and where it came from travel together in one atomic write, so a crash can
// never leave a plan paired with another plan's origin.

export const AUTOSAVE_FORMAT = 'legwise-autosave';

export function autosavePaths(userDataDir: string): { dir: string; file: string } {
  const dir = path.join(userDataDir, 'autosave');
  return { dir, file: path.join(dir, 'current.autosave.json') };
}

/** The two files earlier versions wrote; removed when the autosave is cleared. */
function legacyAutosaveFiles(dir: string): string[] {
  return [path.join(dir, 'current.legwise.json'), path.join(dir, 'current.meta.json')];
}

const AutosaveSchema = z.object({
  format: z.literal(AUTOSAVE_FORMAT),
  sourcePath: z.string().min(1).max(4096).nullable(),
  plan: z.unknown(),
});

export function autosaveText(plan: Plan, sourcePath: string | null): string {
  const wrapped = { format: AUTOSAVE_FORMAT, sourcePath, plan: JSON.parse(serializePlan(plan)) };
  return `${JSON.stringify(wrapped, null, 2)}\n`;
}

export async function writeAutosave(
  userDataDir: string,
  plan: Plan,
  sourcePath: string | null,
): Promise<void> {
  const paths = autosavePaths(userDataDir);
  await fsp.mkdir(paths.dir, { recursive: true });
  await atomicWrite(paths.file, autosaveText(plan, sourcePath));
}

/** The autosaved plan, or null if there is none (or it no longer loads). */
export async function readAutosave(userDataDir: string): Promise<RecoveredPlan | null> {
  const paths = autosavePaths(userDataDir);
  let raw: unknown;
  try {
    const stat = await fsp.stat(paths.file);
    if (stat.size > MAX_PLAN_FILE_BYTES) return null;
    raw = JSON.parse(await fsp.readFile(paths.file, 'utf8'));
  } catch {
    return null;
  }
  const wrapped = AutosaveSchema.safeParse(raw);
  if (!wrapped.success) return null;
  const loaded = parsePlan(wrapped.data.plan);
  if (!loaded.ok) return null;
  return { plan: loaded.plan, warnings: loaded.warnings, sourcePath: wrapped.data.sourcePath };
}

export async function clearAutosave(userDataDir: string): Promise<void> {
  const paths = autosavePaths(userDataDir);
  for (const file of [paths.file, ...legacyAutosaveFiles(paths.dir)])
    await fsp.rm(file, { force: true });
}

// ---- The shell's own settings: `<userData>/shell-settings.json`. ----

export const ShellSettingsSchema = z.object({
  /** How many earlier versions of a plan are kept beside it (`.bak`, `.bak2` …). */
  backupGenerations: z
    .number()
    .int()
    .min(0)
    .max(MAX_BACKUP_GENERATIONS)
    .default(DEFAULT_BACKUP_GENERATIONS),
});
export type ShellSettings = z.infer<typeof ShellSettingsSchema>;

export function shellSettingsPath(userDataDir: string): string {
  return path.join(userDataDir, 'shell-settings.json');
}

/** The stored settings; a missing or damaged file reads as the defaults. */
export async function readShellSettings(userDataDir: string): Promise<ShellSettings> {
  try {
    const raw: unknown = JSON.parse(await fsp.readFile(shellSettingsPath(userDataDir), 'utf8'));
    const parsed = ShellSettingsSchema.safeParse(raw);
    if (parsed.success) return parsed.data;
  } catch {
    // fall through to the defaults
  }
  return ShellSettingsSchema.parse({});
}

export async function writeShellSettings(
  userDataDir: string,
  settings: ShellSettings,
): Promise<void> {
  const valid = ShellSettingsSchema.parse(settings);
  await fsp.mkdir(userDataDir, { recursive: true });
  await atomicWrite(shellSettingsPath(userDataDir), `${JSON.stringify(valid, null, 2)}\n`);
}
