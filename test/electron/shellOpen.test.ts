/**
 * The desktop conventions of the shell against a fake Electron (plain Node): a plan
 * named on the command line, macOS open-file, a second instance's command line, the OS
 * recent-documents list, and the window's size and position kept between sessions.
 */
import { promises as fsp } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { newPlan } from '../../core/plan/defaults.ts';
import { serializePlan } from '../../core/plan/load.ts';
import { MENU_COMMAND_CHANNEL, channelOf, type InvokeMethod } from '../../electron/channels.ts';
import { windowStatePath } from '../../electron/windowState.ts';

vi.mock('electron', () => import('./fakeElectron.ts'));
import { BrowserWindow, app, ipcMain } from './fakeElectron.ts';

const fromPage = { senderFrame: { url: 'legwise://app/index.html', parent: null } };
const invoke = (method: InvokeMethod, ...args: unknown[]) =>
  ipcMain.handlers.get(channelOf(method))?.(fromPage, ...args) as Promise<{
    ok: boolean;
    plan?: { name: string };
    code?: string;
  }>;

let dir: string;
let win: BrowserWindow;
let first: string;
const argvBefore = process.argv;

beforeAll(async () => {
  dir = await fsp.mkdtemp(path.join(os.tmpdir(), 'legwise-open-'));
  app.userData = path.join(dir, 'userData');
  await fsp.mkdir(app.userData, { recursive: true });
  // Last session's window, on the one display the fake screen has (1920×1080).
  await fsp.writeFile(
    windowStatePath(app.userData),
    JSON.stringify({ x: 200, y: 100, width: 1000, height: 700, maximized: false }),
  );
  first = path.join(dir, 'First leg.legwise');
  await fsp.writeFile(first, serializePlan({ ...newPlan(), name: 'From the command line' }));
  // `electron . "First leg.legwise" --some-chromium-switch`, unpackaged.
  process.argv = [process.execPath, dir, first, '--enable-logging'];
  await import('../../electron/main.ts');
  await vi.waitFor(() => expect(BrowserWindow.instances).toHaveLength(1));
  win = BrowserWindow.instances[0] as BrowserWindow;
});
afterAll(async () => {
  process.argv = argvBefore;
  await fsp.rm(dir, { recursive: true, force: true });
});

const offeredCommands = () =>
  win.webContents.send.mock.calls.filter(
    ([channel, command]) =>
      channel === MENU_COMMAND_CHANNEL && (command as { kind: string }).kind === 'openOffered',
  ).length;

describe('files the operating system asks us to open', () => {
  it('the plan on the command line opens once the page has loaded', async () => {
    expect(offeredCommands()).toBe(0); // the page is not there yet
    win.webContents.emit('did-finish-load');
    expect(offeredCommands()).toBe(1);
    const opened = await invoke('openOffered');
    expect(opened.ok && opened.plan?.name).toBe('From the command line');
    expect(app.addRecentDocument).toHaveBeenLastCalledWith(first);
    // Taken once: asking again finds nothing waiting.
    expect(await invoke('openOffered')).toMatchObject({ ok: false, code: 'NOT_FOUND' });
  });

  it('a second instance hands over its command line (resolved in its own folder)', async () => {
    const sub = path.join(dir, 'sub');
    await fsp.mkdir(sub);
    await fsp.writeFile(
      path.join(sub, 'second.legwise'),
      serializePlan({ ...newPlan(), name: 'Second instance' }),
    );
    app.emit('second-instance', {}, ['/usr/bin/legwise-electron', '.', 'second.legwise'], sub);
    expect(win.focus).toHaveBeenCalled();
    expect(offeredCommands()).toBe(2);
    const opened = await invoke('openOffered');
    expect(opened.ok && opened.plan?.name).toBe('Second instance');
    // A second instance started without a file only brings the window forward.
    app.emit('second-instance', {}, ['/usr/bin/legwise-electron', '.'], sub);
    expect(offeredCommands()).toBe(2);
  });

  it('macOS open-file opens the file and the event is taken', async () => {
    const mac = path.join(dir, 'finder.legwise');
    await fsp.writeFile(mac, serializePlan({ ...newPlan(), name: 'Double-clicked' }));
    const event = { preventDefault: vi.fn() };
    app.emit('open-file', event, mac);
    expect(event.preventDefault).toHaveBeenCalled();
    const opened = await invoke('openOffered');
    expect(opened.ok && opened.plan?.name).toBe('Double-clicked');
    expect(app.addRecentDocument).toHaveBeenLastCalledWith(mac);
  });

  it('a file not named like a plan is not offered', () => {
    const before = offeredCommands();
    app.emit('open-file', { preventDefault: vi.fn() }, path.join(dir, 'photo.jpg'));
    expect(offeredCommands()).toBe(before);
  });
});

describe('window size and position', () => {
  it('opens where it was last time, and remembers where it is on close', async () => {
    expect(win.options).toMatchObject({ x: 200, y: 100, width: 1000, height: 700 });
    win.close(); // clean document: closes without asking
    await vi.waitFor(async () => {
      const saved = JSON.parse(await fsp.readFile(windowStatePath(app.userData), 'utf8'));
      // What the fake window's getNormalBounds reports.
      expect(saved).toEqual({ x: 120, y: 80, width: 1100, height: 760, maximized: false });
    });
  });
});
