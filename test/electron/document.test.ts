import { promises as fsp } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { newPlan } from '../../core/plan/defaults.ts';
import { serializePlan } from '../../core/plan/load.ts';
import {
  createDocument,
  recentStorePath,
  type ChangedOnDiskChoice,
  type ShellPorts,
} from '../../electron/document.ts';
import { autosavePaths, readAutosave, writeAutosave } from '../../electron/files.ts';

let dir: string;
beforeEach(async () => {
  dir = await fsp.mkdtemp(path.join(os.tmpdir(), 'legwise-doc-'));
});
afterEach(async () => {
  await fsp.rm(dir, { recursive: true, force: true });
});

function ports(overrides: Partial<ShellPorts> = {}) {
  const p = {
    userDataDir: path.join(dir, 'userData'),
    chooseOpenPath: vi.fn(async (): Promise<string | null> => null),
    chooseSavePath: vi.fn(async (): Promise<string | null> => null),
    confirmDiscard: vi.fn(async () => true),
    askSaveBeforeClose: vi.fn(async () => 'cancel' as const),
    askChangedOnDisk: vi.fn(async (): Promise<ChangedOnDiskChoice> => 'cancel'),
    printPdf: vi.fn(async () => new Uint8Array([0x25, 0x50, 0x44, 0x46])),
    print: vi.fn(async () => undefined),
    addRecentDocument: vi.fn(),
    showTitle: vi.fn(),
    recentChanged: vi.fn(),
    sendMenuCommand: vi.fn(),
    closeWindow: vi.fn(),
    ...overrides,
  };
  return p;
}

const planNamed = (name: string) => ({ ...newPlan(), name });

describe('saving', () => {
  it('asks where to save a new plan, then saves in place without asking again', async () => {
    const target = path.join(dir, 'Survey.legwise.json');
    const p = ports({ chooseSavePath: vi.fn(async () => target) });
    const doc = createDocument(p);
    expect(await doc.handlers.savePlan(planNamed('Survey'))).toEqual({
      ok: true,
      filePath: target,
    });
    expect(p.chooseSavePath).toHaveBeenCalledWith('plan', 'Survey.legwise');
    expect(await doc.handlers.savePlan(planNamed('Survey 2'))).toEqual({
      ok: true,
      filePath: target,
    });
    expect(p.chooseSavePath).toHaveBeenCalledTimes(1);
    expect(p.showTitle).toHaveBeenLastCalledWith('Survey 2', false, target);
    expect(p.recentChanged).toHaveBeenLastCalledWith([
      { filePath: target, name: 'Survey.legwise.json' },
    ]);
  });

  it('returns CANCELLED when the save dialog is closed, writing nothing', async () => {
    const doc = createDocument(ports());
    expect(await doc.handlers.savePlanAs(newPlan())).toMatchObject({
      ok: false,
      code: 'CANCELLED',
    });
    expect(await fsp.readdir(dir)).toEqual([]);
  });

  it('refuses to write a plan that would not open again', async () => {
    const p = ports({ chooseSavePath: vi.fn(async () => path.join(dir, 'x.legwise.json')) });
    const plan = newPlan();
    const twinIds = { ...plan, legs: plan.legs.map((leg) => ({ ...leg, id: 'same' })) };
    const result = await createDocument(p).handlers.savePlanAs(twinIds);
    expect(result).toMatchObject({ ok: false, code: 'INVALID_PLAN' });
    expect(p.chooseSavePath).not.toHaveBeenCalled();
  });

  it('reports a failed write as WRITE_FAILED and leaves the document dirty', async () => {
    const target = path.join(dir, 'w.legwise.json');
    const p = ports({
      chooseSavePath: vi.fn(async () => target),
      writeOps: {
        rename: async () =>
          Promise.reject(Object.assign(new Error('no space'), { code: 'ENOSPC' })),
      },
    });
    const doc = createDocument(p);
    await doc.handlers.setDirty({ dirty: true, name: 'W' });
    const result = await doc.handlers.savePlan(planNamed('W'));
    expect(result).toEqual({
      ok: false,
      code: 'WRITE_FAILED',
      message: 'Could not save w.legwise.json: the disk is full.',
    });
    expect(doc.state.dirty).toBe(true);
  });
});

