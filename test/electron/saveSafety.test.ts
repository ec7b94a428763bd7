/**
 * Saves that never lose another program's work, in plain Node: the changed-on-disk
 * question (with a real second process as "another program"), rotating backups, kept
 * permission bits, writing through symlinks, names within the 255-byte limit
 * (POSIX NAME_MAX, ext4), orphan temporary files, and the single-file autosave under
 * SIGKILL.
 */
import { execFileSync, spawn } from 'node:child_process';
import { promises as fsp } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { newPlan } from '../../core/plan/defaults.ts';
import { parsePlanText, serializePlan } from '../../core/plan/load.ts';
import type { Plan } from '../../core/plan/schema.ts';
import {
  NAME_MAX_BYTES,
  TEMP_NAME,
  atomicWrite,
  backupPathOf,
  fitName,
  removeStaleTemps,
} from '../../electron/atomicWrite.ts';
import {
  createDocument,
  recentStorePath,
  type ChangedOnDiskChoice,
  type ShellPorts,
} from '../../electron/document.ts';
import {
  autosavePaths,
  readAutosave,
  savePlanFile,
  writeShellSettings,
} from '../../electron/files.ts';

const here = path.dirname(fileURLToPath(import.meta.url));
const root = path.resolve(here, '..', '..');

let dir: string;
beforeEach(async () => {
  dir = await fsp.mkdtemp(path.join(os.tmpdir(), 'legwise-safe-'));
});
afterEach(async () => {
  await fsp.rm(dir, { recursive: true, force: true });
});

const planNamed = (name: string): Plan => ({ ...newPlan(), name });
const nameIn = async (file: string) => {
  const loaded = parsePlanText(await fsp.readFile(file, 'utf8'));
  return loaded.ok ? loaded.plan.name : `unloadable: ${loaded.issues[0]?.message}`;
};

function ports(answer: ChangedOnDiskChoice, overrides: Partial<ShellPorts> = {}) {
  return {
    userDataDir: path.join(dir, 'userData'),
    chooseOpenPath: vi.fn(async (): Promise<string | null> => null),
    chooseSavePath: vi.fn(async (): Promise<string | null> => null),
    confirmDiscard: vi.fn(async () => true),
    askSaveBeforeClose: vi.fn(async () => 'cancel' as const),
    askChangedOnDisk: vi.fn(async (): Promise<ChangedOnDiskChoice> => answer),
    printPdf: vi.fn(async () => new Uint8Array()),
    print: vi.fn(async () => undefined),
    showTitle: vi.fn(),
    recentChanged: vi.fn(),
    sendMenuCommand: vi.fn(),
    closeWindow: vi.fn(),
    ...overrides,
  };
}

/** Another program (a separate Node process) edits the file in place. */
function editElsewhere(file: string, name: string): void {
  execFileSync(process.execPath, [path.join(here, 'helpers', 'externalEdit.mjs'), file, name]);
}

/** Opens `file` in a new document whose changed-on-disk answer is `answer`. */
async function openedDocument(file: string, answer: ChangedOnDiskChoice, extra = {}) {
  const p = ports(answer, { chooseOpenPath: vi.fn(async () => file), ...extra });
  const doc = createDocument(p);
  const opened = await doc.handlers.openPlan();
  expect(opened.ok).toBe(true);
  await doc.handlers.setDirty({ dirty: true, name: 'Mine' });
  return { doc, p };
}

