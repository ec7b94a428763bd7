import { describe, expect, it, vi } from 'vitest';

vi.mock('electron', () => import('./fakeElectron.ts'));
import { BrowserWindow } from './fakeElectron.ts';
import { createMainWindow, mainWindowOptions, windowTitle } from '../../electron/windows.ts';

describe('mainWindowOptions', () => {
  it('sets every security setting of Electron’s checklist', () => {
    const prefs = mainWindowOptions('/app/dist-electron/preload.js').webPreferences;
    expect(prefs).toMatchObject({
      preload: '/app/dist-electron/preload.js',
      contextIsolation: true,
      sandbox: true,
      nodeIntegration: false,
      nodeIntegrationInWorker: false,
      nodeIntegrationInSubFrames: false,
      webSecurity: true,
      allowRunningInsecureContent: false,
      webviewTag: false,
      experimentalFeatures: false,
      navigateOnDragDrop: false,
      spellcheck: false,
    });
    expect(prefs).not.toHaveProperty('enableBlinkFeatures');
    expect(prefs).not.toHaveProperty('additionalArguments');
  });
});

describe('windowTitle', () => {
  it('reads "<plan> — Legwise" with a bullet for unsaved changes', () => {
    expect(windowTitle('Coast run', false)).toBe('Coast run — Legwise');
    expect(windowTitle('Coast run', true)).toBe('• Coast run — Legwise');
  });
});

describe('createMainWindow', () => {
  it('loads the built page through the shell’s protocol, never file:// or a remote URL', () => {
    const win = createMainWindow('/app/p.js', {
      indexUrl: 'legwise://app/index.html',
    }) as unknown as BrowserWindow;
    expect(win.loadURL).toHaveBeenCalledWith('legwise://app/index.html');
    expect(win.loadFile).not.toHaveBeenCalled();
    expect(win.options).toEqual(mainWindowOptions('/app/p.js'));
    win.emit('ready-to-show');
    expect(win.show).toHaveBeenCalled();
  });

  it('uses the dev server only when one is given', () => {
    const win = createMainWindow('/app/p.js', {
      indexUrl: 'legwise://app/index.html',
      devServerUrl: 'http://127.0.0.1:5173/',
    }) as unknown as BrowserWindow;
    expect(win.loadURL).toHaveBeenCalledWith('http://127.0.0.1:5173/');
    expect(win.loadFile).not.toHaveBeenCalled();
  });

  it('opens at the restored size and position, maximized if it was', () => {
    const bounds = { x: 40, y: 30, width: 1000, height: 700 };
    const win = createMainWindow(
      '/app/p.js',
      { indexUrl: 'legwise://app/index.html' },
      { bounds, maximized: true },
    ) as unknown as BrowserWindow;
    expect(win.options).toMatchObject(bounds);
    win.emit('ready-to-show');
    expect(win.maximize).toHaveBeenCalled();
  });
});