describe('opening', () => {
  it('opens a plan, remembers it as recent and shows its name', async () => {
    const file = path.join(dir, 'Coast.legwise.json');
    await fsp.writeFile(file, serializePlan(planNamed('Coast run')));
    const p = ports({ chooseOpenPath: vi.fn(async () => file) });
    const doc = createDocument(p);
    const result = await doc.handlers.openPlan();
    expect(result.ok && result.plan.name).toBe('Coast run');
    expect(p.showTitle).toHaveBeenLastCalledWith('Coast run', false, file);
    expect(await doc.handlers.listRecent()).toEqual({
      ok: true,
      files: [{ filePath: file, name: 'Coast.legwise.json' }],
    });
  });

  it('a bad file returns the loader’s messages and changes nothing', async () => {
    const good = path.join(dir, 'good.legwise.json');
    const bad = path.join(dir, 'bad.legwise.json');
    await fsp.writeFile(good, serializePlan(planNamed('Good')));
    await fsp.writeFile(
      bad,
      JSON.stringify({ ...JSON.parse(serializePlan(newPlan())), schemaVersion: 99 }),
    );
    const open = vi.fn(async () => good);
    const p = ports({ chooseOpenPath: open });
    const doc = createDocument(p);
    await doc.handlers.openPlan();
    const before = { ...doc.state };
    const titleCalls = vi.mocked(p.showTitle).mock.calls.length;

    open.mockResolvedValueOnce(bad);
    const result = await doc.handlers.openPlan();
    expect(result).toMatchObject({ ok: false, code: 'INVALID_PLAN' });
    expect(!result.ok && result.issues?.[0]?.path).toBe('schemaVersion');
    expect(doc.state).toEqual(before);
    expect(vi.mocked(p.showTitle).mock.calls.length).toBe(titleCalls);
    expect(await doc.listRecent()).toEqual([good]);
  });

  it('asks before discarding unsaved changes, and keeps them if told to', async () => {
    const p = ports({
      confirmDiscard: vi.fn(async () => false),
      chooseOpenPath: vi.fn(async () => 'never-used'),
    });
    const doc = createDocument(p);
    await doc.handlers.setDirty({ dirty: true, name: 'Work' });
    expect(await doc.handlers.openPlan()).toMatchObject({ ok: false, code: 'CANCELLED' });
    expect(await doc.handlers.newPlan()).toMatchObject({ ok: false, code: 'CANCELLED' });
    expect(p.chooseOpenPath).not.toHaveBeenCalled();
    expect(doc.state.dirty).toBe(true);
  });

  it('openRecent refuses a path the shell never put on the recent list', async () => {
    const elsewhere = path.join(dir, 'elsewhere.legwise');
    await fsp.writeFile(elsewhere, serializePlan(planNamed('Not recent')));
    const listed = path.join(dir, 'listed.legwise');
    await fsp.writeFile(listed, serializePlan(planNamed('Listed')));
    await fsp.mkdir(path.join(dir, 'userData'), { recursive: true });
    await fsp.writeFile(recentStorePath(path.join(dir, 'userData')), JSON.stringify([listed]));
    const doc = createDocument(ports());
    expect(await doc.handlers.openRecent(elsewhere)).toMatchObject({
      ok: false,
      code: 'FORBIDDEN',
      message: 'elsewhere.legwise is not in the recent list.',
    });
    expect(doc.state.filePath).toBeNull();
    const opened = await doc.handlers.openRecent(listed);
    expect(opened.ok && opened.plan.name).toBe('Listed');
  });

  it('a recent file that has gone is reported and dropped from the list', async () => {
    const gone = path.join(dir, 'gone.legwise.json');
    await fsp.mkdir(path.join(dir, 'userData'), { recursive: true });
    await fsp.writeFile(recentStorePath(path.join(dir, 'userData')), JSON.stringify([gone]));
    const p = ports();
    const result = await createDocument(p).handlers.openRecent(gone);
    expect(result).toMatchObject({ ok: false, code: 'NOT_FOUND' });
    expect(p.recentChanged).toHaveBeenCalledWith([]);
  });
});

