/**
 * Electron main entry: wires the shell's modules together and owns nothing else.
 * windows.ts (the window), windowState.ts (its size and place), security.ts (policy),
 * appProtocol.ts (the page's own origin), document.ts (open/save state), dialogs.ts
 * (native dialogs), menu.ts (menu template), ipc.ts (guarded channels), openRequests.ts
 * (files the OS asks us to open). Bundled to dist-electron/main.js by electron/build.mjs;
 * the page comes from dist/ through legwise://app/.
 */
import { promises as fsp } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { BrowserWindow, Menu, app, ipcMain, protocol, screen, session } from 'electron';
import {
  APP_INDEX_URL,
  APP_SCHEME,
  APP_SCHEME_PRIVILEGES,
  appProtocolHandler,
} from './appProtocol.ts';
import { MENU_COMMAND_CHANNEL } from './channels.ts';
import type { RecentFile } from './contract.ts';
import { dialogPorts, showAbout } from './dialogs.ts';
import { createDocument, toRecentFiles, type LegwiseDocument } from './document.ts';
import { readShellSettings, writeShellSettings } from './files.ts';
import { registerIpc } from './ipc.ts';
import { buildMenuTemplate } from './menu.ts';
import { planPathFromArgv } from './openRequests.ts';
import { applySessionPolicy, hardenWebContents, localDevServerUrl } from './security.ts';
import { APP_NAME, createMainWindow, windowTitle } from './windows.ts';
import { boundsToRestore, readWindowState, writeWindowState } from './windowState.ts';

const here = path.dirname(fileURLToPath(import.meta.url));
const preloadPath = path.join(here, 'preload.js');
const distDir = path.join(here, '..', 'dist');
// Only a local dev server, and never in a packaged app.
const devServerUrl = app.isPackaged
  ? undefined
  : localDevServerUrl(process.env.LEGWISE_DEV_SERVER_URL);

// Every renderer sandboxed (security checklist: enable process sandboxing); allowed only before 'ready', and an ES-module
// main may be evaluated late, so guard (the window sets sandbox: true as well).
if (!app.isReady()) {
  app.enableSandbox();
  // The page's own origin must be declared before 'ready' (Electron's protocol docs).
  protocol.registerSchemesAsPrivileged([APP_SCHEME_PRIVILEGES]);
}
app.on('web-contents-created', (_event, contents) => hardenWebContents(contents));

/** A file the OS named before the page could take it (argv, or macOS open-file at launch). */
let pendingOpen: string | null = planPathFromArgv(process.argv, {
  isPackaged: app.isPackaged,
  cwd: process.cwd(),
});
let doc: LegwiseDocument | null = null;
let pageReady = false;

function offer(filePath: string | null): void {
  if (filePath === null) return;
  if (doc && pageReady) doc.offerFile(filePath);
  else pendingOpen = filePath;
}

// macOS: double-click in Finder or a drop on the Dock icon; may arrive before 'ready'.
app.on('open-file', (event, filePath) => {
  event.preventDefault();
  offer(filePath);
});

if (!app.requestSingleInstanceLock()) {
  // A second copy would share the autosave file; hand over to the first one, which
  // gets our command line in 'second-instance' and opens the file named there.
  app.quit();
} else {
  void app.whenReady().then(start);
}

async function start(): Promise<void> {
  let win: BrowserWindow | null = null;
  let closing = false;
  const userDataDir = app.getPath('userData');
  applySessionPolicy(
    session.defaultSession,
    devServerUrl === undefined ? undefined : new URL(devServerUrl).origin,
  );
  protocol.handle(
    APP_SCHEME,
    appProtocolHandler(distDir, (file) => fsp.readFile(file)),
  );

  const rememberWindow = async () => {
    if (!win) return;
    await writeWindowState(userDataDir, {
      ...win.getNormalBounds(),
      maximized: win.isMaximized(),
    }).catch(() => false);
  };
  const finishClose = async () => {
    await rememberWindow();
    await shellDoc.onClosed();
    closing = true;
    win?.close();
  };
  const shellDoc = createDocument({
    userDataDir,
    ...dialogPorts(() => win),
    printPdf: async () => {
      if (!win) throw new Error('no window to print');
      return win.webContents.printToPDF({ printBackground: true, pageSize: 'A4' });
    },
    print: () =>
      new Promise<void>((resolve, reject) => {
        if (!win) return reject(new Error('no window to print'));
        win.webContents.print({ printBackground: true }, (success, reason) =>
          // A cancelled print dialog is not a failure.
          success || reason === 'cancelled' ? resolve() : reject(new Error(reason)),
        );
      }),
    addRecentDocument: (filePath) => app.addRecentDocument(filePath),
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
  doc = shellDoc;

  let recentShown: readonly RecentFile[] = [];
  let backupGenerations = (await readShellSettings(userDataDir)).backupGenerations;
  function setMenu(recent: readonly RecentFile[] = recentShown): void {
    recentShown = recent;
    const template = buildMenuTemplate(
      process.platform,
      {
        command: (command) => win?.webContents.send(MENU_COMMAND_CHANNEL, command),
        about: () => void showAbout(win),
        quit: () => app.quit(),
        setBackups: (generations) =>
          void writeShellSettings(userDataDir, { backupGenerations: generations })
            .then(() => {
              backupGenerations = generations;
            })
            .finally(() => setMenu()),
      },
      { appName: APP_NAME, recent, devTools: !app.isPackaged, backupGenerations },
    );
    Menu.setApplicationMenu(Menu.buildFromTemplate(template));
  }

  await shellDoc.removeOrphanTemps().catch(() => undefined);
  registerIpc(ipcMain, shellDoc.handlers, { indexUrl: APP_INDEX_URL, devServerUrl });
  setMenu(toRecentFiles(await shellDoc.listRecent()));

  const restored = boundsToRestore(
    await readWindowState(userDataDir),
    screen.getAllDisplays().map((d) => d.workArea),
  );
  win = createMainWindow(preloadPath, { indexUrl: APP_INDEX_URL, devServerUrl }, restored);
  win.setTitle(windowTitle(shellDoc.state.name, false));
  win.webContents.on('did-finish-load', () => {
    pageReady = true;
    const waiting = pendingOpen;
    pendingOpen = null;
    offer(waiting);
  });
  win.on('close', (event) => {
    if (closing) return;
    // Ask first; quitting resumes when the window really closes (window-all-closed).
    event.preventDefault();
    void shellDoc
      .onCloseRequested()
      .then((choice) => (choice === 'close' ? finishClose() : undefined));
  });
  win.on('closed', () => {
    win = null;
  });
  app.on('second-instance', (_event, argv, workingDirectory) => {
    if (win?.isMinimized()) win.restore();
    win?.focus();
    offer(planPathFromArgv(argv, { isPackaged: app.isPackaged, cwd: workingDirectory }));
  });
  // One document, one window: closing it ends the app on every platform.
  app.on('window-all-closed', () => app.quit());
}
