/** The main entry wired against a fake Electron: what happens at start and on close. */
import { EventEmitter } from 'node:events';
import { promises as fsp } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { newPlan } from '../../core/plan/defaults.ts';
import { INVOKE_METHODS, channelOf } from '../../electron/channels.ts';
import { autosavePaths } from '../../electron/files.ts';

vi.mock('electron', () => import('./fakeElectron.ts'));
import { BrowserWindow, Menu, app, dialog, ipcMain, protocol, session } from './fakeElectron.ts';

const root = fileURLToPath(new URL('../..', import.meta.url));
const indexUrl = 'legwise://app/index.html';
const fromPage = { senderFrame: { url: indexUrl, parent: null } };
const invoke = (method: (typeof INVOKE_METHODS)[number], ...args: unknown[]) =>
  ipcMain.handlers.get(channelOf(method))?.(fromPage, ...args);

let win: BrowserWindow;
beforeAll(async () => {
  app.userData = await fsp.mkdtemp(path.join(os.tmpdir(), 'legwise-main-'));
  await import('../../electron/main.ts');
  await vi.waitFor(() => expect(BrowserWindow.instances).toHaveLength(1));
  win = BrowserWindow.instances[0] as BrowserWindow;
});
afterAll(async () => {
  await fsp.rm(app.userData, { recursive: true, force: true });
});

describe('electron/main.ts', () => {
  it('sandboxes every renderer and hardens every web contents', () => {
    expect(app.enableSandbox).toHaveBeenCalled();
    const contents = Object.assign(new EventEmitter(), { setWindowOpenHandler: vi.fn() });
    app.emit('web-contents-created', {}, contents);
    const navigation = { preventDefault: vi.fn() };
    contents.emit('will-navigate', navigation, 'https://example.com/');
    expect(navigation.preventDefault).toHaveBeenCalled();
    expect(contents.setWindowOpenHandler).toHaveBeenCalled();
    expect(session.defaultSession.setPermissionRequestHandler).toHaveBeenCalled();
    expect(session.defaultSession.webRequest.onBeforeRequest).toHaveBeenCalled();
  });

  it('opens one window on the built page, through the shell’s protocol, with the preload', async () => {
    expect(win.loadURL).toHaveBeenCalledWith('legwise://app/index.html');
    expect(win.loadFile).not.toHaveBeenCalled();
    expect(protocol.registerSchemesAsPrivileged).toHaveBeenCalledWith([
      expect.objectContaining({ scheme: 'legwise' }),
    ]);
    // The handler serves dist/ only: a path out of it is not found.
    const handler = protocol.handlers.get('legwise');
    expect((await handler?.({ url: 'legwise://app/../package.json' }))?.status).toBe(404);
    expect((await handler?.({ url: 'legwise://app/%2e%2e/package.json' }))?.status).toBe(404);
    const prefs = win.options.webPreferences as Record<string, unknown>;
    expect(prefs.preload).toBe(path.join(root, 'electron', 'preload.js'));
    expect(prefs.sandbox).toBe(true);
    expect(win.title).toBe('Untitled plan — Legwise');
    expect(Menu.setApplicationMenu).toHaveBeenCalled();
  });

  it('File ▸ Backups to Keep writes the setting the next save uses', async () => {
    type Item = { label?: string; submenu?: Item[]; click?: () => void; checked?: boolean };
    const lastTemplate = () =>
      (Menu.buildFromTemplate.mock.calls.at(-1)?.[0] ?? []) as unknown as Item[];
    const find = (items: Item[], label: string): Item | undefined =>
      items.flatMap((i) => [i, ...(i.submenu ?? [])]).find((i) => i.label === label) ??
      items
        .flatMap((i) => i.submenu ?? [])
        .reduce<Item | undefined>((hit, i) => hit ?? find(i.submenu ?? [], label), undefined);
    expect(find(lastTemplate(), '3 earlier versions')?.checked).toBe(true); // the default
    find(lastTemplate(), '5 earlier versions')?.click?.();
    await vi.waitFor(async () => {
      const saved = JSON.parse(
        await fsp.readFile(path.join(app.userData, 'shell-settings.json'), 'utf8'),
      );
      expect(saved).toEqual({ backupGenerations: 5 });
    });
    await vi.waitFor(() => expect(find(lastTemplate(), '5 earlier versions')?.checked).toBe(true));
  });

  it('answers every contract channel, for our page only', async () => {
    expect([...ipcMain.handlers.keys()].sort()).toEqual(INVOKE_METHODS.map(channelOf).sort());
    expect(await invoke('listRecent')).toEqual({ ok: true, files: [] });
    const foreign = { senderFrame: { url: 'https://example.com/', parent: null } };
    expect(await ipcMain.handlers.get(channelOf('listRecent'))?.(foreign)).toMatchObject({
      code: 'FORBIDDEN',
    });
  });

  it('saves the page’s GPX through a save dialog filtered to .gpx', async () => {
    const target = path.join(app.userData, 'Coast run.gpx');
    dialog.showSaveDialog.mockResolvedValueOnce({ canceled: false, filePath: target });
    const text = '<?xml version="1.0"?><gpx version="1.1"></gpx>\n';
    expect(await invoke('exportGpx', { text, suggestedName: 'Coast run.gpx' })).toEqual({
      ok: true,
      filePath: target,
    });
    expect(dialog.showSaveDialog).toHaveBeenLastCalledWith(win, {
      title: 'Export',
      defaultPath: path.join(app.getPath('documents'), 'Coast run.gpx'),
      filters: [{ name: 'GPX route', extensions: ['gpx'] }],
    });
    expect(await fsp.readFile(target, 'utf8')).toBe(text);
  });

  it('shows unsaved changes in the title and asks before closing', async () => {
    await invoke('setDirty', { dirty: true, name: 'Coast run' });
    expect(win.title).toBe('• Coast run — Legwise');
    await invoke('autosave', newPlan());
    await fsp.access(autosavePaths(app.userData).file);

    dialog.showMessageBox.mockResolvedValueOnce({ response: 2, checkboxChecked: false }); // Cancel
    win.close();
    await vi.waitFor(() => expect(dialog.showMessageBox).toHaveBeenCalledTimes(1));
    expect(win.destroyed).toBe(false);

    dialog.showMessageBox.mockResolvedValueOnce({ response: 1, checkboxChecked: false }); // Don't Save
    win.close();
    await vi.waitFor(() => expect(win.destroyed).toBe(true));
    // Closing on purpose is a clean exit: the autosave goes.
    await expect(fsp.access(autosavePaths(app.userData).file)).rejects.toThrow();
  });
});