describe('title, close prompt and autosave', () => {
  it('closes at once when clean; when dirty asks, and Save saves then closes', async () => {
    const target = path.join(dir, 'c.legwise.json');
    const p = ports({
      askSaveBeforeClose: vi.fn(async () => 'save' as const),
      chooseSavePath: vi.fn(async () => target),
    });
    const doc = createDocument(p);
    expect(await doc.onCloseRequested()).toBe('close');

    await doc.handlers.setDirty({ dirty: true, name: 'C' });
    expect(p.showTitle).toHaveBeenLastCalledWith('C', true, null);
    expect(await doc.onCloseRequested()).toBe('cancel');
    expect(p.sendMenuCommand).toHaveBeenCalledWith({ kind: 'save' });
    expect(p.closeWindow).not.toHaveBeenCalled();
    await doc.handlers.savePlan(planNamed('C')); // what the page does on the 'save' command
    expect(p.closeWindow).toHaveBeenCalledTimes(1);
  });

  it("Don't Save closes; Cancel keeps the window", async () => {
    const ask = vi.fn(async () => 'discard' as const);
    const doc = createDocument(ports({ askSaveBeforeClose: ask }));
    await doc.handlers.setDirty({ dirty: true, name: 'D' });
    expect(await doc.onCloseRequested()).toBe('close');
    ask.mockResolvedValueOnce('cancel' as never);
    expect(await doc.onCloseRequested()).toBe('cancel');
  });

  it('autosaves, offers the plan back, and a clean close removes it', async () => {
    const p = ports();
    const userData = p.userDataDir;
    const first = createDocument(p);
    await first.handlers.autosave(planNamed('Crash test'));
    expect((await readAutosave(userData))?.plan.name).toBe('Crash test');

    // A new session after a crash is offered the plan back.
    const second = createDocument(ports());
    const offered = await second.handlers.recoverAutosave();
    expect(offered.ok && offered.recovered?.plan.name).toBe('Crash test');
    await second.onClosed();
    await expect(fsp.access(autosavePaths(userData).file)).rejects.toThrow();
    expect(await second.handlers.recoverAutosave()).toEqual({ ok: true, recovered: null });
  });

  it('a recovered plan’s save dialog starts at the file it came from', async () => {
    const origin = path.join(dir, 'origin.legwise.json');
    const save = vi.fn(async (): Promise<string | null> => null);
    const p = ports({ chooseSavePath: save });
    const doc = createDocument(p);
    await doc.handlers.savePlanAs(newPlan());
    await writeAutosave(p.userDataDir, newPlan(), origin);
    await doc.handlers.recoverAutosave();
    await doc.handlers.savePlan(newPlan());
    expect(save).toHaveBeenLastCalledWith('plan', origin);
    await doc.handlers.discardAutosave();
    expect(await readAutosave(p.userDataDir)).toBeNull();
  });
});

describe('exports', () => {
  it('saves the printed PDF and the page’s CSV where the person chooses', async () => {
    const pdf = path.join(dir, 'report.pdf');
    const csv = path.join(dir, 'results.csv');
    const save = vi.fn(async (kind: string) => (kind === 'pdf' ? pdf : csv));
    const p = ports({ chooseSavePath: save });
    const doc = createDocument(p);
    expect(await doc.handlers.exportPdf({ suggestedName: 'Coast run' })).toEqual({
      ok: true,
      filePath: pdf,
    });
    expect(save).toHaveBeenCalledWith('pdf', 'Coast run.pdf');
    expect((await fsp.readFile(pdf)).subarray(0, 4).toString('latin1')).toBe('%PDF');
    expect(
      await doc.handlers.exportCsv({ text: 'leg,time_s\n1,60\n', suggestedName: 'Coast run' }),
    ).toEqual({
      ok: true,
      filePath: csv,
    });
    expect(await fsp.readFile(csv, 'utf8')).toBe('leg,time_s\n1,60\n');
  });

  it('saves the page’s GPX with a .gpx name, adding the extension only once', async () => {
    const gpx = path.join(dir, 'route.gpx');
    const save = vi.fn(async () => gpx);
    const doc = createDocument(ports({ chooseSavePath: save }));
    const text = '<?xml version="1.0"?><gpx version="1.1"></gpx>\n';
    expect(await doc.handlers.exportGpx({ text, suggestedName: 'Coast run.gpx' })).toEqual({
      ok: true,
      filePath: gpx,
    });
    expect(save).toHaveBeenLastCalledWith('gpx', 'Coast run.gpx');
    expect(await fsp.readFile(gpx, 'utf8')).toBe(text);
    await doc.handlers.exportGpx({ text, suggestedName: 'Coast run' });
    expect(save).toHaveBeenLastCalledWith('gpx', 'Coast run.gpx');
    await doc.handlers.exportCsv({ text: 'a\n', suggestedName: 'Coast run.CSV' });
    expect(save).toHaveBeenLastCalledWith('csv', 'Coast run.csv');
  });

  it('reports a GPX export the person cancelled, writing nothing', async () => {
    const doc = createDocument(ports());
    expect(
      await doc.handlers.exportGpx({ text: '<gpx/>', suggestedName: 'Coast run' }),
    ).toMatchObject({ ok: false, code: 'CANCELLED' });
    expect(await fsp.readdir(dir)).toEqual([]);
  });

  it('does not print when the export dialog is cancelled', async () => {
    const p = ports();
    expect(await createDocument(p).handlers.exportPdf({ suggestedName: 'x' })).toMatchObject({
      code: 'CANCELLED',
    });
    expect(p.printPdf).not.toHaveBeenCalled();
  });
});
