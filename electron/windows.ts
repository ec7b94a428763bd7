/**
 * The main window. `mainWindowOptions` is pure so a test can assert every security
 * setting (Electron security checklist: context isolation, sandbox, no Node in the
 * page, web security on, no insecure content, no <webview>). The page is always our
 * built renderer from dist/ over file:// — or the local dev server while developing.
 */
import { BrowserWindow, type BrowserWindowConstructorOptions } from 'electron';

export const APP_NAME = 'Legwise';

export function mainWindowOptions(preloadPath: string): BrowserWindowConstructorOptions {
  return {
    width: 1280,
    height: 840,
    minWidth: 900,
    minHeight: 600,
    show: false,
    title: APP_NAME,
    backgroundColor: '#ffffff',
    webPreferences: {
      preload: preloadPath,
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
      safeDialogs: true,
      // Chromium fetches spell-check dictionaries from the network; the app stays offline.
      spellcheck: false,
    },
  };
}

/** "<plan name> — Legwise", with a bullet while there are unsaved changes. */
export function windowTitle(planName: string, dirty: boolean): string {
  return `${dirty ? '• ' : ''}${planName} — ${APP_NAME}`;
}

export interface PageSource {
  /** Absolute path of dist/index.html. */
  indexFile: string;
  /** Vite dev server URL, only while developing. */
  devServerUrl?: string;
}

export function createMainWindow(preloadPath: string, page: PageSource): BrowserWindow {
  const win = new BrowserWindow(mainWindowOptions(preloadPath));
  win.once('ready-to-show', () => win.show());
  if (page.devServerUrl !== undefined) void win.loadURL(page.devServerUrl);
  else void win.loadFile(page.indexFile);
  return win;
}