describe('a file changed by another program since it was opened', () => {
  let file: string;
  beforeEach(async () => {
    file = path.join(dir, 'shared.legwise');
    await savePlanFile(file, planNamed('Original'));
  });

  it('asks, and Cancel writes nothing and keeps the edit unsaved', async () => {
    const { doc, p } = await openedDocument(file, 'cancel');
    editElsewhere(file, 'Theirs');
    const result = await doc.handlers.savePlan(planNamed('Mine'));
    expect(result).toMatchObject({ ok: false, code: 'CANCELLED' });
    expect(p.askChangedOnDisk).toHaveBeenCalledWith('shared.legwise');
    expect(await nameIn(file)).toBe('Theirs');
    expect(doc.state.dirty).toBe(true);
  });

  it('Overwrite saves ours and keeps theirs as the newest backup', async () => {
    const { doc } = await openedDocument(file, 'overwrite');
    editElsewhere(file, 'Theirs');
    expect(await doc.handlers.savePlan(planNamed('Mine'))).toEqual({ ok: true, filePath: file });
    expect(await nameIn(file)).toBe('Mine');
    expect(await nameIn(backupPathOf(file))).toBe('Theirs');
  });

  it('Save As leaves their file untouched and puts ours in the new file', async () => {
    const other = path.join(dir, 'mine.legwise');
    const { doc, p } = await openedDocument(file, 'saveAs', {
      chooseSavePath: vi.fn(async () => other),
    });
    editElsewhere(file, 'Theirs');
    expect(await doc.handlers.savePlan(planNamed('Mine'))).toEqual({ ok: true, filePath: other });
    expect(p.chooseSavePath).toHaveBeenCalledTimes(1);
    expect(await nameIn(file)).toBe('Theirs');
    expect(await nameIn(other)).toBe('Mine');
    expect(doc.state.filePath).toBe(other);
  });

  it('Reload hands their version to the page and writes nothing', async () => {
    const { doc } = await openedDocument(file, 'reload');
    editElsewhere(file, 'Theirs');
    const result = await doc.handlers.savePlan(planNamed('Mine'));
    expect(result.ok && result.reloaded?.plan.name).toBe('Theirs');
    expect(await nameIn(file)).toBe('Theirs');
    expect(doc.state.dirty).toBe(false);
    // The reloaded file is the new base: the next save goes through without asking.
    expect(await doc.handlers.savePlan(planNamed('Next'))).toEqual({ ok: true, filePath: file });
    expect(await nameIn(file)).toBe('Next');
  });

  it('an unchanged file, or one only touched, saves without asking', async () => {
    const { doc, p } = await openedDocument(file, 'cancel');
    const later = new Date(Date.now() + 60_000);
    await fsp.utimes(file, later, later); // mtime moves, content (hash) does not
    expect(await doc.handlers.savePlan(planNamed('Mine'))).toEqual({ ok: true, filePath: file });
    expect(await doc.handlers.savePlan(planNamed('Mine again'))).toEqual({
      ok: true,
      filePath: file,
    });
    expect(p.askChangedOnDisk).not.toHaveBeenCalled();
  });

  it('a change made while the save is writing its temporary file is caught too', async () => {
    // Race: the other program writes after our temporary file is durable, before the swap.
    const { doc, p } = await openedDocument(file, 'cancel', {
      writeOps: { beforeSwap: async () => editElsewhere(file, 'Racing') },
    });
    const result = await doc.handlers.savePlan(planNamed('Mine'));
    expect(result).toMatchObject({ ok: false, code: 'CANCELLED' });
    expect(p.askChangedOnDisk).toHaveBeenCalledTimes(1);
    expect(await nameIn(file)).toBe('Racing');
    expect((await fsp.readdir(dir)).filter((n) => TEMP_NAME.test(n))).toEqual([]);
  });
});

describe('backups', () => {
  it('rotate: the newest is .bak, older ones .bak2 …, at most the set number', async () => {
    const userData = path.join(dir, 'userData');
    await writeShellSettings(userData, { backupGenerations: 3 });
    const file = path.join(dir, 'plan.legwise');
    const save = vi.fn(async () => file);
    const doc = createDocument(ports('cancel', { chooseSavePath: save }));
    for (const n of [1, 2, 3, 4, 5]) await doc.handlers.savePlan(planNamed(`Version ${n}`));
    expect(await nameIn(file)).toBe('Version 5');
    expect(await nameIn(backupPathOf(file, 1))).toBe('Version 4');
    expect(await nameIn(backupPathOf(file, 2))).toBe('Version 3');
    expect(await nameIn(backupPathOf(file, 3))).toBe('Version 2');
    expect((await fsp.readdir(dir)).sort()).toEqual([
      'plan.legwise',
      'plan.legwise.bak',
      'plan.legwise.bak2',
      'plan.legwise.bak3',
      'userData',
    ]);
  });

  it('the setting 0 keeps no backup; a damaged settings file means the default', async () => {
    const userData = path.join(dir, 'userData');
    await writeShellSettings(userData, { backupGenerations: 0 });
    const file = path.join(dir, 'p.legwise');
    const doc = createDocument(ports('cancel', { chooseSavePath: vi.fn(async () => file) }));
    await doc.handlers.savePlan(planNamed('A'));
    await doc.handlers.savePlan(planNamed('B'));
    expect(await fsp.readdir(dir)).toEqual(['p.legwise', 'userData']);
    await expect(writeShellSettings(userData, { backupGenerations: 99 })).rejects.toThrow();
  });
});

