import { promises as fsp } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { newPlan } from '../../core/plan/defaults.ts';
import { parsePlanText, serializePlan } from '../../core/plan/load.ts';
import {
  MAX_RECENT,
  addRecent,
  atomicWrite,
  autosavePaths,
  backupPathOf,
  clearAutosave,
  readAutosave,
  readPlanFile,
  readRecent,
  removeRecent,
  safeFileName,
  savePlanFile,
  withRecent,
  writeAutosave,
} from '../../electron/files.ts';

let dir: string;
beforeEach(async () => {
  dir = await fsp.mkdtemp(path.join(os.tmpdir(), 'legwise-files-'));
});
afterEach(async () => {
  await fsp.rm(dir, { recursive: true, force: true });
});

const crashBeforeRename = {
  rename: async () => Promise.reject(new Error('simulated crash before rename')),
};

describe('savePlanFile', () => {
  it('writes no float noise (15 significant digits, IEEE 754 binary64 DBL_DIG)', async () => {
    const target = path.join(dir, 'noise.legwise.json');
    const plan = newPlan();
    plan.environment.isaOffset_K = 0.95 + 1e-16; // 0.9500000000000001 in memory
    await savePlanFile(target, plan);
    const text = await fsp.readFile(target, 'utf8');
    expect(text).toContain('"isaOffset_K": 0.95,');
    expect(text).not.toMatch(/\d\.\d{16,}/);
  });
});

describe('atomicWrite', () => {
  it('replaces the file and leaves no temporary file behind', async () => {
    const target = path.join(dir, 'a.txt');
    await atomicWrite(target, 'one');
    await atomicWrite(target, 'two');
    expect(await fsp.readFile(target, 'utf8')).toBe('two');
    expect(await fsp.readdir(dir)).toEqual(['a.txt']);
  });

  it('keeps the old plan intact and loadable when the process dies before the rename', async () => {
    const target = path.join(dir, 'mission.legwise.json');
    const original = { ...newPlan(), name: 'Original' };
    await savePlanFile(target, original);
    const before = await fsp.readFile(target, 'utf8');

    const edited = { ...original, name: 'Edited' };
    await expect(savePlanFile(target, edited, crashBeforeRename)).rejects.toThrow(
      'simulated crash',
    );

    expect(await fsp.readFile(target, 'utf8')).toBe(before);
    const reopened = await readPlanFile(target);
    expect(reopened.ok && reopened.plan.name).toBe('Original');
    // No partial file anywhere: only the target and its backup remain.
    expect((await fsp.readdir(dir)).sort()).toEqual([
      'mission.legwise.json',
      'mission.legwise.json.bak',
    ]);
  });

  it('a crash of a first save leaves no file at the target', async () => {
    const target = path.join(dir, 'new.legwise.json');
    await expect(savePlanFile(target, newPlan(), crashBeforeRename)).rejects.toThrow();
    expect(await fsp.readdir(dir)).toEqual([]);
  });

  it('keeps the previous version as <file>.bak', async () => {
    const target = path.join(dir, 'mission.legwise.json');
    await savePlanFile(target, { ...newPlan(), name: 'First' });
    await savePlanFile(target, { ...newPlan(), name: 'Second' });
    const backup = parsePlanText(await fsp.readFile(backupPathOf(target), 'utf8'));
    const current = parsePlanText(await fsp.readFile(target, 'utf8'));
    expect(backup.ok && backup.plan.name).toBe('First');
    expect(current.ok && current.plan.name).toBe('Second');
  });

  it('writes bytes unchanged (PDF export)', async () => {
    const target = path.join(dir, 'report.pdf');
    const bytes = new Uint8Array([0x25, 0x50, 0x44, 0x46, 0x00, 0xff]);
    await atomicWrite(target, bytes);
    expect(new Uint8Array(await fsp.readFile(target))).toEqual(bytes);
  });
});

