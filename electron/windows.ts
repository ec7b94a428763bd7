/**
 * The main window. `mainWindowOptions` is pure so a test can assert every security
 * setting (Electron security checklist: context isolation, sandbox, no Node in the
 * page, web security on, no insecure content, no <webview>). The page is always our
 * built renderer from dist/ through the shell's own protocol (legwise://app/, see
 * appProtocol.ts) — or the local dev server while developing. Never file://.
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
  /** The built page's URL on the shell's protocol (APP_INDEX_URL). */
  indexUrl: string;
  /** Vite dev server URL, only while developing. */
  devServerUrl?: string;
}

/** Where the window was last time (windowState.ts); null for the default size. */
export interface RestoredBounds {
  bounds: { x?: number; y?: number; width: number; height: number };
  maximized: boolean;
}

export function createMainWindow(
  preloadPath: string,
  page: PageSource,
  restored: RestoredBounds | null = null,
): BrowserWindow {
  const win = new BrowserWindow({ ...mainWindowOptions(preloadPath), ...restored?.bounds });
  win.once('ready-to-show', () => {
    if (restored?.maximized) win.maximize();
    win.show();
  });
  void win.loadURL(page.devServerUrl ?? page.indexUrl);
  return win;
}
