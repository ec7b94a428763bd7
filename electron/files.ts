/**
 * The shell's file service in plain Node (no Electron): atomic writes with a kept
 * backup, plan files through the core loader, the recent-files list, and the
 * crash-insurance autosave. Every path comes in as an argument, so tests run it
 * against a temporary folder.
 *
 * Atomic write (common practice for crash-safe saves, cf. POSIX rename(2)): write a
 * temporary file in the target's folder, fsync it, then rename it over the target, so
 * a crash leaves either the old file or the new one, never a torn one.
 */
import { existsSync, promises as fsp } from 'node:fs';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import { z } from 'zod';
import type { Plan } from '../core/plan/schema.ts';
import { parsePlan, parsePlanText, serializePlan } from '../core/plan/load.ts';
import { failure, type Failure, type RecoveredPlan } from './contract.ts';

/** Injection point for tests: a rename that fails simulates a crash before the swap. */
export interface WriteOps {
  rename: (from: string, to: string) => Promise<void>;
}

export interface AtomicWriteOptions {
  /** Keep the file being replaced as `<target>.bak`. */
  backup?: boolean;
  ops?: Partial<WriteOps>;
}

export const MAX_PLAN_FILE_BYTES = 10 * 1024 * 1024;
export const MAX_RECENT = 10;

export function backupPathOf(target: string): string {
  return `${target}.bak`;
}

export async function atomicWrite(
  target: string,
  data: string | Uint8Array,
  options: AtomicWriteOptions = {},
): Promise<void> {
  const dir = path.dirname(target);
  const tmp = path.join(
    dir,
    `.${path.basename(target)}.${process.pid}.${randomBytes(6).toString('hex')}.tmp`,
  );
  const rename = options.ops?.rename ?? fsp.rename;
  let handle: fsp.FileHandle | undefined;
  try {
    handle = await fsp.open(tmp, 'wx');
    await handle.writeFile(data);
    await handle.sync();
    await handle.close();
    handle = undefined;
    if (options.backup) await keepBackup(target);
    await rename(tmp, target);
  } catch (error) {
    await handle?.close().catch(() => undefined);
    await fsp.rm(tmp, { force: true }).catch(() => undefined);
    throw error;
  }
  await syncDirectory(dir);
}

/** The backup is itself written atomically, so it is never a torn copy. */
async function keepBackup(target: string): Promise<void> {
  let previous: Buffer;
  try {
    previous = await fsp.readFile(target);
  } catch (error) {
    if (errnoOf(error) === 'ENOENT') return;
    throw error;
  }
  await atomicWrite(backupPathOf(target), previous);
}

/** Makes the rename itself durable where the OS allows opening a folder (not Windows). */
async function syncDirectory(dir: string): Promise<void> {
  let handle: fsp.FileHandle | undefined;
  try {
    handle = await fsp.open(dir, 'r');
    await handle.sync();
  } catch {
    // Best effort only: some platforms and file systems refuse fsync on folders.
  } finally {
    await handle?.close().catch(() => undefined);
  }
}

function errnoOf(error: unknown): string | undefined {
  const code = (error as { code?: unknown } | null)?.code;
  return typeof code === 'string' ? code : undefined;
}

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

export type ReadPlanResult = { ok: true; plan: Plan; warnings: string[] } | Failure;

/** Reads and validates a plan file; a bad file yields the loader's path-named issues. */
export async function readPlanFile(filePath: string): Promise<ReadPlanResult> {
  const name = path.basename(filePath);
  let text: string;
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
    text = await fsp.readFile(filePath, 'utf8');
  } catch (error) {
    return failure('READ_FAILED', `Could not open ${name}: ${describeFsError(error)}.`);
  }
  const loaded = parsePlanText(text);
  if (loaded.ok) return { ok: true, plan: loaded.plan, warnings: loaded.warnings };
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

/** Saves a plan atomically, keeping the replaced version as `<file>.bak`. */
export async function savePlanFile(
  filePath: string,
  plan: Plan,
  ops?: Partial<WriteOps>,
): Promise<void> {
  await atomicWrite(filePath, serializePlan(plan), { backup: true, ...(ops ? { ops } : {}) });
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

// ---- Autosave: `<userData>/autosave/current.legwise.json` (+ where it came from). ----

export function autosavePaths(userDataDir: string): { dir: string; plan: string; meta: string } {
  const dir = path.join(userDataDir, 'autosave');
  return {
    dir,
    plan: path.join(dir, 'current.legwise.json'),
    meta: path.join(dir, 'current.meta.json'),
  };
}

const AutosaveMetaSchema = z.object({ sourcePath: z.string().min(1).max(4096).nullable() });

/** The plan file itself is an ordinary plan file, so a person can also open it by hand. */
export async function writeAutosave(
  userDataDir: string,
  plan: Plan,
  sourcePath: string | null,
): Promise<void> {
  const paths = autosavePaths(userDataDir);
  await fsp.mkdir(paths.dir, { recursive: true });
  await atomicWrite(paths.meta, JSON.stringify({ sourcePath }));
  await atomicWrite(paths.plan, serializePlan(plan));
}

/** The autosaved plan, or null if there is none (or it no longer loads). */
export async function readAutosave(userDataDir: string): Promise<RecoveredPlan | null> {
  const paths = autosavePaths(userDataDir);
  if (!existsSync(paths.plan)) return null;
  const loaded = await readPlanFile(paths.plan);
  if (!loaded.ok) return null;
  let sourcePath: string | null = null;
  try {
    const meta = AutosaveMetaSchema.safeParse(JSON.parse(await fsp.readFile(paths.meta, 'utf8')));
    if (meta.success) sourcePath = meta.data.sourcePath;
  } catch {
    // No or damaged metadata: the plan is still worth offering, as never saved.
  }
  return { plan: loaded.plan, warnings: loaded.warnings, sourcePath };
}

export async function clearAutosave(userDataDir: string): Promise<void> {
  const paths = autosavePaths(userDataDir);
  await fsp.rm(paths.plan, { force: true });
  await fsp.rm(paths.meta, { force: true });
}