describe('what a save keeps of the file it replaces', () => {
  it('keeps the permission bits (600 stays 600, and so does its backup)', async () => {
    const file = path.join(dir, 'private.legwise');
    await savePlanFile(file, planNamed('One'));
    await fsp.chmod(file, 0o600);
    await savePlanFile(file, planNamed('Two'));
    // POSIX permission bits: 0o600 = owner read/write only.
    expect((await fsp.stat(file)).mode & 0o777).toBe(0o600);
    expect((await fsp.stat(backupPathOf(file))).mode & 0o777).toBe(0o600);
    await fsp.chmod(file, 0o640);
    await savePlanFile(file, planNamed('Three'));
    expect((await fsp.stat(file)).mode & 0o777).toBe(0o640);
  });

  it('writes through a symlink to its target; the link stays a link', async () => {
    const realDir = path.join(dir, 'store');
    await fsp.mkdir(realDir);
    const real = path.join(realDir, 'real.legwise');
    const link = path.join(dir, 'link.legwise');
    await savePlanFile(real, planNamed('Before'));
    await fsp.symlink(path.relative(dir, real), link);
    await savePlanFile(link, planNamed('After'));
    expect((await fsp.lstat(link)).isSymbolicLink()).toBe(true);
    expect(await nameIn(real)).toBe('After');
    expect(await nameIn(backupPathOf(real))).toBe('Before');
    expect(await fsp.readdir(dir)).toEqual(['link.legwise', 'store']);
  });

  it('follows a chain of links, and a dangling link creates its target', async () => {
    const real = path.join(dir, 'target.legwise');
    await fsp.symlink('target.legwise', path.join(dir, 'hop1'));
    await fsp.symlink('hop1', path.join(dir, 'hop2'));
    await atomicWrite(path.join(dir, 'hop2'), 'through two links');
    expect(await fsp.readFile(real, 'utf8')).toBe('through two links');
    expect((await fsp.lstat(path.join(dir, 'hop2'))).isSymbolicLink()).toBe(true);
  });
});

describe('long plan names', () => {
  // 255 bytes per name: POSIX NAME_MAX as ext4, XFS and APFS define it.
  const longAscii = `${'Survey of the northern coast '.repeat(8).slice(0, 240)}.legwise`;
  const longUtf8 = `${'Überflug Nordküste – '.repeat(12).slice(0, 120)}.legwise`;

  for (const [label, name] of [
    ['ASCII', longAscii],
    ['multi-byte UTF-8', longUtf8],
  ] as const) {
    it(`temporary and backup names stay within 255 bytes (${label})`, async () => {
      expect(Buffer.byteLength(name)).toBeLessThanOrEqual(NAME_MAX_BYTES);
      const file = path.join(dir, name);
      const seen: string[] = [];
      const ops = { beforeSwap: async () => void seen.push(...(await fsp.readdir(dir))) };
      for (const n of [1, 2, 3, 4]) await savePlanFile(file, planNamed(`V${n}`), { ops });
      const names = [...new Set([...seen, ...(await fsp.readdir(dir))])];
      expect(names.some((n) => TEMP_NAME.test(n))).toBe(true); // the temp was seen
      for (const n of names) expect(Buffer.byteLength(n)).toBeLessThanOrEqual(NAME_MAX_BYTES);
      expect(await nameIn(backupPathOf(file, 3))).toBe('V1');
      // Every name decodes as whole characters (no multi-byte sequence cut in half).
      for (const n of names) expect(Buffer.from(n).toString('utf8')).toBe(n);
    });
  }

  it('distinct long names keep distinct backup names', () => {
    const a = `${'x'.repeat(260)}a`;
    const b = `${'x'.repeat(260)}b`;
    expect(fitName(a, '.bak')).not.toBe(fitName(b, '.bak'));
    expect(Buffer.byteLength(fitName(a, '.bak2'))).toBeLessThanOrEqual(NAME_MAX_BYTES);
  });
});

