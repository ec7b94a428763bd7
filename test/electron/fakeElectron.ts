/**
 * A small stand-in for the 'electron' module so main-process code runs under plain
 * Node. Tests use it with `vi.mock('electron', () => import('./fakeElectron.ts'))`
 * and inspect `fake` (what was called) after exercising the code.
 */
import { EventEmitter } from 'node:events';
import { vi } from 'vitest';

export class FakeWebContents extends EventEmitter {
  send = vi.fn();
  print = vi.fn((_options: unknown, callback?: (success: boolean, reason: string) => void) =>
    callback?.(true, ''),
  );
  printToPDF = vi.fn(async () => new Uint8Array([0x25, 0x50, 0x44, 0x46])); // "%PDF"
  windowOpenHandler: ((details: unknown) => unknown) | undefined;
  setWindowOpenHandler(handler: (details: unknown) => unknown): void {
    this.windowOpenHandler = handler;
  }
}

export class BrowserWindow extends EventEmitter {
  static instances: BrowserWindow[] = [];
  webContents = new FakeWebContents();
  title = '';
  destroyed = false;
  loadFile = vi.fn(async (_file: string) => undefined);
  loadURL = vi.fn(async (_url: string) => undefined);
  show = vi.fn();
  focus = vi.fn();
  restore = vi.fn();
  isMinimized = vi.fn(() => false);
  isMaximized = vi.fn(() => false);
  maximize = vi.fn();
  getNormalBounds = vi.fn(() => ({ x: 120, y: 80, width: 1100, height: 760 }));
  setDocumentEdited = vi.fn();
  setRepresentedFilename = vi.fn();
  constructor(readonly options: Record<string, unknown>) {
    super();
    BrowserWindow.instances.push(this);
  }
  setTitle(title: string): void {
    this.title = title;
  }
  /** Like Electron: 'close' may be prevented; otherwise the window goes and 'closed' fires. */
  close(): void {
    let prevented = false;
    this.emit('close', { preventDefault: () => (prevented = true) });
    if (!prevented) {
      this.destroyed = true;
      this.emit('closed');
    }
  }
}

class FakeApp extends EventEmitter {
  isPackaged = false;
  userData = '/tmp/legwise-fake-user-data';
  enableSandbox = vi.fn();
  isReady = vi.fn(() => false);
  requestSingleInstanceLock = vi.fn(() => true);
  addRecentDocument = vi.fn();
  quit = vi.fn();
  whenReady = vi.fn(async () => undefined);
  getVersion = vi.fn(() => '0.0.0-test');
  getPath = vi.fn((name: string) =>
    name === 'userData' ? this.userData : `/tmp/legwise-fake-${name}`,
  );
}

function fakeSession() {
  return {
    setPermissionRequestHandler: vi.fn(),
    setPermissionCheckHandler: vi.fn(),
    setDevicePermissionHandler: vi.fn(),
    setSpellCheckerEnabled: vi.fn(),
    webRequest: { onBeforeRequest: vi.fn(), onHeadersReceived: vi.fn() },
  };
}

export const app = new FakeApp();
export const ipcMain = {
  handlers: new Map<string, (...args: unknown[]) => unknown>(),
  handle: vi.fn(
    (channel: string, fn: (...args: unknown[]) => unknown) =>
      void ipcMain.handlers.set(channel, fn),
  ),
  removeHandler: vi.fn((channel: string) => void ipcMain.handlers.delete(channel)),
};
export const session = { defaultSession: fakeSession() };
export const protocol = {
  registerSchemesAsPrivileged: vi.fn(),
  handlers: new Map<string, (request: { url: string; method?: string }) => Promise<Response>>(),
  handle: vi.fn(
    (scheme: string, fn: (request: { url: string; method?: string }) => Promise<Response>) =>
      void protocol.handlers.set(scheme, fn),
  ),
};
export const screen = {
  getAllDisplays: vi.fn(() => [{ workArea: { x: 0, y: 0, width: 1920, height: 1080 } }]),
};
export const Menu = {
  buildFromTemplate: vi.fn((template: unknown[]) => ({ template })),
  setApplicationMenu: vi.fn(),
};
export const dialog = {
  showOpenDialog: vi.fn(async () => ({ canceled: true, filePaths: [] as string[] })),
  showSaveDialog: vi.fn(async () => ({ canceled: true, filePath: '' })),
  showMessageBox: vi.fn(async () => ({ response: 0, checkboxChecked: false })),
};
export const contextBridge = { exposeInMainWorld: vi.fn() };
export const ipcRenderer = { invoke: vi.fn(), on: vi.fn(), removeListener: vi.fn() };

export default {
  app,
  ipcMain,
  session,
  protocol,
  screen,
  Menu,
  dialog,
  BrowserWindow,
  contextBridge,
  ipcRenderer,
};