describe('readPlanFile', () => {
  it('round-trips a saved plan losslessly', async () => {
    const target = path.join(dir, 'p.legwise.json');
    const plan = newPlan();
    await savePlanFile(target, plan);
    const loaded = await readPlanFile(target);
    expect(loaded.ok).toBe(true);
    if (loaded.ok) expect(serializePlan(loaded.plan)).toBe(serializePlan(plan));
  });

  it('refuses a bad plan with the loader’s path-named messages', async () => {
    const target = path.join(dir, 'bad.legwise.json');
    const broken = JSON.parse(serializePlan(newPlan()));
    broken.aircraft.wingArea_m2 = -3;
    await fsp.writeFile(target, JSON.stringify(broken));
    const loaded = await readPlanFile(target);
    expect(loaded.ok).toBe(false);
    if (loaded.ok) return;
    expect(loaded.code).toBe('INVALID_PLAN');
    const expected = parsePlanText(JSON.stringify(broken));
    expect(expected.ok).toBe(false);
    if (!expected.ok) expect(loaded.issues).toEqual(expected.issues);
    expect(loaded.issues?.some((i) => i.path.includes('wingArea_m2'))).toBe(true);
    expect(loaded.message).toContain('bad.legwise.json');
  });

  it('refuses a UTF-16 file and bytes that are not UTF-8 by name (RFC 8259 section 8.1)', async () => {
    const utf16 = path.join(dir, 'utf16.legwise.json');
    const text = serializePlan(newPlan());
    await fsp.writeFile(
      utf16,
      Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(text, 'utf16le')]),
    );
    const a = await readPlanFile(utf16);
    expect(a.ok).toBe(false);
    if (!a.ok) {
      expect(a.code).toBe('INVALID_PLAN');
      expect(a.message).toContain('the file is UTF-16 (little-endian) text; plan files are UTF-8');
    }
    const latin1 = path.join(dir, 'latin1.legwise.json');
    await fsp.writeFile(
      latin1,
      Buffer.from(text.replace('"name": "', '"name": "Caf\u00e9 '), 'latin1'),
    );
    const b = await readPlanFile(latin1);
    expect(b.ok).toBe(false);
    if (!b.ok) expect(b.message).toMatch(/byte 0xE9 at line \d+, column \d+ is not UTF-8 text/);
  });

  it('refuses text that is not JSON, naming the line', async () => {
    const target = path.join(dir, 'junk.legwise.json');
    await fsp.writeFile(target, '{ "format": "legwise-plan",\n  oops }');
    const loaded = await readPlanFile(target);
    expect(!loaded.ok && loaded.code).toBe('INVALID_PLAN');
    expect(!loaded.ok && loaded.message).toMatch(/line 2/);
  });

  it('reports a missing file as READ_FAILED in words, without a stack', async () => {
    const loaded = await readPlanFile(path.join(dir, 'absent.legwise.json'));
    expect(loaded.ok).toBe(false);
    if (loaded.ok) return;
    expect(loaded.code).toBe('READ_FAILED');
    expect(loaded.message).toContain('does not exist');
    expect(loaded.message).not.toMatch(/\n\s+at /);
  });
});

describe('recent files', () => {
  it('puts the newest first, drops duplicates and keeps at most 10', () => {
    let list: string[] = [];
    for (let i = 0; i < 12; i++) list = withRecent(list, `/plans/p${i}.legwise.json`);
    list = withRecent(list, '/plans/p5.legwise.json');
    expect(list).toHaveLength(MAX_RECENT); // requirement: at most 10 recent files (issue text)
    expect(list[0]).toBe(path.resolve('/plans/p5.legwise.json'));
    expect(new Set(list).size).toBe(list.length);
  });

  it('stores the list in app data and drops files that no longer exist', async () => {
    const store = path.join(dir, 'userData', 'recent.json');
    const a = path.join(dir, 'a.legwise.json');
    const b = path.join(dir, 'b.legwise.json');
    await fsp.writeFile(a, '{}');
    await fsp.writeFile(b, '{}');
    await addRecent(store, a);
    await addRecent(store, b);
    expect(await readRecent(store)).toEqual([b, a]);
    await fsp.rm(a);
    expect(await readRecent(store)).toEqual([b]);
    expect(await removeRecent(store, b)).toEqual([]);
  });

  it('reads a damaged store as empty', async () => {
    const store = path.join(dir, 'recent.json');
    await fsp.writeFile(store, '{"not": "a list"');
    expect(await readRecent(store)).toEqual([]);
  });
});

describe('autosave', () => {
  it('writes, recovers and clears the current plan', async () => {
    const plan = { ...newPlan(), name: 'Unsaved work' };
    expect(await readAutosave(dir)).toBeNull();
    await writeAutosave(dir, plan, '/plans/origin.legwise.json');
    // One file holds the plan and its origin (see saveSafety.test.ts for the kill test).
    expect(await fsp.readdir(autosavePaths(dir).dir)).toEqual(['current.autosave.json']);
    const recovered = await readAutosave(dir);
    expect(recovered?.plan.name).toBe('Unsaved work');
    expect(recovered?.sourcePath).toBe('/plans/origin.legwise.json');
    expect(recovered && serializePlan(recovered.plan)).toBe(serializePlan(plan));
    await clearAutosave(dir);
    expect(await readAutosave(dir)).toBeNull();
  });

  it('offers a plan never saved with no origin, and ignores a damaged autosave', async () => {
    await writeAutosave(dir, newPlan(), null);
    expect((await readAutosave(dir))?.sourcePath).toBeNull();
    await fsp.writeFile(autosavePaths(dir).file, '{"format": "legwise-autosave", "plan": 3}');
    expect(await readAutosave(dir)).toBeNull();
  });
});

describe('safeFileName', () => {
  it('keeps folders and reserved characters out of suggested names', () => {
    expect(safeFileName('../../etc/passwd', '.pdf')).toBe('..-..-etc-passwd.pdf');
    expect(safeFileName('Survey: leg 2/3?', '.csv')).toBe('Survey- leg 2-3-.csv');
    expect(safeFileName('   ', '.legwise.json')).toBe('plan.legwise.json');
  });
});
