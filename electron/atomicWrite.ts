/**
 * Crash-safe, collision-aware file writes in plain Node (no Electron).
 *
 * Atomic write (common practice for crash-safe saves, cf. POSIX rename(2)): write a
 * temporary file in the target's folder, fsync it, then rename it over the target, so a
 * crash leaves either the old file or the new one, never a torn one. On top of that:
 * - a symlink is written through: the file it points to is replaced, the link stays;
 * - the replaced file's permission bits are kept (a 600 file stays 600, backups too);
 * - temporary names are short (`.lw-<pid>-<hex>.tmp`), so a long plan name cannot push
 *   them past the 255-byte limit most file systems put on one name (POSIX NAME_MAX);
 * - backup names stay within 255 bytes too (long stems are cut and tagged with a hash);
 * - `generations` backups rotate: `<file>.bak` is the newest, then `.bak2`, `.bak3` …;
 * - `expect` refuses the swap if the file on disk is no longer the one that was opened.
 */
import { promises as fsp } from 'node:fs';
import path from 'node:path';
import { createHash, randomBytes } from 'node:crypto';

/** Injection point for tests: a rename that fails simulates a crash before the swap. */
export interface WriteOps {
  rename: (from: string, to: string) => Promise<void>;
  /** Called after the temporary file is durable, just before the on-disk check and swap. */
  beforeSwap?: () => Promise<void>;
}

/** What a file looked like when it was read: compared before it is replaced. */
export interface FileStamp {
  mtimeMs: number;
  size: number;
  sha256: string;
}

export interface AtomicWriteOptions {
  /** Backups of the replaced file to keep (0: none). `backup: true` means 1. */
  generations?: number;
  backup?: boolean;
  /** If set, the swap happens only while the file on disk still has this content. */
  expect?: FileStamp | null;
  ops?: Partial<WriteOps>;
}

/** The file changed on disk since it was opened (another program wrote it). */
export class ExternalChangeError extends Error {
  constructor(
    readonly filePath: string,
    readonly found: FileStamp | null,
  ) {
    super(`${path.basename(filePath)} was changed by another program since it was opened`);
    this.name = 'ExternalChangeError';
  }
}

/** Most file systems allow at most 255 bytes in one name (POSIX NAME_MAX, ext4, NTFS). */
export const NAME_MAX_BYTES = 255;
export const MAX_BACKUP_GENERATIONS = 20;
const MAX_SYMLINK_HOPS = 40; // Linux's own limit (MAXSYMLINKS, path_resolution(7))

export function sha256Of(data: string | Uint8Array): string {
  return createHash('sha256').update(data).digest('hex');
}

export function stampOf(bytes: Uint8Array, mtimeMs: number): FileStamp {
  return { mtimeMs, size: bytes.byteLength, sha256: sha256Of(bytes) };
}

/** Reads a file and its stamp from one open handle (the stamp describes those bytes). */
export async function readWithStamp(
  filePath: string,
): Promise<{ bytes: Buffer; stamp: FileStamp }> {
  const handle = await fsp.open(filePath, 'r');
  try {
    const stat = await handle.stat();
    const bytes = await handle.readFile();
    return { bytes, stamp: stampOf(bytes, stat.mtimeMs) };
  } finally {
    await handle.close();
  }
}

/** The stamp of what is on disk now, or null when there is no file. */
export async function currentStamp(filePath: string): Promise<FileStamp | null> {
  try {
    return (await readWithStamp(filePath)).stamp;
  } catch (error) {
    if (errnoOf(error) === 'ENOENT') return null;
    throw error;
  }
}

/** Same content (the hash decides; a touched but unchanged file is not a conflict). */
export function sameContent(a: FileStamp | null, b: FileStamp | null): boolean {
  if (a === null || b === null) return a === b;
  return a.size === b.size && a.sha256 === b.sha256;
}

/** Follows symlinks to the file that is really written; a dangling link names its target. */
export async function resolveWriteTarget(target: string): Promise<string> {
  let current = path.resolve(target);
  for (let hop = 0; hop < MAX_SYMLINK_HOPS; hop++) {
    let isLink: boolean;
    try {
      isLink = (await fsp.lstat(current)).isSymbolicLink();
    } catch (error) {
      if (errnoOf(error) === 'ENOENT') return current;
      throw error;
    }
    if (!isLink) return current;
    current = path.resolve(path.dirname(current), await fsp.readlink(current));
  }
  throw Object.assign(new Error(`too many symbolic links at ${target}`), { code: 'ELOOP' });
}

/** Cuts `stem` (on a character boundary) so `stem + suffix` fits in `maxBytes`. */
export function fitName(stem: string, suffix: string, maxBytes = NAME_MAX_BYTES): string {
  if (Buffer.byteLength(stem + suffix) <= maxBytes) return stem + suffix;
  const tag = `~${sha256Of(stem).slice(0, 8)}`;
  const room = maxBytes - Buffer.byteLength(tag + suffix);
  let cut = '';
  for (const char of stem) {
    if (Buffer.byteLength(cut + char) > room) break;
    cut += char;
  }
  return cut + tag + suffix;
}

