/**
 * Electron main entry: wires the shell's modules together and owns nothing else.
 * windows.ts (the window), security.ts (policy), document.ts (open/save state),
 * dialogs.ts (native dialogs), menu.ts (menu template), ipc.ts (guarded channels).
 * Bundled to dist-electron/main.js by electron/build.mjs; the page comes from dist/.
 */
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { BrowserWindow, Menu, app, ipcMain, session } from 'electron';
import { MENU_COMMAND_CHANNEL } from './channels.ts';
import type { RecentFile } from './contract.ts';
import { dialogPorts, showAbout } from './dialogs.ts';
import { createDocument, toRecentFiles } from './document.ts';
import { registerIpc } from './ipc.ts';
import { buildMenuTemplate } from './menu.ts';
import { applySessionPolicy, hardenWebContents, localDevServerUrl } from './security.ts';
import { APP_NAME, createMainWindow, windowTitle } from './windows.ts';

const here = path.dirname(fileURLToPath(import.meta.url));
const preloadPath = path.join(here, 'preload.js');
const indexFile = path.join(here, '..', 'dist', 'index.html');
// Only a local dev server, and never in a packaged app.
const devServerUrl = app.isPackaged
  ? undefined
  : localDevServerUrl(process.env.LEGWISE_DEV_SERVER_URL);

// Every renderer sandboxed (security checklist: enable process sandboxing); allowed only before 'ready', and an ES-module
// main may be evaluated late, so guard (the window sets sandbox: true as well).
if (!app.isReady()) app.enableSandbox();
app.on('web-contents-created', (_event, contents) => hardenWebContents(contents));

if (!app.requestSingleInstanceLock()) {
  // A second copy would share the autosave file; hand over to the first one.
  app.quit();
} else {
  void app.whenReady().then(start);
}

async function start(): Promise<void> {
  let win: BrowserWindow | null = null;
  let closing = false;
  applySessionPolicy(
    session.defaultSession,
    devServerUrl === undefined ? undefined : new URL(devServerUrl).origin,
  );

  const finishClose = async () => {
    await doc.onClosed();
    closing = true;
    win?.close();
  };
  const doc = createDocument({
    userDataDir: app.getPath('userData'),
    ...dialogPorts(() => win),
    printPdf: async () => {
      if (!win) throw new Error('no window to print');
      return win.webContents.printToPDF({ printBackground: true, pageSize: 'A4' });
    },
    showTitle(name, dirty, filePath) {
      win?.setTitle(windowTitle(name, dirty));
      if (process.platform === 'darwin') {
        win?.setDocumentEdited(dirty);
        win?.setRepresentedFilename(filePath ?? '');
      }
    },
    recentChanged: (files) => setMenu(files),
    sendMenuCommand: (command) => win?.webContents.send(MENU_COMMAND_CHANNEL, command),
    closeWindow: () => void finishClose(),
  });

  function setMenu(recent: readonly RecentFile[]): void {
    const template = buildMenuTemplate(
      process.platform,
      {
        command: (command) => win?.webContents.send(MENU_COMMAND_CHANNEL, command),
        about: () => void showAbout(win),
        quit: () => app.quit(),
      },
      { appName: APP_NAME, recent, devTools: !app.isPackaged },
    );
    Menu.setApplicationMenu(Menu.buildFromTemplate(template));
  }

  await doc.removeOrphanTemps().catch(() => undefined);
  registerIpc(ipcMain, doc.handlers, { indexUrl: pathToFileURL(indexFile).href, devServerUrl });
  setMenu(toRecentFiles(await doc.listRecent()));

  win = createMainWindow(preloadPath, { indexFile, devServerUrl });
  win.setTitle(windowTitle(doc.state.name, false));
  win.on('close', (event) => {
    if (closing) return;
    // Ask first; quitting resumes when the window really closes (window-all-closed).
    event.preventDefault();
    void doc.onCloseRequested().then((choice) => (choice === 'close' ? finishClose() : undefined));
  });
  win.on('closed', () => {
    win = null;
  });
  app.on('second-instance', () => {
    if (win?.isMinimized()) win.restore();
    win?.focus();
  });
  // One document, one window: closing it ends the app on every platform.
  app.on('window-all-closed', () => app.quit());
}