describe('orphan temporary files', () => {
  async function deadPid(): Promise<number> {
    const child = spawn(process.execPath, ['-e', '']);
    await new Promise((resolve) => child.once('exit', resolve));
    if (child.pid === undefined) throw new Error('no pid');
    return child.pid;
  }

  it('on start, ours from dead writers go; a live writer’s and foreign files stay', async () => {
    const dead = await deadPid();
    const userData = path.join(dir, 'userData');
    const plans = path.join(dir, 'plans');
    await fsp.mkdir(path.join(userData, 'autosave'), { recursive: true });
    await fsp.mkdir(plans);
    const orphan = path.join(plans, `.lw-${dead}-0a1b2c3d.tmp`);
    const legacy = path.join(
      userData,
      'autosave',
      `.current.legwise.json.${dead}.0a1b2c3d4e5f.tmp`,
    );
    const live = path.join(plans, `.lw-${process.ppid}-0a1b2c3d.tmp`);
    const foreign = path.join(plans, 'notes.tmp');
    for (const f of [orphan, legacy, live, foreign]) await fsp.writeFile(f, 'x');
    const plan = path.join(plans, 'a.legwise');
    await savePlanFile(plan, planNamed('A'));
    await fsp.writeFile(recentStorePath(userData), JSON.stringify([plan]));

    const removed = await createDocument(ports('cancel')).removeOrphanTemps();
    expect(removed.sort()).toEqual([legacy, orphan].sort());
    expect((await fsp.readdir(plans)).sort()).toEqual(
      ['a.legwise', path.basename(live), 'notes.tmp'].sort(),
    );
  });

  it('a writer that is told the pid is alive leaves its temp alone', async () => {
    const f = path.join(dir, `.lw-12345-0a1b2c3d.tmp`);
    await fsp.writeFile(f, 'x');
    expect(await removeStaleTemps([dir], () => true)).toEqual([]);
    expect(await removeStaleTemps([dir], () => false)).toEqual([f]);
  });
});

describe('autosave under SIGKILL', () => {
  it('is one file: every kill leaves a plan matched with its own origin', async () => {
    const userData = path.join(dir, 'userData');
    const kills = 12;
    let checked = 0;
    for (let k = 0; k < kills; k++) {
      // One process (node with tsx's loader), so SIGKILL stops the writer itself.
      const script = path.join(here, 'helpers', 'autosaveLoop.ts');
      const child = spawn(process.execPath, ['--import', 'tsx', script, userData], {
        cwd: root,
        stdio: ['ignore', 'pipe', 'inherit'],
      });
      await new Promise<void>((resolve, reject) => {
        child.stdout.once('data', () => resolve());
        child.once('exit', (code) => reject(new Error(`writer exited early (${code})`)));
      });
      // Let it write for a varying while, then kill it without warning.
      await new Promise((resolve) => setTimeout(resolve, 20 + ((k * 37) % 120)));
      const exited = new Promise((resolve) => child.once('exit', resolve));
      child.kill('SIGKILL');
      await exited;
      const recovered = await readAutosave(userData);
      if (recovered === null) continue; // killed before the first write finished
      checked++;
      const round = /^Round (\d+)$/.exec(recovered.plan.name)?.[1];
      expect(round).toBeDefined();
      expect(recovered.sourcePath).toBe(`/plans/round-${round}.legwise`);
      const json = JSON.parse(await fsp.readFile(autosavePaths(userData).file, 'utf8'));
      expect(serializePlan(recovered.plan)).toBe(`${JSON.stringify(json.plan, null, 2)}\n`);
    }
    // Most kills land mid-stream (the writer is ready before the wait starts).
    expect(checked).toBeGreaterThanOrEqual(kills / 2);
    const names = await fsp.readdir(autosavePaths(userData).dir);
    expect(names.filter((n) => !TEMP_NAME.test(n))).toEqual(['current.autosave.json']);
  }, 60_000);
});