/** Generation 1 is `<file>.bak`, then `<file>.bak2` …, each name within 255 bytes. */
export function backupPathOf(target: string, generation = 1): string {
  const suffix = generation === 1 ? '.bak' : `.bak${generation}`;
  return path.join(path.dirname(target), fitName(path.basename(target), suffix));
}

/** Our temporary names: short, and carrying the writer's pid so orphans can be told apart. */
export const TEMP_NAME = /^\.lw-(\d+)-[0-9a-f]{8}\.tmp$/;
/** Names earlier versions used (`.<file>.<pid>.<12 hex>.tmp`); orphans of those go too. */
const LEGACY_TEMP_NAME = /^\..+\.(\d+)\.[0-9a-f]{12}\.tmp$/;

function tempPathIn(dir: string): string {
  return path.join(dir, `.lw-${process.pid}-${randomBytes(4).toString('hex')}.tmp`);
}

function checkGenerations(generations: number): void {
  if (!Number.isInteger(generations) || generations < 0 || generations > MAX_BACKUP_GENERATIONS)
    throw new RangeError(
      `backup generations must be a whole number from 0 to ${MAX_BACKUP_GENERATIONS}`,
    );
}

export async function atomicWrite(
  target: string,
  data: string | Uint8Array,
  options: AtomicWriteOptions = {},
): Promise<void> {
  const generations = options.generations ?? (options.backup ? 1 : 0);
  checkGenerations(generations);
  const real = await resolveWriteTarget(target);
  const dir = path.dirname(real);
  const mode = await modeOf(real);
  const tmp = tempPathIn(dir);
  const rename = options.ops?.rename ?? fsp.rename;
  let handle: fsp.FileHandle | undefined;
  try {
    handle = await fsp.open(tmp, 'wx', mode ?? 0o666);
    // open() applies the umask; the replaced file's own bits are restored exactly.
    if (mode !== undefined) await handle.chmod(mode);
    await handle.writeFile(data);
    await handle.sync();
    await handle.close();
    handle = undefined;
    await options.ops?.beforeSwap?.();
    if (options.expect !== undefined) {
      const found = await currentStamp(real);
      if (!sameContent(found, options.expect)) throw new ExternalChangeError(target, found);
    }
    if (generations > 0) await rotateBackups(real, generations);
    await rename(tmp, real);
  } catch (error) {
    await handle?.close().catch(() => undefined);
    await fsp.rm(tmp, { force: true }).catch(() => undefined);
    throw error;
  }
  await syncDirectory(dir);
}

async function modeOf(file: string): Promise<number | undefined> {
  try {
    return (await fsp.stat(file)).mode & 0o7777;
  } catch (error) {
    if (errnoOf(error) === 'ENOENT') return undefined;
    throw error;
  }
}

/**
 * Shifts `.bak` → `.bak2` → … (the oldest beyond `generations` drops out), then copies
 * the file about to be replaced to `.bak`, itself atomically and with the file's mode.
 */
async function rotateBackups(real: string, generations: number): Promise<void> {
  let previous: Buffer;
  try {
    previous = await fsp.readFile(real);
  } catch (error) {
    if (errnoOf(error) === 'ENOENT') return;
    throw error;
  }
  for (let g = generations - 1; g >= 1; g--) {
    try {
      await fsp.rename(backupPathOf(real, g), backupPathOf(real, g + 1));
    } catch (error) {
      if (errnoOf(error) !== 'ENOENT') throw error;
    }
  }
  await atomicWrite(backupPathOf(real, 1), previous, { generations: 0 });
  const mode = await modeOf(real);
  if (mode !== undefined) await fsp.chmod(backupPathOf(real, 1), mode);
}

function processAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return errnoOf(error) === 'EPERM'; // exists, owned by someone else
  }
}

/**
 * Removes temporary files of ours left by a writer that died (its pid is gone) from the
 * given folders. Returns the removed paths. Unreadable folders are skipped.
 */
export async function removeStaleTemps(
  dirs: readonly string[],
  alive: (pid: number) => boolean = processAlive,
): Promise<string[]> {
  const removed: string[] = [];
  for (const dir of new Set(dirs.map((d) => path.resolve(d)))) {
    let names: string[];
    try {
      names = await fsp.readdir(dir);
    } catch {
      continue;
    }
    for (const name of names) {
      const pid = Number((TEMP_NAME.exec(name) ?? LEGACY_TEMP_NAME.exec(name))?.[1]);
      if (!Number.isInteger(pid) || pid === process.pid || alive(pid)) continue;
      const file = path.join(dir, name);
      try {
        if (!(await fsp.lstat(file)).isFile()) continue;
        await fsp.rm(file);
        removed.push(file);
      } catch {
        // Gone already or not ours to remove: leave it.
      }
    }
  }
  return removed;
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

export function errnoOf(error: unknown): string | undefined {
  const code = (error as { code?: unknown } | null)?.code;
  return typeof code === 'string' ? code : undefined;
}
